package org.solmass.sky;

import org.solmass.climate.Step;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.sun.SunPosition;

/**
 * A weather series and a sky model flattened into per-step arrays for the hot path: the sun
 * direction, DNI, DHI, GHI, the sky model's F1 and F2 and the hours each step stands for. Planes are
 * then given by their outward unit normal (nx east, ny north, nz up); no method allocates per step
 * (but {@link #unobstructed} of a radiance distribution, which makes its plane's patch shares).
 *
 * <p>Per step on an unobstructed plane (W/m2): beam = DNI max(0, n.s) (Duffie &amp; Beckman 2013
 * eq. 2.15.1 first term, written with DNI); sky diffuse per {@link SkyModel}, the parts per unit DHI
 * (1 - F1, F1 a/b, F2 sin b) added by {@link DiffuseParts#sum} (clamped at 0) and times DHI;
 * ground-reflected = albedo GHI (1 - cos b)/2 (Liu &amp; Jordan 1963; D&amp;B eq. 2.15.1 third term).
 *
 * <p>A {@link SkyDistribution} instead gives every step a radiance vector over the
 * {@link SkyPatches#TREGENZA} patches ({@link SkyDistribution#patchRadiance}), and the sky diffuse on
 * a plane is {@code sum_p share_p(n) R_p} with the plane's cosine-weighted patch shares
 * ({@link SkyPatches#cosineShares}); an unobstructed horizontal plane receives DHI to rounding.
 *
 * <p>Immutable after construction: one instance may be shared by all threads of a run.
 */
public final class PreparedSky {
    private final int n;
    private final double[] sx, sy, sz, dni, dhi, ghi, f1, f2, hours;
    private final int[] month;
    /** Compact copies holding only the steps with light (GHI or DNI above 0), for the sums. */
    private final int nLit;
    private final double[] lx, ly, lz, ldni, ldhi, lghi, lf1, lf2, lhours;
    private final int[] lmonth;
    private final TimeBase timeBase;
    private final SkyModel model;
    /** Radiance distributions only: the patches and the radiance vector of every step [step x patches], else null. */
    private final SkyPatches patches;
    private final double[] radiance;
    /** Index of each lit step in the full series. */
    private final int[] litIndex;

    private PreparedSky(WeatherSeries series, SkyModel model) {
        this.model = model;
        this.timeBase = series.timeBase();
        n = series.size();
        sx = new double[n]; sy = new double[n]; sz = new double[n];
        dni = new double[n]; dhi = new double[n]; ghi = new double[n];
        f1 = new double[n]; f2 = new double[n]; hours = new double[n];
        month = new int[n];
        for (int i = 0; i < n; i++) {
            Step s = series.step(i);
            SunPosition p = s.sun();
            double z = Math.toRadians(p.zenithDeg()), a = Math.toRadians(p.azimuthDeg());
            sx[i] = Math.sin(z) * Math.sin(a);
            sy[i] = Math.sin(z) * Math.cos(a);
            sz[i] = p.cosZenith();
            dni[i] = s.dniWm2(); dhi[i] = s.dhiWm2(); ghi[i] = s.ghiWm2();
            if (s.dhiWm2() > 0) {
                f1[i] = model.circumsolarCoefficient(s);
                f2[i] = model.horizonCoefficient(s);
            }
            hours[i] = s.weightedHours();
            month[i] = s.month() - 1;
        }
        if (model instanceof SkyDistribution dist) {
            patches = SkyPatches.TREGENZA;
            int np = patches.count();
            radiance = new double[n * np];
            double[] r = new double[np];
            for (int i = 0; i < n; i++) {
                dist.patchRadiance(series.step(i), patches, r);
                System.arraycopy(r, 0, radiance, i * np, np);
            }
        } else {
            patches = null;
            radiance = null;
        }
        int lit = 0;
        for (int i = 0; i < n; i++) if (ghi[i] > 0 || dni[i] > 0) lit++;
        nLit = lit;
        litIndex = new int[lit];
        lx = new double[lit]; ly = new double[lit]; lz = new double[lit]; ldni = new double[lit]; ldhi = new double[lit];
        lghi = new double[lit]; lf1 = new double[lit]; lf2 = new double[lit]; lhours = new double[lit]; lmonth = new int[lit];
        for (int i = 0, k = 0; i < n; i++) {
            if (!(ghi[i] > 0 || dni[i] > 0)) continue;
            lx[k] = sx[i]; ly[k] = sy[i]; lz[k] = sz[i]; ldni[k] = dni[i]; ldhi[k] = dhi[i]; lghi[k] = ghi[i];
            lf1[k] = f1[i]; lf2[k] = f2[i]; lhours[k] = hours[i]; lmonth[k] = month[i];
            litIndex[k] = i;
            k++;
        }
    }

    /** Number of steps with light (the others add nothing to any sum). */
    public int litSteps() { return nLit; }

    public static PreparedSky of(WeatherSeries series, SkyModel model) { return new PreparedSky(series, model); }

    public int size() { return n; }
    public SkyModel model() { return model; }
    public TimeBase timeBase() { return timeBase; }

