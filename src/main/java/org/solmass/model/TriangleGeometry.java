package org.solmass.model;

/**
 * Cross product, normal and area of a triangle given by corner indices into a flat x,y,z vertex
 * array (the layout of {@link MassingModel#vertices()}): the one home of this arithmetic outside the
 * ray kernels of the scene stage, which keep their own flat, hand-inlined copy for speed.
 *
 * <p>The cross product (b - a) x (c - a) of corners a, b, c is twice the triangle's area times its
 * unit normal, and points to the side from which a, b, c run counter-clockwise (common practice;
 * vector algebra, right-hand rule).
 */
public final class TriangleGeometry {
    private TriangleGeometry() {}

    /**
     * Writes (b - a) x (c - a) into {@code out[0..2]}.
     *
     * @param v flat x,y,z vertex array
     * @param a vertex index (not array offset) of the first corner; likewise b and c
     */
    public static void cross(double[] v, int a, int b, int c, double[] out) {
        a *= 3; b *= 3; c *= 3;
        double ux = v[b] - v[a], uy = v[b + 1] - v[a + 1], uz = v[b + 2] - v[a + 2];
        double wx = v[c] - v[a], wy = v[c + 1] - v[a + 1], wz = v[c + 2] - v[a + 2];
        out[0] = uy * wz - uz * wy;
        out[1] = uz * wx - ux * wz;
        out[2] = ux * wy - uy * wx;
    }

    /** Writes the cross product of triangle {@code t} of {@code tri} (three vertex indices per triangle). */
    public static void cross(double[] v, int[] tri, int t, double[] out) {
        cross(v, tri[3 * t], tri[3 * t + 1], tri[3 * t + 2], out);
    }

    /** Length of a 3-vector in {@code c[0..2]}. */
    public static double length(double[] c) {
        return Math.sqrt(c[0] * c[0] + c[1] * c[1] + c[2] * c[2]);
    }

    /** Area of triangle {@code t}, square metres: half the length of its cross product. */
    public static double area(double[] v, int[] tri, int t) {
        double[] c = new double[3];
        cross(v, tri, t, c);
        return 0.5 * length(c);
    }

    /**
     * Writes the unit normal of triangle {@code t} into {@code out[0..2]}; returns false (and writes
     * nothing) for a zero-area or non-finite triangle.
     */
    public static boolean unitNormal(double[] v, int[] tri, int t, double[] out) {
        double[] c = new double[3];
        cross(v, tri, t, c);
        double l = length(c);
        if (!(l > 0) || !Double.isFinite(l)) return false;
        out[0] = c[0] / l; out[1] = c[1] / l; out[2] = c[2] / l;
        return true;
    }
}
