package org.solmass.scene;

import java.util.Arrays;

/**
 * A far horizon: the elevation angle of distant terrain (or a distant city) per azimuth, seen from
 * the site. Directions that leave the scene below it are obstructed.
 *
 * <p>Sampled at {@code n} equally spaced azimuths {@code a_i = i 360/n} degrees from north,
 * clockwise; between samples the elevation is interpolated linearly in azimuth (wrapping at 360).
 * The profile is taken as the same for every point of the site (the distance to the horizon is large
 * against the site: common practice for far-horizon shading).
 */
public final class HorizonProfile {
    /** No far horizon: every direction above the geometric horizon is open. */
    public static final HorizonProfile NONE = new HorizonProfile(new double[]{0});

    private final double[] elevationDeg;
    private final double stepDeg;
    private final double maxDeg;
    /** tan of {@link #maxDeg}: directions steeper than this need no azimuth lookup. */
    private final double tanMax;
    /**
     * The squares of the tangents of the highest and lowest elevation, widened by {@link #SQUARE_MARGIN}
     * (-1 and 0 where too small to compare safely or the profile too steep: no quick answer from them):
     * see {@link #obstructs}.
     */
    private final double tan2MaxUp, tan2MinDown;
    /**
     * Per sector i (azimuths from sample i to sample i + 1), the same squares over samples i - 1 to
     * i + 2 (one sector more either side, for the approximate azimuth of {@link #sector}); null where
     * not used (one sample, or sectors narrower than {@link #SECTOR_MIN_DEG}).
     */
    private final double[] sectorHi, sectorLo;

    /**
     * Relative margin of the square test in {@link #obstructs}: far above the rounding of the few
     * floating-point operations on either side (each within 2^-53 relative, {@code Math.hypot} and
     * {@code Math.tan} within one ulp; tan amplifies the angle's relative error by at most
     * 1/(sin a cos a), under 10^4 for elevations up to 89.99 degrees; steeper profiles take the lookup alone), far below any angle that matters.
     */
    static final double SQUARE_MARGIN = 1e-9;
    /** Squares and their products are compared only between these bounds, where rounding is relative (no underflow or overflow). */
    private static final double SQUARE_LOW = 1e-200, SQUARE_HIGH = 1e200, TAN2_LOW = 1e-100;
    /**
     * Narrowest sector for which the sector test is used: 50 times the error bound of the azimuth
     * {@link #sector} computes (1e-5 rad, 5.8e-4 degrees), so that it lands in the right sector or
     * a neighbour, both covered by the sector's bracket.
     */
    static final double SECTOR_MIN_DEG = 0.03;

    /**
     * @param elevationDeg elevation angle at azimuths {@code i 360/n}, degrees, each in [0, 90)
     */
    public HorizonProfile(double[] elevationDeg) {
        if (elevationDeg.length == 0) throw new IllegalArgumentException("a horizon profile needs at least one azimuth");
        this.elevationDeg = elevationDeg.clone();
        double max = 0;
        for (int i = 0; i < elevationDeg.length; i++) {
            double e = elevationDeg[i];
            if (!(e >= 0 && e < 90))
                throw new IllegalArgumentException("horizon elevation at azimuth " + i * 360.0 / elevationDeg.length
                        + " deg must lie in [0, 90) degrees: " + e);
            max = Math.max(max, e);
        }
        this.stepDeg = 360.0 / elevationDeg.length;
        this.maxDeg = max;
        this.tanMax = Math.tan(Math.toRadians(max));
        double min = Arrays.stream(elevationDeg).min().orElse(0), tanMin = Math.tan(Math.toRadians(min));
        boolean squares = max <= 89.99; // the amplification bound of SQUARE_MARGIN
        this.tan2MaxUp = squares && tanMax * tanMax >= TAN2_LOW ? tanMax * tanMax * (1 + SQUARE_MARGIN) : -1;
        this.tan2MinDown = squares && tanMin * tanMin >= TAN2_LOW ? tanMin * tanMin * (1 - SQUARE_MARGIN) : 0;
        int n = elevationDeg.length;
        if (squares && n > 1 && stepDeg >= SECTOR_MIN_DEG && tan2MaxUp > 0) {
            sectorHi = new double[n];
            sectorLo = new double[n];
            for (int i = 0; i < n; i++) {
                double hi = 0, lo = 90;
                for (int k = -1; k <= 2; k++) {
                    double e = elevationDeg[Math.floorMod(i + k, n)];
                    hi = Math.max(hi, e);
                    lo = Math.min(lo, e);
                }
                double th = Math.tan(Math.toRadians(hi)), tl = Math.tan(Math.toRadians(lo));
                // hi 0: the four samples are 0, so is the profile between them (every rising direction is open);
                // a tangent too small to square safely decides nothing (+infinity)
                sectorHi[i] = hi == 0 ? 0 : th * th >= TAN2_LOW ? th * th * (1 + SQUARE_MARGIN) : Double.POSITIVE_INFINITY;
                sectorLo[i] = tl * tl >= TAN2_LOW ? tl * tl * (1 - SQUARE_MARGIN) : 0;
            }
        } else {
            sectorHi = sectorLo = null;
        }
    }

