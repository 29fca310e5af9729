package org.solmass.climate;

/**
 * A weather series at a glance: mean global and diffuse horizontal irradiance per month-hour slot
 * ({@link MonthHour}) and the monthly totals. Each step counts with its weighted hours
 * ({@link Step#weightedHours()}): a slot's mean is sum(irradiance x hours) / sum(hours), a month's
 * total is sum(irradiance x hours) / 1000 (common practice: Wh to kWh).
 *
 * @param ghiWm2 mean global horizontal irradiance per slot, W/m2 (288 values; 0 in slots without steps)
 * @param dhiWm2 mean diffuse horizontal irradiance per slot, W/m2, same layout
 * @param ghiMonthKwhM2 global horizontal irradiation per month, kWh/m2 (12 values, January first)
 * @param dhiMonthKwhM2 diffuse horizontal irradiation per month, kWh/m2 (12 values)
 */
public record MonthHourMeans(double[] ghiWm2, double[] dhiWm2, double[] ghiMonthKwhM2, double[] dhiMonthKwhM2) {

    /** The means and monthly totals of a series. */
    public static MonthHourMeans of(WeatherSeries w) {
        int slots = MonthHour.SLOTS;
        double[] g = new double[slots], d = new double[slots], h = new double[slots];
        double[] gm = new double[MonthHour.MONTHS], dm = new double[MonthHour.MONTHS];
        for (Step st : w.steps()) {
            int slot = MonthHour.slotOf(st);
            double wh = st.weightedHours();
            g[slot] += st.ghiWm2() * wh;
            d[slot] += st.dhiWm2() * wh;
            h[slot] += wh;
            gm[st.month() - 1] += st.ghiWm2() * wh / 1000;
            dm[st.month() - 1] += st.dhiWm2() * wh / 1000;
        }
        for (int k = 0; k < slots; k++) {
            g[k] = h[k] > 0 ? g[k] / h[k] : 0;
            d[k] = h[k] > 0 ? d[k] / h[k] : 0;
        }
        return new MonthHourMeans(g, d, gm, dm);
    }
}
