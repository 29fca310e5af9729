package org.solmass.sky;

/**
 * The sky hemisphere cut into patches, for a sky radiance distribution: how much of each patch a
 * plane sees (cosine-weighted) and the mean radiance of each patch.
 *
 * <p>Patches: the 145 patches of Tregenza (1987, "Subdivision of the sky hemisphere for luminance
 * measurements", Lighting Research and Technology 19(1) 13-14): seven bands of 12 degrees elevation
 * holding 30, 30, 24, 24, 18, 12 and 6 patches of equal azimuth width, and a zenith cap above 84
 * degrees. With {@code split} m &gt; 1 each band is cut into m bands of 12/m degrees with m times
 * as many patches (144 m^2 + 1 patches; the cap stays whole; our own refinement, measured in
 * {@code SkyPatchesTest} and docs/method.md).
 *
 * <p>Quadrature: every patch is cut into q x q cells (q = max(1, 4 / m); the cap into q rings of 8
 * sectors). For a cell the exact integrals over its solid angle are kept: its solid angle
 * {@code dphi (sin e1 - sin e0)} and the vector {@code V = integral of d domega} =
 * {@code ((cos phi0 - cos phi1) C, (sin phi1 - sin phi0) C, dphi (sin^2 e1 - sin^2 e0)/2)},
 * {@code C = [e/2 + sin(2e)/4] from e0 to e1} (x east, y north, z up; phi azimuth from north,
 * clockwise). The cosine-weighted share of a patch seen by a plane of unit normal n is
 * {@code sum over its cells of max(0, n . V)/pi}: exact for cells wholly in front of the plane, so an
 * unobstructed horizontal plane's shares sum to 1 to rounding; cells cut by the plane's horizon are
 * clipped whole (a 3-degree cell at m = 1). Radiance is evaluated at each cell's mean direction
 * V/|V| and averaged over the patch weighted by solid angle.
 *
 * <p>Immutable; one instance may be shared by all threads.
 */
public final class SkyPatches {
    /** Tregenza's bands: patches per 12-degree band from the horizon up; then one zenith cap. */
    private static final int[] TREGENZA_BAND = {30, 30, 24, 24, 18, 12, 6};
    private static final double BAND_DEG = 12, CAP_FROM_DEG = 84;

    /** The Tregenza subdivision (145 patches), the one the pipeline uses. */
    public static final SkyPatches TREGENZA = new SkyPatches(1);

    private final int split, count, rows;
    /** Per row of patches: sin of its lower edge, its first patch and its patch count; the cap is the last patch. */
    private final double[] rowSinLow;
    private final int[] rowFirst, rowCount;
    /** Per row: cos and sin of the azimuth boundaries 2 pi k / n, k = 0 .. n/2 (every row's count is even). */
    private final double[][] rowBoundCos, rowBoundSin;
    /** Per cell: exact vector integral (x, y, z), solid angle, mean direction; cells of a patch are contiguous. */
    private final double[] cellV, cellW, cellDir;
    private final int[] patchFirstCell;
    /** Per cell: index of its row of cells (cells of a row share their elevation range, so their cos zenith); per row: cos zenith. */
    private final int[] cellRow;
    private final double[] rowCosZenith;
    private final double[] horizontalShare;

