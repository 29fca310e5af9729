package org.solmass.surface;

import org.solmass.model.Vec3;

/**
 * A right-handed 2D frame in a surface's plane: {@code u x v = normal}. Local coordinates are metres.
 * Conventions: {@code u} is horizontal; for a surface facing up {@code u} = east and {@code v} runs up
 * the slope (north for a horizontal roof or ground); for a facade {@code u} runs along the wall (to
 * the right when seen from the front) and {@code v} is up; for a horizontal underside {@code u} = east
 * and {@code v} = south (so that polygons stay counter-clockwise seen from the front side).
 *
 * @param origin the point of local (0, 0), metres, on the plane
 * @param u unit horizontal axis
 * @param v unit axis, {@code normal x u}
 * @param normal unit front-side normal
 */
public record SurfaceFrame(Vec3 origin, Vec3 u, Vec3 v, Vec3 normal) {

    /** Horizontal-part length below which a normal counts as exactly vertical (up or down). */
    static final double VERTICAL_NORMAL_EPS = 1e-9;

    /** The frame for a unit normal with the given origin. */
    public static SurfaceFrame of(Vec3 normal, Vec3 origin) {
        Vec3 n = normal.normalized();
        double h = Math.hypot(n.x(), n.y());
        Vec3 u = h < VERTICAL_NORMAL_EPS ? new Vec3(1, 0, 0) : Vec3.UP.cross(n).normalized();
        Vec3 v = n.cross(u).normalized();
        return new SurfaceFrame(origin, u, v, n);
    }

    /** The same axes with another origin. */
    public SurfaceFrame withOrigin(Vec3 o) { return new SurfaceFrame(o, u, v, normal); }

    /** World point of local (x, y). */
    public Vec3 toWorld(double x, double y) {
        return new Vec3(origin.x() + u.x() * x + v.x() * y, origin.y() + u.y() * x + v.y() * y,
                origin.z() + u.z() * x + v.z() * y);
    }

    /** Local x of a world point (projected onto the plane). */
    public double localX(double px, double py, double pz) {
        return (px - origin.x()) * u.x() + (py - origin.y()) * u.y() + (pz - origin.z()) * u.z();
    }

    /** Local y of a world point (projected onto the plane). */
    public double localY(double px, double py, double pz) {
        return (px - origin.x()) * v.x() + (py - origin.y()) * v.y() + (pz - origin.z()) * v.z();
    }
}
