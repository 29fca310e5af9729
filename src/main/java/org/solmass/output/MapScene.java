package org.solmass.output;

import org.solmass.model.MassingModel;
import org.solmass.model.TriangleGeometry;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * What the map draws, prepared once for both panels: the model's triangles with their grey shade,
 * the surface edges (creases over 25 deg and open boundaries), the patches with their ramp colours
 * and a ground plane around the model.
 */
final class MapScene {
    /** Direction light comes from for the grey shading of blocks: azimuth 200 deg, elevation 60 deg. */
    private static final Vec3 LIGHT = Vec3.fromAzimuthElevation(200, 60);
    /** The ground quad's two triangles (a fan from corner 0). */
    private static final int[] QUAD_FAN = {0, 1, 2, 0, 2, 3};
    private static final double CREASE_COS = Math.cos(Math.toRadians(25));

    private final MassingModel model;
    private final List<Patch> patches;
    private final int[] patchColour;
    private final int[] triColour;
    private final double[] triNormal;
    private final double[] edges;  // x0,y0,z0,x1,y1,z1 per edge
    private final double cx, cy, cz;  // centre of the model's bounds: projections are relative to it (float depth precision)
    private final double[] ground; // 4 corners x,y,z
    private final double meanPatchEdgeM;
    private final boolean missing;

    /** Overlay polylines (closed, x,y,z triples) drawn over everything but hidden by nearer faces. */
    private final List<double[]> overlay;

    MapScene(MassingModel model, boolean[] analysedBlock, List<Patch> patches, double[] values, double lo, double hi) {
        this(model, analysedBlock, patches, values, lo, hi, false, List.of());
    }

    MapScene(MassingModel model, boolean[] analysedBlock, List<Patch> patches, double[] values, double lo, double hi,
             boolean diverging, List<double[]> overlay) {
        this.model = model;
        this.patches = patches;
        this.overlay = overlay;
        int nt = model.triangleCount();
        triColour = new int[nt];
        triNormal = new double[3 * nt];
        double[] n = new double[3];
        for (int t = 0; t < nt; t++) {
            if (!TriangleGeometry.unitNormal(model.vertices(), model.triangles(), t, n)) java.util.Arrays.fill(n, 0);
            triNormal[3 * t] = n[0];
            triNormal[3 * t + 1] = n[1];
            triNormal[3 * t + 2] = n[2];
            double lambert = Math.max(0, n[0] * LIGHT.x() + n[1] * LIGHT.y() + n[2] * LIGHT.z());
            triColour[t] = analysedBlock[model.triangleBlock()[t]] ? shade(MapRenderer.UNPATCHED, 0.82 + 0.18 * lambert) : contextGrey(lambert);
        }
        patchColour = new int[patches.size()];
        boolean miss = false;
        double edgeSum = 0;
        for (int p = 0; p < patchColour.length; p++) {
            miss |= !Double.isFinite(values[p]);
            double t = Double.isFinite(values[p]) ? ColourRamp.normalise(values[p], lo, hi) : Double.NaN;
            patchColour[p] = diverging ? ColourRamp.diverging(2 * t - 1) : ColourRamp.sequential(t);
            edgeSum += Math.sqrt(Math.max(0, patches.get(p).areaM2()));
        }
        missing = miss;
        meanPatchEdgeM = patchColour.length == 0 ? 0 : edgeSum / patchColour.length;
        edges = creases(model, triNormal);
        double[] b = model.bounds();
        if (!(b[0] <= b[3])) b = new double[] {0, 0, 0, 1, 1, 1};
        cx = (b[0] + b[3]) / 2;
        cy = (b[1] + b[4]) / 2;
        cz = (b[2] + b[5]) / 2;
        double pad = Math.max(5, 0.12 * Math.max(b[3] - b[0], b[4] - b[1]));
        ground = new double[] {b[0] - pad, b[1] - pad, b[2], b[3] + pad, b[1] - pad, b[2],
                b[3] + pad, b[4] + pad, b[2], b[0] - pad, b[4] + pad, b[2]};
    }

