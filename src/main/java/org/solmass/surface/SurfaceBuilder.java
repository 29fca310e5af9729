package org.solmass.surface;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Location;
import org.locationtech.jts.algorithm.locate.IndexedPointInAreaLocator;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Point;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.algorithm.Area;
import org.locationtech.jts.geom.util.AffineTransformation;
import org.locationtech.jts.operation.overlayng.OverlayNGRobust;
import org.solmass.model.IntList;
import org.solmass.model.MassingModel;
import org.solmass.model.Parallel;
import org.solmass.model.SemanticKind;
import org.solmass.model.TriangleGeometry;
import org.solmass.model.VertexWelder;
import org.solmass.model.Vec3;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Merges the coplanar, edge-connected triangles of each block into planar surfaces.
 *
 * <p>Two triangles are coplanar when their unit normals differ by at most {@link #COPLANAR_ANGLE_DEG}
 * and every corner of the candidate lies within the plane distance tolerance of the plane of the
 * group's first triangle (compared with the first triangle, not chained, so that a finely
 * tessellated curved wall does not drift into one "plane"). The group is then projected into its
 * frame and united with JTS (OverlayNG). Before that, vertices are welded by position
 * ({@link VertexWelder}): CAD exports write duplicate vertices per face, and welded corners make
 * shared edges coincide exactly. Each connected part of the union (triangles sharing an edge,
 * including T-junctions) is one surface; parts that only touch at a point are separate surfaces.
 * Holes narrower than the weld tolerance (mean width = 2 area / perimeter) are hairline gaps
 * between triangles, not openings, and are filled.
 *
 * <p>Tolerances scale with the model's bounding-box diagonal D (of the vertices that faces use,
 * {@link MassingModel#bounds()}): weld tolerance
 * {@code max(1e-6 D, 1e-9 m)}; plane distance tolerance {@code max(1e-5 D, 1 mm)}. A surface's plane
 * has the area-weighted mean normal of its triangles and passes through the first vertex of its
 * first triangle, which is also the origin of the frame used for the union, so axis-aligned faces
 * keep exact local coordinates. Triangles the file declares as different kinds (a roof and a wall,
 * {@link MassingModel#semanticKind}) never share a surface, and a declared kind is kept
 * ({@link SurfaceClassifier#classify(SemanticKind, Vec3, double, double)}).
 */
public final class SurfaceBuilder {
    /** Maximum angle between the normals of coplanar triangles, degrees. */
    public static final double COPLANAR_ANGLE_DEG = 1.0;
    /** Weld tolerance relative to the model's bounding-box diagonal ({@link VertexWelder#WELD_REL}). */
    public static final double WELD_REL = VertexWelder.WELD_REL;
    /** Plane distance tolerance relative to the model's bounding-box diagonal. */
    public static final double PLANE_REL = 1e-5;
    /** Smallest plane distance tolerance, metres. */
    public static final double PLANE_MIN_M = 1e-3;

    private static final double COS_TOL = Math.cos(Math.toRadians(COPLANAR_ANGLE_DEG));
    /** Normal bucket size: 2 degrees of arc (twice the tolerance), so neighbours cover all matches. */
    private static final double BUCKET = 2 * Math.sin(Math.toRadians(COPLANAR_ANGLE_DEG));

    private static final GeometryFactory FLOATING = new GeometryFactory();

    private SurfaceBuilder() {}

    /** Weld tolerance for a model, metres. */
    public static double weldTolerance(MassingModel m) { return VertexWelder.tolerance(diagonal(m)); }

    /** Plane distance tolerance for a model, metres. */
    public static double planeTolerance(MassingModel m) { return Math.max(PLANE_REL * diagonal(m), PLANE_MIN_M); }

    static double diagonal(MassingModel m) {
        double[] b = m.bounds();
        return Math.sqrt(sq(b[3] - b[0]) + sq(b[4] - b[1]) + sq(b[5] - b[2]));
    }

    private static double sq(double x) { return x * x; }

    /** Builds the surfaces of all blocks, ordered by block, then by first triangle, then by part. */
    public static List<Surface> build(MassingModel m) {
        List<IntList> groups = groupCoplanar(m);
        double ground = m.minZ(), weld = weldTolerance(m);
        int[] rep = VertexWelder.weld(m.vertices(), weld);
        List<List<Draft>> perGroup = Parallel.map(groups.size(), g -> unite(m, groups.get(g), rep, weld, ground));
        List<Surface> out = new ArrayList<>();
        int[] perBlock = new int[m.blockNames().size()];
        for (List<Draft> ds : perGroup) {
            for (Draft d : ds) {
                out.add(new Surface(out.size(), d.block, perBlock[d.block]++, d.kind, d.frame.normal(), d.area,
                        d.offset, d.triangles, d.polygon, d.frame));
            }
        }
        return out;
    }

    private record Draft(int block, SurfaceKind kind, double area, double offset, int[] triangles,
                         Polygon polygon, SurfaceFrame frame) {}

    /** Groups triangle ids by (block, plane), in order of each group's first triangle. */
    static List<IntList> groupCoplanar(MassingModel m) {
        int nt = m.triangleCount();
        double tol = planeTolerance(m);
        double[] v = m.vertices();
        int[] tri = m.triangles(), tb = m.triangleBlock();
        byte[] tk = m.triangleKind();
        List<IntList> groups = new ArrayList<>();
        List<double[]> planes = new ArrayList<>(); // nx, ny, nz, d of each group's first triangle
        Map<Long, IntList> buckets = new HashMap<>();
        double[] n = new double[3];
        int last = -1;
        for (int t = 0; t < nt; t++) {
            if (!TriangleGeometry.unitNormal(v, tri, t, n)) continue; // zero-area triangle (only in synthetic models)
            int found = -1;
            if (last >= 0 && tb[groups.get(last).get(0)] == tb[t] && sameKind(tk, groups.get(last).get(0), t)
                    && matches(planes.get(last), n, v, tri, t, tol)) {
                found = last;
            } else {
                int bx = (int) Math.floor(n[0] / BUCKET), by = (int) Math.floor(n[1] / BUCKET);
                int bz = (int) Math.floor(n[2] / BUCKET);
                for (int dx = -1; dx <= 1; dx++) for (int dy = -1; dy <= 1; dy++) for (int dz = -1; dz <= 1; dz++) {
                    IntList cand = buckets.get(key(tb[t], bx + dx, by + dy, bz + dz));
                    if (cand == null) continue;
                    for (int c = 0; c < cand.size(); c++) {
                        int g = cand.get(c);
                        if (sameKind(tk, groups.get(g).get(0), t) && matches(planes.get(g), n, v, tri, t, tol)
                                && (found < 0 || g < found)) found = g;
                    }
                }
            }
            if (found < 0) {
                found = groups.size();
                IntList g = new IntList(8);
                groups.add(g);
                int a = tri[3 * t] * 3;
                planes.add(new double[]{n[0], n[1], n[2], n[0] * v[a] + n[1] * v[a + 1] + n[2] * v[a + 2]});
                long k = key(tb[t], (int) Math.floor(n[0] / BUCKET), (int) Math.floor(n[1] / BUCKET),
                        (int) Math.floor(n[2] / BUCKET));
                buckets.computeIfAbsent(k, x -> new IntList(4)).add(found);
            }
            groups.get(found).add(t);
            last = found;
        }
        return groups;
    }

    /** Whether two triangles are declared the same kind (a roof and a wall never share a surface). */
    private static boolean sameKind(byte[] kinds, int a, int b) { return kinds == null || kinds[a] == kinds[b]; }

    private static long key(int block, int bx, int by, int bz) {
        return ((long) block << 24) ^ ((long) (bx + 128) << 16) ^ ((long) (by + 128) << 8) ^ (bz + 128);
    }

    private static boolean matches(double[] p, double[] n, double[] v, int[] tri, int t, double tol) {
        if (p[0] * n[0] + p[1] * n[1] + p[2] * n[2] < COS_TOL) return false;
        for (int k = 0; k < 3; k++) {
            int a = tri[3 * t + k] * 3;
            if (Math.abs(p[0] * v[a] + p[1] * v[a + 1] + p[2] * v[a + 2] - p[3]) > tol) return false;
        }
        return true;
    }


    /** The polygon without holes whose mean width (2 area / perimeter) is below {@code weld}. */
    static Polygon fillHairlineHoles(Polygon p, double weld) {
        int nh = p.getNumInteriorRing();
        if (nh == 0) return p;
        List<LinearRing> keep = new ArrayList<>(nh);
        for (int h = 0; h < nh; h++) {
            LinearRing r = p.getInteriorRingN(h);
            double area = Math.abs(Area.ofRing(r.getCoordinateSequence())), len = r.getLength();
            if (2 * area / len >= weld) keep.add(r);
        }
        if (keep.size() == nh) return p;
        return p.getFactory().createPolygon(p.getExteriorRing(), keep.toArray(new LinearRing[0]));
    }

    /** Unites one coplanar group into one surface per connected part. */
    private static List<Draft> unite(MassingModel m, IntList group, int[] rep, double weld, double groundZ) {
        double[] v = m.vertices();
        int[] tri = m.triangles();
        int k = group.size();
        double sx = 0, sy = 0, sz = 0;
        double[] cr = new double[3];
        for (int i = 0; i < k; i++) {
            int t = group.get(i);
            TriangleGeometry.cross(v, tri, t, cr);
            sx += cr[0]; sy += cr[1]; sz += cr[2];
        }
        Vec3 normal = new Vec3(sx, sy, sz).normalized();
        // The plane: area-weighted mean normal through the first vertex of the group's first triangle
        // (every corner of the group is within the plane tolerance of that vertex's plane).
        int first = rep[tri[3 * group.get(0)]] * 3;
        Vec3 p0 = new Vec3(v[first], v[first + 1], v[first + 2]);
        double offset = normal.dot(p0);
        SurfaceFrame f0 = SurfaceFrame.of(normal, p0);
        GeometryFactory gf = FLOATING;
        List<Geometry> polys = new ArrayList<>(k);
        Coordinate[][] triCoords = new Coordinate[k][];
        for (int i = 0; i < k; i++) {
            int t = group.get(i);
            Coordinate[] cs = new Coordinate[4];
            for (int j = 0; j < 3; j++) {
                int p = rep[tri[3 * t + j]] * 3;
                cs[j] = new Coordinate(f0.localX(v[p], v[p + 1], v[p + 2]), f0.localY(v[p], v[p + 1], v[p + 2]));
            }
            cs[3] = cs[0].copy();
            triCoords[i] = cs;
            double twiceArea = (cs[1].x - cs[0].x) * (cs[2].y - cs[0].y) - (cs[1].y - cs[0].y) * (cs[2].x - cs[0].x);
            if (twiceArea != 0) polys.add(gf.createPolygon(cs)); // a triangle collapsed by welding adds nothing

        }
        Geometry union = OverlayNGRobust.union(polys, gf);
        List<Polygon> parts = new ArrayList<>();
        for (int i = 0; i < union.getNumGeometries(); i++) {
            Geometry g = union.getGeometryN(i);
            if (g instanceof Polygon p && p.getArea() > 0) parts.add(fillHairlineHoles(p, weld));
        }
        List<Draft> out = new ArrayList<>(parts.size());
        if (parts.isEmpty()) return out;
        int[] partOf = new int[k];
        if (parts.size() > 1) {
            Envelope[] envs = new Envelope[parts.size()];
            IndexedPointInAreaLocator[] locators = new IndexedPointInAreaLocator[parts.size()];
            for (int p = 0; p < parts.size(); p++) {
                envs[p] = parts.get(p).getEnvelopeInternal();
                locators[p] = new IndexedPointInAreaLocator(parts.get(p));
            }
            for (int i = 0; i < k; i++) {
                Coordinate[] cs = triCoords[i];
                Point c = gf.createPoint(new Coordinate((cs[0].x + cs[1].x + cs[2].x) / 3,
                        (cs[0].y + cs[1].y + cs[2].y) / 3));
                int best = -1;
                for (int p = 0; p < parts.size() && best < 0; p++) {
                    if (envs[p].covers(c.getCoordinate()) && locators[p].locate(c.getCoordinate()) != Location.EXTERIOR) best = p;
                }
                double bestD = Double.POSITIVE_INFINITY;
                for (int p = 0; p < parts.size() && best < 0; p++) { // centroid off every part: nearest part
                    double d = parts.get(p).distance(c);
                    if (d < bestD) { bestD = d; partOf[i] = p; }
                }
                if (best >= 0) partOf[i] = best;
            }
        }
        int block = m.triangleBlock()[group.get(0)];
        for (int p = 0; p < parts.size(); p++) {
            Polygon poly = parts.get(p);
            IntList ts = new IntList(k);
            for (int i = 0; i < k; i++) if (partOf[i] == p) ts.add(group.get(i));
            var env = poly.getEnvelopeInternal();
            SurfaceFrame frame = f0.withOrigin(f0.toWorld(env.getMinX(), env.getMinY()));
            Polygon local = (Polygon) AffineTransformation.translationInstance(-env.getMinX(), -env.getMinY())
                    .transform(poly);
            double maxZ = Double.NEGATIVE_INFINITY;
            for (Coordinate c : local.getExteriorRing().getCoordinates()) {
                maxZ = Math.max(maxZ, frame.toWorld(c.x, c.y).z());
            }
            SurfaceKind kind = SurfaceClassifier.classify(m.semanticKind(group.get(0)), normal, maxZ, groundZ);
            out.add(new Draft(block, kind, local.getArea(), offset, ts.toArray(), local, frame));
        }
        return out;
    }
}
