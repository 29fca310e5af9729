package org.solmass.climate;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.solmass.InputException;
import org.solmass.cli.Main;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.Site;

import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The same INVENTED weather year (DemoWeather, seed 1, 51 N 10 E, Europe/Berlin) written in many
 * spreadsheet dialects reads as the clean file does: the same steps, and the same patches.csv from
 * {@code analyse}. The expected values are the clean file's own; the unit factors are checked by hand.
 */
class ClimateDialectTest {
    static final Site SITE = new Site(51, 10, 0, ZoneId.of("Europe/Berlin"));
    static final ZoneOffset LST = ZoneOffset.ofHours(1);
    static final SolarCalculator CALC = new SolarCalculator(SITE);
    static List<DemoWeather.Hour> year;
    static String clean;
    static WeatherSeries cleanSeries;

    @TempDir Path dir;

    @BeforeAll
    static void demoYear() {
        year = DemoWeather.year(SITE, 2025, 1);
        clean = DemoWeather.hourlyCsv(year, SITE, 1);
        cleanSeries = read(clean, ClimateSpec.Reading.DEFAULT);
    }

    static WeatherSeries read(String text, ClimateSpec.Reading reading) {
        return ClimateSource.parse(CALC, ClimateSpec.file(Path.of("w.csv")).withReading(reading), "w.csv", text);
    }

    /**
     * How a variant writes the year.
     *
     * @param time  iso, dmy (31.01.2025 13:00), dmy2 (31.01.2025 and 13:00 in two columns), ymd (2025/01/31 13:00), mdy (01/31/2025 13:00) or split (year..hour columns)
     * @param unit  irradiance unit written in the header ("" for none)
     * @param given irradiance unit given as an option, or null
     */
    record Dialect(String name, String sep, boolean decimalComma, boolean crlf, boolean bom, boolean quoted, String time,
                   String unit, String bracket, IrradianceUnit given, ClimateSpec.DateOrder order) {
        @Override public String toString() { return name; }

        ClimateSpec.Reading reading() { return new ClimateSpec.Reading(order, ClimateSpec.Clock.STANDARD, given); }

        boolean exact() {
            IrradianceUnit u = given != null ? given : unit.isEmpty() ? IrradianceUnit.W_M2 : IrradianceUnit.find(unit);
            return u == IrradianceUnit.W_M2 || u == IrradianceUnit.WH_M2;
        }
    }

    static Stream<Dialect> dialects() {
        return Stream.of(
                new Dialect("semicolon", ";", false, false, false, false, "iso", "", "(", null, null),
                new Dialect("semicolon + decimal comma", ";", true, false, false, false, "iso", "", "(", null, null),
                new Dialect("tab", "\t", false, false, false, false, "iso", "", "(", null, null),
                new Dialect("tab + decimal comma", "\t", true, false, false, false, "iso", "", "(", null, null),
                new Dialect("CRLF", ",", false, true, false, false, "iso", "", "(", null, null),
                new Dialect("byte-order mark", ",", false, false, true, false, "iso", "", "(", null, null),
                new Dialect("quoted header and cells", ",", false, false, false, true, "iso", "", "(", null, null),
                new Dialect("comma file, decimal comma in quoted cells", ",", true, false, false, true, "iso", "", "(", null, null),
                new Dialect("units W/m2 in round brackets", ",", false, false, false, false, "iso", "W/m2", "(", null, null),
                new Dialect("units Wh/m2 in square brackets", ",", false, false, false, false, "iso", "Wh/m2", "[", null, null),
                new Dialect("kW/m2 in the header", ",", false, false, false, false, "iso", "kW/m2", "(", null, null),
                new Dialect("kJ/m2 in the header", ",", false, false, false, false, "iso", "kJ/m2", "[", null, null),
                new Dialect("J/cm2 given as an option", ",", false, false, false, false, "iso", "", "(", IrradianceUnit.J_CM2, null),
                new Dialect("day-first dates with dots", ",", false, false, false, false, "dmy", "", "(", null, null),
                new Dialect("year-first dates with slashes", ",", false, false, false, false, "ymd", "", "(", null, null),
                new Dialect("month-first dates with slashes", ",", false, false, false, false, "mdy", "", "(", null, null),
                new Dialect("date and time in two columns, day-first", ";", false, false, false, false, "dmy2", "", "(", null, null),
                new Dialect("split year, month, day, hour columns", ",", false, false, false, false, "split", "", "(", null, null),
                new Dialect("semicolon + decimal comma + CRLF + BOM + quoted header + kJ/m2 + day-first dates", ";", true, true, true, true, "dmy", "kJ/m2", "(", null, null),
                new Dialect("tab + decimal comma + split date columns + J/cm2 option + CRLF", "\t", true, true, false, false, "split", "", "(", IrradianceUnit.J_CM2, null),
                new Dialect("semicolon + slashes month-first with --date-order mdy + Wh/m2", ";", false, false, false, true, "mdy", "Wh/m2", "[", null, ClimateSpec.DateOrder.MDY));
    }

