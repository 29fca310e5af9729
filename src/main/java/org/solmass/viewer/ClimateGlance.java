package org.solmass.viewer;

import org.solmass.climate.MonthHour;

/**
 * The study's climate input summarised for a glance: mean global and diffuse horizontal irradiance
 * per month and local standard hour, and the monthly totals.
 *
 * @param source where the climate came from (file name or "clear sky ..."), for the caption
 * @param ghiWm2 mean global horizontal irradiance, W/m2, {@code [MonthHour.index(month, hour)]} (288 values)
 * @param dhiWm2 mean diffuse horizontal irradiance, W/m2, same layout
 * @param ghiMonthKwhM2 monthly total global horizontal irradiation, kWh/m2 (12 values)
 * @param dhiMonthKwhM2 monthly total diffuse horizontal irradiation, kWh/m2 (12 values)
 */
public record ClimateGlance(String source, double[] ghiWm2, double[] dhiWm2,
                            double[] ghiMonthKwhM2, double[] dhiMonthKwhM2) {
    public ClimateGlance {
        if (ghiWm2.length != MonthHour.SLOTS || dhiWm2.length != MonthHour.SLOTS) throw new IllegalArgumentException("month-hour arrays need 12 x 24 values");
        if (ghiMonthKwhM2.length != 12 || dhiMonthKwhM2.length != 12) throw new IllegalArgumentException("monthly totals need 12 values");
    }
}
