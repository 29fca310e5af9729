package org.solmass.output;

import org.solmass.model.Vec3;

/**
 * An orthographic view for the map: screen right and up as model directions, and the unit direction
 * towards the viewer (depth grows towards the viewer).
 */
record MapView(Vec3 right, Vec3 up, Vec3 toViewer) {
    /** A view looking from direction {@code eye} (unit vector towards the viewer) at the model. */
    static MapView looking(Vec3 eye) {
        Vec3 v = eye.normalized();
        if (Math.abs(v.z()) > 0.999999) return new MapView(new Vec3(1, 0, 0), new Vec3(0, 1, 0), Vec3.UP);
        Vec3 r = Vec3.UP.cross(v).normalized();
        return new MapView(r, v.cross(r).normalized(), v);
    }
}
