package org.solmass.irradiation;

import org.solmass.model.Parallel;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.Scene;

import java.io.Serializable;
import java.util.Arrays;
import java.util.stream.IntStream;

/**
 * The pipeline of {@link ShadedIrradiation#run} cut into three stages that can run apart, for city
 * tiles (org.solmass.tiles): every receiver keeps its global id of a {@link ReceiverLayout}, so its
 * ray seed, its reflectors and its result are those of the one-machine run whenever its scene holds
 * every obstruction it would see.
 * <ol>
 * <li>{@link #firstPass}: a subset of receivers against a scene (a tile and its halo): per receiver
 * the first-pass month sums and its reflector list in global ids ({@link FirstPasses});</li>
 * <li>{@link #reflect}: the Neumann series of {@link Reflection} over the first passes gathered from
 * every tile, in month space ({@link Reflection#solveMonths}; the month-hour table is not a city
 * output);</li>
 * <li>{@link #finish}: the analysed patches of one tile with the reflected sums, as the
 * {@link IrradiationResult} {@link ShadedIrradiation#run} would give for them.</li>
 * </ol>
 * The same formulas as {@link ShadedIrradiation} (its javadoc gives their sources); only the
 * reflected light is summed month by month rather than slot by slot, which changes results by
 * rounding alone.
 */
public final class StagedPasses {
    private StagedPasses() {}

    /**
     * Stage 1: the first pass of {@code receivers} (global ids, ascending) against {@code scene}, with
     * inputs from {@link IrradiationSetup#inputs} for that scene. Parallel over receivers; the result
     * does not depend on the thread count.
     */
    public static FirstPasses firstPass(Scene scene, ShadedIrradiation.Inputs in, int[] receivers) {
        int n = in.receivers().analysed;
        FirstPasses out = new FirstPasses(receivers.length, in.canopy() != null);
        org.solmass.scene.KernelWarmup.awaitFor(receivers.length); // compiled ray kernels before the first receiver
        ThreadLocal<ShadedIrradiation.Worker> workers = ThreadLocal.withInitial(() -> new ShadedIrradiation.Worker(scene, in));
        Parallel.forEach(receivers.length, i -> {
            int r = receivers[i];
            ShadedIrradiation.Worker w = workers.get();
            w.firstPass(r, r < n);
            out.ids[i] = r;
            for (int k = 0; k < ShadedIrradiation.SLOTS; k++) out.monthWh[12 * i + org.solmass.climate.MonthHour.month(k) - 1] += w.slotTotal[k];
            out.refIdx[i] = Arrays.copyOf(w.refIdx, w.refCount);
            out.refW[i] = Arrays.copyOf(w.refW, w.refCount);
            out.ghiW[i] = (float) w.ghiAlbedo;
            if (r < n) {
                out.svf[i] = w.vf.sky();
                out.gvf[i] = w.vf.ground();
                out.obs[i] = w.vf.obstruction();
                out.svfSe[i] = w.vf.skyStdError();
                out.horizonVis[i] = w.horizonVis;
                out.overcastPct[i] = w.overcastSkyPct;
                System.arraycopy(w.beamMonth, 0, out.beamMonthWh, 12 * i, 12);
                System.arraycopy(w.diffMonth, 0, out.diffuseMonthWh, 12 * i, 12);
                out.unshadedWh[i] = w.unshadedTotal;
                out.sunshineH[i] = w.sunshineHours;
                out.refW2[i] = Arrays.copyOf(w.refW2, w.refCount);
                out.ghiW2[i] = (float) w.ghiAlbedo2;
                if (out.canopyReflection != null) {
                    float[] f = new float[12];
                    w.canopyReflection(r, f);
                    System.arraycopy(f, 0, out.canopyReflection, 12 * i, 12);
                }
            } else {
                out.refW2[i] = new float[0];
            }
        });
        return out;
    }

