package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;
import org.solmass.surface.SurfaceFrame;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The receiver found for a hit point is the one whose centre is nearest (the definition of the
 * nearest-patch lookup; checked against a brute-force search over all centres).
 */
class ReflectorIndexTest {

    /** Brute force: the lowest receiver among those at the least squared distance on surface s. */
    private static int nearest(double[] lx, double[] ly, int[] surf, int s, double x, double y) {
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
        for (int r = 0; r < lx.length; r++) {
            if (surf[r] != s) continue;
            double dx = lx[r] - x, dy = ly[r] - y, d = dx * dx + dy * dy;
            if (d < bestD) {
                bestD = d;
                best = r;
            }
        }
        return best;
    }

    @Test
    void hitPointsOnRegularPatchGridsFindTheNearestCentre() {
        // two surfaces: a horizontal roof 20 x 12 m with 2 m patches, a south facade 30 x 9 m with 1.5 m patches
        SurfaceFrame roof = SurfaceFrame.of(new Vec3(0, 0, 1), new Vec3(5, 7, 10));
        SurfaceFrame wall = SurfaceFrame.of(new Vec3(0, -1, 0), new Vec3(-3, 0, 0));
        SurfaceFrame[] frames = {roof, wall};
        int nRoof = 10 * 6, nWall = 20 * 6, nr = nRoof + nWall;
        int[] surf = new int[nr];
        double[] centres = new double[3 * nr], lx = new double[nr], ly = new double[nr];
        int r = 0;
        for (int j = 0; j < 6; j++) for (int i = 0; i < 10; i++, r++) put(roof, 0, 1 + 2 * i, 1 + 2 * j, r, surf, centres, lx, ly);
        for (int j = 0; j < 6; j++) for (int i = 0; i < 20; i++, r++) put(wall, 1, 0.75 + 1.5 * i, 0.75 + 1.5 * j, r, surf, centres, lx, ly);
        ReflectorIndex idx = new ReflectorIndex(new int[] {0, 1, -1}, frames, surf, centres, 2.0, null);
        SplittableRandom rnd = new SplittableRandom(7);
        for (int k = 0; k < 20000; k++) {
            int s = k % 2;
            double w = s == 0 ? 20 : 30, h = s == 0 ? 12 : 9;
            // points on the surface and up to 1 m beyond its edges (slivers a patch grid leaves out)
            double x = -1 + rnd.nextDouble() * (w + 2), y = -1 + rnd.nextDouble() * (h + 2);
            if (k % 7 == 0) x = -8 + rnd.nextDouble() * (w + 16); // beyond the listed buckets: the ring search
            if (k % 50 == 0) x = s == 0 ? 2 * Math.floor(x / 2) : 0.75 * Math.floor(x / 0.75); // on bucket and bisector lines
            Vec3 p = frames[s].toWorld(x, y);
            assertEquals(nearest(lx, ly, surf, s, frames[s].localX(p.x(), p.y(), p.z()), frames[s].localY(p.x(), p.y(), p.z())),
                    idx.onTriangle(s, p.x(), p.y(), p.z()), "point " + x + ", " + y + " on surface " + s);
        }
        assertEquals(-1, idx.onTriangle(2, 0, 0, 0), "a triangle without a surface has no receiver");
    }

