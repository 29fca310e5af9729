package org.solmass.scene;

import org.apache.commons.math3.random.HaltonSequenceGenerator;
import org.apache.commons.math3.random.SobolSequenceGenerator;
import org.junit.jupiter.api.Test;

import java.util.Locale;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Today's jittered stratified hemisphere sampling against two low-discrepancy point sets of Apache
 * Commons Math (Sobol, Joe and Kuo 2008 direction numbers; Halton with the scrambling weights of
 * Faure and Lemieux 2009), each randomised per patch by a random shift modulo 1 (Cranley and
 * Patterson 1976, SIAM J. Numer. Anal. 13(6)) so that it is seeded per patch like today's jitter.
 * All three go through the same square-to-hemisphere map ({@link HemisphereSampler#cosineDirection}).
 *
 * <p>The cases have exact sky view factors and are evaluated on the ray directions alone (infinite
 * geometry, no tracing), so only the sampling differs:
 * <ul>
 * <li>a vertical wall in open field, its normal turned 17 deg off the axes: SVF = 0.5 (Liu and
 *     Jordan 1963; common practice);</li>
 * <li>a point on the floor of an infinitely long canyon (width W = 10 m, walls H = 15 m, the point
 *     2 m off the middle, the canyon's axis turned 17 deg): SVF = (sin phi2 - sin phi1)/2 with phi
 *     the angles from the normal to the walls' tops, the differential-strip form of Hottel's crossed
 *     strings (Howell, Menguc and Siegel, Thermal Radiation Heat Transfer, 6th ed., 2016, ch. 4);</li>
 * <li>an up-facing point under an infinitely long horizontal strip (from 1 m to 6 m beside it, 3 m up):
 *     SVF = 1 - (sin phi2 - sin phi1)/2, same source.</li>
 * </ul>
 * The standard error of an estimator is its root mean square error over {@link #SEEDS} independent
 * seeds. Printed numbers go to docs/scene.md; the assertions are facts only: every estimator is
 * unbiased (its mean over the seeds lies within 4 standard errors of the mean of the exact value) and
 * converges (its error at 4096 rays is below its error at 256 rays).
 */
class HemisphereSamplingComparisonTest {
    static final int SEEDS = 400;
    static final int[] RAYS = {256, 1024, 4096};
    static final double TURN = Math.toRadians(17);

    interface Case { String name(); double exact(); double[] normal(); boolean sky(double dx, double dy, double dz); }

    static final double W = 10, H = 15, X0 = 2;

    static final Case WALL = new Case() {
        public String name() { return "vertical wall, open field"; }
        public double exact() { return 0.5; }
        public double[] normal() { return new double[] {Math.cos(TURN), Math.sin(TURN), 0}; }
        public boolean sky(double dx, double dy, double dz) { return dz >= 0; }
    };

    static final Case CANYON = new Case() {
        public String name() { return "canyon floor W/H = 2/3"; }
        public double exact() {
            double a = (W / 2 - X0), b = (W / 2 + X0);
            return (a / Math.hypot(a, H) + b / Math.hypot(b, H)) / 2;
        }
        public double[] normal() { return new double[] {0, 0, 1}; }
        public boolean sky(double dx, double dy, double dz) {
            double across = dx * Math.cos(TURN) + dy * Math.sin(TURN); // across the turned canyon
            double x = X0 + across * H / dz; // where the ray is at the walls' top height
            return dz > 0 && x >= -W / 2 && x <= W / 2;
        }
    };

    static final Case STRIP = new Case() {
        public String name() { return "under a strip 1..6 m, 3 m up"; }
        public double exact() {
            double s1 = 1 / Math.hypot(1, 3), s2 = 6 / Math.hypot(6, 3);
            return 1 - (s2 - s1) / 2;
        }
        public double[] normal() { return new double[] {0, 0, 1}; }
        public boolean sky(double dx, double dy, double dz) {
            double x = dx * 3 / dz;
            return !(dz > 0 && x >= 1 && x <= 6);
        }
    };

    /** Root mean square error and mean error over the seeds of one estimator. */
    record Error(double rms, double mean) {}

    enum Method { STRATIFIED, SOBOL, HALTON }

    static Error error(Case c, Method m, int rays) {
        Scene empty = Scene.build(new float[0], false, 0);
        HemisphereSampler h = new HemisphereSampler(empty, rays);
        int n = h.rayCount();
        double[] base = null;
        if (m != Method.STRATIFIED) {
            base = new double[2 * n];
            if (m == Method.SOBOL) {
                SobolSequenceGenerator g = new SobolSequenceGenerator(2);
                for (int i = 0; i < n; i++) { double[] p = g.nextVector(); base[2 * i] = p[0]; base[2 * i + 1] = p[1]; }
            } else {
                HaltonSequenceGenerator g = new HaltonSequenceGenerator(2);
                for (int i = 0; i < n; i++) { double[] p = g.nextVector(); base[2 * i] = p[0]; base[2 * i + 1] = p[1]; }
            }
        }
        double[] nrm = c.normal(), dir = new double[3 * n];
        double sumSq = 0, sum = 0;
        SplittableRandom shifts = new SplittableRandom(11);
        for (int seed = 0; seed < SEEDS; seed++) {
            long streamSeed = HemisphereSampler.patchSeed("p" + seed, 7);
            if (m == Method.STRATIFIED) {
                h.directions(nrm[0], nrm[1], nrm[2], streamSeed, dir);
            } else {
                double su = shifts.nextDouble(), sv = shifts.nextDouble();
                for (int i = 0; i < n; i++) {
                    double u = base[2 * i] + su, v = base[2 * i + 1] + sv;
                    HemisphereSampler.cosineDirection(u >= 1 ? u - 1 : u, v >= 1 ? v - 1 : v, nrm[0], nrm[1], nrm[2], dir, i);
                }
            }
            int sky = 0;
            for (int i = 0; i < n; i++) if (c.sky(dir[3 * i], dir[3 * i + 1], dir[3 * i + 2])) sky++;
            double e = sky / (double) n - c.exact();
            sum += e;
            sumSq += e * e;
        }
        return new Error(Math.sqrt(sumSq / SEEDS), sum / SEEDS);
    }

    @Test
    void everySamplingIsUnbiasedAndConvergesOnAnalyticSkyViewFactors() {
        StringBuilder out = new StringBuilder("standard error (RMS over " + SEEDS + " seeds) of the sky view factor\n");
        out.append(String.format(Locale.ROOT, "%-30s %6s %12s %12s %12s%n", "case", "rays", "stratified", "sobol", "halton"));
        for (Case c : new Case[] {WALL, CANYON, STRIP}) {
            for (int rays : RAYS) {
                out.append(String.format(Locale.ROOT, "%-30s %6d", c.name(), rays));
                for (Method m : Method.values()) {
                    Error e = error(c, m, rays);
                    out.append(String.format(Locale.ROOT, " %12.2e", e.rms()));
                    // unbiased: the mean error over the seeds is within 4 standard errors of the mean
                    assertTrue(Math.abs(e.mean()) <= 4 * e.rms() / Math.sqrt(SEEDS) + 1e-12,
                            c.name() + " " + m + " " + rays + ": mean error " + e.mean() + ", rms " + e.rms());
                }
                out.append('\n');
            }
            for (Method m : Method.values()) {
                assertTrue(error(c, m, 4096).rms() < error(c, m, 256).rms(), c.name() + " " + m + " converges");
            }
        }
        System.out.print(out);
    }
}