    /**
     * What the reflection stage hands to the finish stage ({@link Serializable}).
     *
     * @param reflMonthWh reflected irradiation per analysed patch and month (patch x 12), Wh/m2
     * @param totalAnnualWh first pass + reflected, annual, of every receiver, Wh/m2 (for the standard error)
     * @param bounceWh energy added by each bounce, summed over the analysed patches, Wh/m2
     * @param converged whether the last bounce met the tolerance
     * @param tolerance the stopping fraction used
     * @param maxBounces the largest number of bounces allowed
     */
    public record Reflected(double[] reflMonthWh, double[] totalAnnualWh, double[] bounceWh, boolean converged,
                            double tolerance, int maxBounces) implements Serializable {
        public int bounces() { return bounceWh.length; }

        /** Bytes of its arrays: 12 doubles per analysed patch and one per receiver of the whole layout. */
        public long bytes() { return 8L * (reflMonthWh.length + totalAnnualWh.length + bounceWh.length); }
    }

    /**
     * What the finish stage of one tile needs of the reflection ({@link Serializable}): its size follows
     * the tile (its analysed patches and the receivers their reflector lists read), not the whole
     * layout as {@link Reflected}'s does.
     *
     * @param analysedTotal analysed patches of the whole layout (ids 0 .. analysedTotal - 1)
     * @param ids the tile's analysed patches, global ids, ascending
     * @param reflMonthWh reflected irradiation per entry of {@code ids} and month (entry x 12), Wh/m2
     * @param totalIds receivers whose annual total the tile reads, global ids, ascending: at least every
     *                 reflector of its analysed patches
     * @param totalAnnualWh first pass + reflected, annual, per entry of {@code totalIds}, Wh/m2
     * @param bounceWh energy added by each bounce, summed over every analysed patch of the layout, Wh/m2
     * @param converged whether the last bounce met the tolerance
     * @param tolerance the stopping fraction used
     * @param maxBounces the largest number of bounces allowed
     */
    public record TileReflected(int analysedTotal, int[] ids, double[] reflMonthWh, int[] totalIds, double[] totalAnnualWh,
                                double[] bounceWh, boolean converged, double tolerance, int maxBounces) implements Serializable {
        public int bounces() { return bounceWh.length; }

        /** Bytes of its arrays (what a finish task receives besides its first pass). */
        public long bytes() {
            return 4L * ids.length + 8L * reflMonthWh.length + 4L * totalIds.length + 8L * totalAnnualWh.length + 8L * bounceWh.length;
        }

        /** The part of the whole layout's sums that a tile with this first pass reads. */
        public static TileReflected of(FirstPasses part, Reflected whole) {
            int analysed = whole.reflMonthWh().length / 12;
            int n = part.size();
            double[] refl = new double[12 * n], own = new double[n];
            for (int i = 0; i < n; i++) {
                int id = part.ids[i];
                if (id < analysed) System.arraycopy(whole.reflMonthWh(), 12 * id, refl, 12 * i, 12);
                own[i] = whole.totalAnnualWh()[id];
            }
            int[] read = TileBounces.needed(part);
            double[] got = new double[read.length];
            for (int k = 0; k < read.length; k++) got[k] = whole.totalAnnualWh()[read[k]];
            return of(analysed, part.ids, refl, own, read, got, whole.bounceWh(), whole.converged(), whole.tolerance(),
                    whole.maxBounces());
        }

        /**
         * From a tile's own receivers and the annual totals it received (a distributed run's finish task).
         *
         * @param ownIds the tile's receivers, global ids, ascending
         * @param ownReflMonthWh reflected irradiation per entry of {@code ownIds} and month (entry x 12; read for analysed patches only)
         * @param ownTotalAnnualWh first pass + reflected, annual, per entry of {@code ownIds}
         * @param gotIds receivers of other tiles (or its own) whose totals it received, ascending
         * @param gotTotalAnnualWh their annual totals (a receiver in both lists has the same total in both)
         */
        public static TileReflected of(int analysedTotal, int[] ownIds, double[] ownReflMonthWh, double[] ownTotalAnnualWh,
                                       int[] gotIds, double[] gotTotalAnnualWh, double[] bounceWh, boolean converged,
                                       double tolerance, int maxBounces) {
            int na = 0;
            for (int id : ownIds) if (id < analysedTotal) na++;
            int[] ids = new int[na];
            double[] refl = new double[12 * na];
            for (int i = 0, k = 0; i < ownIds.length; i++) {
                if (ownIds[i] >= analysedTotal) continue;
                ids[k] = ownIds[i];
                System.arraycopy(ownReflMonthWh, 12 * i, refl, 12 * k++, 12);
            }
            int[] tIds = new int[ownIds.length + gotIds.length];
            double[] tWh = new double[tIds.length];
            int a = 0, b = 0, m = 0;
            while (a < ownIds.length || b < gotIds.length) { // merge, ascending; own first on a tie
                boolean own = b == gotIds.length || (a < ownIds.length && ownIds[a] <= gotIds[b]);
                int id = own ? ownIds[a] : gotIds[b];
                double v = own ? ownTotalAnnualWh[a++] : gotTotalAnnualWh[b++];
                if (m > 0 && tIds[m - 1] == id) continue;
                tIds[m] = id;
                tWh[m++] = v;
            }
            return new TileReflected(analysedTotal, ids, refl, Arrays.copyOf(tIds, m), Arrays.copyOf(tWh, m), bounceWh,
                    converged, tolerance, maxBounces);
        }
    }

