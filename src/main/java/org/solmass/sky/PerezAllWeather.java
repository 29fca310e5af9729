package org.solmass.sky;

import org.solmass.climate.Step;

/**
 * The all-weather sky luminance distribution of Perez, Seals and Michalsky (1993, "All-weather model
 * for sky luminance distribution - preliminary configuration and validation", Solar Energy 50(3)
 * 235-245), used here as the relative radiance of the sky (the luminous efficacy is taken as the same
 * over the sky; the distribution is normalised per step to DHI, see {@link SkyDistribution}).
 *
 * <p>Eq. 1: {@code l(zeta, gamma) = [1 + a exp(b / cos zeta)] [1 + c exp(d gamma) + e cos^2 gamma]},
 * zeta the zenith angle of the sky element, gamma its angle to the sun (radians). Each of a..e is
 * {@code x1 + x2 Z + Delta (x3 + x4 Z)} with Z the solar zenith (radians), for the sky clearness bin
 * of the step; in the first bin {@code c = exp[(Delta (c1 + c2 Z))^c3] - c4} and
 * {@code d = -exp[Delta (d1 + d2 Z)] + d3 + Delta d4}. Clearness epsilon, its eight bins and the
 * brightness Delta are those of the Perez et al. (1990) irradiance model ({@link Perez#clearness},
 * {@link Perez#bin}, {@link Perez#airMass}), computed from the same sun-up DHI and DNI.
 * Coefficients: Table 1 of the paper, from memory.
 *
 * <p>Guards (our own): cos zeta is taken no lower than 0.01 in the gradation term, and a negative
 * luminance (possible near the horizon for some coefficient combinations outside the fitted data)
 * counts as 0 ({@link SkyPatches#normalised}).
 */
public final class PerezAllWeather implements SkyDistribution {
    public static final PerezAllWeather INSTANCE = new PerezAllWeather();

    /** [bin][a, b, c, d, e][x1, x2, x3, x4]; Perez, Seals and Michalsky (1993) Table 1, from memory. */
    private static final double[][][] T = {
            {{1.3525, -0.2576, -0.2690, -1.4366}, {-0.7670, 0.0007, 1.2734, -0.1233},
                    {2.8000, 0.6004, 1.2375, 1.0000}, {1.8734, 0.6297, 0.9738, 0.2809}, {0.0356, -0.1246, -0.5718, 0.9938}},
            {{-1.2219, -0.7730, 1.4148, 1.1016}, {-0.2054, 0.0367, -3.9128, 0.9156},
                    {6.9750, 0.1774, 6.4477, -0.1239}, {-1.5798, -0.5081, -1.7812, 0.1080}, {0.2624, 0.0672, -0.2190, -0.4285}},
            {{-1.1000, -0.2515, 0.8952, 0.0156}, {0.2782, -0.1812, -4.5000, 1.1766},
                    {24.7219, -13.0812, -37.7000, 34.8438}, {-5.0000, 1.5218, 3.9229, -2.6204}, {-0.0156, 0.1597, 0.4199, -0.5562}},
            {{-0.5484, -0.6654, -0.2672, 0.7117}, {0.7234, -0.6219, -5.6812, 2.6297},
                    {33.3389, -18.3000, -62.2500, 52.0781}, {-3.5000, 0.0016, 1.1477, 0.1062}, {0.4659, -0.3296, -0.0876, -0.0329}},
            {{-0.6000, -0.3566, -2.5000, 2.3250}, {0.2937, 0.0496, -5.6812, 1.8415},
                    {21.0000, -4.7656, -21.5906, 7.2492}, {-3.5000, -0.1554, 1.4062, 0.3988}, {0.0032, 0.0766, -0.0656, -0.1294}},
            {{-1.0156, -0.3670, 1.0078, 1.4051}, {0.2875, -0.5328, -3.8500, 3.3750},
                    {14.0000, -0.9999, -7.1406, 7.5469}, {-3.4000, -0.1078, -1.0750, 1.5702}, {-0.0672, 0.4016, 0.3017, -0.4844}},
            {{-1.0000, 0.0211, 0.5025, -0.5119}, {-0.3000, 0.1922, 0.7023, -1.6317},
                    {19.0000, -5.0000, 1.2438, -1.9094}, {-4.0000, 0.0250, 0.3844, 0.2656}, {1.0468, -0.3788, -2.4517, 1.4656}},
            {{-1.0500, 0.0289, 0.4260, 0.3590}, {-0.3250, 0.1156, 0.7781, 0.0025},
                    {31.0625, -14.5000, -46.1148, 55.3750}, {-7.2312, 0.4050, 13.3500, 0.6234}, {1.5000, -0.6426, 1.8564, 0.5636}},
    };

    /** Lowest cos zeta in the gradation term (our own guard against exp(b / 0)). */
    static final double MIN_COS_ZETA = 0.01;

    private PerezAllWeather() {}

    @Override public String name() { return "perez-1993"; }

    /**
     * The five coefficients {a, b, c, d, e} of eq. 1 for a clearness bin (0..7, {@link Perez#bin}),
     * brightness Delta and solar zenith Z in radians.
     */
    public static double[] coefficients(int bin, double delta, double zenithRad) {
        double[][] t = T[bin];
        double[] x = new double[5];
        for (int i = 0; i < 5; i++) x[i] = t[i][0] + t[i][1] * zenithRad + delta * (t[i][2] + t[i][3] * zenithRad);
        if (bin == 0) {
            x[2] = Math.exp(Math.pow(delta * (t[2][0] + t[2][1] * zenithRad), t[2][2])) - t[2][3];
            x[3] = -Math.exp(delta * (t[3][0] + t[3][1] * zenithRad)) + t[3][2] + delta * t[3][3];
        }
        return x;
    }

    /** Relative luminance of eq. 1 for coefficients {a..e}, cos of the element's zenith angle and its angle to the sun (radians). */
    public static double luminance(double[] k, double cosZeta, double gammaRad) {
        return gradation(k, cosZeta) * indicatrix(k, Math.cos(gammaRad), gammaRad);
    }

    private static double gradation(double[] k, double cosZeta) {
        return 1 + k[0] * Math.exp(k[1] / Math.max(MIN_COS_ZETA, cosZeta));
    }

    private static double indicatrix(double[] k, double cosGamma, double gammaRad) {
        return 1 + k[2] * Math.exp(k[3] * gammaRad) + k[4] * cosGamma * cosGamma;
    }

    @Override
    public Radiance radiance(Step step) {
        if (step.sunUpFraction() <= 0 || step.dhiWm2() <= 0) return null;
        double dhi = step.dhiWm2() / step.sunUpFraction(), dni = step.dniWm2() / step.sunUpFraction();
        double zenithDeg = step.sun().zenithDeg();
        if (zenithDeg >= 90) return null;
        double z = Math.toRadians(zenithDeg);
        double delta = Perez.airMass(zenithDeg) * dhi / step.extraNormalWm2();
        double[] k = coefficients(Perez.bin(Perez.clearness(dhi, dni, z)), delta, z);
        return new Radiance() {
            @Override public double gradation(double cosZenith) { return PerezAllWeather.gradation(k, cosZenith); }

            @Override public double indicatrix(double cosToSun) {
                double c = Math.max(-1, Math.min(1, cosToSun));
                return PerezAllWeather.indicatrix(k, c, Math.acos(c));
            }
        };
    }
}
