package org.solmass.climate;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.sun.SolarGeometry;
import org.solmass.sun.Site;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class ClimateSourceTest {
    static final Site SITE = new Site(47.4, 8.5, 430, ZoneOffset.ofHours(1)); // invented test site

    @TempDir Path dir;

    private Path write(String name, List<String> lines) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, lines);
        return p;
    }

    private static double dayTotalWh(WeatherSeries s, int month) {
        double wh = 0;
        for (Step st : s.steps()) if (st.month() == month) wh += st.ghiWm2() * st.durationH();
        return wh;
    }

    /** Closure GHI = DNI cos z + DHI on every step (definition of the components, common practice). */
    static void assertClosure(WeatherSeries s) {
        for (Step st : s.steps()) {
            assertTrue(st.ghiWm2() >= 0 && st.dniWm2() >= 0 && st.dhiWm2() >= 0, "non-negative at " + st.start());
            double beamH = st.dniWm2() * Math.max(0, st.sun().cosZenith());
            assertEquals(st.ghiWm2(), beamH + st.dhiWm2(), 1e-9 + 1e-9 * st.ghiWm2(), "closure at " + st.start());
            if (st.sunUpFraction() == 0) assertEquals(0, st.ghiWm2(), 0, "dark at night");
        }
    }

    @Test
    void clearSkyAverageDaysHaveKleinDaysAndMonthWeights() {
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.clearSky());
        assertEquals(TimeBase.AVERAGE_DAYS, s.timeBase());
        assertEquals(12 * 24, s.size());
        for (Step st : s.steps()) {
            assertEquals(SolarGeometry.kleinDayOfYear(st.month()), st.dayOfYear());
            assertEquals(SolarGeometry.daysInMonth(st.month()), st.weightDays(), 0);
        }
        assertClosure(s);
        // clear-sky daily GHI is below the extraterrestrial H0 and above half of it in June (Hottel clear day)
        double h0 = SolarGeometry.dailyExtraterrestrialWhM2(47.4, 162);
        double june = dayTotalWh(s, 6);
        assertTrue(june < h0 && june > 0.5 * h0, june + " vs H0 " + h0);
    }

    @Test
    void clearSkyYearCoversEveryHourOfALeapYear() {
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.clearSkyYear(2024).withStepMinutes(60));
        assertEquals(8784, s.size());
        assertEquals(TimeBase.HOURLY_YEAR, s.timeBase());
        assertEquals(1, s.step(0).weightDays(), 0);
        assertEquals(0, s.step(0).localStandardHour(), 0);
        assertClosure(s);
    }

    /** Monthly means: every average day's steps sum exactly to the given daily totals (rescaled CPR / Liu-Jordan). */
    @Test
    void monthlyMeansHoursSumToTheDailyTotals() throws IOException {
        double[] h = {1.0, 1.8, 3.0, 4.2, 5.0, 5.6, 5.8, 4.9, 3.6, 2.2, 1.2, 0.8};
        List<String> rows = new ArrayList<>(List.of("# invented site", "month,ghi_kwh_m2_day,dhi_kwh_m2_day,temp_c"));
        for (int m = 1; m <= 12; m++) rows.add(m + "," + h[m - 1] + "," + (m == 6 ? "" : String.valueOf(0.5 * h[m - 1])) + "," + (m * 1.5));
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.file(write("means.csv", rows)));
        assertEquals(TimeBase.AVERAGE_DAYS, s.timeBase());
        for (int m = 1; m <= 12; m++) {
            assertEquals(h[m - 1] * 1000, dayTotalWh(s, m), 1e-6, "month " + m);
            double dwh = 0;
            for (Step st : s.steps()) if (st.month() == m) dwh += st.dhiWm2() * st.durationH();
            if (m != 6) assertEquals(0.5 * h[m - 1] * 1000, dwh, 0.02 * 1000 * h[m - 1], "diffuse, month " + m + " (low-sun cut-off moves beam to diffuse)");
        }
        assertClosure(s);
        assertEquals(9.0, s.steps().stream().filter(st -> st.month() == 6).findFirst().orElseThrow().dryBulbC(), 1e-12);
    }

    /** Sub-hourly average days keep the daily totals. */
    @Test
    void monthlyMeansWithQuarterHourSteps() throws IOException {
        List<String> rows = new ArrayList<>(List.of("month,ghi_kwh_m2_day"));
        double[] h = new double[12];
        for (int m = 1; m <= 12; m++) {
            h[m - 1] = 0.5 * SolarGeometry.dailyExtraterrestrialWhM2(47.4, SolarGeometry.kleinDayOfYear(m)) / 1000; // KT = 0.5
            rows.add(m + "," + h[m - 1]);
        }
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.file(write("m.csv", rows)).withStepMinutes(15));
        assertEquals(12 * 96, s.size());
        for (int m = 1; m <= 12; m++) assertEquals(1000 * h[m - 1], dayTotalWh(s, m), 1e-6);
    }

    @Test
    void monthlyMeansAboveExtraterrestrialIsAnError() throws IOException {
        List<String> rows = new ArrayList<>(List.of("month,ghi_kwh_m2_day"));
        for (int m = 1; m <= 12; m++) rows.add(m + "," + (m == 12 ? "9.5" : "2"));
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(write("m.csv", rows))));
        assertTrue(e.getMessage().contains("m.csv:13"), e.getMessage());
    }

    private List<String> monthHourRows(double nightValue) {
        List<String> rows = new ArrayList<>(List.of("month,hour,ghi_wm2,dhi_wm2,temp_c"));
        for (int m = 1; m <= 12; m++) {
            for (int h = 0; h < 24; h++) {
                double g = h >= 8 && h <= 15 ? 300 * Math.sin(Math.PI * (h - 7.5) / 9) : 0;
                if (m == 1 && h == 7) g = nightValue; // 07-08 LST is before sunrise on 17 Jan at 47.4 N, 8.5 E
                rows.add(m + "," + h + "," + g + "," + 0.4 * g + ",5");
            }
        }
        return rows;
    }

    @Test
    void monthHourTableIsAnAverageDaySeries() throws IOException {
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.file(write("mh.csv", monthHourRows(0))));
        assertEquals(TimeBase.AVERAGE_DAYS, s.timeBase());
        assertEquals(288, s.size());
        assertClosure(s);
        assertEquals(300 * Math.sin(Math.PI * 4.5 / 9), s.step(4 * 24 + 12).ghiWm2(), 1e-9, "May 12-13 h GHI kept");
        assertTrue(s.report().isClean(), s.report().toString());
    }

    @Test
    void monthHourNightValueMovesToTheFirstSunUpHour() throws IOException {
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.file(write("mh.csv", monthHourRows(20))));
        assertEquals(0, s.step(7).ghiWm2(), 0);
        assertEquals(1, s.report().repairs().size(), s.report().toString());
        assertEquals(dayTotalWhExpected(), dayTotalWh(s, 1), 1e-9);
    }

    private static double dayTotalWhExpected() {
        double t = 20;
        for (int h = 8; h <= 15; h++) t += 300 * Math.sin(Math.PI * (h - 7.5) / 9);
        return t;
    }

    /**
     * A monthly mean sunrise hour holds light from the month's later days even where the sun is
     * barely up on Klein's day: accepted (only GHI <= G0n per hour, and the day total against H0).
     */
    @Test
    void monthHourSunriseHourOfOtherDaysIsAccepted() throws IOException {
        List<String> rows = monthHourRows(0);
        WeatherSeries ref = ClimateSource.load(SITE, ClimateSpec.file(write("mh0.csv", rows)));
        int firstUp = -1;
        for (int h = 0; h < 24 && firstUp < 0; h++) if (ref.step(2 * 24 + h).sunUpFraction() > 0) firstUp = h;
        rows.set(1 + 2 * 24 + firstUp, "3," + firstUp + ",45,30,5");
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.file(write("mh.csv", rows)));
        assertEquals(45, s.step(2 * 24 + firstUp).ghiWm2(), 1e-9);
        ClimateSourceTest.assertClosure(s);
    }

    @Test
    void monthHourDayAboveExtraterrestrialIsAnError() throws IOException {
        List<String> rows = monthHourRows(0);
        rows.set(1 + 11 * 24 + 12, "12,12,1300,100,5");
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(write("mh.csv", rows))));
        assertTrue(e.getMessage().contains("month 12") && e.getMessage().contains("extraterrestrial"), e.getMessage());
    }

    @Test
    void monthHourMissingRowIsAnError() throws IOException {
        List<String> rows = monthHourRows(0);
        rows.remove(30);
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(write("mh.csv", rows))));
        assertTrue(e.getMessage().contains("month 2 hour 5"), e.getMessage());
    }

    @Test
    void unknownHeaderAsksForTheFormat() throws IOException {
        Path p = write("x.csv", List.of("foo,bar", "1,2"));
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(p)));
        assertTrue(e.getMessage().contains("x.csv:1") && e.getMessage().contains("--climate-format"), e.getMessage());
    }
}
