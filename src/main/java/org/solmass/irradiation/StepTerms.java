package org.solmass.irradiation;

import org.solmass.sky.SkyModel;

import java.util.Arrays;

/**
 * The step terms of a receiver's beam and circumsolar sums that depend on its normal only, kept for
 * the next receiver with the same normal ({@link ShadedIrradiation}'s step loop without tree crowns).
 *
 * <p>For a normal, each sun-up step in front of the plane ({@code cos(incidence) > 0}) gives the
 * beam {@code DNI wh cos(incidence)} and the circumsolar part {@code DHI F1 wh a/b} of its slot,
 * whatever the receiver sees; only the sun's visibility differs between receivers. Neighbouring
 * receivers, computed one after the other, mostly lie on one face (and all ground probes face up),
 * so the terms and the unshaded slot sums are worked out once per face instead of once per receiver.
 *
 * <p>Steps that share a sun direction and a slot are shaded or lit together (the same occlusion
 * ray stands for them), so their terms are added up once per face into one term per (direction,
 * slot) pair, in step order: with binned sun directions a year's steps at one hour of one month
 * fall into a few sky cells (the sun moves about 0.4 degrees a day at a given hour), so a face keeps
 * about a fifth as many terms as steps (a clear-sky year at 51 N in 4,096 cells: a roof 4,811 steps
 * in front, 875 pairs; a south facade 3,795 and 715; an east facade 2,322 and 429), and each receiver's loop is that much shorter. The shaded
 * sums then add the pairs' sums instead of the single terms: the same sums up to rounding (all
 * terms are at or above zero, so the relative difference stays below the term count times the
 * double precision unit; tested against the loop over every step).
 *
 * <p>Per thread; allocates nothing after construction.
 */
final class StepTerms {
    private final StepTable st;
    /** Normal of the terms held (float bits), or none yet. */
    private int nxBits, nyBits, nzBits;
    private boolean held;
    /** Terms of the steps in front of the plane, one per (direction, slot) pair: direction, slot, beam, circumsolar, sunshine hours. */
    private int live;
    private final int[] direction, slot;
    private final double[] beam, circ, sunshine;
    /** Unshaded beam and circumsolar sums per slot of the normal held, once asked for. */
    final double[] beamU = new double[StepTable.SLOTS], circU = new double[StepTable.SLOTS];
    private boolean unshadedHeld;

    /** Scratch: (direction x slots + slot) << 32 | term index, for grouping the terms of one normal. */
    private final long[] keys;
    /** Scratch: the terms in key order. */
    private final int[] sDir, sSlot;
    private final double[] sBeam, sCirc, sSun;

    StepTerms(StepTable st) {
        this.st = st;
        keys = new long[st.count];
        sDir = new int[st.count];
        sSlot = new int[st.count];
        sBeam = new double[st.count];
        sCirc = new double[st.count];
        sSun = new double[st.count];
        direction = new int[st.count];
        slot = new int[st.count];
        beam = new double[st.count];
        circ = new double[st.count];
        sunshine = new double[st.count];
    }

    /** Makes the terms those of the plane with normal (fnx, fny, fnz); with {@code unshaded} also {@link #beamU} and {@link #circU}. */
    void normal(float fnx, float fny, float fnz, boolean unshaded) {
        int bx = Float.floatToRawIntBits(fnx), by = Float.floatToRawIntBits(fny), bz = Float.floatToRawIntBits(fnz);
        if (!held || bx != nxBits || by != nyBits || bz != nzBits) {
            nxBits = bx;
            nyBits = by;
            nzBits = bz;
            held = true;
            unshadedHeld = false;
            int m = 0;
            for (int s = 0; s < st.count; s++) {
                double c = fnx * st.sx[s] + fny * st.sy[s] + fnz * st.sz[s];
                if (c <= 0) continue;
                direction[m] = st.direction[s];
                slot[m] = st.slot[s];
                beam[m] = st.beamWh[s] * c;
                circ[m] = st.circumsolarWh[s] * SkyModel.circumsolarRatio(c, st.cosZenith[s]);
                sunshine[m] = st.sunshineHours[s];
                keys[m] = ((long) direction[m] * StepTable.SLOTS + slot[m]) << 32 | m;
                m++;
            }
            live = merge(m);
        }
        if (unshaded && !unshadedHeld) {
            Arrays.fill(beamU, 0);
            Arrays.fill(circU, 0);
            for (int i = 0; i < live; i++) {
                beamU[slot[i]] += beam[i];
                circU[slot[i]] += circ[i];
            }
            unshadedHeld = true;
        }
    }

    /**
     * Adds up the first {@code m} terms (step order) per (direction, slot) pair, each pair's terms in
     * step order, into one term per pair (ordered by direction, then slot); returns the pairs' count.
     */
    private int merge(int m) {
        Arrays.sort(keys, 0, m);
        // copy the terms out in key order first: a pair is written at its rank, which may lie past
        // terms that are still to be read at their step-order positions
        for (int q = 0; q < m; q++) {
            int i = (int) keys[q];
            sDir[q] = direction[i];
            sSlot[q] = slot[i];
            sBeam[q] = beam[i];
            sCirc[q] = circ[i];
            sSun[q] = sunshine[i];
        }
        int g = -1;
        long prev = -1;
        for (int q = 0; q < m; q++) {
            long pair = keys[q] >>> 32;
            if (pair != prev) {
                prev = pair;
                g++;
                direction[g] = sDir[q];
                slot[g] = sSlot[q];
                beam[g] = sBeam[q];
                circ[g] = sCirc[q];
                sunshine[g] = sSun[q];
            } else {
                beam[g] += sBeam[q];
                circ[g] += sCirc[q];
                sunshine[g] += sSun[q];
            }
        }
        return g + 1;
    }

    /**
     * Adds the terms of the steps whose sun direction is visible ({@code vis[direction] != 0}) into
     * the slot sums (zeroed first); returns the sunshine hours of those steps.
     */
    double shaded(byte[] vis, double[] beamSlot, double[] circSlot) {
        Arrays.fill(beamSlot, 0);
        Arrays.fill(circSlot, 0);
        double sun = 0;
        for (int i = 0; i < live; i++) {
            if (vis[direction[i]] == 0) continue;
            int k = slot[i];
            sun += sunshine[i];
            beamSlot[k] += beam[i];
            circSlot[k] += circ[i];
        }
        return sun;
    }
}