    /**
     * Stage 2: reflection between all receivers from their gathered first passes ({@code all} holds
     * every receiver of the layout exactly once, {@link FirstPasses#concat}).
     *
     * @param analysed number of analysed patches of the layout (ids 0 .. analysed - 1)
     */
    public static Reflected reflect(FirstPasses all, int analysed, IrradiationSetup.Sun sun, double tolerance, int maxBounces) {
        int total = all.size();
        for (int i = 0; i < total; i++)
            if (all.ids[i] != i) throw new IllegalArgumentException("first passes miss receiver " + i + " (every receiver once, in id order)");
        Reflection.Lists lists = new Reflection.Lists(all.refIdx, all.refW, all.refW2, all.ghiW, all.ghiW2, 0, 0);
        double[] ghiMonth = new double[12];
        StepTable st = sun.steps;
        for (int k = 0; k < ShadedIrradiation.SLOTS; k++) ghiMonth[org.solmass.climate.MonthHour.month(k) - 1] += st.ghiWh[k];
        Reflection.Outcome ro = Reflection.solveMonths(all.monthWh, lists, analysed, ghiMonth, tolerance, maxBounces);
        double[] refl = new double[analysed * 12];
        for (int m = 0; m < 12; m++) for (int p = 0; p < analysed; p++) refl[12 * p + m] = ro.reflMonthWh()[m][p];
        return new Reflected(refl, ro.totalAnnualWh(), ro.bounceWh(), ro.converged(), tolerance, maxBounces);
    }

    /**
     * Stage 3: the results of the analysed patches in {@code part} (entries that are not analysed
     * patches are skipped), in its order, as {@link ShadedIrradiation#run} gives them (no month-hour
     * table).
     *
     * @param raysPerPatch hemisphere rays of an analysed patch (for the standard error)
     * @param reflectorRays the run's reflection rays ({@link ShadedIrradiation.Inputs#reflectorRays()})
     */
    public static IrradiationResult finish(FirstPasses part, Reflected refl, IrradiationSetup.Sun sun, int raysPerPatch,
                                           int reflectorRays) {
        return finish(part, TileReflected.of(part, refl), sun, raysPerPatch, reflectorRays);
    }

