package org.solmass.terrain;

import java.util.Locale;

/**
 * A digital elevation model: heights on a regular grid of a projected coordinate system in metres,
 * rows running south (north-up, as GeoTIFF stores them). Sample (col, row) stands at
 * {@code x = x0 + col dx, y = y0 - row dy}; nodata samples are NaN.
 *
 * @param source file name for messages
 * @param width samples per row
 * @param height rows
 * @param z heights in metres, row-major, NaN for nodata
 * @param x0 easting of sample (0, 0), metres
 * @param y0 northing of sample (0, 0), metres
 * @param dx sample spacing along a row (east), metres, positive
 * @param dy sample spacing between rows (south), metres, positive
 * @param epsg the coordinate system's EPSG code, or 0 when unknown
 */
public record Dem(String source, int width, int height, float[] z, double x0, double y0, double dx, double dy, int epsg) {
    public Dem {
        if (width < 2 || height < 2) throw new IllegalArgumentException("a DEM needs at least 2 x 2 samples");
        if (z.length != (long) width * height) throw new IllegalArgumentException("height array does not match the grid");
        if (!(dx > 0 && dy > 0)) throw new IllegalArgumentException("sample spacing must be positive");
    }

    public double minX() { return x0; }
    public double maxX() { return x0 + (width - 1) * dx; }
    public double maxY() { return y0; }
    public double minY() { return y0 - (height - 1) * dy; }

    /** Height of sample (col, row), NaN for nodata. */
    public double at(int col, int row) { return z[row * width + col]; }

    /** Easting of column {@code col}. */
    public double x(int col) { return x0 + col * dx; }

    /** Northing of row {@code row}. */
    public double y(int row) { return y0 - row * dy; }

    /** Whether (x, y) lies inside the grid of samples (where {@link #heightAt} can interpolate). */
    public boolean covers(double x, double y) {
        return x >= minX() && x <= maxX() && y >= minY() && y <= maxY();
    }

    /**
     * Height at (x, y) by bilinear interpolation of the four samples around it, metres; NaN outside
     * the grid or when one of the four is nodata.
     */
    public double heightAt(double x, double y) {
        double c = (x - x0) / dx, r = (y0 - y) / dy;
        if (!(c >= 0 && r >= 0 && c <= width - 1 && r <= height - 1)) return Double.NaN;
        int i = Math.min((int) c, width - 2), j = Math.min((int) r, height - 2);
        double fc = c - i, fr = r - j;
        double a = at(i, j), b = at(i + 1, j), d = at(i, j + 1), e = at(i + 1, j + 1);
        return (a * (1 - fc) + b * fc) * (1 - fr) + (d * (1 - fc) + e * fc) * fr;
    }

    /** The extent for messages: "E 1000..2000 m, N 5000..6000 m (EPSG:25832)". */
    public String extentText() {
        return String.format(Locale.ROOT, "E %.1f..%.1f m, N %.1f..%.1f m%s", minX(), maxX(), minY(), maxY(),
                epsg > 0 ? " (EPSG:" + epsg + ")" : "");
    }
}
