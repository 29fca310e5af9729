package org.solmass.climate;

import org.solmass.InputException;

import java.util.Locale;

/**
 * The time base a study asks for: {@link #AUTO} takes it from the climate source (an hourly file gives
 * an hourly year, anything else monthly-average days); the other two ask for one
 * {@link TimeBase} (for the clear-sky model, which can give either).
 */
public enum TimeBaseChoice {
    AUTO, AVERAGE_DAYS, HOURLY_YEAR;

    /** The name as written in a study file or a flag: lower case, '-' between words. */
    public String label() { return name().toLowerCase(Locale.ROOT).replace('_', '-'); }

    /** @param where the flag or key named in the error message */
    public static TimeBaseChoice parse(String s, String where) {
        String t = s == null ? "" : s.trim();
        for (TimeBaseChoice c : values()) if (c.label().equalsIgnoreCase(t)) return c;
        throw new InputException(where, "expected one of auto, average-days, hourly-year, got \"" + s + "\"");
    }

    /** The time base of the clear-sky model under this choice (AUTO: average days). */
    public TimeBase forClearSky() { return this == HOURLY_YEAR ? TimeBase.HOURLY_YEAR : TimeBase.AVERAGE_DAYS; }

    /**
     * The clear-sky model under this choice.
     *
     * @param year calendar year of an hourly year
     */
    public ClimateSpec clearSky(int year) {
        return forClearSky() == TimeBase.HOURLY_YEAR ? ClimateSpec.clearSkyYear(year) : ClimateSpec.clearSky();
    }
}
