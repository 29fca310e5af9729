package org.solmass.metrics;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.scene.Scene;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.SurfaceKind;
import org.solmass.table.ResultTable;

import java.nio.file.Path;
import java.time.MonthDay;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The vertical sky component against the CIE standard overcast sky integrated by quadrature (sky
 * luminance Lz (1 + 2 sin gamma) / 3: Moon and Spencer 1942; ISO 15469:2004 sky type 16), independent
 * of the ray engine. Tolerances are statistical: 4 standard errors of the mean of equivalent patches,
 * the standard error measured from their spread (the patches of one row differ only in their seeds).
 */
class VerticalSkyComponentMetricTest {
    @TempDir Path dir;

    /**
     * VSC in percent of a vertical wall facing +y at height z, with an infinitely long parallel wall of
     * height H at distance W in front (H = 0: open field), by midpoint quadrature over elevation and
     * azimuth: VSC = 100 x [integral of (1 + 2 sin g) / 3 cos(theta) dw over the visible sky] / (7 pi / 9).
     */
    static double quadrature(double z, double h, double w) {
        int n = 2000;
        double sum = 0, dg = Math.PI / 2 / n, dp = Math.PI / n;
        for (int i = 0; i < n; i++) {
            double g = (i + 0.5) * dg, sg = Math.sin(g), cg = Math.cos(g);
            for (int j = 0; j < n; j++) {
                double psi = -Math.PI / 2 + (j + 0.5) * dp, cp = Math.cos(psi);
                double dy = cg * cp;                                  // towards the opposite wall
                boolean blocked = h > 0 && z + w / dy * sg < h;        // meets the wall y = W below its top
                if (!blocked) sum += (1 + 2 * sg) / 3 * dy * cg * dg * dp;   // L cos(theta) dw, dw = cos g dg dpsi
            }
        }
        return 100 * sum / (7 * Math.PI / 9);
    }

    @Test
    void quadratureGivesTheTradesValueForAnOpenVerticalWall() {
        // common practice: an unobstructed vertical wall has a VSC of 39.6 %; closed form 100 (2/3)(pi/4 + 2/3) / (7 pi / 9)
        double closed = 100 * (2.0 / 3) * (Math.PI / 4 + 2.0 / 3) / (7 * Math.PI / 9);
        assertEquals(39.6, closed, 0.05);
        assertEquals(closed, quadrature(5, 0, 10), 1e-3);
    }

    @Test
    void openVerticalWallHasThirtyNinePointSixPercent() {
        double[] v = vscOfRow(Boxes.onGround(0, 0, 20, 10, 30).obj("a"), Set.of("a"), 15.5, false);
        assertWithin(quadrature(15.5, 0, 10), v);
    }

    @Test
    void canyonWallMatchesTheInfiniteStripIntegral() {
        // an analysed block 20 m long facing a 2 km long, 24 m high context wall 12 m away (y = 10 .. 22)
        String obj = Boxes.onGround(0, 0, 20, 10, 30).obj("a") + Boxes.onGround(-990, 22, 1010, 40, 24).obj("wall");
        for (double z : new double[] {2.5, 10.5, 20.5}) {
            double[] v = vscOfRow(obj, Set.of("a"), z, true);
            double expected = quadrature(z, 24, 12);
            assertWithin(expected, v);
            assertTrue(expected < 39.6, "the opposite wall takes sky away");
        }
    }

    /**
     * The same canyon against the closed form for an infinitely long obstruction seen at elevation
     * alpha, VSC = 100 x 3 [(pi/2)(1 - sin alpha) + (4/3) cos^2 alpha] / (7 pi), derived in
     * {@code irradiation.SkyDistributionPipelineTest#vscClosedForm}; the quadrature above agrees with it
     * (to its midpoint error, 1e-3 pp) and the ray estimate within 4 standard errors.
     */
    @Test
    void canyonWallMatchesTheClosedFormOfAnInfinitelyLongObstruction() {
        String obj = Boxes.onGround(0, 0, 20, 10, 30).obj("a") + Boxes.onGround(-990, 22, 1010, 40, 24).obj("wall");
        for (double z : new double[] {2.5, 10.5, 20.5}) {
            double alpha = Math.atan2(24 - z, 12), c = Math.cos(alpha);
            double closed = 100 * 3 * (Math.PI / 2 * (1 - Math.sin(alpha)) + 4.0 / 3 * c * c) / (7 * Math.PI);
            assertEquals(closed, quadrature(z, 24, 12), 1e-3);
            assertWithin(closed, vscOfRow(obj, Set.of("a"), z, true));
        }
    }

    /** The VSC of the facade patches facing +y (north) whose centroid is at height z. */
    private double[] vscOfRow(String obj, Set<String> analysed, double z, boolean context) {
        Path f = Boxes.write(dir, "m" + System.nanoTime() + ".obj", obj);
        MassingModel m = ObjReader.load(f, ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(1.0, analysed, false));
        Scene scene = Scene.build(m, !ps.hasGroundFaces(), ps.groundLevelZ());
        MetricContext ctx = new MetricContext(scene, org.solmass.surface.Surface.groundTriangles(ps.surfaces(), scene.triangleCount()), ps, null, null, null, null, 2026, 0.2, 1.0, 1024, 0x5A15_3A55L,
                new MetricContext.Settings(List.of(MonthDay.of(3, 21)), 5, 5, null));
        ResultTable t = new ResultTable(ps.patches());
        new VerticalSkyComponentMetric().compute(ctx, t);
        double[] vsc = t.column(VerticalSkyComponentMetric.VSC.name());
        List<Double> row = new ArrayList<>();
        for (Patch p : ps.patches()) {
            if (p.kind() != SurfaceKind.FACADE) {
                assertTrue(Double.isNaN(vsc[p.index()]), "only facades get a VSC");
                continue;
            }
            if (p.normal().y() > 0.99 && Math.abs(p.centroid().z() - z) < 1e-6 && p.centroid().x() > 1 && p.centroid().x() < 19) {
                row.add(vsc[p.index()]);
            }
        }
        assertTrue(row.size() >= 10, "row at z = " + z + " has " + row.size() + " patches");
        return row.stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static void assertWithin(double expected, double[] v) {
        double mean = 0;
        for (double x : v) mean += x;
        mean /= v.length;
        double var = 0;
        for (double x : v) var += (x - mean) * (x - mean);
        double se = Math.sqrt(var / (v.length - 1) / v.length);
        assertTrue(se > 0, "equivalent patches must differ by their seeds");
        assertTrue(Math.abs(mean - expected) <= 4 * se,
                String.format("mean %.3f of %d patches vs quadrature %.3f (standard error of the mean %.3f, per patch %.3f)",
                        mean, v.length, expected, se, se * Math.sqrt(v.length)));
        System.out.printf("VSC: ray mean %.3f, quadrature %.3f, per-patch standard deviation %.3f pp%n", mean, expected,
                se * Math.sqrt(v.length));
    }
}
