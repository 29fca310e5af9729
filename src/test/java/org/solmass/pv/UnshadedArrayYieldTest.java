package org.solmass.pv;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.GeometryFactory;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.SunDirections;
import org.solmass.model.Vec3;
import org.solmass.scene.Scene;
import org.solmass.sky.Perez;
import org.solmass.sky.PreparedSky;
import org.solmass.sun.Site;
import org.solmass.surface.SurfaceFrame;

import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * One row of modules tilted 35 deg to the south on open ground, in the sample's (invented) month-hour
 * climate at 51 N: the whole chain from the ray engine's plane-of-array irradiance to AC energy.
 */
class UnshadedArrayYieldTest {
    @Test
    void unshadedSouthArrayHasAPerformanceRatioInThePracticeRangeAndLossesThatAddUp() {
        Site site = new Site(51, 10, 200, ZoneId.of("Europe/Berlin"));
        WeatherSeries w = ClimateSource.load(site, ClimateSpec.file(Path.of("sample-massing/veldhaven-month-hour.csv")));
        GeometryFactory gf = new GeometryFactory();
        var field = gf.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(6 * 1.722, 0),
                new Coordinate(6 * 1.722, 1), new Coordinate(0, 1), new Coordinate(0, 0)});
        List<PvModule> row = ModuleLayout.place(1, field, SurfaceFrame.of(new Vec3(0, 0, 1), Vec3.ZERO), true, 180,
                new LayoutOptions(ModuleSpec.DEFAULT, 0, 5, 35, Double.NaN, 0.4, 0, 0.5, false));
        assertEquals(6, row.size());
        float[] soup = new float[18 * row.size()];
        for (int i = 0; i < row.size(); i++) row.get(i).triangles(soup, 18 * i);
        Scene scene = Scene.build(new float[0], true, 0).withTriangles(soup);
        PvArrays.Result r = PvArrays.run(scene, new boolean[scene.triangleCount()], List.of(row), new int[] {1},
                ModuleSpec.DEFAULT, w, Perez.INSTANCE, SunDirections.exact(w), 0.2, site.zone(), new PvArrays.Settings(1024, 3L, 4, 2));
        ZoneYield y = r.zones().get(0);
        EnergyBalance e = y.year();

        // reference yield Yr = unobstructed plane-of-array irradiation / 1 kW/m2 (IEC 61724-1), and that
        // irradiation equals the sky package's own sum for the plane (sky.PreparedSky, a separate code path)
        double plane = PreparedSky.of(w, Perez.INSTANCE).sum(35, 180, 0.2).annualKwhM2();
        assertEquals(plane, y.poaUnobstructedKwhM2(), 1e-6 * plane);
        assertEquals(plane, e.referenceWh() / (6 * ModuleSpec.DEFAULT.stcPowerW()), 1e-6 * plane);

        // nothing obstructs the row: the shading loss is the sampled view factors' noise
        assertTrue(Math.abs(y.shadingLossPct()) < 1, "shading " + y.shadingLossPct());

        // the losses add up to reference minus AC (docs/pv.md identity)
        assertEquals(e.referenceWh() - e.lossesWh(), e.acWh(), 1e-9 * e.referenceWh());

        // IEC 61724-1:2021 defines PR = Yf / Yr; well-ventilated crystalline-silicon systems in
        // central Europe reach 0.75 to 0.90 (common practice)
        double pr = y.performanceRatio();
        assertTrue(pr >= 0.75 && pr <= 0.90, "PR " + pr);
        assertEquals(pr * plane, y.specificYieldKwhKwp(), 1e-6 * plane);
        System.out.printf(java.util.Locale.ROOT, "unshaded 35 deg south row, sample climate: Yr %.1f kWh/kWp, Yf %.1f kWh/kWp, PR %.3f%n",
                plane, y.specificYieldKwhKwp(), pr);
    }
}
