package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

class TracerTest {

    /** Random triangles of random size in a 100 m cube, plus a few boxes (shared edges, ties). */
    static float[] randomSoup(long seed, int count) {
        SplittableRandom r = new SplittableRandom(seed);
        SceneFixtures f = new SceneFixtures();
        for (int b = 0; b < 5; b++) {
            double x = r.nextDouble(0, 80), y = r.nextDouble(0, 80);
            f.box(x, y, 0, x + r.nextDouble(1, 20), y + r.nextDouble(1, 20), r.nextDouble(1, 40));
        }
        while (f.triangleCount() < count) {
            double cx = r.nextDouble(0, 100), cy = r.nextDouble(0, 100), cz = r.nextDouble(0, 100);
            double s = Math.pow(10, r.nextDouble(-1, 1.3));
            double[] t = new double[9];
            for (int i = 0; i < 9; i++) t[i] = (i % 3 == 0 ? cx : i % 3 == 1 ? cy : cz) + r.nextDouble(-s, s);
            f.triangle(t);
        }
        return f.model().triangleSoup();
    }

    @Test
    void bvhQueriesAgreeWithBruteForceOnRandomScenes() {
        // property (common practice): a BVH is exact, so over 100,000 random rays its closest hit and
        // any-hit answers equal the brute-force loop over every triangle (same intersection kernel).
        int[] sizes = {50, 700, 2500, 4000};
        int raysPerScene = 25_000;
        for (int sc = 0; sc < sizes.length; sc++) {
            boolean plane = sc % 2 == 1;
            Scene scene = Scene.build(randomSoup(1000 + sc, sizes[sc]), plane, 0.0);
            Tracer bvh = scene.tracer(), brute = scene.tracer();
            SplittableRandom r = new SplittableRandom(77 + sc);
            int hits = 0;
            for (int i = 0; i < raysPerScene; i++) {
                double ox = r.nextDouble(-20, 120), oy = r.nextDouble(-20, 120), oz = r.nextDouble(-5, 120);
                double dx = r.nextGaussian(), dy = r.nextGaussian(), dz = r.nextGaussian();
                if (i % 50 == 0) { dx = 0; } // axis-parallel components exercise the slab test's limits
                if (i % 70 == 0) { dy = 0; dz = 0; }
                double l = Math.sqrt(dx * dx + dy * dy + dz * dz);
                if (l == 0) continue;
                dx /= l; dy /= l; dz /= l;
                double tMax = i % 3 == 0 ? r.nextDouble(0.1, 150) : Double.POSITIVE_INFINITY;
                int a = bvh.closestHit(ox, oy, oz, dx, dy, dz, tMax);
                int b = brute.closestHitBruteForce(ox, oy, oz, dx, dy, dz, tMax);
                if (a != b) {
                    assertTrue(a >= 0 && b >= 0, "scene " + sc + " ray " + i + ": bvh " + a + " brute " + b);
                    assertEquals(brute.t(), bvh.t(), 1e-6 * brute.t(), "tie must be at the same distance");
                } else if (a != Tracer.MISS) {
                    assertEquals(brute.t(), bvh.t(), 0.0);
                    assertEquals(brute.u(), bvh.u(), 0.0);
                    assertEquals(brute.v(), bvh.v(), 0.0);
                }
                if (b != Tracer.MISS) hits++;
                assertEquals(b != Tracer.MISS, bvh.occluded(ox, oy, oz, dx, dy, dz, tMax),
                        "occluded disagrees, scene " + sc + " ray " + i);
            }
            assertTrue(hits > 500, "the test rays must actually hit things: " + hits);
        }
    }

