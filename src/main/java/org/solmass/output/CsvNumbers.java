package org.solmass.output;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Locale-independent fixed-decimal number text for Solmass's CSV files: '.' as decimal separator, no
 * grouping, no exponent, "-0.00" written as "0.00", non-finite values as an empty cell. The same
 * double always gives the same text, so files are byte-identical across runs and machines.
 */
public final class CsvNumbers {
    private static final long[] POW10 = {1, 10, 100, 1000, 10_000, 100_000, 1_000_000, 10_000_000, 100_000_000};
    private static final double FAST_LIMIT = 1e15;

    private CsvNumbers() {}

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

    /**
     * Decimal places of a result column, from its unit: kWh/m2, kWh, %, h and deg 2; W/m2 1; m 3;
     * ids and levels ("id", "level") 0; ratios (no unit) and anything else 4. See docs/outputs.md.
     */
    public static int decimalsForUnit(String unit) {
        if (unit == null) return 4;
        return switch (unit) {
            case "kWh/m2", "kWh", "%", "h", "deg", "Wh/m2" -> 2;
            case "W/m2" -> 1;
            case "m" -> 3;
            case "id", "level" -> 0;
            default -> 4;
        };
    }
}
