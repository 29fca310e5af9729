package org.solmass.scene;

import org.solmass.model.Parallel;
import org.solmass.surface.Patch;

import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;

/**
 * Sky, ground and obstruction view factors of many patches by cosine-weighted stratified Monte Carlo
 * ray casting ({@link HemisphereSampler}).
 *
 * <p>Estimator: with directions of density cos(theta)/pi the view factor of a set of directions is the
 * expected fraction of rays in it (Howell, Menguc and Siegel, Thermal Radiation Heat Transfer, 6th ed.,
 * 2016, ch. 7, Monte Carlo view factors), so sky = n_sky / N, ground = n_ground / N, obstruction =
 * n_block / N; they sum to 1 exactly.
 *
 * <p>Standard error of the sky view factor: one jittered sample per equal-weight stratum, so the
 * variance of the mean is (1/N^2) sum_h var_h, which one sample per stratum cannot estimate directly.
 * Neighbouring strata of a grid row are collapsed into groups of 2 (the last group of a row of odd
 * length takes 3) and var of each group's sum is estimated by g/(g-1) sum (y_i - ybar)^2 with y the
 * sky indicator: the collapsed-strata estimator, Cochran, Sampling Techniques, 3rd ed., 1977,
 * section 5A.12; it is biased upwards (conservative) by the spread of the stratum means within a
 * group. With a single ray (k = 1) the binomial bound 0.5 is reported.
 *
 * <p>Determinism: patches run in parallel (the calling ForkJoinPool, normally the common pool) and
 * each writes only its own array slot; every patch's rays depend only on its id and the run seed.
 */
public final class SkyViewCalculator {
    private SkyViewCalculator() {}

    /** {@link #compute(Scene, List, int, long, boolean[], IntConsumer)} with no ground-flagged triangles and no progress. */
    public static ViewFactors[] compute(Scene scene, List<Patch> patches, int raysPerPatch, long seed) {
        return compute(scene, patches, raysPerPatch, seed, null, null);
    }

    /**
     * View factors of every patch, index = position in {@code patches}.
     *
     * @param raysPerPatch positive; rounded to a square stratification grid
     *                     ({@link HemisphereSampler#roundedRayCount(int)}); default
     *                     {@link HemisphereSampler#DEFAULT_RAYS}
     * @param seed run seed mixed into every patch's ray stream
     * @param triangleIsGround per original triangle whether hitting it counts as ground; may be null
     * @param progress receives the number of patches finished so far (from any thread, roughly every
     *                 1% and at the end); may be null
     */
    public static ViewFactors[] compute(Scene scene, List<Patch> patches, int raysPerPatch, long seed,
                                        boolean[] triangleIsGround, IntConsumer progress) {
        int n = patches.size();
        int k = HemisphereSampler.gridSide(raysPerPatch);
        if (triangleIsGround != null && triangleIsGround.length < scene.triangleCount()) {
            throw new IllegalArgumentException("triangleIsGround has " + triangleIsGround.length
                    + " entries for " + scene.triangleCount() + " triangles");
        }
        ViewFactors[] out = new ViewFactors[n];
        ThreadLocal<Worker> workers = ThreadLocal.withInitial(() -> new Worker(scene, k * k));
        AtomicInteger done = new AtomicInteger();
        int step = Math.max(1, n / 100);
        Parallel.forEach(n, i -> {
            out[i] = workers.get().compute(patches.get(i), seed, triangleIsGround);
            int d = done.incrementAndGet();
            if (progress != null && (d % step == 0 || d == n)) progress.accept(d);
        });
        return out;
    }

    /** Per-thread sampler and scratch arrays. */
    private static final class Worker {
        final HemisphereSampler sampler;
        final double[] dir;
        final int[] cls;

        Worker(Scene scene, int rays) {
            sampler = new HemisphereSampler(scene, rays);
            dir = new double[3 * sampler.rayCount()];
            cls = new int[sampler.rayCount()];
        }

        ViewFactors compute(Patch p, long seed, boolean[] ground) {
            sampler.classify(p, seed, ground, dir, cls);
            return fromClasses(cls, sampler.gridSide());
        }
    }

    /** View factors and SVF standard error from ray classes in stratum order (k x k, row-major). */
    public static ViewFactors fromClasses(int[] cls, int k) {
        int n = k * k, sky = 0, ground = 0, block;
        for (int s = 0; s < n; s++) { // counts without a branch per ray (the classes come in no order)
            int c = cls[s];
            sky += c == HemisphereSampler.SKY ? 1 : 0;
            ground += c == HemisphereSampler.GROUND ? 1 : 0;
        }
        block = n - sky - ground;
        double se;
        if (k == 1) se = 0.5;
        else if (k % 2 == 0) {
            // rows of pairs only: a pair's term below is exactly 1 when its two rays differ (one sky),
            // else 0 (mean 0.5 or 0 or 1, squares and sums of halves: exact), so count those pairs
            int differ = 0;
            for (int s = 0; s < n; s += 2) {
                differ += (cls[s] == HemisphereSampler.SKY) != (cls[s + 1] == HemisphereSampler.SKY) ? 1 : 0;
            }
            se = Math.sqrt(differ) / n;
        } else {
            double varSum = 0;
            for (int row = 0; row < k; row++) {
                int base = row * k;
                for (int c = 0; c < k; ) {
                    int g = (k - c == 3) ? 3 : 2;
                    double mean = 0;
                    for (int q = 0; q < g; q++) mean += cls[base + c + q] == HemisphereSampler.SKY ? 1 : 0;
                    mean /= g;
                    double ss = 0;
                    for (int q = 0; q < g; q++) {
                        double y = cls[base + c + q] == HemisphereSampler.SKY ? 1 : 0;
                        ss += (y - mean) * (y - mean);
                    }
                    varSum += ss * g / (g - 1);
                    c += g;
                }
            }
            se = Math.sqrt(varSum) / n;
        }
        return new ViewFactors((double) sky / n, (double) ground / n, (double) block / n, se);
    }
}
