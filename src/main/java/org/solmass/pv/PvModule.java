package org.solmass.pv;

import org.solmass.model.Vec3;

/**
 * One placed module: a rectangle in space. Its bypass-diode substrings are strips along
 * {@code lengthAxis}, side by side across {@code widthAxis} ({@link ModuleSpec}).
 *
 * @param zone the PV zone it belongs to (1-based)
 * @param corner one corner, world metres
 * @param lengthAxis from {@code corner} along the long side, length = module length, metres
 * @param widthAxis from {@code corner} along the short side, length = module width, metres
 * @param normal unit front-side normal
 * @param racked on a rack (part of the ray scene) rather than flush on its surface
 */
public record PvModule(int zone, Vec3 corner, Vec3 lengthAxis, Vec3 widthAxis, Vec3 normal, boolean racked) {

    /** World point at fractions {@code fl} of the length and {@code fw} of the width, both in [0, 1]. */
    public Vec3 at(double fl, double fw) {
        return corner.plus(lengthAxis.times(fl)).plus(widthAxis.times(fw));
    }

    /** Tilt of the module plane from horizontal, degrees. */
    public double tiltDeg() { return Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, normal.z())))); }

    /** Azimuth the module faces, degrees from north clockwise (0 for a horizontal module). */
    public double azimuthDeg() {
        if (Math.hypot(normal.x(), normal.y()) < 1e-9) return 0;
        double a = Math.toDegrees(Math.atan2(normal.x(), normal.y()));
        return a < 0 ? a + 360 : a;
    }

    /** The four corners in order around the rectangle, world metres. */
    public Vec3[] corners() {
        return new Vec3[] {corner, corner.plus(lengthAxis), corner.plus(lengthAxis).plus(widthAxis), corner.plus(widthAxis)};
    }

    /** Two triangles (9 floats each), for the ray scene. */
    public void triangles(float[] out, int offset) {
        Vec3[] c = corners();
        int[] order = {0, 1, 2, 0, 2, 3};
        for (int i = 0; i < 6; i++) {
            out[offset + 3 * i] = (float) c[order[i]].x();
            out[offset + 3 * i + 1] = (float) c[order[i]].y();
            out[offset + 3 * i + 2] = (float) c[order[i]].z();
        }
    }
}
