package org.solmass.model;

/**
 * The one polygon triangulator of Solmass: ear clipping of a planar, possibly concave, simple
 * polygon. The OBJ reader uses it for n-gon faces ({@link #triangulate(int[], int, double[], IntList)}),
 * and every patch mesh (glTF, viewer, PNG map) through {@code surface.Patch.triangles()}, which calls
 * {@link #triangulate(double[], double[])} on the outline in the patch's plane.
 * Method: ear clipping (Meisters, G. H., 1975, "Polygons have ears", American Mathematical Monthly
 * 82(6):648-651; every simple polygon with more than 3 vertices has two non-overlapping ears).
 * Valid for simple polygons (no self-intersection); collinear and repeated vertices are allowed.
 * For a 3D face the plane is taken from the Newell normal (Newell's method, see Sutherland, Sproull
 * and Schumacker, 1974, "A characterization of ten hidden-surface algorithms", ACM Computing Surveys
 * 6(1)), and the polygon is projected by dropping the normal's dominant axis.
 * Output triangles keep the polygon's winding, so their normals agree with the face normal.
 *
 * <p>Clipping tries corners in order from a first corner: 0 for OBJ faces, 1 for 2D outlines. From
 * corner 1 a strictly convex polygon comes out as the fan from corner 0, (0,1,2), (0,2,3), ...
 * Not thread-safe: one instance per reader (the static 2D method makes its own).
 */
public final class PolygonTriangulator {
    /** Relative tolerance for the convexity test: |cross| below this times the squared size is collinear. */
    static final double COLLINEAR_REL = 1e-12;

    private double[] px = new double[16], py = new double[16];
    private int[] idx = new int[16], prev = new int[16], next = new int[16];

    /**
     * @param face vertex indices (0-based) of the face, in OBJ order
     * @param n number of used entries in {@code face}
     * @param v flat vertex array x,y,z
     * @param out receives three indices per triangle
     * @return number of triangles written
     */
    int triangulate(int[] face, int n, double[] v, IntList out) {
        ensure(n);
        // Copy, dropping consecutive repeats (same index or same position) and a closing repeat.
        int k = 0;
        for (int i = 0; i < n; i++) {
            int vi = face[i];
            if (k > 0 && samePos(v, idx[k - 1], vi)) continue;
            idx[k++] = vi;
        }
        while (k > 1 && samePos(v, idx[k - 1], idx[0])) k--;
        if (k < 3) return 0;
        if (k == 3) {
            out.add(idx[0]); out.add(idx[1]); out.add(idx[2]);
            return 1;
        }
        // Newell normal.
        double nx = 0, ny = 0, nz = 0;
        for (int i = 0; i < k; i++) {
            int a = idx[i] * 3, b = idx[(i + 1) % k] * 3;
            nx += (v[a + 1] - v[b + 1]) * (v[a + 2] + v[b + 2]);
            ny += (v[a + 2] - v[b + 2]) * (v[a] + v[b]);
            nz += (v[a] - v[b]) * (v[a + 1] + v[b + 1]);
        }
        double ax = Math.abs(nx), ay = Math.abs(ny), az = Math.abs(nz);
        if (ax + ay + az == 0) return 0;
        int drop = az >= ax && az >= ay ? 2 : (ay >= ax ? 1 : 0);
        double sign = drop == 2 ? Math.signum(nz) : drop == 1 ? Math.signum(ny) : Math.signum(nx);
        for (int i = 0; i < k; i++) {
            int a = idx[i] * 3;
            // Right-handed projection so that the polygon is counter-clockwise in 2D when sign > 0.
            double x, y;
            if (drop == 2) { x = v[a]; y = v[a + 1]; }
            else if (drop == 1) { x = v[a + 2]; y = v[a]; }
            else { x = v[a + 1]; y = v[a + 2]; }
            if (sign < 0) y = -y;
            px[i] = x; py[i] = y;
        }
        return clip(k, 0, out);
    }

