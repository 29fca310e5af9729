package org.solmass.irradiation;

import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;

import java.util.ArrayList;
import java.util.List;

/** Small massing models built in code for the pipeline tests: boxes, free quads and ground faces. */
final class TestModels {
    private final List<String> blocks = new ArrayList<>();
    private final List<double[]> verts = new ArrayList<>();
    private final List<int[]> tris = new ArrayList<>();
    private final List<Integer> triBlock = new ArrayList<>();

    /** A box without a bottom face, on z = 0 ({@link Boxes#onGround}). */
    TestModels box(String name, double x0, double y0, double x1, double y1, double h) {
        int b = block(name);
        for (double[][] f : Boxes.onGround(x0, y0, x1, y1, h).faces()) quad(b, f[0], f[1], f[2], f[3]);
        return this;
    }

    /** A horizontal face at height z facing up (a roof slab or, at the lowest level, a ground face). */
    TestModels slab(String name, double x0, double y0, double x1, double y1, double z) {
        int b = block(name);
        quad(b, new double[] {x0, y0, z}, new double[] {x1, y0, z}, new double[] {x1, y1, z}, new double[] {x0, y1, z});
        return this;
    }

    /** Any planar quad, counter-clockwise seen from its front. */
    TestModels quad(String name, double[] a, double[] b, double[] c, double[] d) {
        quad(block(name), a, b, c, d);
        return this;
    }

    private int block(String name) {
        int i = blocks.indexOf(name);
        if (i >= 0) return i;
        blocks.add(name);
        return blocks.size() - 1;
    }

    private void quad(int b, double[] p0, double[] p1, double[] p2, double[] p3) {
        int base = verts.size();
        verts.add(p0);
        verts.add(p1);
        verts.add(p2);
        verts.add(p3);
        tris.add(new int[] {base, base + 1, base + 2});
        tris.add(new int[] {base, base + 2, base + 3});
        triBlock.add(b);
        triBlock.add(b);
    }

    MassingModel build() {
        double[] v = new double[verts.size() * 3];
        for (int i = 0; i < verts.size(); i++) System.arraycopy(verts.get(i), 0, v, 3 * i, 3);
        int[] t = new int[tris.size() * 3], tb = new int[tris.size()], tm = new int[tris.size()], tl = new int[tris.size()];
        for (int i = 0; i < tris.size(); i++) {
            System.arraycopy(tris.get(i), 0, t, 3 * i, 3);
            tb[i] = triBlock.get(i);
            tm[i] = -1;
        }
        return new MassingModel(null, List.copyOf(blocks), List.of(), v, t, tb, tm, tl, 0);
    }
}
