package org.solmass.viewer;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class TriangulatorTest {

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
        int[] t = Triangulator.triangulate(u, v);
        assertEquals(3 * 4, t.length);
        assertEquals(3, area(u, v, t), 1e-12);
    }

    @Test
    void convexPolygonIsFanned() {
        double[] u = {0, 1, 1, 0}, v = {0, 0, 1, 1};
        int[] t = Triangulator.triangulate(u, v);
        assertEquals(6, t.length);
        assertEquals(1, area(u, v, t), 1e-12);
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
        int[] t = Triangulator.triangulate(u, v);
        assertEquals(3 * (n - 2), t.length);
        assertEquals(Triangulator.signedArea(u, v), area(u, v, t), 1e-9);
    }
}
