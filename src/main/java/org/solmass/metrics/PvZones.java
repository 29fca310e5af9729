package org.solmass.metrics;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LineString;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.overlayng.OverlayNGRobust;
import org.solmass.model.Parallel;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceFrame;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * PV roof zones (docs/metrics.md): per roof patch a suitability, its annual irradiation as a
 * percentage of the best unobstructed plane at the site ({@link BestPlane}); roof patches at or above
 * a threshold are suitable; suitable patches of one roof surface that share an outline edge are
 * joined into zones (connected components), and zones below a minimum area are dropped.
 *
 * <p>Per zone: area (sum of its patch areas), area-weighted mean annual irradiation, total annual
 * irradiation (kWh), area-weighted mean shading loss, and an indicative annual yield
 * {@code E = H A eta PR} (H annual irradiation kWh/m2 on the roof plane, A area, eta module
 * efficiency, PR performance ratio): the performance-ratio form of IEC 61724-1:2021 (PR = final
 * yield / reference yield) solved for the energy. Defaults eta = 0.20 and PR = 0.80 are common
 * practice for current crystalline-silicon modules and well-ventilated roof systems; the area counts
 * as fully covered with modules, so the figure is an upper bound before layout, setbacks and spacing.
 * Indicative only.
 *
 * <p>Adjacency: patch outlines are taken into the surface's 2D frame, snapped to 0.1 mm, and two
 * patches are neighbours when their boundaries share a segment longer than 5 % of the patch size
 * (a shared corner alone does not join). Zone outlines are the JTS union of their patches' outlines.
 */
public final class PvZones {
    /** Coordinates are snapped to this grid (metres) before adjacency tests and union. */
    static final double SNAP_M = 1e-4;
    /** Shared boundary, as a share of the patch size, that makes two patches neighbours. */
    static final double SHARED_EDGE_FRACTION = 0.05;

    private PvZones() {}

    /**
     * Settings.
     *
     * @param suitablePct threshold on the suitability, percent of the best plane
     * @param minZoneM2 smallest zone kept, m2
     * @param moduleEfficiency 0..1
     * @param performanceRatio 0..1
     * @param layout how modules are placed in a zone
     * @param sunBins sky cells the sun is binned into for an hourly year (as the irradiation stage)
     */
    public record Settings(double suitablePct, double minZoneM2, double moduleEfficiency, double performanceRatio,
                           org.solmass.pv.LayoutOptions layout, int sunBins) {
        /** Settings with the default layout and 4096 sun cells. */
        public Settings(double suitablePct, double minZoneM2, double moduleEfficiency, double performanceRatio) {
            this(suitablePct, minZoneM2, moduleEfficiency, performanceRatio, org.solmass.pv.LayoutOptions.DEFAULTS, 4096);
        }
    }

    /**
     * One zone.
     *
     * @param id 1-based, in order of surface id then first patch
     * @param block block id
     * @param blockName block name
     * @param surface surface id
     * @param surfaceLabel B&lt;block&gt;-S&lt;n&gt;
     * @param patches patch indices, ascending
     * @param areaM2 sum of the patch areas, m2
     * @param meanKwhM2 area-weighted mean annual irradiation, kWh/m2
     * @param totalKwh annual irradiation on the zone, kWh
     * @param meanShadingLossPct area-weighted mean shading loss, %
     * @param yieldKwh indicative annual yield, kWh
     * @param tiltDeg tilt of the roof surface, degrees
     * @param azimuthDeg azimuth of the roof surface, degrees from north clockwise
     * @param outlines the zone's boundary rings as closed polylines of x,y,z triples (world, metres;
     *                 the first corner is not repeated)
     * @param localOutline the zone's outline in its surface's 2D frame ({@link Surface#frame()}), metres
     */
    public record Zone(int id, int block, String blockName, int surface, String surfaceLabel, int[] patches,
                       double areaM2, double meanKwhM2, double totalKwh, double meanShadingLossPct, double yieldKwh,
                       double tiltDeg, double azimuthDeg, List<double[]> outlines, Geometry localOutline) {}

