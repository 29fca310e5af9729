package org.solmass.viewer;

import org.solmass.climate.ClimateReport;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.study.Study;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * What a climate file gives before a run, read as the analysis will read it ({@link ClimateSource}
 * with the study's climate settings and site): how it was read (layout, separator, decimal mark,
 * columns and their units), the first daylight steps as parsed, and the year's totals from
 * {@link ClimateReport}. Also the clear-sky note.
 */
final class ClimatePreview {
    /** Shown wherever the clear sky is chosen; the same words as summary.json and the terminal ({@code Cautions.CLEAR_SKY}). */
    static final String CLEAR_SKY_NOTE = org.solmass.Cautions.CLEAR_SKY;

    private ClimatePreview() {}

    /** The preview lines of the study's climate file (the study must name a file). */
    static List<String> lines(Study study) {
        WeatherSeries w = ClimateSource.load(study.site(), study.climateSpec());
        return lines(w, study.site().standardOffset(study.climate().year()));
    }

    /** The preview lines of a series whose local standard time is UTC + {@code offset}. */
    static List<String> lines(WeatherSeries w, java.time.ZoneOffset offset) {
        List<String> out = new ArrayList<>();
        ClimateReport r = w.report();
        ClimateReport.Reading rd = r.reading();
        if (rd != null) {
            out.add("Layout: " + rd.format() + (rd.timestamps().isEmpty() ? "" : ", " + rd.timestamps()));
            out.add("Separator: " + rd.separator() + " \u00b7 decimal mark: " + rd.decimalMark() + " \u00b7 " + rd.encoding()
                    + (rd.quoted() ? " \u00b7 quoted cells" : ""));
            StringBuilder cols = new StringBuilder("Columns: ");
            boolean first = true;
            for (var e : rd.columns().entrySet()) {
                cols.append(first ? "" : "; ").append(e.getKey()).append(" \u2190 \u201c").append(e.getValue()).append('\u201d');
                if (rd.units().containsKey(e.getKey())) cols.append(" in ").append(rd.units().get(e.getKey()));
                first = false;
            }
            out.add(cols.toString());
            for (String n : rd.notes()) out.add("Note: " + GuiWords.of(n));
        }
        ClimateReport.Period p = r.period();
        if (p != null) {
            out.add(String.format(Locale.ROOT, "Period: %s%,d steps of %.0f min (%s)", p.first().isEmpty() ? "" : p.first() + " to " + p.last() + ", ",
                    p.steps(), p.stepMinutes(), p.timeBase()));
        }
        out.add("First daylight steps as read (local standard time), W/m\u00b2:");
        out.add(String.format(Locale.ROOT, "   %-9s %-5s %5s %5s %5s", "day", "time", "GHI", "DHI", "DNI"));
        int shown = 0;
        for (Step s : w.steps()) {
            if (s.ghiWm2() <= 0) continue;
            int h = (int) Math.floor(s.localStandardHour()), min = (int) Math.round((s.localStandardHour() - h) * 60);
            String day = java.time.Month.of(s.month()).getDisplayName(java.time.format.TextStyle.SHORT, Locale.ENGLISH)
                    + (w.timeBase() == org.solmass.climate.TimeBase.HOURLY_YEAR
                    ? " " + s.start().atOffset(offset).getDayOfMonth() : " (mean)");
            out.add(String.format(Locale.ROOT, "   %-9s %02d:%02d %5.0f %5.0f %5.0f", day, h, min, s.ghiWm2(), s.dhiWm2(), s.dniWm2()));
            if (++shown == 5) break;
        }
        if (r.total() != null) {
            out.add(String.format(Locale.ROOT, "Year: GHI %,.0f kWh/m\u00b2 \u00b7 DHI %,.0f kWh/m\u00b2 \u00b7 DNI %,.0f kWh/m\u00b2",
                    r.total().ghiKwhM2(), r.total().dhiKwhM2(), r.total().dniKwhM2()));
        }
        for (String x : r.repairs()) out.add("Repaired: " + GuiWords.of(x));
        for (String x : r.warnings()) out.add("Check: " + GuiWords.of(x));
        return out;
    }
}
