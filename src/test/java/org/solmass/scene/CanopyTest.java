package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Crown crossings counted by {@link Canopy}: checked against the analytic slab test of a ray and an
 * axis-aligned box (Kay and Kajiya, 1986, SIGGRAPH "Ray tracing complex scenes"), computed here in
 * double precision and independently of the BVH.
 */
class CanopyTest {
    /** A closed axis-aligned box as 12 triangles (9 floats each). */
    static void box(List<Float> soup, double x0, double y0, double z0, double x1, double y1, double z1) {
        double[][] c = new double[8][];
        for (int i = 0; i < 8; i++) c[i] = new double[] {(i & 1) == 0 ? x0 : x1, (i & 2) == 0 ? y0 : y1, (i & 4) == 0 ? z0 : z1};
        int[][] faces = {{0, 1, 3, 2}, {4, 6, 7, 5}, {0, 4, 5, 1}, {2, 3, 7, 6}, {0, 2, 6, 4}, {1, 5, 7, 3}};
        for (int[] f : faces) {
            for (int[] t : new int[][] {{f[0], f[1], f[2]}, {f[0], f[2], f[3]}}) {
                for (int v : t) for (int k = 0; k < 3; k++) soup.add((float) c[v][k]);
            }
        }
    }

    static float[] array(List<Float> l) {
        float[] a = new float[l.size()];
        for (int i = 0; i < a.length; i++) a[i] = l.get(i);
        return a;
    }

    /** Ray parameters where the ray enters and leaves the box, or null when it misses (slab test). */
    static double[] slab(double[] o, double[] d, double[] b) {
        double tn = Double.NEGATIVE_INFINITY, tf = Double.POSITIVE_INFINITY;
        for (int k = 0; k < 3; k++) {
            double t0 = (b[k] - o[k]) / d[k], t1 = (b[k + 3] - o[k]) / d[k];
            tn = Math.max(tn, Math.min(t0, t1));
            tf = Math.min(tf, Math.max(t0, t1));
        }
        return tn <= tf ? new double[] {tn, tf} : null;
    }

    @Test
    void twoCrownsInLineAreCrossedTwiceAndAStartInsideACrownCountsItOnce() {
        List<Float> s = new ArrayList<>();
        box(s, 2, -1, -1, 4, 1, 1);
        box(s, 6, -1, -1, 8, 1, 1);
        Canopy.Counter c = Canopy.build(array(s)).counter();
        double inf = Double.POSITIVE_INFINITY;
        assertEquals(2, c.crossings(0, 0.1, 0.2, 1, 0, 0, inf), "through both crowns");
        assertEquals(2, c.crossings(3, 0.1, 0.2, 1, 0, 0, inf), "out of the first (it started inside), through the second");
        assertEquals(0, c.crossings(0, 0.1, 0.2, -1, 0, 0, inf), "away from both");
        assertEquals(0, c.crossings(0, 0.1, 0.2, 1, 0, 0, 1.5), "stopped by an opaque face before the first");
        assertEquals(1, c.crossings(0, 0.1, 0.2, 1, 0, 0, 3.0), "stopped by an opaque face inside the first");
        assertEquals(1, c.crossings(0, 0.1, 0.2, 1, 0, 0, 5.0), "stopped between the crowns");
    }

    @Test
    void anOpenSheetCountsAsOneCrossing() {
        float[] quad = {5, -1, -1, 5, 1, -1, 5, 1, 1, 5, -1, -1, 5, 1, 1, 5, -1, 1};
        Canopy.Counter c = Canopy.build(quad).counter();
        assertEquals(1, c.crossings(0, 0.2, 0.1, 1, 0, 0, Double.POSITIVE_INFINITY));
    }

    @Test
    void crossingsEqualTheBoxesTheRayMeetsOverRandomRays() {
        double[][] boxes = {{0, 0, 0, 3, 2, 4}, {5, 1, 0, 7, 4, 3}, {2, 6, 1, 4, 9, 5}};
        List<Float> s = new ArrayList<>();
        for (double[] b : boxes) box(s, b[0], b[1], b[2], b[3], b[4], b[5]);
        Canopy.Counter c = Canopy.build(array(s)).counter();
        Random rnd = new Random(17);
        int checked = 0, crossedTwo = 0;
        for (int i = 0; i < 3000; i++) {
            double[] o = {-5 + 17 * rnd.nextDouble(), -5 + 19 * rnd.nextDouble(), -1 + 8 * rnd.nextDouble()};
            double[] d = {rnd.nextGaussian(), rnd.nextGaussian(), rnd.nextGaussian()};
            double len = Math.sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]);
            for (int k = 0; k < 3; k++) d[k] /= len;
            int expected = 0;
            boolean nearEdge = false;
            for (double[] b : boxes) {
                double[] t = slab(o, d, b);
                if (t == null || t[1] <= 0) continue;
                if (t[1] - Math.max(0, t[0]) < 1e-3 || Math.abs(t[0]) < 1e-3) nearEdge = true; // grazing or starting on a face
                expected++;
            }
            if (nearEdge) continue;
            checked++;
            if (expected == 2) crossedTwo++;
            assertEquals(expected, c.crossings(o[0], o[1], o[2], d[0], d[1], d[2], Double.POSITIVE_INFINITY), "ray " + i);
        }
        assertEquals(true, checked > 2500 && crossedTwo > 10, checked + " rays checked, " + crossedTwo + " crossing two crowns");
    }
}
