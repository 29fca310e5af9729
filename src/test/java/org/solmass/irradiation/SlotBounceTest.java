package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.scene.BundleTracer;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Bounce 1 of {@link SlotBounce} against the plain loop (each receiver's list row by row, one
 * product and one sum per term). IEEE 754 rounds each product and each sum exactly once, so the
 * same operations in the same order give the same double (IEEE Std 754-2019, clause 4.3: every
 * operation is computed as if exactly and then rounded): the blocked kernels must match bit for bit,
 * not within a tolerance.
 */
class SlotBounceTest {
    /** A first pass with random values (some exactly 0, some negative zero) and random reflector lists. */
    private static Object[] random(long seed, int receivers, int kept, boolean ascending) {
        Random rnd = new Random(seed);
        boolean[] lit = new boolean[FirstPass.SLOTS];
        for (int k = 0; k < kept; k++) lit[(k * 7 + 3) % FirstPass.SLOTS] = true; // 7 and 288 are coprime: distinct slots
        FirstPass fp = new FirstPass(receivers, lit);
        int stride = fp.stride();
        for (int r = 0; r < receivers; r++) {
            for (int i = 0; i < kept; i++) {
                double u = rnd.nextDouble();
                fp.values[r * stride + i] = u < 0.1 ? 0 : u < 0.12 ? -0.0 : u * 1e3 * Math.exp(rnd.nextGaussian());
            }
        }
        int[][] idx = new int[receivers][];
        float[][] w = new float[receivers][];
        for (int r = 0; r < receivers; r++) {
            int len = rnd.nextInt(40);
            idx[r] = rnd.ints(len, 0, receivers).distinct().toArray();
            if (ascending) java.util.Arrays.sort(idx[r]);
            w[r] = new float[idx[r].length];
            for (int i = 0; i < w[r].length; i++) w[r][i] = (float) (rnd.nextDouble() * 0.05);
        }
        Reflection.Lists l = new Reflection.Lists(idx, w, null, new float[receivers], null, 0, 0);
        return new Object[] {fp, l};
    }

    /** The plain loop: receiver r's kept slot i, its list in order. */
    private static double plain(FirstPass fp, Reflection.Lists l, int r, int i) {
        double s = 0;
        for (int t = 0; t < l.idx()[r].length; t++) s += (double) l.w()[r][t] * fp.values[l.idx()[r][t] * fp.stride() + i];
        return s;
    }

    private static void checkKernel(boolean simd) {
        for (int kept : new int[] {1, 7, 8, 31, 33, 166, 288}) {
            for (boolean ascending : new boolean[] {true, false}) {
                int receivers = 300;
                Object[] in = random(kept * 31L + (ascending ? 1 : 0), receivers, kept, ascending);
                FirstPass fp = (FirstPass) in[0];
                Reflection.Lists l = (Reflection.Lists) in[1];
                SlotBounce sb = new SlotBounce(fp, simd);
                for (int r0 = 0; r0 < receivers; r0 += SlotBounce.BLOCK) {
                    int r1 = Math.min(receivers, r0 + SlotBounce.BLOCK);
                    sb.sum(r0, r1, l, fp);
                    for (int r = r0; r < r1; r++) {
                        for (int i = 0; i < kept; i++) {
                            double want = plain(fp, l, r, i), got = sb.acc[(r - r0) * fp.stride() + i];
                            assertEquals(Double.doubleToRawLongBits(want), Double.doubleToRawLongBits(got),
                                    "kept " + kept + ", receiver " + r + ", slot " + i + ": " + got + " vs " + want);
                        }
                    }
                }
            }
        }
    }

    @Test
    void simdBlockedBounceEqualsThePlainLoopBitForBit() {
        assertTrue(BundleTracer.SIMD_AVAILABLE, "the tests run with --add-modules jdk.incubator.vector (pom.xml)");
        checkKernel(true);
    }

    @Test
    void scalarBounceEqualsThePlainLoopBitForBit() {
        checkKernel(false);
    }

    @Test
    void rowsArePaddedToWholeVectorsWithZeros() {
        for (int kept = 0; kept <= 288; kept++) {
            int len = FirstPass.rowLength(kept);
            assertTrue(len >= kept && len - kept < FirstPass.PAD && len % FirstPass.PAD == 0, "kept " + kept + " -> " + len);
        }
    }
}
