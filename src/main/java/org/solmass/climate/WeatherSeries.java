package org.solmass.climate;

import java.util.List;

/**
 * The weather of a study as time steps.
 *
 * @param steps    the steps in time order (for {@link TimeBase#AVERAGE_DAYS}: month by month)
 * @param timeBase what the steps stand for
 * @param source   human-readable description of where the data came from
 * @param report   repairs and warnings made while reading
 */
public record WeatherSeries(List<Step> steps, TimeBase timeBase, String source, ClimateReport report) {
    public WeatherSeries {
        steps = List.copyOf(steps);
    }

    public int size() { return steps.size(); }

    public Step step(int i) { return steps.get(i); }
}
