package org.solmass.output;

import org.solmass.study.Study;

/**
 * What a run's annual values cover, in words for page titles: the time base and the climate source,
 * e.g. "Year of monthly-average days, climate veldhaven-month-hour.csv" or "Hourly year 2025,
 * climate site.csv".
 */
public final class RunPeriod {
    private RunPeriod() {}

    /**
     * @param timeBase the time base the run used ({@link RunRecord#timeBase()}: "average-days" or
     *                 "hourly-year")
     */
    public static String text(Study study, String timeBase) {
        String climate = study.climate().isClearSky() ? "clear-sky model"
                : "climate " + study.climate().file().getFileName();
        String base = !"hourly-year".equals(timeBase) ? "Year of monthly-average days"
                : study.climate().isClearSky() ? "Hourly year " + study.climate().year() : "Hourly year";
        return base + ", " + climate;
    }

    /** The period of a recorded run. */
    public static String of(RunRecord run) {
        return text(run.study(), run.timeBase());
    }
}
