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
 * The shaded sums add the same terms in the same step order as the loop over all steps, so every
 * sum is the same to the last bit.
 *
 * <p>Per thread; allocates nothing after construction.
 */
final class StepTerms {
    private final StepTable st;
    /** Normal of the terms held (float bits), or none yet. */
    private int nxBits, nyBits, nzBits;
    private boolean held;
    /** Steps in front of the plane, in step order: their direction, slot, beam, circumsolar and sunshine terms. */
    private int live;
    private final int[] direction, slot;
    private final double[] beam, circ, sunshine;
    /** Unshaded beam and circumsolar sums per slot of the normal held, once asked for. */
    final double[] beamU = new double[StepTable.SLOTS], circU = new double[StepTable.SLOTS];
    private boolean unshadedHeld;

    StepTerms(StepTable st) {
        this.st = st;
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
                m++;
            }
            live = m;
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
