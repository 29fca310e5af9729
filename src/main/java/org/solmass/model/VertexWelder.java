package org.solmass.model;

import java.util.HashMap;
import java.util.Map;

/**
 * Welds vertices by position: every vertex within {@code tol} (Euclidean distance, metres) of an
 * earlier representative vertex is replaced by that representative; the lowest-index
 * representative in reach wins, so the result depends only on the vertex order. Uses a uniform hash
 * grid of cell size {@code tol} and searches the 27 neighbouring cells (common practice).
 *
 * <p>The one weld of Solmass: the reader's orientation pass ({@link Orientation}) finds shared edges
 * with it, and the surface stage merges coplanar triangles on welded corners. Its tolerance scales
 * with the bounding-box diagonal D of the vertices the faces use: {@code max(1e-6 D, 1e-9 m)}.
 */
public final class VertexWelder {
    /** Weld tolerance relative to the bounding-box diagonal of the used vertices. */
    public static final double WELD_REL = 1e-6;
    /** Smallest weld tolerance, metres. */
    public static final double WELD_MIN_M = 1e-9;

    private VertexWelder() {}

    /** Weld tolerance for a model whose used vertices span a box of diagonal {@code diagonalM}, metres. */
    public static double tolerance(double diagonalM) { return Math.max(WELD_REL * diagonalM, WELD_MIN_M); }

    /** Representative vertex index for every vertex of the flat x,y,z array. */
    public static int[] weld(double[] v, double tol) {
        int n = v.length / 3;
        int[] rep = new int[n];
        Map<Long, IntList> grid = new HashMap<>(Math.max(16, n * 2));
        double tol2 = tol * tol;
        for (int i = 0; i < n; i++) {
            double x = v[3 * i], y = v[3 * i + 1], z = v[3 * i + 2];
            long cx = (long) Math.floor(x / tol), cy = (long) Math.floor(y / tol), cz = (long) Math.floor(z / tol);
            int best = -1;
            for (long dx = -1; dx <= 1; dx++) for (long dy = -1; dy <= 1; dy++) for (long dz = -1; dz <= 1; dz++) {
                IntList cell = grid.get(key(cx + dx, cy + dy, cz + dz));
                if (cell == null) continue;
                for (int k = 0; k < cell.size(); k++) {
                    int r = cell.get(k);
                    double ex = v[3 * r] - x, ey = v[3 * r + 1] - y, ez = v[3 * r + 2] - z;
                    if (ex * ex + ey * ey + ez * ez <= tol2 && (best < 0 || r < best)) best = r;
                }
            }
            if (best >= 0) {
                rep[i] = best;
            } else {
                rep[i] = i;
                grid.computeIfAbsent(key(cx, cy, cz), q -> new IntList(2)).add(i);
            }
        }
        return rep;
    }

    private static long key(long x, long y, long z) {
        return (x * 73856093L) ^ (y * 19349663L) ^ (z * 83492791L); // collisions only cost time
    }
}
