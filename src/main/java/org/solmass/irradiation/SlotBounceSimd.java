package org.solmass.irradiation;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The SIMD kernel of {@link SlotBounce} on the JDK's incubating Vector API (loaded only when the
 * {@code jdk.incubator.vector} module is). A row's kept slots are padded to whole vectors
 * ({@link FirstPass#stride}); each receiver's slots are summed four vectors at a time in registers,
 * the block's receivers one after another for the same four vectors, so their row pieces are read
 * from cache after the first receiver that needs them. Each lane adds {@code w * F} as one rounded
 * product and one rounded sum (no fused multiply-add), term by term in list order: the plain loop's
 * arithmetic, bit for bit.
 */
final class SlotBounceSimd {
    /** The machine's vectors, at most 512 bits, so that 8 doubles (the row padding of {@link FirstPass}) are whole vectors. */
    private static final VectorSpecies<Double> S = DoubleVector.SPECIES_PREFERRED.length() <= FirstPass.PAD
            ? DoubleVector.SPECIES_PREFERRED : DoubleVector.SPECIES_512;

    private SlotBounceSimd() {}

    /** {@code acc[(r - r0) * stride + i] = sum_j w_rj F_j[i]} for r0 <= r < r1 and every slot i of the stride. */
    static void sum(int r0, int r1, Reflection.Lists l, double[] f, int stride, double[] acc) {
        final int v = S.length(), four = 4 * v;
        if (stride % v != 0) throw new IllegalArgumentException("row stride " + stride + " is not a whole number of vectors of " + v);
        DoubleVector zero = DoubleVector.zero(S);
        int k0 = 0;
        for (; k0 + four <= stride; k0 += four) {
            for (int r = r0; r < r1; r++) {
                int[] idx = l.idx()[r];
                float[] w = l.w()[r];
                DoubleVector a0 = zero, a1 = zero, a2 = zero, a3 = zero;
                for (int i = 0; i < idx.length; i++) {
                    int b = idx[i] * stride + k0;
                    DoubleVector wr = DoubleVector.broadcast(S, (double) w[i]);
                    a0 = a0.add(DoubleVector.fromArray(S, f, b).mul(wr));
                    a1 = a1.add(DoubleVector.fromArray(S, f, b + v).mul(wr));
                    a2 = a2.add(DoubleVector.fromArray(S, f, b + 2 * v).mul(wr));
                    a3 = a3.add(DoubleVector.fromArray(S, f, b + 3 * v).mul(wr));
                }
                int o = (r - r0) * stride + k0;
                a0.intoArray(acc, o);
                a1.intoArray(acc, o + v);
                a2.intoArray(acc, o + 2 * v);
                a3.intoArray(acc, o + 3 * v);
            }
        }
        for (; k0 < stride; k0 += v) { // the last slots, one vector at a time
            for (int r = r0; r < r1; r++) {
                int[] idx = l.idx()[r];
                float[] w = l.w()[r];
                DoubleVector a0 = zero;
                for (int i = 0; i < idx.length; i++) {
                    a0 = a0.add(DoubleVector.fromArray(S, f, idx[i] * stride + k0).mul(DoubleVector.broadcast(S, (double) w[i])));
                }
                a0.intoArray(acc, (r - r0) * stride + k0);
            }
        }
    }
}
