package org.solmass.climate;

import org.solmass.sun.SunPosition;

import java.time.Instant;

/**
 * One time step of an analysis: an interval of weather, its sun and its irradiance.
 *
 * <p>Irradiances are <em>averages over the whole interval</em> (night part included), so
 * irradiance x {@link #durationH()} is the interval's irradiation in Wh/m2, and
 * irradiance x durationH x {@link #weightDays()} summed over steps gives the irradiation of the
 * period the series stands for. Beam on a plane is DNI x cos(incidence) with the incidence taken
 * from {@link #sun()}, the position at the middle of the sun-up part of the interval.
 *
 * @param start             interval start (an instant)
 * @param durationH         interval length, hours (1 for hourly data, 0.25 for 15 min)
 * @param month             month 1..12 of the interval start in local standard time
 * @param dayOfYear         day of year 1..366 of the interval start in local standard time
 * @param localStandardHour hour of day of the interval start in local standard time, [0, 24)
 * @param sun               apparent sun position at the middle of the sun-up part of the interval
 *                          (at the interval middle, below the horizon, when the sun is down throughout)
 * @param sunUpFraction     share of the interval with the sun's apparent centre above the horizon, [0, 1]
 * @param ghiWm2            global horizontal irradiance, W/m2, interval average
 * @param dniWm2            direct normal irradiance, W/m2, interval average (0 below the low-sun cut-off)
 * @param dhiWm2            diffuse horizontal irradiance, W/m2, interval average
 * @param extraNormalWm2    extraterrestrial normal irradiance of the day, W/m2 (no sun-up weighting)
 * @param dryBulbC          dry-bulb air temperature, degrees C, or NaN when the source has none
 * @param windMs            wind speed, m/s, interval mean, or NaN when the source has none
 * @param weightDays        real days the step stands for: 1 for a year of steps, the days of the
 *                          month for a monthly average day
 */
public record Step(Instant start, double durationH, int month, int dayOfYear, double localStandardHour,
                   SunPosition sun, double sunUpFraction, double ghiWm2, double dniWm2, double dhiWm2,
                   double extraNormalWm2, double dryBulbC, double windMs, double weightDays) {

    /** A step without wind data (wind speed NaN). */
    public Step(Instant start, double durationH, int month, int dayOfYear, double localStandardHour,
                SunPosition sun, double sunUpFraction, double ghiWm2, double dniWm2, double dhiWm2,
                double extraNormalWm2, double dryBulbC, double weightDays) {
        this(start, durationH, month, dayOfYear, localStandardHour, sun, sunUpFraction, ghiWm2, dniWm2, dhiWm2,
                extraNormalWm2, dryBulbC, Double.NaN, weightDays);
    }

    /** Hours this step contributes to the sums: duration x weight (h). */
    public double weightedHours() { return durationH * weightDays; }

    /** Whether the sun is up during some part of the interval. */
    public boolean sunUp() { return sunUpFraction > 0; }

    /** Mean extraterrestrial irradiance on a horizontal plane over the interval, W/m2 (approximation:
     * G0n x cos(zenith at the sun-up middle) x sun-up fraction). */
    public double extraHorizontalWm2() {
        return sunUpFraction > 0 ? extraNormalWm2 * Math.max(0, sun.cosZenith()) * sunUpFraction : 0;
    }
}
