package org.solmass.viewer;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Round tick values for a legend: steps of 1, 2 or 5 times a power of ten, all inside the range.
 * Method: P. S. Heckbert, "Nice numbers for graph labels", Graphics Gems, Academic Press, 1990,
 * pp. 61-63 (the "nice number" rounding), applied to the step between ticks.
 */
public final class LegendTicks {
    private LegendTicks() {}

    /** Tick values within [min,max], at most about {@code target} of them (at least 2 when min < max). */
    public static double[] ticks(double min, double max, int target) {
        if (!(max > min) || !Double.isFinite(min) || !Double.isFinite(max)) return new double[] {min};
        double step = step(min, max, target);
        int e = (int) Math.floor(Math.log10(step) + 1e-9);
        double mant = Math.round(step / Math.pow(10, e));  // 1, 2 or 5
        List<Double> out = new ArrayList<>();
        for (long k = (long) Math.ceil(min / step - 1e-9); k * step <= max + step * 1e-9; k++) {
            // k x mantissa scaled by a power of ten in one rounding step: exact decimals (0.6, not 0.6000000000000001)
            double r = e >= 0 ? k * mant * Math.pow(10, e) : k * mant / Math.pow(10, -e);
            out.add(r == 0 ? 0.0 : r);
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** The tick step: 1, 2 or 5 times a power of ten nearest to the range over {@code target} intervals. */
    public static double step(double min, double max, int target) {
        double raw = (max - min) / Math.max(1, target);
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        double f = raw / p;
        double nice = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;   // Heckbert's rounded nice number
        return nice * p;
    }

    /** Decimals needed to write multiples of {@code step} exactly (0 for steps >= 1). */
    public static int decimals(double step) {
        if (!(step > 0)) return 0;
        return Math.max(0, (int) -Math.floor(Math.log10(step) + 1e-9));
    }

    /** Tick label with the decimals of the step. */
    public static String format(double v, double step) {
        return String.format(Locale.ROOT, "%." + decimals(step) + "f", v);
    }
}