    /** The year in one dialect. Irradiance values are converted with exact decimal arithmetic. */
    static String write(Dialect d) {
        StringBuilder b = new StringBuilder();
        String nl = d.crlf() ? "\r\n" : "\n";
        if (d.bom()) b.append('\uFEFF');
        b.append("# INVENTED demo weather, not measured data (ClimateDialectTest)").append(nl);
        String close = d.bracket().equals("(") ? ")" : "]";
        String u = d.unit().isEmpty() ? "" : " " + d.bracket() + d.unit() + close;
        List<String> head = new ArrayList<>();
        if (d.time().equals("split")) head.addAll(List.of("Year", "Month", "Day", "Hour"));
        else if (d.time().equals("dmy2")) head.addAll(List.of("Date", "Time"));
        else head.add("Timestamp");
        head.addAll(List.of("GHI" + u, "DHI" + u, "Temperature (C)"));
        b.append(String.join(d.sep(), head.stream().map(h -> d.quoted() ? "\"" + h + "\"" : h).toList())).append(nl);
        IrradianceUnit unit = d.given() != null ? d.given() : d.unit().isEmpty() ? IrradianceUnit.W_M2 : IrradianceUnit.find(d.unit());
        for (DemoWeather.Hour h : year) {
            List<String> cells = new ArrayList<>(time(d, h.start()));
            cells.add(number(d, in(unit, h.ghiWm2())));
            cells.add(number(d, in(unit, h.dhiWm2())));
            cells.add(number(d, BigDecimal.valueOf(h.tempC())));
            b.append(String.join(d.sep(), cells.stream().map(c -> d.quoted() ? "\"" + c + "\"" : c).toList())).append(nl);
        }
        return b.toString();
    }

    /** W/m2 over one hour in the unit: kW/m2 = W/m2 / 1000; Wh/m2 = W/m2 x 1 h; kJ/m2 = Wh/m2 x 3.6; J/cm2 = kJ/m2 / 10. */
    static BigDecimal in(IrradianceUnit u, double wm2) {
        BigDecimal v = BigDecimal.valueOf(wm2);
        return switch (u) {
            case W_M2, WH_M2 -> v;
            case KW_M2, KWH_M2 -> v.movePointLeft(3);
            case KJ_M2 -> v.multiply(new BigDecimal("3.6"));
            case MJ_M2 -> v.multiply(new BigDecimal("0.0036"));
            case J_CM2 -> v.multiply(new BigDecimal("0.36"));
        };
    }

    static String number(Dialect d, BigDecimal v) {
        String s = v.stripTrailingZeros().toPlainString();
        return d.decimalComma() ? s.replace('.', ',') : s;
    }

