package org.solmass.model;

/**
 * An immutable 3D vector or point in the model frame: metres, x east, y north, z up.
 * Plain value type for the non-hot code; kernels work on flat arrays instead.
 */
public record Vec3(double x, double y, double z) {
    public static final Vec3 ZERO = new Vec3(0, 0, 0);
    public static final Vec3 UP = new Vec3(0, 0, 1);

    public Vec3 plus(Vec3 o) { return new Vec3(x + o.x, y + o.y, z + o.z); }
    public Vec3 minus(Vec3 o) { return new Vec3(x - o.x, y - o.y, z - o.z); }
    public Vec3 times(double s) { return new Vec3(x * s, y * s, z * s); }
    public double dot(Vec3 o) { return x * o.x + y * o.y + z * o.z; }
    public Vec3 cross(Vec3 o) { return new Vec3(y * o.z - z * o.y, z * o.x - x * o.z, x * o.y - y * o.x); }
    public double length() { return Math.sqrt(x * x + y * y + z * z); }

    /** Unit vector in the same direction; the zero vector stays zero. */
    public Vec3 normalized() {
        double l = length();
        return l == 0 ? this : new Vec3(x / l, y / l, z / l);
    }

    /**
     * Unit direction from an azimuth (degrees from north, clockwise) and an elevation (degrees above
     * the horizon). Common practice for solar geometry with x east, y north, z up.
     */
    public static Vec3 fromAzimuthElevation(double azimuthDeg, double elevationDeg) {
        double a = Math.toRadians(azimuthDeg), e = Math.toRadians(elevationDeg);
        return new Vec3(Math.sin(a) * Math.cos(e), Math.cos(a) * Math.cos(e), Math.sin(e));
    }
}
