package org.solmass.pv;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.SunDirections;
import org.solmass.model.Vec3;
import org.solmass.scene.Scene;
import org.solmass.sky.Perez;
import org.solmass.sun.Site;
import org.solmass.surface.SurfaceFrame;

import java.time.ZoneOffset;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Racked rows on open flat ground: the shading of one row by the row in front comes from the ray
 * engine (the modules are triangles of the scene) and is checked against the analytic projection.
 */
class InterRowShadingTest {
    static final GeometryFactory GF = new GeometryFactory();
    static final SurfaceFrame GROUND = SurfaceFrame.of(new Vec3(0, 0, 1), new Vec3(0, 0, 0));

    /** Rows on a w x h field (no setback), facing south. */
    static List<PvModule> rows(double w, double h, double tiltDeg, double gcr) {
        Polygon field = GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(w, 0), new Coordinate(w, h),
                new Coordinate(0, h), new Coordinate(0, 0)});
        return ModuleLayout.place(1, field, GROUND, true, 180,
                new LayoutOptions(ModuleSpec.DEFAULT, 0, 5, tiltDeg, Double.NaN, gcr, 0, 0.2, false));
    }

    static Scene sceneWith(List<PvModule> mods) {
        float[] soup = new float[18 * mods.size()];
        for (int i = 0; i < mods.size(); i++) mods.get(i).triangles(soup, 18 * i);
        return Scene.build(new float[0], true, 0).withTriangles(soup);
    }

    /**
     * Sun due south at elevation a (the profile angle, as the rows run east-west), module slant W,
     * tilt b, pitch p: the top edge of the front row casts its shadow onto the back row up to
     * {@code u* = W - p sin(a) / sin(a + b)} along the slope (intersection of the sun ray through the
     * top edge with the back module's plane; the standard row-to-row shading geometry, e.g. Appelbaum
     * and Bany, 1979, Solar Energy 23(6), "Shadow effect of adjacent solar collectors in large scale
     * systems", eq. for the shadow height; derived here again). Shaded share = max(0, u* over W).
     */
    @Test
    void shadedShareOfTheBackRowEqualsTheAnalyticProjection() {
        double tilt = 25, gcr = 0.567, a = Math.toRadians(20), b = Math.toRadians(tilt);
        ModuleSpec m = ModuleSpec.DEFAULT;
        List<PvModule> mods = rows(20 * m.lengthM(), 2 * m.widthM() / gcr + 0.1, tilt, gcr);
        assertEquals(2 * 20, mods.size(), "two rows of 20");
        Scene scene = sceneWith(mods);
        Vec3 sun = new Vec3(0, -Math.cos(a), Math.sin(a)); // azimuth 180, elevation a
        int across = 300;
        ModuleSight s = ModuleSight.compute(scene, new boolean[scene.triangleCount()], mods, 3, new Vec3[] {sun}, 16, 1L, 4, across);
        double pitch = m.widthM() / gcr;
        double expected = Math.max(0, 1 - pitch / m.widthM() * Math.sin(a) / Math.sin(a + b));
        // the back row: modules with the larger y; take the middle one
        PvModule back = mods.stream().filter(p -> p.corner().y() > 1).skip(10).findFirst().orElseThrow();
        int mi = mods.indexOf(back);
        double seen = 0;
        for (int k = 0; k < 3; k++) seen += s.sunVisible(mi, k, 0);
        double shaded = 1 - seen / 3;
        // error sources: the sample points are cell centres (at most half a cell, 0.5 / (3 across) of the
        // module), and rays start scene.epsilon() off the module plane toward the sun, which moves the
        // shadow edge by epsilon / tan(a + b) along the slope (a + b: the sun's angle to the plane)
        double tol = 0.5 / (3 * across) + scene.epsilon() / Math.tan(a + b) / m.widthM();
        assertEquals(expected, shaded, tol, "expected " + expected);
        // the shadow climbs from the low edge: the lowest substring takes it all (expected < 1/3 here)
        assertTrue(expected > 0.05 && expected < 1.0 / 3);
        assertEquals(1 - 3 * expected, s.sunVisible(mi, 0, 0), 3 * tol);
        assertEquals(1, s.sunVisible(mi, 1, 0));
        assertEquals(1, s.sunVisible(mi, 2, 0));
        // the front row is unshaded
        int front = mods.indexOf(mods.stream().filter(p -> p.corner().y() < 1).skip(10).findFirst().orElseThrow());
        for (int k = 0; k < 3; k++) assertEquals(1, s.sunVisible(front, k, 0));
    }

    /** Annual shading loss of the rows behind the first, clear-sky year at 51 N, by ground-coverage ratio. */
    static double interRowLossPct(double gcr, WeatherSeries w) {
        ModuleSpec m = ModuleSpec.DEFAULT;
        List<PvModule> all = rows(6 * m.lengthM(), 2 * m.widthM() / gcr + m.widthM(), 15, gcr);
        assertEquals(18, all.size(), "three rows of six at GCR " + gcr);
        Scene scene = sceneWith(all);
        SunDirections sun = SunDirections.exact(w);
        PvArrays.Result r = PvArrays.run(scene, new boolean[scene.triangleCount()], List.of(all), new int[] {1}, m, w,
                Perez.INSTANCE, sun, 0.2, ZoneOffset.ofHours(1), new PvArrays.Settings(1024, 5L, 4, 2));
        // the middle row's middle modules: rows in front and behind, modules to both sides
        double poa = 0, unob = 0;
        double[] beam = new double[3], sky = new double[3], refl = new double[3], un = new double[3];
        for (int i = 0; i < all.size(); i++) {
            PvModule p = all.get(i);
            double y = p.corner().y(), x = p.corner().x();
            if (!(y > 1 && y < m.widthM() / gcr + 1) || x < 2 * m.lengthM() - 1e-6 || x > 3 * m.lengthM() + 1e-6) continue;
            for (int st = 0; st < w.size(); st++) {
                r.poa().module(i, st, beam, sky, refl, un);
                double h = w.step(st).weightedHours();
                for (int k = 0; k < 3; k++) {
                    poa += (beam[k] + sky[k] + refl[k]) * h;
                    unob += un[k] * h;
                }
            }
        }
        return 100 * (1 - poa / unob);
    }

    @Test
    void interRowShadingLossRisesWithGroundCoverageRatioAndVanishesAsItGoesToZero() {
        Site site = new Site(51, 10, 0, ZoneOffset.ofHours(1));
        WeatherSeries w = ClimateSource.load(site, ClimateSpec.clearSky());
        double prev = -1;
        for (double gcr : new double[] {0.02, 0.2, 0.4, 0.6, 0.8}) {
            double loss = interRowLossPct(gcr, w);
            System.out.printf(java.util.Locale.ROOT, "inter-row shading loss at GCR %.2f: %.3f %%%n", gcr, loss);
            if (gcr == 0.02) {
                // rows 57 m apart: only a sun below 0.5 deg reaches the next row; what remains is the
                // Monte Carlo error of the sampled view factors (stratified, 1024 rays: well under 0.5 %)
                assertTrue(Math.abs(loss) < 0.5, "loss at GCR 0.02: " + loss);
            } else {
                assertTrue(loss > prev, "loss at GCR " + gcr + " = " + loss + " not above " + prev);
            }
            prev = loss;
        }
        assertTrue(prev > 5, "at GCR 0.8 the rows shade each other markedly: " + prev);
    }
}
