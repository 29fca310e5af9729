package org.solmass.bench;

import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.scene.HemisphereSampler;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * An invented, seeded district for benchmarks (not a real place): a square grid of 40 m plots, each
 * with one box block of random footprint (15-34 m a side) and height (2-20 storeys of 3 m, skewed
 * low), facades split into storey bands (as floor-by-floor massing exports are), about a third of the
 * low blocks with a 35 degree gable roof. About 60 triangles per block: 1,000 blocks give ~60,000.
 */
public final class SyntheticDistrict {
    public static final double PLOT_M = 40, STOREY_M = 3;

    private final List<double[]> tris = new ArrayList<>();
    private final List<Integer> blockOf = new ArrayList<>();
    private final List<String> names = new ArrayList<>();
    private final MassingModel model;

    private SyntheticDistrict(int blocks, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        int side = (int) Math.ceil(Math.sqrt(blocks));
        for (int b = 0; b < blocks; b++) {
            names.add("block-" + b);
            double w = r.nextDouble(15, 34), d = r.nextDouble(15, 34);
            double x0 = (b % side) * PLOT_M + r.nextDouble(0, PLOT_M - w), y0 = (b / side) * PLOT_M + r.nextDouble(0, PLOT_M - d);
            int storeys = 2 + (int) Math.floor(18 * Math.pow(r.nextDouble(), 2));
            double h = storeys * STOREY_M;
            boolean pitched = storeys <= 5 && r.nextInt(3) == 0;
            addBlock(b, x0, y0, x0 + w, y0 + d, storeys, h, pitched);
        }
        int n = tris.size();
        double[] v = new double[9 * n];
        int[] t = new int[3 * n], tb = new int[n], tm = new int[n], tl = new int[n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(tris.get(i), 0, v, 9 * i, 9);
            for (int k = 0; k < 3; k++) t[3 * i + k] = 3 * i + k;
            tb[i] = blockOf.get(i);
            tm[i] = -1;
        }
        model = new MassingModel(null, List.copyOf(names), List.of(), v, t, tb, tm, tl, 0);
    }

    /** The district with {@code blocks} blocks (positive) from {@code seed}. */
    public static MassingModel generate(int blocks, long seed) {
        if (blocks < 1) throw new IllegalArgumentException("blocks must be positive");
        return new SyntheticDistrict(blocks, seed).model;
    }

    private void addBlock(int b, double x0, double y0, double x1, double y1, int storeys, double h, boolean pitched) {
        double[][] ring = {{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}};
        for (int s = 0; s < storeys; s++) {
            double za = s * STOREY_M, zb = (s + 1) * STOREY_M;
            for (int i = 0; i < 4; i++) {
                double[] p = ring[i], q = ring[(i + 1) % 4];
                quad(b, new double[] {p[0], p[1], za}, new double[] {q[0], q[1], za},
                        new double[] {q[0], q[1], zb}, new double[] {p[0], p[1], zb});
            }
        }
        if (!pitched) {
            quad(b, new double[] {x0, y0, h}, new double[] {x1, y0, h}, new double[] {x1, y1, h}, new double[] {x0, y1, h});
            return;
        }
        double ym = (y0 + y1) / 2, ridge = h + (y1 - y0) / 2 * Math.tan(Math.toRadians(35));
        quad(b, new double[] {x0, y0, h}, new double[] {x1, y0, h}, new double[] {x1, ym, ridge}, new double[] {x0, ym, ridge});
        quad(b, new double[] {x1, y1, h}, new double[] {x0, y1, h}, new double[] {x0, ym, ridge}, new double[] {x1, ym, ridge});
        tri(b, new double[] {x1, y0, h}, new double[] {x1, y1, h}, new double[] {x1, ym, ridge}); // east gable
        tri(b, new double[] {x0, y1, h}, new double[] {x0, y0, h}, new double[] {x0, ym, ridge}); // west gable
    }

    private void quad(int b, double[] p, double[] q, double[] r, double[] s) {
        tri(b, p, q, r);
        tri(b, p, r, s);
    }

    private void tri(int b, double[] p, double[] q, double[] r) {
        tris.add(new double[] {p[0], p[1], p[2], q[0], q[1], q[2], r[0], r[1], r[2]});
        blockOf.add(b);
    }

    /**
     * {@code count} patch-like sample points on random triangles of the model (chosen with
     * probability proportional to area): centroid = a random point of the triangle, normal = its face
     * normal, area 1 m^2, id from the triangle and sample number.
     */
    public static List<Patch> samplePatches(MassingModel m, int count, long seed) {
        int n = m.triangleCount();
        double[] cum = new double[n];
        double total = 0;
        for (int t = 0; t < n; t++) {
            Vec3 a = m.vertex(t, 0), e1 = m.vertex(t, 1).minus(a), e2 = m.vertex(t, 2).minus(a);
            total += e1.cross(e2).length() / 2;
            cum[t] = total;
        }
        SplittableRandom r = new SplittableRandom(seed);
        List<Patch> out = new ArrayList<>(count);
        for (int i = 0; i < count; i++) {
            int t = java.util.Arrays.binarySearch(cum, r.nextDouble(0, total));
            if (t < 0) t = -t - 1;
            t = Math.min(t, n - 1);
            Vec3 a = m.vertex(t, 0), e1 = m.vertex(t, 1).minus(a), e2 = m.vertex(t, 2).minus(a);
            double u = r.nextDouble(), v = r.nextDouble();
            if (u + v > 1) { u = 1 - u; v = 1 - v; }
            Vec3 c = a.plus(e1.times(u)).plus(e2.times(v));
            Vec3 nrm = e1.cross(e2).normalized();
            double tilt = Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, nrm.z()))));
            double az = Math.abs(nrm.z()) > 0.999999 ? 0 : (Math.toDegrees(Math.atan2(nrm.x(), nrm.y())) + 360) % 360;
            SurfaceKind kind = tilt < 60 ? SurfaceKind.ROOF : SurfaceKind.FACADE;
            out.add(new Patch(i, "T" + t + "-" + i, m.triangleBlock()[t], m.blockNames().get(m.triangleBlock()[t]),
                    t, kind, c, nrm, 1.0, tilt, az, new double[0]));
        }
        return out;
    }

    /**
     * A benchmark ray set: {@code origins} patch points (offset along their normals by
     * {@code epsilon}) each shooting {@code raysPerOrigin} cosine-weighted directions about its normal
     * (coherent-ish, as in view-factor work). Returns {ox,oy,oz,dx,dy,dz} per ray, flat.
     */
    public static double[] rays(MassingModel m, int origins, int raysPerOrigin, double epsilon, long seed) {
        List<Patch> ps = samplePatches(m, origins, seed);
        HemisphereSampler hs = new HemisphereSampler(org.solmass.scene.Scene.build(new float[0], false, 0), raysPerOrigin);
        int k = hs.rayCount();
        double[] dir = new double[3 * k];
        double[] out = new double[6 * k * origins];
        int j = 0;
        for (Patch p : ps) {
            Vec3 n = p.normal(), c = p.centroid().plus(n.times(epsilon));
            hs.directions(n.x(), n.y(), n.z(), HemisphereSampler.patchSeed(p.id(), seed), dir);
            for (int s = 0; s < k; s++) {
                out[j++] = c.x(); out[j++] = c.y(); out[j++] = c.z();
                out[j++] = dir[3 * s]; out[j++] = dir[3 * s + 1]; out[j++] = dir[3 * s + 2];
            }
        }
        return out;
    }
}
