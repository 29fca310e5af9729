package org.solmass.irradiation;

import org.solmass.scene.BundleTracer;

/**
 * Bounce 1 slot by slot, {@code sum_j w_rj F_j[i]} over receiver r's reflector list for every kept
 * slot i ({@link FirstPass}), for a block of consecutive receivers at a time (one worker thread's
 * scratch).
 *
 * <p>Why blocks: a first-pass row holds the ~half of 288 slots that can hold light (about 1.3 kB),
 * an analysed patch's list names about 300 reflectors, and rows taken receiver by receiver come
 * from anywhere in an array of hundreds of MB, so the plain loop (each row whole into a sum array)
 * waits on memory and on its stores. Neighbouring patches of one surface see mostly the same
 * reflectors: a block of {@link #BLOCK} consecutive receivers names each distinct reflector about
 * 10 times. With the SIMD kernel ({@link SlotBounceSimd}, on request: {@link #SIMD_BY_DEFAULT}) the block is
 * summed a few slots at a time (32 with 512-bit vectors): the block's row pieces of those slots
 * (about 1 MB) stay in the core's cache across its receivers, and each receiver's sums stay in
 * vector registers while its list is walked, so nothing is stored per term. Otherwise (the
 * default) each receiver's list is walked row by row as before.
 *
 * <p>Exactness: in every kernel each slot's sum starts at 0 and adds the terms in list order, one
 * product rounded then one sum rounded per term, as the plain loop does: every slot sum is the same
 * double, bit for bit, whatever the kernel, block size or thread count.
 */
final class SlotBounce {
    /** Receivers per block (our choice: about 4,000 distinct reflectors x 256 bytes stay in a 2 MB L2 cache). */
    static final int BLOCK = 128;

    private final int stride;
    private final boolean simd;
    /** Sums of the block's receivers, receiver (r - r0) kept slot i at {@code (r - r0) * stride + i}. */
    final double[] acc;
    /** One receiver's sums in the scalar kernel. */
    private final double[] row;

    /** Scratch for rows of {@code fp}'s layout; the SIMD kernel when {@code simd} ({@link BundleTracer#SIMD_AVAILABLE} must hold). */
    SlotBounce(FirstPass fp, boolean simd) {
        if (simd && !BundleTracer.SIMD_AVAILABLE) throw new IllegalStateException("the jdk.incubator.vector module is not loaded");
        stride = fp.stride();
        this.simd = simd;
        acc = new double[BLOCK * stride];
        row = new double[stride];
    }

    /**
     * Whether bounce 1 uses the SIMD kernel: only on request ({@code -Dsolmass.slotSimd=true}) with the
     * vector module loaded. Measured in the pipeline (bench-analysis --patches 30000, load 9-12 on 2
     * cores) it took 2.0 s wall / 2.35 s CPU against the scalar loop's 1.6 s / 1.6 s: a single run
     * pays for the Vector API code before C2 has compiled it, which outweighs the gain seen warm
     * (CPU 2.3-3.3 s against 4.9-5.4 s at 113,467 patches in one JVM). Off until shown faster cold.
     */
    static final boolean SIMD_BY_DEFAULT = BundleTracer.SIMD_AVAILABLE && Boolean.getBoolean("solmass.slotSimd");

    /** Scratch with the kernel chosen by {@link #SIMD_BY_DEFAULT}. */
    SlotBounce(FirstPass fp) {
        this(fp, SIMD_BY_DEFAULT);
    }

    /**
     * Fills {@link #acc} with bounce 1 of receivers r0 (inclusive) to r1 (exclusive, at most
     * {@link #BLOCK} of them) before the GHI term: {@code acc[(r - r0) * stride + i] = sum_j w_rj F_j[i]}
     * over the kept slots i (and 0 in the row's padding), each sum in list order.
     */
    void sum(int r0, int r1, Reflection.Lists l, FirstPass fp) {
        if (r1 - r0 > BLOCK) throw new IllegalArgumentException("block of " + (r1 - r0) + " receivers");
        if (simd) {
            SlotBounceSimd.sum(r0, r1, l, fp.values, stride, acc);
            return;
        }
        double[] f = fp.values; // the plain loop into one row, as C2 compiles it best, then into the block
        for (int r = r0; r < r1; r++) {
            java.util.Arrays.fill(row, 0);
            int[] idx = l.idx()[r];
            float[] w = l.w()[r];
            for (int i = 0; i < idx.length; i++) {
                int base = idx[i] * stride;
                double wr = w[i];
                for (int k = 0; k < stride; k++) row[k] += wr * f[base + k];
            }
            System.arraycopy(row, 0, acc, (r - r0) * stride, stride);
        }
    }
}
