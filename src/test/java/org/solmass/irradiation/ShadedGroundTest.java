package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
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
 * The shaded-ground option: the ground a patch sees is lit by its own first-pass irradiance (ground
 * probes) instead of the unshaded GHI. In a deep canyon the street floor is mostly in shadow, so the
 * walls must receive less ground-reflected light than with GHI; beam and sky diffuse do not change.
 */
class ShadedGroundTest {
    @Test
    void canyonWallsReceiveLessGroundReflectionFromAShadedStreet() {
        TestModels m = new TestModels()
                .box("south", -100, -20, 100, 0, 24)
                .box("north", -100, 10, 100, 30, 24);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of("north"), 3.0);
        List<Patch> wall = f.patches.patches().stream()
                .filter(p -> p.kind() == SurfaceKind.FACADE && Math.abs(p.azimuthDeg() - 180) < 1
                        && Math.abs(p.centroid().x()) < 15).toList();
        WeatherSeries w = ClimateSource.load(new Site(51, 10, 0, ZoneId.of("Europe/Berlin")), ClimateSpec.clearSky());
        IrradiationSetup.Options unshaded = new IrradiationSetup.Options(3.0, 256, 0.2, false,
                IrradiationSetup.SunSampling.EXACT, 4096, 7L, false);
        IrradiationSetup.Options shaded = new IrradiationSetup.Options(3.0, 256, 0.2, true,
                IrradiationSetup.SunSampling.EXACT, 4096, 7L, false);
        IrradiationResult a = f.run(wall, w, Perez.INSTANCE, unshaded), b = f.run(wall, w, Perez.INSTANCE, shaded);
        double ra = 0, rb = 0;
        for (int p = 0; p < wall.size(); p++) {
            assertEquals(a.beam()[p], b.beam()[p], 1e-9, "beam does not depend on the ground option");
            assertEquals(a.diffuse()[p], b.diffuse()[p], 1e-9, "sky diffuse does not depend on the ground option");
            ra += a.reflected()[p];
            rb += b.reflected()[p];
        }
        assertTrue(rb < 0.9 * ra, "shaded street reflects less: " + rb + " vs " + ra);
        assertTrue(rb > 0, "the lit part of the street still reflects");
    }
}
