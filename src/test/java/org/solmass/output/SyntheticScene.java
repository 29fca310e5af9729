package org.solmass.output;

import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;

/**
 * Test fixture: a few axis-aligned boxes (four walls and a roof each) as a MassingModel, with square
 * patches laid on their faces, and a synthetic per-patch value (not physics: a smooth function of the
 * normal and height, so the map has something to show).
 */
final class SyntheticScene {
    final List<String> blocks = new ArrayList<>();
    final List<Double> vertices = new ArrayList<>();
    final List<Integer> triangles = new ArrayList<>();
    final List<Integer> triangleBlock = new ArrayList<>();
    final List<Patch> patches = new ArrayList<>();
    final List<Boolean> analysed = new ArrayList<>();
    private final double patchM;

    SyntheticScene(double patchM) { this.patchM = patchM; }

    /** A box from (x0,y0,0) to (x1,y1,h); analysed boxes get patches on roof and walls. */
    SyntheticScene box(String name, double x0, double y0, double x1, double y1, double h, boolean analyse) {
        int b = blocks.size();
        blocks.add(name);
        analysed.add(analyse);
        // faces of Boxes.onGround as (first corner, edge u to the second, edge v to the fourth): u x v points outward
        for (double[][] f : Boxes.onGround(x0, y0, x1, y1, h).faces()) {
            Vec3 o = new Vec3(f[0][0], f[0][1], f[0][2]);
            face(b, analyse, o, new Vec3(f[1][0], f[1][1], f[1][2]).minus(o), new Vec3(f[3][0], f[3][1], f[3][2]).minus(o));
        }
        return this;
    }

    /**
     * A gable-roofed house rotated by {@code rotDeg} (counter-clockwise seen from above) about its
     * south-west corner: walls and both roof slopes get patches; the two gable triangles are faces of
     * the block without patches.
     */
    SyntheticScene gableHouse(String name, double x0, double y0, double length, double width, double eave, double ridge, double rotDeg) {
        int b = blocks.size();
        blocks.add(name);
        analysed.add(true);
        double c = Math.cos(Math.toRadians(rotDeg)), sn = Math.sin(Math.toRadians(rotDeg));
        Vec3 ex = new Vec3(c * length, sn * length, 0), ey = new Vec3(-sn * width, c * width, 0), up = new Vec3(0, 0, eave);
        Vec3 o = new Vec3(x0, y0, 0);
        Vec3 half = ey.times(0.5), rise = new Vec3(0, 0, ridge - eave);
        face(b, true, o, ex, up);                                        // long wall, front
        face(b, true, o.plus(ex).plus(ey), ex.times(-1), up);            // long wall, back
        face(b, true, o.plus(ex), ey, up);                               // end wall
        face(b, true, o.plus(ey), ey.times(-1), up);                     // other end wall
        face(b, true, o.plus(up), ex, half.plus(rise));                  // front slope
        face(b, true, o.plus(ex).plus(ey).plus(up), ex.times(-1), half.times(-1).plus(rise));  // back slope
        triangle(b, o.plus(ex).plus(up), o.plus(ex).plus(ey).plus(up), o.plus(ex).plus(half).plus(up).plus(rise));
        triangle(b, o.plus(ey).plus(up), o.plus(up), o.plus(half).plus(up).plus(rise));
        return this;
    }

    private void triangle(int block, Vec3 a, Vec3 b2, Vec3 c) {
        int base = vertices.size() / 3;
        for (Vec3 p : new Vec3[] {a, b2, c}) {
            vertices.add(p.x()); vertices.add(p.y()); vertices.add(p.z());
        }
        triangles.add(base); triangles.add(base + 1); triangles.add(base + 2);
        triangleBlock.add(block);
    }

    /** A flat ground face (a courtyard floor) at z = 0, analysed. */
    SyntheticScene groundFace(String name, double x0, double y0, double x1, double y1) {
        int b = blocks.size();
        blocks.add(name);
        analysed.add(true);
        face(b, true, new Vec3(x0, y0, 0), new Vec3(x1 - x0, 0, 0), new Vec3(0, y1 - y0, 0));
        return this;
    }

