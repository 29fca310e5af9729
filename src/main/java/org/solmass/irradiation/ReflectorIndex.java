package org.solmass.irradiation;

import org.solmass.surface.SurfaceFrame;

import java.util.Arrays;

/**
 * Finds the receiver that stands for a point where a hemisphere ray hit the scene: the receiver of
 * the hit triangle's surface whose centre is nearest to the hit point (a uniform bucket grid per
 * surface, in the surface's own 2D frame), or the ground probe of the cell the point falls in.
 *
 * <p>The search looks at the buckets around the point's bucket: the first ring of buckets holding a
 * centre and one ring more. That set depends only on the bucket, so it is listed once per bucket,
 * without the centres that can never be the nearest anywhere in the bucket: a centre b is left out
 * when another centre a of the set is nearer than b at every point of the bucket by more than a
 * margin far above rounding ({@code |q-b|^2 - |q-a|^2} is linear in the point q, so its least value
 * over the bucket's rectangle is at a corner). The answer is the same receiver as a search over the
 * whole set; points more than {@link #BOX_CELLS} buckets outside the grid (where an edge bucket's
 * rectangle would be unbounded) take the ring search itself.
 */
final class ReflectorIndex {
    private final int[] triangleSurface;
    /** Per surface: the frame's origin, u and v (9 values), for the lookup without reaching through the records. */
    private final double[] frame;
    // per surface bucket grid
    private final double[] gx0, gy0;
    private final int[] gnx, gny, gStart;
    private final double cell;
    private final int[] bucketStart; // concatenated per surface: gnx*gny+1 entries each
    private final int[] items;
    private final double[] lx, ly; // local coordinates per receiver (index = receiver)
    // per bucket: the candidates that can be nearest somewhere in it (receiver, local x, local y)
    private final int[] candStart, cand;
    private final double[] candXY;
    /** Buckets beyond the grid that the listed candidates still cover, on every side. */
    static final int BOX_CELLS = 2;
    /** Candidate sets larger than this are listed without pruning (a sparse surface; keeps set-up time bounded). */
    private static final int PRUNE_MAX = 64;
    /** Relative margin of a dominance test, far above the rounding of a squared distance (about 1e-15). */
    private static final double MARGIN = 1e-9;
    // ground probes
    private final double px0, py0, pSpacing;
    private final int pnx, pny, probeBase;

