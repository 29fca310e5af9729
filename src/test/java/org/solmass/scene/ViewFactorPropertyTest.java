package org.solmass.scene;

import org.junit.jupiter.api.Test;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.ForkJoinPool;

import static org.junit.jupiter.api.Assertions.*;

class ViewFactorPropertyTest {

    /** Random boxes on the ground, random patches on their faces and in the open with random normals. */
    private static Object[] randomCase(long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        SceneFixtures f = new SceneFixtures();
        List<double[]> boxes = new ArrayList<>();
        for (int b = 0; b < 30; b++) {
            double x = r.nextDouble(0, 200), y = r.nextDouble(0, 200), w = r.nextDouble(5, 30), d = r.nextDouble(5, 30);
            double h = r.nextDouble(3, 60);
            f.box(x, y, 0, x + w, y + d, h);
            boxes.add(new double[] {x, y, x + w, y + d, h});
        }
        List<Patch> ps = new ArrayList<>();
        for (int i = 0; i < 60; i++) {
            double[] b = boxes.get(r.nextInt(boxes.size()));
            double u = r.nextDouble(0.05, 0.95), v = r.nextDouble(0.05, 0.95);
            double x = b[0] + u * (b[2] - b[0]), y = b[1] + v * (b[3] - b[1]), z = v * b[4];
            switch (r.nextInt(5)) {
                case 0 -> ps.add(SceneFixtures.patch("p" + i, x, y, b[4], 0, 0, 1));
                case 1 -> ps.add(SceneFixtures.patch("p" + i, b[2], y, z, 1, 0, 0));
                case 2 -> ps.add(SceneFixtures.patch("p" + i, b[0], y, z, -1, 0, 0));
                case 3 -> ps.add(SceneFixtures.patch("p" + i, x, b[1], z, 0, -1, 0));
                default -> ps.add(SceneFixtures.patch("p" + i, r.nextDouble(0, 230), r.nextDouble(0, 230),
                        r.nextDouble(0.5, 70), r.nextGaussian(), r.nextGaussian(), r.nextGaussian()));
            }
        }
        boolean[] ground = new boolean[f.triangleCount()];
        for (int t = 0; t < ground.length; t++) ground[t] = r.nextInt(4) == 0;
        return new Object[] {f, ps, ground};
    }

    @Test
    @SuppressWarnings("unchecked")
    void viewFactorsAreFractionsSummingToOneWhateverTheThreadCount() throws Exception {
        // physical invariant (definition of view factors; common practice): each in [0,1], sum 1;
        // determinism rule: the same numbers on 1 and on 2 worker threads
        for (long seed = 1; seed <= 3; seed++) {
            Object[] c = randomCase(seed);
            SceneFixtures f = (SceneFixtures) c[0];
            List<Patch> ps = (List<Patch>) c[1];
            for (boolean plane : new boolean[] {true, false}) {
                Scene s = Scene.build(f.model(), plane, 0.0);
                for (boolean[] ground : new boolean[][] {null, (boolean[]) c[2]}) {
                    ViewFactors[] one = inPool(1, s, ps, ground), two = inPool(2, s, ps, ground);
                    assertArrayEquals(one, two, "1 vs 2 threads, seed " + seed);
                    for (ViewFactors v : one) {
                        for (double x : new double[] {v.sky(), v.ground(), v.obstruction()}) {
                            assertTrue(x >= 0 && x <= 1, v.toString());
                        }
                        assertEquals(1.0, v.sky() + v.ground() + v.obstruction(), 1e-12);
                        assertTrue(v.skyStdError() >= 0 && v.skyStdError() <= 0.5);
                    }
                }
            }
        }
    }

    private static ViewFactors[] inPool(int threads, Scene s, List<Patch> ps, boolean[] ground) throws Exception {
        ForkJoinPool pool = new ForkJoinPool(threads);
        try {
            return pool.submit(() -> SkyViewCalculator.compute(s, ps, 256, 99, ground, null)).get();
        } finally {
            pool.shutdown();
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void fastClassificationAgreesWithFullClosestHitSampling() {
        // the any-hit shortcut used for view factors must classify every ray as the full
        // closest-hit path does (same directions, same scene)
        Object[] c = randomCase(11);
        SceneFixtures f = (SceneFixtures) c[0];
        // ground plane at 0, none, and at 8 m (some patches then lie below it and look up through it)
        for (double gz : new double[] {0, Double.NaN, 8}) {
            Scene s = Scene.build(f.model(), !Double.isNaN(gz), Double.isNaN(gz) ? 0 : gz);
            HemisphereSampler hs = new HemisphereSampler(s, 400);
            int n = hs.rayCount();
            double[] d1 = new double[3 * n], d2 = new double[3 * n], dist = new double[n];
            int[] c1 = new int[n], c2 = new int[n], tri = new int[n];
            for (Patch p : (List<Patch>) c[1]) {
                hs.classify(p, 5, null, d1, c1);
                hs.sample(p, 5, null, d2, c2, tri, dist);
                assertArrayEquals(d1, d2);
                assertArrayEquals(c1, c2, p.id());
                for (int i = 0; i < n; i++) {
                    assertEquals(tri[i] == Tracer.MISS, Double.isInfinite(dist[i]));
                    if (c2[i] == HemisphereSampler.BLOCK) assertTrue(tri[i] >= 0);
                }
            }
        }
    }

    @Test
    void progressReachesThePatchCount() {
        Object[] c = randomCase(4);
        @SuppressWarnings("unchecked") List<Patch> ps = (List<Patch>) c[1];
        Scene s = Scene.build(((SceneFixtures) c[0]).model(), true, 0.0);
        java.util.concurrent.atomic.AtomicInteger max = new java.util.concurrent.atomic.AtomicInteger();
        SkyViewCalculator.compute(s, ps, 16, 1, null, d -> max.accumulateAndGet(d, Math::max));
        assertEquals(ps.size(), max.get());
    }
}
