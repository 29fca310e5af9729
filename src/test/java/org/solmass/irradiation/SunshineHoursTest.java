package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.Step;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.Isotropic;
import org.solmass.sun.Site;

import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Sunshine duration by the WMO definition: DNI of at least 120 W/m2 (WMO-No. 8, ch. 8). */
class SunshineHoursTest {
    @Test
    void thresholdIsInclusiveAtExactly120() {
        assertTrue(StepTable.isSunshine(120.0));
        assertFalse(StepTable.isSunshine(Math.nextDown(120.0)));
    }

    /**
     * Clear-sky June steps with DNI forced to 119.99, 120 or 500 in turn: an unobstructed roof counts
     * exactly the hours whose DNI is at least 120, and the site count is the same.
     */
    @Test
    void unobstructedRoofCountsExactlyTheStepsAtOrAboveTheThreshold() {
        Site site = new Site(48, 10, 0, ZoneId.of("+01:00"));
        WeatherSeries all = ClimateSource.load(site, ClimateSpec.clearSky());
        List<Step> june = new ArrayList<>();
        double[] forced = {119.99, 120.0, 500.0};
        double expected = 0;
        int i = 0;
        for (Step s : all.steps()) {
            if (s.month() != 6) continue;
            if (s.sun().elevationDeg() > 5) {
                double dni = forced[i++ % 3];
                double ghi = dni * s.sun().cosZenith() + s.dhiWm2();
                s = new Step(s.start(), s.durationH(), s.month(), s.dayOfYear(), s.localStandardHour(), s.sun(),
                        s.sunUpFraction(), ghi, dni, s.dhiWm2(), s.extraNormalWm2(), s.dryBulbC(), s.weightDays());
                if (dni >= 120) expected += s.weightedHours();
            } else {
                s = new Step(s.start(), s.durationH(), s.month(), s.dayOfYear(), s.localStandardHour(), s.sun(),
                        s.sunUpFraction(), s.dhiWm2(), 0, s.dhiWm2(), s.extraNormalWm2(), s.dryBulbC(), s.weightDays());
            }
            june.add(s);
        }
        WeatherSeries series = new WeatherSeries(june, TimeBase.AVERAGE_DAYS, "june with forced DNI", all.report());
        PipelineFixture f = new PipelineFixture(new TestModels().slab("roof", 0, 0, 4, 4, 10).build(), Set.of(), 2.0);
        IrradiationResult r = f.run(series, Isotropic.INSTANCE, PipelineFixture.options(16, IrradiationSetup.SunSampling.EXACT));
        assertEquals(expected, r.siteSunshineHours(), 1e-9);
        for (int p = 0; p < r.size(); p++) assertEquals(expected, r.sunshineHours()[p], 1e-9);
        assertTrue(expected > 0);
    }
}
