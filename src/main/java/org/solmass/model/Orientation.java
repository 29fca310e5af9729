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
 * <li>An open shell (some edge used by one triangle only) has no inside, so two pieces of evidence
 *     are weighed: "away", the same sum about the shell's area centroid (positive when most of the
 *     area faces away from it, as the walls and roof of a box without a floor do), and "up", the
 *     area-weighted mean of the normals' z (positive for roofs, plazas and terrain). Where both
 *     speak they must agree; where one is silent the other decides. A flat shell (away is zero)
 *     is turned up by "up" only when it is its block's only shell and lies within 45 degrees of
 *     horizontal (a plaza, a flat roof sheet): a flat shell beside others may be the hidden face
 *     between two stacked boxes, which faces down by right. Where the evidence is missing or
 *     disagrees (a wall meeting a plaza faces into the corner they make), the shell follows the
 *     habit of the file's closed shells: turned when most of their area had to be turned, else
 *     kept as most of its own area was written.</li>
 * </ol>
 * Each block with turned faces gets one warning naming the block, the number of faces turned, the
 * first one's OBJ line and whether open shells were involved (their orientation is a judgement).
 */
public final class Orientation {
    /** |6 V| below this times (area x diagonal) of a closed shell: no volume to judge by. */
    static final double CLOSED_MIN_REL = 1e-9;
    /** |away sum| below this times (area x diagonal) of an open shell: no evidence. */
    static final double AWAY_MIN_REL = 1e-3;
    /** |mean normal z| below this: no evidence of up. */
    static final double UP_MIN = 0.01;
    /** All normals of a flat shell lie within this angle of each other, degrees. */
    static final double FLAT_ANGLE_DEG = 1.0;
    /** A flat single-shell block within this angle of horizontal is turned to face up, degrees. */
    static final double HORIZONTAL_DEG = 45.0;

    private Orientation() {}

