package org.solmass.climate;

import org.solmass.InputException;
import org.solmass.sun.SolarCalculator;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Reads an hourly (or finer) CSV: one row per interval, a timestamp column (ISO local standard time
 * of the site, or ISO with an offset) and GHI+DHI, GHI+DNI, DNI+DHI or GHI alone (Erbs et al. 1982
 * decomposition), optional dry-bulb temperature and wind speed. See docs/climate-formats.md.
 */
final class HourlyYearReader {
    private HourlyYearReader() {}

    private static final String FILLED_STEPS = "missing steps filled by linear interpolation";
    static final Set<String> ROLES = Set.copyOf(ClimateSpec.COLUMN_ROLES);
    static final List<String> TIME_NAMES = List.of("time", "timestamp", "datetime");
    private static final Map<String, List<String>> NAMES = Map.ofEntries(
            Map.entry("time", TIME_NAMES),
            Map.entry("ghi", List.of("ghi_wm2", "ghi")),
            Map.entry("dhi", List.of("dhi_wm2", "dhi")),
            Map.entry("dni", List.of("dni_wm2", "dni")),
            Map.entry("temp", List.of("temp_c", "dry_bulb_c", "temperature_c", "temp", "temperature")),
            Map.entry("wind", List.of("wind_ms", "wind_speed_ms", "wind_speed", "ws")),
            Map.entry("date", List.of("date")),
            Map.entry("year", List.of("year")), Map.entry("month", List.of("month")), Map.entry("day", List.of("day")),
            Map.entry("hour", List.of("hour")), Map.entry("minute", List.of("minute")));
    private static final Set<String> CELSIUS = Set.of("c", "°c", "degc", "deg_c", "celsius");
    private static final Set<String> METRES_PER_SECOND = Set.of("m/s", "ms", "m/sec", "ms-1", "m.s-1", "ms^-1");
    /** Highest wind speed accepted, m/s: above any recorded mean wind (the record gust is 113 m/s, WMO). */
    static final double MAX_WIND_MS = 100;

