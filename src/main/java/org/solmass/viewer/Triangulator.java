package org.solmass.viewer;

/**
 * Triangulates a planar simple polygon given as 2D coordinates: a fan for convex polygons, ear
 * clipping otherwise (common practice; ear clipping after D. Eberly, "Triangulation by Ear
 * Clipping", Geometric Tools, 2002). Returns corner indices, three per triangle, in the polygon's
 * own orientation.
 */
public final class Triangulator {
    private Triangulator() {}

    /** Triangles of the polygon (u[i], v[i]); n-2 of them for a simple polygon with n corners. */
    public static int[] triangulate(double[] u, double[] v) {
        int n = u.length;
        if (n < 3) return new int[0];
        double area = signedArea(u, v);
        if (isConvex(u, v, area)) {
            int[] out = new int[3 * (n - 2)];
            for (int i = 0; i < n - 2; i++) {
                out[3 * i] = 0;
                out[3 * i + 1] = i + 1;
                out[3 * i + 2] = i + 2;
            }
            return out;
        }
        return earClip(u, v, area >= 0 ? 1 : -1);
    }

    static double signedArea(double[] u, double[] v) {
        double a = 0;
        for (int i = 0, n = u.length; i < n; i++) {
            int j = (i + 1) % n;
            a += u[i] * v[j] - u[j] * v[i];
        }
        return a / 2;
    }

    private static double cross(double[] u, double[] v, int a, int b, int c) {
        return (u[b] - u[a]) * (v[c] - v[a]) - (v[b] - v[a]) * (u[c] - u[a]);
    }

    private static boolean isConvex(double[] u, double[] v, double area) {
        double sign = area >= 0 ? 1 : -1;
        int n = u.length;
        for (int i = 0; i < n; i++) {
            if (cross(u, v, i, (i + 1) % n, (i + 2) % n) * sign < -1e-12) return false;
        }
        return true;
    }

    private static int[] earClip(double[] u, double[] v, double sign) {
        int n = u.length;
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) idx[i] = i;
        int[] out = new int[3 * (n - 2)];
        int k = 0, m = n, guard = 0;
        int i = 0;
        while (m > 3 && guard < n * n) {
            guard++;
            int a = idx[(i + m - 1) % m], b = idx[i % m], c = idx[(i + 1) % m];
            if (cross(u, v, a, b, c) * sign > 1e-12 && noCornerInside(u, v, idx, m, a, b, c, sign)) {
                out[k++] = a;
                out[k++] = b;
                out[k++] = c;
                System.arraycopy(idx, i % m + 1, idx, i % m, m - i % m - 1);
                m--;
                i = Math.max(0, i - 1);
            } else {
                i = (i + 1) % m;
            }
        }
        if (m == 3) {
            out[k++] = idx[0];
            out[k++] = idx[1];
            out[k++] = idx[2];
        }
        if (k < out.length) {                 // degenerate input: fall back to a fan over what is left
            int[] trimmed = new int[k];
            System.arraycopy(out, 0, trimmed, 0, k);
            return trimmed;
        }
        return out;
    }

    private static boolean noCornerInside(double[] u, double[] v, int[] idx, int m, int a, int b, int c, double s) {
        for (int j = 0; j < m; j++) {
            int p = idx[j];
            if (p == a || p == b || p == c) continue;
            if (cross(u, v, a, b, p) * s >= 0 && cross(u, v, b, c, p) * s >= 0 && cross(u, v, c, a, p) * s >= 0) return false;
        }
        return true;
    }
}
