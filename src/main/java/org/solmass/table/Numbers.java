package org.solmass.table;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Locale-independent fixed-decimal number text for every file Solmass writes (CSV, summary.json, glTF extras): '.' as decimal separator, no
 * grouping, no exponent, "-0.00" written as "0.00", non-finite values as an empty cell. The same
 * double always gives the same text, so files are byte-identical across runs and machines.
 */
public final class Numbers {
    private static final long[] POW10 = {1, 10, 100, 1000, 10_000, 100_000, 1_000_000, 10_000_000, 100_000_000};
    private static final double FAST_LIMIT = 1e15;

    private Numbers() {}

    /** Appends {@code v} rounded half away from zero to {@code decimals} (0..8) places. */
    public static void append(StringBuilder sb, double v, int decimals) {
        if (!Double.isFinite(v)) return;
        long scale = POW10[decimals];
        double scaled = v * scale;
        if (Math.abs(scaled) >= FAST_LIMIT) {
            String s = new BigDecimal(v).setScale(decimals, RoundingMode.HALF_UP).toPlainString();
            sb.append(s);
            return;
        }
        long r = Math.round(Math.abs(scaled));
        if (r != 0 && v < 0) sb.append('-');
        long whole = r / scale, frac = r % scale;
        sb.append(whole);
        if (decimals > 0) {
            sb.append('.');
            String f = Long.toString(frac);
            for (int i = f.length(); i < decimals; i++) sb.append('0');
            sb.append(f);
        }
    }

    /** {@code v} as fixed-decimal text. */
    public static String format(double v, int decimals) {
        StringBuilder sb = new StringBuilder(24);
        append(sb, v, decimals);
        return sb.toString();
    }
}