    /** @param split m >= 1: every Tregenza band cut into m bands of m times as many patches */
    public SkyPatches(int split) {
        if (split < 1) throw new IllegalArgumentException("split must be at least 1, got " + split);
        this.split = split;
        rows = TREGENZA_BAND.length * split;
        rowSinLow = new double[rows + 1];
        rowFirst = new int[rows + 1];
        rowCount = new int[rows + 1];
        int q = Math.max(1, 4 / split), capSectors = 8;
        int p = 0;
        for (int r = 0; r < rows; r++) {
            rowSinLow[r] = Math.sin(Math.toRadians(r * BAND_DEG / split));
            rowFirst[r] = p;
            rowCount[r] = TREGENZA_BAND[r / split] * split;
            p += rowCount[r];
        }
        rowBoundCos = new double[rows][];
        rowBoundSin = new double[rows][];
        for (int r = 0; r < rows; r++) {
            int half = rowCount[r] / 2;
            rowBoundCos[r] = new double[half];
            rowBoundSin[r] = new double[half];
            for (int k = 0; k < half; k++) {
                rowBoundCos[r][k] = Math.cos(2 * Math.PI * k / rowCount[r]);
                rowBoundSin[r][k] = Math.sin(2 * Math.PI * k / rowCount[r]);
            }
        }
        rowSinLow[rows] = Math.sin(Math.toRadians(CAP_FROM_DEG));
        rowFirst[rows] = p;
        rowCount[rows] = 1;
        count = p + 1;
        int cells = (count - 1) * q * q + q * capSectors;
        cellV = new double[3 * cells];
        cellW = new double[cells];
        cellDir = new double[3 * cells];
        patchFirstCell = new int[count + 1];
        cellRow = new int[cells];
        rowCosZenith = new double[rows * q + q];
        int c = 0;
        for (int r = 0; r < rows; r++) {
            double e0 = Math.toRadians(r * BAND_DEG / split), e1 = Math.toRadians((r + 1) * BAND_DEG / split);
            int n = rowCount[r];
            for (int k = 0; k < n; k++) {
                patchFirstCell[rowFirst[r] + k] = c;
                double a0 = 2 * Math.PI * k / n, a1 = 2 * Math.PI * (k + 1) / n;
                for (int i = 0; i < q; i++) {
                    for (int j = 0; j < q; j++) {
                        cellRow[c] = r * q + i;
                        cell(c++, e0 + (e1 - e0) * i / q, e0 + (e1 - e0) * (i + 1) / q,
                                a0 + (a1 - a0) * j / q, a0 + (a1 - a0) * (j + 1) / q);
                    }
                }
            }
        }
        patchFirstCell[count - 1] = c;
        double c0 = Math.toRadians(CAP_FROM_DEG);
        for (int i = 0; i < q; i++) {
            for (int j = 0; j < capSectors; j++) {
                cellRow[c] = rows * q + i;
                cell(c++, c0 + (Math.PI / 2 - c0) * i / q, c0 + (Math.PI / 2 - c0) * (i + 1) / q,
                        2 * Math.PI * j / capSectors, 2 * Math.PI * (j + 1) / capSectors);
            }
        }
        patchFirstCell[count] = c;
        for (int k = 0; k < c; k++) rowCosZenith[cellRow[k]] = cellDir[3 * k + 2];
        horizontalShare = new double[count];
        cosineShares(0, 0, 1, horizontalShare);
    }

    private void cell(int c, double e0, double e1, double a0, double a1) {
        double da = a1 - a0;
        double cc = (e1 / 2 + Math.sin(2 * e1) / 4) - (e0 / 2 + Math.sin(2 * e0) / 4);
        double vx = (Math.cos(a0) - Math.cos(a1)) * cc, vy = (Math.sin(a1) - Math.sin(a0)) * cc;
        double s0 = Math.sin(e0), s1 = Math.sin(e1);
        double vz = da * (s1 * s1 - s0 * s0) / 2;
        cellV[3 * c] = vx;
        cellV[3 * c + 1] = vy;
        cellV[3 * c + 2] = vz;
        cellW[c] = da * (s1 - s0);
        double len = Math.sqrt(vx * vx + vy * vy + vz * vz);
        cellDir[3 * c] = vx / len;
        cellDir[3 * c + 1] = vy / len;
        cellDir[3 * c + 2] = vz / len;
    }

    /** Number of patches. */
    public int count() { return count; }

    /** The split m this subdivision was made with (1: Tregenza's 145 patches). */
    public int split() { return split; }

    /**
     * The patch holding a direction of the upper hemisphere (unit vector, dz >= 0; x east, y north,
     * z up). No allocation.
     */
    public int patchOf(double dx, double dy, double dz) {
        int r = 0;
        while (r < rows && dz >= rowSinLow[r + 1]) r++;
        if (r == rows) return count - 1;
        // azimuth cell without atan2: fold the western half onto the eastern one (every row's count is
        // even, so pi is a boundary), then binary search the boundaries phi_k by the sign of
        // sin(phi - phi_k) = (dx cos phi_k - dy sin phi_k) / |d_h|, monotone for phi, phi_k in [0, pi)
        int half = rowCount[r] / 2, off = 0;
        double hx = dx, hy = dy;
        if (hx < 0 || (hx == 0 && hy < 0)) {
            hx = -hx;
            hy = -hy;
            off = half;
        }
        double[] bc = rowBoundCos[r], bs = rowBoundSin[r];
        int lo = 0, hi = half - 1;
        while (lo < hi) {
            int mid = (lo + hi + 1) >>> 1;
            if (hx * bc[mid] - hy * bs[mid] >= 0) lo = mid;
            else hi = mid - 1;
        }
        return rowFirst[r] + off + lo;
    }

