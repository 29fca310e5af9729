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
     * Per sector i, the tangents at its two samples and the slopes of tan(elevation) in the sector's
     * fraction f at either end: {t0, t1, t0', t1'} at {@code 4 i} (see {@link #obstructs}); null where
     * the sector test is not used.
     */
    private final double[] sectorTan;

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
    /** Bound on the error of {@link #sectorPosition}'s azimuth used by {@link #obstructs}, degrees: 1e-5 rad (5.73e-4 degrees) rounded up. */
    static final double AZIMUTH_ERROR_DEG = 1e-3;

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
            sectorTan = new double[4 * n];
            for (int i = 0; i < n; i++) {
                double e0 = elevationDeg[i], e1 = elevationDeg[(i + 1) % n], d = Math.toRadians(e1 - e0);
                double t0 = Math.tan(Math.toRadians(e0)), t1 = Math.tan(Math.toRadians(e1));
                sectorTan[4 * i] = t0;
                sectorTan[4 * i + 1] = t1;
                sectorTan[4 * i + 2] = d * (1 + t0 * t0); // d tan(e(f)) / df = (e1 - e0) sec^2(e), in radians
                sectorTan[4 * i + 3] = d * (1 + t1 * t1);
            }
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
            sectorTan = null;
        }
    }

    /**
     * The azimuth of (dx, dy) from north, clockwise, in sample steps (sector and fraction, 0 to n),
     * from an arc tangent within 1e-5 rad (Abramowitz and Stegun, Handbook of Mathematical Functions,
     * 4.4.49: a degree-9 odd polynomial on [0, 1]); (dx, dy) not both zero.
     */
    private double sectorPosition(double dx, double dy) {
        double ax = Math.abs(dx), ay = Math.abs(dy);
        boolean steep = ax > ay;
        double t = steep ? ay / ax : ax / ay, t2 = t * t;
        double at = t * (0.9998660 + t2 * (-0.3302995 + t2 * (0.1801410 + t2 * (-0.0851330 + t2 * 0.0208351))));
        double fromY = steep ? Math.PI / 2 - at : at; // angle from the +y or -y axis towards x, radians
        double az = dy >= 0 ? (dx >= 0 ? fromY : 2 * Math.PI - fromY) : (dx >= 0 ? Math.PI - fromY : Math.PI + fromY);
        return Math.toDegrees(az) / stepDeg;
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
            if (sectorHi != null) {
                int n = sectorHi.length;
                double pos = sectorPosition(dx, dy);
                int i = (int) pos;
                double f = pos - i, df = AZIMUTH_ERROR_DEG / stepDeg;
                if (i >= n) i -= n;
                if (f > df && f < 1 - df) {
                    // inside one sector for sure, at fraction f within df: tan of the profile there lies
                    // under the chord between the samples' tangents and over the tangent lines at both
                    // ends (tan(e(f)) is convex in f: e is linear in f, tan convex on [0, 90) degrees)
                    int o = 4 * i;
                    double t0 = sectorTan[o], t1 = sectorTan[o + 1];
                    double p0 = sectorTan[o + 2], p1 = sectorTan[o + 3];
                    // each bound where f's uncertainty puts it lowest (lower bounds) or highest (the chord)
                    double hi = t0 + (t1 - t0) * (t1 >= t0 ? f + df : f - df);
                    double lo = Math.max(t0 + p0 * (p0 >= 0 ? f - df : f + df), t1 - p1 * (1 - (p1 >= 0 ? f - df : f + df)));
                    // a bound far smaller than its terms may have lost its relative precision: not used
                    if (t0 == 0 && t1 == 0) return false; // a flat 0 sector: every rising direction is open
                    if (hi > 1e-4 * (t0 + t1) && z2 > s * hi * hi * (1 + SQUARE_MARGIN)) return false;
                    if (lo > 1e-4 * (t0 + t1 + Math.abs(p0) + Math.abs(p1)) && lo * lo >= TAN2_LOW
                            && z2 < s * lo * lo * (1 - SQUARE_MARGIN)) return true;
                } else { // next to a sample azimuth: the bracket of the samples around it
                    if (f >= 0.5) i = i + 1 == n ? 0 : i + 1; // the sample nearest: its sector's bracket covers both sides
                    if (z2 > s * sectorHi[i]) return false;
                    if (z2 < s * sectorLo[i]) return true;
                }
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