    /**
     * Triangles of a simple 2D polygon (either orientation; not closed: the last corner is not a
     * repeat of the first), as corner indices, three per triangle, in the polygon's own
     * orientation. A corner at the same position as the one before it is skipped. A strictly convex
     * polygon gives the fan from corner 0; a simple polygon with n distinct corners and no straight
     * ones gives n - 2 triangles.
     */
    public static int[] triangulate(double[] x, double[] y) {
        int n = Math.min(x.length, y.length);
        PolygonTriangulator t = new PolygonTriangulator();
        t.ensure(n);
        int k = 0;
        for (int i = 0; i < n; i++) {
            if (k > 0 && x[i] == t.px[k - 1] && y[i] == t.py[k - 1]) continue;
            t.px[k] = x[i]; t.py[k] = y[i]; t.idx[k] = i;
            k++;
        }
        while (k > 1 && t.px[k - 1] == t.px[0] && t.py[k - 1] == t.py[0]) k--;
        if (k < 3) return new int[0];
        double area2 = 0;
        for (int i = 0; i < k; i++) {
            int j = (i + 1) % k;
            area2 += t.px[i] * t.py[j] - t.px[j] * t.py[i];
        }
        if (area2 < 0) for (int i = 0; i < k; i++) t.py[i] = -t.py[i]; // clockwise: mirror to counter-clockwise
        IntList out = new IntList();
        if (k == 3) {
            out.add(t.idx[0]); out.add(t.idx[1]); out.add(t.idx[2]);
        } else {
            t.clip(k, 1, out);
        }
        return out.toArray();
    }

