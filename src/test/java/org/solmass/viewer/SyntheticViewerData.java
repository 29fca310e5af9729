package org.solmass.viewer;

import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.table.ResultTable;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * SYNTHETIC test data for the viewer: an invented courtyard of four boxes plus one context tower at
 * a fictional site, with patches laid on roofs and facades and made-up values that follow the face
 * orientation and height. Nothing here is a computed result; it only exercises the window.
 */
final class SyntheticViewerData {
    private SyntheticViewerData() {}

    /** {x0, y0, x1, y1, height} of the courtyard blocks (metres) and, last, the context tower. */
    static final double[][] BLOCKS = {
            {0, 30, 40, 40, 18},     // north bar
            {0, 0, 40, 10, 9},       // south bar, lower
            {30, 10, 40, 30, 15},    // east wing
            {0, 10, 10, 30, 12},     // west wing
            {52, -18, 64, -6, 36}};  // context tower to the south-east, not analysed
    static final String[] NAMES = {"north-bar", "south-bar", "east-wing", "west-wing", "tower (context)"};

    /** The courtyard with 1 m patches (a few thousand). */
    static ViewerData courtyard() { return build(1.0, true); }

    /** The courtyard with patches small enough to make about {@code target} of them. */
    static ViewerData withAbout(int target, boolean monthHour) {
        double area = 0;
        for (int b = 0; b < 4; b++) {
            double[] k = BLOCKS[b];
            double w = k[2] - k[0], d = k[3] - k[1], h = k[4];
            area += w * d + 2 * (w + d) * h;
        }
        return build(Math.sqrt(area / target), monthHour);
    }

    static ViewerData build(double size, boolean monthHour) {
        List<Double> verts = new ArrayList<>();
        List<Integer> tris = new ArrayList<>(), triBlock = new ArrayList<>();
        List<Patch> patches = new ArrayList<>();
        int surface = 0;
        for (int b = 0; b < BLOCKS.length; b++) {
            double[] k = BLOCKS[b];
            double x0 = k[0], y0 = k[1], x1 = k[2], y1 = k[3], h = k[4];
            List<Vec3[]> faces = new ArrayList<>();   // origin, U, V (lengths), outward normal U x V
            for (double[][] c : Boxes.onGround(x0, y0, x1, y1, h).faces()) {
                Vec3 o = new Vec3(c[0][0], c[0][1], c[0][2]);
                Vec3 u = new Vec3(c[1][0], c[1][1], c[1][2]).minus(o), v = new Vec3(c[3][0], c[3][1], c[3][2]).minus(o);
                faces.add(new Vec3[] {o, u, v, u.cross(v).normalized()});
            }
            for (Vec3[] f : faces) {
                int v0 = verts.size() / 3;
                Vec3 o = f[0], u = f[1], v = f[2];
                for (Vec3 c : new Vec3[] {o, o.plus(u), o.plus(u).plus(v), o.plus(v)}) {
                    verts.add(c.x());
                    verts.add(c.y());
                    verts.add(c.z());
                }
                int[] t = {v0, v0 + 1, v0 + 2, v0, v0 + 2, v0 + 3};
                for (int i : t) tris.add(i);
                triBlock.add(b);
                triBlock.add(b);
                if (b < 4) addPatches(patches, b, surface, o, u, v, f[3], size, h);
                surface++;
            }
        }
        double[] vv = verts.stream().mapToDouble(Double::doubleValue).toArray();
        int[] ti = tris.stream().mapToInt(Integer::intValue).toArray();
        int[] tb = triBlock.stream().mapToInt(Integer::intValue).toArray();
        int[] tm = new int[tb.length];
        java.util.Arrays.fill(tm, -1);
        MassingModel model = new MassingModel(null, List.of(NAMES), List.of(), vv, ti, tb, tm, new int[tb.length], 0);
        boolean[] analysed = {true, true, true, true, false};
        ResultTable table = values(patches);
        float[] mh = monthHour ? monthHour(patches, table) : null;
        return new ViewerData("Invented courtyard (synthetic values)", model, analysed, patches, table, mh,
                climate(), sunPath(48.2), 48.2, 11.6, "UTC+01:00",
                List.of("synthetic demo data: values are made up from the face orientation, not computed"));
    }

