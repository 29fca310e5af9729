package org.solmass.pv;

/**
 * A PV module's datasheet values, all at standard test conditions (STC: 1000 W/m2 in the module
 * plane, cell temperature 25 C, air mass 1.5; IEC 61215 / IEC 60904-3).
 *
 * <p>Geometry: a module is a rectangle {@code lengthM x widthM}; its bypass-diode substrings are
 * strips running along the length, side by side across the width (the usual wiring of a 60- or
 * 120-half-cell module with three diodes: common practice).
 *
 * @param lengthM long side, metres
 * @param widthM short side, metres
 * @param stcPowerW rated power at STC, W
 * @param tempCoeffPerK relative change of power per kelvin of cell temperature above 25 C (negative), 1/K
 * @param bypassSubstrings number of bypass-diode substrings (1 when the module has none)
 */
public record ModuleSpec(double lengthM, double widthM, double stcPowerW, double tempCoeffPerK,
                         int bypassSubstrings) {

    /**
     * Default module: 1.722 m x 1.134 m, 400 W, -0.35 %/K, three substrings: a typical
     * monocrystalline 108-half-cell module of 2021-2024 (common practice; values from memory of
     * datasheets of that class, not of one product). Efficiency 400 / (1.722 x 1.134 x 1000) = 20.5 %.
     */
    public static final ModuleSpec DEFAULT = new ModuleSpec(1.722, 1.134, 400, -0.0035, 3);

    public ModuleSpec {
        if (!(lengthM > 0) || !(widthM > 0) || widthM > lengthM)
            throw new IllegalArgumentException("module size must be positive, length >= width: "
                    + lengthM + " x " + widthM + " m");
        if (!(stcPowerW > 0)) throw new IllegalArgumentException("module power must be positive: " + stcPowerW + " W");
        if (!(tempCoeffPerK <= 0 && tempCoeffPerK > -0.02))
            throw new IllegalArgumentException("temperature coefficient must lie in (-2, 0] %/K: "
                    + tempCoeffPerK * 100 + " %/K");
        if (bypassSubstrings < 1 || bypassSubstrings > 12)
            throw new IllegalArgumentException("bypass substrings must be 1..12: " + bypassSubstrings);
    }

    /** Module area, m2. */
    public double areaM2() { return lengthM * widthM; }

    /** STC efficiency: rated power over 1000 W/m2 times the module area. */
    public double efficiency() { return stcPowerW / (1000 * areaM2()); }
}
