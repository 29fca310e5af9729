package org.solmass.output;

/**
 * A small software rasteriser with a depth buffer for the headless map: filled triangles and
 * polygons, depth-tested lines with alpha, and a 2 x 2 box downsampling for anti-aliasing. Depth grows
 * towards the viewer. Pixel centres at (i + 0.5, j + 0.5); no allocation per primitive except for
 * polygons of more than four corners.
 */
final class Raster {
    final int w, h;
    final int[] rgb;
    final float[] depth;

    Raster(int w, int h, int background) {
        this.w = w;
        this.h = h;
        rgb = new int[w * h];
        depth = new float[w * h];
        java.util.Arrays.fill(rgb, background);
        java.util.Arrays.fill(depth, Float.NEGATIVE_INFINITY);
    }

    /** Fills a triangle where it is at least as near as {@code depth - bias}. */
    void triangle(double x0, double y0, double z0, double x1, double y1, double z1,
                  double x2, double y2, double z2, int colour, float bias) {
        double area = (x1 - x0) * (y2 - y0) - (x2 - x0) * (y1 - y0);
        if (Math.abs(area) < 1e-12) return;
        int minX = Math.max(0, (int) Math.floor(Math.min(x0, Math.min(x1, x2))));
        int maxX = Math.min(w - 1, (int) Math.ceil(Math.max(x0, Math.max(x1, x2))));
        int minY = Math.max(0, (int) Math.floor(Math.min(y0, Math.min(y1, y2))));
        int maxY = Math.min(h - 1, (int) Math.ceil(Math.max(y0, Math.max(y1, y2))));
        double inv = 1 / area;
        for (int j = minY; j <= maxY; j++) {
            double py = j + 0.5;
            for (int i = minX; i <= maxX; i++) {
                double px = i + 0.5;
                double b0 = ((x1 - px) * (y2 - py) - (x2 - px) * (y1 - py)) * inv;
                double b1 = ((x2 - px) * (y0 - py) - (x0 - px) * (y2 - py)) * inv;
                double b2 = 1 - b0 - b1;
                if (b0 < 0 || b1 < 0 || b2 < 0) continue;
                float z = (float) (b0 * z0 + b1 * z1 + b2 * z2);
                int k = j * w + i;
                if (z + bias >= depth[k]) {
                    if (z > depth[k]) depth[k] = z;
                    rgb[k] = colour;
                }
            }
        }
    }