    private static void addPatches(List<Patch> out, int block, int surface, Vec3 o, Vec3 u, Vec3 v, Vec3 n,
                                   double size, double height) {
        double lu = u.length(), lv = v.length();
        Vec3 eu = u.normalized(), ev = v.normalized();
        int nu = (int) Math.ceil(lu / size - 1e-9), nv = (int) Math.ceil(lv / size - 1e-9);
        SurfaceKind kind = n.z() > 0.5 ? SurfaceKind.ROOF : SurfaceKind.FACADE;
        double tilt = kind == SurfaceKind.ROOF ? 0 : 90;
        double az = kind == SurfaceKind.ROOF ? 0 : (Math.toDegrees(Math.atan2(n.x(), n.y())) + 360) % 360;
        int k = 0;
        for (int j = 0; j < nv; j++) {
            for (int i = 0; i < nu; i++) {
                double a0 = i * size, a1 = Math.min(lu, (i + 1) * size), b0 = j * size, b1 = Math.min(lv, (j + 1) * size);
                Vec3[] c = {o.plus(eu.times(a0)).plus(ev.times(b0)), o.plus(eu.times(a1)).plus(ev.times(b0)),
                        o.plus(eu.times(a1)).plus(ev.times(b1)), o.plus(eu.times(a0)).plus(ev.times(b1))};
                double[] outline = new double[12];
                Vec3 cen = Vec3.ZERO;
                for (int q = 0; q < 4; q++) {
                    outline[3 * q] = c[q].x();
                    outline[3 * q + 1] = c[q].y();
                    outline[3 * q + 2] = c[q].z();
                    cen = cen.plus(c[q].times(0.25));
                }
                String id = String.format(Locale.ROOT, "B%d-S%d-P%04d", block, surface, k++);
                out.add(new Patch(out.size(), id, block, NAMES[block], surface, kind, cen, n,
                        (a1 - a0) * (b1 - b0), tilt, az, outline));
            }
        }
    }

    /** Made-up values from orientation and height (synthetic). */
    static ResultTable values(List<Patch> ps) {
        int n = ps.size();
        double[] svf = new double[n], gvf = new double[n], ann = new double[n], beam = new double[n], dif = new double[n],
                ref = new double[n], uns = new double[n], loss = new double[n], kwh = new double[n];
        double[][] mon = new double[12][n];
        for (Patch p : ps) {
            int i = p.index();
            double zRel = Math.min(1, p.centroid().z() / 18.0);
            if (p.kind() == SurfaceKind.ROOF) {
                double edge = 0.9 + 0.1 * Math.abs(Math.sin(p.centroid().x() * 0.2));
                uns[i] = 1150;
                ann[i] = 1150 * edge;
                svf[i] = 0.97 * edge;
                gvf[i] = 0;
            } else {
                double base = 300 + 500 * (1 + Math.cos(Math.toRadians(p.azimuthDeg() - 180))) / 2;
                uns[i] = base;
                ann[i] = base * (0.45 + 0.55 * zRel);
                svf[i] = 0.5 * (0.5 + 0.5 * zRel);
                gvf[i] = 0.5;
            }
            beam[i] = 0.55 * ann[i];
            dif[i] = 0.38 * ann[i];
            ref[i] = ann[i] - beam[i] - dif[i];
            loss[i] = 100 * (1 - ann[i] / uns[i]);
            kwh[i] = ann[i] * p.areaM2();
            double[] w = monthWeights();
            for (int m = 0; m < 12; m++) mon[m][i] = ann[i] * w[m];
        }
        ResultTable t = new ResultTable(ps);
        t.put(org.solmass.metrics.ColumnCatalogue.of("sky_view_factor"), svf).put(org.solmass.metrics.ColumnCatalogue.of("ground_view_factor"), gvf).put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2"), ann)
                .put(org.solmass.metrics.ColumnCatalogue.of("beam_kwh_m2"), beam).put(org.solmass.metrics.ColumnCatalogue.of("diffuse_kwh_m2"), dif)
                .put(org.solmass.metrics.ColumnCatalogue.of("reflected_kwh_m2"), ref).put(org.solmass.metrics.ColumnCatalogue.of("unshaded_kwh_m2"), uns)
                .put(org.solmass.metrics.ColumnCatalogue.of("shading_loss_pct"), loss).put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh"), kwh);
        for (int m = 0; m < 12; m++) t.put(org.solmass.irradiation.IrradiationColumns.month(m + 1), mon[m]);
        return t;
    }

