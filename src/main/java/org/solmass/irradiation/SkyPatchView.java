package org.solmass.irradiation;

import org.solmass.scene.BundleTracer;
import org.solmass.scene.HemisphereSampler;
import org.solmass.sky.SkyPatches;

import java.util.Arrays;

/**
 * What one receiver sees of each sky patch, for a radiance distribution: per patch of
 * {@link SkyPatches} the cosine-weighted share of the unobstructed plane ({@link SkyPatches#cosineShares},
 * exact) and the visible share, that share times the fraction of the receiver's hemisphere rays in
 * the patch that reach the sky (a ratio estimator: Cochran, Sampling Techniques, 3rd ed., 1977,
 * ch. 6). A patch in front of the receiver that none of its rays falls in (a patch seen at a grazing
 * angle, with an expected count below one ray) gets one ray of its own, toward its most heavily
 * weighted cell ({@link SkyPatches#frontDirection}); taking the receiver's overall sky fraction
 * instead underestimated a canyon floor's sky by 6 % (the grazing patches along the canyon axis are
 * open while most of its sky is not; measured in {@code SkyDistributionPipelineTest}).
 * Unobstructed, every fraction is 1 and the receiver gets the distribution's exact value on its
 * plane (an unobstructed horizontal patch: DHI to rounding).
 *
 * <p>Per slot the sky diffuse is then {@code max(0, sum_p visible_p skyWh[p, slot])} with the slot's
 * radiance vector ({@link StepTable#skyWh}), summed for all slots at once ({@link #slotSums}). Per
 * thread; allocates nothing per receiver.
 */
final class SkyPatchView {
    private final SkyPatches patches;
    private final int np;
    final double[] unobstructed, visible;
    private final int[] rays, seen, extraPatch;
    private final double[] extraDir;
    private final boolean[] extraBlocked;
    private final BundleTracer bundle;
    /** Sky patch of each hemisphere ray of the current receiver, -1 below the horizon. */
    private int[] rayPatch = new int[0];
    /** Patches in front that got a ray of their own ({@code extraPatch[0 .. extraCount - 1]}). */
    private int extraCount;
    /** Per month (0 = January): the visible shares through the tree crowns ({@link #throughCrowns}). */
    final double[][] visibleMonth;
    /** The normal {@link #unobstructed} was last filled for (bits of x, y, z), and whether it is set. */
    private long cachedNx, cachedNy, cachedNz;
    private boolean cachedShares;
    /** The normal and radiance table the last {@link #unobstructedSlotSums} output belongs to. */
    private long sumsNx, sumsNy, sumsNz;
    private double[] sumsTable, sumsOut;
    /** Slot ranges {@code [k0, k1)} where some patch of the radiance table is not zero (pairs), and their table. */
    private int[] lightRanges;
    private double[] rangesTable;

    SkyPatchView(SkyPatches patches, BundleTracer bundle) {
        this.patches = patches;
        this.bundle = bundle;
        np = patches.count();
        unobstructed = new double[np];
        visible = new double[np];
        rays = new int[np];
        seen = new int[np];
        extraPatch = new int[np];
        extraDir = new double[3 * np];
        extraBlocked = new boolean[np];
        visibleMonth = new double[12][np];
    }

    /**
     * Fills both share vectors from the receiver's ray origin and normal and its hemisphere rays
     * (directions and classes), tracing one ray into each patch in front that no ray reached.
     */
    void measure(double ox, double oy, double oz, double nx, double ny, double nz, double[] dir, int[] cls, int n) {
        long bx = Double.doubleToRawLongBits(nx), by = Double.doubleToRawLongBits(ny), bz = Double.doubleToRawLongBits(nz);
        if (!cachedShares || bx != cachedNx || by != cachedNy || bz != cachedNz) { // a function of the normal alone
            patches.cosineShares(nx, ny, nz, unobstructed);
            cachedNx = bx;
            cachedNy = by;
            cachedNz = bz;
            cachedShares = true;
        }
        Arrays.fill(rays, 0);
        Arrays.fill(seen, 0);
        if (rayPatch.length < n) rayPatch = new int[n];
        for (int s = 0; s < n; s++) {
            double dz = dir[3 * s + 2];
            rayPatch[s] = -1;
            if (dz < 0) continue;
            int p = patches.patchOf(dir[3 * s], dir[3 * s + 1], dz);
            rayPatch[s] = p;
            rays[p]++;
            if (cls[s] == HemisphereSampler.SKY) seen[p]++;
        }
        int m = 0;
        for (int p = 0; p < np; p++) {
            if (rays[p] == 0 && unobstructed[p] > 0 && patches.frontDirection(p, nx, ny, nz, extraDir, m)) extraPatch[m++] = p;
        }
        extraCount = m;
        if (m > 0) {
            bundle.occluded(ox, oy, oz, extraDir, null, m, extraBlocked);
            for (int i = 0; i < m; i++) {
                rays[extraPatch[i]] = 1;
                seen[extraPatch[i]] = extraBlocked[i] ? 0 : 1;
            }
        }
        for (int p = 0; p < np; p++) {
            visible[p] = rays[p] > 0 ? unobstructed[p] * seen[p] / rays[p] : 0;
        }
    }

