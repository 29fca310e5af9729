package org.solmass.irradiation;

import org.solmass.surface.SurfaceFrame;

import java.util.Arrays;

/**
 * Finds the receiver that stands for a point where a hemisphere ray hit the scene: the receiver of
 * the hit triangle's surface whose centre is nearest to the hit point (a uniform bucket grid per
 * surface, in the surface's own 2D frame), or the ground probe of the cell the point falls in.
 */
final class ReflectorIndex {
    private final int[] triangleSurface;
    private final SurfaceFrame[] frames;
    // per surface bucket grid
    private final double[] gx0, gy0;
    private final int[] gnx, gny, gStart;
    private final double cell;
    private final int[] bucketStart; // concatenated per surface: gnx*gny+1 entries each
    private final int[] items;
    private final double[] lx, ly; // local coordinates per receiver (index = receiver)
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
        this.frames = frames;
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

    /** Receiver nearest to world point p on the surface of triangle {@code tri}, or -1 if that surface has none. */
    int onTriangle(int tri, double px, double py, double pz) {
        int s = triangleSurface[tri];
        if (s < 0 || gnx[s] == 0) return -1;
        SurfaceFrame f = frames[s];
        double x = f.localX(px, py, pz), y = f.localY(px, py, pz);
        int ci = Math.max(0, Math.min(gnx[s] - 1, (int) ((x - gx0[s]) / cell)));
        int cj = Math.max(0, Math.min(gny[s] - 1, (int) ((y - gy0[s]) / cell)));
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
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
                        int r = items[k];
                        double dx = lx[r] - x, dy = ly[r] - y, d = dx * dx + dy * dy;
                        if (d < bestD || (d == bestD && r < best)) { bestD = d; best = r; }
                    }
                }
            }
            // centres lie on a grid of about one bucket: one more ring settles the nearest
            if (best >= 0 && stopAfter == Integer.MAX_VALUE) stopAfter = ring + 1;
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