    /**
     * Stage 3 with the tile's own part of the reflection ({@link TileReflected}): the same results as
     * with the whole layout's, from arrays the size of the tile.
     */
    public static IrradiationResult finish(FirstPasses part, TileReflected refl, IrradiationSetup.Sun sun, int raysPerPatch,
                                           int reflectorRays) {
        int analysedTotal = refl.analysedTotal();
        int[] rows = IntStream.range(0, part.size()).filter(i -> part.ids[i] < analysedTotal).toArray();
        int n = rows.length;
        StepTable st = sun.steps;
        double background = 0, ghi = 0;
        for (int k = 0; k < ShadedIrradiation.SLOTS; k++) {
            background += st.backgroundWh[k];
            ghi += st.ghiWh[k];
        }
        // one patch's reflector list at a time, its ids as positions in the tile's totals: one set of
        // arrays for every patch (a buffer per list length), no copy of every list
        int[][] idxRow = new int[1][];
        float[][] wRow = new float[1][], w2Row = new float[1][];
        float[] gRow = new float[1], g2Row = new float[1];
        Reflection.Lists row = Reflection.Lists.of(idxRow, wRow, w2Row, gRow, g2Row, raysPerPatch, reflectorRays);
        int[][] byLength = new int[1][];
        double[] svf = new double[n], gvf = new double[n], obs = new double[n], se = new double[n], hv = new double[n];
        double[] overcast = new double[n];
        double[] annual = new double[n], beam = new double[n], diffuse = new double[n], reflected = new double[n];
        double[] unshaded = new double[n], sunshine = new double[n], annualSe = new double[n];
        double[][] monthly = new double[12][n];
        for (int p = 0; p < n; p++) {
            int i = rows[p], id = part.ids[i], r = Arrays.binarySearch(refl.ids(), id);
            if (r < 0) throw new IllegalArgumentException("no reflected sums for patch " + id);
            svf[p] = part.svf[i];
            gvf[p] = part.gvf[i];
            obs[p] = part.obs[i];
            se[p] = part.svfSe[i];
            hv[p] = part.horizonVis[i];
            overcast[p] = part.overcastPct[i];
            double[] bm = new double[12], dm = new double[12], rm = new double[12];
            for (int m = 0; m < 12; m++) {
                rm[m] = refl.reflMonthWh()[12 * r + m];
                if (part.canopyReflection != null) rm[m] *= part.canopyReflection[12 * i + m];
                bm[m] = part.beamMonthWh[12 * i + m];
                dm[m] = part.diffuseMonthWh[12 * i + m];
            }
            ShadedIrradiation.patchTotals(p, bm, dm, rm, monthly, beam, diffuse, reflected, annual);
            int len = part.refIdx[i].length;
            if (len >= byLength.length) byLength = Arrays.copyOf(byLength, Math.max(len + 1, 2 * byLength.length));
            if (byLength[len] == null) byLength[len] = new int[len];
            idxRow[0] = localIds(part.refIdx[i], refl.totalIds(), byLength[len]);
            wRow[0] = part.refW[i];
            w2Row[0] = part.refW2[i];
            gRow[0] = part.ghiW[i];
            g2Row[0] = part.ghiW2[i];
            annualSe[p] = Reflection.stdErrorWh(0, row, svf[p], background, ghi, refl.totalAnnualWh()) / 1000;
            unshaded[p] = part.unshadedWh[i] / 1000;
            sunshine[p] = part.sunshineH[i];
        }
        double[] bounceKwh = new double[refl.bounces()];
        for (int b = 0; b < bounceKwh.length; b++) bounceKwh[b] = refl.bounceWh()[b] / 1000;
        return new IrradiationResult(svf, gvf, obs, se, hv, annual, beam, diffuse, reflected, unshaded, monthly, null,
                sunshine, st.siteSunshineHours, sun.directions.count(), annualSe,
                new IrradiationResult.Bounces(bounceKwh, refl.converged(), refl.tolerance(), refl.maxBounces()), overcast);
    }

    /** Global receiver ids as positions in {@code ids} (ascending), into {@code out} (the same length). */
    private static int[] localIds(int[] global, int[] ids, int[] out) {
        for (int k = 0; k < global.length; k++) {
            out[k] = Arrays.binarySearch(ids, global[k]);
            if (out[k] < 0) throw new IllegalArgumentException("no annual total for receiver " + global[k]);
        }
        return out;
    }
}