    private void face(int block, boolean analyse, Vec3 o, Vec3 u, Vec3 v) {
        int base = vertices.size() / 3;
        for (Vec3 p : new Vec3[] {o, o.plus(u), o.plus(u).plus(v), o.plus(v)}) {
            vertices.add(p.x()); vertices.add(p.y()); vertices.add(p.z());
        }
        int[] t = {base, base + 1, base + 2, base, base + 2, base + 3};
        for (int i : t) triangles.add(i);
        triangleBlock.add(block);
        triangleBlock.add(block);
        if (!analyse) return;
        Vec3 n = u.cross(v).normalized();
        SurfaceKind kind = n.z() > 0.3 ? (o.z() > 0.01 ? SurfaceKind.ROOF : SurfaceKind.GROUND) : SurfaceKind.FACADE;
        int nu = Math.max(1, (int) Math.ceil(u.length() / patchM - 1e-9)), nv = Math.max(1, (int) Math.ceil(v.length() / patchM - 1e-9));
        Vec3 du = u.times(1.0 / nu), dv = v.times(1.0 / nv);
        double tilt = Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, n.z()))));
        double az = Math.abs(n.z()) > 0.999 ? 0 : (Math.toDegrees(Math.atan2(n.x(), n.y())) + 360) % 360;
        int surface = (int) patches.stream().map(Patch::surface).distinct().count();
        for (int i = 0; i < nu; i++) {
            for (int j = 0; j < nv; j++) {
                Vec3 c0 = o.plus(du.times(i)).plus(dv.times(j));
                Vec3 c1 = c0.plus(du), c2 = c1.plus(dv), c3 = c0.plus(dv);
                double[] outline = {c0.x(), c0.y(), c0.z(), c1.x(), c1.y(), c1.z(), c2.x(), c2.y(), c2.z(), c3.x(), c3.y(), c3.z()};
                Vec3 c = c0.plus(c2).times(0.5);
                int idx = patches.size();
                String id = String.format(java.util.Locale.ROOT, "B%d-S%d-P%04d", block, surface, i * nv + j);
                patches.add(new Patch(idx, id, block, blocks.get(block), surface, kind, c, n,
                        du.length() * dv.length(), tilt, az, outline));
            }
        }
    }

    MassingModel model() {
        int nt = triangles.size() / 3;
        return new MassingModel(null, List.copyOf(blocks), List.of(),
                vertices.stream().mapToDouble(Double::doubleValue).toArray(),
                triangles.stream().mapToInt(Integer::intValue).toArray(),
                triangleBlock.stream().mapToInt(Integer::intValue).toArray(),
                new int[nt], new int[nt], 0);
    }

    boolean[] analysedBlocks() {
        boolean[] a = new boolean[analysed.size()];
        for (int i = 0; i < a.length; i++) a[i] = analysed.get(i);
        return a;
    }

    /** Synthetic values, kWh/m2 (not physics): roofs high, south walls higher than north, rising with height. */
    double[] values() {
        double[] v = new double[patches.size()];
        for (Patch p : patches) {
            Vec3 n = p.normal();
            v[p.index()] = 250 + 800 * Math.max(0, n.z()) + 450 * Math.max(0, -n.y()) + 150 * Math.max(0, -n.x())
                    + 12 * p.centroid().z();
        }
        return v;
    }

    /** A courtyard block with a tower and two context neighbours. */
    static SyntheticScene district(double patchM) {
        return new SyntheticScene(patchM)
                .box("North wing", 0, 30, 40, 40, 21, true)
                .box("South wing", 0, 0, 40, 8, 12, true)
                .box("West wing", 0, 8, 10, 30, 15, true)
                .box("Tower", 30, 8, 40, 18, 45, true)
                .groundFace("Courtyard", 10, 8, 30, 30)
                .box("Neighbour east", 52, 0, 70, 40, 18, false)
                .box("Neighbour south", -5, -30, 45, -16, 24, false);
    }
}
