package org.solmass.pv;

import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.SunDirections;
import org.solmass.model.Vec3;
import org.solmass.sky.DiffuseParts;
import org.solmass.sky.SkyModel;

/**
 * Plane-of-array irradiance of every module substring for every time step, from what the substring
 * sees ({@link ModuleSight}) and the step's weather, with the formulas of the irradiation stage
 * (docs/method.md; {@code org.solmass.irradiation.ShadedIrradiation}) applied step by step instead of
 * summed into month-hour slots:
 * <ul>
 * <li>beam: {@code DNI max(0, cos theta) V}, V the substring's visible share of the step's sun
 *     direction (its shaded share is {@code 1 - V});</li>
 * <li>sky diffuse: the sky model's three parts ({@link SkyModel#parts}; Perez et al. 1990, Solar
 *     Energy 44(5), eq. 9) added with {@link DiffuseParts#sum}: background x obstructed sky view factor,
 *     circumsolar x circumsolar ratio x V, horizon x sin(tilt) x visible share of the horizon band. The
 *     circumsolar part is reported with the beam (it arrives from about the sun's direction), the
 *     rest as sky diffuse;</li>
 * <li>reflected: {@code albedo GHI (F_ground + F_obstruction)}, every surface the substring sees
 *     below the sky counted as ground lit by GHI at the ground albedo (one bounce, isotropic; an upper
 *     bound where the substring sees shaded surfaces, e.g. the back of the row in front).</li>
 * </ul>
 * The unobstructed counterpart (for the shading loss and the reference yield) takes V = 1, the
 * unobstructed view factors {@code (1 + cos b)/2} and {@code (1 - cos b)/2} and the whole horizon
 * band. Values are irradiances in W/m2, averages over the step; nothing per step is stored: each call
 * computes one module's step from the stored visibilities, cheaply.
 */
public final class PlaneOfArray {
    private final ModuleSight sight;
    private final WeatherSeries weather;
    private final double albedo;
    private final int[] dirOfStep;
    private final double[] sx, sy, sz, dni, ghi, background, circumsolar, horizon;

    public PlaneOfArray(ModuleSight sight, WeatherSeries weather, SkyModel sky, SunDirections sun, double groundAlbedo) {
        this.sight = sight;
        this.weather = weather;
        this.albedo = groundAlbedo;
        int n = weather.size();
        dirOfStep = new int[n];
        sx = new double[n];
        sy = new double[n];
        sz = new double[n];
        dni = new double[n];
        ghi = new double[n];
        background = new double[n];
        circumsolar = new double[n];
        horizon = new double[n];
        for (int s = 0; s < n; s++) {
            Step st = weather.step(s);
            dirOfStep[s] = sun.ofStep(s);
            Vec3 v = st.sun().direction();
            sx[s] = v.x();
            sy[s] = v.y();
            sz[s] = v.z();
            dni[s] = Math.max(0, st.dniWm2());
            ghi[s] = Math.max(0, st.ghiWm2());
            DiffuseParts p = sky.parts(st);
            background[s] = p.backgroundPerSvf();
            circumsolar[s] = p.circumsolar();
            horizon[s] = p.horizon();
        }
    }

    public ModuleSight sight() { return sight; }

    public WeatherSeries weather() { return weather; }

    public int steps() { return dirOfStep.length; }

    /**
     * One module's plane-of-array irradiance at step {@code s}, W/m2, per substring.
     *
     * @param beam out: beam + circumsolar per substring (length {@link ModuleSight#substrings()})
     * @param sky out: sky diffuse without the circumsolar part per substring
     * @param reflected out: reflected per substring
     * @param unobstructed out, may be null: total of the unobstructed plane per substring
     * @return the beam incidence angle, degrees (90 when the sun is behind the module or down)
     */
    public double module(int m, int s, double[] beam, double[] sky, double[] reflected, double[] unobstructed) {
        return module(m, s, beam, sky, reflected, unobstructed, new PlaneStep());
    }

    /**
     * What a module plane gets at one step before its substrings' sight is applied: the sun's
     * cosine on it, beam and circumsolar irradiance with the sun visible, the unobstructed total, the
     * incidence angle. Modules of one zone mostly share their normal; {@link #module(int, int,
     * double[], double[], double[], double[], PlaneStep)} reuses these values while the normal and
     * step stay the same (and the same {@code PlaneOfArray} asks), computed by the same expressions,
     * so the results are the same bit for bit. One per thread.
     */
    public static final class PlaneStep {
        private PlaneOfArray owner;
        private Vec3 normal;
        private int step = -1;
        private double sinT, b, circ, unobstructed, incidenceDeg;
    }

    /** As {@link #module(int, int, double[], double[], double[], double[])}, reusing {@code plane} (see {@link PlaneStep}). */
    public double module(int m, int s, double[] beam, double[] sky, double[] reflected, double[] unobstructed, PlaneStep plane) {
        PvModule mod = sight.modules.get(m);
        Vec3 n = mod.normal();
        int d = dirOfStep[s];
        if (plane.owner != this || plane.step != s || !n.equals(plane.normal)) {
            double cosT = n.z(), sinT = Math.sqrt(Math.max(0, 1 - cosT * cosT));
            double c = d < 0 ? 0 : n.x() * sx[s] + n.y() * sy[s] + n.z() * sz[s];
            double b = 0, circ = 0;
            if (c > 0) {
                b = dni[s] * c;
                circ = circumsolar[s] * SkyModel.circumsolarRatio(c, sz[s]);
            }
            plane.owner = this;
            plane.normal = n;
            plane.step = s;
            plane.sinT = sinT;
            plane.b = b;
            plane.circ = circ;
            plane.unobstructed = b + DiffuseParts.sum(background[s], (1 + cosT) / 2, circ, horizon[s], sinT)
                    + albedo * ghi[s] * (1 - cosT) / 2;
            plane.incidenceDeg = c > 0 ? Math.toDegrees(Math.acos(Math.min(1, c))) : 90;
        }
        double b = plane.b, circ = plane.circ, sinT = plane.sinT;
        int S = sight.substrings;
        for (int k = 0; k < S; k++) {
            int q = m * S + k;
            double v = d < 0 ? 0 : sight.sunVisible[q * sight.directions + d];
            double diff = DiffuseParts.sum(background[s], sight.skyVf[q], circ * v, horizon[s], sinT * sight.horizonVis[q]);
            double cs = Math.min(circ * v, diff);
            beam[k] = b * v + cs;
            sky[k] = diff - cs;
            reflected[k] = albedo * ghi[s] * (sight.groundVf[q] + sight.obstructionVf[q]);
            if (unobstructed != null) unobstructed[k] = plane.unobstructed;
        }
        return plane.incidenceDeg;
    }
}
