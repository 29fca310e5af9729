package org.solmass.output;

import org.solmass.metrics.PatchComparison;
import org.solmass.table.Column;

import java.nio.file.Path;

/**
 * Two patches.csv files of massing variants read and compared patch by patch ({@link PatchComparison}):
 * what {@code compare} writes and the viewer shows as differences.
 *
 * @param a the reference variant's table
 * @param b the other variant's table
 * @param comparison matches and compared quantities
 */
public record ComparedResults(PatchCsvReader.Table a, PatchCsvReader.Table b, PatchComparison comparison) {

    /**
     * Matches two patches.csv tables (read from {@code csvA} and {@code csvB}, named in messages);
     * refuses two tables with no result column in common.
     */
    public static ComparedResults of(PatchCsvReader.Table ta, Path csvA, PatchCsvReader.Table tb, Path csvB,
                                     double maxDistanceM, double maxAngleDeg) {
        PatchComparison c = PatchComparison.of(xyz(ta, "x", "y", "z"), xyz(ta, "nx", "ny", "nz"), ta.resultColumns(),
                xyz(tb, "x", "y", "z"), xyz(tb, "nx", "ny", "nz"), tb.resultColumns(), maxDistanceM, maxAngleDeg);
        if (c.quantities().isEmpty()) {
            throw new org.solmass.InputException(csvB.toString(), "no result column in common with " + csvA + " to compare");
        }
        return new ComparedResults(ta, tb, c);
    }

    /** B - A of a quantity per row of B; NaN where unmatched. */
    public double[] delta(Column q) {
        return comparison.delta(a.column(q.name()), b.column(q.name()));
    }

    public int matched() { return comparison.matched(); }

    private static double[] xyz(PatchCsvReader.Table t, String x, String y, String z) {
        double[] cx = t.column(x), cy = t.column(y), cz = t.column(z), out = new double[3 * t.size()];
        for (int i = 0; i < t.size(); i++) {
            out[3 * i] = cx[i];
            out[3 * i + 1] = cy[i];
            out[3 * i + 2] = cz[i];
        }
        return out;
    }
}
