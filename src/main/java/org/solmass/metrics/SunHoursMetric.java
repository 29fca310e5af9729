package org.solmass.metrics;

import org.solmass.sun.SolarCalculator;
import org.solmass.surface.Patch;
import org.solmass.table.AreaStats;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;
import org.solmass.table.ColumnKind;
import org.solmass.table.ResultTable;
import org.solmass.table.Unit;

import java.time.MonthDay;
import java.time.format.TextStyle;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Hours of direct sun on each of the study's dates ({@link SunHoursOnDate}), and for dates from
 * 1 February to 21 March the EN 17037:2018 sunlight-exposure level of those hours. Columns
 * {@code sun_hours_MMDD} and {@code sun_level_MMDD}; method in docs/metrics.md.
 */
public final class SunHoursMetric implements Metric {
    /** summary.json note on how the levels are to be read. */
    static final String EN17037_NOTE = "Sun hours on a date and sun_level (EN 17037:2018 sunlight exposure: "
            + "1 minimum >= 1.5 h, 2 medium >= 3 h, 3 high >= 4 h, 0 below): EN 17037 is written for reference points "
            + "on the inside of windows; values of facade and ground patches are an indicator only.";

    private static final Pattern DATE = Pattern.compile("(0[1-9]|1[0-2])([0-3][0-9])");

    /** {@code sun_hours_MMDD}. */
    public static final ColumnFamily SUN_HOURS = new ColumnFamily("sun_hours_MMDD",
            Pattern.compile("sun_hours_" + DATE.pattern()), m -> hoursColumn(date(m)), hoursColumn(MonthDay.of(3, 21)));
    /** {@code sun_level_MMDD}. */
    public static final ColumnFamily SUN_LEVEL = new ColumnFamily("sun_level_MMDD",
            Pattern.compile("sun_level_" + DATE.pattern()), m -> levelColumn(date(m)), levelColumn(MonthDay.of(3, 21)));
    /** The columns of this metric. */
    public static final List<ColumnFamily> COLUMNS = List.of(SUN_HOURS, SUN_LEVEL);

    @Override public String name() { return "sun hours"; }

    @Override public List<ColumnFamily> columns() { return COLUMNS; }

    /** Hours of direct sun on a date. */
    public static Column hoursColumn(MonthDay d) {
        return Column.of("sun_hours_" + SunHoursOnDate.suffix(d), Unit.HOURS, "Sun hours on " + dayText(d),
                "One per date of `sun_hours.dates`: hours of direct sun on that date (docs/metrics.md).");
    }

    /** EN 17037 level of the hours on a date (0..3). */
    public static Column levelColumn(MonthDay d) {
        return new Column("sun_level_" + SunHoursOnDate.suffix(d), Unit.LEVEL, "EN 17037 sunlight level on " + dayText(d),
                0, ColumnKind.INTEGER, "Dates from 1 February to 21 March only: EN 17037:2018 sunlight-exposure level of "
                + "`sun_hours_MMDD`: 0 below 1.5 h, 1 minimum (>= 1.5 h), 2 medium (>= 3 h), 3 high (>= 4 h). EN 17037 is "
                + "written for reference points on the inside of windows: for facade and ground patches it is an indicator only.",
                false);
    }

    /** "21 March". */
    public static String dayText(MonthDay d) {
        return d.getDayOfMonth() + " " + d.getMonth().getDisplayName(TextStyle.FULL, Locale.ENGLISH);
    }

    /** The date of a matched name; throws DateTimeException for "0231" (then the name is no column of the family). */
    private static MonthDay date(Matcher m) {
        return MonthDay.of(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)));
    }

    @Override
    public Findings compute(MetricContext ctx, ResultTable table) {
        MetricContext.Settings s = ctx.settings();
        SolarCalculator calc = new SolarCalculator(ctx.site());
        List<Patch> patches = ctx.patches().patches();
        List<String> lines = new ArrayList<>(), cols = new ArrayList<>();
        for (MonthDay day : s.sunHourDates()) {
            double[] dirs = SunHoursOnDate.sunDirections(calc, ctx.year(), day, s.sunHourStepMinutes(), s.sunHourMinElevationDeg());
            double[] h = SunHoursOnDate.hours(ctx.scene(), patches, dirs, s.sunHourStepMinutes() / 60.0);
            Column hc = hoursColumn(day);
            table.put(hc, h);
            cols.add(hc.name());
            if (SunHoursOnDate.inEn17037Window(day)) {
                double[] lvl = new double[h.length];
                for (int p = 0; p < h.length; p++) lvl[p] = SunHoursOnDate.en17037Level(h[p]);
                table.put(levelColumn(day), lvl);
            }
            AreaStats st = AreaStats.of(patches, h);
            double atLeast = AreaStats.areaAtLeast(patches, h, SunHoursOnDate.EN17037_MIN_H);
            lines.add(String.format(Locale.ROOT, "sun hours on %02d-%02d: area-weighted mean %.1f h; %.0f %% of the area has at least 1.5 h",
                    day.getMonthValue(), day.getDayOfMonth(), st.areaM2() > 0 ? st.mean() : 0,
                    st.areaM2() > 0 ? 100 * atLeast / st.areaM2() : 0));
        }
        return new Found(List.copyOf(lines), List.copyOf(cols));
    }

    /** The terminal lines and summarised columns of a run. */
    record Found(List<String> summaryLines, List<String> summaryColumns) implements Findings {
        @Override public List<String> notes() { return List.of(EN17037_NOTE); }
    }
}
