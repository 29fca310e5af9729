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