    /**
     * Fills a simple polygon given as screen x, y and depth per corner (fan for convex, ear clipping
     * otherwise).
     */
    void polygon(double[] xs, double[] ys, double[] zs, int n, int colour, float bias) {
        if (n < 3) return;
        if (n == 3 || convex(xs, ys, n)) {
            for (int i = 1; i + 1 < n; i++) {
                triangle(xs[0], ys[0], zs[0], xs[i], ys[i], zs[i], xs[i + 1], ys[i + 1], zs[i + 1], colour, bias);
            }
            return;
        }
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) idx[i] = i;
        double sign = Math.signum(signedArea(xs, ys, n));
        int m = n, guard = 0;
        while (m > 3 && guard++ < n * n) {
            boolean clipped = false;
            for (int a = 0; a < m; a++) {
                int ia = idx[(a + m - 1) % m], ib = idx[a], ic = idx[(a + 1) % m];
                double cross = (xs[ib] - xs[ia]) * (ys[ic] - ys[ia]) - (xs[ic] - xs[ia]) * (ys[ib] - ys[ia]);
                if (cross * sign <= 0) continue;
                boolean inside = false;
                for (int q = 0; q < m && !inside; q++) {
                    int iq = idx[q];
                    if (iq == ia || iq == ib || iq == ic) continue;
                    inside = inTriangle(xs[iq], ys[iq], xs[ia], ys[ia], xs[ib], ys[ib], xs[ic], ys[ic]);
                }
                if (inside) continue;
                triangle(xs[ia], ys[ia], zs[ia], xs[ib], ys[ib], zs[ib], xs[ic], ys[ic], zs[ic], colour, bias);
                System.arraycopy(idx, a + 1, idx, a, m - a - 1);
                m--;
                clipped = true;
                break;
            }
            if (!clipped) break;
        }
        for (int i = 1; i + 1 < m; i++) {
            triangle(xs[idx[0]], ys[idx[0]], zs[idx[0]], xs[idx[i]], ys[idx[i]], zs[idx[i]],
                    xs[idx[i + 1]], ys[idx[i + 1]], zs[idx[i + 1]], colour, bias);
        }
    }

    /** A depth-tested line of one pixel width blended over the image with {@code alpha} in [0,1]. */
    void line(double x0, double y0, double z0, double x1, double y1, double z1, int colour, double alpha, float bias) {
        double dx = x1 - x0, dy = y1 - y0;
        int steps = (int) Math.ceil(Math.max(Math.abs(dx), Math.abs(dy)));
        if (steps == 0) steps = 1;
        if (steps > 4 * (w + h)) return;  // far outside: not worth drawing
        int a = (int) Math.round(alpha * 256);
        for (int s = 0; s <= steps; s++) {
            double t = s / (double) steps;
            int i = (int) Math.floor(x0 + dx * t), j = (int) Math.floor(y0 + dy * t);
            if (i < 0 || j < 0 || i >= w || j >= h) continue;
            int k = j * w + i;
            float z = (float) (z0 + (z1 - z0) * t);
            if (z + bias < depth[k]) continue;
            rgb[k] = blend(rgb[k], colour, a);
        }
    }

    static int blend(int under, int over, int a256) {
        int r = (((under >> 16) & 255) * (256 - a256) + ((over >> 16) & 255) * a256) >> 8;
        int g = (((under >> 8) & 255) * (256 - a256) + ((over >> 8) & 255) * a256) >> 8;
        int b = ((under & 255) * (256 - a256) + (over & 255) * a256) >> 8;
        return (r << 16) | (g << 8) | b;
    }

    /** The image at half size, each pixel the mean of a 2 x 2 block. */
    int[] downsample2() {
        int hw = w / 2, hh = h / 2;
        int[] out = new int[hw * hh];
        for (int j = 0; j < hh; j++) {
            for (int i = 0; i < hw; i++) {
                int k = 2 * j * w + 2 * i;
                int c0 = rgb[k], c1 = rgb[k + 1], c2 = rgb[k + w], c3 = rgb[k + w + 1];
                int r = (((c0 >> 16) & 255) + ((c1 >> 16) & 255) + ((c2 >> 16) & 255) + ((c3 >> 16) & 255) + 2) >> 2;
                int g = (((c0 >> 8) & 255) + ((c1 >> 8) & 255) + ((c2 >> 8) & 255) + ((c3 >> 8) & 255) + 2) >> 2;
                int b = ((c0 & 255) + (c1 & 255) + (c2 & 255) + (c3 & 255) + 2) >> 2;
                out[j * hw + i] = (r << 16) | (g << 8) | b;
            }
        }
        return out;
    }

    private static boolean convex(double[] xs, double[] ys, int n) {
        double sign = 0;
        for (int i = 0; i < n; i++) {
            int a = i, b = (i + 1) % n, c = (i + 2) % n;
            double cross = (xs[b] - xs[a]) * (ys[c] - ys[b]) - (ys[b] - ys[a]) * (xs[c] - xs[b]);
            if (Math.abs(cross) < 1e-12) continue;
            if (sign == 0) sign = Math.signum(cross);
            else if (Math.signum(cross) != sign) return false;
        }
        return true;
    }

    private static double signedArea(double[] xs, double[] ys, int n) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            int j = (i + 1) % n;
            s += xs[i] * ys[j] - xs[j] * ys[i];
        }
        return s / 2;
    }

    private static boolean inTriangle(double px, double py, double ax, double ay, double bx, double by, double cx, double cy) {
        double d1 = (px - bx) * (ay - by) - (ax - bx) * (py - by);
        double d2 = (px - cx) * (by - cy) - (bx - cx) * (py - cy);
        double d3 = (px - ax) * (cy - ay) - (cx - ax) * (py - ay);
        boolean neg = d1 < 0 || d2 < 0 || d3 < 0, pos = d1 > 0 || d2 > 0 || d3 > 0;
        return !(neg && pos);
    }
}
