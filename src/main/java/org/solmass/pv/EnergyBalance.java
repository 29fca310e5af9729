package org.solmass.pv;

/**
 * Energy of a PV array over some period, from the STC-rated energy of its plane-of-array irradiation
 * down to AC output, with each loss as its own quantity (Wh). The losses add up exactly (to rounding)
 * to the difference between the reference energy and the AC energy:
 * <pre>  referenceWh - (shading + incidence + mismatch + temperature + dcOther + inverter + clipping) = acWh</pre>
 * A loss may be negative: the temperature "loss" is a gain when cells run below 25 C.
 *
 * <p>Yields in the sense of IEC 61724-1 follow from the array's STC power P0 (W): reference yield
 * Yr = referenceWh / P0 (h, equal to kWh/kWp and to the in-plane irradiation over 1 kW/m2), final
 * yield Yf = acWh / P0, performance ratio PR = Yf / Yr = acWh / referenceWh.
 *
 * @param referenceWh   P0 x unobstructed in-plane irradiation / 1 kW/m2: the STC-rated energy, Wh
 * @param shadingWh     loss to the site's obstructions (unobstructed minus obstructed irradiance), Wh
 * @param incidenceWh   loss to reflection at the module glass (incidence-angle modifier), Wh
 * @param mismatchWh    loss to unequal irradiance of bypass-diode substrings (partial shading), Wh
 * @param temperatureWh loss to cell temperature above 25 C (negative below), Wh
 * @param dcOtherWh     other DC losses (soiling, wiring, module quality) as one factor, Wh
 * @param inverterWh    inverter conversion loss, Wh
 * @param clippingWh    DC energy not drawn because AC output was at the inverter's rating, Wh
 * @param acWh          AC energy delivered, Wh
 */
public record EnergyBalance(double referenceWh, double shadingWh, double incidenceWh, double mismatchWh,
                            double temperatureWh, double dcOtherWh, double inverterWh, double clippingWh, double acWh) {

    /** Nothing. */
    public static final EnergyBalance ZERO = new EnergyBalance(0, 0, 0, 0, 0, 0, 0, 0, 0);

    /** Sum of all losses, Wh. */
    public double lossesWh() {
        return shadingWh + incidenceWh + mismatchWh + temperatureWh + dcOtherWh + inverterWh + clippingWh;
    }

    /** DC energy at the inverter input (what the array offers at its maximum-power point), Wh. */
    public double dcWh() { return acWh + inverterWh + clippingWh; }

    /** Performance ratio acWh / referenceWh (IEC 61724-1, PR = Yf / Yr); NaN with no irradiation. */
    public double performanceRatio() { return referenceWh > 0 ? acWh / referenceWh : Double.NaN; }

    /** This plus another, field by field. */
    public EnergyBalance plus(EnergyBalance o) {
        return new EnergyBalance(referenceWh + o.referenceWh, shadingWh + o.shadingWh, incidenceWh + o.incidenceWh,
                mismatchWh + o.mismatchWh, temperatureWh + o.temperatureWh, dcOtherWh + o.dcOtherWh,
                inverterWh + o.inverterWh, clippingWh + o.clippingWh, acWh + o.acWh);
    }

    /** Every field times f (e.g. the days a representative step stands for). */
    public EnergyBalance times(double f) {
        return new EnergyBalance(referenceWh * f, shadingWh * f, incidenceWh * f, mismatchWh * f, temperatureWh * f,
                dcOtherWh * f, inverterWh * f, clippingWh * f, acWh * f);
    }
}
