package org.solmass.model;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Turns the faces of each block to face out of it, so that a model exported with clockwise faces
 * (common from CAD tools) reads like one with counter-clockwise faces. Solmass analyses the front
 * side of each face: a box wound the wrong way round has its roof facing down into the block and
 * its walls facing inwards.
 *
 * <p>Method (common practice in mesh repair):
 * <ol>
 * <li>Corners are welded by position ({@link VertexWelder}) so that faces written with their own
 *     copies of shared corners still share edges.</li>
 * <li>Shells: the triangles of one block joined across edges that exactly two of its triangles use
 *     (manifold edges). Two triangles on such an edge are wound consistently when they run along it
 *     in opposite directions; a breadth-first walk gives every triangle of a shell its winding
 *     relative to the first. A shell that cannot be wound consistently (a one-sided surface, or
 *     faces welded across) is left as written.</li>
 * <li>A closed shell (every edge used by exactly two of its triangles) faces outward when its signed
 *     volume is positive. By the divergence theorem the volume is
 *     V = 1/6 sum over triangles of a . ((b - a) x (c - a)) for corners a, b, c, the same about any
 *     reference point, here the shell's centroid (the signed-tetrahedron sum of Zhang and Chen, 2001,
 *     "Efficient feature extraction for 2D/3D objects in mesh representation", Proc. IEEE ICIP,
 *     from memory; divergence theorem, common practice). A shell of
 *     (near) zero volume, such as a face written twice back to back, is left as written.</li>
 * <li>An open shell (some edge used by one triangle only) has no inside. The best evidence is used:
 *     the same sum about the shell's area centroid (positive when most of the area faces away from
 *     it, as the walls and roof of a box without a floor do); for a flat shell, which that sum cannot
 *     judge, facing up when it is the block's only shell and within 45 degrees of horizontal (a
 *     plaza, a flat roof sheet). Without evidence the winding that most of its area was written with
 *     is kept.</li>
 * </ol>
 * Each block with turned faces gets one warning naming the block, the number of faces turned, the
 * first one's OBJ line and whether open shells were involved (their orientation is a judgement).
 */
public final class Orientation {
    /** |6 V| below this times (area x diagonal) of a closed shell: no volume to judge by. */
    static final double CLOSED_MIN_REL = 1e-9;
    /** |sum| below this times (area x diagonal) of an open shell: no evidence to judge by. */
    static final double OPEN_MIN_REL = 1e-3;
    /** All normals of a flat shell lie within this angle of each other, degrees. */
    static final double FLAT_ANGLE_DEG = 1.0;
    /** A flat single-shell block within this angle of horizontal is turned to face up, degrees. */
    static final double HORIZONTAL_DEG = 45.0;

    private Orientation() {}

