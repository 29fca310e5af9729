package org.solmass.pv;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.solmass.model.Vec3;
import org.solmass.scene.Scene;
import org.solmass.surface.SurfaceFrame;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A flat roof with a parapet along its south edge: the first rack row, laid out by {@link ModuleLayout}
 * at the setback behind the parapet, is shaded by it at the winter-solstice noon sun, and the ray
 * engine's shaded share (the parapet is a triangle of the scene, the modules too) agrees with the
 * analytic shadow of the parapet's top edge.
 */
class ParapetShadingTest {
    static final GeometryFactory GF = new GeometryFactory();
    /** The roof plane, z = 0 (the ground plane of the test scene stands for the roof). */
    static final SurfaceFrame ROOF = SurfaceFrame.of(new Vec3(0, 0, 1), new Vec3(0, 0, 0));

    /** A closed box x0..x1, y0..y1, z0..z1 as a triangle soup (12 triangles, 9 floats each). */
    static float[] box(double x0, double y0, double z0, double x1, double y1, double z1) {
        double[][] v = {{x0, y0, z0}, {x1, y0, z0}, {x1, y1, z0}, {x0, y1, z0}, {x0, y0, z1}, {x1, y0, z1}, {x1, y1, z1}, {x0, y1, z1}};
        int[][] q = {{0, 3, 2, 1}, {4, 5, 6, 7}, {0, 1, 5, 4}, {1, 2, 6, 5}, {2, 3, 7, 6}, {3, 0, 4, 7}};
        float[] soup = new float[12 * 9];
        int o = 0;
        for (int[] f : q) {
            for (int[] t : new int[][] {{f[0], f[1], f[2]}, {f[0], f[2], f[3]}}) {
                for (int c : t) for (int k = 0; k < 3; k++) soup[o++] = (float) v[c][k];
            }
        }
        return soup;
    }

    /**
     * Parapet of height h = 0.8 m (0.2 m thick, 100 m long) on the roof's south edge y = 0; the zone
     * behind it 20 x 12 m, setback s = 1 m, default racks (15 deg, low edge 0.2 m above the roof)
     * facing south. Sun due south at the winter-solstice noon elevation at 51 N,
     * a = 90 - 51 - 23.44 = 15.56 deg (declination at the solstice, common practice). On the roof the
     * parapet's shadow reaches h / tan(a) = 2.87 m from its face; on the module plane (low edge at
     * y = s, height c, tilt b, a point u up the slope at y = s + u cos b, z = c + u sin b) the sun ray
     * passes the parapet's plane y = 0 at height c + u sin b + (s + u cos b) tan a, so the points below
     * {@code u* = (h - c - s tan a) / (sin b + cos b tan a)} are in shadow: the same similar triangles
     * as h / tan(a) (derived here). Shaded share u* / W. The issue asks for agreement within one
     * substring (a third of the module); the sampling allows far less: half a cell of the
     * 300 sample rows across, plus the rays' start epsilon off the module plane.
     */
    @Test
    void parapetShadesTheFirstRowAsFarAsTheAnalyticShadowOfItsTopEdge() {
        double h = 0.8, s = 1.0, a = Math.toRadians(90 - 51 - 23.44);
        LayoutOptions o = new LayoutOptions(ModuleSpec.DEFAULT, s, 5, 15, Double.NaN, 0.4, 0, 0.2, false);
        Polygon zone = GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(20, 0), new Coordinate(20, 12),
                new Coordinate(0, 12), new Coordinate(0, 0)});
        List<PvModule> mods = ModuleLayout.place(1, zone, ROOF, true, 180, o);
        double firstY = mods.stream().mapToDouble(p -> p.corner().y()).min().orElseThrow();
        assertEquals(s, firstY, 1e-9, "the first row's low edge stands at the setback behind the parapet");
        float[] soup = new float[18 * mods.size()];
        for (int i = 0; i < mods.size(); i++) mods.get(i).triangles(soup, 18 * i);
        Scene scene = Scene.build(box(-50, -0.2, 0, 50, 0, h), true, 0).withTriangles(soup);
        Vec3 sun = new Vec3(0, -Math.cos(a), Math.sin(a));
        int across = 300;
        ModuleSight sight = ModuleSight.compute(scene, new boolean[scene.triangleCount()], mods, 3, new Vec3[] {sun}, 16, 1L, 4, across);
        ModuleSpec m = ModuleSpec.DEFAULT;
        double b = Math.toRadians(o.rackTiltDeg()), c = o.rackClearanceM();
        double uStar = (h - c - s * Math.tan(a)) / (Math.sin(b) + Math.cos(b) * Math.tan(a));
        double expected = Math.max(0, Math.min(1, uStar / m.widthM()));
        assertEquals(h / Math.tan(a), 2.87, 0.005, "the shadow on the roof, h / tan(a)");
        assertTrue(expected > 1.0 / 3 && expected < 2.0 / 3, "the shadow edge crosses the middle substring: " + expected);
        double tol = 0.5 / (3 * across) + scene.epsilon() / Math.tan(a + b) / m.widthM();
        int checked = 0;
        for (int i = 0; i < mods.size(); i++) {
            PvModule p = mods.get(i);
            double seen = 0;
            for (int k = 0; k < 3; k++) seen += sight.sunVisible(i, k, 0);
            double shaded = 1 - seen / 3;
            if (Math.abs(p.corner().y() - firstY) > 1e-9) {
                // the rows behind are out of the parapet's shadow (2.87 m) and, at GCR 0.4, out of the row in front's
                assertTrue(p.corner().y() > firstY + 2.5);
                continue;
            }
            checked++;
            assertEquals(expected, shaded, tol, "first-row module at x = " + p.corner().x());
            assertEquals(expected, shaded, 1.0 / 3, "within one substring");
            assertEquals(0, sight.sunVisible(i, 0, 0), 1e-12, "the lowest substring wholly in shadow");
            assertEquals(1, sight.sunVisible(i, 2, 0), 1e-12, "the top substring wholly in sun");
        }
        assertTrue(checked >= 10, "first-row modules: " + checked);
        System.out.printf(java.util.Locale.ROOT, "parapet %.1f m, sun %.2f deg: first row shaded %.4f, analytic %.4f%n",
                h, Math.toDegrees(a), 1 - (sight.sunVisible(0, 0, 0) + sight.sunVisible(0, 1, 0) + sight.sunVisible(0, 2, 0)) / 3, expected);
    }
}
