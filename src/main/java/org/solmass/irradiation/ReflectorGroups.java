package org.solmass.irradiation;

import java.util.Arrays;

/**
 * The reflectors one receiver's hemisphere rays hit, gathered into its sparse reflector list
 * ({@link ShadedIrradiation}): per reflector (receiver index, ascending) the weights
 * {@code w = sum rho / N} and {@code w2 = sum rho^2 / N} over the rays that hit it.
 *
 * <p>The list is defined by sorting the hits' keys (reflector, albedo bits) and summing each run of
 * equal reflectors in key order. A reflector almost always shows one albedo (it lies on one face),
 * so its run is one value added once per ray: the hits are grouped as they come (a per-thread map
 * from receiver index to group) and only the distinct reflectors are sorted, which gives the sums of
 * the sorted keys term for term. Only when some reflector shows two albedos are all keys sorted.
 *
 * <p>Per thread; allocates nothing after construction.
 */
final class ReflectorGroups {
    private final long[] key;
    /** Per receiver index its group, -1 for none; per group its receiver (in order of first hit), albedo bits and hits. */
    private final int[] groupOf, groupRec, groupAlbedo, groupCount;
    private int hits, groups;
    private boolean mixedAlbedo;

    /** @param receivers receivers of the run (reflector indices lie below); @param maxRays most hits of one receiver */
    ReflectorGroups(int receivers, int maxRays) {
        key = new long[maxRays];
        groupOf = new int[receivers];
        Arrays.fill(groupOf, -1);
        groupRec = new int[maxRays];
        groupAlbedo = new int[maxRays];
        groupCount = new int[maxRays];
    }

    /** Notes one ray hit on reflector {@code rec} of albedo {@code rho}. */
    void add(int rec, float rho) {
        int bits = Float.floatToRawIntBits(rho);
        key[hits++] = ((long) rec << 32) | bits;
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

    /**
     * Writes the reflector list of the hits noted since the last call (rays = N) into the arrays;
     * returns its length and forgets the hits.
     */
    int finish(int rays, int[] refIdx, float[] refW, float[] refW2) {
        double inv = 1.0 / rays;
        int m = 0;
        if (!mixedAlbedo) {
            Arrays.sort(groupRec, 0, groups);
            for (int g = 0; g < groups; g++) {
                int rec = groupRec[g], at = groupOf[rec];
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
}