    /**
     * Reorients the triangles in place (a turned triangle has its 2nd and 3rd corners swapped) and
     * returns the warnings, one per block with turned faces.
     *
     * @param v flat x,y,z vertices, metres (only vertices that triangles use)
     * @param tri three vertex indices per triangle
     * @param tBlock block id per triangle
     * @param tLine OBJ line of each triangle's face (faces are counted by line)
     * @param blockNames block names, index = block id
     * @param source the file's name, for the warnings
     * @param weldTolM weld tolerance, metres
     */
    public static List<String> orient(double[] v, int[] tri, int[] tBlock, int[] tLine, List<String> blockNames,
                                      String source, double weldTolM) {
        int nt = tri.length / 3, nb = blockNames.size();
        int[] rep = VertexWelder.weld(v, weldTolM);
        List<IntList> perBlock = new ArrayList<>(nb);
        for (int b = 0; b < nb; b++) perBlock.add(new IntList());
        for (int t = 0; t < nt; t++) perBlock.get(tBlock[t]).add(t);
        boolean[] flip = new boolean[nt];
        List<String> warnings = new ArrayList<>();
        for (int b = 0; b < nb; b++) {
            IntList ts = perBlock.get(b);
            if (ts.size() == 0) continue;
            BlockResult r = orientBlock(v, tri, rep, ts, flip);
            if (r.conflicting > 0) {
                warnings.add(String.format(Locale.ROOT, "%s: block '%s': %d triangle(s) could not be wound consistently"
                        + " with their neighbours (a one-sided surface, or faces that cross); left as written",
                        source, blockNames.get(b), r.conflicting));
            }
            Set<Integer> faces = new HashSet<>(), turned = new HashSet<>();
            int firstLine = Integer.MAX_VALUE;
            for (int i = 0; i < ts.size(); i++) {
                int t = ts.get(i);
                faces.add(tLine[t]);
                if (flip[t]) { turned.add(tLine[t]); firstLine = Math.min(firstLine, tLine[t]); }
            }
            if (turned.isEmpty()) continue;
            warnings.add(String.format(Locale.ROOT, "%s:%d: block '%s': turned %d of %d face(s) to face out of the block (%s)",
                    source, firstLine, blockNames.get(b), turned.size(), faces.size(),
                    r.openTurned ? "an open mesh, with edges used by one face only, judged by its faces' consistent"
                            + " winding and by facing away from its centre or up; check this block"
                            : "closed shells, judged by their signed volume"));
        }
        for (int t = 0; t < nt; t++) {
            if (!flip[t]) continue;
            int s = tri[3 * t + 1];
            tri[3 * t + 1] = tri[3 * t + 2];
            tri[3 * t + 2] = s;
        }
        return warnings;
    }

    private static final class BlockResult {
        int conflicting;
        boolean openTurned;
    }