    /**
     * Ear clipping of the counter-clockwise polygon {@code px, py} of k (at least 4) corners, trying
     * corners from {@code first}; writes {@code idx} of the corners, three per triangle.
     */
    private int clip(int k, int first, IntList out) {
        double minX = Double.POSITIVE_INFINITY, maxX = Double.NEGATIVE_INFINITY;
        double minY = Double.POSITIVE_INFINITY, maxY = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < k; i++) {
            minX = Math.min(minX, px[i]); maxX = Math.max(maxX, px[i]);
            minY = Math.min(minY, py[i]); maxY = Math.max(maxY, py[i]);
        }
        double size = Math.max(maxX - minX, maxY - minY);
        double eps = COLLINEAR_REL * size * size;
        for (int i = 0; i < k; i++) { prev[i] = (i + k - 1) % k; next[i] = (i + 1) % k; }
        int remaining = k, written = 0, cur = first, sinceEar = 0;
        while (remaining > 3) {
            int p = prev[cur], q = next[cur];
            double c = cross(p, cur, q);
            boolean ear = false;
            if (c > eps) {
                ear = true;
                for (int j = next[q]; j != p; j = next[j]) {
                    if (coincides(j, p) || coincides(j, cur) || coincides(j, q)) continue;
                    if (insideOrOn(j, p, cur, q, eps)) { ear = false; break; }
                }
            } else if (Math.abs(c) <= eps && isSpike(p, cur, q)) {
                // A zero-width spike (the boundary goes out and straight back): remove without a triangle.
                unlink(cur); remaining--; cur = q; sinceEar = 0; continue;
            }
            if (ear) {
                out.add(idx[p]); out.add(idx[cur]); out.add(idx[q]);
                written++;
                unlink(cur); remaining--; cur = q; sinceEar = 0;
                continue;
            }
            cur = q;
            if (++sinceEar > remaining) {
                // No ear (numerically awkward input): drop a collinear vertex if there is one, else clip
                // the most convex corner so that the loop always ends.
                int best = -1; double bestC = Double.NEGATIVE_INFINITY;
                int j = cur;
                for (int s = 0; s < remaining; s++, j = next[j]) {
                    double cj = cross(prev[j], j, next[j]);
                    if (Math.abs(cj) <= eps) { best = j; bestC = 0; break; }
                    if (cj > bestC) { bestC = cj; best = j; }
                }
                if (bestC > eps) {
                    out.add(idx[prev[best]]); out.add(idx[best]); out.add(idx[next[best]]);
                    written++;
                } else if (bestC < -eps) {
                    return written; // only reflex corners left: not a simple polygon
                }
                cur = next[best];
                unlink(best); remaining--; sinceEar = 0;
            }
        }
        int p = prev[cur], q = next[cur];
        out.add(idx[p]); out.add(idx[cur]); out.add(idx[q]);
        return written + 1;
    }

    /** Faces of more corners than this are not checked for crossing edges (quadratic cost). */
    static final int MAX_CROSSING_CHECK = 4096;

    /**
     * The first pair of edges of a 3D face that cross each other (a bow-tie), or null for a face
     * without crossing edges (or of more than {@link #MAX_CROSSING_CHECK} corners). Edge i runs from
     * corner i to corner i + 1 (0-based, the last back to corner 0); returns {i, j} with i &lt; j.
     * The face is projected along the axis on which its fan's cross products are largest (it works
     * for a bow-tie, whose two lobes cancel in the Newell normal); a crossing is proper: the
     * corners of each edge lie strictly on opposite sides of the other, beyond the collinear
     * tolerance, so faces whose edges only touch or overlap (a bridge to a hole) pass.
     */
    static int[] crossingEdges(int[] face, int n, double[] v) {
        if (n < 4 || n > MAX_CROSSING_CHECK) return null;
        double sx = 0, sy = 0, sz = 0;
        int a0 = face[0] * 3;
        for (int i = 1; i + 1 < n; i++) {
            int b = face[i] * 3, c = face[i + 1] * 3;
            double ux = v[b] - v[a0], uy = v[b + 1] - v[a0 + 1], uz = v[b + 2] - v[a0 + 2];
            double wx = v[c] - v[a0], wy = v[c + 1] - v[a0 + 1], wz = v[c + 2] - v[a0 + 2];
            sx += Math.abs(uy * wz - uz * wy); sy += Math.abs(uz * wx - ux * wz); sz += Math.abs(ux * wy - uy * wx);
        }
        int drop = sz >= sx && sz >= sy ? 2 : (sy >= sx ? 1 : 0);
        double[] x = new double[n], y = new double[n];
        double minX = Double.POSITIVE_INFINITY, maxX = Double.NEGATIVE_INFINITY;
        double minY = Double.POSITIVE_INFINITY, maxY = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            int a = face[i] * 3;
            x[i] = drop == 0 ? v[a + 1] : v[a];
            y[i] = drop == 2 ? v[a + 1] : v[a + 2];
            minX = Math.min(minX, x[i]); maxX = Math.max(maxX, x[i]);
            minY = Math.min(minY, y[i]); maxY = Math.max(maxY, y[i]);
        }
        double size = Math.max(maxX - minX, maxY - minY);
        double eps = COLLINEAR_REL * size * size;
        for (int i = 0; i < n; i++) {
            int i2 = (i + 1) % n;
            for (int j = i + 2; j < n; j++) {
                int j2 = (j + 1) % n;
                if (j2 == i) continue; // adjacent through the closing edge
                if (face[j] == face[i] || face[j] == face[i2] || face[j2] == face[i] || face[j2] == face[i2]) continue;
                double d1 = orient(x, y, i, i2, j), d2 = orient(x, y, i, i2, j2);
                double d3 = orient(x, y, j, j2, i), d4 = orient(x, y, j, j2, i2);
                if (((d1 > eps && d2 < -eps) || (d1 < -eps && d2 > eps))
                        && ((d3 > eps && d4 < -eps) || (d3 < -eps && d4 > eps))) {
                    return new int[]{i, j};
                }
            }
        }
        return null;
    }

    private static double orient(double[] x, double[] y, int a, int b, int c) {
        return (x[b] - x[a]) * (y[c] - y[a]) - (y[b] - y[a]) * (x[c] - x[a]);
    }

    private void unlink(int i) {
        next[prev[i]] = next[i];
        prev[next[i]] = prev[i];
    }

    private double cross(int a, int b, int c) {
        return (px[b] - px[a]) * (py[c] - py[a]) - (py[b] - py[a]) * (px[c] - px[a]);
    }

    private boolean isSpike(int a, int b, int c) {
        double dx1 = px[b] - px[a], dy1 = py[b] - py[a], dx2 = px[c] - px[b], dy2 = py[c] - py[b];
        return dx1 * dx2 + dy1 * dy2 < 0;
    }

    private boolean coincides(int a, int b) { return px[a] == px[b] && py[a] == py[b]; }

    private boolean insideOrOn(int pnt, int a, int b, int c, double eps) {
        return cross(a, b, pnt) >= -eps && cross(b, c, pnt) >= -eps && cross(c, a, pnt) >= -eps;
    }

    private static boolean samePos(double[] v, int a, int b) {
        if (a == b) return true;
        int i = a * 3, j = b * 3;
        return v[i] == v[j] && v[i + 1] == v[j + 1] && v[i + 2] == v[j + 2];
    }

    private void ensure(int n) {
        if (idx.length >= n) return;
        int m = Math.max(n, idx.length * 2);
        px = new double[m]; py = new double[m]; idx = new int[m]; prev = new int[m]; next = new int[m];
    }
}