    boolean hasMissing() { return missing; }

    /** Neutral grey of a context face lit with the given Lambert factor (0..1). */
    static int contextGrey(double lambert) {
        int v = (int) Math.round(255 * (0.50 + 0.38 * lambert));
        return (v << 16) | (v << 8) | v;
    }

    private static int shade(int rgb, double f) {
        int r = (int) Math.min(255, ((rgb >> 16) & 255) * f), g = (int) Math.min(255, ((rgb >> 8) & 255) * f),
                b = (int) Math.min(255, (rgb & 255) * f);
        return (r << 16) | (g << 8) | b;
    }

    /**
     * Points the views are fitted to besides the model's vertices (x,y,z triples, metres), e.g. a
     * ground grid that reaches beyond the model; empty by default.
     */
    private double[] fitExtra = new double[0];

    /** Sets {@link #fitExtra}; returns this scene. */
    MapScene fitAlso(double[] points) {
        fitExtra = points.clone();
        return this;
    }

    /** How a view fits into a w x h (supersampled) image: pixels per metre, offsets and depth range. */
    private record Fit(double scale, double ox, double oy, double minD, double maxD) {}

    private Fit fit(MapView view, int w, int h) {
        Vec3 r = view.right(), u = view.up(), v = view.toViewer();
        double[] vx = model.vertices();
        if (fitExtra.length > 0) {
            vx = java.util.Arrays.copyOf(vx, vx.length + fitExtra.length);
            System.arraycopy(fitExtra, 0, vx, model.vertices().length, fitExtra.length);
        }
        double minR = Double.POSITIVE_INFINITY, maxR = Double.NEGATIVE_INFINITY, minU = minR, maxU = maxR, minD = minR, maxD = maxR;
        for (int pass = 0; pass < 2; pass++) {
            double[] pts = pass == 0 ? vx : ground;
            if (pass == 1 && vx.length > 0) {   // fit to the model; the ground plane is a backdrop
                double fr = minR, fu = minU, gr = maxR, gu = maxU;
                for (int i = 0; i + 2 < pts.length; i += 3) {
                    double pd = (pts[i] - cx) * v.x() + (pts[i + 1] - cy) * v.y() + (pts[i + 2] - cz) * v.z();
                    minD = Math.min(minD, pd); maxD = Math.max(maxD, pd);
                }
                minR = fr; minU = fu; maxR = gr; maxU = gu;
                break;
            }
            for (int i = 0; i + 2 < pts.length; i += 3) {
                double x = pts[i] - cx, y = pts[i + 1] - cy, z = pts[i + 2] - cz;
                double pr = x * r.x() + y * r.y() + z * r.z();
                double pu = x * u.x() + y * u.y() + z * u.z();
                double pd = x * v.x() + y * v.y() + z * v.z();
                minR = Math.min(minR, pr); maxR = Math.max(maxR, pr);
                minU = Math.min(minU, pu); maxU = Math.max(maxU, pu);
                minD = Math.min(minD, pd); maxD = Math.max(maxD, pd);
            }
        }
        double scale = Math.min(w * 0.92 / Math.max(1e-9, maxR - minR), h * 0.88 / Math.max(1e-9, maxU - minU));
        double ox = (w - (maxR - minR) * scale) / 2 - minR * scale, oy = (h - (maxU - minU) * scale) / 2 + maxU * scale;
        return new Fit(scale, ox, oy, minD, maxD);
    }

    /** Pixels per metre of the image {@link #draw} returns for this view at w x h (supersampled size). */
    double pixelsPerMetre(MapView view, int w, int h) {
        return fit(view, w, h).scale() / 2;
    }

