package org.solmass.irradiation;

import org.solmass.model.Parallel;
import java.util.stream.IntStream;

/**
 * Multi-bounce Lambertian reflection between receivers, month-hour slot by slot, and the sampling
 * standard error of each analysed patch's annual irradiation.
 *
 * <p>Every receiver r (analysed patch, context patch or ground probe) carries a sparse reflector
 * list from its own hemisphere rays: receivers j with weight {@code w_rj = (1/N) sum over the rays
 * that hit j of rho_hit} (the cosine-weighted Monte Carlo estimate of {@code F_rj rho_j}), and a
 * weight {@code g_r} of hits whose irradiance is GHI (unshaded ground, ground outside the probe grid,
 * rays leaving a model without ground plane downward). The irradiance then satisfies the Lambertian
 * exchange (radiosity) equation
 * <pre>  E_r = F_r + g_r GHI + sum_j w_rj E_j</pre>
 * with F_r the first pass (beam + sky diffuse). Its solution is the Neumann series
 * {@code E = sum_k W^k (F + g GHI)} (Howell, Menguc and Siegel, Thermal Radiation Heat Transfer,
 * 6th ed., 2016, ch. 7 for the exchange between diffuse surfaces and ch. 9 for its solution by
 * successive substitution / Monte Carlo), which converges because every row sum of W is at most the
 * largest albedo (below 1). Term k is bounce k:
 * <pre>  D_1 = W F + g GHI,   D_(k+1) = W D_k,   reflected = sum_k D_k</pre>
 * The series stops after the first bounce whose added energy (summed over the analysed patches,
 * all slots) is at most {@code tolerance} times the reflected total so far, or at {@code maxBounces}.
 * With a geometric decay of ratio q the part left out is about q / (1 - q) times the last bounce.
 *
 * <p>Bounce 1 of an analysed patch whose month-hour table is kept is summed slot by slot (the slots
 * that can hold light, {@link FirstPass}: the others are zero for every receiver); every other
 * receiver's bounce 1 and all later bounces month by month (12 values): W is the same for every
 * slot, so the month sums of {@code W D} are W times the month sums of D and monthly and annual
 * results are exact (only the order of the additions differs); only the month-hour table spreads
 * the later bounces over a month's hours in proportion to bounce 1. Memory: besides the first pass
 * ({@code double[total x lit slots]}, about half of 288 for an hourly year) two
 * {@code double[total x 12]} hold the current and the next bounce (the first holds the first pass's
 * month sums during bounce 1), so the peak stays that of the one-bounce pass plus under 10 %
 * ({@link MemoryEstimate}); time: a month-space bounce costs about 1/12 of a slot-by-slot one.
 *
 * <p>Determinism: each receiver's bounce is summed in its list's order into its own slots, and the
 * energy sums run in receiver order after the parallel part, so nothing depends on the thread count.
 */
final class Reflection {
    static final int SLOTS = StepTable.SLOTS;
    /** Default stopping fraction: the last bounce adds at most 0.5 % of the reflected total (our choice). */
    static final double DEFAULT_TOLERANCE = 0.005;
    /** Default largest number of bounces (our choice: at albedo 0.5 in an H/W 2 canyon, 4-6 suffice). */
    static final int DEFAULT_MAX_BOUNCES = 20;

    /**
     * Reflector lists of every receiver.
     *
     * @param idx receivers hit, ascending, per receiver
     * @param w weights {@code (1/N) sum rho} per entry
     * @param w2 {@code (1/N) sum rho^2} per entry, analysed patches only (for the standard error)
     * @param ghiW weight of hits lit by GHI, per receiver
     * @param ghiW2 {@code (1/N) sum rho^2} of those hits, analysed patches only
     * @param rays hemisphere rays N of an analysed patch (its view factors)
     * @param reflectionRays rays of an analysed patch that sample reflected light (its lists and
     *                       {@code ghiW}: the subset of {@link org.solmass.scene.HemisphereSampler#sampleForReflection})
     */
    record Lists(int[][] idx, float[][] w, float[][] w2, float[] ghiW, float[] ghiW2, int rays, int reflectionRays) {
        /** Lists of analysed patches traced with {@code raysPerPatch} requested rays, reflection sampled by {@code reflectorRays} of them. */
        static Lists of(int[][] idx, float[][] w, float[][] w2, float[] ghiW, float[] ghiW2, int raysPerPatch, int reflectorRays) {
            return new Lists(idx, w, w2, ghiW, ghiW2, org.solmass.scene.HemisphereSampler.roundedRayCount(raysPerPatch),
                    org.solmass.scene.HemisphereSampler.reflectionRayCount(raysPerPatch, reflectorRays));
        }
    }