    @Test
    void hitPointsAmongJitteredCentresFindTheNearestCentre() {
        // centres of a 1.6 m grid each moved up to 0.1 of the spacing (edge pieces, merged cells), on a sloped
        // roof; buckets of the spacing and of 1.5 times it. Within 0.85 spacings of every point lies a centre and
        // the index looks at least one bucket (one spacing) beyond its own, so its answer must be the nearest.
        SurfaceFrame roof = SurfaceFrame.of(new Vec3(0.3, -0.4, 0.866), new Vec3(120, -40, 15));
        double sp = 1.6;
        int nx = 23, ny = 17, nr = nx * ny;
        for (double cellM : new double[] {sp, 1.5 * sp}) {
            SplittableRandom rnd = new SplittableRandom(11);
            int[] surf = new int[nr];
            double[] centres = new double[3 * nr], lx = new double[nr], ly = new double[nr];
            for (int j = 0, r = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++, r++) {
                    double x = sp * (i + 0.5 + 0.2 * (rnd.nextDouble() - 0.5)), y = sp * (j + 0.5 + 0.2 * (rnd.nextDouble() - 0.5));
                    if (rnd.nextInt(6) == 0) { // some centres exactly on the grid, as full cells have them
                        x = sp * (i + 0.5);
                        y = sp * (j + 0.5);
                    }
                    put(roof, 0, x, y, r, surf, centres, lx, ly);
                }
            }
            ReflectorIndex idx = new ReflectorIndex(new int[] {0}, new SurfaceFrame[] {roof}, surf, centres, cellM, null);
            for (int k = 0; k < 40000; k++) {
                double x = sp * nx * rnd.nextDouble(), y = sp * ny * rnd.nextDouble();
                if (k % 3 == 0) { // near a bisector of two grid nodes, within a micrometre or so
                    x = sp * Math.floor(x / sp) + (rnd.nextDouble() - 0.5) * Math.pow(10, -4 - rnd.nextInt(6));
                }
                if (k % 5 == 0) y = sp * Math.floor(y / sp) + (rnd.nextDouble() - 0.5) * Math.pow(10, -4 - rnd.nextInt(6));
                Vec3 p = roof.toWorld(x, y);
                assertEquals(nearest(lx, ly, surf, 0, roof.localX(p.x(), p.y(), p.z()), roof.localY(p.x(), p.y(), p.z())),
                        idx.onTriangle(0, p.x(), p.y(), p.z()), "point " + x + ", " + y + " with buckets of " + cellM + " m");
            }
        }
    }

    /**
     * Surfaces are indexed in parallel and their lists laid end to end: the records and lists are
     * those of one thread going through the surfaces in order, and the answers stay the nearest centre.
     */
    @Test
    void parallelIndexEqualsTheOneThreadIndex() throws Exception {
        int ns = 40, per = 9 * 7;
        SplittableRandom rnd = new SplittableRandom(23);
        SurfaceFrame[] frames = new SurfaceFrame[ns];
        int[] triSurf = new int[ns];
        int nr = ns * per;
        int[] surf = new int[nr];
        double[] centres = new double[3 * nr], lx = new double[nr], ly = new double[nr];
        for (int s = 0, r = 0; s < ns; s++) {
            frames[s] = SurfaceFrame.of(new Vec3(rnd.nextDouble(-1, 1), rnd.nextDouble(-1, 1), rnd.nextDouble(0.1, 1)),
                    new Vec3(rnd.nextDouble(-100, 100), rnd.nextDouble(-100, 100), rnd.nextDouble(0, 30)));
            triSurf[s] = s;
            for (int j = 0; j < 7; j++) {
                for (int i = 0; i < 9; i++, r++) {
                    put(frames[s], s, 1.5 * (i + 0.5 + 0.2 * (rnd.nextDouble() - 0.5)), 1.5 * (j + 0.5 + 0.2 * (rnd.nextDouble() - 0.5)),
                            r, surf, centres, lx, ly);
                }
            }
        }
        ReflectorIndex one = build(1, triSurf, frames, surf, centres), four = build(4, triSurf, frames, surf, centres);
        org.junit.jupiter.api.Assertions.assertTrue(one.sameLayout(four), "records and lists built on 1 and on 4 threads");
        for (int k = 0; k < 20000; k++) {
            int s = k % ns;
            double x = -1 + rnd.nextDouble() * 15.5, y = -1 + rnd.nextDouble() * 12.5;
            Vec3 p = frames[s].toWorld(x, y);
            assertEquals(nearest(lx, ly, surf, s, frames[s].localX(p.x(), p.y(), p.z()), frames[s].localY(p.x(), p.y(), p.z())),
                    four.onTriangle(s, p.x(), p.y(), p.z()), "point " + x + ", " + y + " on surface " + s);
        }
    }

    private static ReflectorIndex build(int threads, int[] triSurf, SurfaceFrame[] frames, int[] surf, double[] centres) throws Exception {
        java.util.concurrent.ForkJoinPool pool = new java.util.concurrent.ForkJoinPool(threads);
        try {
            return pool.submit(() -> new ReflectorIndex(triSurf, frames, surf, centres, 1.5, null)).get();
        } finally {
            pool.shutdown();
        }
    }

    private static void put(SurfaceFrame f, int s, double x, double y, int r, int[] surf, double[] centres, double[] lx, double[] ly) {
        Vec3 c = f.toWorld(x, y);
        surf[r] = s;
        centres[3 * r] = c.x();
        centres[3 * r + 1] = c.y();
        centres[3 * r + 2] = c.z();
        lx[r] = f.localX(c.x(), c.y(), c.z());
        ly[r] = f.localY(c.x(), c.y(), c.z());
    }
}