    /**
     * Per month, the visible shares seen through tree crowns (docs/method.md, "Vegetation"):
     * {@code visibleMonth[m][p] = unobstructed[p] (sum over the patch's rays that reach the sky of
     * t_m^k) / rays[p]}, {@code k} the crowns a ray crosses, the same per-crossing transmittance the
     * isotropic sky view factor gets ({@link CanopyShading}). Call after {@link #measure} and after
     * the probe's {@code sky} for the same receiver and rays (it reads their crossings); a patch's
     * own extra ray is counted here. With {@code t_m = 1} every share equals {@link #visible}.
     */
    void throughCrowns(CanopyShading.Probe crowns, double ox, double oy, double oz, int[] cls, int n) {
        for (double[] v : visibleMonth) Arrays.fill(v, 0);
        for (int s = 0; s < n; s++) {
            int p = rayPatch[s];
            if (p < 0 || cls[s] != HemisphereSampler.SKY) continue;
            int k = crowns.skyCrossings[s];
            for (int m = 0; m < 12; m++) visibleMonth[m][p] += crowns.factor(m, k);
        }
        for (int i = 0; i < extraCount; i++) {
            if (extraBlocked[i]) continue;
            int p = extraPatch[i];
            int k = crowns.crossings(ox, oy, oz, extraDir[3 * i], extraDir[3 * i + 1], extraDir[3 * i + 2]);
            for (int m = 0; m < 12; m++) visibleMonth[m][p] += crowns.factor(m, k);
        }
        for (int p = 0; p < np; p++) { // in measure's order of operations: with t = 1 exactly its visible shares
            for (int m = 0; m < 12; m++) visibleMonth[m][p] = rays[p] > 0 ? unobstructed[p] * visibleMonth[m][p] / rays[p] : 0;
        }
    }

    /**
     * As {@link #slotSums} on the month's shares through the crowns ({@link #visibleMonth}): each
     * slot summed with the shares of its own month.
     */
    void slotSumsThroughCrowns(double[] skyWh, double[] out) {
        int slots = out.length, hours = slots / 12;
        Arrays.fill(out, 0);
        for (int m = 0; m < 12; m++) {
            double[] shares = visibleMonth[m];
            int k0 = m * hours, k1 = k0 + hours; // the slots of month m (MonthHour.index)
            for (int p = 0; p < np; p++) {
                double w = shares[p];
                if (w == 0) continue;
                int base = p * slots;
                for (int k = k0; k < k1; k++) out[k] += w * skyWh[base + k];
            }
        }
    }

    /**
     * Sky diffuse of every slot on these shares into {@code out} (Wh/m2, not yet clamped):
     * {@code out[k] = sum_p shares[p] skyWh[p, k]}, patch by patch (an axpy over the slots the JIT
     * vectorises; patches with share 0 skipped).
     */
    void slotSums(double[] shares, double[] skyWh, double[] out) {
        int slots = out.length;
        int[] ranges = lightRanges(skyWh, slots);
        Arrays.fill(out, 0);
        for (int p = 0; p < np; p++) {
            double w = shares[p];
            if (w == 0) continue;
            int base = p * slots;
            for (int r = 0; r < ranges.length; r += 2) { // slots outside the ranges add w * 0 to 0: skipped
                for (int k = ranges[r]; k < ranges[r + 1]; k++) out[k] += w * skyWh[base + k];
            }
        }
    }

    /**
     * {@link #slotSums} of the {@link #unobstructed} shares of the normal last {@link #measure}d
     * ({@code nx, ny, nz}): they depend on the normal alone, so the sums are kept for the next receiver
     * with the same normal and table (every face of a surface, every ground probe) instead of redone.
     */
    void unobstructedSlotSums(double nx, double ny, double nz, double[] skyWh, double[] out) {
        long bx = Double.doubleToRawLongBits(nx), by = Double.doubleToRawLongBits(ny), bz = Double.doubleToRawLongBits(nz);
        if (out == sumsOut && skyWh == sumsTable && bx == sumsNx && by == sumsNy && bz == sumsNz) return;
        slotSums(unobstructed, skyWh, out);
        sumsOut = out;
        sumsTable = skyWh;
        sumsNx = bx;
        sumsNy = by;
        sumsNz = bz;
    }

    /** Runs of slots where some patch's radiance is not zero (night slots are zero for every patch). */
    private int[] lightRanges(double[] skyWh, int slots) {
        if (skyWh == rangesTable) return lightRanges;
        boolean[] lit = new boolean[slots];
        for (int p = 0; p < np; p++) {
            for (int k = 0; k < slots; k++) if (skyWh[p * slots + k] != 0) lit[k] = true;
        }
        int[] r = new int[slots + 1];
        int n = 0;
        for (int k = 0; k < slots; k++) {
            if (lit[k] && (k == 0 || !lit[k - 1])) r[n++] = k;
            if (lit[k] && (k == slots - 1 || !lit[k + 1])) r[n++] = k + 1;
        }
        lightRanges = Arrays.copyOf(r, n);
        rangesTable = skyWh;
        return lightRanges;
    }
}