    /**
     * @param best the best unobstructed plane
     * @param suitabilityPct per patch: 100 x annual / best for roof patches, NaN for others
     * @param zoneOf per patch: zone id, or 0 when in no zone
     * @param zones the zones
     */
    public record Result(BestPlane best, double[] suitabilityPct, int[] zoneOf, List<Zone> zones) {
        public double totalAreaM2() { return zones.stream().mapToDouble(Zone::areaM2).sum(); }
        public double totalYieldKwh() { return zones.stream().mapToDouble(Zone::yieldKwh).sum(); }
    }

    /**
     * @param patches analysed patches in index order
     * @param surfaces all surfaces (index = surface id)
     * @param annualKwhM2 annual irradiation per patch
     * @param shadingLossPct shading loss per patch
     * @param patchM patch size, metres
     */
    public static Result compute(List<Patch> patches, List<Surface> surfaces, double[] annualKwhM2,
                                 double[] shadingLossPct, double patchM, BestPlane best, Settings s) {
        int n = patches.size();
        double[] suit = new double[n];
        Arrays.fill(suit, Double.NaN);
        for (int p = 0; p < n; p++) {
            if (patches.get(p).kind() != SurfaceKind.ROOF) continue;
            suit[p] = best.annualKwhM2() > 0 ? 100 * annualKwhM2[p] / best.annualKwhM2() : 0;
        }
        return compute(patches, surfaces, annualKwhM2, shadingLossPct, suit, patchM, best, s);
    }

    /**
     * As {@link #compute(List, List, double[], double[], double, BestPlane, Settings)} with the
     * suitability per patch given (NaN where a patch may not hold a zone).
     */
    public static Result compute(List<Patch> patches, List<Surface> surfaces, double[] annualKwhM2,
                                 double[] shadingLossPct, double[] suit, double patchM, BestPlane best, Settings s) {
        int n = patches.size();
        Map<Integer, List<Integer>> bySurface = new LinkedHashMap<>();
        for (int p = 0; p < n; p++) {
            if (suit[p] >= s.suitablePct()) bySurface.computeIfAbsent(patches.get(p).surface(), k -> new ArrayList<>()).add(p);
        }
        int[] zoneOf = new int[n];
        List<Zone> zones = new ArrayList<>();
        List<Integer> surfaceIds = new ArrayList<>(bySurface.keySet());
        surfaceIds.sort(null);
        // surfaces in parallel, each into its own slot; zones numbered below in surface order
        List<List<Component>> comps = Parallel.map(surfaceIds.size(), i -> components(patches, surfaces.get(surfaceIds.get(i)),
                bySurface.get(surfaceIds.get(i)), annualKwhM2, shadingLossPct, patchM, s.minZoneM2()));
        for (int i = 0; i < surfaceIds.size(); i++) {
            int sid = surfaceIds.get(i);
            Surface sf = surfaces.get(sid);
            for (Component c : comps.get(i)) {
                int id = zones.size() + 1;
                for (int p : c.idx) zoneOf[p] = id;
                zones.add(new Zone(id, sf.block(), patches.get(c.idx[0]).blockName(), sid, sf.label(), c.idx, c.area,
                        c.irr / c.area, c.irr, c.loss / c.area, c.irr * s.moduleEfficiency() * s.performanceRatio(),
                        sf.tiltDeg(), sf.azimuthDeg(), rings(c.union, sf.frame()), c.union));
            }
        }
        return new Result(best, suit, zoneOf, List.copyOf(zones));
    }

    /** A zone before numbering: its patches (ascending), area, area-weighted sums and outline union. */
    private record Component(int[] idx, double area, double irr, double loss, Geometry union) {}

