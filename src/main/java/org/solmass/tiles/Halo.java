package org.solmass.tiles;

import org.solmass.irradiation.SunDirections;

/**
 * The halo of a tile: how far around it obstructing geometry must be loaded so that every sun
 * direction the run counts is shaded as in the whole model. A block of height H above the lowest
 * receiver z_min, at horizontal distance d, can hide the sun at elevation alpha only if
 * {@code tan(alpha) <= (H - z_min) / d}; so beyond
 * <pre>  R = (H_max - z_min) / tan(alpha_min)</pre>
 * no block hides any sun direction at or above alpha_min (plain trigonometry; the same bound as the
 * usual "shadow length = height / tan(elevation)", common practice). At 100 m and 5 degrees,
 * R = 100 / tan(5 deg) = 1143 m. Sky diffuse and reflection see farther (down to the horizon): the
 * far horizon ({@link FarHorizon}) stands for that.
 */
public final class Halo {
    private Halo() {}

    /**
     * @param tallestM the highest point of the model, metres
     * @param lowestM the lowest receiver height (the ground level), metres
     * @param minSunElevationDeg the lowest sun elevation counted, degrees (above 0)
     * @return the halo radius, metres; 0 when nothing stands above {@code lowestM}; infinite without a sun above the horizon
     */
    public static double radiusM(double tallestM, double lowestM, double minSunElevationDeg) {
        double h = tallestM - lowestM;
        if (!(h > 0)) return 0;
        if (!(minSunElevationDeg > 0)) return Double.POSITIVE_INFINITY;
        return h / Math.tan(Math.toRadians(minSunElevationDeg));
    }

    /** The lowest elevation of the sun directions above the horizon, degrees (NaN when none is). */
    public static double lowestSunElevationDeg(SunDirections sun) {
        double min = Double.NaN;
        for (int d = 0; d < sun.count(); d++) {
            double z = sun.direction(d).z();
            if (z <= 0) continue;
            double e = Math.toDegrees(Math.asin(Math.min(1, z)));
            if (Double.isNaN(min) || e < min) min = e;
        }
        return min;
    }
}
