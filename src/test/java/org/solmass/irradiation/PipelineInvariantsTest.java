package org.solmass.irradiation;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.Perez;
import org.solmass.sun.Site;

import java.time.ZoneId;
import java.util.Set;
import java.util.concurrent.ForkJoinPool;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Invariants of the pipeline on a small courtyard (common practice: bookkeeping must close). */
class PipelineInvariantsTest {
    static PipelineFixture fixture;
    static WeatherSeries weather;

    @BeforeAll
    static void courtyard() {
        TestModels m = new TestModels()
                .box("north", 0, 24, 30, 30, 18).box("south", 0, 0, 30, 6, 9)
                .box("west", 0, 6, 6, 24, 12).box("east", 24, 6, 30, 24, 15)
                .slab("yard", 6, 6, 24, 24, 0)
                .box("tower", -30, -30, -18, -18, 60);
        fixture = new PipelineFixture(m.build(), Set.of("north", "south", "west", "east", "yard"), 2.0);
        weather = ClimateSource.load(new Site(51, 10, 0, ZoneId.of("Europe/Berlin")), ClimateSpec.clearSky());
    }

    static IrradiationResult run(int threads) throws Exception {
        ForkJoinPool pool = new ForkJoinPool(threads);
        try {
            return pool.submit(() -> fixture.run(weather, Perez.INSTANCE,
                    PipelineFixture.options(144, IrradiationSetup.SunSampling.EXACT))).get();
        } finally {
            pool.shutdown();
        }
    }

    @Test
    void resultsAreIdenticalWithOneAndTwoThreads() throws Exception {
        IrradiationResult a = run(1), b = run(2);
        assertArrayEquals(a.annual(), b.annual());
        assertArrayEquals(a.reflected(), b.reflected());
        assertArrayEquals(a.skyViewFactor(), b.skyViewFactor());
        assertArrayEquals(a.monthHourWm2(), b.monthHourWm2());
    }

    @Test
    void componentsSumToTotalAndMonthsToTheYear() throws Exception {
        IrradiationResult r = run(2);
        for (int p = 0; p < r.size(); p++) {
            double comp = r.beam()[p] + r.diffuse()[p] + r.reflected()[p];
            assertEquals(r.annual()[p], comp, 1e-9 * Math.max(1, comp), "components, patch " + p);
            double months = 0;
            for (int mo = 0; mo < 12; mo++) months += r.monthly()[mo][p];
            assertEquals(r.annual()[p], months, 1e-9 * Math.max(1, months), "months, patch " + p);
        }
    }

    @Test
    void everyComponentIsNonNegativeAndShadingNeverAddsDirectLight() throws Exception {
        IrradiationResult r = run(2);
        for (int p = 0; p < r.size(); p++) {
            assertTrue(r.beam()[p] >= 0 && r.diffuse()[p] >= 0 && r.reflected()[p] >= 0, "patch " + p);
            assertTrue(r.skyViewFactor()[p] >= 0 && r.skyViewFactor()[p] <= 1);
            assertTrue(r.horizonVisibility()[p] >= 0 && r.horizonVisibility()[p] <= 1);
            // beam + sky diffuse can only lose to obstruction; reflection from blocks may add light
            double direct = r.beam()[p] + r.diffuse()[p];
            assertTrue(direct <= r.unshaded()[p] + 1e-9, "patch " + p + ": " + direct + " > unshaded " + r.unshaded()[p]);
        }
    }
}
