package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.overlayng.OverlayNG;
import org.locationtech.jts.operation.overlayng.OverlayNGRobust;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

class GridClipperTest {
    private static final GeometryFactory GF = new GeometryFactory();

    private static Polygon rect(double x0, double y0, double x1, double y1) {
        return GF.createPolygon(new Coordinate[]{new Coordinate(x0, y0), new Coordinate(x1, y0),
                new Coordinate(x1, y1), new Coordinate(x0, y1), new Coordinate(x0, y0)});
    }

    /** Random star-shaped polygon with an optional rectangular hole, shifted so its envelope starts at 0. */
    private static Polygon randomPolygon(Random rnd) {
        int n = 3 + rnd.nextInt(12);
        Coordinate[] cs = new Coordinate[n + 1];
        double scale = 1 + rnd.nextDouble() * 8;
        for (int i = 0; i < n; i++) {
            double a = (i + 0.8 * rnd.nextDouble()) * 2 * Math.PI / n, r = scale * (0.4 + 0.6 * rnd.nextDouble());
            // snap some corners to a 0.5 grid so that edges run along cell lines too
            double x = r * Math.cos(a), y = r * Math.sin(a);
            if (rnd.nextBoolean()) { x = Math.round(x * 2) / 2.0; y = Math.round(y * 2) / 2.0; }
            cs[i] = new Coordinate(x, y);
        }
        cs[n] = cs[0].copy();
        Geometry g = GF.createPolygon(cs).buffer(0); // repair if snapping made it self-touching
        if (rnd.nextBoolean()) g = g.difference(rect(-0.3 * scale, -0.2 * scale, 0.25 * scale, 0.3 * scale));
        Polygon p = null;
        for (int i = 0; i < g.getNumGeometries(); i++) {
            if (g.getGeometryN(i) instanceof Polygon q && (p == null || q.getArea() > p.getArea())) p = q;
        }
        var env = p.getEnvelopeInternal();
        return (Polygon) org.locationtech.jts.geom.util.AffineTransformation
                .translationInstance(-env.getMinX(), -env.getMinY()).transform(p);
    }

    @Test
    void fastCutMatchesJtsIntersectionCellByCell() {
        Random rnd = new Random(7);
        for (int trial = 0; trial < 60; trial++) {
            Polygon p = randomPolygon(rnd);
            double s = 0.25 + rnd.nextDouble() * 1.5;
            if (rnd.nextInt(3) == 0) s = 0.5; // grid lines on the snapped corners
            List<GridClipper.Cut> cuts = GridClipper.cut(p, s);
            var env = p.getEnvelopeInternal();
            int nu = (int) Math.ceil(env.getMaxX() / s), nv = (int) Math.ceil(env.getMaxY() / s);
            double[] got = new double[Math.max(1, nu) * Math.max(1, nv)];
            double total = 0;
            for (GridClipper.Cut c : cuts) {
                got[c.j() * Math.max(1, nu) + c.i()] += c.polygon().getArea();
                total += c.polygon().getArea();
            }
            // reference: JTS OverlayNG intersection of every cell
            for (int j = 0; j < nv; j++) {
                for (int i = 0; i < nu; i++) {
                    double ref = OverlayNGRobust.overlay(p, rect(i * s, j * s, (i + 1) * s, (j + 1) * s),
                            OverlayNG.INTERSECTION).getArea();
                    assertEquals(ref, got[j * nu + i], 1e-9, "trial " + trial + " cell " + i + "," + j);
                }
            }
            assertEquals(p.getArea(), total, 1e-9 * Math.max(1, p.getArea()), "trial " + trial);
        }
    }

    @Test
    void segmentOnACellSideDoesNotEnterIt() {
        assertFalse(GridClipper.entersInterior(new double[]{0, 0, 2, 0}, 0, 0, 1, 1));
        assertFalse(GridClipper.entersInterior(new double[]{1, -1, 1, 3}, 0, 0, 1, 1));
        assertFalse(GridClipper.entersInterior(new double[]{-1, 3, 3, -1}, 0, 0, 1, 1)); // x + y = 2 touches corner (1,1) only
        assertTrue(GridClipper.entersInterior(new double[]{-1, 2, 2, -1}, 0, 0, 1, 1));  // x + y = 1 is a diagonal
        assertTrue(GridClipper.entersInterior(new double[]{-1, 1.5, 2, -0.5}, 0, 0, 1, 1));
        assertTrue(GridClipper.entersInterior(new double[]{0.5, 0.5, 0.6, 0.6}, 0, 0, 1, 1));
        assertFalse(GridClipper.entersInterior(new double[]{-1, 0, 0, 1}, 0, 0, 1, 1)); // ends at corner (0,1) from outside
    }
}
