package org.solmass.irradiation;

import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * A receiver's reflector list is the definition in {@link ReflectorGroups}' javadoc: the hits' keys
 * (reflector, albedo bits) sorted, each run of equal reflectors summed in key order. Checked against
 * that definition computed with the JDK's sort ({@link Arrays#sort(long[])}, a general-purpose
 * library) on random hits: few and many distinct reflectors (the comparison and the radix sort),
 * receiver indices up to 300,000 (three radix passes), one albedo per reflector and mixed albedos.
 */
class ReflectorGroupsTest {

    /** The definition: sort the keys, sum each reflector's run in key order. */
    private static int byDefinition(int[] rec, float[] rho, int n, int rays, int[] idx, float[] w, float[] w2) {
        long[] key = new long[n];
        for (int i = 0; i < n; i++) key[i] = ((long) rec[i] << 32) | Float.floatToRawIntBits(rho[i]);
        Arrays.sort(key);
        double inv = 1.0 / rays;
        int m = 0;
        for (int i = 0; i < n; ) {
            int r = (int) (key[i] >>> 32);
            double a = 0, a2 = 0;
            for (; i < n && (int) (key[i] >>> 32) == r; i++) {
                double p = Float.intBitsToFloat((int) key[i]);
                a += p * inv;
                a2 += p * p * inv;
            }
            idx[m] = r;
            w[m] = (float) a;
            w2[m] = (float) a2;
            m++;
        }
        return m;
    }

    @Test
    void reflectorListsAreTheSortedKeysSummedRunByRun() {
        int rays = 1024;
        int[] ranges = {300, 70_000, 300_000};
        float[] albedos = {0.2f, 0.35f, 0.1f, 0.6f};
        SplittableRandom rnd = new SplittableRandom(5);
        for (int range : ranges) {
            ReflectorGroups groups = new ReflectorGroups(range, rays);
            for (int trial = 0; trial < 200; trial++) {
                int n = rnd.nextInt(rays + 1);
                boolean mixed = trial % 4 == 3;
                int[] rec = new int[n];
                float[] rho = new float[n];
                for (int i = 0; i < n; i++) {
                    rec[i] = rnd.nextInt(Math.min(range, 1 + (trial % 3 == 0 ? 40 : 5 * n)));
                    rho[i] = mixed ? albedos[rnd.nextInt(albedos.length)] : albedos[rec[i] % albedos.length];
                    groups.add(rec[i], rho[i]);
                }
                int[] idx = new int[rays], idxE = new int[rays];
                float[] w = new float[rays], w2 = new float[rays], wE = new float[rays], w2E = new float[rays];
                int m = groups.finish(rays, idx, w, w2), mE = byDefinition(rec, rho, n, rays, idxE, wE, w2E);
                assertEquals(mE, m, "reflectors of trial " + trial + ", range " + range);
                assertArrayEquals(Arrays.copyOf(idxE, mE), Arrays.copyOf(idx, m), "reflector indices");
                assertArrayEquals(Arrays.copyOf(wE, mE), Arrays.copyOf(w, m), "w");
                assertArrayEquals(Arrays.copyOf(w2E, mE), Arrays.copyOf(w2, m), "w2");
            }
        }
    }
}
