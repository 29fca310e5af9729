package org.solmass.climate;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.sun.Site;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;

import static org.junit.jupiter.api.Assertions.*;

/** Fixtures for every column layout of the hourly CSV and each bad-input case (invented site, clear-sky data). */
class HourlyYearReaderTest {
    static final Site SITE = ClimateSourceTest.SITE;
    static final ZoneOffset LST = ZoneOffset.ofHours(1);
    static List<Step> june; // 1-3 June 2025, hourly clear sky

    @TempDir Path dir;

    @BeforeAll
    static void clearSkyDays() {
        WeatherSeries y = ClimateSource.load(SITE, ClimateSpec.clearSkyYear(2025));
        june = y.steps().subList(151 * 24, 154 * 24);
    }

    private Path file(String header, Function<Step, String> row) throws IOException {
        List<String> lines = new ArrayList<>(List.of("# invented site, clear-sky values", header));
        for (Step s : june) lines.add(row.apply(s));
        Path p = dir.resolve("h.csv");
        Files.write(p, lines);
        return p;
    }

    private static String t(Step s) { return LocalDateTime.ofInstant(s.start(), LST).toString(); }
    private static String f(double v) { return String.format(Locale.ROOT, "%.3f", v); }

    private static WeatherSeries load(Path p) { return ClimateSource.load(SITE, ClimateSpec.file(p)); }

    private static void assertReproduces(WeatherSeries s, double dniTol) {
        assertEquals(june.size(), s.size());
        for (int i = 0; i < s.size(); i++) {
            Step a = june.get(i), b = s.step(i);
            assertEquals(a.start(), b.start());
            assertEquals(a.ghiWm2(), b.ghiWm2(), 0.01, "GHI at " + a.start());
            assertEquals(a.dniWm2(), b.dniWm2(), dniTol, "DNI at " + a.start());
            assertEquals(a.dhiWm2(), b.dhiWm2(), dniTol, "DHI at " + a.start());
        }
        ClimateSourceTest.assertClosure(s);
    }

    @Test
    void ghiAndDhiByHeaderName() throws IOException {
        WeatherSeries s = load(file("time,ghi_wm2,dhi_wm2,temp_c", st -> t(st) + "," + f(st.ghiWm2()) + "," + f(st.dhiWm2()) + ",18.5"));
        assertEquals(TimeBase.HOURLY_YEAR, s.timeBase());
        // DNI from (GHI - DHI)/cos z: rounding of 0.0005 W/m2 over cos z >= 0.035 stays below 0.03 W/m2
        assertReproduces(s, 0.03);
        assertEquals(18.5, s.step(5).dryBulbC(), 0);
        assertTrue(s.report().warnings().get(0).contains("not a whole year"));
    }

    @Test
    void ghiAndDniWithShortNames() throws IOException {
        assertReproduces(load(file("timestamp,ghi,dni", st -> t(st) + "," + f(st.ghiWm2()) + "," + f(st.dniWm2()))), 0.01);
    }

    @Test
    void dniAndDhiWithoutGhi() throws IOException {
        assertReproduces(load(file("datetime,dni_wm2,dhi_wm2", st -> t(st) + "," + f(st.dniWm2()) + "," + f(st.dhiWm2()))), 0.01);
    }

    /** GHI alone: Erbs et al. (1982) gives DHI = kd(kT) GHI, GHI itself is kept. */
    @Test
    void ghiAloneIsDecomposedByErbs() throws IOException {
        WeatherSeries s = load(file("time,ghi_wm2", st -> t(st) + "," + f(st.ghiWm2())));
        for (int i = 0; i < s.size(); i++) {
            Step b = s.step(i);
            assertEquals(june.get(i).ghiWm2(), b.ghiWm2(), 0.001);
            if (b.sun().elevationDeg() > 10) {
                double kt = Math.min(1, b.ghiWm2() / b.extraHorizontalWm2());
                assertEquals(Decomposition.erbsHourlyDiffuseFraction(kt) * b.ghiWm2(), b.dhiWm2(), 1e-6);
            }
        }
        ClimateSourceTest.assertClosure(s);
    }