    /** Sun direction of step i (unit vector; x east, y north, z up). */
    public double sunX(int i) { return sx[i]; }
    public double sunY(int i) { return sy[i]; }
    public double sunZ(int i) { return sz[i]; }
    /** Whether the sun is up during step i (its sun-up middle is above the horizon): cast sun rays only then. */
    public boolean sunUp(int i) { return sz[i] > 0; }
    public double dni(int i) { return dni[i]; }
    public double dhi(int i) { return dhi[i]; }
    public double ghi(int i) { return ghi[i]; }
    /** Hours step i contributes to sums (duration x weight). */
    public double weightedHours(int i) { return hours[i]; }
    /** Month 0..11 of step i. */
    public int month(int i) { return month[i]; }

    /** Beam on a plane of normal n at step i, W/m2 (0 with the sun behind the plane). */
    public double beam(int i, double nx, double ny, double nz) {
        double c = nx * sx[i] + ny * sy[i] + nz * sz[i];
        return c > 0 ? dni[i] * c : 0;
    }

    /** Unobstructed beam, sky diffuse, ground-reflected at step i into out[0..2], W/m2, each >= 0. */
    public void unobstructed(int i, double nx, double ny, double nz, double albedo, double[] out) {
        double c = nx * sx[i] + ny * sy[i] + nz * sz[i];
        out[0] = c > 0 ? dni[i] * c : 0;
        double d = dhi[i];
        if (radiance != null) {
            double[] shares = new double[patches.count()];
            patches.cosineShares(nx, ny, nz, shares);
            out[1] = distributed(i, shares);
        } else if (d > 0) {
            double sinTilt = Math.sqrt(Math.max(0, 1 - nz * nz));
            out[1] = d * DiffuseParts.sum(1 - f1[i], (1 + nz) / 2, f1[i] * SkyModel.circumsolarRatio(c, sz[i]), f2[i], sinTilt);
        } else {
            out[1] = 0;
        }
        out[2] = albedo * ghi[i] * (1 - nz) / 2;
    }

    /**
     * Adds the monthly irradiation of an unobstructed plane into wh36 (Wh/m2):
     * [month] beam, [12 + month] sky diffuse, [24 + month] ground-reflected. No allocation.
     */
    public void sumInto(double nx, double ny, double nz, double albedo, double[] wh36) {
        if (radiance != null) {
            sumDistributed(nx, ny, nz, albedo, wh36);
            return;
        }
        double sinTilt = Math.sqrt(Math.max(0, 1 - nz * nz)), svf = (1 + nz) / 2, gvf = (1 - nz) / 2;
        double refl = albedo * gvf;
        for (int i = 0; i < nLit; i++) {
            double h = lhours[i];
            int m = lmonth[i];
            double c = nx * lx[i] + ny * ly[i] + nz * lz[i];
            if (c > 0) wh36[m] += ldni[i] * c * h;
            double d = ldhi[i];
            if (d > 0) {
                double v = d * DiffuseParts.sum(1 - lf1[i], svf, lf1[i] * SkyModel.circumsolarRatio(c, lz[i]), lf2[i], sinTilt);
                if (v > 0) wh36[12 + m] += v * h;
            }
            wh36[24 + m] += refl * lghi[i] * h;
        }
    }

    /** Sky diffuse of step i on the plane of these cosine-weighted patch shares, W/m2, >= 0 (distributions only). */
    private double distributed(int i, double[] shares) {
        int np = shares.length, base = i * np;
        double v = 0;
        for (int p = 0; p < np; p++) v += shares[p] * radiance[base + p];
        return Math.max(0, v);
    }

    /** {@link #sumInto} for a radiance distribution: the plane's patch shares once, then one dot product per step. */
    private void sumDistributed(double nx, double ny, double nz, double albedo, double[] wh36) {
        double[] shares = new double[patches.count()];
        patches.cosineShares(nx, ny, nz, shares);
        double refl = albedo * (1 - nz) / 2;
        for (int k = 0; k < nLit; k++) {
            double h = lhours[k];
            int m = lmonth[k];
            double c = nx * lx[k] + ny * ly[k] + nz * lz[k];
            if (c > 0) wh36[m] += ldni[k] * c * h;
            if (ldhi[k] > 0) {
                double v = distributed(litIndex[k], shares);
                if (v > 0) wh36[12 + m] += v * h;
            }
            wh36[24 + m] += refl * lghi[k] * h;
        }
    }

    /** Irradiation of an unobstructed plane given by its outward unit normal. */
    public PlaneIrradiation sum(double nx, double ny, double nz, double albedo) {
        double[] wh = new double[36];
        sumInto(nx, ny, nz, albedo, wh);
        return PlaneIrradiation.fromMonthlyWh(wh);
    }

    /** Irradiation of an unobstructed plane of tilt (from horizontal) and surface azimuth (from north, clockwise), degrees. */
    public PlaneIrradiation sum(double tiltDeg, double surfaceAzimuthDeg, double albedo) {
        var nrm = SunPosition.planeNormal(tiltDeg, surfaceAzimuthDeg);
        return sum(nrm.x(), nrm.y(), nrm.z(), albedo);
    }
}
