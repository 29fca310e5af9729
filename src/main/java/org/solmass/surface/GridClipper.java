package org.solmass.surface;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LineString;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.overlayng.OverlayNG;
import org.locationtech.jts.operation.overlayng.OverlayNGRobust;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Clips a square grid anchored at (0, 0) to a polygon (with holes). Cells whose open interior no
 * polygon edge enters are wholly inside or wholly outside; they are told apart by the even-odd
 * crossing rule at the cell centre (point in polygon, common practice) and need no overlay. Only the
 * cells an edge passes through are clipped with JTS OverlayNG. Edge/cell tests use Liang-Barsky
 * parametric clipping (Liang and Barsky, 1984, "A new concept and method for line clipping",
 * ACM Transactions on Graphics 3(1):1-22).
 */
final class GridClipper {
    private static final GeometryFactory GF = new GeometryFactory();

    private GridClipper() {}

    /** One clipped piece: a polygon in cell (i, j); {@code full} when it is the whole cell. */
    record Cut(Polygon polygon, int i, int j, boolean full) {}

    static List<Cut> cut(Polygon poly, double s) {
        Envelope env = poly.getEnvelopeInternal();
        int nu = Math.max(1, (int) Math.ceil(env.getMaxX() / s)), nv = Math.max(1, (int) Math.ceil(env.getMaxY() / s));
        List<double[]> edges = new ArrayList<>(); // ax, ay, bx, by
        addRing(poly.getExteriorRing(), edges);
        for (int h = 0; h < poly.getNumInteriorRing(); h++) addRing(poly.getInteriorRingN(h), edges);
        boolean[] boundary = new boolean[nu * nv];
        for (double[] e : edges) markCells(e, s, nu, nv, boundary);
        List<Cut> out = new ArrayList<>();
        double[] xs = new double[edges.size()];
        for (int j = 0; j < nv; j++) {
            double cy = (j + 0.5) * s;
            int nx = 0;
            for (double[] e : edges) {
                if ((e[1] > cy) != (e[3] > cy)) xs[nx++] = e[0] + (cy - e[1]) * (e[2] - e[0]) / (e[3] - e[1]);
            }
            Arrays.sort(xs, 0, nx);
            int k = 0;
            for (int i = 0; i < nu; i++) {
                double x0 = i * s, x1 = (i + 1) * s, y0 = j * s, y1 = (j + 1) * s;
                if (boundary[j * nu + i]) {
                    Geometry clip = OverlayNGRobust.overlay(poly, rect(x0, y0, x1, y1), OverlayNG.INTERSECTION);
                    for (int p = 0; p < clip.getNumGeometries(); p++) {
                        if (clip.getGeometryN(p) instanceof Polygon part && part.getArea() > 0) out.add(new Cut(part, i, j, false));
                    }
                    continue;
                }
                double cx = (i + 0.5) * s;
                while (k < nx && xs[k] < cx) k++;
                if ((k & 1) == 1) out.add(new Cut(rect(x0, y0, x1, y1), i, j, true));
            }
        }
        return out;
    }

    private static Polygon rect(double x0, double y0, double x1, double y1) {
        return GF.createPolygon(new Coordinate[]{new Coordinate(x0, y0), new Coordinate(x1, y0),
                new Coordinate(x1, y1), new Coordinate(x0, y1), new Coordinate(x0, y0)});
    }

    private static void addRing(LineString ring, List<double[]> edges) {
        Coordinate[] cs = ring.getCoordinates();
        for (int i = 0; i + 1 < cs.length; i++) {
            if (cs[i].x == cs[i + 1].x && cs[i].y == cs[i + 1].y) continue;
            edges.add(new double[]{cs[i].x, cs[i].y, cs[i + 1].x, cs[i + 1].y});
        }
    }

    /** Marks the cells whose open interior the edge enters. */
    private static void markCells(double[] e, double s, int nu, int nv, boolean[] boundary) {
        int i0 = clamp((int) Math.floor(Math.min(e[0], e[2]) / s), nu), i1 = clamp((int) Math.floor(Math.max(e[0], e[2]) / s), nu);
        int j0 = clamp((int) Math.floor(Math.min(e[1], e[3]) / s), nv), j1 = clamp((int) Math.floor(Math.max(e[1], e[3]) / s), nv);
        for (int j = j0; j <= j1; j++) {
            for (int i = i0; i <= i1; i++) {
                if (!boundary[j * nu + i] && entersInterior(e, i * s, j * s, (i + 1) * s, (j + 1) * s)) {
                    boundary[j * nu + i] = true;
                }
            }
        }
    }

    private static int clamp(int i, int n) { return Math.max(0, Math.min(n - 1, i)); }

    /**
     * Whether segment e meets the open rectangle (x0, x1) x (y0, y1): clip it to the closed rectangle
     * (Liang-Barsky) and test the clipped part's midpoint, which is interior unless the part lies on a side.
     */
    static boolean entersInterior(double[] e, double x0, double y0, double x1, double y1) {
        double dx = e[2] - e[0], dy = e[3] - e[1];
        double[] t = {0, 1};
        if (!clipT(-dx, e[0] - x0, t) || !clipT(dx, x1 - e[0], t) || !clipT(-dy, e[1] - y0, t) || !clipT(dy, y1 - e[1], t)) {
            return false;
        }
        double tm = 0.5 * (t[0] + t[1]);
        double mx = e[0] + tm * dx, my = e[1] + tm * dy;
        return mx > x0 && mx < x1 && my > y0 && my < y1;
    }

    private static boolean clipT(double p, double q, double[] t) {
        if (p == 0) return q >= 0;
        double r = q / p;
        if (p < 0) {
            if (r > t[1]) return false;
            if (r > t[0]) t[0] = r;
        } else {
            if (r < t[0]) return false;
            if (r < t[1]) t[1] = r;
        }
        return true;
    }
}
