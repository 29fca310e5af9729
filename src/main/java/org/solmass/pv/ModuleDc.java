package org.solmass.pv;

/**
 * DC power of one module, or the sum over modules, at one instant, W: the STC-rated power of the
 * unobstructed irradiance, each DC-side loss and the DC power offered to the inverter:
 * dcW = referenceW - shadingW - incidenceW - mismatchW - temperatureW - dcOtherW. All fields add up
 * over modules ({@link #plus}); {@link #cellTimesReferenceCW} is the cell temperature times the
 * reference power, so that {@link #meanCellC()} is the reference-power-weighted mean over modules.
 */
public record ModuleDc(double referenceW, double shadingW, double incidenceW, double mismatchW,
                       double temperatureW, double dcOtherW, double dcW, double cellTimesReferenceCW) {

    public static final ModuleDc ZERO = new ModuleDc(0, 0, 0, 0, 0, 0, 0, 0);

    /** Field-by-field sum (a module group). */
    public ModuleDc plus(ModuleDc o) {
        return new ModuleDc(referenceW + o.referenceW, shadingW + o.shadingW, incidenceW + o.incidenceW, mismatchW + o.mismatchW,
                temperatureW + o.temperatureW, dcOtherW + o.dcOtherW, dcW + o.dcW, cellTimesReferenceCW + o.cellTimesReferenceCW);
    }

    /** Cell temperature, C, weighted by reference power over the modules summed; NaN with no irradiance. */
    public double meanCellC() { return referenceW > 0 ? cellTimesReferenceCW / referenceW : Double.NaN; }
}
