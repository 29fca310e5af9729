package org.solmass.pv;

/**
 * Power of a module whose bypass-diode substrings see different irradiance (partial shading).
 *
 * <p>Approach (common practice, bypass-diode reasoning; it is the substring picture used by
 * C. Deline, A. Dobos, S. Janzou, J. Meydbray and M. Donovan (2013), "A simplified model of uniform
 * shading in large photovoltaic arrays", Solar Energy 96, 274-282, reduced to its simplest form;
 * their equations are not reproduced here): the substrings are in series, so they carry one current.
 * A substring's current at its maximum-power point is taken proportional to its effective irradiance
 * and its voltage as the same for all substrings. At a module current set by the k-th brightest
 * substring, the k brightest substrings produce and the others are bypassed by their diodes, so
 * <pre>  P = P_stc / 1000 x max over k of (k / n) G_(k)</pre>
 * with G_(1) &gt;= G_(2) &gt;= ... &gt;= G_(n) the substrings' effective irradiances (W/m2) and n their
 * number. Uniform irradiance gives no loss; one of three substrings fully shaded gives 2/3 of the
 * unshaded power. Neglected: the bypass diode's forward voltage drop, the voltage's weak dependence
 * on irradiance, and mismatch between modules of a string (module-level: as with one
 * maximum-power-point tracker per module, or a string whose modules share one shading pattern).
 */
public final class SubstringMismatch {
    private SubstringMismatch() {}

    /**
     * The irradiance (W/m2) that, spread uniformly over the module, gives the same power as the
     * substrings' irradiances with bypass diodes: max over k of (k / n) G_(k).
     *
     * @param substringWm2 effective irradiance of each substring, W/m2 (not changed)
     */
    public static double equivalentWm2(double[] substringWm2) {
        int n = substringWm2.length;
        if (n == 0) throw new IllegalArgumentException("a module has at least one substring");
        // for each substring as the current-setting one: k = substrings at least as bright (no sort, no allocation)
        double best = 0;
        for (int i = 0; i < n; i++) {
            double gi = Math.max(0, substringWm2[i]);
            int k = 0;
            for (int j = 0; j < n; j++) if (Math.max(0, substringWm2[j]) >= gi) k++;
            best = Math.max(best, k * gi / n);
        }
        return best;
    }

    /** Mean of the substrings' irradiances (W/m2, negatives as 0): the power with no mismatch. */
    public static double meanWm2(double[] substringWm2) {
        double s = 0;
        for (double g : substringWm2) s += Math.max(0, g);
        return s / substringWm2.length;
    }
}
