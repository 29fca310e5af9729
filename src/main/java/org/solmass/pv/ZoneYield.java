package org.solmass.pv;

/**
 * One PV zone's modules and what they deliver over the weather series (docs/pv.md "Yield per zone",
 * docs/pv.md for the loss chain).
 *
 * @param zone zone id
 * @param modules number of modules
 * @param racked racked rows (flat roof) or flush-mounted
 * @param tiltDeg module tilt, degrees
 * @param azimuthDeg azimuth the modules face, degrees from north clockwise
 * @param kwp STC power, kWp
 * @param moduleAreaM2 module area, m2
 * @param poaKwhM2 annual plane-of-array irradiation, module-area mean, with obstruction, kWh/m2
 * @param poaUnobstructedKwhM2 the same planes with no obstruction, kWh/m2
 * @param monthlyPoaKwhM2 per month 1..12 at index 0..11, with obstruction, kWh/m2
 * @param totals the energy balance per month and year ({@link YieldChain}); null when the zone has no module
 * @param series per step: the energy balance and cell temperature; null when the zone has no module
 * @param seriesPoaWm2 per step of the series: module-area mean plane-of-array irradiance, W/m2
 * @param seriesPoaUnobstructedWm2 per step: the same with no obstruction, W/m2
 */
public record ZoneYield(int zone, int modules, boolean racked, double tiltDeg, double azimuthDeg, double kwp,
                        double moduleAreaM2, double poaKwhM2, double poaUnobstructedKwhM2, double[] monthlyPoaKwhM2,
                        YieldTotals totals, ZoneSeries series, float[] seriesPoaWm2, float[] seriesPoaUnobstructedWm2) {

    /** The year's energy balance (zeros without modules), Wh. */
    public EnergyBalance year() { return totals == null ? EnergyBalance.ZERO : totals.year(); }

    /** Annual AC energy, kWh. */
    public double yieldKwh() { return year().acWh() / 1000; }

    /** AC energy of month 1..12, kWh. */
    public double monthYieldKwh(int month) { return totals == null ? 0 : totals.month(month).acWh() / 1000; }

    /** Shading loss of the modules, %: 100 (1 - obstructed / unobstructed plane-of-array irradiation). */
    public double shadingLossPct() {
        return poaUnobstructedKwhM2 > 0 ? 100 * (1 - poaKwhM2 / poaUnobstructedKwhM2) : 0;
    }

    /** Specific (final) yield Yf, kWh/kWp. */
    public double specificYieldKwhKwp() { return totals == null ? 0 : totals.finalYield(year()); }

    /**
     * Performance ratio (IEC 61724-1:2021) Yf / Yr, the reference on the unobstructed module planes
     * (so shading counts as a loss); 0 without modules.
     */
    public double performanceRatio() {
        double pr = year().performanceRatio();
        return Double.isNaN(pr) ? 0 : pr;
    }
}
