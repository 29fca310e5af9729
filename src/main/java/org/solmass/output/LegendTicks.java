package org.solmass.output;

import java.math.BigDecimal;
import java.util.Locale;

/**
 * "Nice" legend ticks: steps of 1, 2 or 5 times a power of ten, chosen so that at most a given number
 * of ticks fall in a range. Common practice for axis labelling (the 1-2-5 series). Shared by the map
 * renderer and the viewer's legend.
 */
public final class LegendTicks {
    private static final double[] MANTISSAS = {1, 2, 5};

    private LegendTicks() {}

    /**
     * The smallest 1-2-5 step that puts at most {@code maxTicks} ticks in [lo, hi].
     *
     * @param maxTicks at least 2
     * @return the step; 1 for an empty or non-finite range
     */
    public static double step(double lo, double hi, int maxTicks) {
        double span = hi - lo;
        if (!(span > 0) || !Double.isFinite(span)) return 1;
        int intervals = Math.max(1, maxTicks - 1);
        double raw = span / intervals;
        int exp = (int) Math.floor(Math.log10(raw));
        for (int e = exp - 1; e <= exp + 1; e++) {
            for (double m : MANTISSAS) {
                double s = m * Math.pow(10, e);
                if (count(lo, hi, s) <= maxTicks) return s;
            }
        }
        return 10 * Math.pow(10, exp + 1);
    }

    /** Tick values: every multiple of the step within [lo, hi], ascending. */
    public static double[] ticks(double lo, double hi, int maxTicks) {
        if (!(hi > lo)) return Double.isFinite(lo) ? new double[] {lo} : new double[0];
        double s = step(lo, hi, maxTicks);
        long first = (long) Math.ceil(lo / s - 1e-9), last = (long) Math.floor(hi / s + 1e-9);
        double[] out = new double[(int) Math.max(0, last - first + 1)];
        for (int i = 0; i < out.length; i++) {
            double v = (first + i) * s;
            out[i] = clean(v, s);
        }
        return out;
    }

    /** The range widened outward to whole steps: {lo', hi'} with lo' <= lo and hi' >= hi. */
    public static double[] niceRange(double lo, double hi, int maxTicks) {
        if (!(hi > lo)) return new double[] {lo, hi};
        double s = step(lo, hi, maxTicks);
        return new double[] {clean(Math.floor(lo / s + 1e-9) * s, s), clean(Math.ceil(hi / s - 1e-9) * s, s)};
    }

    /** A tick label with as many decimals as the step needs ("0.25" for step 0.05, "1200" for 200). */
    public static String label(double v, double step) {
        int decimals = Math.max(0, -(int) Math.floor(Math.log10(step) + 1e-9));
        return String.format(Locale.ROOT, "%." + decimals + "f", v == 0 ? 0.0 : v);
    }

    private static long count(double lo, double hi, double s) {
        return (long) Math.floor(hi / s + 1e-9) - (long) Math.ceil(lo / s - 1e-9) + 1;
    }

    /** Removes binary noise such as 0.30000000000000004 by rounding to the step's decimals. */
    private static double clean(double v, double s) {
        int decimals = Math.max(0, -(int) Math.floor(Math.log10(s) + 1e-9)) + 1;
        return new BigDecimal(v).setScale(decimals, java.math.RoundingMode.HALF_UP).doubleValue();
    }
}
