package org.solmass.terrain;

/**
 * The far horizon seen from a point, computed from a DEM by marching outward along each azimuth and
 * keeping the highest elevation angle of the terrain:
 * {@code elevation(d) = atan((z(d) - c(d) - z_eye) / d)}, with the drop of the terrain below the
 * eye's tangent plane by the earth's curvature, lessened by atmospheric refraction,
 * {@code c(d) = d^2 / (2 R) (1 - k)}, R = 6 371 000 m (mean earth radius) and k = 0.13, the
 * coefficient of terrestrial refraction (the combined curvature and refraction correction of
 * trigonometric levelling and of viewshed analysis: common practice in geodesy, e.g. the
 * "curvature/refraction" correction of GIS viewshed tools; k = 0.13 from memory, Gauss's value).
 * Terrain below the horizontal counts as 0 (the profile holds elevations in [0, 90)).
 *
 * <p>Along each azimuth the DEM is sampled (bilinear) every half sample spacing from {@code fromM}
 * to the edge of the grid; nodata samples are skipped.
 */
public final class DemHorizon {
    /** Mean earth radius, metres (IUGG). */
    public static final double EARTH_RADIUS_M = 6_371_000;
    /** Coefficient of terrestrial refraction (common practice). */
    public static final double REFRACTION_K = 0.13;

    private DemHorizon() {}

    /** Drop of the terrain at distance d below the tangent plane, curvature less refraction, metres. */
    public static double curvatureDropM(double dM) {
        return dM * dM / (2 * EARTH_RADIUS_M) * (1 - REFRACTION_K);
    }

    /**
     * @param dem the terrain
     * @param east easting of the eye, metres (DEM grid)
     * @param north northing of the eye, metres
     * @param eyeZ height of the eye, metres (the DEM's vertical datum)
     * @param fromM distance from which terrain counts, metres (nearer terrain is in the scene)
     * @param azimuths number of equally spaced azimuths (from north, clockwise)
     * @return elevation per azimuth {@code i 360/azimuths}, degrees
     */
    public static double[] elevationsDeg(Dem dem, double east, double north, double eyeZ, double fromM, int azimuths) {
        double step = Math.min(dem.dx(), dem.dy()) / 2;
        double start = Math.max(fromM, step);
        double[] out = new double[azimuths];
        for (int a = 0; a < azimuths; a++) {
            double az = Math.toRadians(a * 360.0 / azimuths), sx = Math.sin(az), sy = Math.cos(az);
            double best = 0; // tan of the highest elevation so far, never below the horizontal
            for (double d = start; ; d += step) {
                double x = east + d * sx, y = north + d * sy;
                if (!dem.covers(x, y)) break;
                double z = dem.heightAt(x, y);
                if (Double.isNaN(z)) continue;
                double t = (z - curvatureDropM(d) - eyeZ) / d;
                if (t > best) best = t;
            }
            out[a] = Math.toDegrees(Math.atan(best));
        }
        return out;
    }
}