    static WeatherSeries read(SolarCalculator calc, ClimateTable csv, ClimateSpec spec) {
        int ct = column(csv, spec, "time"), cg = column(csv, spec, "ghi"), cd = column(csv, spec, "dhi"),
                cn = column(csv, spec, "dni"), cT = column(csv, spec, "temp"), cW = column(csv, spec, "wind");
        int cdate = column(csv, spec, "date");
        int[] split = {column(csv, spec, "year"), column(csv, spec, "month"), column(csv, spec, "day"), column(csv, spec, "hour"),
                column(csv, spec, "minute")};
        String head = csv.headerAt();
        boolean splitTime = ct < 0 && split[0] >= 0 && split[1] >= 0 && split[2] >= 0 && split[3] >= 0;
        if (ct < 0 && !splitTime) {
            throw new InputException(head, "no time column (header time, timestamp or datetime, or columns year, month, day, hour, or --columns time=N)");
        }
        if (cg < 0 && (cd < 0 || cn < 0)) throw new InputException(head, "need a ghi column (ghi_wm2), or both dni_wm2 and dhi_wm2");
        if (csv.rows.size() < 2) throw new InputException(csv.name, "an hourly file needs at least 2 rows");
        IrradianceUnit option = spec.reading().irradianceUnit();
        IrradianceUnit[] units = new IrradianceUnit[3];
        int[] irr = {cg, cd, cn};
        for (int c = 0; c < 3; c++) if (irr[c] >= 0) units[c] = csv.irradianceUnit(irr[c], option);
        if (cT >= 0 && csv.unit(cT) != null && !CELSIUS.contains(csv.unit(cT).replace(" ", "").toLowerCase(Locale.ROOT))) {
            throw new InputException(head, "unknown temperature unit '" + csv.unit(cT) + "' in the header '" + csv.header.cells()[cT] + "'; expected C");
        }
        if (cW >= 0 && csv.unit(cW) != null && !METRES_PER_SECOND.contains(csv.unit(cW).replace(" ", "").toLowerCase(Locale.ROOT))) {
            throw new InputException(head, "unknown wind speed unit '" + csv.unit(cW) + "' in the header '" + csv.header.cells()[cW] + "'; expected m/s");
        }
        ClimateReport.Builder rep = new ClimateReport.Builder();
        RowTimes.Result times = RowTimes.read(csv, splitTime ? -1 : ct, split, cdate, spec.reading(), calc.site().zone(), rep);
        ZoneOffset off = times.standard();
        int n0 = csv.rows.size();
        Instant[] t = times.instants();
        for (int i = 1; i < n0; i++) {
            if (!t[i].isAfter(t[i - 1])) {
                throw new InputException(csv.at(csv.rows.get(i)), "timestamp " + LocalDateTime.ofInstant(t[i], off) + " is not after the previous row's "
                        + LocalDateTime.ofInstant(t[i - 1], off) + "; rows must be in time order, one per interval"
                        + clockHint(spec, calc.site().zone(), LocalDateTime.ofInstant(t[i], off)));
            }
        }
        long step = Duration.between(t[0], t[1]).getSeconds();
        if (step <= 0) throw new InputException(csv.at(csv.rows.get(1)), "timestamps must increase");
        if (step < 60 || (step <= 3600 ? 3600 % step != 0 : step != 3600)) {
            throw new InputException(csv.at(csv.rows.get(1)), "the step (" + step + " s from the first two rows) must divide one hour");
        }
        double stepH = step / 3600.0;
        checkGaps(csv, t, step, off, spec.fillGapsMaxSteps(), spec, calc.site().zone());
        RowTimes.checkYears(csv, t, off);
        long span = Duration.between(t[0], t[n0 - 1]).getSeconds();
        int n = (int) (span / step) + 1;
        double[][] v = new double[5][n];
        for (double[] a : v) Arrays.fill(a, Double.NaN);
        String[] where = new String[n];
        for (int i = 0; i < n0; i++) {
            ClimateTable.Line l = csv.rows.get(i);
            long d = Duration.between(t[0], t[i]).getSeconds();
            if (d % step != 0) throw new InputException(csv.at(l), "timestamp is not on the " + step / 60 + "-minute grid of the first rows");
            int k = (int) (d / step);
            where[k] = csv.at(l);
            int[] cols = {cg, cd, cn, cT, cW};
            String[] names = {"ghi", "dhi", "dni", "temp", "wind speed"};
            for (int c = 0; c < 5; c++) if (cols[c] >= 0) v[c][k] = csv.number(l, cols[c], names[c], true);
            if (cW >= 0 && (v[4][k] < 0 || v[4][k] > MAX_WIND_MS)) {
                throw new InputException(csv.at(l), "wind speed " + csv.header.cells()[cW] + " = " + l.cells()[cW]
                        + " is out of range; expected 0 to " + (int) MAX_WIND_MS + " m/s");
            }
            for (int c = 0; c < 3; c++) if (cols[c] >= 0 && units[c] != IrradianceUnit.W_M2) v[c][k] = units[c].toWm2(v[c][k], stepH);
        }
        String[] missingAt = new String[n];
        for (int k = 0; k < n; k++) {
            if (where[k] == null) {
                where[k] = where[k - 1]; // the line before the gap
                missingAt[k] = LocalDateTime.ofInstant(t[0].plusSeconds(k * step), off).toString();
            }
        }
        int[] cols = {cg, cd, cn, cT, cW};
        String[] names = {"GHI", "DHI", "DNI", "temperature", "wind speed"};
        for (int c = 0; c < 5; c++) if (cols[c] >= 0) fill(v[c], names[c], missingAt, where, spec.fillGapsMaxSteps(), rep);
        for (int k = 0; k < n; k++) if (missingAt[k] != null) rep.repair(FILLED_STEPS, missingAt[k]);
        double hours = n * step / 3600.0;
        if (Math.abs(hours - 8760) > 1e-6 && Math.abs(hours - 8784) > 1e-6) {
            rep.warn(String.format("the file covers %.1f h, not a whole year (8760 or 8784 h): sums are over the file's period", hours));
        }
        int year0 = LocalDateTime.ofInstant(start(t[0], step, spec.intervalLabel()), off).getYear();
        if (Math.abs(hours - 8784) <= 1e-6 && !java.time.Year.isLeap(year0)) {
            rep.warn("the file covers 8784 h (a leap year) but starts in " + year0 + ", which has 8760 h: it runs into "
                    + (year0 + 1) + "; check the timestamps (a leap year's rows stamped with another year?)");
        }
        List<Step> steps = new ArrayList<>(n);
        Instant first = start(t[0], step, spec.intervalLabel());
        SolarCalculator.SunUp[] up = calc.sunUpSequence(first, step, n);
        for (int k = 0; k < n; k++) {
            Slot s = Slot.of(up[k], off, first.plusSeconds(k * step), step, 1);
            double[] c = Components.check(s, v[0][k], v[2][k], v[1][k], rep, where[k]);
            double g = c[0], dn = c[1], dh = c[2];
            double[] r;
            if (Double.isNaN(g)) {
                double beamH = dn * Math.max(0, s.sun().cosZenith());
                r = Components.lowSun(s) ? new double[] {beamH + dh, 0, beamH + dh} : new double[] {beamH + dh, dn, dh};
            } else if (!Double.isNaN(dh)) r = Components.fromGhiDhi(s, g, dh, rep, where[k]);
            else if (!Double.isNaN(dn)) r = Components.fromGhiDni(s, g, dn, rep, where[k]);
            else r = Components.fromGhi(s, g, rep, where[k]);
            steps.add(s.toStep(r[0], r[1], r[2], v[3][k], v[4][k]));
        }
        String layout = cg < 0 ? "DNI+DHI" : cd >= 0 ? "GHI+DHI" : cn >= 0 ? "GHI+DNI" : "GHI (Erbs decomposition)";
        if (times.hour24() && spec.intervalLabel() == ClimateSpec.IntervalLabel.START) {
            rep.warn("the file gives hours as 24:00, as files labelled by the end of each interval (hour ending) do, but its"
                    + " timestamps are read as interval starts; if the values are for the hour before, read it with --interval-label end");
        }
        if (spec.reading().clock() == ClimateSpec.Clock.STANDARD) ClockCheck.warnIfClockTime(steps, calc.site().zone(), rep);
        Map<String, String> mapped = new java.util.LinkedHashMap<>(), unitNames = new java.util.LinkedHashMap<>();
        String[] roles = {"date", "time", "year", "month", "day", "hour", "minute", "ghi", "dhi", "dni", "temp", "wind"};
        int[] at = {times.dateJoined() ? cdate : -1, splitTime ? -1 : ct, splitTime ? split[0] : -1, splitTime ? split[1] : -1, splitTime ? split[2] : -1,
                splitTime ? split[3] : -1, splitTime ? split[4] : -1, cg, cd, cn, cT, cW};
        for (int r = 0; r < roles.length; r++) if (at[r] >= 0) mapped.put(roles[r], csv.header.cells()[at[r]]);
        for (int c = 0; c < 3; c++) if (irr[c] >= 0) unitNames.put(roles[7 + c], units[c].label() + (units[c].perInterval() ? " per step" : ""));
        if (cT >= 0) unitNames.put("temp", "C");
        if (cW >= 0) unitNames.put("wind", "m/s");
        rep.reading(csv.reading("hourly", mapped, unitNames, times.layout() + ", labels at interval "
                + spec.intervalLabel().name().toLowerCase(Locale.ROOT) + ", layout " + layout, rep.notes()));
        return new WeatherSeries(steps, TimeBase.HOURLY_YEAR, "hourly file " + csv.name + " (" + layout + ", "
                + step / 60 + "-minute steps, labels at interval " + spec.intervalLabel().name().toLowerCase(Locale.ROOT) + ")",
                rep.build().complete(steps, TimeBase.HOURLY_YEAR, off, rep.count(FILLED_STEPS)));
    }

