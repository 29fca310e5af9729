package org.solmass.climate;

/**
 * Correlations that split global irradiance into diffuse and beam, and daily totals into hours.
 * Angles in degrees.
 */
public final class Decomposition {
    private Decomposition() {}

    /**
     * Hourly diffuse fraction Id/I from the hourly clearness index kT = I/I0, Erbs, Klein &amp; Duffie
     * (1982, Solar Energy 28(4) 293-302), as Duffie &amp; Beckman (2013) eq. 2.10.1:
     * 1 - 0.09 kT for kT &lt;= 0.22; 0.9511 - 0.1604 kT + 4.388 kT^2 - 16.638 kT^3 + 12.336 kT^4 for
     * 0.22 &lt; kT &lt;= 0.80; 0.165 for kT &gt; 0.80. Fitted on US data, kT in [0, 1].
     */
    public static double erbsHourlyDiffuseFraction(double kt) {
        if (kt <= 0.22) return 1.0 - 0.09 * Math.max(0, kt);
        if (kt <= 0.80) return 0.9511 - 0.1604 * kt + 4.388 * kt * kt - 16.638 * kt * kt * kt + 12.336 * kt * kt * kt * kt;
        return 0.165;
    }

    /**
     * Monthly mean diffuse fraction Hd/H from the monthly mean clearness index KT and the sunset hour
     * angle of the average day, Erbs, Klein &amp; Duffie (1982), as Duffie &amp; Beckman (2013)
     * eq. 2.12.1: ws &lt;= 81.4: 1.391 - 3.560 KT + 4.189 KT^2 - 2.137 KT^3; ws &gt; 81.4:
     * 1.311 - 3.022 KT + 3.427 KT^2 - 1.821 KT^3. Valid 0.3 &lt;= KT &lt;= 0.8 (clamped to that range).
     */
    public static double erbsMonthlyDiffuseFraction(double kt, double sunsetHourAngleDeg) {
        double k = Math.max(0.3, Math.min(0.8, kt));
        if (sunsetHourAngleDeg <= 81.4) return 1.391 - 3.560 * k + 4.189 * k * k - 2.137 * k * k * k;
        return 1.311 - 3.022 * k + 3.427 * k * k - 1.821 * k * k * k;
    }

    /**
     * Ratio of hourly to daily global irradiation rt at hour angle w (middle of the hour), Collares-Pereira
     * &amp; Rabl (1979, Solar Energy 22(2) 155-164), Duffie &amp; Beckman (2013) eq. 2.13.2:
     * rt = (pi/24)(a + b cos w)(cos w - cos ws)/(sin ws - (pi ws/180) cos ws),
     * a = 0.409 + 0.5016 sin(ws - 60), b = 0.6609 - 0.4767 sin(ws - 60). 0 outside the day.
     * Given here as a function of cos w so a caller may take it from the sun position.
     */
    public static double collaresPereiraRabl(double cosW, double sunsetHourAngleDeg) {
        double ws = Math.toRadians(sunsetHourAngleDeg);
        double a = 0.409 + 0.5016 * Math.sin(ws - Math.PI / 3), b = 0.6609 - 0.4767 * Math.sin(ws - Math.PI / 3);
        return Math.max(0, (a + b * cosW) * liuJordanDiffuse(cosW, sunsetHourAngleDeg));
    }

    /**
     * Ratio of hourly to daily diffuse irradiation rd, Liu &amp; Jordan (1960, Solar Energy 4(3) 1-19)
     * in the form of Duffie &amp; Beckman (2013) eq. 2.13.4:
     * rd = (pi/24)(cos w - cos ws)/(sin ws - (pi ws/180) cos ws). 0 outside the day.
     */
    public static double liuJordanDiffuse(double cosW, double sunsetHourAngleDeg) {
        double ws = Math.toRadians(sunsetHourAngleDeg);
        double den = Math.sin(ws) - ws * Math.cos(ws);
        if (den <= 0) return 0;
        return Math.max(0, Math.PI / 24 * (cosW - Math.cos(ws)) / den);
    }
}
