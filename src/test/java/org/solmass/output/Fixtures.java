package org.solmass.output;

import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

/** Small hand-made patches for the writer tests. */
final class Fixtures {
    private Fixtures() {}

    static Patch patch(int index, String id, int block, String blockName, SurfaceKind kind, double area) {
        Vec3 n = kind == SurfaceKind.FACADE ? new Vec3(0, -1, 0) : Vec3.UP;
        double tilt = kind == SurfaceKind.FACADE ? 90 : 0, az = kind == SurfaceKind.FACADE ? 180 : 0;
        double s = Math.sqrt(area);
        Vec3 c = new Vec3(index * 1.25 + 0.3333333, -7.0 / 3, 10.0 + index);
        double[] outline = {c.x() - s / 2, c.y() - s / 2, c.z(), c.x() + s / 2, c.y() - s / 2, c.z(),
                c.x() + s / 2, c.y() + s / 2, c.z(), c.x() - s / 2, c.y() + s / 2, c.z()};
        return new Patch(index, id, block, blockName, index % 3, kind, c, n, area, tilt, az, outline);
    }
}
