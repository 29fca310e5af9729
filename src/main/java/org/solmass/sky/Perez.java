package org.solmass.sky;

import org.solmass.climate.Step;

/**
 * Anisotropic sky of Perez, Ineichen, Seals, Michalsky &amp; Stewart (1990, "Modeling daylight
 * availability and irradiance components from direct and global irradiance", Solar Energy 44(5)
 * 271-289), with the brightness coefficients of its Table 6 as reproduced in Duffie &amp; Beckman
 * (2013) Table 2.16.1 (the coefficient values here are from memory of that table).
 *
 * <p>Sky clearness eps = ((DHI + DNI)/DHI + k z^3)/(1 + k z^3), k = 1.041, z zenith in radians
 * (eq. 1); brightness Delta = m DHI / G0n (eq. 2) with the DHI of the sun-up part of the step and
 * the relative air mass m of Kasten &amp; Young (1989, Applied Optics 28(22) 4735-4738);
 * F1 = max(0, f11 + f12 Delta + f13 z), F2 = f21 + f22 Delta + f23 z for the eps bin of the step.
 * Valid for the sun above the horizon; fitted on data from 18 sites (US and Europe).
 */
public final class Perez implements SkyModel {
    public static final Perez INSTANCE = new Perez();

    /** Upper bounds of the eps bins 1..7 (bin 8 above 6.2). */
    private static final double[] EPS_UPPER = {1.065, 1.230, 1.500, 1.950, 2.800, 4.500, 6.200};

    /** f11, f12, f13, f21, f22, f23 by eps bin 1..8. */
    private static final double[][] F = {
            {-0.008, 0.588, -0.062, -0.060, 0.072, -0.022},
            {0.130, 0.683, -0.151, -0.019, 0.066, -0.029},
            {0.330, 0.487, -0.221, 0.055, -0.064, -0.026},
            {0.568, 0.187, -0.295, 0.109, -0.152, -0.014},
            {0.873, -0.392, -0.362, 0.226, -0.462, 0.001},
            {1.132, -1.237, -0.412, 0.288, -0.823, 0.056},
            {1.060, -1.600, -0.359, 0.264, -1.127, 0.131},
            {0.678, -0.327, -0.250, 0.156, -1.377, 0.251},
    };

    private Perez() {}

    @Override public String name() { return "perez"; }

    /** Sky clearness eps of a step (1 for a fully overcast sky). */
    public static double clearness(double dhi, double dni, double zenithRad) {
        double kz3 = 1.041 * zenithRad * zenithRad * zenithRad;
        return ((dhi + dni) / dhi + kz3) / (1 + kz3);
    }

    /** The eps bin 0..7. */
    public static int bin(double eps) {
        for (int i = 0; i < EPS_UPPER.length; i++) if (eps < EPS_UPPER[i]) return i;
        return 7;
    }

    /** Relative optical air mass, Kasten &amp; Young (1989) eq. 3, zenith in degrees (apparent), valid to 90 deg. */
    public static double airMass(double zenithDeg) {
        double z = Math.min(zenithDeg, 90);
        return 1 / (Math.cos(Math.toRadians(z)) + 0.50572 * Math.pow(96.07995 - z, -1.6364));
    }

    /** {F1, F2} from DHI and DNI of the sun-up part (W/m2), the zenith (degrees) and G0n (W/m2). */
    public static double[] coefficients(double dhiSunUp, double dniSunUp, double zenithDeg, double extraNormalWm2) {
        if (dhiSunUp <= 0 || zenithDeg >= 90) return new double[] {0, 0};
        double z = Math.toRadians(zenithDeg);
        double[] f = F[bin(clearness(dhiSunUp, dniSunUp, z))];
        double delta = airMass(zenithDeg) * dhiSunUp / extraNormalWm2;
        return new double[] {Math.max(0, f[0] + f[1] * delta + f[2] * z), f[3] + f[4] * delta + f[5] * z};
    }

    private static double[] of(Step s) {
        if (s.sunUpFraction() <= 0) return new double[] {0, 0};
        return coefficients(s.dhiWm2() / s.sunUpFraction(), s.dniWm2() / s.sunUpFraction(), s.sun().zenithDeg(), s.extraNormalWm2());
    }

    @Override public double circumsolarCoefficient(Step step) { return of(step)[0]; }
    @Override public double horizonCoefficient(Step step) { return of(step)[1]; }
}
