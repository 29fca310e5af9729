package org.solmass.output;

/**
 * A small software rasteriser with a depth buffer for the headless map: filled triangles and
 * polygons (triangulated by the caller), depth-tested lines with alpha, and a 2 x 2 box downsampling
 * for anti-aliasing. Depth grows towards the viewer. Pixel centres at (i + 0.5, j + 0.5); no
 * allocation per primitive.
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
     * Fills a polygon given as screen x, y and depth per corner and its triangles as corner indices,
     * three per triangle (for a patch, {@code Patch.triangles()}: the triangulation glTF and the viewer
     * use too).
     */
    void polygon(double[] xs, double[] ys, double[] zs, int[] triangles, int colour, float bias) {
        for (int t = 0; t + 2 < triangles.length; t += 3) {
            int a = triangles[t], b = triangles[t + 1], c = triangles[t + 2];
            triangle(xs[a], ys[a], zs[a], xs[b], ys[b], zs[b], xs[c], ys[c], zs[c], colour, bias);
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
}