    @Test
    void columnsMappedByNameAndByNumber() throws IOException {
        Path p = file("Date,GlobHor,DiffHor", st -> t(st) + "," + f(st.ghiWm2()) + "," + f(st.dhiWm2()));
        assertReproduces(ClimateSource.load(SITE, ClimateSpec.file(p).withFormat(ClimateSpec.Format.HOURLY)
                .withColumns(ClimateSpec.parseColumns("time=Date,ghi=GlobHor,dhi=DiffHor", "--columns"))), 0.03);
        assertReproduces(ClimateSource.load(SITE, ClimateSpec.file(p).withFormat(ClimateSpec.Format.HOURLY)
                .withColumns(Map.of("time", "1", "ghi", "2", "dhi", "3"))), 0.03);
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(p)
                .withFormat(ClimateSpec.Format.HOURLY).withColumns(Map.of("time", "1", "ghi", "9"))));
        assertEquals("columns", e.where());
    }

    @Test
    void timestampsWithOffsetEqualLocalStandardTime() throws IOException {
        assertReproduces(load(file("time,ghi_wm2,dhi_wm2", st -> st.start().toString() + "," + f(st.ghiWm2()) + "," + f(st.dhiWm2()))), 0.03);
        assertReproduces(load(file("time,ghi_wm2,dhi_wm2", st -> t(st).replace('T', ' ') + "+01:00," + f(st.ghiWm2()) + "," + f(st.dhiWm2()))), 0.03);
    }

    @Test
    void endLabelledIntervalsAreShiftedByOneStep() throws IOException {
        Path p = file("time,ghi_wm2,dhi_wm2", st -> LocalDateTime.ofInstant(st.start().plusSeconds(3600), LST) + "," + f(st.ghiWm2()) + "," + f(st.dhiWm2()));
        assertReproduces(ClimateSource.load(SITE, ClimateSpec.file(p).withIntervalLabel(ClimateSpec.IntervalLabel.END)), 0.03);
        // read as start-labelled, the evening values come an hour late: caught as GHI above the
        // extraterrestrial limit in the low evening sun, or as daytime values at night
        InputException e = assertThrows(InputException.class, () -> load(p));
        assertTrue(e.getMessage().contains("below the horizon") || e.getMessage().contains("extraterrestrial"), e.getMessage());
    }

    @Test
    void quarterHourStepsAndALeapDay() throws IOException {
        List<String> lines = new ArrayList<>(List.of("time,ghi_wm2,dhi_wm2"));
        LocalDateTime t0 = LocalDateTime.of(2024, 2, 28, 0, 0);
        for (int k = 0; k < 3 * 96; k++) lines.add(t0.plusMinutes(15L * k) + ",0,0");
        Path p = dir.resolve("q.csv");
        Files.write(p, lines);
        WeatherSeries s = load(p);
        assertEquals(288, s.size());
        assertEquals(0.25, s.step(0).durationH(), 0);
        assertEquals(60, s.step(96).dayOfYear(), "29 February is day 60");
        assertEquals(2, s.step(96).month());
    }

    private Path broken(Function<Step, String> row) throws IOException {
        return file("time,ghi_wm2,dhi_wm2", row);
    }

    private String error(Path p) {
        return assertThrows(InputException.class, () -> load(p)).getMessage();
    }

    private static String ok(Step st) { return t(st) + "," + f(st.ghiWm2()) + "," + f(st.dhiWm2()); }

    // row numbers: line 1 comment, line 2 header, step i at line i + 3; step 12 = 1 June 12:00 LST (line 15)

    @Test
    void missingStepIsAnErrorUnlessGapFillingIsAsked() throws IOException {
        Path p = dir.resolve("gap.csv");
        List<String> lines = new ArrayList<>(List.of("# invented", "time,ghi_wm2,dhi_wm2"));
        for (int i = 0; i < june.size(); i++) if (i != 12 && i != 13) lines.add(ok(june.get(i)));
        Files.write(p, lines);
        String m = error(p);
        assertTrue(m.contains("missing step") && m.contains("2025-06-01T12:00") && m.contains("gap.csv:14"), m);
        WeatherSeries s = ClimateSource.load(SITE, ClimateSpec.file(p).withFillGaps(2));
        assertEquals(june.size(), s.size());
        double expect = june.get(11).ghiWm2() + (june.get(14).ghiWm2() - june.get(11).ghiWm2()) / 3;
        assertEquals(expect, s.step(12).ghiWm2(), 0.01, "linear interpolation");
        assertTrue(s.report().repairs().get(0).startsWith("missing steps filled by linear interpolation: 2 steps"), s.report().repairs().toString());
        assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(p).withFillGaps(1)));
    }

    @Test
    void missingValueIsAnErrorNamingTheRow() throws IOException {
        String m = error(broken(st -> st == june.get(12) ? t(st) + ",," + f(st.dhiWm2()) : ok(st)));
        assertTrue(m.contains("h.csv:15") && m.contains("missing GHI"), m);
    }

    @Test
    void negativeValueIsAnError() throws IOException {
        String m = error(broken(st -> st == june.get(12) ? t(st) + ",-50," + f(st.dhiWm2()) : ok(st)));
        assertTrue(m.contains("h.csv:15") && m.contains("negative"), m);
    }

    @Test
    void ghiAboveExtraterrestrialIsAnError() throws IOException {
        String m = error(broken(st -> st == june.get(12) ? t(st) + ",1500,100" : ok(st)));
        assertTrue(m.contains("h.csv:15") && m.contains("extraterrestrial"), m);
    }

    @Test
    void dniAboveExtraterrestrialNormalIsAnError() throws IOException {
        String m = assertThrows(InputException.class, () -> load(file("time,ghi_wm2,dni_wm2",
                st -> t(st) + "," + f(st.ghiWm2()) + "," + (st == june.get(12) ? "1400" : f(st.dniWm2()))))).getMessage();
        assertTrue(m.contains("h.csv:15") && m.contains("DNI"), m);
    }

    @Test
    void dhiAboveGhiIsAnError() throws IOException {
        String m = error(broken(st -> st == june.get(12) ? t(st) + ",300,400" : ok(st)));
        assertTrue(m.contains("h.csv:15") && m.contains("DHI"), m);
    }

    @Test
    void daytimeValuesAtNightAreAnError() throws IOException {
        String m = error(broken(st -> st == june.get(1) ? t(st) + ",200,100" : ok(st)));
        assertTrue(m.contains("h.csv:4") && m.contains("below the horizon"), m);
    }

    @Test
    void smallSensorOffsetsAreRepairedAndReported() throws IOException {
        WeatherSeries s = load(broken(st -> st == june.get(1) ? t(st) + ",-2,3" : ok(st)));
        assertEquals(0, s.step(1).ghiWm2(), 0);
        assertTrue(s.report().repairs().stream().anyMatch(r -> r.startsWith("small negative values set to 0")), s.report().toString());
        assertTrue(s.report().repairs().stream().anyMatch(r -> r.startsWith("small night values set to 0")), s.report().toString());
    }

    @Test
    void badTimestampAndDisorderAreErrors() throws IOException {
        assertTrue(error(broken(st -> st == june.get(3) ? "June 1st," + f(st.ghiWm2()) + ",0" : ok(st))).contains("h.csv:6"));
        Path p = dir.resolve("order.csv");
        Files.write(p, List.of("time,ghi_wm2", "2025-06-01T01:00,0", "2025-06-01T02:00,0", "2025-06-01T01:00,0"));
        assertTrue(error(p).contains("order.csv:4"));
    }
}
