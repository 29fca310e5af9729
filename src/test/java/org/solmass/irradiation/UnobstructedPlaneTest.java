package org.solmass.irradiation;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.PlaneIrradiation;
import org.solmass.sky.PreparedSky;
import org.solmass.sky.SkyModel;
import org.solmass.sky.SkyModels;
import org.solmass.sun.Site;
import org.solmass.surface.Patch;

import java.time.ZoneId;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A patch that nothing obstructs must receive what the unobstructed-plane calculator (the
 * {@code plane} command) gives for its tilt and azimuth: the shading-aware pipeline and the plane
 * model share their equations (docs/method.md section 1) and differ only by the sampled view factors.
 */
class UnobstructedPlaneTest {
    static final Site SITE = new Site(51.0, 10.0, 200, ZoneId.of("Europe/Berlin"));
    static final WeatherSeries AVERAGE_DAYS = ClimateSource.load(SITE, ClimateSpec.clearSky());

    static SkyModel sky(String name) {
        return SkyModels.byName(name, "test");
    }

    /** Invariant of the method: an unobstructed horizontal roof receives exactly the GHI of the input. */
    @ParameterizedTest
    @ValueSource(strings = {"perez", "isotropic", "perez-1993", "cie-12", "cie-overcast"})
    void unobstructedHorizontalRoofReceivesTheAnnualGhi(String skyName) {
        TestModels m = new TestModels().slab("roof", 0, 0, 8, 8, 10);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of(), 1.0);
        IrradiationResult r = f.run(AVERAGE_DAYS, sky(skyName), PipelineFixture.options(256, IrradiationSetup.SunSampling.EXACT));
        double ghi = 0;
        for (Step s : AVERAGE_DAYS.steps()) ghi += s.ghiWm2() * s.weightedHours() / 1000;
        for (int p = 0; p < r.size(); p++) {
            assertEquals(1.0, r.skyViewFactor()[p], 0.0, "SVF of an up-facing unobstructed patch");
            // float storage of sun vectors and slot sums: relative 1e-6
            assertEquals(ghi, r.annual()[p], ghi * 1e-6, "annual = annual GHI");
            assertEquals(ghi, r.unshaded()[p], ghi * 1e-6, "unshaded = annual GHI");
            assertEquals(0, r.reflected()[p], 0.0, "no ground in view");
        }
    }

    /**
     * A lone tilted panel facing south, east, west or north high above the ground: the unshaded column
     * equals the plane calculator, and the shading-aware total differs from it only by the sampling
     * error of the sky and ground view factors (3 standard errors of each, times the diffuse
     * background and the ground-reflected sums that multiply them).
     */
    @ParameterizedTest
    @ValueSource(strings = {"perez:30:180", "perez:60:90", "perez:90:270", "isotropic:45:0", "isotropic:90:180",
            "perez-1993:90:180", "perez-1993:30:135", "cie-12:60:90", "cie-overcast:90:0"})
    void loneTiltedPanelMatchesThePlaneCalculator(String spec) {
        String[] a = spec.split(":");
        double tilt = Double.parseDouble(a[1]), az = Double.parseDouble(a[2]);
        double[] n = {Math.sin(Math.toRadians(tilt)) * Math.sin(Math.toRadians(az)),
                Math.sin(Math.toRadians(tilt)) * Math.cos(Math.toRadians(az)), Math.cos(Math.toRadians(tilt))};
        // a 4 x 4 m panel centred 50 m up, its corners in its own frame (u horizontal, v up the slope)
        double[] u = {Math.cos(Math.toRadians(az)), -Math.sin(Math.toRadians(az)), 0};
        double[] v = {n[1] * u[2] - n[2] * u[1], n[2] * u[0] - n[0] * u[2], n[0] * u[1] - n[1] * u[0]};
        double[][] c = new double[4][];
        double[][] uv = {{-2, -2}, {2, -2}, {2, 2}, {-2, 2}};
        for (int i = 0; i < 4; i++) {
            c[i] = new double[] {uv[i][0] * u[0] + uv[i][1] * v[0], uv[i][0] * u[1] + uv[i][1] * v[1],
                    50 + uv[i][0] * u[2] + uv[i][1] * v[2]};
        }
        // a tiny far-away pad sets the ground level at z = 0
        TestModels m = new TestModels().quad("panel", c[0], c[1], c[2], c[3]).slab("pad", 500, 500, 501, 501, 0);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of("panel"), 2.0);
        SkyModel sky = sky(a[0]);
        IrradiationResult r = f.run(AVERAGE_DAYS, sky, PipelineFixture.options(1024, IrradiationSetup.SunSampling.EXACT));
        Patch p0 = f.patches.patches().get(0);
        PlaneIrradiation plane = PreparedSky.of(AVERAGE_DAYS, sky).sum(p0.normal().x(), p0.normal().y(), p0.normal().z(), 0.2);
        double bgSum = 0, ghiSum = 0;
        for (Step s : AVERAGE_DAYS.steps()) {
            double f1 = s.dhiWm2() > 0 ? sky.circumsolarCoefficient(s) : 0;
            bgSum += s.dhiWm2() * (1 - f1) * s.weightedHours() / 1000;
            ghiSum += s.ghiWm2() * s.weightedHours() / 1000;
        }
        for (int p = 0; p < r.size(); p++) {
            assertEquals(plane.annualKwhM2(), r.unshaded()[p], plane.annualKwhM2() * 1e-5, "unshaded vs plane");
            double se = r.skyViewStdError()[p];
            double tol = 3 * se * bgSum + 3 * se * 0.2 * ghiSum + plane.annualKwhM2() * 1e-5;
            assertEquals(plane.annualKwhM2(), r.annual()[p], tol, "shading-aware vs plane, " + spec);
            assertEquals(plane.beamKwhM2(), r.beam()[p], plane.beamKwhM2() * 1e-5 + 1e-9, "beam is unobstructed");
            assertTrue(r.horizonVisibility()[p] > 0.999 || tilt < 1, "horizon band fully visible");
        }
    }
}
