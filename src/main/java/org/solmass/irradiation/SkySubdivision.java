package org.solmass.irradiation;

/**
 * A subdivision of the upper hemisphere into cells of nearly equal solid angle, used to bin a year
 * of sun positions so that one occlusion ray per occupied cell stands for every step whose sun lies
 * in it.
 *
 * <p>Construction (our own, in the manner of common equal-area sky partitions): {@code R} elevation
 * bands of equal width {@code 90/R} degrees; band {@code i} (centre elevation {@code e_i}) holds
 * {@code max(1, round(4 R cos e_i))} azimuth cells, so that a cell's solid angle
 * {@code (2 pi / n_i)(sin e_top - sin e_bottom)} is close to {@code (pi / 2) / R^2} in every band.
 * {@code R} is the smallest band count whose total reaches the requested cell count.
 */
public final class SkySubdivision {
    private final int bands;
    private final int[] cellsInBand;
    private final int[] firstCell;
    private final int cellCount;

    /** @param requestedCells the number of cells wanted (the result has at least this many) */
    public SkySubdivision(int requestedCells) {
        if (requestedCells < 1) throw new IllegalArgumentException("cells must be positive: " + requestedCells);
        int r = 1;
        while (count(r) < requestedCells) r++;
        bands = r;
        cellsInBand = new int[r];
        firstCell = new int[r];
        int total = 0;
        for (int i = 0; i < r; i++) {
            cellsInBand[i] = cellsIn(r, i);
            firstCell[i] = total;
            total += cellsInBand[i];
        }
        cellCount = total;
    }

    private static int count(int r) {
        int total = 0;
        for (int i = 0; i < r; i++) total += cellsIn(r, i);
        return total;
    }

    private static int cellsIn(int r, int band) {
        double mid = Math.toRadians((band + 0.5) * 90.0 / r);
        return Math.max(1, (int) Math.round(4.0 * r * Math.cos(mid)));
    }

    public int cellCount() { return cellCount; }

    public int bandCount() { return bands; }

    /**
     * The cell holding a direction given by azimuth (degrees from north, clockwise) and elevation
     * (degrees above the horizon, clamped to [0, 90]).
     */
    public int cellOf(double azimuthDeg, double elevationDeg) {
        double e = Math.max(0, Math.min(90, elevationDeg));
        int band = Math.min(bands - 1, (int) (e / (90.0 / bands)));
        double a = azimuthDeg % 360;
        if (a < 0) a += 360;
        int n = cellsInBand[band];
        int k = Math.min(n - 1, (int) (a / 360.0 * n));
        return firstCell[band] + k;
    }

    /** Solid angle of a cell, steradians (exact for this construction). */
    public double solidAngle(int cell) {
        int band = bandOf(cell);
        double lo = Math.toRadians(band * 90.0 / bands), hi = Math.toRadians((band + 1) * 90.0 / bands);
        return 2 * Math.PI / cellsInBand[band] * (Math.sin(hi) - Math.sin(lo));
    }

    /** Band index of a cell. */
    public int bandOf(int cell) {
        int lo = 0, hi = bands - 1;
        while (lo < hi) {
            int mid = (lo + hi + 1) >>> 1;
            if (firstCell[mid] <= cell) lo = mid; else hi = mid - 1;
        }
        return lo;
    }
}
