package org.solmass.irradiation;

/**
 * Per-patch results of the shading-aware pipeline, arrays indexed by patch index. Irradiation in
 * kWh/m2 over the period of the weather series (a year), irradiance in W/m2.
 *
 * @param skyViewFactor obstructed sky view factor
 * @param groundViewFactor ground view factor
 * @param obstructionViewFactor view factor of the blocks
 * @param skyViewStdError standard error of the sky view factor estimate
 * @param horizonVisibility visible share of the horizon band (Perez), [0, 1]
 * @param annual total irradiation (beam + diffuse + reflected)
 * @param beam beam part
 * @param diffuse sky diffuse part
 * @param reflected ground- and block-reflected part
 * @param unshaded total irradiation of the same plane with no obstruction
 * @param monthly total irradiation per month: [month 0..11][patch]
 * @param monthHourWm2 mean total irradiance per patch, month and hour of the day
 *                     {@code patch * MonthHour.SLOTS + MonthHour.index(month, hour)}; null unless asked for
 * @param sunshineHours hours per year with DNI at or above 120 W/m2 (WMO) while the patch sees the sun
 * @param siteSunshineHours the site's sunshine hours over the same period (unobstructed)
 * @param sunDirections number of sun directions rays were cast to per patch
 * @param annualStdError standard error of {@code annual} from the hemisphere ray sampling, kWh/m2
 *                       ({@link Reflection#stdErrorWh})
 * @param bounces how the reflection series ended
 * @param overcastSkyPct the sky component under the traditional CIE overcast sky in percent
 *                       ({@link org.solmass.sky.CieSky#skyComponentPct}), from the same hemisphere rays
 *                       as the sky view factor (for a facade patch its vertical sky component)
 */
public record IrradiationResult(double[] skyViewFactor, double[] groundViewFactor, double[] obstructionViewFactor,
                                double[] skyViewStdError, double[] horizonVisibility,
                                double[] annual, double[] beam, double[] diffuse, double[] reflected,
                                double[] unshaded, double[][] monthly, float[] monthHourWm2, double[] sunshineHours,
                                double siteSunshineHours, int sunDirections, double[] annualStdError,
                                Bounces bounces, double[] overcastSkyPct) {

    /**
     * The reflection bounces used ({@link Reflection}).
     *
     * @param addedKwhM2 irradiation each bounce added, summed over the analysed patches, kWh/m2
     * @param converged whether the last bounce added at most {@code tolerance} of the reflected total
     * @param tolerance the stopping fraction
     * @param maxBounces the largest number of bounces allowed
     */
    public record Bounces(double[] addedKwhM2, boolean converged, double tolerance, int maxBounces) {
        public int used() { return addedKwhM2.length; }
    }

    public int size() { return annual.length; }

    /** Shading loss in percent: 100 (1 - annual / unshaded); 0 where the unshaded value is 0. */
    public double shadingLossPct(int p) {
        return unshaded[p] > 0 ? 100 * (1 - annual[p] / unshaded[p]) : 0;
    }
}