    /**
     * The zones of one roof surface, in order of their first member: the suitable patches
     * {@code members} joined where their outlines share an edge (connected components), those of at
     * least {@code minZoneM2} kept. Pairs whose boxes overlap along more than the shared-edge length
     * are tested first, the corner pairs after them, when most are joined already and need no test:
     * the components are the same whatever the order, since a pair's test does not depend on it.
     */
    private static List<Component> components(List<Patch> patches, Surface sf, List<Integer> members, double[] annualKwhM2,
                                              double[] shadingLossPct, double patchM, double minZoneM2) {
        GeometryFactory gf = new GeometryFactory();
        Polygon[] poly = new Polygon[members.size()];
        for (int i = 0; i < poly.length; i++) poly[i] = localPolygon(gf, sf.frame(), patches.get(members.get(i)));
        int[] parent = new int[poly.length];
        for (int i = 0; i < parent.length; i++) parent[i] = i;
        double minShared = SHARED_EDGE_FRACTION * patchM;
        for (int pass = 0; pass < 2; pass++) {
            for (int i = 0; i < poly.length; i++) {
                Envelope ei = new Envelope(poly[i].getEnvelopeInternal());
                ei.expandBy(10 * SNAP_M);
                for (int j = i + 1; j < poly.length; j++) {
                    Envelope ej = poly[j].getEnvelopeInternal();
                    if (!ei.intersects(ej)) continue;
                    Envelope both = ei.intersection(ej);
                    boolean edgeLike = Math.max(both.getWidth(), both.getHeight()) > minShared;
                    if (edgeLike != (pass == 0)) continue;
                    if (find(parent, i) == find(parent, j)) continue;
                    Geometry shared = poly[i].getExteriorRing().intersection(poly[j].getExteriorRing());
                    if (shared.getLength() > minShared) parent[find(parent, i)] = find(parent, j);
                }
            }
        }
        Map<Integer, List<Integer>> byRoot = new LinkedHashMap<>();
        for (int i = 0; i < poly.length; i++) byRoot.computeIfAbsent(find(parent, i), k -> new ArrayList<>()).add(i);
        List<Component> out = new ArrayList<>();
        for (List<Integer> comp : byRoot.values()) {
            double area = 0, irr = 0, loss = 0;
            int[] idx = new int[comp.size()];
            List<Geometry> parts = new ArrayList<>();
            for (int k = 0; k < idx.length; k++) {
                int p = members.get(comp.get(k));
                idx[k] = p;
                double a = patches.get(p).areaM2();
                area += a;
                irr += a * annualKwhM2[p];
                loss += a * shadingLossPct[p];
                parts.add(poly[comp.get(k)]);
            }
            if (area < minZoneM2 || area <= 0) continue;
            Arrays.sort(idx);
            out.add(new Component(idx, area, irr, loss, OverlayNGRobust.union(gf.buildGeometry(parts))));
        }
        return out;
    }

    private static int find(int[] parent, int i) {
        while (parent[i] != i) {
            parent[i] = parent[parent[i]];
            i = parent[i];
        }
        return i;
    }

    private static double snap(double v) { return Math.round(v / SNAP_M) * SNAP_M; }

    private static Polygon localPolygon(GeometryFactory gf, SurfaceFrame f, Patch q) {
        double[] o = q.outline();
        int m = o.length / 3;
        Coordinate[] c = new Coordinate[m + 1];
        for (int k = 0; k < m; k++) {
            c[k] = new Coordinate(snap(f.localX(o[3 * k], o[3 * k + 1], o[3 * k + 2])),
                    snap(f.localY(o[3 * k], o[3 * k + 1], o[3 * k + 2])));
        }
        c[m] = c[0];
        return gf.createPolygon(c);
    }

    private static List<double[]> rings(Geometry g, SurfaceFrame f) {
        List<double[]> out = new ArrayList<>();
        for (int i = 0; i < g.getNumGeometries(); i++) {
            if (!(g.getGeometryN(i) instanceof Polygon p)) continue;
            out.add(world(p.getExteriorRing(), f));
            for (int h = 0; h < p.getNumInteriorRing(); h++) out.add(world(p.getInteriorRingN(h), f));
        }
        return out;
    }

    private static double[] world(LineString ring, SurfaceFrame f) {
        Coordinate[] c = ring.getCoordinates();
        int m = c.length - 1;
        double[] out = new double[3 * m];
        for (int k = 0; k < m; k++) {
            Vec3 w = f.toWorld(c[k].x, c[k].y);
            out[3 * k] = w.x();
            out[3 * k + 1] = w.y();
            out[3 * k + 2] = w.z();
        }
        return out;
    }
}
