package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Property (common practice for a packet tracer: a ray's answer does not depend on the rays traced
 * with it, nor on where in the tracer's arrays it was sorted): rays shared by many origins
 * ({@link BundleTracer#share}, packed once) and each origin's own rays traced with them
 * ({@link BundleTracer#occludedWithShared}) get exactly the single-ray answers of
 * {@link Tracer#occluded} (which the BVH test checks against brute force), ray by ray.
 *
 * <p>Covered: the SIMD kernel and the scalar stream; scenes with and without the ground plane and
 * a far horizon; origins above and below the plane (below it the plane meets every upward shared
 * ray, above it every downward one, so the shared packets must not be used); shared sets with
 * upward rays only (sun and band) and with downward rays too; far-blocked shared rays; own bundles of
 * 0 to 1,024 rays with and without limits; many origins in a row for one shared set (a trace retires
 * lanes, and the next origin must start from the shared set as it was packed); the shared set
 * replaced by a smaller and a larger one; closest-hit bundles on the same tracer in between (they
 * sort their rays after the shared packets and must leave them alone) with their own answers
 * checked against {@link Tracer#closestHit}, and plain any-hit bundles in between; an empty shared
 * set; the refusal to trace shared rays before any were set; and that the SIMD kernel does use the
 * shared packets (a test that passed on the fallback alone would check nothing of them).
 */
class SharedRaysTest {
    @Test
    void sharedRaysGiveTheSingleRayAnswersFromEveryOrigin() {
        int checked = 0, blocked = 0, belowPlane = 0;
        for (int sc = 0; sc < 4; sc++) {
            boolean plane = sc % 2 == 0, farHorizon = sc >= 2;
            Scene scene = Scene.build(TracerTest.randomSoup(700 + sc, 900), plane, 10.0);
            if (farHorizon) {
                double[] elev = new double[36];
                for (int i = 0; i < elev.length; i++) elev[i] = 3 + 9 * Math.abs(Math.sin(0.4 * i));
                scene = scene.withHorizon(new HorizonProfile(elev));
            }
            Tracer single = scene.tracer();
            SplittableRandom r = new SplittableRandom(17 + sc);
            BundleTracer[] tracers = BundleTracer.SIMD_AVAILABLE
                    ? new BundleTracer[] {new BundleTracer(scene, false), new BundleTracer(scene, true)}
                    : new BundleTracer[] {new BundleTracer(scene, false)};
            for (BundleTracer bt : tracers) {
                String kernel = bt.simd() ? "SIMD" : "scalar";
                assertThrows(IllegalStateException.class, () -> bt.occludedWithShared(0, 0, 20, new double[0], null,
                        new boolean[0], 0, new boolean[0], new boolean[0]), "shared rays traced before any were set");
                long packedBefore = bt.packedTraces;
                for (int set = 0; set < 5; set++) {
                    int n = new int[] {300, 40, 1500, 216, 0}[set];
                    boolean downToo = set % 2 == 1;
                    double[] shared = directions(r, n, downToo);
                    boolean[] far = scene.escapeBlocked(shared, n);
                    bt.share(shared, far, n);
                    boolean[] sharedOut = new boolean[n];
                    for (int o = 0; o < 24; o++) {
                        double ox = r.nextDouble(-20, 120), oy = r.nextDouble(-20, 120);
                        double oz = o % 4 == 0 ? r.nextDouble(0, 9.9) : r.nextDouble(10.1, 110); // some below the plane
                        if (o % 4 == 0 && plane) belowPlane++;
                        int own = new int[] {0, 1, 77, 1024}[o % 4];
                        double[] dir = directions(r, own, true);
                        double[] tMax = new double[own];
                        boolean[] ownFar = new boolean[own];
                        for (int s = 0; s < own; s++) {
                            tMax[s] = s % 3 == 0 ? r.nextDouble(0.5, 150) : Double.POSITIVE_INFINITY;
                            ownFar[s] = tMax[s] == Double.POSITIVE_INFINITY
                                    && scene.escapeBlocked(dir[3 * s], dir[3 * s + 1], dir[3 * s + 2]);
                        }
                        boolean[] out = new boolean[own];
                        java.util.Arrays.fill(sharedOut, o % 2 == 0); // stale answers must be overwritten
                        bt.occludedWithShared(ox, oy, oz, dir, tMax, ownFar, own, out, sharedOut);
                        for (int s = 0; s < own; s++) {
                            boolean want = single.occluded(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], tMax[s]);
                            assertEquals(want, out[s], kernel + " scene " + sc + " set " + set + " origin " + o + " own ray " + s);
                        }
                        for (int s = 0; s < n; s++) {
                            boolean want = single.occluded(ox, oy, oz, shared[3 * s], shared[3 * s + 1], shared[3 * s + 2],
                                    Double.POSITIVE_INFINITY);
                            assertEquals(want, sharedOut[s], kernel + " scene " + sc + " set " + set + " origin " + o + " shared ray " + s);
                            if (want) blocked++;
                            checked++;
                        }
                        if (o % 3 == 2) { // a plain any-hit bundle on the same tracer between two origins
                            double[] pd = directions(r, 50, true);
                            boolean[] pf = new boolean[50], po = new boolean[50];
                            for (int s = 0; s < 50; s++) pf[s] = scene.escapeBlocked(pd[3 * s], pd[3 * s + 1], pd[3 * s + 2]);
                            bt.occludedKnownFar(ox, oy, oz, pd, null, pf, 50, po);
                            for (int s = 0; s < 50; s++) {
                                assertEquals(single.occluded(ox, oy, oz, pd[3 * s], pd[3 * s + 1], pd[3 * s + 2], Double.POSITIVE_INFINITY),
                                        po[s], kernel + " plain bundle ray " + s);
                            }
                        }
                        if (o % 3 == 1) { // a closest-hit bundle on the same tracer between two origins
                            double[] cd = directions(r, 64, true);
                            int[] tri = new int[64];
                            double[] dist = new double[64];
                            bt.closestHit(ox, oy, oz, cd, 64, tri, dist);
                            for (int s = 0; s < 64; s++) {
                                int want = single.closestHit(ox, oy, oz, cd[3 * s], cd[3 * s + 1], cd[3 * s + 2], Double.POSITIVE_INFINITY);
                                if (want != tri[s]) { // a shared edge: either triangle, at the same distance
                                    assertEquals(single.t(), dist[s], 0.0, kernel + " closest hit " + s);
                                } else if (want >= 0) {
                                    assertEquals(single.t(), dist[s], 0.0, kernel + " closest hit " + s);
                                }
                            }
                        }
                    }
                }
                // the packets are used where they may be (SIMD, origins the plane cannot decide for), not only the fallback
                if (bt.simd()) assertTrue(bt.packedTraces - packedBefore > 40, kernel + " scene " + sc + ": packed traces "
                        + (bt.packedTraces - packedBefore));
                else assertEquals(packedBefore, bt.packedTraces, "the scalar kernel has no packets");
            }
        }
        // preconditions of the check, not results: blocked and free shared rays, origins below the plane
        assertTrue(blocked > checked / 20 && blocked < checked - checked / 20, "blocked " + blocked + " of " + checked);
        assertTrue(belowPlane > 10, "origins below the ground plane: " + belowPlane);
    }

    /** {@code n} random unit directions; upward only (as sun and band rays) unless {@code downToo}. */
    private static double[] directions(SplittableRandom r, int n, boolean downToo) {
        double[] d = new double[3 * n];
        for (int s = 0; s < n; s++) {
            double x = r.nextGaussian(), y = r.nextGaussian(), z = r.nextGaussian();
            if (!downToo) z = Math.abs(z) + 0.02;
            if (s % 17 == 0) x = 0; // an axis-parallel component
            double l = Math.sqrt(x * x + y * y + z * z);
            d[3 * s] = x / l;
            d[3 * s + 1] = y / l;
            d[3 * s + 2] = z / l;
        }
        return d;
    }
}
