package org.solmass.metrics;

import org.solmass.irradiation.IrradiationColumns;
import org.solmass.table.Column;
import org.solmass.table.ColumnKind;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Two results of massing variants of one site, patch by patch: patches matched by position and
 * orientation ({@link PatchMatcher}), differences B - A of the compared quantities. Pure numbers in,
 * numbers out; reading the folders and writing delta.csv belong to the output stage.
 *
 * @param matchOfB for each patch (row) of B the row of its A patch, or -1
 * @param matchOfA for each row of A the row of its B patch, or -1
 * @param quantities the compared columns, in order
 */
public record PatchComparison(int[] matchOfB, int[] matchOfA, List<Column> quantities) {
    /** Prefix of a difference column's name. */
    public static final String DELTA_PREFIX = "delta_";
    /** Compared whenever both sides have them; then every {@code sun_hours_MMDD} both have. */
    static final List<Column> BASE = List.of(IrradiationColumns.ANNUAL, IrradiationColumns.SUNSHINE_H,
            IrradiationColumns.SKY_VIEW_FACTOR);

    public PatchComparison {
        quantities = List.copyOf(quantities);
    }

    /**
     * Matches B's patches to A's and picks the quantities both have.
     *
     * @param centroidsA x,y,z per row of A; {@code normalsA} unit normals per row of A; the same for B
     * @param namesA result column names of A; {@code namesB} of B
     */
    public static PatchComparison of(double[] centroidsA, double[] normalsA, List<String> namesA,
                                     double[] centroidsB, double[] normalsB, List<String> namesB,
                                     double maxDistanceM, double maxAngleDeg) {
        int[] mb = PatchMatcher.match(centroidsA, normalsA, centroidsB, normalsB, maxDistanceM, maxAngleDeg);
        int[] ma = new int[centroidsA.length / 3];
        Arrays.fill(ma, -1);
        for (int r = 0; r < mb.length; r++) if (mb[r] >= 0) ma[mb[r]] = r;
        return new PatchComparison(mb, ma, quantities(namesA, namesB));
    }

    /** The compared quantities of two sets of result columns, in order. */
    public static List<Column> quantities(List<String> namesA, List<String> namesB) {
        List<Column> qs = new ArrayList<>();
        for (Column c : BASE) if (namesA.contains(c.name()) && namesB.contains(c.name())) qs.add(c);
        for (String n : namesB) {
            if (namesA.contains(n) && SunHoursMetric.SUN_HOURS.match(n).isPresent()) qs.add(SunHoursMetric.SUN_HOURS.match(n).get());
        }
        return qs;
    }

    public int matched() { return (int) Arrays.stream(matchOfB).filter(i -> i >= 0).count(); }

    /** B - A per row of B; NaN where unmatched. */
    public double[] delta(double[] valuesA, double[] valuesB) {
        double[] d = new double[matchOfB.length];
        for (int r = 0; r < d.length; r++) d[r] = matchOfB[r] >= 0 ? valuesB[r] - valuesA[matchOfB[r]] : Double.NaN;
        return d;
    }

    /** The difference column of a quantity: {@code delta_<name>}, same unit and decimals, diverging. */
    public static Column delta(Column c) {
        return new Column(DELTA_PREFIX + c.name(), c.unit(), "Change in " + lowerFirst(c.label()) + " (B - A)",
                c.kind().whole() ? 0 : c.decimals(), ColumnKind.DIVERGING,
                "Difference of `" + c.name() + "` between two variants, B - A.", c.cautioned());
    }

    private static String lowerFirst(String s) {
        // "Sky view factor" -> "sky view factor"; keep acronyms such as "PV" or "EN 17037" as they are
        if (s.length() > 1 && Character.isUpperCase(s.charAt(0)) && Character.isLowerCase(s.charAt(1))) {
            return Character.toLowerCase(s.charAt(0)) + s.substring(1);
        }
        return s;
    }
}
