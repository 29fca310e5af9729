package org.solmass.irradiation;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.Step;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.model.Vec3;
import org.solmass.sky.Perez;
import org.solmass.sun.Site;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.time.ZoneId;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The floor of a long east-west street canyon: on a given average day, the beam irradiation of each
 * floor patch must equal DNI x cos(zenith) summed over exactly the steps in which the analytic shadow
 * of two infinitely long walls leaves the patch centre in sun. A point at distance y north of the
 * south wall (height H) is shaded by it when the sun is south of east-west and y tan(elevation') < H,
 * where tan(elevation') = s_z / (-s_y) is the sun's elevation in the plane across the street (the
 * profile angle; common practice in shading geometry), and likewise for the north wall at W - y.
 */
class CanyonShadowTest {
    static final double H = 15, W = 12, LENGTH = 4000;

    @ParameterizedTest
    @ValueSource(ints = {3, 6, 12})
    void floorBeamFollowsTheAnalyticShadowOfInfiniteWalls(int month) {
        Site site = new Site(48.0, 10.0, 0, ZoneId.of("+01:00"));
        WeatherSeries all = ClimateSource.load(site, ClimateSpec.clearSky());
        List<Step> day = all.steps().stream().filter(s -> s.month() == month).toList();
        WeatherSeries series = new WeatherSeries(day, TimeBase.AVERAGE_DAYS, "one average day", all.report());
        double half = LENGTH / 2;
        TestModels m = new TestModels()
                .box("south", -half, -20, half, 0, H)
                .box("north", -half, W, half, W + 20, H)
                .slab("street", -5, 0, 5, W, 0);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of("street"), 1.0);
        IrradiationResult r = f.run(series, Perez.INSTANCE, PipelineFixture.options(64, IrradiationSetup.SunSampling.EXACT));
        int checked = 0;
        for (Patch p : f.patches.patches()) {
            assertEquals(SurfaceKind.GROUND, p.kind());
            double y = p.centroid().y();
            double expected = 0;
            boolean decided = true;
            for (Step s : day) {
                if (!SunDirections.isSunUp(s) || s.dniWm2() <= 0) continue;
                Vec3 d = s.sun().direction();
                double along = d.y() < 0 ? y / -d.y() : (W - y) / Math.max(1e-12, d.y());
                if (Math.abs(along * d.x()) > half - 10) {
                    decided = false; // the ray would pass the end of the finite model before reaching the wall
                    continue;
                }
                double heightAtWall = along * d.z();
                if (Math.abs(heightAtWall - H) < 1e-6) continue; // grazing the roof edge: undecidable
                if (heightAtWall > H) expected += s.dniWm2() * d.z() * s.weightedHours() / 1000;
            }
            if (!decided) continue;
            checked++;
            // sun vectors are kept as float in the kernel: relative 1e-6
            assertEquals(expected, r.beam()[p.index()], 1e-6 * Math.max(1, expected), "patch at y = " + y);
        }
        assertTrue(checked > 50, "checked " + checked + " patches");
    }
}
