package org.solmass.surface;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.TopologyException;
import org.locationtech.jts.operation.overlayng.OverlayNG;
import org.locationtech.jts.operation.overlayng.OverlayNGRobust;
import org.solmass.model.Parallel;
import org.solmass.model.Vec3;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Faces hidden against a touching block: where two surfaces lie in one plane with opposite normals
 * (the shared wall of two blocks modelled as separate boxes, common in massing exports), the part of
 * each covered by the other faces into solid mass and sees nothing. Those parts are not patched, so
 * they neither report zero sky view nor count in areas and totals.
 *
 * <p>The same test with normals alike finds a block written twice under two names
 * ({@link #duplicates}).
 *
 * <p>Tolerances: normals opposite within {@link #ANGLE_TOL_DEG}, planes within
 * {@link #PLANE_TOL_M} (or 1e-6 of the surfaces' size, whichever is larger); overlaps under
 * {@link #MIN_OVERLAP_M2} are ignored.
 */
public final class HiddenFaces {
    public static final double ANGLE_TOL_DEG = 1.0;
    public static final double PLANE_TOL_M = 0.01;
    public static final double MIN_OVERLAP_M2 = 1e-4;

    private HiddenFaces() {}

    /**
     * The exposed part of every surface in its own frame's local coordinates: the surface polygon
     * minus every coincident opposite surface; the polygon itself where nothing covers it.
     */
    public static Geometry[] exposed(List<Surface> surfaces) {
        int n = surfaces.size();
        Geometry[] out = new Geometry[n];
        List<List<Integer>> covering = coincident(surfaces, true);
        Parallel.forEach(n, i -> { // each surface's overlays on its own (JTS geometries are only read)
            Surface a = surfaces.get(i);
            List<Geometry> covers = new ArrayList<>();
            for (int j : covering.get(i)) covers.add(inFrameOf(a, surfaces.get(j)));
            Geometry poly = a.polygon();
            if (!covers.isEmpty()) {
                Geometry cover = union(poly.getFactory().buildGeometry(covers));
                Geometry inter = overlay(poly, cover, OverlayNG.INTERSECTION);
                if (inter.getArea() > MIN_OVERLAP_M2) poly = overlay(poly, cover, OverlayNG.DIFFERENCE);
            }
            out[i] = poly;
        });
        return out;
    }

    /**
     * JTS's overlay, and where its classic noding fails on nearly coincident edges (a
     * TopologyException, found by fuzzing faces that touch at 1e-13 m) the snapping overlay of
     * OverlayNGRobust (JTS 1.18+), which is built for such input. The classic one stays first so
     * ordinary models keep their exact results.
     */
    static Geometry overlay(Geometry a, Geometry b, int op) {
        try {
            return op == OverlayNG.INTERSECTION ? a.intersection(b) : a.difference(b);
        } catch (TopologyException e) {
            return OverlayNGRobust.overlay(a, b, op);
        }
    }

    /** The union of a collection, with the same fallback as {@link #overlay}. */
    static Geometry union(Geometry g) {
        try {
            return g.union();
        } catch (TopologyException e) {
            return OverlayNGRobust.union(g);
        }
    }

    /**
     * Two surfaces of different blocks that lie in one plane and face the same way, and the area they
     * share (over {@link #MIN_OVERLAP_M2}), square metres.
     */
    public record Duplicate(int surfaceA, int surfaceB, double areaM2) {}

    /**
     * Faces of two different blocks in the same place facing the same way: a block written twice
     * under two names (its areas and totals would count twice). The same plane and overlap tests as
     * {@link #exposed}, with normals alike instead of opposite; pairs in order of surface ids, a &lt; b.
     */
    public static List<Duplicate> duplicates(List<Surface> surfaces) {
        List<List<Integer>> same = coincident(surfaces, false);
        List<Duplicate> out = new ArrayList<>();
        for (int i = 0; i < surfaces.size(); i++) {
            Surface a = surfaces.get(i);
            for (int j : same.get(i)) {
                Surface b = surfaces.get(j);
                if (j <= i || a.block() == b.block()) continue;
                double area = overlay(a.polygon(), inFrameOf(a, b), OverlayNG.INTERSECTION).getArea();
                if (area > MIN_OVERLAP_M2) out.add(new Duplicate(i, j, area));
            }
        }
        return out;
    }

    /**
     * For every surface, the other surfaces in the same plane (within the tolerances) whose world
     * boxes overlap it and whose normals are opposite ({@code opposite}) or alike.
     */
    private static List<List<Integer>> coincident(List<Surface> surfaces, boolean opposite) {
        int n = surfaces.size();
        double[][] box = new double[n][];
        for (int i = 0; i < n; i++) box[i] = worldBox(surfaces.get(i));
        double cosOpposite = Math.cos(Math.toRadians(180 - ANGLE_TOL_DEG)), cosAlike = Math.cos(Math.toRadians(ANGLE_TOL_DEG));
        // Only surfaces whose plane offsets lie within the largest tolerance of any pair can pass the
        // plane test: with the surfaces sorted by offset each one looks at that window alone (not at
        // every other surface: a city of 10^4 surfaces made 10^8 pairs), and every test below is the
        // same as before, so are the lists (ascending j).
        double tolMax = PLANE_TOL_M;
        for (double[] b : box) tolMax = Math.max(tolMax, 1e-6 * b[6]);
        double[] off = new double[n];
        for (int i = 0; i < n; i++) off[i] = surfaces.get(i).planeOffsetM();
        int[] byOff = IntStream.range(0, n).boxed().sorted((x, y) -> Double.compare(off[x], off[y])).mapToInt(Integer::intValue).toArray();
        double[] sorted = new double[n];
        for (int k = 0; k < n; k++) sorted[k] = off[byOff[k]];
        List<List<Integer>> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            Surface a = surfaces.get(i);
            List<Integer> found = new ArrayList<>();
            double target = opposite ? -off[i] : off[i];
            double w = tolMax * (1 + 1e-9) + 1e-9 * (Math.abs(target) + 1); // far above the rounding of the sum below
            int k = lowerBound(sorted, target - w);
            for (; k < n && sorted[k] <= target + w; k++) {
                int j = byOff[k];
                if (i == j) continue;
                Surface b = surfaces.get(j);
                double dot = a.normal().dot(b.normal());
                if (opposite ? dot > cosOpposite : dot < cosAlike) continue;           // not opposite / not alike
                double tol = Math.max(PLANE_TOL_M, 1e-6 * Math.max(box[i][6], box[j][6]));
                double planeGap = opposite ? a.planeOffsetM() + b.planeOffsetM() : a.planeOffsetM() - b.planeOffsetM();
                if (Math.abs(planeGap) > tol) continue;                                 // not the same plane
                if (!overlap(box[i], box[j], tol)) continue;
                found.add(j);
            }
            found.sort(null);
            out.add(found);
        }
        return out;
    }

    /** Surface b's polygon expressed in surface a's frame (both lie in one plane). */
    static Polygon inFrameOf(Surface a, Surface b) {
        GeometryFactory f = a.polygon().getFactory();
        Polygon p = b.polygon();
        LinearRing shell = ring(f, p.getExteriorRing().getCoordinates(), a, b);
        LinearRing[] holes = new LinearRing[p.getNumInteriorRing()];
        for (int h = 0; h < holes.length; h++) holes[h] = ring(f, p.getInteriorRingN(h).getCoordinates(), a, b);
        return f.createPolygon(shell, holes);
    }

    private static LinearRing ring(GeometryFactory f, Coordinate[] cs, Surface a, Surface b) {
        Coordinate[] out = new Coordinate[cs.length];
        for (int k = 0; k < cs.length; k++) {
            Vec3 w = b.frame().toWorld(cs[k].x, cs[k].y);
            out[k] = new Coordinate(a.frame().localX(w.x(), w.y(), w.z()), a.frame().localY(w.x(), w.y(), w.z()));
        }
        return f.createLinearRing(out);
    }

    /** World bounding box {minX, minY, minZ, maxX, maxY, maxZ, diagonal} of a surface. */
    /** The first index k of ascending {@code a} with {@code a[k] >= x} ({@code a.length} if none). */
    private static int lowerBound(double[] a, double x) {
        int lo = 0, hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] < x) lo = mid + 1;
            else hi = mid;
        }
        return lo;
    }

    private static double[] worldBox(Surface s) {
        double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, 0};
        for (Coordinate c : s.polygon().getExteriorRing().getCoordinates()) {
            Vec3 w = s.frame().toWorld(c.x, c.y);
            double[] v = {w.x(), w.y(), w.z()};
            for (int k = 0; k < 3; k++) {
                b[k] = Math.min(b[k], v[k]);
                b[k + 3] = Math.max(b[k + 3], v[k]);
            }
        }
        b[6] = Math.sqrt(Math.pow(b[3] - b[0], 2) + Math.pow(b[4] - b[1], 2) + Math.pow(b[5] - b[2], 2));
        return b;
    }

    private static boolean overlap(double[] a, double[] b, double tol) {
        for (int k = 0; k < 3; k++) if (a[k] > b[k + 3] + tol || b[k] > a[k + 3] + tol) return false;
        return true;
    }
}
