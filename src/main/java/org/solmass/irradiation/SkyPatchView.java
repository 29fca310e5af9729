package org.solmass.irradiation;

import org.solmass.scene.HemisphereSampler;
import org.solmass.sky.SkyPatches;

import java.util.Arrays;

/**
 * What one receiver sees of each sky patch, for a radiance distribution: per patch of
 * {@link SkyPatches} the cosine-weighted share of the unobstructed plane ({@link SkyPatches#cosineShares},
 * exact) and the visible share, that share times the fraction of the receiver's hemisphere rays in
 * the patch that reach the sky (a ratio estimator: Cochran, Sampling Techniques, 3rd ed., 1977,
 * ch. 6). A patch no ray falls in takes the receiver's fraction over all its rays above the horizon.
 * Unobstructed, every fraction is 1 and the receiver gets the distribution's exact value on its
 * plane (an unobstructed horizontal patch: DHI to rounding).
 *
 * <p>Per slot the sky diffuse is then one dot product with the slot's radiance vector
 * ({@link StepTable#skyWh}), {@code max(0, sum_p visible_p skyWh[slot, p])}. Per thread; allocates
 * nothing per receiver.
 */
final class SkyPatchView {
    private final SkyPatches patches;
    private final int np;
    final double[] unobstructed, visible;
    private final int[] rays, seen;

    SkyPatchView(SkyPatches patches) {
        this.patches = patches;
        np = patches.count();
        unobstructed = new double[np];
        visible = new double[np];
        rays = new int[np];
        seen = new int[np];
    }

    /** Fills both share vectors from the receiver's normal and its hemisphere rays (directions and classes). */
    void measure(double nx, double ny, double nz, double[] dir, int[] cls, int n) {
        patches.cosineShares(nx, ny, nz, unobstructed);
        Arrays.fill(rays, 0);
        Arrays.fill(seen, 0);
        int up = 0, sky = 0;
        for (int s = 0; s < n; s++) {
            double dz = dir[3 * s + 2];
            if (dz < 0) continue;
            int p = patches.patchOf(dir[3 * s], dir[3 * s + 1], dz);
            rays[p]++;
            up++;
            if (cls[s] == HemisphereSampler.SKY) {
                seen[p]++;
                sky++;
            }
        }
        double fallback = up > 0 ? (double) sky / up : 0;
        for (int p = 0; p < np; p++) {
            visible[p] = unobstructed[p] * (rays[p] > 0 ? (double) seen[p] / rays[p] : fallback);
        }
    }

    /** Sky diffuse of slot k on these shares, Wh/m2, >= 0. */
    double diffuse(double[] shares, double[] skyWh, int k) {
        int base = k * np;
        double v = 0;
        for (int p = 0; p < np; p++) v += shares[p] * skyWh[base + p];
        return Math.max(0, v);
    }
}
