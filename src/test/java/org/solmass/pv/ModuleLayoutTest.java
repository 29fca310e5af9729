package org.solmass.pv;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.solmass.model.Vec3;
import org.solmass.surface.SurfaceFrame;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Module counts in rectangles against the arithmetic of a regular grid (floor division), and the
 * setback kept from the outline.
 */
class ModuleLayoutTest {
    static final GeometryFactory GF = new GeometryFactory();

    static Polygon rect(double w, double h) {
        return GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(w, 0), new Coordinate(w, h),
                new Coordinate(0, h), new Coordinate(0, 0)});
    }

    static LayoutOptions options(double setback, double gcr) {
        return new LayoutOptions(ModuleSpec.DEFAULT, setback, 5, 15, Double.NaN, gcr, 0, 0.2, false);
    }

    /** A roof of 30 deg facing south: frame from its normal (x east, y north, z up). */
    static SurfaceFrame pitched() {
        double t = Math.toRadians(30);
        return SurfaceFrame.of(new Vec3(0, -Math.sin(t), Math.cos(t)), new Vec3(5, 7, 10));
    }

    static SurfaceFrame flat() {
        return SurfaceFrame.of(new Vec3(0, 0, 1), new Vec3(-3, 4, 20));
    }

    @Test
    void flushModulesInARectangleWithSetbacksMatchTheFloorDivisionCount() {
        Random r = new Random(18);
        ModuleSpec m = ModuleSpec.DEFAULT;
        for (int i = 0; i < 200; i++) {
            double w = 3 + 20 * r.nextDouble(), h = 3 + 12 * r.nextDouble(), s = r.nextDouble();
            List<PvModule> mods = ModuleLayout.place(1, rect(w, h), pitched(), false, 180, options(s, 0.4));
            // portrait: module width across the slope, length up the slope, rows touching
            int expected = (int) Math.max(0, Math.floor((w - 2 * s) / m.widthM())) * (int) Math.max(0, Math.floor((h - 2 * s) / m.lengthM()));
            assertEquals(expected, mods.size(), "w " + w + " h " + h + " setback " + s);
            for (PvModule p : mods) {
                assertEquals(30, p.tiltDeg(), 1e-9);
                assertEquals(180, p.azimuthDeg(), 1e-9);
                assertTrue(!p.racked());
            }
        }
    }

    @Test
    void rackedRowsInARectangleWithSetbacksMatchTheFloorDivisionCount() {
        Random r = new Random(19);
        ModuleSpec m = ModuleSpec.DEFAULT;
        for (int i = 0; i < 200; i++) {
            double w = 3 + 30 * r.nextDouble(), h = 3 + 20 * r.nextDouble(), s = r.nextDouble(), gcr = 0.2 + 0.6 * r.nextDouble();
            LayoutOptions o = options(s, gcr);
            List<PvModule> mods = ModuleLayout.place(1, rect(w, h), flat(), true, 180, o);
            // landscape along east-west rows; footprint depth width x cos(tilt); rows every width / GCR
            double depth = m.widthM() * Math.cos(Math.toRadians(15)), pitch = m.widthM() / gcr;
            int cols = (int) Math.floor((w - 2 * s) / m.lengthM());
            int rows = h - 2 * s < depth ? 0 : (int) Math.floor((h - 2 * s - depth) / pitch) + 1;
            assertEquals(Math.max(0, cols) * rows, mods.size(), "w " + w + " h " + h + " setback " + s + " gcr " + gcr);
            for (PvModule p : mods) {
                assertEquals(15, p.tiltDeg(), 1e-9);
                assertEquals(180, p.azimuthDeg(), 1e-9);
                assertEquals(20.2, p.corner().z(), 1e-9);  // low edge at the rack clearance above the roof
            }
        }
    }

    @Test
    void everyModuleKeepsTheSetbackFromTheZoneOutline() {
        Geometry l = GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(20, 0), new Coordinate(20, 8),
                new Coordinate(8, 8), new Coordinate(8, 16), new Coordinate(0, 16), new Coordinate(0, 0)});
        SurfaceFrame f = flat();
        List<PvModule> mods = ModuleLayout.place(1, l, f, true, 200, options(1.2, 0.45));
        assertTrue(mods.size() > 10, "modules " + mods.size());
        for (PvModule p : mods) {
            for (Vec3 c : p.corners()) {
                var pt = GF.createPoint(new Coordinate(f.localX(c.x(), c.y(), c.z()), f.localY(c.x(), c.y(), c.z())));
                assertTrue(l.contains(pt) && l.getBoundary().distance(pt) >= 1.2 - 1e-6, "corner " + c);
            }
            assertEquals(200, p.azimuthDeg(), 1e-9);
        }
    }

    /**
     * Racked rows are centred in the usable width (the zone less its setback): in a rectangle every row
     * leaves the same margin at both ends (arithmetic of the floor-division grid: margin =
     * (w - 2 s - n L) / 2), and in an L-shaped zone each row holds floor(run / L) modules centred in
     * its own run (1.2 .. 18.8 m below the inner corner, 1.2 .. 6.8 m in the narrow arm, between them
     * up to the setback's quarter circle about the inner corner).
     */
    @Test
    void rackedRowsAreCentredInTheUsableWidthOfEachRow() {
        Random r = new Random(20);
        ModuleSpec m = ModuleSpec.DEFAULT;
        SurfaceFrame f = flat();
        for (int i = 0; i < 50; i++) {
            double w = 3 + 30 * r.nextDouble(), h = 3 + 20 * r.nextDouble(), s = r.nextDouble();
            List<PvModule> mods = ModuleLayout.place(1, rect(w, h), f, true, 180, options(s, 0.4));
            java.util.Map<Long, double[]> rows = rowExtents(mods, f);
            int n = (int) Math.floor((w - 2 * s) / m.lengthM());
            for (double[] e : rows.values()) {
                assertEquals(e[0] - s, w - s - e[1], 1e-6, "margins of a row, w " + w + " setback " + s);
                assertEquals(0.5 * (w - 2 * s - n * m.lengthM()), e[0] - s, 1e-6);
            }
        }
        Geometry l = GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(20, 0), new Coordinate(20, 8),
                new Coordinate(8, 8), new Coordinate(8, 16), new Coordinate(0, 16), new Coordinate(0, 0)});
        List<PvModule> mods = ModuleLayout.place(1, l, f, true, 180, options(1.2, 0.45));
        java.util.Map<Long, double[]> rows = rowExtents(mods, f);
        int wide = 0, narrow = 0;
        for (double[] e : rows.values()) {
            // the setback rounds the inner corner (8, 8) with a radius of 1.2 m: a row reaching y_top in
            // 6.8 .. 8 runs to x = 8 - sqrt(1.2^2 - (8 - y_top)^2); JTS draws the arc with 8 chords per
            // quarter circle, whose sagitta 1.2 (1 - cos(pi / 32)) = 5.8 mm bounds the difference
            double top = e[3], right = top <= 6.8 + 1e-9 ? 18.8 : top >= 8 ? 6.8 : 8 - Math.sqrt(1.44 - (8 - top) * (8 - top));
            if (right > 10) wide++;
            else narrow++;
            int n = (int) Math.floor((right - 1.2) / m.lengthM());
            assertEquals(n, Math.round(e[4]), "modules in the row at y " + e[2]);
            assertEquals(e[0] - 1.2, right - e[1], 0.006, "margins of the row at y " + e[2]);
        }
        assertTrue(wide >= 2 && narrow >= 2, wide + " wide rows, " + narrow + " narrow rows");
    }

    /** Per row (keyed by its low edge's local y in mm): {min x, max x, min y, max y, modules} of its modules' corners. */
    private static java.util.Map<Long, double[]> rowExtents(List<PvModule> mods, SurfaceFrame f) {
        java.util.Map<Long, double[]> rows = new java.util.TreeMap<>();
        for (PvModule p : mods) {
            Vec3 b = p.corner();
            long key = Math.round(f.localY(b.x(), b.y(), b.z()) * 1000);
            double[] e = rows.computeIfAbsent(key, k -> new double[] {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY,
                    Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 0});
            for (Vec3 c : p.corners()) {
                double x = f.localX(c.x(), c.y(), c.z()), y = f.localY(c.x(), c.y(), c.z());
                e[0] = Math.min(e[0], x);
                e[1] = Math.max(e[1], x);
                e[2] = Math.min(e[2], y);
                e[3] = Math.max(e[3], y);
            }
            e[4]++;
        }
        return rows;
    }
}