    static List<String> time(Dialect d, LocalDateTime t) {
        return switch (d.time()) {
            case "dmy" -> List.of(DateTimeFormatter.ofPattern("dd.MM.yyyy HH:mm").format(t));
            case "dmy2" -> List.of(DateTimeFormatter.ofPattern("dd.MM.yyyy").format(t), DateTimeFormatter.ofPattern("HH:mm").format(t));
            case "ymd" -> List.of(DateTimeFormatter.ofPattern("yyyy/MM/dd HH:mm").format(t));
            case "mdy" -> List.of(DateTimeFormatter.ofPattern("MM/dd/yyyy HH:mm").format(t));
            case "split" -> List.of(Integer.toString(t.getYear()), Integer.toString(t.getMonthValue()),
                    Integer.toString(t.getDayOfMonth()), Integer.toString(t.getHour()));
            default -> List.of(DateTimeFormatter.ofPattern("yyyy-MM-dd'T'HH:mm").format(t));
        };
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("dialects")
    void theYearInAnyDialectReadsAsTheCleanFile(Dialect d) {
        WeatherSeries w = read(write(d), d.reading());
        assertEquals(cleanSeries.size(), w.size());
        if (d.exact()) {
            assertEquals(cleanSeries.steps(), w.steps(), d.name());
        } else {
            // a unit conversion (one multiplication and one division of doubles) may differ from the
            // clean value in the last bits: 1e-9 W/m2 is far below the 0.1 W/m2 the file is written to
            for (int i = 0; i < w.size(); i++) {
                Step a = cleanSeries.step(i), b = w.step(i);
                assertEquals(a.start(), b.start());
                assertEquals(a.ghiWm2(), b.ghiWm2(), 1e-9, d.name() + " step " + i);
                assertEquals(a.dhiWm2(), b.dhiWm2(), 1e-9, d.name() + " step " + i);
                assertEquals(a.dniWm2(), b.dniWm2(), 1e-9, d.name() + " step " + i);
            }
        }
        assertEquals(cleanSeries.report().repairs(), w.report().repairs());
        assertEquals(cleanSeries.report().warnings(), w.report().warnings());
    }

    @Test
    void aBoxAnalysedWithTheMessiestDialectsGivesByteIdenticalPatches() throws Exception {
        Path obj = dir.resolve("box.obj");
        StringBuilder b = new StringBuilder("# invented 10 m box\no box\n");
        for (int z = 0; z <= 1; z++) for (int y = 0; y <= 1; y++) for (int x = 0; x <= 1; x++) b.append("v ").append(10 * x).append(' ').append(10 * y).append(' ').append(10 * z).append('\n');
        b.append("f 1 3 4 2\nf 5 6 8 7\nf 1 2 6 5\nf 3 7 8 4\nf 1 5 7 3\nf 2 4 8 6\n");
        Files.writeString(obj, b);
        byte[] expected = analyse(obj, "clean", clean);
        List<Dialect> messy = dialects().filter(d -> d.name().contains(" + ")).toList();
        assertEquals(5, messy.size());
        for (Dialect d : messy) {
            List<String> extra = new ArrayList<>();
            if (d.given() != null) extra.addAll(List.of("--irradiance-unit", d.given().label()));
            if (d.order() != null) extra.addAll(List.of("--date-order", d.order().label()));
            assertArrayEquals(expected, analyse(obj, "d" + messy.indexOf(d), write(d), extra.toArray(String[]::new)), d.name());
        }
    }

    private byte[] analyse(Path obj, String name, String csv, String... extra) throws Exception {
        Path f = dir.resolve(name + ".csv"), out = dir.resolve("out-" + name);
        Files.writeString(f, csv, StandardCharsets.UTF_8);
        List<String> args = new ArrayList<>(List.of("analyse", "-q", "--model", obj.toString(), "--lat", "51", "--lon", "10",
                "--zone", "Europe/Berlin", "--climate", f.toString(), "--rays", "16", "--patch", "5", "--out", out.toString()));
        args.addAll(List.of(extra));
        assertEquals(0, Main.execute(args.toArray(String[]::new)), name);
        return Files.readAllBytes(out.resolve("patches.csv"));
    }

    /** SI definitions: 1 Wh = 3600 J; 1 kWh = 3600 kJ; 1 J/cm2 = 10^4 J/m2 = 10 kJ/m2. */
    @Test
    void unitFactorsAreTheSiDefinitions() {
        assertEquals(1000, IrradianceUnit.KW_M2.toWm2(1, 1), 1e-12);
        assertEquals(1000, IrradianceUnit.WH_M2.toWm2(1000, 1), 1e-12);
        assertEquals(1000, IrradianceUnit.WH_M2.toWm2(250, 0.25), 1e-12);        // 250 Wh/m2 in 15 min
        assertEquals(1000, IrradianceUnit.KWH_M2.toWm2(1, 1), 1e-12);
        assertEquals(1000, IrradianceUnit.KJ_M2.toWm2(3600, 1), 1e-9);           // 1 kWh = 3600 kJ
        assertEquals(1000, IrradianceUnit.MJ_M2.toWm2(3.6, 1), 1e-9);            // 1 kWh = 3.6 MJ
        assertEquals(1000, IrradianceUnit.J_CM2.toWm2(360, 1), 1e-9);            // 360 J/cm2 = 3600 kJ/m2
        assertEquals(IrradianceUnit.KJ_M2.toWm2(10, 1), IrradianceUnit.J_CM2.toWm2(1, 1), 1e-12);   // 1 J/cm2 = 10 kJ/m2
        assertEquals(IrradianceUnit.W_M2, IrradianceUnit.find("W m-2"));
        assertEquals(IrradianceUnit.W_M2, IrradianceUnit.find("W/m²"));
        assertEquals(IrradianceUnit.J_CM2, IrradianceUnit.find("J cm-2"));
        assertNull(IrradianceUnit.find("W/ft2"));
    }

    @Test
    void clockTimeWithDaylightSavingReadsAsTheStandardTimeFileAndReportsTheClockChanges() {
        ZoneId berlin = SITE.zone();
        StringBuilder b = new StringBuilder("time,ghi_wm2,dhi_wm2,temp_c\n");
        for (DemoWeather.Hour h : year) {
            LocalDateTime clock = h.start().toInstant(LST).atZone(berlin).toLocalDateTime();
            b.append(clock).append(',').append(h.ghiWm2()).append(',').append(h.dhiWm2()).append(',').append(h.tempC()).append('\n');
        }
        WeatherSeries w = read(b.toString(), new ClimateSpec.Reading(null, ClimateSpec.Clock.DST, null));
        assertEquals(cleanSeries.steps(), w.steps());
        assertEquals(cleanSeries.report().months(), w.report().months());
        // 2025 in Europe/Berlin: forward on 30 March 02:00 -> 03:00, back on 26 October 03:00 -> 02:00 (EU rule, common practice)
        assertTrue(w.report().warnings().stream().anyMatch(x -> x.startsWith("clock skipped 2025-03-30T02:00 to 03:00")), w.report().warnings().toString());
        assertTrue(w.report().warnings().stream().anyMatch(x -> x.startsWith("clock repeated 2025-10-26T02:00 to 03:00")), w.report().warnings().toString());
        assertTrue(w.report().repairs().get(0).startsWith("repeated autumn clock hour read as its second pass (standard time): 1 step"), w.report().repairs().toString());
        assertEquals(2, w.report().reading().notes().size());
        InputException e = assertThrows(InputException.class, () -> read(b.toString(), ClimateSpec.Reading.DEFAULT));
        assertTrue(e.getMessage().contains("read it with --clock dst"), e.getMessage());
    }

    @Test
    void aClockTimeThatDoesNotExistIsAnError() {
        String csv = "time,ghi_wm2\n2025-03-30T01:00,0\n2025-03-30T02:00,0\n2025-03-30T03:00,0\n";
        InputException e = assertThrows(InputException.class, () -> read(csv, new ClimateSpec.Reading(null, ClimateSpec.Clock.DST, null)));
        assertEquals("w.csv:3: clock time 2025-03-30T02:00 does not exist: clocks went forward from 02:00 to 03:00 that day"
                + " (is the file in standard time? --clock standard)", e.getMessage());
    }

    /** The check of ClockCheck: the clean year shows no shift; the same year with its daylight-saving days one hour late does. */
    @Test
    void dataShiftedOneHourOnDaylightSavingDaysLookLikeClockTime() {
        ZoneId berlin = SITE.zone();
        ClimateReport.Builder none = new ClimateReport.Builder();
        ClockCheck.warnIfClockTime(cleanSeries.steps(), berlin, none);
        assertEquals(List.of(), none.build().warnings());
        List<Step> s = cleanSeries.steps(), shifted = new ArrayList<>(s);
        for (int i = 1; i < s.size(); i++) {
            Step a = s.get(i), p = s.get(i - 1);
            if (berlin.getRules().isDaylightSavings(a.start())) {
                shifted.set(i, new Step(a.start(), a.durationH(), a.month(), a.dayOfYear(), a.localStandardHour(), a.sun(), a.sunUpFraction(),
                        p.ghiWm2(), p.dniWm2(), p.dhiWm2(), a.extraNormalWm2(), a.dryBulbC(), a.weightDays()));
            }
        }
        ClimateReport.Builder rep = new ClimateReport.Builder();
        ClockCheck.warnIfClockTime(shifted, berlin, rep);
        assertEquals(1, rep.build().warnings().size());
        assertTrue(rep.build().warnings().get(0).contains("look like clock time"), rep.build().warnings().toString());
    }

    @Test
    void aLeapYearOfRowsStampedIn2023IsWarnedAbout() {
        List<DemoWeather.Hour> leap = DemoWeather.year(SITE, 2024, 1);
        assertEquals(8784, leap.size());
        StringBuilder b = new StringBuilder("time,ghi_wm2,dhi_wm2\n");
        LocalDateTime t = LocalDateTime.of(2023, 1, 1, 0, 0);
        for (DemoWeather.Hour h : leap) {
            // the 2024 values on 2023 stamps: one day late after February, within the checks' limits at night
            b.append(t).append(',').append(t.getDayOfYear() > 59 ? 0 : h.ghiWm2()).append(',').append(t.getDayOfYear() > 59 ? 0 : h.dhiWm2()).append('\n');
            t = t.plusHours(1);
        }
        WeatherSeries w = read(b.toString(), ClimateSpec.Reading.DEFAULT);
        assertEquals(List.of("the file covers 8784 h (a leap year) but starts in 2023, which has 8760 h: it runs into 2024;"
                + " check the timestamps (a leap year's rows stamped with another year?)"), w.report().warnings());
    }

    @Test
    void splitDateColumnsAreAnHourlyFileNotAMonthHourTable() {
        ClimateTable t = ClimateTable.of("w.csv", "year,month,day,hour,ghi\n2025,1,1,0,0\n2025,1,1,1,0\n");
        assertEquals(ClimateSpec.Format.HOURLY, ClimateSource.detect(t, ClimateSpec.file(Path.of("w.csv"))));
        ClimateTable mh = ClimateTable.of("w.csv", "month,hour,ghi_wm2,dhi_wm2\n1,0,0,0\n");
        assertEquals(ClimateSpec.Format.MONTH_HOUR, ClimateSource.detect(mh, ClimateSpec.file(Path.of("w.csv"))));
    }

    @Test
    void theReportGivesTheDialectColumnsUnitsPeriodAndTotals() {
        Dialect d = dialects().filter(x -> x.name().startsWith("semicolon + decimal comma + CRLF")).findFirst().orElseThrow();
        ClimateReport r = read(write(d), d.reading()).report();
        assertEquals("semicolon", r.reading().separator());
        assertEquals("comma", r.reading().decimalMark());
        assertEquals("UTF-8 (byte-order mark)", r.reading().encoding());
        assertEquals("CRLF", r.reading().lineEnd());
        assertTrue(r.reading().quoted());
        assertEquals("GHI (kJ/m2)", r.reading().columns().get("ghi"));
        assertEquals("kJ/m2 per step", r.reading().units().get("ghi"));
        assertEquals(new ClimateReport.Period("2025-01-01T00:00", "2025-12-31T23:00", 8760, 60, "hourly-year", 0), r.period());
        assertEquals(12, r.months().size());
        // the annual total is the sum of the months, and GHI x 1 h summed over the clean file / 1000
        double sum = 0;
        for (DemoWeather.Hour h : year) sum += h.ghiWm2();
        assertEquals(sum / 1000, r.total().ghiKwhM2(), 1e-6);
        assertEquals(r.months().stream().mapToDouble(ClimateReport.Totals::ghiKwhM2).sum(), r.total().ghiKwhM2(), 1e-9);
    }

    @Test
    void aNonUtf8FileNamesTheLine(@TempDir Path tmp) throws Exception {
        Path f = tmp.resolve("w.csv");
        Files.write(f, "time,ghi_wm2\n2025-01-01T00:00,0\n2025-01-01T01:00,\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(f)));
        assertTrue(e.getMessage().startsWith(f + ":3: not UTF-8 text"), e.getMessage());
    }

    /** Issue 12: /dev/zero as a climate file ran out of memory; now the first 64 K characters without a line end stop it. */
    @Test
    void anEndlessSingleLineIsRefusedBeforeMemoryRunsOut() {
        Path zero = Path.of("/dev/zero");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.exists(zero), "no /dev/zero on this system");
        InputException e = assertThrows(InputException.class, () -> ClimateSource.load(SITE, ClimateSpec.file(zero)));
        assertEquals("/dev/zero:1: line longer than 65536 characters; a climate file has one row of a table per line (is this a CSV file?)",
                e.getMessage());
    }

    @Test
    void aUtf16FileWithAByteOrderMarkReadsAsTheCleanFile(@TempDir Path tmp) throws Exception {
        Path f = tmp.resolve("w.csv");
        Files.write(f, clean.getBytes(StandardCharsets.UTF_16));   // Java's UTF-16 encoder writes a big-endian byte-order mark
        WeatherSeries w = ClimateSource.load(SITE, ClimateSpec.file(f));
        assertEquals(cleanSeries.steps(), w.steps());
        assertEquals("UTF-16 (byte-order mark)", w.report().reading().encoding());
    }

    @Test
    void theMonthHourTableInASemicolonDecimalCommaDialectWithUnitsReadsAsTheCleanTable() {
        String table = DemoWeather.monthHourCsv(year, SITE, 1);
        StringBuilder b = new StringBuilder("\uFEFF");
        for (String line : table.split("\n")) {
            if (line.startsWith("#")) { b.append(line).append("\r\n"); continue; }
            String l = line.startsWith("month,") ? "\"Month\",\"Hour\",\"GHI (W/m2)\",\"DHI [Wh/m2]\",\"temp_c\"" : line;
            b.append(String.join(";", java.util.Arrays.stream(l.split(",")).map(c -> c.replace('.', ',')).toList())).append("\r\n");
        }
        WeatherSeries a = read(table, ClimateSpec.Reading.DEFAULT), w = read(b.toString(), ClimateSpec.Reading.DEFAULT);
        assertEquals(TimeBase.AVERAGE_DAYS, w.timeBase());
        assertEquals(a.steps(), w.steps());
        assertEquals(a.report().months(), w.report().months());
        assertEquals("semicolon", w.report().reading().separator());
        assertEquals("Wh/m2", w.report().reading().units().get("dhi"));
    }

    @Test
    void hour24ReadAsIntervalStartIsWarnedAbout() {
        String csv = "year,month,day,hour,ghi\n2025,1,1,23,0\n2025,1,1,24,0\n2025,1,2,1,0\n";
        WeatherSeries start = read(csv, ClimateSpec.Reading.DEFAULT);
        assertTrue(start.report().warnings().stream().anyMatch(w -> w.startsWith("the file gives hours as 24:00")), start.report().warnings().toString());
        WeatherSeries end = ClimateSource.parse(CALC, ClimateSpec.file(Path.of("w.csv")).withIntervalLabel(ClimateSpec.IntervalLabel.END), "w.csv", csv);
        assertTrue(end.report().warnings().stream().noneMatch(w -> w.startsWith("the file gives hours as 24:00")));
        // 24:00 of 1 January is 00:00 of 2 January: three hourly steps in a row
        assertEquals(3, end.size());
    }
}
