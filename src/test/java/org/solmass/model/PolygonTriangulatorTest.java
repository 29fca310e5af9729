package org.solmass.model;

import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

class PolygonTriangulatorTest {

    /** Shoelace area of a planar polygon in the x-y plane (Gauss's area formula; elementary). */
    static double shoelace(double[] xs, double[] ys) {
        double a = 0;
        for (int i = 0; i < xs.length; i++) {
            int j = (i + 1) % xs.length;
            a += xs[i] * ys[j] - xs[j] * ys[i];
        }
        return a / 2;
    }

    @Test
    void randomStarShapedPolygonsKeepTheirAreaAndOrientation() {
        Random rnd = new Random(12345);
        PolygonTriangulator tri = new PolygonTriangulator();
        for (int trial = 0; trial < 500; trial++) {
            int base = 3 + rnd.nextInt(30);
            // star-shaped about the origin (angle gaps below pi), random radii: simple, often concave
            java.util.List<double[]> pts = new java.util.ArrayList<>();
            for (int i = 0; i < base; i++) {
                double ang = (i + 0.8 * rnd.nextDouble()) * 2 * Math.PI / base;
                double r = 0.2 + rnd.nextDouble() * 5;
                double[] p = {r * Math.cos(ang), r * Math.sin(ang)};
                if (i > 0 && rnd.nextInt(4) == 0) { // collinear vertex: midpoint of the edge from the previous
                    double[] q = pts.get(pts.size() - 1);
                    pts.add(new double[]{(q[0] + p[0]) / 2, (q[1] + p[1]) / 2});
                }
                pts.add(p);
            }
            int n = pts.size();
            double[] xs = new double[n], ys = new double[n];
            double[] v = new double[3 * n];
            int[] face = new int[n];
            for (int i = 0; i < n; i++) { xs[i] = pts.get(i)[0]; ys[i] = pts.get(i)[1]; }
            double expected = shoelace(xs, ys);
            // tilt the plane so that the 3D projection path is exercised: (x, y) -> (x, y*0.6, y*0.8)
            for (int i = 0; i < n; i++) {
                v[3 * i] = xs[i]; v[3 * i + 1] = ys[i] * 0.6; v[3 * i + 2] = ys[i] * 0.8;
                face[i] = i;
            }
            IntList out = new IntList();
            tri.triangulate(face, n, v, out);
            double sum = 0;
            for (int t = 0; t < out.size(); t += 3) {
                int a = out.get(t) * 3, b = out.get(t + 1) * 3, c = out.get(t + 2) * 3;
                Vec3 pa = new Vec3(v[a], v[a + 1], v[a + 2]), pb = new Vec3(v[b], v[b + 1], v[b + 2]);
                Vec3 pc = new Vec3(v[c], v[c + 1], v[c + 2]);
                Vec3 cr = pb.minus(pa).cross(pc.minus(pa));
                // same orientation as the polygon: normal (0, -0.8, 0.6) (plane tilted about x)
                assertTrue(cr.dot(new Vec3(0, -0.8, 0.6)) >= -1e-12, "triangle flipped in trial " + trial);
                sum += 0.5 * cr.length();
            }
            assertEquals(expected, sum, 1e-9 * Math.max(1, expected), "trial " + trial + " n=" + n);
        }
    }

    @Test
    void randomOrthogonalPolygonsWithCollinearRunsKeepTheirArea() {
        // Outlines of unions of random grid squares (JTS): strongly concave, many collinear vertices.
        // Reference area: JTS Polygon.getArea of the hole-free exterior ring (shoelace).
        Random rnd = new Random(31);
        org.locationtech.jts.geom.GeometryFactory gf = new org.locationtech.jts.geom.GeometryFactory();
        PolygonTriangulator tri = new PolygonTriangulator();
        int tested = 0;
        for (int trial = 0; trial < 150; trial++) {
            java.util.List<org.locationtech.jts.geom.Geometry> cells = new java.util.ArrayList<>();
            for (int k = 0; k < 6 + rnd.nextInt(30); k++) {
                int x = rnd.nextInt(8), y = rnd.nextInt(8);
                cells.add(gf.toGeometry(new org.locationtech.jts.geom.Envelope(x, x + 1, y, y + 1)));
            }
            org.locationtech.jts.geom.Geometry u = org.locationtech.jts.operation.union.UnaryUnionOp.union(cells);
            org.locationtech.jts.geom.Polygon p = null;
            for (int i = 0; i < u.getNumGeometries(); i++) {
                if (u.getGeometryN(i) instanceof org.locationtech.jts.geom.Polygon q && (p == null || q.getArea() > p.getArea())) p = q;
            }
            org.locationtech.jts.geom.Coordinate[] cs = p.getExteriorRing().getCoordinates();
            org.locationtech.jts.geom.Polygon shell = gf.createPolygon(cs);
            if (!shell.isSimple() || !shell.isValid()) continue; // a shell touching itself at a corner is not simple
            int n = cs.length - 1;
            boolean reverse = !org.locationtech.jts.algorithm.Orientation.isCCW(cs);
            double[] v = new double[3 * n];
            int[] face = new int[n];
            for (int i = 0; i < n; i++) {
                org.locationtech.jts.geom.Coordinate c = cs[reverse ? n - i : i];
                v[3 * i] = c.x; v[3 * i + 1] = c.y; v[3 * i + 2] = 2.0;
                face[i] = i;
            }
            IntList out = new IntList();
            tri.triangulate(face, n, v, out);
            double sum = 0;
            for (int t = 0; t < out.size(); t += 3) {
                int a = out.get(t) * 3, b = out.get(t + 1) * 3, c = out.get(t + 2) * 3;
                double cr = (v[b] - v[a]) * (v[c + 1] - v[a + 1]) - (v[b + 1] - v[a + 1]) * (v[c] - v[a]);
                assertTrue(cr >= 0, "flipped triangle in trial " + trial);
                sum += cr / 2;
            }
            assertEquals(shell.getArea(), sum, 1e-9, "trial " + trial + " " + shell);
            tested++;
        }
        assertTrue(tested > 50, "tested " + tested);
    }

    @Test
    void repeatedVerticesAndClosingRepeatAreIgnored() {
        double[] v = {0, 0, 0, 1, 0, 0, 1, 1, 0, 0, 1, 0};
        IntList out = new IntList();
        int made = new PolygonTriangulator().triangulate(new int[]{0, 1, 1, 2, 3, 0}, 6, v, out);
        assertEquals(2, made);
    }
}
