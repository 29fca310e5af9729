package org.solmass.metrics;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Matches the patches of two massing variants of one site by position and orientation (our own rule,
 * docs/metrics.md): patch b of variant B matches patch a of variant A when their centroids are less
 * than {@code maxDistanceM} apart (half a patch size by default) and their unit normals differ by at
 * most {@code maxAngleDeg} (5 deg by default). Each patch matches at most once: B's patches are taken
 * in order, each takes the nearest still-free A patch that qualifies. Deterministic; a spatial hash
 * of cell size {@code maxDistanceM} keeps it linear in the patch count.
 */
public final class PatchMatcher {
    public static final double DEFAULT_MAX_ANGLE_DEG = 5;

    private PatchMatcher() {}

    /**
     * @param centroidsA x,y,z per patch of A (metres)
     * @param normalsA unit normals per patch of A
     * @param centroidsB x,y,z per patch of B
     * @param normalsB unit normals per patch of B
     * @return for each patch of B the index of its A patch, or -1
     */
    public static int[] match(double[] centroidsA, double[] normalsA, double[] centroidsB, double[] normalsB,
                              double maxDistanceM, double maxAngleDeg) {
        if (!(maxDistanceM > 0)) throw new IllegalArgumentException("max distance must be > 0");
        int na = centroidsA.length / 3, nb = centroidsB.length / 3;
        double cosMax = Math.cos(Math.toRadians(maxAngleDeg));
        Map<Long, List<Integer>> grid = new HashMap<>();
        for (int a = 0; a < na; a++) grid.computeIfAbsent(key(cell(centroidsA, a, 0, maxDistanceM),
                cell(centroidsA, a, 1, maxDistanceM), cell(centroidsA, a, 2, maxDistanceM)), k -> new ArrayList<>()).add(a);
        boolean[] taken = new boolean[na];
        int[] out = new int[nb];
        double d2max = maxDistanceM * maxDistanceM;
        for (int b = 0; b < nb; b++) {
            long cx = cell(centroidsB, b, 0, maxDistanceM), cy = cell(centroidsB, b, 1, maxDistanceM), cz = cell(centroidsB, b, 2, maxDistanceM);
            int best = -1;
            double bestD2 = Double.POSITIVE_INFINITY;
            for (long i = cx - 1; i <= cx + 1; i++) for (long j = cy - 1; j <= cy + 1; j++) for (long k = cz - 1; k <= cz + 1; k++) {
                List<Integer> cand = grid.get(key(i, j, k));
                if (cand == null) continue;
                for (int a : cand) {
                    if (taken[a]) continue;
                    double dx = centroidsA[3 * a] - centroidsB[3 * b], dy = centroidsA[3 * a + 1] - centroidsB[3 * b + 1],
                            dz = centroidsA[3 * a + 2] - centroidsB[3 * b + 2];
                    double d2 = dx * dx + dy * dy + dz * dz;
                    if (!(d2 < d2max)) continue;
                    double dot = normalsA[3 * a] * normalsB[3 * b] + normalsA[3 * a + 1] * normalsB[3 * b + 1]
                            + normalsA[3 * a + 2] * normalsB[3 * b + 2];
                    if (dot < cosMax) continue;
                    if (d2 < bestD2 || (d2 == bestD2 && a < best)) {
                        best = a;
                        bestD2 = d2;
                    }
                }
            }
            out[b] = best;
            if (best >= 0) taken[best] = true;
        }
        return out;
    }

    private static long cell(double[] c, int i, int axis, double size) { return (long) Math.floor(c[3 * i + axis] / size); }

    private static long key(long i, long j, long k) {
        return (i & 0x1FFFFF) << 42 | (j & 0x1FFFFF) << 21 | (k & 0x1FFFFF);
    }
}
