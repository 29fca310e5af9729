package org.solmass.metrics;

import org.solmass.model.Parallel;
import org.solmass.scene.HemisphereSampler;
import org.solmass.sky.CieSky;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;
import org.solmass.table.AreaStats;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;
import org.solmass.table.ResultTable;
import org.solmass.table.Unit;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Vertical sky component of every facade patch: the illuminance the patch receives directly from the
 * visible part of a CIE standard overcast sky, as a percentage of the illuminance on an unobstructed
 * horizontal plane under the whole of that sky. A daylight check value of the trade for courtyards
 * and canyons (common practice: an unobstructed vertical wall has 39.6 %).
 *
 * <p>Sky luminance: the traditional CIE standard overcast sky, L(gamma) = Lz (1 + 2 sin gamma) / 3 for
 * elevation gamma (Moon and Spencer 1942, Illuminating Engineering 37, 707-726; kept beside the 15
 * general skies by ISO 15469:2004 / CIE S 011/E:2003), the sky package's one implementation
 * ({@link CieSky#overcastRelative}, {@link CieSky#OVERCAST_HORIZONTAL_PER_LZ}; also the sky model
 * {@code cie-overcast}). Horizontal illuminance of the whole sky: E_h = 7 pi Lz / 9 (integral of
 * L sin gamma over the upper hemisphere). The patch's illuminance E_v = integral of L cos(theta) over
 * the sky it sees is estimated with the run's cosine-weighted stratified hemisphere rays
 * ({@link HemisphereSampler}, pdf cos(theta)/pi): E_v ~ (pi / N) sum over rays that reach the sky of
 * L(gamma_i), so VSC = E_v / E_h = 3 / (7 N) x sum (1 + 2 sin gamma_i), in percent
 * ({@link CieSky#skyComponentPct}). Light reflected by the ground and the blocks is not part of the
 * vertical sky component (by its definition). Sampling error at 1024 rays: see docs/metrics.md
 * (measured over many seeds in {@code VerticalSkyComponentMetricTest}).
 *
 * <p>The rays are the patch's sky-view rays of the irradiation pass (same seed, origin and answers),
 * so a run traces them once: the pass keeps the sum for every analysed patch
 * ({@link org.solmass.irradiation.IrradiationResult#overcastSkyPct}). Without a pass's result (a
 * context of the metrics alone) the metric traces the same rays itself ({@link HemisphereSampler#skyRays},
 * only the rays that can reach the sky: a ray going down never does), with the same answers;
 * {@code VscFromPassTest} checks that both give the same value. The sky view factor and the vertical
 * sky component of one patch so share their sampling error's rays (each is still unbiased).
 *
 * <p>Facade patches only (other kinds: no value): the component is defined for vertical windows.
 */
public final class VerticalSkyComponentMetric implements Metric {
    public static final Column VSC = Column.of("vsc_pct", Unit.PERCENT, "Vertical sky component (CIE overcast sky)",
            "Facade patches: illuminance from the visible CIE standard overcast sky as a share of an unobstructed "
                    + "horizontal plane's (an open vertical wall has 39.6 %); empty for other kinds.");
    /** The columns of this metric. */
    public static final List<ColumnFamily> COLUMNS = List.of(ColumnFamily.of(VSC));

    @Override public String name() { return "vertical sky component"; }

    @Override public List<ColumnFamily> columns() { return COLUMNS; }

    @Override
    public Findings compute(MetricContext ctx, ResultTable table) {
        List<Patch> patches = ctx.patches().patches();
        double[] vsc = new double[patches.size()];
        Arrays.fill(vsc, Double.NaN);
        double[] fromPass = ctx.irradiation() == null ? null : ctx.irradiation().overcastSkyPct();
        if (fromPass != null) {
            if (fromPass.length != vsc.length)
                throw new IllegalArgumentException("the irradiation result holds " + fromPass.length + " patches, the metric "
                        + vsc.length + ": the pass and the metrics must run on the same patch list");
            for (int p = 0; p < vsc.length; p++) if (patches.get(p).kind() == SurfaceKind.FACADE) vsc[p] = fromPass[p];
        } else {
            traced(ctx, patches, vsc);
        }
        return findings(patches, vsc, table);
    }

    /** The metric's own rays for every facade patch: the pass's sky-view rays, traced again. */
    static void traced(MetricContext ctx, List<Patch> patches, double[] vsc) {
        int rays = ctx.rays() > 0 ? ctx.rays() : HemisphereSampler.DEFAULT_RAYS;
        ThreadLocal<HemisphereSampler> samplers = ThreadLocal.withInitial(() -> new HemisphereSampler(ctx.scene(), rays));
        Parallel.forEach(patches.size(), p -> {
            Patch q = patches.get(p);
            if (q.kind() != SurfaceKind.FACADE) return;
            HemisphereSampler s = samplers.get();
            int n = s.rayCount();
            double[] dir = new double[3 * n];
            boolean[] sky = new boolean[n];
            s.skyRays(q, ctx.raySeed(), dir, sky);
            vsc[p] = percentOfSky(dir, sky, n);
        });
    }

    private static Findings findings(List<Patch> patches, double[] vsc, ResultTable table) {
        table.put(VSC, vsc);
        AreaStats st = AreaStats.of(patches, vsc);
        double below27 = 0;
        for (int p = 0; p < vsc.length; p++) if (vsc[p] < 27) below27 += patches.get(p).areaM2();
        List<String> lines = st.areaM2() > 0
                ? List.of(String.format(Locale.ROOT, "vertical sky component of facades: area-weighted mean %.1f %%; "
                + "%.0f %% of the facade area below 27 %%", st.mean(), 100 * below27 / st.areaM2()))
                : List.of();
        return new Found(lines);
    }

    /**
     * The vertical sky component in percent from cosine-weighted rays: 3 / (7 N) sum over the rays that
     * reach the sky of (1 + 2 dz) x 100 (dz = sin of the ray's elevation; see the class doc).
     */
    static double percentOfSky(double[] dir, boolean[] sky, int n) {
        double sum = 0;
        for (int i = 0; i < n; i++) if (sky[i]) sum += CieSky.overcastRelative(dir[3 * i + 2]);
        return CieSky.skyComponentPct(sum, n);
    }

    /** Terminal lines of a run; the column is summarised in summary.json. */
    record Found(List<String> summaryLines) implements Findings {
        @Override
        public List<String> notes() {
            return List.of("Vertical sky component (vsc_pct): direct light of a CIE standard overcast sky on facade patches, "
                    + "at the patch centre; a daylight indicator for early design, not a daylight-factor or rights-of-light "
                    + "assessment, which follow local guidance and licensed practice.");
        }

        @Override public List<String> summaryColumns() { return List.of(VSC.name()); }
    }
}
