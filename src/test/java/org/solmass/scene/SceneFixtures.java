package org.solmass.scene;

import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;

/** Builds small massing models and patches by hand for the scene tests. */
final class SceneFixtures {
    private final List<double[]> tris = new ArrayList<>();
    private final List<Integer> blocks = new ArrayList<>();
    private int block = -1;

    /** Starts a new block; following triangles belong to it. */
    SceneFixtures block() {
        block++;
        return this;
    }

    /** One triangle, corners counter-clockwise seen from the front. */
    SceneFixtures triangle(double... xyz9) {
        tris.add(xyz9.clone());
        blocks.add(Math.max(0, block));
        return this;
    }

    /** Quad a,b,c,d counter-clockwise from the front, as two triangles. */
    SceneFixtures quad(double[] a, double[] b, double[] c, double[] d) {
        triangle(a[0], a[1], a[2], b[0], b[1], b[2], c[0], c[1], c[2]);
        return triangle(a[0], a[1], a[2], c[0], c[1], c[2], d[0], d[1], d[2]);
    }

    /** Closed axis-aligned box [x0,x1] x [y0,y1] x [z0,z1] with outward faces ({@link Boxes#closed}), as a new block. */
    SceneFixtures box(double x0, double y0, double z0, double x1, double y1, double z1) {
        block();
        for (double[][] f : Boxes.closed(x0, y0, z0, x1, y1, z1).faces()) quad(f[0], f[1], f[2], f[3]);
        return this;
    }

    /**
     * Closed prism over a convex footprint (x,y pairs, counter-clockwise seen from above) between
     * z0 and z1, outward faces, as a new block.
     */
    SceneFixtures prism(double[] xy, double z0, double z1) {
        block();
        int n = xy.length / 2;
        for (int i = 1; i + 1 < n; i++) {
            triangle(xy[0], xy[1], z1, xy[2 * i], xy[2 * i + 1], z1, xy[2 * i + 2], xy[2 * i + 3], z1);
            triangle(xy[0], xy[1], z0, xy[2 * i + 2], xy[2 * i + 3], z0, xy[2 * i], xy[2 * i + 1], z0);
        }
        for (int i = 0; i < n; i++) {
            int j = (i + 1) % n;
            double[] a = {xy[2 * i], xy[2 * i + 1], z0}, b = {xy[2 * j], xy[2 * j + 1], z0};
            double[] c = {xy[2 * j], xy[2 * j + 1], z1}, d = {xy[2 * i], xy[2 * i + 1], z1};
            quad(a, b, c, d);
        }
        return this;
    }

    int triangleCount() { return tris.size(); }

    MassingModel model() {
        int n = tris.size();
        double[] v = new double[9 * n];
        int[] t = new int[3 * n], tb = new int[n], tm = new int[n], tl = new int[n];
        List<String> names = new ArrayList<>();
        for (int b = 0; b <= Math.max(0, block); b++) names.add("B" + b);
        for (int i = 0; i < n; i++) {
            System.arraycopy(tris.get(i), 0, v, 9 * i, 9);
            t[3 * i] = 3 * i; t[3 * i + 1] = 3 * i + 1; t[3 * i + 2] = 3 * i + 2;
            tb[i] = blocks.get(i);
            tm[i] = -1;
        }
        return new MassingModel(null, names, List.of(), v, t, tb, tm, tl, 0);
    }

    /** A 1 m^2 patch at a point with a unit normal (kind by normal: up = roof, else facade). */
    static Patch patch(String id, double x, double y, double z, double nx, double ny, double nz) {
        Vec3 n = new Vec3(nx, ny, nz).normalized();
        double tilt = Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, n.z()))));
        double az = (Math.abs(n.x()) + Math.abs(n.y()) < 1e-12) ? 0
                : (Math.toDegrees(Math.atan2(n.x(), n.y())) + 360) % 360;
        SurfaceKind kind = n.z() > 0.7 ? SurfaceKind.ROOF : n.z() < -0.7 ? SurfaceKind.UNDERSIDE : SurfaceKind.FACADE;
        return new Patch(0, id, 0, "B0", 0, kind, new Vec3(x, y, z), n, 1.0, tilt, az, new double[0]);
    }
}
