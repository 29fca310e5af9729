package org.solmass.model;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The 2D entry of the one triangulator (patch outlines in their plane). */
class PolygonTriangulator2dTest {

    private static double area(double[] u, double[] v, int[] t) {
        double a = 0;
        for (int i = 0; i < t.length; i += 3) {
            double ar = ((u[t[i + 1]] - u[t[i]]) * (v[t[i + 2]] - v[t[i]]) - (v[t[i + 1]] - v[t[i]]) * (u[t[i + 2]] - u[t[i]])) / 2;
            assertTrue(ar > 0, "triangle keeps the polygon's counter-clockwise orientation");
            a += ar;
        }
        return a;
    }

    @Test
    void concaveLShapeSplitsIntoNMinusTwoTrianglesOfTheSameArea() {
        // L of a 2x2 square minus its top-right 1x1 quarter: shoelace area 3
        double[] u = {0, 2, 2, 1, 1, 0}, v = {0, 0, 1, 1, 2, 2};
        int[] t = PolygonTriangulator.triangulate(u, v);
        assertEquals(3 * 4, t.length);
        assertEquals(3, area(u, v, t), 1e-12);
    }

    @Test
    void convexPolygonIsTheFanFromCornerZero() {
        double[] u = {0, 1, 1.5, 1, 0}, v = {0, 0, 0.5, 1, 1};
        int[] t = PolygonTriangulator.triangulate(u, v);
        org.junit.jupiter.api.Assertions.assertArrayEquals(new int[] {0, 1, 2, 0, 2, 3, 0, 3, 4}, t);
        assertEquals(1.25, area(u, v, t), 1e-12);  // unit square + triangle of base 1, height 0.5
    }

    @Test
    void clockwisePolygonKeepsItsClockwiseOrientation() {
        // the L of concaveLShapeSplitsIntoNMinusTwoTrianglesOfTheSameArea traversed clockwise: triangles come out clockwise, same area
        double[] u = {0, 0, 1, 1, 2, 2}, v = {0, 2, 2, 1, 1, 0};
        int[] t = PolygonTriangulator.triangulate(u, v);
        assertEquals(3 * 4, t.length);
        double[] vm = new double[v.length];
        for (int i = 0; i < v.length; i++) vm[i] = -v[i];  // mirrored, it is counter-clockwise
        assertEquals(3, area(u, vm, t), 1e-12);
    }

    @Test
    void concaveStarKeepsItsArea() {
        int n = 10;
        double[] u = new double[n], v = new double[n];
        for (int i = 0; i < n; i++) {
            double r = i % 2 == 0 ? 2 : 0.8, a = 2 * Math.PI * i / n;
            u[i] = r * Math.cos(a);
            v[i] = r * Math.sin(a);
        }
        int[] t = PolygonTriangulator.triangulate(u, v);
        assertEquals(3 * (n - 2), t.length);
        assertEquals(PolygonTriangulatorTest.shoelace(u, v), area(u, v, t), 1e-9);
    }
}
