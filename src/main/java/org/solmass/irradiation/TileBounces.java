package org.solmass.irradiation;

import java.util.function.IntConsumer;
import java.util.function.IntUnaryOperator;

/**
 * The reflection stage of a city run cut at tile boundaries, for a runner that keeps each tile's
 * first passes where they were computed and exchanges only the values a tile's reflector lists name
 * (the Spark runner, src/spark/java). The same Neumann series as {@link Reflection#solveMonths} (its javadoc gives
 * the source), term by term in month space:
 * <pre>  D_1 = W F + g GHI,   D_(k+1) = W D_k</pre>
 * with each receiver's row of W its reflector list in list order. One call of {@link #bounce} gives
 * one tile's rows of one term; {@link #accumulate} adds it to the tile's running sums exactly as
 * {@code Reflection.finish} does, so a receiver's reflected months and annual total are those of
 * {@link StagedPasses#reflect} to the last bit (only the energy sum of the stopping rule is added up
 * tile by tile, which changes it by rounding alone).
 */
public final class TileBounces {
    private TileBounces() {}

    /** GHI per month (0 = January), Wh/m2, summed over the month-hour slots in slot order. */
    public static double[] ghiMonthWh(IrradiationSetup.Sun sun) {
        double[] g = new double[12];
        StepTable st = sun.steps;
        for (int k = 0; k < ShadedIrradiation.SLOTS; k++) g[org.solmass.climate.MonthHour.month(k) - 1] += st.ghiWh[k];
        return g;
    }

    /** The global ids the part's reflector lists name, ascending, each once: the totals a tile's finish reads. */
    public static int[] needed(FirstPasses part) {
        int n = 0;
        for (int[] l : part.refIdx) n += l.length;
        int[] all = new int[n];
        int k = 0;
        for (int[] l : part.refIdx) {
            System.arraycopy(l, 0, all, k, l.length);
            k += l.length;
        }
        java.util.Arrays.sort(all);
        int m = 0;
        for (int i = 0; i < all.length; i++) if (m == 0 || all[i] != all[m - 1]) all[m++] = all[i];
        return java.util.Arrays.copyOf(all, m);
    }

    /** Calls {@code use} with each global id the part's reflector lists name, receivers in entry order, each list in order (repeats included). */
    public static void forEachReflector(FirstPasses part, IntConsumer use) {
        for (int[] l : part.refIdx) for (int j : l) use.accept(j);
    }

    /** The part's first pass months (entry x 12), Wh/m2: the source of bounce 1. */
    public static double[] firstPassMonths(FirstPasses part) {
        return part.monthWh.clone();
    }

    /** Each entry's annual first pass, summed in month order (the start of the annual totals). */
    public static double[] firstPassAnnual(FirstPasses part) {
        double[] t = new double[part.size()];
        for (int i = 0; i < t.length; i++) {
            double s = 0;
            for (int m = 0; m < 12; m++) s += part.monthWh[12 * i + m];
            t[i] = s;
        }
        return t;
    }

    /**
     * The part's reflector lists as slots of a flat source array: {@code slotOf} of each list entry's
     * global id, receivers in entry order, each list in list order (what {@link #bounce} reads).
     */
    public static int[] slots(FirstPasses part, IntUnaryOperator slotOf) {
        int n = 0;
        for (int[] l : part.refIdx) n += l.length;
        int[] slots = new int[n];
        int k = 0;
        for (int[] l : part.refIdx) for (int j : l) slots[k++] = slotOf.applyAsInt(j);
        return slots;
    }

    /**
     * One term of the series for the part's receivers (entry x 12), Wh/m2.
     *
     * @param slots {@link #slots}: where each reflector-list entry's values lie in {@code source}
     * @param source the previous term (the first pass for bounce 1), 12 months per slot starting at
     *               {@code 12 * slot}, Wh/m2
     * @param first whether this is bounce 1 (adds {@code g GHI})
     * @param ghiMonthWh {@link #ghiMonthWh}
     */
    public static double[] bounce(FirstPasses part, int[] slots, double[] source, boolean first, double[] ghiMonthWh) {
        int n = part.size();
        double[] dst = new double[12 * n];
        int k = 0;
        for (int r = 0; r < n; r++) {
            float[] wt = part.refW[r];
            int len = part.refIdx[r].length, m0 = r * 12;
            double g = first ? part.ghiW[r] : 0;
            for (int i = 0; i < len; i++, k++) {
                int base = 12 * slots[k];
                double wr = wt[i];
                for (int m = 0; m < 12; m++) dst[m0 + m] += wr * source[base + m];
            }
            if (first) for (int m = 0; m < 12; m++) dst[m0 + m] += g * ghiMonthWh[m];
        }
        return dst;
    }

    /**
     * Adds one term to a tile's running sums, as {@code Reflection.finish} does.
     *
     * @param analysedTotal analysed patches of the whole layout (ids below it are analysed)
     * @param reflMonth reflected months so far (entry x 12), updated
     * @param totalAnnual first pass + reflected so far per entry, updated
     * @return the term's energy over the part's analysed patches (their annual sums added in entry order)
     */
    public static double accumulate(FirstPasses part, double[] term, int analysedTotal, double[] reflMonth, double[] totalAnnual) {
        double added = 0;
        for (int r = 0; r < part.size(); r++) {
            double sum = 0;
            int m0 = r * 12;
            boolean analysed = part.ids[r] < analysedTotal;
            for (int m = 0; m < 12; m++) {
                sum += term[m0 + m];
                if (analysed) reflMonth[m0 + m] += term[m0 + m];
            }
            totalAnnual[r] += sum;
            if (analysed) added += sum;
        }
        return added;
    }
}
