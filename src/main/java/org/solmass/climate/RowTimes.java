package org.solmass.climate;

import org.solmass.InputException;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.time.zone.ZoneOffsetTransition;
import java.time.zone.ZoneRules;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The instant each row of an hourly file stands for, from one timestamp column (ISO-8601, or a date
 * with '.', '/' or '-' between day, month and year followed by HH:mm) or from separate year, month,
 * day, hour (and minute) columns. Timestamps without an offset are local standard time of the site,
 * or clock time with daylight saving when the user says so ({@link ClimateSpec.Clock#DST}): then the
 * repeated autumn hour is told apart by the order of the rows and the skipped spring hour is reported.
 */
final class RowTimes {
    private RowTimes() {}

    /** Years the solar position supports: the Delta-T estimate of Espenak &amp; Meeus (2006) ends in 2999. */
    static final int FIRST_YEAR = 1, LAST_YEAR = 2999;

    private static final Pattern ISO = Pattern.compile("^\\d{4}-\\d{2}-\\d{2}([T ].*)?$");
    private static final Pattern TIME_OF_DAY = Pattern.compile("^\\d{1,2}:\\d{2}(:\\d{2})?$");
    private static final Pattern DATE = Pattern.compile(
            "^(\\d{1,4})([./-])(\\d{1,2})\\2(\\d{1,4})[ T]+(\\d{1,2}):(\\d{2})(?::(\\d{2}))?$");

    /**
     * @param instants  interval labels (start or end, as the file has them), in row order
     * @param layout    how the rows give their time, for the climate report
     * @param standard  the site's standard UTC offset in the first row's year
     * @param dateJoined whether the date came from a date column beside a time-of-day column
     * @param hour24    whether some row gives the hour as 24 (hour-ending files count 1 to 24)
     */
    record Result(Instant[] instants, String layout, ZoneOffset standard, boolean dateJoined, boolean hour24) {}

    /**
     * @param timeCol the timestamp column, or -1 for split columns
     * @param split   year, month, day, hour, minute columns (minute may be -1) when timeCol is -1
     * @param dateCol a date column that goes with a time column holding only the time of day, or -1
     */
    static Result read(ClimateTable csv, int timeCol, int[] split, int dateCol, ClimateSpec.Reading reading, ZoneId zone, ClimateReport.Builder rep) {
        int n = csv.rows.size();
        String[] stamp = new String[n];
        boolean[] saw24 = new boolean[1];
        boolean joined = timeCol >= 0 && dateCol >= 0 && TIME_OF_DAY.matcher(csv.rows.get(0).cells()[timeCol]).matches();
        for (int i = 0; timeCol >= 0 && i < n; i++) {
            String[] c = csv.rows.get(i).cells();
            stamp[i] = joined ? c[dateCol] + " " + c[timeCol] : c[timeCol];
        }
        String column = timeCol < 0 ? "" : joined ? "columns '" + csv.header.cells()[dateCol] + "' and '" + csv.header.cells()[timeCol] + "'"
                : "column '" + csv.header.cells()[timeCol] + "'";
        LocalDateTime[] local = new LocalDateTime[n];
        ZoneOffset[] given = new ZoneOffset[n];
        String layout;
        if (timeCol < 0) {
            for (int i = 0; i < n; i++) local[i] = fromColumns(csv, csv.rows.get(i), split, saw24);
            layout = "date and time in columns " + String.join(", ", splitNames(csv, split));
        } else if (ISO.matcher(stamp[0]).matches()) {
            for (int i = 0; i < n; i++) {
                ClimateTable.Line l = csv.rows.get(i);
                String s = stamp[i];
                String iso = s.length() > 10 && s.charAt(10) == ' ' ? s.substring(0, 10) + "T" + s.substring(11) : s;
                try {
                    OffsetDateTime o = OffsetDateTime.parse(iso);
                    local[i] = o.toLocalDateTime();
                    given[i] = o.getOffset();
                } catch (DateTimeParseException e) {
                    try {
                        local[i] = LocalDateTime.parse(iso);
                    } catch (DateTimeParseException e2) {
                        throw new InputException(csv.at(l), "expected an ISO timestamp like 2025-01-01T13:00 (local standard time) or 2025-01-01T13:00+01:00, got '" + s + "'");
                    }
                }
            }
            layout = "ISO-8601 timestamps in " + column;
        } else {
            ClimateSpec.DateOrder order = dateOrder(csv, stamp, reading.dateOrder());
            for (int i = 0; i < n; i++) local[i] = fromDate(csv, csv.rows.get(i), stamp[i], order, saw24);
            layout = "timestamps in " + column + ", dates " + order.label();
        }
        ZoneOffset standard = zone.getRules().getStandardOffset(LocalDateTime.of(local[0].getYear(), 1, 1, 0, 0).toInstant(ZoneOffset.UTC));
        Instant[] t = new Instant[n];
        if (reading.clock() == ClimateSpec.Clock.DST) {
            ZoneRules rules = zone.getRules();
            if (rules.isFixedOffset()) {
                throw new InputException("--clock", "clock time with daylight saving needs a zone that observes it (an IANA id such as Europe/Berlin), got " + zone);
            }
            clockTime(csv, local, given, rules, t, rep);
            layout += ", local clock time with daylight saving of " + zone + " converted to standard time UTC" + standard;
        } else {
            for (int i = 0; i < n; i++) t[i] = local[i].toInstant(given[i] != null ? given[i] : standard);
            boolean anyGiven = false;
            for (ZoneOffset o : given) anyGiven |= o != null;
            layout += anyGiven ? ", with UTC offsets" : ", local standard time UTC" + standard;
        }
        return new Result(t, layout, standard, joined, saw24[0]);
    }

    /**
     * Refuses a year the solar position cannot compute, naming the row; called once the rows are known
     * to be a grid without long gaps, so that a far jump is reported as the gap it is.
     */
    static void checkYears(ClimateTable csv, Instant[] t, ZoneOffset standard) {
        for (int i = 0; i < t.length; i++) {
            int y = LocalDateTime.ofInstant(t[i], standard).getYear();
            if (y < FIRST_YEAR || y > LAST_YEAR) {
                throw new InputException(csv.at(csv.rows.get(i)), "year " + y + " is outside the years " + FIRST_YEAR + " to " + LAST_YEAR
                        + " that the solar position supports");
            }
        }
    }

    /**
     * Clock time to instants. In the autumn overlap a local time is read with the summer offset unless
     * that would not come after the previous row (the second pass through the repeated hour). A local
     * time in the spring gap does not exist: error.
     */
    private static void clockTime(ClimateTable csv, LocalDateTime[] local, ZoneOffset[] given, ZoneRules rules, Instant[] t, ClimateReport.Builder rep) {
        for (int i = 0; i < local.length; i++) {
            String where = csv.at(csv.rows.get(i));
            if (given[i] != null) { t[i] = local[i].toInstant(given[i]); continue; }
            List<ZoneOffset> valid = rules.getValidOffsets(local[i]);
            if (valid.isEmpty()) {
                ZoneOffsetTransition tr = rules.getTransition(local[i]);
                throw new InputException(where, "clock time " + local[i] + " does not exist: clocks went forward from "
                        + tr.getDateTimeBefore().toLocalTime() + " to " + tr.getDateTimeAfter().toLocalTime() + " that day (is the file in standard time? --clock standard)");
            }
            t[i] = local[i].toInstant(valid.get(0));
            if (valid.size() == 2) {
                if (i > 0 && !t[i].isAfter(t[i - 1])) {
                    t[i] = local[i].toInstant(valid.get(1));
                    rep.repair("repeated autumn clock hour read as its second pass (standard time)", where);
                }
            }
            if (i > 0) {
                ZoneOffsetTransition tr = rules.nextTransition(t[i - 1]);
                if (tr != null && tr.isGap() && !tr.getInstant().isAfter(t[i])) {
                    clock(rep, "clock skipped " + tr.getDateTimeBefore() + " to " + tr.getDateTimeAfter().toLocalTime()
                            + " (spring forward; no data missing) before " + where);
                }
                if (tr != null && tr.isOverlap() && !tr.getInstant().isAfter(t[i])) {
                    clock(rep, "clock repeated " + tr.getDateTimeAfter() + " to " + tr.getDateTimeBefore().toLocalTime()
                            + " (autumn back) at " + where);
                }
            }
        }
    }

    private static void clock(ClimateReport.Builder rep, String message) {
        rep.note(message);
        rep.warn(message);
    }

    /** Day-month order: the option, else the only one the data allow; all first two parts up to 12: error. */
    private static ClimateSpec.DateOrder dateOrder(ClimateTable csv, String[] stamp, ClimateSpec.DateOrder option) {
        int maxA = 0, maxB = 0;
        boolean yearFirst = false;
        for (String st : stamp) {
            Matcher m = DATE.matcher(st);
            if (!m.matches()) continue;
            yearFirst = m.group(1).length() == 4;
            maxA = Math.max(maxA, Integer.parseInt(m.group(1)));
            maxB = Math.max(maxB, Integer.parseInt(m.group(3)));
        }
        Matcher first = DATE.matcher(stamp[0]);
        if (!first.matches()) {
            throw new InputException(csv.at(csv.rows.get(0)), "expected a timestamp like 2025-01-31T13:00, 31.01.2025 13:00 or 2025/01/31 13:00, got '"
                    + stamp[0] + "'");
        }
        if (first.group(1).length() == 4) {
            if (option != null && option != ClimateSpec.DateOrder.YMD) {
                throw new InputException("--date-order", option.label() + " given, but the dates start with the year (" + stamp[0] + "); use ymd");
            }
            return ClimateSpec.DateOrder.YMD;
        }
        if (option != null) {
            if (option == ClimateSpec.DateOrder.YMD) throw new InputException("--date-order", "ymd given, but the dates end with the year (" + stamp[0] + ")");
            return option;
        }
        if (maxA > 12 && maxB <= 12) return ClimateSpec.DateOrder.DMY;
        if (maxB > 12 && maxA <= 12) return ClimateSpec.DateOrder.MDY;
        if (maxA <= 12 && maxB <= 12) {
            throw new InputException(csv.headerAt(), "dates like '" + stamp[0] + "' can be day-month or month-day and no day above 12"
                    + " tells which; give --date-order dmy or mdy (study key climate.date_order)");
        }
        return ClimateSpec.DateOrder.DMY;   // both above 12 somewhere: the row that is no date says so
    }

    private static LocalDateTime fromDate(ClimateTable csv, ClimateTable.Line l, String s, ClimateSpec.DateOrder order, boolean[] saw24) {
        Matcher m = DATE.matcher(s);
        String like = order == ClimateSpec.DateOrder.YMD ? "2025/01/31 13:00" : order == ClimateSpec.DateOrder.DMY ? "31.01.2025 13:00" : "01/31/2025 13:00";
        if (!m.matches() || (m.group(1).length() == 4) != (order == ClimateSpec.DateOrder.YMD)) {
            throw new InputException(csv.at(l), "expected a timestamp like " + like + " (as the first row), got '" + s + "'");
        }
        int a = Integer.parseInt(m.group(1)), b = Integer.parseInt(m.group(3)), c = Integer.parseInt(m.group(4));
        int y = order == ClimateSpec.DateOrder.YMD ? a : c;
        int mo = order == ClimateSpec.DateOrder.MDY ? a : b;
        int d = order == ClimateSpec.DateOrder.YMD ? c : order == ClimateSpec.DateOrder.DMY ? a : b;
        int sec = m.group(7) == null ? 0 : Integer.parseInt(m.group(7));
        return at(csv, l, s, y, mo, d, Integer.parseInt(m.group(5)), Integer.parseInt(m.group(6)), sec, saw24);
    }

    private static LocalDateTime fromColumns(ClimateTable csv, ClimateTable.Line l, int[] c, boolean[] saw24) {
        int y = ClimateSource.integer(csv, l, c[0], "year", 1, 9999);
        int mo = ClimateSource.integer(csv, l, c[1], "month", 1, 12);
        int d = ClimateSource.integer(csv, l, c[2], "day", 1, 31);
        int h = ClimateSource.integer(csv, l, c[3], "hour", 0, 24);
        int mi = c[4] < 0 ? 0 : ClimateSource.integer(csv, l, c[4], "minute", 0, 59);
        return at(csv, l, y + "-" + mo + "-" + d + " " + h + ":" + mi, y, mo, d, h, mi, 0, saw24);
    }

    /** A local date-time; hour 24 (minute 0) is 00:00 of the next day. */
    private static LocalDateTime at(ClimateTable csv, ClimateTable.Line l, String text, int y, int mo, int d, int h, int mi, int sec, boolean[] saw24) {
        try {
            if (h == 24 && mi == 0 && sec == 0) {
                saw24[0] = true;
                return LocalDateTime.of(y, mo, d, 0, 0).plusDays(1);
            }
            return LocalDateTime.of(y, mo, d, h, mi, sec);
        } catch (DateTimeException e) {
            throw new InputException(csv.at(l), "no such date and time '" + text + "': " + e.getMessage());
        }
    }

    private static List<String> splitNames(ClimateTable csv, int[] split) {
        java.util.List<String> out = new java.util.ArrayList<>();
        for (int c : split) if (c >= 0) out.add("'" + csv.header.cells()[c] + "'");
        return out;
    }
}
