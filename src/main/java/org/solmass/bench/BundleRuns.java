package org.solmass.bench;

import org.solmass.scene.BundleTracer;
import org.solmass.scene.Tracer;

/** The bundle loop shared by the {@code bench} command and {@link OcclusionBench}. */
public final class BundleRuns {
    private BundleRuns() {}

    /**
     * Traces the rays [from, to) of {@code r} ({ox,oy,oz,dx,dy,dz} per ray, {@code per} consecutive
     * rays sharing an origin, as {@link SyntheticDistrict#rays} lays them out) as one bundle per point,
     * any hit or closest hit. Returns how many rays hit something. Scratch arrays are made once per call.
     */
    public static long trace(BundleTracer bt, double[] r, int from, int to, int per, boolean closest) {
        double[] dir = new double[3 * per], dist = new double[per];
        boolean[] out = new boolean[per];
        int[] tri = new int[per];
        long hits = 0;
        for (int i = from; i + per <= to; i += per) { // the rays of one point share its origin
            for (int s = 0; s < per; s++) System.arraycopy(r, 6 * (i + s) + 3, dir, 3 * s, 3);
            if (closest) {
                bt.closestHit(r[6 * i], r[6 * i + 1], r[6 * i + 2], dir, per, tri, dist);
                for (int s = 0; s < per; s++) if (tri[s] != Tracer.MISS) hits++;
            } else {
                bt.occluded(r[6 * i], r[6 * i + 1], r[6 * i + 2], dir, null, per, out);
                for (int s = 0; s < per; s++) if (out[s]) hits++;
            }
        }
        return hits;
    }
}
