package org.solmass.table;

import org.solmass.surface.Patch;

import java.util.List;

/**
 * Area-weighted statistics of one per-patch column: what the terminal summary, the metrics and the
 * summary file state about a set of patches. Patches without a value (NaN) are left out.
 *
 * @param areaM2 area of the patches with a value, m2
 * @param mean area-weighted mean, sum(value x area) / sum(area); NaN without any value
 * @param min smallest value; NaN without any value
 * @param max largest value; NaN without any value
 * @param valueTimesAreaSum sum(value x area): for irradiation in kWh/m2 the total in kWh
 */
public record AreaStats(double areaM2, double mean, double min, double max, double valueTimesAreaSum) {

    /** Statistics of {@code values} (one per patch, in patch order). */
    public static AreaStats of(List<Patch> patches, double[] values) {
        double area = 0, sum = 0, min = Double.POSITIVE_INFINITY, max = Double.NEGATIVE_INFINITY;
        for (int p = 0; p < values.length; p++) {
            double v = values[p];
            if (!Double.isFinite(v)) continue;
            double a = patches.get(p).areaM2();
            area += a;
            sum += v * a;
            min = Math.min(min, v);
            max = Math.max(max, v);
        }
        return area > 0 ? new AreaStats(area, sum / area, min, max, sum) : new AreaStats(0, Double.NaN, Double.NaN, Double.NaN, 0);
    }

    /** Area of the patches whose value is at least {@code threshold}, m2. */
    public static double areaAtLeast(List<Patch> patches, double[] values, double threshold) {
        double a = 0;
        for (int p = 0; p < values.length; p++) if (values[p] >= threshold) a += patches.get(p).areaM2();
        return a;
    }
}