    static double[] monthWeights() {
        double[] w = new double[12];
        double s = 0;
        for (int m = 0; m < 12; m++) s += w[m] = 1.2 - Math.cos(2 * Math.PI * (m + 0.5) / 12);
        for (int m = 0; m < 12; m++) w[m] /= s;
        return w;
    }

    static float[] monthHour(List<Patch> ps, ResultTable t) {
        int n = ps.size();
        float[] out = new float[n * 288];
        int[] days = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
        for (int m = 0; m < 12; m++) {
            double[] col = t.column(String.format(Locale.ROOT, "m%02d_kwh_m2", m + 1));
            double dayLen = 12 - 4 * Math.cos(2 * Math.PI * (m + 0.5) / 12);
            for (Patch p : ps) {
                double shift = p.kind() == SurfaceKind.ROOF ? 0 : 3 * Math.sin(Math.toRadians(p.azimuthDeg() - 180)) * -1;
                double peak = 12 - shift;
                double[] shape = new double[24];
                double sum = 0;
                for (int h = 0; h < 24; h++) {
                    double x = (h + 0.5 - peak) / (dayLen / 2);
                    shape[h] = Math.abs(x) < 1 ? Math.cos(Math.PI / 2 * x) : 0;
                    sum += shape[h];
                }
                double meanWh = col[p.index()] * 1000 / days[m];       // Wh/m2 per day
                for (int h = 0; h < 24; h++) out[(p.index() * 12 + m) * 24 + h] = (float) (sum > 0 ? meanWh * shape[h] / sum : 0);
            }
        }
        return out;
    }

    static ClimateGlance climate() {
        double[] g = new double[288], d = new double[288], gm = new double[12], dm = new double[12];
        int[] days = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
        for (int m = 0; m < 12; m++) {
            double dayLen = 12 - 4 * Math.cos(2 * Math.PI * (m + 0.5) / 12);
            double peak = 300 + 450 * (1 - Math.cos(2 * Math.PI * (m + 0.5) / 12)) / 2;
            for (int h = 0; h < 24; h++) {
                double x = (h + 0.5 - 12) / (dayLen / 2);
                double v = Math.abs(x) < 1 ? peak * Math.cos(Math.PI / 2 * x) : 0;
                g[m * 24 + h] = v;
                d[m * 24 + h] = v * (0.55 - 0.15 * (1 - Math.cos(2 * Math.PI * (m + 0.5) / 12)) / 2);
                gm[m] += g[m * 24 + h] * days[m] / 1000;
                dm[m] += d[m * 24 + h] * days[m] / 1000;
            }
        }
        return new ClimateGlance("synthetic climate (made up for tests)", g, d, gm, dm);
    }

    /**
     * Sun positions on the 15th of each month for test display only, from the textbook declination
     * of Cooper (1969, Solar Energy 12, eq. 1) and the spherical-triangle elevation/azimuth
     * (Duffie and Beckman, Solar Engineering of Thermal Processes, 4th ed., 2013, eq. 1.6.5, 1.6.6);
     * solar time is taken as local time here (synthetic).
     */
    static List<SunArc> sunPath(double latDeg) {
        List<SunArc> arcs = new ArrayList<>();
        double phi = Math.toRadians(latDeg);
        int[] doy = {15, 46, 74, 105, 135, 166, 196, 227, 258, 288, 319, 349};
        for (int m = 0; m < 12; m++) {
            double dec = Math.toRadians(23.45 * Math.sin(Math.toRadians(360.0 * (284 + doy[m]) / 365)));
            List<SunArc.Point> pts = new ArrayList<>();
            for (double h = 0; h <= 24; h += 0.5) {
                double w = Math.toRadians(15 * (h - 12));
                double sinEl = Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(w);
                double el = Math.toDegrees(Math.asin(sinEl));
                if (el < 0) continue;
                double az = Math.toDegrees(Math.atan2(Math.sin(w), Math.cos(w) * Math.sin(phi) - Math.tan(dec) * Math.cos(phi))) + 180;
                pts.add(new SunArc.Point(h, az, el));
            }
            arcs.add(new SunArc(m + 1, pts));
        }
        return arcs;
    }
}
