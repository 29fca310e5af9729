package org.solmass.pv;

/**
 * Cell (module) temperature from the plane-of-array irradiance, the air temperature and the wind speed.
 *
 * <p>Source: D. Faiman (2008), "Assessing the outdoor operating temperature of photovoltaic modules",
 * Progress in Photovoltaics: Research and Applications 16, 307-315, eq. (1) (from memory):
 * {@code T_module = T_air + G_poa / (U0 + U1 v)}, with U0 the constant heat-loss coefficient
 * (W/(m2 K)) and U1 the wind coefficient (W s/(m3 K)). Steady state (no thermal mass), module
 * temperature taken as cell temperature. Validity: the conditions of the fit, roughly wind speeds
 * 0-10 m/s measured near module height.
 *
 * <p>Defaults: {@link #FREE_STANDING} U0 = 25.0, U1 = 6.84, the coefficients commonly quoted for
 * free-standing (open-rack) glass/back-sheet c-Si modules (common practice, values from memory).
 * {@link #ROOF_FLUSH} for modules close to a roof with little back ventilation: U0 = 19.6,
 * U1 = 1.07, obtained by matching Faiman's form at 1 and 5 m/s to the "close roof mount,
 * glass/cell/glass" coefficients (a = -2.98, b = -0.0471) of D.L. King, W.E. Boyson and J.A. Kratochvil
 * (2004), "Photovoltaic array performance model", Sandia report SAND2004-3535, Table 1 (coefficients
 * from memory), whose module temperature is {@code T_air + G exp(a + b v)}; the preset runs about
 * 14 K warmer than free-standing at 800 W/m2 and 1 m/s (common practice: flush roof mounting runs markedly warmer).
 *
 * @param u0WPerM2K constant heat-loss coefficient U0, W/(m2 K), positive
 * @param u1WsPerM3K wind heat-loss coefficient U1, W s/(m3 K), 0 or more
 */
public record CellTemperature(double u0WPerM2K, double u1WsPerM3K) {

    /** Free-standing (open rack) c-Si: U0 = 25.0 W/(m2 K), U1 = 6.84 W s/(m3 K) (common practice, from memory). */
    public static final CellTemperature FREE_STANDING = new CellTemperature(25.0, 6.84);
    /** Flush on a roof, poorly ventilated: U0 = 19.6, U1 = 1.07 (from King et al. 2004, see the class comment). */
    public static final CellTemperature ROOF_FLUSH = new CellTemperature(19.6, 1.07);

    /**
     * Air temperature used when the weather has none for a step and no month mean is known: 20 C, the
     * ambient of the nominal operating cell temperature conditions (NOCT: 800 W/m2, 20 C, 1 m/s;
     * IEC 61215, common practice). In a cool climate it overstates the temperature loss a little.
     */
    public static final double DEFAULT_AIR_C = 20.0;
    /**
     * Wind speed used when the weather has none: 1 m/s (the NOCT wind speed; common practice for a
     * missing wind column).
     */
    public static final double DEFAULT_WIND_MS = 1.0;

    public CellTemperature {
        if (!(u0WPerM2K > 0) || !(u1WsPerM3K >= 0) || Double.isInfinite(u0WPerM2K) || Double.isInfinite(u1WsPerM3K))
            throw new IllegalArgumentException("heat-loss coefficients must be U0 > 0, U1 >= 0: " + u0WPerM2K + ", " + u1WsPerM3K);
    }

    /**
     * Cell temperature, C (Faiman 2008). A NaN air temperature or wind speed takes
     * {@link #DEFAULT_AIR_C} / {@link #DEFAULT_WIND_MS}; negative wind counts as calm.
     *
     * @param poaWm2 plane-of-array irradiance incident on the module (before incidence losses), W/m2
     * @param airC   air temperature, C (NaN when unknown)
     * @param windMs wind speed, m/s (NaN when unknown)
     */
    public double cellC(double poaWm2, double airC, double windMs) {
        double ta = Double.isNaN(airC) ? DEFAULT_AIR_C : airC;
        double v = Double.isNaN(windMs) ? DEFAULT_WIND_MS : Math.max(0, windMs);
        return ta + Math.max(0, poaWm2) / (u0WPerM2K + u1WsPerM3K * v);
    }

    /**
     * Air temperature per climate step with the gaps filled as {@link #fillAir}: the step's dry-bulb
     * temperature, else its month's mean, else {@link #DEFAULT_AIR_C}. (Wind needs no filling: pass
     * {@code step.windMs()}, NaN takes {@link #DEFAULT_WIND_MS}.)
     */
    public static double[] airPerStep(java.util.List<org.solmass.climate.Step> steps) {
        double[] air = new double[steps.size()];
        int[] month = new int[steps.size()];
        for (int i = 0; i < air.length; i++) { air[i] = steps.get(i).dryBulbC(); month[i] = steps.get(i).month(); }
        return fillAir(air, month);
    }

    /**
     * Air temperature per step with the gaps filled: a step's own value when known, else the mean of
     * the known values of its month, else {@link #DEFAULT_AIR_C}.
     *
     * @param airC  air temperature per step, C, NaN where unknown
     * @param month month 1..12 per step
     * @return a new array, no NaN
     */
    public static double[] fillAir(double[] airC, int[] month) {
        if (airC.length != month.length) throw new IllegalArgumentException("one month per step");
        double[] sum = new double[13];
        int[] n = new int[13];
        for (int i = 0; i < airC.length; i++) if (!Double.isNaN(airC[i])) { sum[month[i]] += airC[i]; n[month[i]]++; }
        double[] out = new double[airC.length];
        for (int i = 0; i < airC.length; i++) {
            int m = month[i];
            out[i] = !Double.isNaN(airC[i]) ? airC[i] : n[m] > 0 ? sum[m] / n[m] : DEFAULT_AIR_C;
        }
        return out;
    }
}
