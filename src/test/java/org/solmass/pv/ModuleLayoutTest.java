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
}