    /** Orients the triangles {@code ts} of one block; sets {@code flip[t]} for each triangle to turn. */
    private static BlockResult orientBlock(double[] v, int[] tri, int[] rep, IntList ts, boolean[] flip) {
        BlockResult res = new BlockResult();
        int k = ts.size();
        // Half-edges by undirected welded edge.
        Map<Long, IntList> edges = new HashMap<>(k * 4);
        long n = v.length / 3;
        boolean[] collapsed = new boolean[k];
        for (int i = 0; i < k; i++) {
            int t = ts.get(i);
            int a = rep[tri[3 * t]], b = rep[tri[3 * t + 1]], c = rep[tri[3 * t + 2]];
            if (a == b || b == c || a == c) { collapsed[i] = true; continue; }
            for (int e = 0; e < 3; e++) {
                int u = rep[tri[3 * t + e]], w = rep[tri[3 * t + (e + 1) % 3]];
                long key = Math.min(u, w) * n + Math.max(u, w);
                edges.computeIfAbsent(key, x -> new IntList(2)).add(3 * i + e);
            }
        }
        int[] parity = new int[k], comp = new int[k];
        java.util.Arrays.fill(comp, -1);
        int[] queue = new int[k];
        int shells = 0;
        List<int[]> members = new ArrayList<>();
        List<boolean[]> props = new ArrayList<>(); // {closed, conflict}
        for (int s = 0; s < k; s++) {
            if (collapsed[s] || comp[s] >= 0) continue;
            int head = 0, tail = 0;
            queue[tail++] = s;
            comp[s] = shells;
            boolean closed = true, conflict = false;
            while (head < tail) {
                int i = queue[head++];
                int t = ts.get(i);
                for (int e = 0; e < 3; e++) {
                    int u = rep[tri[3 * t + e]], w = rep[tri[3 * t + (e + 1) % 3]];
                    IntList uses = edges.get(Math.min(u, w) * n + Math.max(u, w));
                    if (uses.size() != 2) { closed = false; continue; }
                    int h = uses.get(0) == 3 * i + e ? uses.get(1) : uses.get(0);
                    int j = h / 3;
                    if (j == i) { closed = false; continue; }
                    int tj = ts.get(j);
                    boolean sameDirection = rep[tri[3 * tj + h % 3]] == u;
                    int want = parity[i] ^ (sameDirection ? 1 : 0);
                    if (comp[j] < 0) {
                        comp[j] = shells;
                        parity[j] = want;
                        queue[tail++] = j;
                    } else if (parity[j] != want) {
                        conflict = true;
                    }
                }
            }
            members.add(java.util.Arrays.copyOf(queue, tail));
            props.add(new boolean[]{closed, conflict});
            shells++;
        }
        double[] cr = new double[3];
        for (int c = 0; c < shells; c++) {
            int[] m = members.get(c);
            boolean closed = props.get(c)[0];
            if (props.get(c)[1]) { res.conflicting += m.length; continue; }
            // Area centroid, area, diagonal and the area written in each parity.
            double area = 0, cx = 0, cy = 0, cz = 0, keptArea = 0;
            double[] box = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                    Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
            double[] n0 = null;
            boolean flat = true;
            double cosFlat = Math.cos(Math.toRadians(FLAT_ANGLE_DEG)), nzSum = 0;
            for (int i : m) {
                int t = ts.get(i);
                TriangleGeometry.cross(v, tri, t, cr);
                double len = TriangleGeometry.length(cr), sign = parity[i] == 0 ? 1 : -1;
                double ar = 0.5 * len;
                area += ar;
                if (parity[i] == 0) keptArea += ar;
                nzSum += sign * cr[2] * 0.5;
                for (int q = 0; q < 3; q++) {
                    int p = 3 * tri[3 * t + q];
                    cx += ar / 3 * v[p]; cy += ar / 3 * v[p + 1]; cz += ar / 3 * v[p + 2];
                    for (int d = 0; d < 3; d++) {
                        box[d] = Math.min(box[d], v[p + d]);
                        box[d + 3] = Math.max(box[d + 3], v[p + d]);
                    }
                }
                if (len > 0) {
                    double[] u = {sign * cr[0] / len, sign * cr[1] / len, sign * cr[2] / len};
                    if (n0 == null) n0 = u;
                    else if (u[0] * n0[0] + u[1] * n0[1] + u[2] * n0[2] < cosFlat) flat = false;
                }
            }
            if (!(area > 0)) continue;
            cx /= area; cy /= area; cz /= area;
            double diag = Math.sqrt(sq(box[3] - box[0]) + sq(box[4] - box[1]) + sq(box[5] - box[2]));
            // sum of (a - centroid) . ((b - a) x (c - a)) over the shell, wound as parity 0 says (6 V when closed).
            double sum = 0;
            for (int i : m) {
                int t = ts.get(i);
                TriangleGeometry.cross(v, tri, t, cr);
                int a = 3 * tri[3 * t];
                double d = (v[a] - cx) * cr[0] + (v[a + 1] - cy) * cr[1] + (v[a + 2] - cz) * cr[2];
                sum += parity[i] == 0 ? d : -d;
            }
            double scale = area * diag;
            int decision; // +1: parity 0 faces out; -1: parity 1 faces out; 0: no evidence
            if (closed) {
                decision = Math.abs(sum) > CLOSED_MIN_REL * scale ? (sum > 0 ? 1 : -1) : 0;
            } else if (!flat) {
                decision = Math.abs(sum) > OPEN_MIN_REL * scale ? (sum > 0 ? 1 : -1) : 0;
            } else if (shells == 1 && Math.abs(nzSum) >= Math.cos(Math.toRadians(HORIZONTAL_DEG)) * area) {
                decision = nzSum > 0 ? 1 : -1;
            } else {
                decision = 0;
            }
            if (decision == 0) decision = keptArea >= area - keptArea ? 1 : -1; // keep what most of it was written as
            int turnParity = decision > 0 ? 1 : 0;
            for (int i : m) {
                if (parity[i] == turnParity) {
                    flip[ts.get(i)] = true;
                    if (!closed) res.openTurned = true;
                }
            }
        }
        return res;
    }

    private static double sq(double x) { return x * x; }
}
