package org.solmass.pv;

/**
 * One PV zone's modules and what they deliver over the weather series (docs/metrics.md "PV yield").
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
 * @param yieldKwh annual energy, kWh
 * @param monthlyYieldKwh per month, kWh
 * @param seriesPoaWm2 per step of the series: module-area mean plane-of-array irradiance, W/m2
 * @param seriesPoaUnobstructedWm2 per step: the same with no obstruction, W/m2
 * @param seriesYieldWh per step: energy of the step (not times the days an average-day step stands for), Wh
 */
public record ZoneYield(int zone, int modules, boolean racked, double tiltDeg, double azimuthDeg, double kwp,
                        double moduleAreaM2, double poaKwhM2, double poaUnobstructedKwhM2, double[] monthlyPoaKwhM2,
                        double yieldKwh, double[] monthlyYieldKwh, float[] seriesPoaWm2,
                        float[] seriesPoaUnobstructedWm2, float[] seriesYieldWh) {

    /** Shading loss of the modules, %: 100 (1 - obstructed / unobstructed plane-of-array irradiation). */
    public double shadingLossPct() {
        return poaUnobstructedKwhM2 > 0 ? 100 * (1 - poaKwhM2 / poaUnobstructedKwhM2) : 0;
    }

    /** Specific yield, kWh/kWp. */
    public double specificYieldKwhKwp() { return kwp > 0 ? yieldKwh / kwp : 0; }

    /**
     * Performance ratio (IEC 61724-1:2021): final yield over reference yield, the reference taken on
     * the unobstructed module planes (so shading counts as a loss).
     */
    public double performanceRatio() {
        return poaUnobstructedKwhM2 > 0 && kwp > 0 ? specificYieldKwhKwp() / poaUnobstructedKwhM2 : 0;
    }
}