    /** One shell: its triangles (model ids), their winding relative to the first, and what was found. */
    private static final class Shell {
        int block;
        int[] tris;
        int[] parity;
        boolean closed, conflict;
        /** +1: parity 0 faces out; -1: parity 1 faces out; 0: no decision from its own geometry. */
        int decision;
        double area, keptArea;
    }

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
        List<Shell> shells = new ArrayList<>();
        for (int b = 0; b < nb; b++) if (perBlock.get(b).size() > 0) shells.addAll(shellsOf(v, tri, rep, perBlock.get(b), b));
        // The habit of the file's writer, from the closed shells it judged: turned or kept (by area).
        double habitTurned = 0, habitKept = 0;
        for (Shell sh : shells) {
            if (!sh.closed || sh.conflict || sh.decision == 0) continue;
            double outArea = sh.decision > 0 ? sh.keptArea : sh.area - sh.keptArea;
            habitKept += outArea;
            habitTurned += sh.area - outArea;
        }
        boolean turnByHabit = habitTurned > habitKept;
        boolean[] flip = new boolean[nt], openTurned = new boolean[nb];
        int[] conflicting = new int[nb];
        for (Shell sh : shells) {
            if (sh.conflict) { conflicting[sh.block] += sh.tris.length; continue; }
            int d = sh.decision;
            if (d == 0) {
                d = sh.keptArea >= sh.area - sh.keptArea ? 1 : -1; // as most of its area was written
                if (turnByHabit) d = -d;
            }
            int turnParity = d > 0 ? 1 : 0;
            for (int i = 0; i < sh.tris.length; i++) {
                if (sh.parity[i] != turnParity) continue;
                flip[sh.tris[i]] = true;
                if (!sh.closed) openTurned[sh.block] = true;
            }
        }
        List<String> warnings = new ArrayList<>();
        for (int b = 0; b < nb; b++) {
            IntList ts = perBlock.get(b);
            if (conflicting[b] > 0) {
                warnings.add(String.format(Locale.ROOT, "%s: block '%s': %d triangle(s) could not be wound consistently"
                        + " with their neighbours (a one-sided surface, or faces that cross); left as written",
                        source, blockNames.get(b), conflicting[b]));
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
                    openTurned[b] ? "an open mesh, with edges used by one face only, judged by its faces' consistent"
                            + " winding, facing up and away from its centre, and the file's closed shells; check this block"
                            : "closed shells, judged by their signed volume"));
        }
        for (int t = 0; t < nt; t++) {
            if (!flip[t]) continue;
            int x = tri[3 * t + 1];
            tri[3 * t + 1] = tri[3 * t + 2];
            tri[3 * t + 2] = x;
        }
        return warnings;
    }

    /** The shells of one block's triangles {@code ts}, each wound consistently where it can be, and judged. */
    private static List<Shell> shellsOf(double[] v, int[] tri, int[] rep, IntList ts, int block) {
        int k = ts.size();
        // Half-edges (3 x local triangle + edge) by undirected welded edge.
        Map<Long, IntList> edges = new HashMap<>(k * 4);
        long n = v.length / 3;
        boolean[] collapsed = new boolean[k];
        for (int i = 0; i < k; i++) {
            int t = ts.get(i);
            int a = rep[tri[3 * t]], b = rep[tri[3 * t + 1]], c = rep[tri[3 * t + 2]];
            if (a == b || b == c || a == c) { collapsed[i] = true; continue; }
            for (int e = 0; e < 3; e++) {
                int u = rep[tri[3 * t + e]], w = rep[tri[3 * t + (e + 1) % 3]];
                edges.computeIfAbsent(Math.min(u, w) * n + Math.max(u, w), x -> new IntList(2)).add(3 * i + e);
            }
        }
        int[] parity = new int[k];
        boolean[] seen = new boolean[k];
        int[] queue = new int[k];
        List<Shell> out = new ArrayList<>();
        for (int s = 0; s < k; s++) {
            if (collapsed[s] || seen[s]) continue;
            int head = 0, tail = 0;
            queue[tail++] = s;
            seen[s] = true;
            boolean closed = true, conflict = false;
            while (head < tail) {
                int i = queue[head++];
                int t = ts.get(i);
                for (int e = 0; e < 3; e++) {
                    int u = rep[tri[3 * t + e]], w = rep[tri[3 * t + (e + 1) % 3]];
                    IntList uses = edges.get(Math.min(u, w) * n + Math.max(u, w));
                    if (uses.size() != 2) { closed = false; continue; } // a border, or an edge of three or more faces
                    int h = uses.get(0) == 3 * i + e ? uses.get(1) : uses.get(0);
                    int j = h / 3;
                    boolean sameDirection = rep[tri[3 * ts.get(j) + h % 3]] == u;
                    int want = parity[i] ^ (sameDirection ? 1 : 0);
                    if (!seen[j]) {
                        seen[j] = true;
                        parity[j] = want;
                        queue[tail++] = j;
                    } else if (parity[j] != want) {
                        conflict = true;
                    }
                }
            }
            Shell sh = new Shell();
            sh.block = block;
            sh.closed = closed;
            sh.conflict = conflict;
            sh.tris = new int[tail];
            sh.parity = new int[tail];
            for (int q = 0; q < tail; q++) { sh.tris[q] = ts.get(queue[q]); sh.parity[q] = parity[queue[q]]; }
            out.add(sh);
        }
        for (Shell sh : out) judge(v, tri, sh, out.size() == 1);
        return out;
    }

    /** Sets the shell's area, the area written as parity 0, and its decision from its own geometry. */
    private static void judge(double[] v, int[] tri, Shell sh, boolean onlyShellOfBlock) {
        double[] cr = new double[3];
        double area = 0, cx = 0, cy = 0, cz = 0, kept = 0, upSum = 0;
        double[] box = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        double[] n0 = null;
        boolean flat = true;
        double cosFlat = Math.cos(Math.toRadians(FLAT_ANGLE_DEG));
        for (int i = 0; i < sh.tris.length; i++) {
            int t = sh.tris[i];
            TriangleGeometry.cross(v, tri, t, cr);
            double len = TriangleGeometry.length(cr), sign = sh.parity[i] == 0 ? 1 : -1, ar = 0.5 * len;
            area += ar;
            if (sh.parity[i] == 0) kept += ar;
            upSum += sign * 0.5 * cr[2];
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
        sh.area = area;
        sh.keptArea = kept;
        if (!(area > 0) || !Double.isFinite(area)) return;
        cx /= area; cy /= area; cz /= area;
        double diag = Math.sqrt(sq(box[3] - box[0]) + sq(box[4] - box[1]) + sq(box[5] - box[2]));
        // sum of (a - centroid) . ((b - a) x (c - a)), wound as parity 0 (6 V for a closed shell)
        double sum = 0;
        for (int i = 0; i < sh.tris.length; i++) {
            int t = sh.tris[i];
            TriangleGeometry.cross(v, tri, t, cr);
            int a = 3 * tri[3 * t];
            double d = (v[a] - cx) * cr[0] + (v[a + 1] - cy) * cr[1] + (v[a + 2] - cz) * cr[2];
            sum += sh.parity[i] == 0 ? d : -d;
        }
        double scale = area * diag;
        if (sh.closed) {
            sh.decision = Math.abs(sum) > CLOSED_MIN_REL * scale ? (sum > 0 ? 1 : -1) : 0;
            return;
        }
        double up = upSum / area;
        int away = !flat && Math.abs(sum) > AWAY_MIN_REL * scale ? (sum > 0 ? 1 : -1) : 0;
        int upward = Math.abs(up) > UP_MIN ? (up > 0 ? 1 : -1) : 0;
        if (flat) upward = onlyShellOfBlock && Math.abs(up) >= Math.cos(Math.toRadians(HORIZONTAL_DEG)) ? upward : 0;
        if (away != 0 && upward != 0) sh.decision = away == upward ? away : 0;
        else sh.decision = away != 0 ? away : upward;
    }

    private static double sq(double x) { return x * x; }
}
