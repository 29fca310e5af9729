package org.solmass.sky;

/**
 * Irradiation of a plane over a weather series, kWh/m2, by component and month. Sums follow the
 * time base: irradiance x step hours x step weight (days), so a monthly-average-day series gives
 * average-day total x days of month, and a year of steps gives straight sums; the year is the sum of
 * the months.
 *
 * @param annualKwhM2    beam + diffuse + reflected over the year
 * @param beamKwhM2      beam over the year
 * @param diffuseKwhM2   sky diffuse over the year
 * @param reflectedKwhM2 ground-reflected over the year
 * @param monthlyKwhM2   total of each month, index 0 = January
 * @param monthlyBeamKwhM2      beam of each month
 * @param monthlyDiffuseKwhM2   sky diffuse of each month
 * @param monthlyReflectedKwhM2 ground-reflected of each month
 */
public record PlaneIrradiation(double annualKwhM2, double beamKwhM2, double diffuseKwhM2, double reflectedKwhM2,
                               double[] monthlyKwhM2, double[] monthlyBeamKwhM2, double[] monthlyDiffuseKwhM2,
                               double[] monthlyReflectedKwhM2) {

    /** From the 36 monthly sums of {@link PreparedSky#sumInto} (Wh/m2, [component x 12 + month]). */
    public static PlaneIrradiation fromMonthlyWh(double[] wh36) {
        double[] b = new double[12], d = new double[12], r = new double[12], t = new double[12];
        double sb = 0, sd = 0, sr = 0;
        for (int m = 0; m < 12; m++) {
            b[m] = wh36[m] / 1000; d[m] = wh36[12 + m] / 1000; r[m] = wh36[24 + m] / 1000;
            t[m] = b[m] + d[m] + r[m];
            sb += b[m]; sd += d[m]; sr += r[m];
        }
        return new PlaneIrradiation(sb + sd + sr, sb, sd, sr, t, b, d, r);
    }

    /** Column names of the per-patch and per-plane tables, in order. */
    public static String[] columnNames() {
        String[] n = new String[16];
        n[0] = "annual_kwh_m2"; n[1] = "beam_kwh_m2"; n[2] = "diffuse_kwh_m2"; n[3] = "reflected_kwh_m2";
        for (int m = 1; m <= 12; m++) n[3 + m] = String.format("m%02d_kwh_m2", m);
        return n;
    }

    /** Values in the order of {@link #columnNames()}. */
    public double[] columnValues() {
        double[] v = new double[16];
        v[0] = annualKwhM2; v[1] = beamKwhM2; v[2] = diffuseKwhM2; v[3] = reflectedKwhM2;
        System.arraycopy(monthlyKwhM2, 0, v, 4, 12);
        return v;
    }
}
