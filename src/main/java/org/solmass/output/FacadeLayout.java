package org.solmass.output;

import org.solmass.model.Compass;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The facades of one block unrolled side by side: one panel per planar facade surface, each seen
 * straight on (orthographic, from outside), every facade patch in exactly one panel at its true shape.
 * A panel's axes are the surface's own: u horizontal along the surface, to the right as seen from
 * outside ({@code (-ny, nx, 0)/|n_h|}, the axis {@link Patch#triangles()} uses), and w = n x u up the
 * surface (the vertical for a wall). Both are unit vectors in the surface plane, so the projection keeps
 * lengths and areas: a patch's area on the page is its area times the page scale squared.
 *
 * <p>Order: walking round the block with it on the left, from the south facade: panels by
 * (180 - azimuth) mod 360 (south, east, north, west), then along u, then by surface id, so the right
 * edge of a panel is the corner shared with the next one on a simple block. Panels stand on a common
 * base (the lowest w of the block's panels), so storeys line up across a page.
 */
public final class FacadeLayout {
    /**
     * One facade surface seen straight on.
     *
     * @param surface surface id
     * @param label surface label {@code B<block>-S<surface>} (the prefix of its patch ids)
     * @param azimuthDeg area-weighted azimuth of its patches, degrees from north clockwise
     * @param patches its facade patches in patch order
     * @param uv per patch its outline in panel coordinates (u, w pairs, metres; u from the panel's left
     *           edge, w from the layout's common base)
     * @param widthM width of the panel (u extent), metres
     * @param heightM height from the common base to the panel's top, metres
     * @param bottomM lowest w of the panel above the common base, metres
     */
    public record Panel(int surface, String label, double azimuthDeg, List<Patch> patches, List<double[]> uv,
                        double widthM, double heightM, double bottomM) {
        public Panel {
            patches = List.copyOf(patches);
            uv = List.copyOf(uv);
        }

        /** "S", "NE", ... of the panel's azimuth ({@link Compass}). */
        public String compass() { return Compass.shortName(azimuthDeg); }

        /** The panel's area (its patches' areas summed), square metres. */
        public double areaM2() { return patches.stream().mapToDouble(Patch::areaM2).sum(); }
    }

    private final List<Panel> panels;
    private final double baseW;

    private FacadeLayout(List<Panel> panels, double baseW) {
        this.panels = List.copyOf(panels);
        this.baseW = baseW;
    }

    /** The panels in page order. */
    public List<Panel> panels() { return panels; }

    /** The w of the common base (for a wall: the height z of the lowest facade edge), metres. */
    public double baseW() { return baseW; }

    /** Tallest panel, metres. */
    public double maxHeightM() { return panels.stream().mapToDouble(Panel::heightM).max().orElse(0); }

    /** Facade surface label of a patch id {@code B<b>-S<s>-P<n>}: the id up to its last "-P". */
    public static String surfaceLabel(String patchId) {
        int k = patchId.lastIndexOf("-P");
        return k > 0 ? patchId.substring(0, k) : patchId;
    }

    /** Unrolls the facade patches among {@code patches} (other kinds are left out). */
    public static FacadeLayout of(List<Patch> patches) {
        Map<Integer, List<Patch>> bySurface = new LinkedHashMap<>();
        for (Patch p : patches) {
            if (p.kind() == SurfaceKind.FACADE) bySurface.computeIfAbsent(p.surface(), k -> new ArrayList<>()).add(p);
        }
        record Raw(int surface, String label, double az, List<Patch> ps, List<double[]> uw, double uMin, double uMax,
                   double wMin, double wMax, double along) {}
        List<Raw> raws = new ArrayList<>();
        for (Map.Entry<Integer, List<Patch>> e : bySurface.entrySet()) {
            List<Patch> ps = e.getValue();
            double nx = 0, ny = 0, nz = 0, area = 0;
            for (Patch p : ps) {
                nx += p.normal().x() * p.areaM2();
                ny += p.normal().y() * p.areaM2();
                nz += p.normal().z() * p.areaM2();
                area += p.areaM2();
            }
            Vec3 n = new Vec3(nx, ny, nz).normalized();
            double h = Math.hypot(n.x(), n.y());
            Vec3 u = h < 1e-9 ? new Vec3(1, 0, 0) : new Vec3(-n.y() / h, n.x() / h, 0);
            Vec3 w = n.cross(u).normalized();
            double az = h < 1e-9 ? 0 : Math.toDegrees(Math.atan2(n.x(), n.y()));
            if (az < 0) az += 360;
            double uMin = Double.POSITIVE_INFINITY, uMax = Double.NEGATIVE_INFINITY, wMin = uMin, wMax = uMax, cu = 0;
            List<double[]> uw = new ArrayList<>();
            for (Patch p : ps) {
                double[] o = p.outline();
                double[] q = new double[o.length / 3 * 2];
                for (int k = 0; k < o.length / 3; k++) {
                    Vec3 c = new Vec3(o[3 * k], o[3 * k + 1], o[3 * k + 2]);
                    q[2 * k] = c.dot(u);
                    q[2 * k + 1] = c.dot(w);
                    uMin = Math.min(uMin, q[2 * k]);
                    uMax = Math.max(uMax, q[2 * k]);
                    wMin = Math.min(wMin, q[2 * k + 1]);
                    wMax = Math.max(wMax, q[2 * k + 1]);
                }
                uw.add(q);
                cu += p.centroid().dot(u) * p.areaM2();
            }
            raws.add(new Raw(e.getKey(), surfaceLabel(ps.get(0).id()), az, ps, uw, uMin, uMax, wMin, wMax, cu / Math.max(area, 1e-12)));
        }
        raws.sort(Comparator.comparingDouble((Raw r) -> Math.floorMod(Math.round((180 - r.az()) * 1e6), 360_000_000L))
                .thenComparingDouble(Raw::along).thenComparingInt(Raw::surface));
        double base = raws.stream().mapToDouble(Raw::wMin).min().orElse(0);
        List<Panel> out = new ArrayList<>();
        for (Raw r : raws) {
            List<double[]> uv = new ArrayList<>();
            for (double[] q : r.uw()) {
                double[] s = new double[q.length];
                for (int k = 0; k < q.length; k += 2) {
                    s[k] = q[k] - r.uMin();
                    s[k + 1] = q[k + 1] - base;
                }
                uv.add(s);
            }
            out.add(new Panel(r.surface(), r.label(), r.az(), r.ps(), uv, r.uMax() - r.uMin(), r.wMax() - base, r.wMin() - base));
        }
        return new FacadeLayout(out, base);
    }

    /** Area of a polygon given as (u, w) pairs (shoelace formula), in the square of its unit. */
    public static double polygonArea(double[] uv) {
        double a = 0;
        int m = uv.length / 2;
        for (int k = 0; k < m; k++) {
            int j = (k + 1) % m;
            a += uv[2 * k] * uv[2 * j + 1] - uv[2 * j] * uv[2 * k + 1];
        }
        return Math.abs(a) / 2;
    }

    /**
     * Where each panel goes on a page: slots of {@code max(width x scale, minSlotPx)} plus a gap, filled
     * into rows left to right, each row as tall as its tallest panel plus {@code labelPx}.
     *
     * @param scalePxPerM page scale, pixels per metre
     * @param x left of each slot (the panel's left edge), pixels from the area's left
     * @param y top of each row's drawing (below its labels), pixels from the area's top; the panel's
     *          base line is at {@code y + rowHeightM x scale}
     * @param row row of each panel
     * @param rowHeightM height of each row's tallest panel, metres
     */
    public record Placement(double scalePxPerM, int[] x, int[] y, int[] row, double[] rowHeightM) {
        /** Page x of a panel's point at u metres, pixels. */
        public double px(int panel, double u) { return x[panel] + u * scalePxPerM; }

        /** Page y of a panel's point at w metres above the common base, pixels (down the page). */
        public double py(int panel, double w) { return y[panel] + (rowHeightM[row[panel]] - w) * scalePxPerM; }
    }

    /**
     * The largest scale at which the panels fit an area of {@code areaW x areaH} pixels (bisection on
     * the scale; the packing's height only grows with the scale), and the placement at that scale.
     *
     * @param minSlotPx least width of a slot (room for the panel's labels), pixels
     * @param gapPx gap between slots, pixels
     * @param labelPx room above each row for the labels, pixels
     */
    public Placement place(int areaW, int areaH, int minSlotPx, int gapPx, int labelPx) {
        double lo = 0, hi = 1e4;
        for (int it = 0; it < 60; it++) {
            double mid = (lo + hi) / 2;
            Placement p = pack(mid, areaW, minSlotPx, gapPx, labelPx);
            if (p != null && height(p, labelPx) <= areaH) lo = mid;
            else hi = mid;
        }
        Placement p = pack(lo, areaW, minSlotPx, gapPx, labelPx);
        return p != null ? p : pack(0, areaW, minSlotPx, gapPx, labelPx);
    }

    private static double height(Placement p, int labelPx) {
        double h = 0;
        for (double r : p.rowHeightM()) h += labelPx + r * p.scalePxPerM();
        return h + (p.rowHeightM().length - 1) * (double) labelPx / 3;
    }

    private Placement pack(double s, int areaW, int minSlotPx, int gapPx, int labelPx) {
        int n = panels.size();
        int[] x = new int[n], y = new int[n], row = new int[n];
        List<Double> rowH = new ArrayList<>();
        double cx = 0;
        int r = 0;
        rowH.add(0.0);
        for (int i = 0; i < n; i++) {
            double slot = Math.max(panels.get(i).widthM() * s, minSlotPx);
            if (slot > areaW) return null;
            if (cx > 0 && cx + slot > areaW) {
                r++;
                rowH.add(0.0);
                cx = 0;
            }
            x[i] = (int) Math.round(cx + (slot - panels.get(i).widthM() * s) / 2);
            row[i] = r;
            rowH.set(r, Math.max(rowH.get(r), panels.get(i).heightM()));
            cx += slot + gapPx;
        }
        double[] rh = rowH.stream().mapToDouble(Double::doubleValue).toArray();
        double top = 0;
        int[] rowTop = new int[rh.length];
        for (int k = 0; k < rh.length; k++) {
            rowTop[k] = (int) Math.round(top + labelPx);
            top += labelPx + rh[k] * s + labelPx / 3.0;
        }
        for (int i = 0; i < n; i++) y[i] = rowTop[row[i]];
        return new Placement(s, x, y, row, rh);
    }
}