    /**
     * @param triangleSurface surface id of every model triangle, -1 where none
     * @param frames frame of every surface id
     * @param receiverSurface surface id per receiver (-1 for probes)
     * @param centres x,y,z world centre per receiver
     * @param cellM bucket size, metres (about the patch size)
     * @param probeGrid {x0, y0, spacing, nx, ny, firstProbeIndex} or null without probes
     */
    ReflectorIndex(int[] triangleSurface, SurfaceFrame[] frames, int[] receiverSurface, double[] centres,
                   double cellM, double[] probeGrid) {
        this.triangleSurface = triangleSurface;
        frame = new double[9 * frames.length];
        for (int s = 0; s < frames.length; s++) {
            SurfaceFrame f = frames[s];
            double[] v = {f.origin().x(), f.origin().y(), f.origin().z(), f.u().x(), f.u().y(), f.u().z(), f.v().x(), f.v().y(), f.v().z()};
            System.arraycopy(v, 0, frame, 9 * s, 9);
        }
        this.cell = cellM;
        int ns = frames.length, nr = receiverSurface.length;
        lx = new double[nr];
        ly = new double[nr];
        gx0 = new double[ns];
        gy0 = new double[ns];
        gnx = new int[ns];
        gny = new int[ns];
        gStart = new int[ns];
        double[] minX = new double[ns], minY = new double[ns], maxX = new double[ns], maxY = new double[ns];
        Arrays.fill(minX, Double.POSITIVE_INFINITY);
        Arrays.fill(minY, Double.POSITIVE_INFINITY);
        Arrays.fill(maxX, Double.NEGATIVE_INFINITY);
        Arrays.fill(maxY, Double.NEGATIVE_INFINITY);
        for (int r = 0; r < nr; r++) {
            int s = receiverSurface[r];
            if (s < 0) continue;
            SurfaceFrame f = frames[s];
            lx[r] = f.localX(centres[3 * r], centres[3 * r + 1], centres[3 * r + 2]);
            ly[r] = f.localY(centres[3 * r], centres[3 * r + 1], centres[3 * r + 2]);
            minX[s] = Math.min(minX[s], lx[r]);
            minY[s] = Math.min(minY[s], ly[r]);
            maxX[s] = Math.max(maxX[s], lx[r]);
            maxY[s] = Math.max(maxY[s], ly[r]);
        }
        int total = 0;
        for (int s = 0; s < ns; s++) {
            gStart[s] = total;
            if (minX[s] > maxX[s]) continue;
            gx0[s] = minX[s];
            gy0[s] = minY[s];
            gnx[s] = 1 + (int) ((maxX[s] - minX[s]) / cell);
            gny[s] = 1 + (int) ((maxY[s] - minY[s]) / cell);
            total += gnx[s] * gny[s];
        }
        int[] counts = new int[total + 1];
        int[] bucketOf = new int[nr];
        for (int r = 0; r < nr; r++) {
            int s = receiverSurface[r];
            if (s < 0) { bucketOf[r] = -1; continue; }
            int b = gStart[s] + bucket(s, lx[r], ly[r]);
            bucketOf[r] = b;
            counts[b + 1]++;
        }
        for (int i = 0; i < total; i++) counts[i + 1] += counts[i];
        bucketStart = counts.clone();
        items = new int[counts[total]];
        int[] fill = Arrays.copyOf(counts, total);
        for (int r = 0; r < nr; r++) if (bucketOf[r] >= 0) items[fill[bucketOf[r]]++] = r;
        int[][] lists = new int[total][];
        int sum = 0;
        for (int s = 0; s < ns; s++) {
            for (int j = 0; j < gny[s]; j++) {
                for (int i = 0; i < gnx[s]; i++) {
                    int[] c = candidates(s, i, j);
                    lists[gStart[s] + j * gnx[s] + i] = c;
                    sum += c.length;
                }
            }
        }
        candStart = new int[total + 1];
        cand = new int[sum];
        candXY = new double[2 * sum];
        for (int b = 0, k = 0; b < total; b++) {
            candStart[b] = k;
            for (int r : lists[b]) {
                cand[k] = r;
                candXY[2 * k] = lx[r];
                candXY[2 * k + 1] = ly[r];
                k++;
            }
        }
        candStart[total] = sum;
        if (probeGrid != null) {
            px0 = probeGrid[0];
            py0 = probeGrid[1];
            pSpacing = probeGrid[2];
            pnx = (int) probeGrid[3];
            pny = (int) probeGrid[4];
            probeBase = (int) probeGrid[5];
        } else {
            px0 = py0 = pSpacing = 0;
            pnx = pny = 0;
            probeBase = -1;
        }
    }

    private int bucket(int s, double x, double y) {
        int i = Math.max(0, Math.min(gnx[s] - 1, (int) ((x - gx0[s]) / cell)));
        int j = Math.max(0, Math.min(gny[s] - 1, (int) ((y - gy0[s]) / cell)));
        return j * gnx[s] + i;
    }

    /** Lower or upper edge of the rectangle of bucket column/row i of n, origin o, extended by the box at the grid's ends. */
    private double edge(double o, int i, int n, boolean upper) {
        double eps = 1e-6 * cell + 1e-9 * (Math.abs(o) + n * cell); // points that round into the bucket
        if (upper) return i == n - 1 ? o + (n + BOX_CELLS) * cell : o + (i + 1) * cell + eps;
        return i == 0 ? o - BOX_CELLS * cell : o + i * cell - eps;
    }

    /** Centres in the buckets around (ci, cj) of surface s: the first ring holding one and one ring more. */
    private int[] ringSet(int s, int ci, int cj) {
        int[] all = new int[8];
        int c = 0;
        int maxRing = Math.max(gnx[s], gny[s]);
        int stopAfter = Integer.MAX_VALUE;
        for (int ring = 0; ring <= maxRing && ring <= stopAfter; ring++) {
            for (int j = cj - ring; j <= cj + ring; j++) {
                if (j < 0 || j >= gny[s]) continue;
                for (int i = ci - ring; i <= ci + ring; i++) {
                    if (i < 0 || i >= gnx[s]) continue;
                    if (Math.max(Math.abs(i - ci), Math.abs(j - cj)) != ring) continue;
                    int b = gStart[s] + j * gnx[s] + i;
                    for (int k = bucketStart[b]; k < bucketStart[b + 1]; k++) {
                        if (c == all.length) all = Arrays.copyOf(all, 2 * c);
                        all[c++] = items[k];
                    }
                }
            }
            // centres lie on a grid of about one bucket: one more ring settles the nearest
            if (c > 0 && stopAfter == Integer.MAX_VALUE) stopAfter = ring + 1;
        }
        int[] set = Arrays.copyOf(all, c);
        Arrays.sort(set);
        return set;
    }