    /** Renders the scene in a view at w x h (supersampled) and returns the w/2 x h/2 image. */
    int[] draw(MapView view, int w, int h) {
        Vec3 v = view.toViewer();
        double[] vx = model.vertices();
        Fit f = fit(view, w, h);
        double scale = f.scale(), minD = f.minD(), maxD = f.maxD();
        Projector P = new Projector(view.right(), view.up(), v, scale, f.ox(), f.oy(), cx, cy, cz);
        float bias = (float) (2e-4 * Math.max(1e-6, maxD - minD));
        Raster ras = new Raster(w, h, MapRenderer.BACKGROUND);

        double[] xs = new double[16], ys = new double[16], zs = new double[16];
        for (int k = 0; k < 4; k++) {
            P.project(ground[3 * k], ground[3 * k + 1], ground[3 * k + 2]);
            xs[k] = P.sx; ys[k] = P.sy; zs[k] = P.depth - 4 * bias;
        }
        ras.polygon(xs, ys, zs, QUAD_FAN, MapRenderer.GROUND, 0);

        int[] tri = model.triangles();
        for (int t = 0; t < triColour.length; t++) {
            if (triNormal[3 * t] * v.x() + triNormal[3 * t + 1] * v.y() + triNormal[3 * t + 2] * v.z() <= 1e-6) continue;
            for (int k = 0; k < 3; k++) {
                int i = 3 * tri[3 * t + k];
                P.project(vx[i], vx[i + 1], vx[i + 2]);
                xs[k] = P.sx; ys[k] = P.sy; zs[k] = P.depth;
            }
            ras.triangle(xs[0], ys[0], zs[0], xs[1], ys[1], zs[1], xs[2], ys[2], zs[2], triColour[t], 0);
        }

        double finalEdgePx = meanPatchEdgeM * scale / 2;
        double outlineAlpha = finalEdgePx >= 10 ? 0.28 : finalEdgePx >= 6 ? 0.14 : 0;   // no hatching of small patches
        for (int p = 0; p < patchColour.length; p++) {
            Patch q = patches.get(p);
            if (q.normal().dot(v) <= 1e-6) continue;
            double[] o = q.outline();
            int n = o.length / 3;
            if (n > xs.length) {
                xs = new double[n]; ys = new double[n]; zs = new double[n];
            }
            for (int k = 0; k < n; k++) {
                P.project(o[3 * k], o[3 * k + 1], o[3 * k + 2]);
                xs[k] = P.sx; ys[k] = P.sy; zs[k] = P.depth;
            }
            ras.polygon(xs, ys, zs, q.triangles(), patchColour[p], bias);
            if (outlineAlpha > 0) {
                for (int k = 0; k < n; k++) {
                    int k1 = (k + 1) % n;
                    ras.line(xs[k], ys[k], zs[k], xs[k1], ys[k1], zs[k1], 0x000000, outlineAlpha, 2 * bias);
                }
            }
        }

        for (int e = 0; e < edges.length; e += 6) {
            P.project(edges[e], edges[e + 1], edges[e + 2]);
            double x0 = P.sx, y0 = P.sy, z0 = P.depth;
            P.project(edges[e + 3], edges[e + 4], edges[e + 5]);
            boolean steep = Math.abs(P.sy - y0) > Math.abs(P.sx - x0);
            double dx = steep ? 1 : 0, dy = steep ? 0 : 1;
            ras.line(x0, y0, z0, P.sx, P.sy, P.depth, MapRenderer.EDGE, 0.75, 3 * bias);
            ras.line(x0 + dx, y0 + dy, z0, P.sx + dx, P.sy + dy, P.depth, MapRenderer.EDGE, 0.75, 3 * bias);
        }
        for (double[] ring : overlay) {
            int n = ring.length / 3;
            for (int k = 0; k < n; k++) {
                int k1 = (k + 1) % n;
                P.project(ring[3 * k], ring[3 * k + 1], ring[3 * k + 2]);
                double x0 = P.sx, y0 = P.sy, z0 = P.depth;
                P.project(ring[3 * k1], ring[3 * k1 + 1], ring[3 * k1 + 2]);
                for (int d = -2; d <= 2; d++) {   // about 2.5 px wide after downsampling
                    boolean steep = Math.abs(P.sy - y0) > Math.abs(P.sx - x0);
                    double ddx = steep ? d : 0, ddy = steep ? 0 : d;
                    ras.line(x0 + ddx, y0 + ddy, z0, P.sx + ddx, P.sy + ddy, P.depth, MapRenderer.OUTLINE, 0.95, 4 * bias);
                }
            }
        }
        return ras.downsample2();
    }