    /** Linear interpolation over runs of NaN no longer than maxRun with values on both sides; else an error. */
    private static void fill(double[] a, String name, String[] missingAt, String[] where, int maxRun, ClimateReport.Builder rep) {
        int n = a.length;
        for (int i = 0; i < n; ) {
            if (!Double.isNaN(a[i])) { i++; continue; }
            int j = i;
            while (j < n && Double.isNaN(a[j])) j++;
            int run = j - i;
            boolean missingRows = missingAt[i] != null;
            if (run > maxRun || i == 0 || j == n) {
                throw new InputException(where[i], (missingRows ? "missing step" : "missing " + name + " value") + (run > 1 ? "s (" + run + " in a row)" : "")
                        + (missingRows ? " after this line, from " + missingAt[i] : "")
                        + gapAdvice(maxRun));
            }
            for (int k = i; k < j; k++) a[k] = a[i - 1] + (a[j] - a[i - 1]) * (k - i + 1) / (run + 1);
            if (!missingRows) rep.repair("missing " + name + " values filled by linear interpolation", where[i]);
            i = j;
        }
    }

    /**
     * Refuses a gap between two rows longer than the gaps that are filled, before any array of the
     * file's span is made: the span is then at most (rows x (maxRun + 1)) steps, whatever the timestamps.
     */
    private static void checkGaps(ClimateTable csv, Instant[] t, long step, ZoneOffset off, int maxRun, ClimateSpec spec, java.time.ZoneId zone) {
        for (int i = 1; i < t.length; i++) {
            long d = Duration.between(t[i - 1], t[i]).getSeconds();
            ClimateTable.Line l = csv.rows.get(i);
            if (d % step != 0) throw new InputException(csv.at(l), "timestamp is not on the " + step / 60 + "-minute grid of the first rows");
            long missing = d / step - 1;
            if (missing > maxRun) {
                throw new InputException(csv.at(csv.rows.get(i - 1)), "missing step" + (missing > 1 ? "s (" + missing + " in a row)" : "")
                        + " after this line, from " + LocalDateTime.ofInstant(t[i - 1].plusSeconds(step), off) + gapAdvice(maxRun)
                        + clockHint(spec, zone, LocalDateTime.ofInstant(t[i - 1].plusSeconds(step), off)));
            }
        }
    }

