package org.solmass.climate;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.sky.PlaneIrradiation;
import org.solmass.sky.PreparedSky;
import org.solmass.sky.Perez;
import org.solmass.sun.Site;

import java.nio.file.Path;
import java.time.ZoneOffset;

import static org.junit.jupiter.api.Assertions.*;

class RoundTripTest {
    @TempDir Path dir;

    /** A clear-sky year written as an hourly file and read back gives the same plane irradiation (to the file's 0.01 W/m2 rounding). */
    @Test
    void clearSkyYearSurvivesTheHourlyFormat() {
        Site site = new Site(-23.5, -46.6, 760, ZoneOffset.ofHours(-3)); // invented site
        WeatherSeries y = ClimateSource.load(site, ClimateSpec.clearSkyYear(2025));
        Path f = dir.resolve("year.csv");
        HourlyCsvWriter.write(y, ZoneOffset.ofHours(-3), "invented site, clear-sky year", f);
        WeatherSeries back = ClimateSource.load(site, ClimateSpec.file(f));
        assertEquals(y.size(), back.size());
        assertTrue(back.report().warnings().isEmpty(), back.report().toString());
        for (double[] plane : new double[][] {{0, 0}, {25, 0}, {90, 90}, {90, 270}, {60, 180}}) {
            PlaneIrradiation a = PreparedSky.of(y, Perez.INSTANCE).sum(plane[0], plane[1], 0.2);
            PlaneIrradiation b = PreparedSky.of(back, Perez.INSTANCE).sum(plane[0], plane[1], 0.2);
            assertEquals(a.annualKwhM2(), b.annualKwhM2(), 0.001 * a.annualKwhM2(), "tilt " + plane[0] + " az " + plane[1]);
            for (int m = 0; m < 12; m++) assertEquals(a.monthlyKwhM2()[m], b.monthlyKwhM2()[m], 0.001 * a.monthlyKwhM2()[m] + 1e-6);
        }
    }

    /** Quarter-hour average days give nearly the hourly days' clear-sky daily totals (step-size consistency, 1 %). */
    @Test
    void quarterHourAndHourlyClearSkyDaysAgree() {
        Site site = new Site(52, 13, 40, ZoneOffset.ofHours(1));
        WeatherSeries h = ClimateSource.load(site, ClimateSpec.clearSky());
        WeatherSeries q = ClimateSource.load(site, ClimateSpec.clearSky().withStepMinutes(15));
        for (int m = 1; m <= 12; m++) {
            double a = 0, b = 0;
            for (Step s : h.steps()) if (s.month() == m) a += s.ghiWm2() * s.durationH();
            for (Step s : q.steps()) if (s.month() == m) b += s.ghiWm2() * s.durationH();
            assertEquals(b, a, 0.01 * b, "month " + m);
        }
    }
}
