package org.solmass.viewer;

/**
 * Conversion from the model frame (metres, x east, y north, z up, possibly large map coordinates)
 * to the JavaFX scene frame (x right, y down, z into the screen), centred on the site so floats keep
 * centimetre precision: fx = x - cx, fy = -(z - cz), fz = y - cy. This is a proper rotation (no
 * mirror), so east stays to the right of north seen from above.
 *
 * @param cx site centre x, metres
 * @param cy site centre y, metres
 * @param cz ground level z, metres
 * @param radiusM half the diagonal of the model's bounding box, metres
 */
public record SceneFrame(double cx, double cy, double cz, double radiusM) {

    /** Frame centred on the bounds {minX, minY, minZ, maxX, maxY, maxZ}. */
    public static SceneFrame of(double[] b) {
        double dx = b[3] - b[0], dy = b[4] - b[1], dz = b[5] - b[2];
        double r = 0.5 * Math.sqrt(dx * dx + dy * dy + dz * dz);
        return new SceneFrame((b[0] + b[3]) / 2, (b[1] + b[4]) / 2, b[2], Math.max(r, 1));
    }

    public float fx(double x) { return (float) (x - cx); }

    public float fy(double z) { return (float) -(z - cz); }

    public float fz(double y) { return (float) (y - cy); }

    /** Scene point {fx, fy, fz} of a model direction (east, north, up) scaled by length. */
    public static double[] direction(double east, double north, double up) { return new double[] {east, -up, north}; }
}