    /**
     * The sector (0 to n - 1) of the azimuth of (dx, dy) from north, clockwise, from an arc tangent
     * within 1e-5 rad (Abramowitz and Stegun, Handbook of Mathematical Functions, 4.4.49: a degree-9
     * odd polynomial on [0, 1]); (dx, dy) not both zero. It may name a neighbour of the exact sector
     * next to a sample azimuth.
     */
    private int sector(double dx, double dy) {
        double ax = Math.abs(dx), ay = Math.abs(dy);
        boolean steep = ax > ay;
        double t = steep ? ay / ax : ax / ay, t2 = t * t;
        double at = t * (0.9998660 + t2 * (-0.3302995 + t2 * (0.1801410 + t2 * (-0.0851330 + t2 * 0.0208351))));
        double fromY = steep ? Math.PI / 2 - at : at; // angle from the +y or -y axis towards x, radians
        double az = dy >= 0 ? (dx >= 0 ? fromY : 2 * Math.PI - fromY) : (dx >= 0 ? Math.PI - fromY : Math.PI + fromY);
        int i = (int) (Math.toDegrees(az) / stepDeg);
        int n = sectorHi.length;
        return i >= n ? i - n : Math.max(0, i);
    }

    /** The same elevation in every direction. */
    public static HorizonProfile constant(double elevationDeg) {
        return new HorizonProfile(new double[]{elevationDeg});
    }

    /** True when the profile obstructs nothing. */
    public boolean isNone() { return maxDeg == 0; }

    /** Highest elevation of the profile, degrees. */
    public double maxElevationDeg() { return maxDeg; }

    /** Number of azimuth samples. */
    public int size() { return elevationDeg.length; }

    /** The sampled elevations, degrees (a copy). */
    public double[] elevationsDeg() { return elevationDeg.clone(); }

    /** Elevation of the horizon at an azimuth (degrees from north, clockwise), degrees. */
    public double elevationDegAt(double azimuthDeg) {
        int n = elevationDeg.length;
        if (n == 1) return elevationDeg[0];
        double a = ((azimuthDeg % 360) + 360) % 360 / stepDeg;
        int i = (int) Math.floor(a);
        double f = a - i;
        i %= n;
        return elevationDeg[i] * (1 - f) + elevationDeg[(i + 1) % n] * f;
    }

    /**
     * Whether a direction (x east, y north, z up; need not be unit length) lies at or below the
     * horizon. Directions pointing down are always below.
     */
    public boolean obstructs(double dx, double dy, double dz) {
        if (dz <= 0) return true;
        if (maxDeg == 0) return false;
        // Most directions lie clearly above the profile's highest point or below its lowest: decided
        // on the squares (no square root, arc tangent or table), with a relative margin that keeps
        // every answer that of the lookup below (see SQUARE_MARGIN); the rest go to the lookup.
        double s = dx * dx + dy * dy, z2 = dz * dz;
        if (tan2MaxUp > 0 && z2 > SQUARE_LOW && z2 < SQUARE_HIGH && s > SQUARE_LOW && s < SQUARE_HIGH) {
            if (z2 > s * tan2MaxUp) return false;
            if (z2 < s * tan2MinDown) return true;
            if (sectorHi != null) { // the same on the sector's bracket
                int i = sector(dx, dy);
                if (z2 > s * sectorHi[i]) return false;
                if (z2 < s * sectorLo[i]) return true;
            }
        }
        return obstructsByLookup(dx, dy, dz);
    }

    /** {@link #obstructs} by the azimuth lookup alone, for directions with dz > 0 (the reference the square test keeps to). */
    boolean obstructsByLookup(double dx, double dy, double dz) {
        double h = Math.hypot(dx, dy);
        if (dz > h * tanMax) return false; // above the highest point: no lookup
        double az = Math.toDegrees(Math.atan2(dx, dy));
        return dz <= h * Math.tan(Math.toRadians(elevationDegAt(az)));
    }

    @Override public String toString() {
        return "HorizonProfile" + (elevationDeg.length == 1 ? "(constant " + elevationDeg[0] + " deg)"
                : "(" + elevationDeg.length + " azimuths, max " + maxDeg + " deg)");
    }

    @Override public boolean equals(Object o) {
        return o instanceof HorizonProfile h && Arrays.equals(h.elevationDeg, elevationDeg);
    }

    @Override public int hashCode() { return Arrays.hashCode(elevationDeg); }
}