    /**
     * The outcome for the analysed patches.
     *
     * @param reflMonthWh reflected irradiation per month [12][analysed], Wh/m2
     * @param monthHourWh reflected irradiation per analysed patch and slot (patch x 288), Wh/m2; null unless kept
     * @param totalAnnualWh first pass + reflected, annual, of every receiver, Wh/m2
     * @param bounceWh energy added by each bounce used, summed over the analysed patches, Wh/m2
     * @param converged whether the last bounce met the tolerance (false: stopped at the maximum)
     */
    record Outcome(double[][] reflMonthWh, float[] monthHourWh, double[] totalAnnualWh, double[] bounceWh,
                   boolean converged) {
        int bounces() { return bounceWh.length; }
    }

    private Reflection() {}

    static Outcome solve(FirstPass fp, Lists l, int analysed, StepTable st, double tolerance, int maxBounces,
                         boolean keepMonthHour, PhaseProgress progress) {
        int total = l.idx().length, n = analysed, ns = fp.slots();
        double[] firstPass = fp.values;
        int[] live = fp.live, liveMonth = fp.liveMonth;
        double[] cur = new double[total * 12], next = new double[total * 12];
        double[][] reflMonth = new double[12][n];
        double[] firstBounceMonth = keepMonthHour ? new double[n * 12] : null;
        float[] monthHour = keepMonthHour ? new float[n * SLOTS] : null;
        double[] totalAnnual = fp.annual.clone();
        double[] added = new double[total];
        double[] ghiLive = new double[ns], ghiMonth = new double[12];
        for (int i = 0; i < ns; i++) {
            ghiLive[i] = st.ghiWh[live[i]];
            ghiMonth[liveMonth[i]] += ghiLive[i];
        }
        // receivers without a month-hour table take bounce 1 in month space: W acts on every slot alike
        int slotted = keepMonthHour ? n : 0;
        double[] fpMonth = cur; // bounce 1 reads no earlier bounce: cur holds the first pass's month sums meanwhile
        int stride = fp.stride();
        Parallel.forEach(total, r -> {
            int base = r * stride, m0 = r * 12;
            for (int i = 0; i < ns; i++) fpMonth[m0 + liveMonth[i]] += firstPass[base + i];
        });
        int[] slotMonth = new int[SLOTS];
        for (int k = 0; k < SLOTS; k++) slotMonth[k] = org.solmass.climate.MonthHour.month(k) - 1;
        Series series = new Series(maxBounces, tolerance);
        progress.begin("reflection", maxBounces);
        for (int b = 0; b < maxBounces; b++) {
            final double[] src = cur, dst = next;
            if (b == 0) { // bounce 1: slot by slot where the month-hour table needs its profile
                ThreadLocal<SlotBounce> scratch = ThreadLocal.withInitial(() -> new SlotBounce(fp));
                int blocks = (slotted + SlotBounce.BLOCK - 1) / SlotBounce.BLOCK;
                Parallel.forEach(blocks, bk -> {
                    int r0 = bk * SlotBounce.BLOCK, r1 = Math.min(slotted, r0 + SlotBounce.BLOCK);
                    SlotBounce sb = scratch.get();
                    sb.sum(r0, r1, l, fp);
                    double[] acc = sb.acc;
                    for (int r = r0; r < r1; r++) {
                        int m0 = r * 12, a = (r - r0) * stride;
                        double g = l.ghiW()[r];
                        for (int m = 0; m < 12; m++) dst[m0 + m] = 0;
                        for (int k = 0; k < ns; k++) acc[a + k] += g * ghiLive[k];
                        for (int k = 0; k < ns; k++) dst[m0 + liveMonth[k]] += acc[a + k];
                        for (int k = 0; k < ns; k++) monthHour[r * SLOTS + live[k]] = (float) acc[a + k];
                        System.arraycopy(dst, m0, firstBounceMonth, m0, 12);
                        finish(r, n, dst, reflMonth, added, totalAnnual);
                    }
                });
                IntStream.range(slotted, total).parallel().forEach(r -> {
                    monthBounce(r, l, fpMonth, dst);
                    double g = l.ghiW()[r];
                    for (int m = 0; m < 12; m++) dst[r * 12 + m] += g * ghiMonth[m];
                    finish(r, n, dst, reflMonth, added, totalAnnual);
                });
            } else { // later bounces month by month: W acts on every slot alike, so month sums are exact
                Parallel.forEach(total, r -> {
                    monthBounce(r, l, src, dst);
                    finish(r, n, dst, reflMonth, added, totalAnnual);
                });
            }
            boolean stop = series.record(added, n);
            double[] t = cur;
            cur = next;
            next = t;
            progress.advance(series.used);
            if (stop) break;
        }
        if (monthHour != null) laterBouncesIntoSlots(fp, n, reflMonth, firstBounceMonth, monthHour, slotMonth, st);
        return new Outcome(reflMonth, monthHour, totalAnnual, series.bounces(), series.converged);
    }

