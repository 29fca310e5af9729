package org.solmass.climate;

/** What the steps of a weather series stand for. */
public enum TimeBase {
    /** One average day per month (Klein's recommended day), each step weighted by the days of its month. */
    AVERAGE_DAYS,
    /** A sequence of real intervals (hourly or finer) of one year, each step weighted 1. */
    HOURLY_YEAR;

    public String label() { return this == AVERAGE_DAYS ? "average-days" : "hourly-year"; }
}
