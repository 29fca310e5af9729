package org.solmass.irradiation;

import java.util.Arrays;

/**
 * The reflectors one receiver's hemisphere rays hit, gathered into its sparse reflector list
 * ({@link ShadedIrradiation}): per reflector (receiver index, ascending) the weights
 * {@code w = sum rho / N} and {@code w2 = sum rho^2 / N} over the rays that hit it.
 *
 * <p>The list is defined by sorting the hits' keys (reflector, albedo bits) and summing each run of
 * equal reflectors in key order. A reflector almost always shows one albedo (it lies on one face),
 * so its run is one value added once per ray: the hits' keys are noted as they come, then grouped
 * in that order (a per-thread map from receiver index to group) and only the distinct reflectors
 * are sorted, which gives the sums of the sorted keys term for term. Only when some reflector shows
 * two albedos are all keys sorted.
 *
 * <p>The distinct reflectors (about 150 of 250 hits for 1,024 rays) are sorted by a least
 * significant digit radix sort, 8 bits a pass (Knuth, The Art of Computer Programming vol. 3,
 * sec. 5.2.5; Cormen et al., Introduction to Algorithms, sec. 8.3): the same ascending order as a
 * comparison sort of distinct keys, without its mispredicted branches; short lists take
 * {@link Arrays#sort(int[], int, int)}.
 *
 * <p>Per thread; allocates nothing after construction.
 */
final class ReflectorGroups {
    private final long[] key;
    /** Per receiver index its group, -1 for none; per group its receiver (in order of first hit), albedo bits and hits. */
    private final int[] groupOf, groupRec, groupAlbedo, groupCount;
    /** Radix sort: the two buffers and the digit counts. */
    private final int[] sortA, sortB, digits = new int[RADIX + 1];
    private static final int RADIX = 256;
    /** Fewer distinct reflectors than this are sorted by {@link Arrays#sort(int[], int, int)}. */
    private static final int RADIX_MIN = 48;
    private int hits, groups;
    /** What the first read of the per-receiver table gave (kept, so the reads stay). */
    private int touched;
    private boolean mixedAlbedo;

    /** @param receivers receivers of the run (reflector indices lie below); @param maxRays most hits of one receiver */
    ReflectorGroups(int receivers, int maxRays) {
        key = new long[maxRays];
        groupOf = new int[receivers];
        Arrays.fill(groupOf, -1);
        groupRec = new int[maxRays];
        groupAlbedo = new int[maxRays];
        groupCount = new int[maxRays];
        sortA = new int[maxRays];
        sortB = new int[maxRays];
    }

    /** Notes one ray hit on reflector {@code rec} of albedo {@code rho} (its key; grouped in {@link #finish}). */
    void add(int rec, float rho) {
        key[hits++] = ((long) rec << 32) | Float.floatToRawIntBits(rho);
    }

    /**
     * Groups the hits noted, in order. The per-receiver table is read for every hit first, in a loop
     * without branches on what it reads, so that its cache misses overlap instead of stalling the
     * grouping one by one (and the ray loop that notes the hits carries no such branch either).
     */
    private void group() {
        int n = hits, seen = 0;
        for (int i = 0; i < n; i++) seen |= groupOf[(int) (key[i] >>> 32)];
        touched = seen;
        for (int i = 0; i < n; i++) {
            int rec = (int) (key[i] >>> 32), bits = (int) key[i];
            int at = groupOf[rec];
            if (at < 0) {
                at = groups;
                groupOf[rec] = at;
                groupRec[groups++] = rec;
                groupAlbedo[at] = bits;
                groupCount[at] = 1;
            } else {
                groupCount[at]++;
                if (groupAlbedo[at] != bits) mixedAlbedo = true;
            }
        }
    }

    /**
     * Writes the reflector list of the hits noted since the last call (rays = N) into the arrays;
     * returns its length and forgets the hits.
     */
    int finish(int rays, int[] refIdx, float[] refW, float[] refW2) {
        group();
        double inv = 1.0 / rays;
        int m = 0;
        if (!mixedAlbedo) {
            int[] sorted = sortedReflectors();
            for (int g = 0; g < groups; g++) {
                int rec = sorted[g], at = groupOf[rec];
                double rho = Float.intBitsToFloat(groupAlbedo[at]), w = 0, w2 = 0;
                for (int i = groupCount[at]; i > 0; i--) {
                    w += rho * inv;
                    w2 += rho * rho * inv;
                }
                refIdx[m] = rec;
                refW[m] = (float) w;
                refW2[m] = (float) w2;
                m++;
            }
        } else {
            Arrays.sort(key, 0, hits);
            for (int i = 0; i < hits; ) {
                int rec = (int) (key[i] >>> 32);
                double w = 0, w2 = 0;
                while (i < hits && (int) (key[i] >>> 32) == rec) {
                    double rho = Float.intBitsToFloat((int) key[i]);
                    w += rho * inv;
                    w2 += rho * rho * inv;
                    i++;
                }
                refIdx[m] = rec;
                refW[m] = (float) w;
                refW2[m] = (float) w2;
                m++;
            }
        }
        for (int g = 0; g < groups; g++) groupOf[groupRec[g]] = -1;
        groups = 0;
        hits = 0;
        mixedAlbedo = false;
        return m;
    }

    /** The distinct reflectors noted, ascending (in one of the sort buffers). */
    private int[] sortedReflectors() {
        int n = groups;
        int[] a = sortA, b = sortB;
        System.arraycopy(groupRec, 0, a, 0, n);
        if (n < RADIX_MIN) {
            Arrays.sort(a, 0, n);
            return a;
        }
        int all = 0;
        for (int i = 0; i < n; i++) all |= a[i];
        for (int shift = 0; shift == 0 || shift < 32 && (all >>> shift) != 0; shift += 8) {
            Arrays.fill(digits, 0);
            for (int i = 0; i < n; i++) digits[((a[i] >>> shift) & (RADIX - 1)) + 1]++;
            for (int d = 0; d < RADIX; d++) digits[d + 1] += digits[d];
            for (int i = 0; i < n; i++) b[digits[(a[i] >>> shift) & (RADIX - 1)]++] = a[i];
            int[] t = a;
            a = b;
            b = t;
        }
        return a;
    }
}