    /**
     * The same Neumann series in month space only (12 values per receiver), for first passes gathered
     * from the tiles of a city (org.solmass.tiles), where the month-hour table is not an output.
     * Bounce 1 is {@code W F + g GHI} with F and GHI summed per month: W is the same for every slot,
     * so this equals the month sums of {@link #solve}'s slot-wise bounce 1, and monthly and annual
     * results agree with it up to rounding; the stopping rule is the same.
     *
     * @param firstPassMonthWh first pass per receiver and month (receiver x 12), Wh/m2
     * @param ghiMonthWh GHI per month, Wh/m2
     */
    static Outcome solveMonths(double[] firstPassMonthWh, Lists l, int analysed, double[] ghiMonthWh, double tolerance,
                               int maxBounces) {
        int total = l.idx().length, n = analysed;
        double[] cur = firstPassMonthWh.clone(), next = new double[total * 12];
        double[][] reflMonth = new double[12][n];
        double[] totalAnnual = new double[total], added = new double[total];
        for (int r = 0; r < total; r++) {
            double s = 0;
            for (int m = 0; m < 12; m++) s += firstPassMonthWh[r * 12 + m];
            totalAnnual[r] = s;
        }
        Series series = new Series(maxBounces, tolerance);
        for (int b = 0; b < maxBounces; b++) {
            final double[] src = cur, dst = next;
            final boolean first = b == 0;
            Parallel.forEach(total, r -> {
                monthBounce(r, l, src, dst);
                if (first) {
                    double g = l.ghiW()[r];
                    for (int m = 0; m < 12; m++) dst[r * 12 + m] += g * ghiMonthWh[m];
                }
                finish(r, n, dst, reflMonth, added, totalAnnual);
            });
            boolean stop = series.record(added, n);
            double[] t = cur;
            cur = next;
            next = t;
            if (stop) break;
        }
        return new Outcome(reflMonth, null, totalAnnual, series.bounces(), series.converged);
    }

    /**
     * The stopping rule's bookkeeping, shared by both solves: the energy each bounce adds over the
     * analysed patches (summed in receiver order) and whether the last one met the tolerance.
     */
    private static final class Series {
        private final double[] bounceWh;
        private final double tolerance;
        private double reflected;
        int used;
        boolean converged;

        Series(int maxBounces, double tolerance) {
            bounceWh = new double[Math.max(1, maxBounces)];
            this.tolerance = tolerance;
        }

        /** Records the bounce whose per-receiver additions are {@code added}; true when the series may stop. */
        boolean record(double[] added, int analysed) {
            double add = 0;
            for (int r = 0; r < analysed; r++) add += added[r];
            reflected += add;
            bounceWh[used++] = add;
            converged = add <= tolerance * reflected;
            return converged;
        }

        double[] bounces() { return java.util.Arrays.copyOf(bounceWh, used); }
    }

    /**
     * Receiver r's 12 months in {@code dst}: its list's weights times the month sums of {@code src}, in
     * list order (each month's sum starts at 0 and adds one rounded product per term; twelve locals
     * keep the sums in registers).
     */
    private static void monthBounce(int r, Lists l, double[] src, double[] dst) {
        int[] idx = l.idx()[r];
        float[] wt = l.w()[r];
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, s5 = 0, s6 = 0, s7 = 0, s8 = 0, s9 = 0, s10 = 0, s11 = 0;
        for (int i = 0; i < idx.length; i++) {
            int b = idx[i] * 12;
            double wr = wt[i];
            s0 += wr * src[b];
            s1 += wr * src[b + 1];
            s2 += wr * src[b + 2];
            s3 += wr * src[b + 3];
            s4 += wr * src[b + 4];
            s5 += wr * src[b + 5];
            s6 += wr * src[b + 6];
            s7 += wr * src[b + 7];
            s8 += wr * src[b + 8];
            s9 += wr * src[b + 9];
            s10 += wr * src[b + 10];
            s11 += wr * src[b + 11];
        }
        int m0 = r * 12;
        dst[m0] = s0;
        dst[m0 + 1] = s1;
        dst[m0 + 2] = s2;
        dst[m0 + 3] = s3;
        dst[m0 + 4] = s4;
        dst[m0 + 5] = s5;
        dst[m0 + 6] = s6;
        dst[m0 + 7] = s7;
        dst[m0 + 8] = s8;
        dst[m0 + 9] = s9;
        dst[m0 + 10] = s10;
        dst[m0 + 11] = s11;
    }

