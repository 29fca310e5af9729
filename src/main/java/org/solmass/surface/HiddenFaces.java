package org.solmass.surface;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Polygon;
import org.solmass.model.Vec3;

import java.util.ArrayList;
import java.util.List;

/**
 * Faces hidden against a touching block: where two surfaces lie in one plane with opposite normals
 * (the shared wall of two blocks modelled as separate boxes, common in massing exports), the part of
 * each covered by the other faces into solid mass and sees nothing. Those parts are not patched, so
 * they neither report zero sky view nor count in areas and totals.
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
        double[][] box = new double[n][];
        for (int i = 0; i < n; i++) box[i] = worldBox(surfaces.get(i));
        double cosTol = Math.cos(Math.toRadians(180 - ANGLE_TOL_DEG));
        for (int i = 0; i < n; i++) {
            Surface a = surfaces.get(i);
            List<Geometry> covers = new ArrayList<>();
            for (int j = 0; j < n; j++) {
                if (i == j) continue;
                Surface b = surfaces.get(j);
                if (a.normal().dot(b.normal()) > cosTol) continue;                 // not opposite
                double tol = Math.max(PLANE_TOL_M, 1e-6 * Math.max(box[i][6], box[j][6]));
                if (Math.abs(a.planeOffsetM() + b.planeOffsetM()) > tol) continue;  // not the same plane
                if (!overlap(box[i], box[j], tol)) continue;
                covers.add(inFrameOf(a, b));
            }
            Geometry poly = a.polygon();
            if (!covers.isEmpty()) {
                Geometry cover = poly.getFactory().buildGeometry(covers).union();
                Geometry inter = poly.intersection(cover);
                if (inter.getArea() > MIN_OVERLAP_M2) poly = poly.difference(cover);
            }
            out[i] = poly;
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
