package org.solmass.scene;

import org.junit.jupiter.api.Test;
import org.solmass.bench.SyntheticDistrict;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

class BundleTracerTest {

    /**
     * Property (common practice for a packet tracer): tracing rays together changes nothing. Every ray
     * of a bundle gets exactly the single-ray answer of {@link Tracer#occluded}, which the BVH test
     * checks against brute force, for the SIMD kernel and the scalar stream alike.
     */
    @Test
    void bundleAnswersEqualSingleRayAnswersOnRandomScenes() {
        int[] sizes = {1, 60, 900, 4000};
        int[] bundleSizes = {0, 1, 7, 16, 17, 64, 333, 1024};
        for (int sc = 0; sc < sizes.length; sc++) {
            boolean plane = sc % 2 == 0;
            Scene scene = Scene.build(TracerTest.randomSoup(500 + sc, sizes[sc]), plane, 0.0);
            Tracer single = scene.tracer();
            BundleTracer scalar = new BundleTracer(scene, false);
            BundleTracer simd = BundleTracer.SIMD_AVAILABLE ? new BundleTracer(scene, true) : null;
            SplittableRandom r = new SplittableRandom(31 + sc);
            int blocked = 0, total = 0;
            for (int bundle = 0; bundle < 60; bundle++) {
                int n = bundleSizes[bundle % bundleSizes.length];
                double ox = r.nextDouble(-20, 120), oy = r.nextDouble(-20, 120), oz = r.nextDouble(-5, 120);
                double[] dir = new double[3 * n], tMax = new double[n];
                for (int s = 0; s < n; s++) {
                    double dx = r.nextGaussian(), dy = r.nextGaussian(), dz = r.nextGaussian();
                    if (s % 11 == 0) dx = 0; // axis-parallel components exercise the slab limits
                    if (s % 13 == 0) { dy = 0; dz = -0.0; }
                    double l = Math.sqrt(dx * dx + dy * dy + dz * dz);
                    if (l == 0) { dx = 1; l = 1; }
                    dir[3 * s] = dx / l; dir[3 * s + 1] = dy / l; dir[3 * s + 2] = dz / l;
                    tMax[s] = s % 3 == 0 ? r.nextDouble(0.1, 150) : Double.POSITIVE_INFINITY;
                }
                boolean[] a = new boolean[n], b = new boolean[n];
                scalar.occluded(ox, oy, oz, dir, tMax, n, a);
                if (simd != null) simd.occluded(ox, oy, oz, dir, tMax, n, b);
                for (int s = 0; s < n; s++) {
                    boolean want = single.occluded(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], tMax[s]);
                    assertEquals(want, a[s], "scalar stream, scene " + sc + " bundle " + bundle + " ray " + s);
                    if (simd != null) assertEquals(want, b[s], "SIMD packets, scene " + sc + " bundle " + bundle + " ray " + s);
                    if (want) blocked++;
                    total++;
                }
            }
            // precondition of the check, not a result: the rays must include blocked and free ones
            assertTrue(blocked > 100 && blocked < total, "scene " + sc + ": a mix of blocked and free rays, " + blocked + " of " + total);
        }
    }

    @Test
    void hemisphereBundlesOnTheBenchDistrictMatchSingleRays() {
        // the workload the bundle is for: 1,024 cosine-weighted rays from one patch, many patches
        var m = SyntheticDistrict.generate(60, 3);
        Scene scene = Scene.build(m, true, 0.0);
        double[] r = SyntheticDistrict.rays(m, 40, 1024, scene.epsilon(), 5);
        Tracer single = scene.tracer();
        BundleTracer bundle = scene.bundleTracer();
        double[] dir = new double[3 * 1024];
        boolean[] out = new boolean[1024];
        for (int p = 0; p < 40; p++) {
            int base = p * 1024;
            for (int s = 0; s < 1024; s++) System.arraycopy(r, 6 * (base + s) + 3, dir, 3 * s, 3);
            bundle.occluded(r[6 * base], r[6 * base + 1], r[6 * base + 2], dir, null, 1024, out);
            for (int s = 0; s < 1024; s++) {
                int j = 6 * (base + s);
                assertEquals(single.occluded(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY),
                        out[s], "patch " + p + " ray " + s);
            }
        }
    }

    /**
     * Property (common practice): the closest hit of a bundle is the single-ray closest hit, ray by
     * ray: the same distance bit for bit, and the same triangle unless two triangles meet the ray at
     * exactly that distance (a shared edge), where either is right.
     */
    @Test
    void bundleClosestHitsEqualSingleRayClosestHits() {
        int[] sizes = {1, 60, 900, 4000};
        int[] bundleSizes = {0, 1, 7, 16, 17, 64, 333, 1024};
        for (int sc = 0; sc < sizes.length; sc++) {
            Scene scene = Scene.build(TracerTest.randomSoup(700 + sc, sizes[sc]), sc % 2 == 0, 0.0);
            Tracer single = scene.tracer();
            BundleTracer bundle = scene.bundleTracer();
            SplittableRandom r = new SplittableRandom(41 + sc);
            int hits = 0, ties = 0;
            for (int b = 0; b < 60; b++) {
                int n = bundleSizes[b % bundleSizes.length];
                double ox = r.nextDouble(-20, 120), oy = r.nextDouble(-20, 120), oz = r.nextDouble(0.5, 120);
                double[] dir = new double[3 * n], dist = new double[n];
                int[] tri = new int[n];
                for (int s = 0; s < n; s++) {
                    double dx = r.nextGaussian(), dy = r.nextGaussian(), dz = r.nextGaussian();
                    if (s % 11 == 0) dx = 0;
                    double l = Math.sqrt(dx * dx + dy * dy + dz * dz);
                    dir[3 * s] = dx / l; dir[3 * s + 1] = dy / l; dir[3 * s + 2] = dz / l;
                }
                bundle.closestHit(ox, oy, oz, dir, n, tri, dist);
                for (int s = 0; s < n; s++) {
                    int want = single.closestHit(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], Double.POSITIVE_INFINITY);
                    assertEquals(single.t(), dist[s], 0.0, "distance, scene " + sc + " bundle " + b + " ray " + s);
                    if (want != tri[s]) {
                        assertTrue(want >= 0 && tri[s] >= 0, "scene " + sc + " bundle " + b + " ray " + s + ": " + want + " vs " + tri[s]);
                        ties++;
                    }
                    if (want >= 0) hits++;
                }
            }
            assertTrue(hits > 100 || sizes[sc] < 100, "scene " + sc + ": the rays must hit triangles, " + hits);
            assertTrue(ties <= hits / 100 + 1, "ties are rare: " + ties + " of " + hits);
        }
    }

    @Test
    void reusedBundleTracerForgetsEarlierBundles() {
        // a larger bundle, then a smaller one: no state may leak from the first into the second
        Scene scene = Scene.build(TracerTest.randomSoup(9, 300), false, 0.0);
        BundleTracer b = scene.bundleTracer();
        Tracer single = scene.tracer();
        SplittableRandom r = new SplittableRandom(4);
        for (int n : new int[] {500, 3, 40, 0, 2}) {
            double[] dir = new double[3 * n];
            for (int s = 0; s < n; s++) {
                double dx = r.nextGaussian(), dy = r.nextGaussian(), dz = r.nextGaussian(), l = Math.sqrt(dx * dx + dy * dy + dz * dz);
                dir[3 * s] = dx / l; dir[3 * s + 1] = dy / l; dir[3 * s + 2] = dz / l;
            }
            boolean[] out = new boolean[n];
            java.util.Arrays.fill(out, true);
            b.occluded(50, 50, 50, dir, null, n, out);
            for (int s = 0; s < n; s++) {
                assertEquals(single.occluded(50, 50, 50, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], Double.POSITIVE_INFINITY), out[s]);
            }
        }
    }

    @Test
    void buildUsesTheSimdKernelWhenTheModuleIsLoaded() {
        // the build and the launcher start the JVM with the vector module (pom.xml, ./solmass)
        assertTrue(BundleTracer.SIMD_AVAILABLE, "tests run with --add-modules jdk.incubator.vector");
        assertTrue(Scene.build(TracerTest.randomSoup(1, 10), false, 0).bundleTracer().simd());
    }
}
