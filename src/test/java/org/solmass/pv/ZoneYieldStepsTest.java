package org.solmass.pv;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Polygon;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.SunDirections;
import org.solmass.scene.Scene;
import org.solmass.sky.Perez;
import org.solmass.sun.Site;

import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The yield of a zone, which works out per step what modules of one plane share once and sums the
 * chain on flat arrays, against the chain's own record path step by step: {@link PlaneOfArray#module}
 * for each module, {@link ModuleIrradiance}, {@link YieldChain#step}. Equal bit for bit. The zone
 * mixes racked rows of two azimuths on two fields side by side, module by module, so the shared
 * values change between neighbours, and the rows shade each other, so the substrings differ. What
 * it checks is the sharing and the flat arrays; the chain's formula itself (one method on both
 * paths) is checked against worked values in {@code YieldChainTest}.
 */
class ZoneYieldStepsTest {
    @Test
    void zoneYieldEqualsTheRecordPathOfTheChainStepByStep() {
        ModuleSpec spec = ModuleSpec.DEFAULT;
        LayoutOptions lo = new LayoutOptions(spec, 0, 5, 20, Double.NaN, 0.7, 0, 0.2, false);
        Polygon field = InterRowShadingTest.GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(12, 0),
                new Coordinate(12, 9), new Coordinate(0, 9), new Coordinate(0, 0)});
        Polygon beside = InterRowShadingTest.GF.createPolygon(new Coordinate[] {new Coordinate(20, 0), new Coordinate(32, 0),
                new Coordinate(32, 9), new Coordinate(20, 9), new Coordinate(20, 0)});
        List<PvModule> south = ModuleLayout.place(1, field, InterRowShadingTest.GROUND, true, 180, lo);
        List<PvModule> west = ModuleLayout.place(1, beside, InterRowShadingTest.GROUND, true, 230, lo);
        List<PvModule> zone = new ArrayList<>();
        for (int i = 0; i < Math.max(south.size(), west.size()); i++) { // planes alternate module by module
            if (i < south.size()) zone.add(south.get(i));
            if (i < west.size()) zone.add(west.get(i));
        }
        Scene scene = Scene.build(new float[0], true, 0); // open ground; PvArrays adds every module's rack
        WeatherSeries w = ClimateSource.load(new Site(51, 10, 0, ZoneOffset.ofHours(1)), ClimateSpec.clearSkyYear(2025));
        PvArrays.Result r = PvArrays.run(scene, new boolean[scene.triangleCount()], List.of(zone), new int[] {1}, lo, w,
                Perez.INSTANCE, SunDirections.exact(w), 0.2, ZoneOffset.ofHours(1), new PvArrays.Settings(64, 9L, 4, 2));
        ZoneYield zy = r.zones().get(0);
        List<ZoneSeries.Row> rows = zy.series().rows();
        assertEquals(w.size(), rows.size());

        YieldChain chain = lo.yieldChain(true);
        double[] air = CellTemperature.airPerStep(w.steps());
        int S = spec.bypassSubstrings(), lit = 0, mismatched = 0;
        double tilt = Math.min(180, zone.get(0).tiltDeg());
        for (int st = 0; st < w.size(); st++) {
            Step step = w.step(st);
            if (!(step.ghiWm2() > 0 || step.dhiWm2() > 0 || step.dniWm2() > 0)) continue;
            List<ModuleIrradiance> group = new ArrayList<>();
            for (int m = 0; m < zone.size(); m++) {
                double[] beam = new double[S], sky = new double[S], refl = new double[S], unob = new double[S];
                double aoi = r.poa().module(m, st, beam, sky, refl, unob);
                double u = 0;
                for (int k = 0; k < S; k++) u += unob[k];
                group.add(new ModuleIrradiance(beam, sky, refl, u / S, aoi, tilt));
                if (beam[0] != beam[S - 1]) mismatched++;
            }
            ModuleDc dc = chain.dcSum(group, air[st], step.windMs());
            EnergyBalance expected = chain.acStep(dc, zone.size(), step.durationH());
            assertEquals(expected, rows.get(st).energy(), "step " + st);
            assertEquals(dc.meanCellC(), rows.get(st).cellC(), 0.0, "cell temperature at step " + st);
            lit++;
        }
        assertTrue(lit > 4000, "lit steps compared: " + lit);
        assertTrue(mismatched > 1000, "module-steps whose substrings differ (rows shading rows): " + mismatched);
    }
}