    /** Projects model points to supersampled screen coordinates; fields hold the last result. */
    private static final class Projector {
        final double rx, ry, rz, ux, uy, uz, vx, vy, vz, s, ox, oy, cx, cy, cz;
        double sx, sy, depth;

        Projector(Vec3 r, Vec3 u, Vec3 v, double s, double ox, double oy, double cx, double cy, double cz) {
            this.cx = cx;
            this.cy = cy;
            this.cz = cz;
            rx = r.x(); ry = r.y(); rz = r.z(); ux = u.x(); uy = u.y(); uz = u.z(); vx = v.x(); vy = v.y(); vz = v.z();
            this.s = s;
            this.ox = ox;
            this.oy = oy;
        }

        void project(double px, double py, double pz) {
            double x = px - cx, y = py - cy, z = pz - cz;
            sx = (x * rx + y * ry + z * rz) * s + ox;
            sy = oy - (x * ux + y * uy + z * uz) * s;
            depth = x * vx + y * vy + z * vz;
        }
    }

    /**
     * Edges to outline: shared by two triangles whose normals differ by more than 25 deg, or used by
     * one triangle only. Endpoints are matched by position (to 1 mm), so unshared vertices still pair.
     */
    private static double[] creases(MassingModel m, double[] normal) {
        record Key(long ax, long ay, long az, long bx, long by, long bz) {}
        Map<Key, int[]> seen = new HashMap<>();
        List<Key> order = new ArrayList<>();
        int[] tri = m.triangles();
        double[] vx = m.vertices();
        for (int t = 0; t < m.triangleCount(); t++) {
            for (int k = 0; k < 3; k++) {
                int a = 3 * tri[3 * t + k], b = 3 * tri[3 * t + (k + 1) % 3];
                long[] pa = quant(vx, a), pb = quant(vx, b);
                boolean swap = compare(pa, pb) > 0;
                long[] p = swap ? pb : pa, q = swap ? pa : pb;
                Key key = new Key(p[0], p[1], p[2], q[0], q[1], q[2]);
                int[] rec = seen.get(key);
                if (rec == null) {
                    seen.put(key, new int[] {t, -1, 0});
                    order.add(key);
                } else if (rec[1] < 0) {
                    rec[1] = t;
                } else {
                    rec[2] = 1;  // more than two triangles share it: a real edge of the massing
                }
            }
        }
        double[] out = new double[order.size() * 6];
        int n = 0;
        for (Key key : order) {
            int[] rec = seen.get(key);
            boolean draw = rec[1] < 0 || rec[2] == 1;
            if (!draw) {
                int t0 = rec[0], t1 = rec[1];
                double dot = normal[3 * t0] * normal[3 * t1] + normal[3 * t0 + 1] * normal[3 * t1 + 1] + normal[3 * t0 + 2] * normal[3 * t1 + 2];
                draw = dot < CREASE_COS;
            }
            if (!draw) continue;
            out[n++] = key.ax() / 1000.0; out[n++] = key.ay() / 1000.0; out[n++] = key.az() / 1000.0;
            out[n++] = key.bx() / 1000.0; out[n++] = key.by() / 1000.0; out[n++] = key.bz() / 1000.0;
        }
        return java.util.Arrays.copyOf(out, n);
    }

    private static long[] quant(double[] v, int i) {
        return new long[] {Math.round(v[i] * 1000), Math.round(v[i + 1] * 1000), Math.round(v[i + 2] * 1000)};
    }

    private static int compare(long[] a, long[] b) {
        for (int i = 0; i < 3; i++) if (a[i] != b[i]) return Long.compare(a[i], b[i]);
        return 0;
    }
}
