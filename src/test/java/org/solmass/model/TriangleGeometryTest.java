package org.solmass.model;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Cross product, area and normal of known triangles (vector algebra, right-hand rule; worked by hand). */
class TriangleGeometryTest {

    @Test
    void rightTriangleWithLegsTwoAndThreeHasCrossZeroZeroSixAndAreaThree() {
        double[] v = {0, 0, 0, 2, 0, 0, 0, 3, 0};
        double[] c = new double[3];
        TriangleGeometry.cross(v, 0, 1, 2, c);
        assertArrayEquals(new double[] {0, 0, 6}, c, 0);
        assertEquals(3, TriangleGeometry.area(v, new int[] {0, 1, 2}, 0), 0);
        double[] n = new double[3];
        assertTrue(TriangleGeometry.unitNormal(v, new int[] {0, 1, 2}, 0, n));
        assertArrayEquals(new double[] {0, 0, 1}, n, 0);
        // reversed winding: the normal points the other way (right-hand rule)
        assertTrue(TriangleGeometry.unitNormal(v, new int[] {0, 2, 1}, 0, n));
        assertArrayEquals(new double[] {0, 0, -1}, n, 0);
    }

    @Test
    void triangleOfTheUnitAxisPointsHasNormalOneOneOneOverRootThreeAndAreaRootThreeOverTwo() {
        // (1,0,0), (0,1,0), (0,0,1): (b - a) x (c - a) = (-1,1,0) x (-1,0,1) = (1,1,1); an equilateral
        // triangle of side sqrt 2, area sqrt(3)/4 x 2 = sqrt(3)/2
        double[] v = {1, 0, 0, 0, 1, 0, 0, 0, 1};
        int[] tri = {0, 1, 2};
        double[] c = new double[3];
        TriangleGeometry.cross(v, tri, 0, c);
        assertArrayEquals(new double[] {1, 1, 1}, c, 0);
        assertEquals(Math.sqrt(3) / 2, TriangleGeometry.area(v, tri, 0), 1e-15);
        double[] n = new double[3];
        assertTrue(TriangleGeometry.unitNormal(v, tri, 0, n));
        double r = 1 / Math.sqrt(3);
        assertArrayEquals(new double[] {r, r, r}, n, 1e-15);
    }

    @Test
    void collinearCornersHaveNoNormal() {
        double[] v = {0, 0, 0, 1, 1, 1, 2, 2, 2};
        double[] n = {7, 7, 7};
        assertFalse(TriangleGeometry.unitNormal(v, new int[] {0, 1, 2}, 0, n));
        assertArrayEquals(new double[] {7, 7, 7}, n, 0, "nothing written");
        assertEquals(0, TriangleGeometry.area(v, new int[] {0, 1, 2}, 0), 0);
    }
}
