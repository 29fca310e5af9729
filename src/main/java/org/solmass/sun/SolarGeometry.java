package org.solmass.sun;

/**
 * Day-level solar geometry used by the monthly and daily models (not by the per-step sun position,
 * which comes from the SPA in {@link SolarCalculator}). Angles in degrees unless named otherwise.
 */
public final class SolarGeometry {
    private SolarGeometry() {}

    /**
     * Solar constant, W/m2: 1361 (Kopp &amp; Lean 2011, Geophys. Res. Lett. 38, L01706; total solar
     * irradiance at 1 AU from SORCE/TIM). Duffie &amp; Beckman use 1367 W/m2 (WRC); the 0.44 %
     * difference is documented in docs/sun-sky-climate.md.
     */
    public static final double SOLAR_CONSTANT_WM2 = 1361.0;

    /**
     * Klein's (1977, Solar Energy 19(4) 325-329) recommended average day of each month, as day of the
     * (non-leap) year, as tabulated in Duffie &amp; Beckman (2013) Table 1.6.1: 17, 47, 75, 105, 135,
     * 162, 198, 228, 258, 288, 318, 344.
     */
    private static final int[] KLEIN_DAY = {17, 47, 75, 105, 135, 162, 198, 228, 258, 288, 318, 344};
    private static final int[] DAYS_IN_MONTH = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};

    /** Klein's average day of month 1..12, day of a non-leap year. */
    public static int kleinDayOfYear(int month) { return KLEIN_DAY[month - 1]; }

    /** Days of month 1..12 in a non-leap year. */
    public static int daysInMonth(int month) { return DAYS_IN_MONTH[month - 1]; }

    private static double dayAngleRad(int dayOfYear) { return Math.toRadians((dayOfYear - 1) * 360.0 / 365.0); }

    /**
     * Extraterrestrial normal irradiance, W/m2, with the Earth-orbit eccentricity correction of
     * Spencer (1971, Search 2(5) 172), as given by Duffie &amp; Beckman (2013) eq. 1.4.1b:
     * G0n = Gsc (1.000110 + 0.034221 cos B + 0.001280 sin B + 0.000719 cos 2B + 0.000077 sin 2B),
     * B = (n - 1) 360/365. Accuracy about 0.01 % against the ephemeris.
     */
    public static double extraterrestrialNormalWm2(int dayOfYear) {
        double b = dayAngleRad(dayOfYear);
        return SOLAR_CONSTANT_WM2 * (1.000110 + 0.034221 * Math.cos(b) + 0.001280 * Math.sin(b)
                + 0.000719 * Math.cos(2 * b) + 0.000077 * Math.sin(2 * b));
    }

    /** Year whose ephemeris gives the declination of a day of year (non-leap, near the present epoch). */
    public static final int DECLINATION_YEAR = 2025;
    private static final double[] DECLINATION = new double[367];

    static {
        for (int n = 1; n <= 366; n++) {
            java.time.ZonedDateTime noon = java.time.LocalDate.ofYearDay(DECLINATION_YEAR, Math.min(n, 365))
                    .atTime(12, 0).atZone(java.time.ZoneOffset.UTC).plusDays(n == 366 ? 1 : 0);
            // geometric SPA position seen from (0 N, 0 E): sin(delta) = cos(z) sin(0) + cos(0) sin(z) cos(A)
            var p = net.e175.klaus.solarpositioning.SPA.calculateSolarPosition(noon, 0, 0, 0, 69);
            double z = Math.toRadians(p.zenithAngle()), a = Math.toRadians(p.azimuth());
            DECLINATION[n] = Math.toDegrees(Math.asin(Math.sin(z) * Math.cos(a)));
        }
    }

    /**
     * Solar declination at 12:00 UTC of a day of year, degrees, from the SPA ephemeris (Reda &amp;
     * Andreas 2004) for {@link #DECLINATION_YEAR}. Day-of-year formulas (Cooper 1969, Spencer 1971)
     * were fitted to other epochs and are 0.3-0.6 deg off near the equinoxes today (the equinoxes
     * have moved by about a day), which moves H0 of the equinox months by over 1 % at 45 deg latitude;
     * taking the declination from the same ephemeris as the per-step sun keeps the monthly models
     * consistent with the steps. Day 366 is taken one day after day 365.
     */
    public static double declinationDeg(int dayOfYear) {
        return DECLINATION[dayOfYear];
    }

    /** Declination of Cooper (1969), Duffie &amp; Beckman (2013) eq. 1.6.1a: 23.45 sin(360 (284 + n)/365), degrees. */
    public static double cooperDeclinationDeg(int dayOfYear) {
        return 23.45 * Math.sin(Math.toRadians(360.0 * (284 + dayOfYear) / 365));
    }

    /**
     * Equation of time, minutes (apparent solar time minus mean solar time), Spencer (1971) as given
     * by Duffie &amp; Beckman (2013) eq. 1.5.3.
     */
    public static double equationOfTimeMin(int dayOfYear) {
        double b = dayAngleRad(dayOfYear);
        return 229.2 * (0.000075 + 0.001868 * Math.cos(b) - 0.032077 * Math.sin(b)
                - 0.014615 * Math.cos(2 * b) - 0.04089 * Math.sin(2 * b));
    }

    /**
     * Sunset hour angle, degrees: cos ws = -tan(phi) tan(delta), Duffie &amp; Beckman (2013) eq. 1.6.10;
     * 0 in polar night, 180 in polar day.
     */
    public static double sunsetHourAngleDeg(double latitudeDeg, double declinationDeg) {
        double c = -Math.tan(Math.toRadians(latitudeDeg)) * Math.tan(Math.toRadians(declinationDeg));
        if (c >= 1) return 0;
        if (c <= -1) return 180;
        return Math.toDegrees(Math.acos(c));
    }

    /**
     * Daily extraterrestrial irradiation on a horizontal plane, Wh/m2 per day, Duffie &amp; Beckman
     * (2013) eq. 1.10.3: H0 = (24/pi) G0n [cos phi cos delta sin ws + (pi ws/180) sin phi sin delta]
     * (with 24 h instead of 24x3600 s to give Wh). Geometric sunrise/sunset (no refraction).
     */
    public static double dailyExtraterrestrialWhM2(double latitudeDeg, int dayOfYear) {
        return dailyExtraterrestrialWhM2(latitudeDeg, dayOfYear, declinationDeg(dayOfYear));
    }

    /** As {@link #dailyExtraterrestrialWhM2(double, int)} with a given declination (degrees). */
    public static double dailyExtraterrestrialWhM2(double latitudeDeg, int dayOfYear, double declinationDeg) {
        double delta = declinationDeg;
        double ws = sunsetHourAngleDeg(latitudeDeg, delta);
        double phi = Math.toRadians(latitudeDeg), d = Math.toRadians(delta), w = Math.toRadians(ws);
        return 24.0 / Math.PI * extraterrestrialNormalWm2(dayOfYear)
                * (Math.cos(phi) * Math.cos(d) * Math.sin(w) + w * Math.sin(phi) * Math.sin(d));
    }
}