    @Test
    void closestHitReportsOriginalTriangleDistanceAndBarycentrics() {
        // a single triangle z = 5 over (0,0)-(10,0)-(0,10) behind two others; analytic (common practice)
        SceneFixtures f = new SceneFixtures();
        f.triangle(100, 100, 1, 101, 100, 1, 100, 101, 1);
        f.triangle(0, 0, 5, 10, 0, 5, 0, 10, 5);
        f.triangle(0, 0, 9, 10, 0, 9, 0, 10, 9);
        Scene s = Scene.build(f.model(), true, 0.0);
        Tracer t = s.tracer();
        assertEquals(1, t.closestHit(2, 3, 0.5, 0, 0, 1, Double.POSITIVE_INFINITY));
        assertEquals(4.5, t.t(), 1e-5);
        assertEquals(0.2, t.u(), 1e-6);
        assertEquals(0.3, t.v(), 1e-6);
        assertEquals(2, t.closestHit(2, 3, 20, 0, 0, -1, Double.POSITIVE_INFINITY), "two-sided: back face hit");
        assertEquals(11, t.t(), 1e-5);
        assertEquals(Tracer.GROUND, t.closestHit(50, 50, 3, 0.6, 0, -0.8, Double.POSITIVE_INFINITY));
        assertEquals(3.75, t.t(), 1e-12);
        assertEquals(Tracer.MISS, t.closestHit(50, 50, 3, 0, 0, 1, Double.POSITIVE_INFINITY));
        assertEquals(Tracer.MISS, t.closestHit(2, 3, 0.5, 0, 0, 1, 4.0), "tMax stops before the hit");
        assertTrue(t.occluded(2, 3, 0.5, 0, 0, 1, 4.6));
        assertFalse(t.occluded(2, 3, 0.5, 0, 0, 1, 4.4));
        assertTrue(t.occluded(50, 50, 3, 0, 0, -1, 3.1), "ground plane occludes");
        assertFalse(t.occluded(50, 50, 3, 0, 0, -1, 2.9));
    }

    @Test
    void projectedCoordinatesKeepMillimetreResolution() {
        // a model 500 km east and 5,000 km north of the origin (UTM-like): float storage relative to
        // the box centre must still resolve a 1 mm gap (common practice: recentre before float)
        double x0 = 500_000, y0 = 5_000_000;
        SceneFixtures f = new SceneFixtures();
        f.box(x0, y0, 0, x0 + 10, y0 + 10, 10);
        f.box(x0 + 200, y0 + 200, 0, x0 + 210, y0 + 210, 10);
        Tracer t = Scene.build(f.model(), true, 0.0).tracer();
        assertEquals(Tracer.MISS, t.closestHit(x0 + 10.001, y0 + 5, 5, 0, 0, 1, Double.POSITIVE_INFINITY));
        assertTrue(t.closestHit(x0 + 9.999, y0 + 5, 5, 0, 0, 1, Double.POSITIVE_INFINITY) >= 0);
        assertEquals(5.0, t.t(), 1e-3);
    }

    @Test
    void emptySceneOnlyHasTheGroundPlane() {
        Scene s = Scene.build(new float[0], true, -1.0);
        Tracer t = s.tracer();
        assertEquals(Tracer.MISS, t.closestHit(0, 0, 0, 0, 0, 1, Double.POSITIVE_INFINITY));
        assertEquals(Tracer.GROUND, t.closestHit(0, 0, 0, 0, 0, -1, Double.POSITIVE_INFINITY));
        assertEquals(1.0, t.t(), 0);
        assertFalse(Scene.build(new float[0], false, 0).tracer().occluded(0, 0, 0, 0, 0, -1, 1e9));
    }

    @Test
    void rayOriginIsOffsetAlongTheNormalByTheDocumentedEpsilon() {
        SceneFixtures f = new SceneFixtures().box(0, 0, 0, 300, 400, 0.0001);
        Scene s = Scene.build(f.model(), false, 0);
        // diagonal = 500 m -> 1e-5 x 500 = 5 mm; a tiny scene falls back to 1 mm
        assertEquals(0.005, s.epsilon(), 1e-9);
        double[] o = s.rayOrigin(SceneFixtures.patch("p", 1, 2, 3, 0, -1, 0));
        assertArrayEquals(new double[] {1, 2 - 0.005, 3}, o, 1e-12);
        assertEquals(Scene.MIN_EPSILON_M, Scene.build(new SceneFixtures().box(0, 0, 0, 1, 1, 1).model(), false, 0).epsilon());
    }

    @Test
    void buildHandlesCoincidentAndDegenerateTriangles() {
        SceneFixtures f = new SceneFixtures();
        for (int i = 0; i < 50; i++) f.triangle(0, 0, 1, 1, 0, 1, 0, 1, 1); // 50 identical triangles
        f.triangle(5, 5, 5, 5, 5, 5, 5, 5, 5);                                // a point
        Scene s = Scene.build(f.model(), false, 0);
        Tracer t = s.tracer();
        assertTrue(t.closestHit(0.2, 0.2, 0, 0, 0, 1, Double.POSITIVE_INFINITY) >= 0);
        assertEquals(1.0, t.t(), 1e-6);
        assertEquals(Tracer.MISS, t.closestHit(5, 5, 0, 0, 0, 1, Double.POSITIVE_INFINITY));
    }
}
