package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.Isotropic;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Energy sanity of the bounce series ({@link Reflection}) in a street canyon (H/W 2, 200 m long;
 * {@link CanyonRadiosityTest#canyon}): with albedo 0 nothing is reflected and any number of bounces
 * gives the one-bounce result; with albedo 0.5 every bounce adds less than the one before (a
 * Neumann series of a matrix with row sums at most the albedo decays at least geometrically; Howell,
 * Menguc and Siegel, 2016, ch. 9), and a patch's reflected part never falls as bounces are added
 * (every term is irradiance times albedo, non-negative).
 */
class ReflectionBouncesTest {
    static final double H = 20, LENGTH = 200;

    private static IrradiationResult run(PipelineFixture f, List<Patch> a, List<Patch> c, double albedo, int maxBounces) {
        WeatherSeries w = CanyonRadiosityTest.diffuseOnly();
        return f.run(a, c, (float) albedo, w, Isotropic.INSTANCE, new IrradiationSetup.Options(CanyonRadiosityTest.PATCH,
                256, albedo, true, IrradiationSetup.SunSampling.EXACT, 4096, 7L, true).withBounces(0.005, maxBounces));
    }

    private static List<List<Patch>> split(PipelineFixture f) {
        List<Patch> a = new ArrayList<>(), c = new ArrayList<>();
        for (Patch p : f.patches.patches()) (Math.abs(p.centroid().x()) < 20 ? a : c).add(p);
        return List.of(a, c);
    }

    @Test
    void withAlbedoZeroEveryBounceCountGivesTheOneBounceResult() {
        PipelineFixture f = CanyonRadiosityTest.canyon(H, LENGTH);
        List<List<Patch>> s = split(f);
        IrradiationResult one = run(f, s.get(0), s.get(1), 0, 1), many = run(f, s.get(0), s.get(1), 0, 20);
        assertArrayEquals(one.annual(), many.annual(), 0);
        assertArrayEquals(one.monthHourWm2(), many.monthHourWm2(), 0f);
        for (double v : many.reflected()) assertEquals(0, v, 0);
        assertEquals(1, many.bounces().used(), "nothing reflected: the first bounce adds nothing and ends the series");
    }

    @Test
    void bouncesAddDecreasingEnergyAndReflectionNeverFalls() {
        PipelineFixture f = CanyonRadiosityTest.canyon(H, LENGTH);
        List<List<Patch>> s = split(f);
        IrradiationResult all = run(f, s.get(0), s.get(1), 0.5, 20);
        double[] added = all.bounces().addedKwhM2();
        assertTrue(added.length >= 3, "a deep canyon at albedo 0.5 needs several bounces: " + added.length);
        for (int b = 1; b < added.length; b++) {
            assertTrue(added[b] < added[b - 1], "bounce " + (b + 1) + " adds " + added[b] + " after " + added[b - 1]);
        }
        assertTrue(all.bounces().converged());
        double total = 0;
        for (double v : added) total += v;
        assertTrue(added[added.length - 1] <= 0.005 * total, "the last bounce met the 0.5 % tolerance");
        double[] previous = null;
        for (int k = 1; k <= added.length; k++) {
            IrradiationResult r = run(f, s.get(0), s.get(1), 0.5, k);
            assertEquals(k, r.bounces().used());
            assertArrayEquals(java.util.Arrays.copyOf(added, k), r.bounces().addedKwhM2(), 0, "the same series, cut after " + k);
            if (previous != null) {
                for (int p = 0; p < previous.length; p++) assertTrue(r.reflected()[p] >= previous[p], "patch " + p);
            }
            previous = r.reflected();
        }
        assertArrayEquals(all.reflected(), previous, 0);
    }
}