    /** The ring set of bucket (ci, cj) without the centres that are never the nearest in it. */
    private int[] candidates(int s, int ci, int cj) {
        int[] all = ringSet(s, ci, cj);
        int c = all.length;
        if (c > PRUNE_MAX) return all;
        double x0 = edge(gx0[s], ci, gnx[s], false), x1 = edge(gx0[s], ci, gnx[s], true);
        double y0 = edge(gy0[s], cj, gny[s], false), y1 = edge(gy0[s], cj, gny[s], true);
        double[] qx = {x0, x1, x0, x1}, qy = {y0, y0, y1, y1};
        int kept = 0;
        int[] out = new int[c];
        for (int bi = 0; bi < c; bi++) {
            int b = all[bi];
            boolean dominated = false;
            for (int ai = 0; ai < c && !dominated; ai++) {
                int a = all[ai];
                if (a == b) continue;
                double least = Double.POSITIVE_INFINITY, scale = 0;
                for (int q = 0; q < 4; q++) {
                    double bx = lx[b] - qx[q], by = ly[b] - qy[q], ax = lx[a] - qx[q], ay = ly[a] - qy[q];
                    double db = bx * bx + by * by, da = ax * ax + ay * ay;
                    least = Math.min(least, db - da);
                    scale = Math.max(scale, Math.max(db, da));
                }
                dominated = least > MARGIN * scale;
            }
            if (!dominated) out[kept++] = b;
        }
        return Arrays.copyOf(out, kept); // ascending, as the ring set
    }

    /** Receiver nearest to world point p on the surface of triangle {@code tri}, or -1 if that surface has none. */
    int onTriangle(int tri, double px, double py, double pz) {
        int s = triangleSurface[tri];
        if (s < 0 || gnx[s] == 0) return -1;
        int o = 9 * s; // SurfaceFrame.localX and localY, term by term
        double qx = px - frame[o], qy = py - frame[o + 1], qz = pz - frame[o + 2];
        double x = qx * frame[o + 3] + qy * frame[o + 4] + qz * frame[o + 5];
        double y = qx * frame[o + 6] + qy * frame[o + 7] + qz * frame[o + 8];
        double reach = BOX_CELLS * cell;
        if (!(x >= gx0[s] - reach && x <= gx0[s] + (gnx[s] + BOX_CELLS) * cell
                && y >= gy0[s] - reach && y <= gy0[s] + (gny[s] + BOX_CELLS) * cell)) return ringSearch(s, x, y);
        int ci = Math.max(0, Math.min(gnx[s] - 1, (int) ((x - gx0[s]) / cell)));
        int cj = Math.max(0, Math.min(gny[s] - 1, (int) ((y - gy0[s]) / cell)));
        int b = gStart[s] + cj * gnx[s] + ci;
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
        for (int k = candStart[b]; k < candStart[b + 1]; k++) {
            double dx = candXY[2 * k] - x, dy = candXY[2 * k + 1] - y, d = dx * dx + dy * dy;
            if (d < bestD) { // ascending receivers: the first of equal distances is the lowest
                bestD = d;
                best = cand[k];
            }
        }
        return best;
    }

    /** The nearest centre of the ring set of the point's bucket (points beyond the listed box). */
    private int ringSearch(int s, double x, double y) {
        int ci = Math.max(0, Math.min(gnx[s] - 1, (int) ((x - gx0[s]) / cell)));
        int cj = Math.max(0, Math.min(gny[s] - 1, (int) ((y - gy0[s]) / cell)));
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
        for (int r : ringSet(s, ci, cj)) { // ascending: the first of equal distances is the lowest
            double dx = lx[r] - x, dy = ly[r] - y, d = dx * dx + dy * dy;
            if (d < bestD) {
                bestD = d;
                best = r;
            }
        }
        return best;
    }

    /** Ground probe of the cell holding (x, y), or -1 outside the probe grid or without probes. */
    int probeAt(double x, double y) {
        if (probeBase < 0) return -1;
        int i = (int) Math.floor((x - px0) / pSpacing), j = (int) Math.floor((y - py0) / pSpacing);
        if (i < 0 || j < 0 || i >= pnx || j >= pny) return -1;
        return probeBase + j * pnx + i;
    }
}
