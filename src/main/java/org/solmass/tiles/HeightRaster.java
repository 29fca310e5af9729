package org.solmass.tiles;

import org.solmass.model.MassingModel;

import java.io.Serializable;

/**
 * A coarse raster of the whole model's heights: per square cell the highest z of any triangle whose
 * plan bounding box overlaps the cell (an upper bound of the true surface height in the cell, so
 * the far horizon drawn from it errs on the obstructed side). Cells with nothing hold
 * {@code Float.NEGATIVE_INFINITY}. Small (4 bytes per cell) and {@link Serializable}: built once for
 * a city and shared by every tile.
 */
public final class HeightRaster implements Serializable {
    private static final long serialVersionUID = 1L;

    final double x0, y0, cellM;
    final int nx, ny;
    final float[] maxZ;

    private HeightRaster(double x0, double y0, double cellM, int nx, int ny, float[] maxZ) {
        this.x0 = x0;
        this.y0 = y0;
        this.cellM = cellM;
        this.nx = nx;
        this.ny = ny;
        this.maxZ = maxZ;
    }

    /** The raster of every triangle of {@code model} with cells of {@code cellM} metres. */
    public static HeightRaster of(MassingModel model, double cellM) {
        double[] b = model.bounds();
        int nx = Math.max(1, (int) Math.ceil((b[3] - b[0]) / cellM)), ny = Math.max(1, (int) Math.ceil((b[4] - b[1]) / cellM));
        float[] z = new float[nx * ny];
        java.util.Arrays.fill(z, Float.NEGATIVE_INFINITY);
        HeightRaster r = new HeightRaster(b[0], b[1], cellM, nx, ny, z);
        double[] v = model.vertices();
        int[] tr = model.triangles();
        for (int t = 0; t < model.triangleCount(); t++) {
            double minX = Double.POSITIVE_INFINITY, minY = minX, maxX = Double.NEGATIVE_INFINITY, maxY = maxX, top = maxX;
            for (int k = 0; k < 3; k++) {
                int o = 3 * tr[3 * t + k];
                minX = Math.min(minX, v[o]);
                maxX = Math.max(maxX, v[o]);
                minY = Math.min(minY, v[o + 1]);
                maxY = Math.max(maxY, v[o + 1]);
                top = Math.max(top, v[o + 2]);
            }
            int i0 = r.col(minX), i1 = r.col(maxX), j0 = r.row(minY), j1 = r.row(maxY);
            for (int j = j0; j <= j1; j++)
                for (int i = i0; i <= i1; i++) z[j * nx + i] = Math.max(z[j * nx + i], (float) top);
        }
        return r;
    }

    /** A raster from explicit values (row j from the south, column i from the west; -inf: empty), for tests and tools. */
    public static HeightRaster of(double x0, double y0, double cellM, int nx, int ny, float[] maxZ) {
        if (maxZ.length != nx * ny) throw new IllegalArgumentException("raster needs nx * ny values");
        return new HeightRaster(x0, y0, cellM, nx, ny, maxZ.clone());
    }

    int col(double x) { return Math.max(0, Math.min(nx - 1, (int) Math.floor((x - x0) / cellM))); }

    int row(double y) { return Math.max(0, Math.min(ny - 1, (int) Math.floor((y - y0) / cellM))); }

    public int columns() { return nx; }

    public int rows() { return ny; }

    public double cellM() { return cellM; }

    /** Highest z in cell (i, j), metres, or -infinity when the cell is empty. */
    public double maxZ(int i, int j) { return maxZ[j * nx + i]; }
}