    /**
     * A hint when a local time read as standard time is one that clocks repeat (autumn) or skip
     * (spring) in the zone: the file is probably clock time with daylight saving.
     */
    private static String clockHint(ClimateSpec spec, java.time.ZoneId zone, LocalDateTime local) {
        if (spec.reading().clock() != ClimateSpec.Clock.STANDARD || zone.getRules().isFixedOffset()) return "";
        int valid = zone.getRules().getValidOffsets(local).size();
        if (valid == 1) return "";
        return " (" + local + " is an hour the clocks of " + zone + (valid == 0 ? " skip in spring" : " repeat in autumn")
                + ": if the file is in clock time with daylight saving, read it with --clock dst)";
    }

    private static String gapAdvice(int maxRun) {
        return maxRun > 0 ? "; only gaps of up to " + maxRun + " steps inside the file are filled"
                : "; set \"fill_gaps\": true in the study's climate object to interpolate short gaps";
    }

    private static int column(ClimateTable csv, ClimateSpec spec, String role) {
        String m = spec.columns().get(role);
        if (m != null) {
            if (m.matches("\\d+")) {
                int c = Integer.parseInt(m) - 1;
                if (c < 0 || c >= csv.header.cells().length) throw new InputException("columns", role + "=" + m + ": the header has columns 1.." + csv.header.cells().length);
                return c;
            }
            int c = csv.column(m);
            if (c < 0) throw new InputException("columns", role + "=" + m + ": no such header in " + csv.name + " " + Arrays.toString(csv.header.cells()));
            return c;
        }
        for (String name : NAMES.get(role)) {
            int c = csv.column(name);
            if (c >= 0) return c;
        }
        return -1;
    }

    /** Interval start from a label. */
    static Instant start(Instant label, long stepSec, ClimateSpec.IntervalLabel mode) {
        return mode == ClimateSpec.IntervalLabel.END ? label.minusSeconds(stepSec) : label;
    }
}
