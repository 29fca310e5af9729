package org.solmass.climate;

import org.solmass.InputException;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * What weather a study uses and how to read it.
 *
 * @param kind             clear sky or a file
 * @param file             the file (FILE only)
 * @param format           file format, AUTO to recognise it from the header (docs/climate-formats.md)
 * @param timeBase         for clear sky: AVERAGE_DAYS (default) or HOURLY_YEAR; for files it follows the format
 * @param year             calendar year of a clear-sky HOURLY_YEAR
 * @param stepMinutes      step of generated days/years (clear sky, monthly means), divides 60
 * @param intervalLabel    whether a timestamp of an hourly file labels its interval's start or end
 * @param columns          role (time, ghi, dhi, dni, temp, wind; date, year, month, day, hour, minute) to header name or 1-based column number
 * @param fillGapsMaxSteps longest run of missing steps/values filled by linear interpolation (0 = never)
 * @param reading          how to read dates, clock time and irradiance units of a file (docs/climate-formats.md)
 */
public record ClimateSpec(Kind kind, Path file, Format format, TimeBase timeBase, int year, int stepMinutes,
                          IntervalLabel intervalLabel, Map<String, String> columns, int fillGapsMaxSteps, Reading reading) {

    /**
     * What a file cannot say about itself, given by the user.
     *
     * @param dateOrder       order of day, month and year in dates like 01/02/2025; null: decided from the data
     * @param clock           whether local timestamps are standard time or clock time with daylight saving
     * @param irradianceUnit  unit of irradiance columns whose header names none; null: W/m2
     */
    public record Reading(DateOrder dateOrder, Clock clock, IrradianceUnit irradianceUnit) {
        public static final Reading DEFAULT = new Reading(null, Clock.STANDARD, null);

        public Reading {
            clock = clock == null ? Clock.STANDARD : clock;
        }
    }

    /** Order of the parts of a date written with '.', '/' or '-' between them. */
    public enum DateOrder {
        DMY, MDY, YMD;

        public String label() { return name().toLowerCase(Locale.ROOT); }

        /** @param where the flag or key named in the error message */
        public static DateOrder parse(String s, String where) {
            String t = s == null ? "" : s.trim();
            for (DateOrder o : values()) if (o.label().equalsIgnoreCase(t)) return o;
            throw new InputException(where, "expected one of dmy, mdy, ymd, got \"" + s + "\"");
        }
    }

    /** Local timestamps without an offset: standard time all year, or clock time with daylight saving. */
    public enum Clock {
        STANDARD, DST;

        public String label() { return name().toLowerCase(Locale.ROOT); }

        /** @param where the flag or key named in the error message */
        public static Clock parse(String s, String where) {
            String t = s == null ? "" : s.trim();
            for (Clock c : values()) if (c.label().equalsIgnoreCase(t)) return c;
            throw new InputException(where, "expected one of standard, dst, got \"" + s + "\"");
        }
    }

    public enum Kind { CLEAR_SKY, FILE }

    /** Roles of the columns of an hourly file that {@code columns} can map. */
    public static final java.util.List<String> COLUMN_ROLES = java.util.List.of("time", "ghi", "dhi", "dni", "temp", "wind", "date", "year", "month", "day", "hour", "minute");

    /**
     * Kind of climate file (docs/climate-formats.md). Written in lower case, '-' between words;
     * {@code monthly} is also accepted as {@code monthly-means}, the name of its section there.
     */
    public enum Format {
        AUTO("auto"), MONTH_HOUR("month-hour"), MONTHLY_MEANS("monthly"), HOURLY("hourly");

        private final String label;

        Format(String label) { this.label = label; }

        /** The name as written in a study file or a flag. */
        public String label() { return label; }

        /** The other accepted spelling: the enum name in lower case, '-' between words. */
        public String alias() { return name().toLowerCase(Locale.ROOT).replace('_', '-'); }

        /** @param where the flag or key named in the error message */
        public static Format parse(String s, String where) {
            String t = s == null ? "" : s.trim();
            for (Format f : values()) if (f.label.equalsIgnoreCase(t) || f.alias().equalsIgnoreCase(t)) return f;
            throw new InputException(where, "expected one of auto, month-hour, monthly (or monthly-means), hourly, got \"" + s + "\"");
        }
    }

    /** A timestamp names the start (default) or the end of its interval. */
    public enum IntervalLabel {
        START, END;

        /** The name as written in a study file or a flag. */
        public String label() { return name().toLowerCase(Locale.ROOT); }

        /** @param where the flag or key named in the error message */
        public static IntervalLabel parse(String s, String where) {
            String t = s == null ? "" : s.trim();
            for (IntervalLabel l : values()) if (l.label().equalsIgnoreCase(t)) return l;
            throw new InputException(where, "expected one of start, end, got \"" + s + "\"");
        }
    }

    public ClimateSpec {
        columns = Map.copyOf(columns);
        reading = reading == null ? Reading.DEFAULT : reading;
        if (fillGapsMaxSteps < 0) throw new InputException("fill-gaps", "must be >= 0, got " + fillGapsMaxSteps);
    }

    public static ClimateSpec clearSky() {
        return new ClimateSpec(Kind.CLEAR_SKY, null, Format.AUTO, TimeBase.AVERAGE_DAYS, StepGrid.AVERAGE_DAY_YEAR, 60,
                IntervalLabel.START, Map.of(), 0, Reading.DEFAULT);
    }

    public static ClimateSpec clearSkyYear(int year) {
        return clearSky().withTimeBase(TimeBase.HOURLY_YEAR).withYear(year);
    }

    public static ClimateSpec file(Path file) {
        return new ClimateSpec(Kind.FILE, file, Format.AUTO, TimeBase.HOURLY_YEAR, StepGrid.AVERAGE_DAY_YEAR, 60,
                IntervalLabel.START, Map.of(), 0, Reading.DEFAULT);
    }

    /** "clear-sky" or a file path. */
    public static ClimateSpec parse(String text) {
        if (text == null || text.isBlank() || text.equalsIgnoreCase("clear-sky")) return clearSky();
        return file(Path.of(text));
    }

    public ClimateSpec withFormat(Format f) { return new ClimateSpec(kind, file, f, timeBase, year, stepMinutes, intervalLabel, columns, fillGapsMaxSteps, reading); }
    public ClimateSpec withTimeBase(TimeBase t) { return new ClimateSpec(kind, file, format, t, year, stepMinutes, intervalLabel, columns, fillGapsMaxSteps, reading); }
    public ClimateSpec withYear(int y) { return new ClimateSpec(kind, file, format, timeBase, y, stepMinutes, intervalLabel, columns, fillGapsMaxSteps, reading); }
    public ClimateSpec withStepMinutes(int m) { return new ClimateSpec(kind, file, format, timeBase, year, m, intervalLabel, columns, fillGapsMaxSteps, reading); }
    public ClimateSpec withIntervalLabel(IntervalLabel l) { return new ClimateSpec(kind, file, format, timeBase, year, stepMinutes, l, columns, fillGapsMaxSteps, reading); }
    public ClimateSpec withColumns(Map<String, String> c) { return new ClimateSpec(kind, file, format, timeBase, year, stepMinutes, intervalLabel, c, fillGapsMaxSteps, reading); }
    public ClimateSpec withReading(Reading r) { return new ClimateSpec(kind, file, format, timeBase, year, stepMinutes, intervalLabel, columns, fillGapsMaxSteps, r); }
    public ClimateSpec withFillGaps(int maxSteps) { return new ClimateSpec(kind, file, format, timeBase, year, stepMinutes, intervalLabel, columns, maxSteps, reading); }

    /** Parses "ghi=GlobHor,time=1" (role=name or role=1-based column number). */
    public static Map<String, String> parseColumns(String text, String where) {
        Map<String, String> m = new LinkedHashMap<>();
        if (text == null || text.isBlank()) return m;
        for (String part : text.split(",")) {
            int eq = part.indexOf('=');
            if (eq <= 0) throw new InputException(where, "expected role=column pairs like ghi=3,dhi=4, got '" + part + "'");
            String role = part.substring(0, eq).trim().toLowerCase(Locale.ROOT);
            if (!HourlyYearReader.ROLES.contains(role)) throw new InputException(where, "unknown column role '" + role + "' (expected one of " + HourlyYearReader.ROLES + ")");
            m.put(role, part.substring(eq + 1).trim());
        }
        return m;
    }
}
