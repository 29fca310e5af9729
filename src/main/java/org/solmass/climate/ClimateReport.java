package org.solmass.climate;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a climate source found while reading its input, for the user to read before a run
 * ({@code solmass climate FILE}) and for the viewer: how the file was read, the period and steps,
 * one line per kind of repair with its count and the first place it happened, warnings, and the
 * monthly and annual irradiation. A plain object: records, lists, strings and numbers.
 *
 * @param repairs  one line per kind of repair
 * @param warnings what looks wrong but was accepted
 * @param reading  how the file was read; null for the clear-sky model
 * @param period   the steps the series holds; null until the series is complete
 * @param months   irradiation per calendar month present, in month order
 * @param total    irradiation of all steps (the year, for a whole year or average days)
 */
public record ClimateReport(List<String> repairs, List<String> warnings, Reading reading, Period period,
                            List<Totals> months, Totals total) {
    public ClimateReport {
        repairs = List.copyOf(repairs);
        warnings = List.copyOf(warnings);
        months = months == null ? List.of() : List.copyOf(months);
    }

    public ClimateReport(List<String> repairs, List<String> warnings) {
        this(repairs, warnings, null, null, List.of(), null);
    }

    /**
     * How a file was read.
     *
     * @param format       month-hour, monthly or hourly
     * @param separator    comma, semicolon or tab
     * @param decimalMark  point or comma
     * @param encoding     UTF-8, with "(byte-order mark)" when it had one
     * @param lineEnd      LF, CRLF or CR
     * @param quoted       whether cells were quoted
     * @param columns      role (time, ghi, ...) to the header cell read for it
     * @param units        role to the unit its values were read in (irradiance roles)
     * @param timestamps   how the rows give their time (hourly files), or ""
     * @param notes        clock changes and other facts of the reading that are no repair
     */
    public record Reading(String format, String separator, String decimalMark, String encoding, String lineEnd, boolean quoted,
                          Map<String, String> columns, Map<String, String> units, String timestamps, List<String> notes) {
        public Reading {
            columns = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(columns));
            units = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(units));
            notes = List.copyOf(notes);
        }
    }

    /**
     * @param first       start of the first step, local standard time (ISO), or "" for average days
     * @param last        start of the last step, local standard time, or ""
     * @param steps       number of steps
     * @param stepMinutes length of a step, minutes
     * @param timeBase    hourly-year or average-days
     * @param filledSteps steps missing from the file and filled by interpolation (climate.fill_gaps)
     */
    public record Period(String first, String last, int steps, double stepMinutes, String timeBase, int filledSteps) {}

    /**
     * Irradiation of a period, kWh/m2 (DNI: on a plane normal to the sun).
     *
     * @param month 1..12, or 0 for the whole series
     */
    public record Totals(int month, double ghiKwhM2, double dhiKwhM2, double dniKwhM2) {}

    public boolean isClean() { return repairs.isEmpty() && warnings.isEmpty(); }

    /** This report with the period and irradiation totals of the series' steps. */
    ClimateReport complete(List<Step> steps, TimeBase timeBase, java.time.ZoneOffset standard) {
        return complete(steps, timeBase, standard, 0);
    }

    /** @param filledSteps steps missing from the file and filled by interpolation */
    ClimateReport complete(List<Step> steps, TimeBase timeBase, java.time.ZoneOffset standard, int filledSteps) {
        double[][] m = new double[13][3];
        boolean[] seen = new boolean[13];
        for (Step s : steps) {
            double h = s.weightedHours() / 1000;
            double[] a = m[s.month()];
            a[0] += s.ghiWm2() * h;
            a[1] += s.dhiWm2() * h;
            a[2] += s.dniWm2() * h;
            seen[s.month()] = true;
        }
        List<Totals> months = new ArrayList<>();
        double g = 0, d = 0, n = 0;
        for (int k = 1; k <= 12; k++) {
            if (!seen[k]) continue;
            months.add(new Totals(k, m[k][0], m[k][1], m[k][2]));
            g += m[k][0]; d += m[k][1]; n += m[k][2];
        }
        Period p = null;
        if (!steps.isEmpty()) {
            boolean days = timeBase == TimeBase.AVERAGE_DAYS;
            java.time.ZoneOffset off = standard == null ? java.time.ZoneOffset.UTC : standard;
            p = new Period(days ? "" : java.time.LocalDateTime.ofInstant(steps.get(0).start(), off).toString(),
                    days ? "" : java.time.LocalDateTime.ofInstant(steps.get(steps.size() - 1).start(), off).toString(),
                    steps.size(), steps.get(0).durationH() * 60, days ? "average-days" : "hourly-year", filledSteps);
        }
        return new ClimateReport(repairs, warnings, reading, p, months, new Totals(0, g, d, n));
    }

    /** Collects repairs while a source reads. */
    static final class Builder {
        private final Map<String, int[]> counts = new LinkedHashMap<>();
        private final Map<String, String> first = new LinkedHashMap<>();
        private final List<String> warnings = new ArrayList<>();
        private final List<String> notes = new ArrayList<>();
        private Reading reading;

        void repair(String kind, String where) {
            counts.computeIfAbsent(kind, k -> new int[1])[0]++;
            first.putIfAbsent(kind, where);
        }

        void warn(String message) { warnings.add(message); }

        /** A fact of the reading that is neither a repair nor a warning (a clock change). */
        void note(String message) { notes.add(message); }

        List<String> notes() { return notes; }

        void reading(Reading r) { reading = r; }

        int count(String kind) { int[] c = counts.get(kind); return c == null ? 0 : c[0]; }

        ClimateReport build() {
            List<String> r = new ArrayList<>();
            counts.forEach((k, c) -> r.add(k + ": " + c[0] + (c[0] == 1 ? " step" : " steps") + " (first at " + first.get(k) + ")"));
            return new ClimateReport(r, warnings, reading, null, List.of(), null);
        }
    }
}