    /**
     * Cosine-weighted share of every patch seen by an unobstructed plane of unit normal n:
     * {@code out[p] = integral over p of max(0, n . d) domega / pi} (see the class doc). No allocation.
     */
    public void cosineShares(double nx, double ny, double nz, double[] out) {
        for (int p = 0; p < count; p++) {
            double s = 0;
            for (int c = patchFirstCell[p]; c < patchFirstCell[p + 1]; c++) {
                double v = nx * cellV[3 * c] + ny * cellV[3 * c + 1] + nz * cellV[3 * c + 2];
                if (v > 0) s += v;
            }
            out[p] = s / Math.PI;
        }
    }

    /**
     * A direction into patch p in front of the plane of unit normal n: the mean direction of the
     * patch's cell with the largest {@code n . V} (its most heavily weighted cell), into
     * {@code out[3s..3s+2]}; false when no cell of the patch lies in front.
     */
    public boolean frontDirection(int p, double nx, double ny, double nz, double[] out, int s) {
        int best = -1;
        double bv = 0;
        for (int c = patchFirstCell[p]; c < patchFirstCell[p + 1]; c++) {
            double v = nx * cellV[3 * c] + ny * cellV[3 * c + 1] + nz * cellV[3 * c + 2];
            double d = nx * cellDir[3 * c] + ny * cellDir[3 * c + 1] + nz * cellDir[3 * c + 2];
            if (v > bv && d > 0) {
                bv = v;
                best = c;
            }
        }
        if (best < 0) return false;
        out[3 * s] = cellDir[3 * best];
        out[3 * s + 1] = cellDir[3 * best + 1];
        out[3 * s + 2] = cellDir[3 * best + 2];
        return true;
    }

    /** Cosine-weighted share of patch p seen by an unobstructed horizontal plane (the shares sum to 1). */
    public double horizontalShare(int p) { return horizontalShare[p]; }

    /** Solid angle of patch p, steradians (exact). */
    public double solidAngle(int p) {
        double s = 0;
        for (int c = patchFirstCell[p]; c < patchFirstCell[p + 1]; c++) s += cellW[c];
        return s;
    }

    /**
     * The radiance of every patch, normalised so that an unobstructed horizontal plane receives
     * {@code horizontalWm2}: {@code out[p] = horizontalWm2 x Lmean_p / sum_q (h_q Lmean_q)}, with
     * Lmean_p the patch's solid-angle-weighted mean of {@code radiance} and h_q
     * {@link #horizontalShare}. A plane then receives {@code sum_p share_p out[p]}. The radiance
     * of a cell is {@code max(0, gradation x indicatrix)} at its mean direction, (sx, sy, sz) the sun's
     * unit vector. A radiance that is 0 everywhere (or null) gives the uniform sky. Allocates one
     * array of row gradations.
     */
    public void normalised(SkyDistribution.Radiance radiance, double sx, double sy, double sz, double horizontalWm2,
                           double[] out) {
        double[] g = new double[rowCosZenith.length];
        if (radiance != null) for (int r = 0; r < g.length; r++) g[r] = radiance.gradation(rowCosZenith[r]);
        double total = 0;
        for (int p = 0; p < count; p++) {
            double s = 0, w = 0;
            if (radiance != null) {
                for (int c = patchFirstCell[p]; c < patchFirstCell[p + 1]; c++) {
                    double cg = sx * cellDir[3 * c] + sy * cellDir[3 * c + 1] + sz * cellDir[3 * c + 2];
                    s += cellW[c] * Math.max(0, g[cellRow[c]] * radiance.indicatrix(cg));
                    w += cellW[c];
                }
            }
            out[p] = w > 0 ? s / w : 0;
            total += horizontalShare[p] * out[p];
        }
        if (!(total > 0)) { // no radiance anywhere: the uniform sky
            java.util.Arrays.fill(out, 0, count, 1);
            total = 0;
            for (int p = 0; p < count; p++) total += horizontalShare[p];
        }
        double f = horizontalWm2 / total;
        for (int p = 0; p < count; p++) out[p] *= f;
    }
}
