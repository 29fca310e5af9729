package org.solmass.testkit;

/** OBJ text of closed-sided boxes without a bottom face, for test fixtures (invented geometry). */
public final class ObjBoxes {
    private ObjBoxes() {}

    /**
     * Eight vertices and five faces (roof and four walls, counter-clockwise seen from outside) of the box
     * [x0, x1] x [y0, y1] x [0, h]; {@code base} is the number of vertices written before it.
     */
    public static String box(double x0, double y0, double x1, double y1, double h, int base) {
        StringBuilder b = new StringBuilder();
        double[][] v = {{x0, y0, 0}, {x1, y0, 0}, {x1, y1, 0}, {x0, y1, 0}, {x0, y0, h}, {x1, y0, h}, {x1, y1, h}, {x0, y1, h}};
        for (double[] p : v) b.append("v ").append(p[0]).append(' ').append(p[1]).append(' ').append(p[2]).append('\n');
        int[][] f = {{5, 6, 7, 8}, {1, 2, 6, 5}, {2, 3, 7, 6}, {3, 4, 8, 7}, {4, 1, 5, 8}};
        for (int[] q : f) b.append("f ").append(q[0] + base).append(' ').append(q[1] + base).append(' ')
                .append(q[2] + base).append(' ').append(q[3] + base).append('\n');
        return b.toString();
    }
}
