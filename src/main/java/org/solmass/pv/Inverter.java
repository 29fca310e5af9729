package org.solmass.pv;

/**
 * Inverter: DC to AC conversion efficiency as a function of load, and clipping at the AC rating.
 *
 * <p>Efficiency curve: the loss model of H. Schmidt and D.U. Sauer (1996), "Wechselrichter-Wirkungsgrade:
 * Praxisgerechte Modellierung und Abschaetzung", Sonnenenergie 4/1996, 43-47 (from memory): the
 * inverter's losses, in per unit of its rated AC power, are a constant self-consumption, a part
 * proportional to the load and an ohmic part proportional to its square,
 * <pre>  p_dc = p_ac + p0 + v p_ac + r p_ac^2,   eta(p_ac) = p_ac / p_dc</pre>
 * Given the DC input the AC output is the positive root of that quadratic; below p0 the inverter
 * gives nothing. Defaults p0 = 0.004, v = 0.02, r = 0.01 give a peak efficiency of about 96.8 % and a
 * European-weighted efficiency (weights 0.03, 0.06, 0.13, 0.10, 0.48, 0.20 at 5, 10, 20, 30, 50,
 * 100 % load; EN 50530 / common practice) of about 96.3 %: a typical string inverter (common practice).
 *
 * <p>Clipping: the AC rating is the array's STC power divided by the DC/AC ratio (default 1.2, common
 * practice for fixed-tilt systems in central Europe). When the DC power would give more than the rating
 * the inverter moves off the maximum-power point: output is the rating, the DC power it draws is the
 * input that gives the rating, and the rest of the available DC power is the clipping loss.
 *
 * @param p0 self-consumption, per unit of the AC rating, [0, 0.1)
 * @param v  loss proportional to load, dimensionless, [0, 0.2)
 * @param r  ohmic loss coefficient, per unit, [0, 0.2)
 * @param dcAcRatio array STC power over inverter AC rating, in [0.5, 3]
 */
public record Inverter(double p0, double v, double r, double dcAcRatio) {

    /** Defaults: p0 = 0.004, v = 0.02, r = 0.01, DC/AC ratio 1.2 (common practice, see the class comment). */
    public static final Inverter DEFAULT = new Inverter(0.004, 0.02, 0.01, 1.2);

    /** Loads (per unit) and weights of the European efficiency (EN 50530; common practice). */
    public static final double[] EURO_LOADS = {0.05, 0.10, 0.20, 0.30, 0.50, 1.00};
    public static final double[] EURO_WEIGHTS = {0.03, 0.06, 0.13, 0.10, 0.48, 0.20};

    public Inverter {
        if (!(p0 >= 0 && p0 < 0.1) || !(v >= 0 && v < 0.2) || !(r >= 0 && r < 0.2))
            throw new IllegalArgumentException("inverter loss coefficients out of range: p0 " + p0 + ", v " + v + ", r " + r);
        if (!(dcAcRatio >= 0.5 && dcAcRatio <= 3)) throw new IllegalArgumentException("DC/AC ratio must lie in [0.5, 3]: " + dcAcRatio);
    }

    /** DC input (per unit of the AC rating) that gives an AC output pAc (per unit). */
    public double dcForAc(double pAc) {
        return pAc <= 0 ? 0 : pAc + p0 + v * pAc + r * pAc * pAc;
    }

    /** Efficiency at an AC output pAc (per unit of the AC rating), 0 at no load. */
    public double efficiencyAtAc(double pAc) {
        return pAc <= 0 ? 0 : pAc / dcForAc(pAc);
    }

    /** AC output (per unit) for a DC input pDc (per unit), without clipping; 0 at or below p0. */
    public double acForDc(double pDc) {
        if (pDc <= p0) return 0;
        double b = 1 + v, c = p0 - pDc;
        if (r == 0) return -c / b;
        // positive root of r x^2 + b x + c = 0, written to avoid cancellation
        return -2 * c / (b + Math.sqrt(b * b - 4 * r * c));
    }

    /** European-weighted efficiency of this curve (weights {@link #EURO_WEIGHTS} at loads {@link #EURO_LOADS} of the AC rating). */
    public double europeanEfficiency() {
        double e = 0;
        for (int i = 0; i < EURO_LOADS.length; i++) e += EURO_WEIGHTS[i] * efficiencyAtAc(EURO_LOADS[i]);
        return e;
    }

    /** AC rating, W, of an inverter (or set of inverters) for an array of STC power arrayStcW. */
    public double acRatingW(double arrayStcW) { return arrayStcW / dcAcRatio; }

    /**
     * Converts one step's DC power.
     *
     * @param dcW       DC power available at the maximum-power point, W
     * @param acRatingW the AC rating, W (see {@link #acRatingW})
     * @return AC output, inverter loss and clipping loss, W; dcW = acW + lossW + clippedW
     */
    public Conversion convert(double dcW, double acRatingW) {
        if (!(acRatingW > 0)) throw new IllegalArgumentException("AC rating must be positive: " + acRatingW);
        double pDc = Math.max(0, dcW) / acRatingW;
        double pAc = acForDc(pDc);
        if (pAc <= 1) return new Conversion(pAc * acRatingW, Math.max(0, dcW) - pAc * acRatingW, 0);
        double drawn = dcForAc(1) * acRatingW;
        return new Conversion(acRatingW, drawn - acRatingW, dcW - drawn);
    }

    /** One step's conversion, W: AC output, inverter loss, clipping loss. */
    public record Conversion(double acW, double lossW, double clippedW) {}
}