    private static void finish(int r, int n, double[] dst, double[][] reflMonth, double[] added, double[] totalAnnual) {
        double sum = 0;
        int m0 = r * 12;
        for (int m = 0; m < 12; m++) {
            sum += dst[m0 + m];
            if (r < n) reflMonth[m][r] += dst[m0 + m];
        }
        added[r] = sum;
        totalAnnual[r] += sum;
    }

    /**
     * The month-hour table of the analysed patches: bounce 1 is known per slot; the later bounces'
     * month sums are spread over the month's slots in proportion to bounce 1 (they are its light
     * reflected again), else to the first pass, else to the hours. An approximation of the table
     * only: monthly and annual sums are exact.
     */
    private static void laterBouncesIntoSlots(FirstPass fp, int n, double[][] reflMonth, double[] firstBounceMonth,
                                              float[] monthHour, int[] slotMonth, StepTable st) {
        Parallel.forEach(n, p -> {
            double[] later = new double[12], fpMonth = new double[12], hoursMonth = new double[12];
            for (int m = 0; m < 12; m++) later[m] = reflMonth[m][p] - firstBounceMonth[p * 12 + m];
            int base = p * SLOTS;
            for (int k = 0; k < SLOTS; k++) {
                fpMonth[slotMonth[k]] += fp.slot(p, k);
                hoursMonth[slotMonth[k]] += st.hours[k];
            }
            for (int k = 0; k < SLOTS; k++) {
                int m = slotMonth[k];
                if (!(later[m] > 0)) continue;
                double share = firstBounceMonth[p * 12 + m] > 0 ? monthHour[base + k] / firstBounceMonth[p * 12 + m]
                        : fpMonth[m] > 0 ? fp.slot(p, k) / fpMonth[m]
                        : hoursMonth[m] > 0 ? st.hours[k] / hoursMonth[m] : 0;
                monthHour[base + k] += (float) (later[m] * share);
            }
        });
    }

    /**
     * Standard error of an analysed patch's annual irradiation from its hemisphere rays, Wh/m2.
     * Each ray s is one sample of the hemisphere part of the annual sum, in two parts: {@code X_s},
     * the sky background per unit sky view factor {@code B} when it reaches the sky (0 otherwise),
     * over all N1 rays ({@link Lists#rays}); {@code Y_s}, {@code rho E_j} when it hits receiver j
     * (E_j its annual total after all bounces), {@code rho GHI} for GHI-lit hits, 0 otherwise, over the
     * N2 reflection rays, a subset of the N1 ({@link Lists#reflectionRays}). The estimate is
     * {@code mean(X) + mean(Y)}; since a ray is either sky or a hit, {@code X_s Y_s = 0} and
     * {@code Cov(X, Y) = -E[X] E[Y]}, and with the subset drawn from the same rays
     * {@code Var = Var(X)/N1 + Var(Y)/N2 + 2 Cov(X, Y)/N1}. Each variance is the sample variance
     * {@code N/(N-1) (mean(Z^2) - mean(Z)^2)} (mean(Y^2) from the lists: {@code sum_j w2_j E_j^2}),
     * the covariance term {@code -2 mean(X) mean(Y)/(N1 - 1)}, so that for N1 = N2 this is the
     * variance of the per-ray sum {@code X_s + Y_s} over N rays. This treats the rays as independent:
     * the sampler stratifies them, whose variance is never larger (stratified sampling, e.g. Owen,
     * Monte Carlo theory, methods and examples, 2013, ch. 8), so the value is an upper bound in
     * expectation. Left out: the noise of the E_j themselves (their own rays, independent, weighted
     * by w_j^2) and the nearest-patch discretisation (a bias, not noise). Sun and horizon band rays
     * are a fixed quadrature, without sampling noise.
     */
    static double stdErrorWh(int p, Lists l, double skyShare, double backgroundAnnualWh, double ghiAnnualWh,
                             double[] totalAnnualWh) {
        int n1 = l.rays(), n2 = l.reflectionRays();
        if (n1 < 2 || n2 < 2) return Double.NaN;
        double mx = skyShare * backgroundAnnualWh, sqx = skyShare * backgroundAnnualWh * backgroundAnnualWh;
        double my = l.ghiW()[p] * ghiAnnualWh, sqy = l.ghiW2()[p] * ghiAnnualWh * ghiAnnualWh;
        int[] idx = l.idx()[p];
        float[] w = l.w()[p], w2 = l.w2()[p];
        for (int i = 0; i < idx.length; i++) {
            double e = totalAnnualWh[idx[i]];
            my += w[i] * e;
            sqy += w2[i] * e * e;
        }
        double var = (sqx - mx * mx) / (n1 - 1.0) + (sqy - my * my) / (n2 - 1.0) - 2 * mx * my / (n1 - 1.0);
        return Math.sqrt(Math.max(0, var));
    }

}
