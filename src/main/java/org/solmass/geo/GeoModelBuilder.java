package org.solmass.geo;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Polygon;
import org.solmass.InputException;
import org.solmass.model.CoordinateRange;
import org.solmass.model.DoubleList;
import org.solmass.model.IntList;
import org.solmass.model.MassingModel;
import org.solmass.model.ObjReader;
import org.solmass.model.Orientation;
import org.solmass.model.PolygonTriangulator;
import org.solmass.model.SemanticKind;
import org.solmass.model.VertexWelder;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Collects the planar polygons a geo-referenced file describes (in the file's coordinates, each with
 * its block, declared kind and feature number), then builds the {@link MassingModel} in the Solmass
 * frame: the {@link GeoReference} is chosen around the polygons' bounding box, every corner turned
 * into the local frame, every polygon triangulated (without holes by {@link PolygonTriangulator}, the
 * one triangulator of Solmass; with holes by JTS's ear clipping after joining the holes to the shell,
 * {@code org.locationtech.jts.triangulate.polygon.PolygonTriangulator}), degenerate triangles dropped
 * ({@link ObjReader#isDegenerate}), the coordinate range checked and the faces turned to face out of
 * their block ({@link Orientation}), as the OBJ reader does.
 *
 * <p>{@link MassingModel#triangleLine()} holds the feature number (1-based, in file order) a triangle
 * came from: messages name "file: feature N".
 */
final class GeoModelBuilder {
    private static final GeometryFactory GF = new GeometryFactory();

    /** One planar polygon: rings of x, y, z (file coordinates), the first the shell. */
    private record Face(int block, SemanticKind kind, int feature, List<double[]> rings) {}

    private final String name;
    private final Path source;
    private final Map<String, Integer> blocks = new LinkedHashMap<>();
    private final List<Face> faces = new ArrayList<>();
    private double minX = Double.POSITIVE_INFINITY, minY = Double.POSITIVE_INFINITY;
    private double maxX = Double.NEGATIVE_INFINITY, maxY = Double.NEGATIVE_INFINITY;

    GeoModelBuilder(String name, Path source) {
        this.name = name;
        this.source = source;
    }

    /** The id of a block, created when new. */
    int block(String blockName) {
        return blocks.computeIfAbsent(blockName, k -> blocks.size());
    }

    boolean hasBlock(String blockName) { return blocks.containsKey(blockName); }

    /**
     * Adds a polygon.
     *
     * @param rings x,y,z triples per ring (file coordinates; a closing repeat of the first corner is allowed), shell first
     * @param feature feature number, 1-based, for messages
     */
    void polygon(int block, SemanticKind kind, int feature, List<double[]> rings) {
        for (double[] r : rings) {
            for (double c : r) {
                if (!Double.isFinite(c)) {
                    throw new InputException(name + ": feature " + feature, "coordinate " + c
                            + " is not a finite number, expected finite decimal numbers");
                }
            }
            for (int i = 0; i + 2 < r.length; i += 3) {
                minX = Math.min(minX, r[i]); maxX = Math.max(maxX, r[i]);
                minY = Math.min(minY, r[i + 1]); maxY = Math.max(maxY, r[i + 1]);
            }
        }
        faces.add(new Face(block, kind, feature, rings));
    }

    /** The model and its reference; {@code warnings} receives the reader's warnings. */
    GeoModel build(Crs crs, List<String> warnings) {
        if (faces.isEmpty()) throw new InputException(name, "the file has no building polygons to read");
        GeoReference ref = GeoReference.around(crs, minX, minY, maxX, maxY);
        DoubleList v = new DoubleList();
        IntList vFeature = new IntList(), tris = new IntList(), tBlock = new IntList(), tLine = new IntList();
        java.io.ByteArrayOutputStream kinds = new java.io.ByteArrayOutputStream();
        int degenerate = 0;
        for (Face f : faces) {
            List<double[]> local = new ArrayList<>(f.rings.size());
            for (double[] r : f.rings) local.add(toLocal(ref, r));
            int base = v.size() / 3;
            for (double[] r : local) {
                for (double c : r) v.add(c);
                for (int i = 0; i < r.length / 3; i++) vFeature.add(f.feature);
            }
            int[] t;
            try {
                t = triangulate(local);
            } catch (RuntimeException e) {   // JTS on a polygon whose holes cross its shell
                throw new InputException(name + ": feature " + f.feature, "a polygon with holes could not be"
                        + " triangulated (" + e.getMessage() + "); expected holes inside their shell that do not cross it");
            }
            double[] all = v.raw();
            for (int i = 0; i < t.length; i += 3) {
                int a = base + t[i], b = base + t[i + 1], c = base + t[i + 2];
                if (ObjReader.isDegenerate(all, a, b, c)) { degenerate++; continue; }
                tris.add(a); tris.add(b); tris.add(c);
                tBlock.add(f.block); tLine.add(f.feature); kinds.write(f.kind.code());
            }
        }
        if (tris.size() == 0) throw new InputException(name, "every polygon of the file is degenerate (zero area)");
        if (degenerate > 0) warnings.add(name + ": dropped " + degenerate + " degenerate (zero-area) triangle(s)");
        double[] verts = v.toArray();
        CoordinateRange.check(verts, vFeature.toArray(), name);
        byte[] tk = kinds.toByteArray();
        int[] ti = tris.toArray(), tb = tBlock.toArray(), tl = tLine.toArray();
        int[] mat = new int[tb.length];
        java.util.Arrays.fill(mat, -1);
        MassingModel m = new MassingModel(source, List.copyOf(blocks.keySet()), List.of(), verts, ti, tb, mat, tl,
                degenerate, tk);
        double[] b = m.bounds();
        double diagonal = Math.sqrt((b[3] - b[0]) * (b[3] - b[0]) + (b[4] - b[1]) * (b[4] - b[1])
                + (b[5] - b[2]) * (b[5] - b[2]));
        warnings.addAll(Orientation.orient(verts, ti, tb, tl, m.blockNames(), name, VertexWelder.tolerance(diagonal)));
        return new GeoModel(m, ref, List.copyOf(warnings));
    }

    /** A ring in the local frame, without a closing repeat of its first corner. */
    private static double[] toLocal(GeoReference ref, double[] r) {
        int n = r.length / 3;
        if (n > 1 && r[0] == r[3 * n - 3] && r[1] == r[3 * n - 2] && r[2] == r[3 * n - 1]) n--;
        double[] out = new double[3 * n];
        for (int i = 0; i < n; i++) {
            double[] p = ref.toLocal(r[3 * i], r[3 * i + 1], r[3 * i + 2]);
            System.arraycopy(p, 0, out, 3 * i, 3);
        }
        return out;
    }

    /**
     * Triangles of a planar polygon with holes as corner indices into its rings laid end to end, wound
     * as its shell: the polygon is projected on the plane of its Newell normal's dominant axis.
     */
    static int[] triangulate(List<double[]> rings) {
        double[] s = rings.get(0);
        int n = s.length / 3;
        if (n < 3) return new int[0];
        double nx = 0, ny = 0, nz = 0;
        for (int i = 0; i < n; i++) {
            int a = 3 * i, b = 3 * ((i + 1) % n);
            nx += (s[a + 1] - s[b + 1]) * (s[a + 2] + s[b + 2]);
            ny += (s[a + 2] - s[b + 2]) * (s[a] + s[b]);
            nz += (s[a] - s[b]) * (s[a + 1] + s[b + 1]);
        }
        double ax = Math.abs(nx), ay = Math.abs(ny), az = Math.abs(nz);
        if (ax + ay + az == 0) return new int[0];
        int drop = az >= ax && az >= ay ? 2 : (ay >= ax ? 1 : 0);
        int ux = drop == 0 ? 1 : 0, uy = drop == 2 ? 1 : 2;
        if (rings.size() == 1) {
            double[] x = new double[n], y = new double[n];
            for (int i = 0; i < n; i++) { x[i] = s[3 * i + ux]; y[i] = s[3 * i + uy]; }
            return PolygonTriangulator.triangulate(x, y);
        }
        // With holes: JTS's hole joiner and ear clipping in 2D, corners found back by position.
        Map<Coordinate, Integer> index = new HashMap<>();
        LinearRing shell = null;
        List<LinearRing> holes = new ArrayList<>();
        int offset = 0;
        double shellArea2 = 0;
        for (int r = 0; r < rings.size(); r++) {
            double[] ring = rings.get(r);
            int k = ring.length / 3;
            if (k < 3) { offset += k; continue; }
            Coordinate[] cs = new Coordinate[k + 1];
            for (int i = 0; i < k; i++) {
                cs[i] = new Coordinate(ring[3 * i + ux], ring[3 * i + uy]);
                index.putIfAbsent(cs[i], offset + i);
            }
            cs[k] = cs[0].copy();
            if (r == 0) {
                for (int i = 0; i < k; i++) shellArea2 += cs[i].x * cs[i + 1].y - cs[i + 1].x * cs[i].y;
                shell = GF.createLinearRing(cs);
            } else {
                holes.add(GF.createLinearRing(cs));
            }
            offset += k;
        }
        Polygon p = GF.createPolygon(shell, holes.toArray(new LinearRing[0]));
        Geometry t = org.locationtech.jts.triangulate.polygon.PolygonTriangulator.triangulate(p);
        IntList out = new IntList();
        for (int g = 0; g < t.getNumGeometries(); g++) {
            Coordinate[] c = t.getGeometryN(g).getCoordinates();
            Integer a = index.get(c[0]), b = index.get(c[1]), d = index.get(c[2]);
            if (a == null || b == null || d == null) continue;
            double area2 = (c[1].x - c[0].x) * (c[2].y - c[0].y) - (c[1].y - c[0].y) * (c[2].x - c[0].x);
            if (area2 == 0) continue;
            boolean same = (area2 > 0) == (shellArea2 > 0);
            out.add(a);
            out.add(same ? b : d);
            out.add(same ? d : b);
        }
        return out.toArray();
    }
}
