package org.solmass.irradiation;

import org.solmass.model.Parallel;
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
 *
 * <p>Each bucket is then cut into 3 x 3 cells by two lines across each axis, a micrometre or so
 * either side of the bisector of two of its centres' coordinates (on a regular patch grid the
 * bucket's corners are patch centres and the bisectors cross it half-way). The same test keeps, in
 * each of the four corner cells, the bucket's centres that no other of them beats everywhere in the
 * cell: a cell left with one centre holds that receiver itself, and a point in it is answered
 * without a distance (on a regular grid every point but those in the thin strips along the
 * bisectors). The strips, and corner cells left with more than one centre, hold a list (the
 * bucket's own for the strips), scanned in ascending receiver order as before. A point goes to a
 * cell by comparing its coordinates with the lines, so the cell's closed rectangle holds it. The
 * answer stays the nearest of the bucket's list (that one is never beaten in the cell the point
 * falls in), so the same receiver as before, to the bit. The lookup reads a surface's frame and grid
 * from one record and a bucket's lines and answers from one record of {@value #BUCKET} ints.
 */
final class ReflectorIndex {
    private final int[] triangleSurface;
    /**
     * Per surface {@value #REC} doubles: the frame's origin, u and v (9 values), the listed box (x low,
     * x high, y low, y high; NaN for a surface without receivers) and the grid origin (x, y).
     */
    private final double[] surf;
    private static final int REC = 16;
    /** Per surface: buckets across, buckets up, its first bucket. */
    private final int[] grid;
    // per surface bucket grid (set-up and ring search)
    private final double[] gx0, gy0;
    private final int[] gnx, gny, gStart;
    private final double cell;
    private final int[] bucketStart; // concatenated per surface: gnx*gny+1 entries each
    private final int[] items;
    /** Local x, y per receiver (2 values, index = receiver). */
    private final double[] lxy;
    /**
     * Per bucket {@value #BUCKET} ints: the float bits of its lines x low, x high, y low, y high (+infinity
     * for none), then its 3 x 3 cells row by row (y, then x): the receiver (>= 0) or {@code ~at} of the
     * cell's list in {@link #lists}.
     */
    private final int[] cells;
    static final int BUCKET = 16;
    /** Lists of cells: length, then the receivers ascending. */
    private final int[] lists;
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
     * The same index for another scene made of the same model's triangles: {@code triangleSurface}
     * maps that scene's triangles to surface ids; every other table is shared, not copied. A surface's
     * buckets depend only on its own receivers, so a lookup on a triangle of that scene answers what
     * an index built for the scene alone answers (a city tile: {@link ReceiverLayout#index}).
     */
    ReflectorIndex withTriangleSurfaces(int[] triangleSurface) {
        return new ReflectorIndex(this, triangleSurface);
    }

    private ReflectorIndex(ReflectorIndex o, int[] triangleSurface) {
        this.triangleSurface = triangleSurface;
        surf = o.surf;
        grid = o.grid;
        gx0 = o.gx0;
        gy0 = o.gy0;
        gnx = o.gnx;
        gny = o.gny;
        gStart = o.gStart;
        cell = o.cell;
        bucketStart = o.bucketStart;
        items = o.items;
        lxy = o.lxy;
        cells = o.cells;
        lists = o.lists;
        px0 = o.px0;
        py0 = o.py0;
        pSpacing = o.pSpacing;
        pnx = o.pnx;
        pny = o.pny;
        probeBase = o.probeBase;
    }

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
        this.cell = cellM;
        int ns = frames.length, nr = receiverSurface.length;
        lxy = new double[2 * nr];
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
            double x = f.localX(centres[3 * r], centres[3 * r + 1], centres[3 * r + 2]);
            double y = f.localY(centres[3 * r], centres[3 * r + 1], centres[3 * r + 2]);
            lxy[2 * r] = x;
            lxy[2 * r + 1] = y;
            minX[s] = Math.min(minX[s], x);
            minY[s] = Math.min(minY[s], y);
            maxX[s] = Math.max(maxX[s], x);
            maxY[s] = Math.max(maxY[s], y);
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
        surf = new double[REC * ns];
        grid = new int[3 * ns];
        for (int s = 0; s < ns; s++) {
            SurfaceFrame f = frames[s];
            double[] v = {f.origin().x(), f.origin().y(), f.origin().z(), f.u().x(), f.u().y(), f.u().z(), f.v().x(), f.v().y(), f.v().z()};
            System.arraycopy(v, 0, surf, REC * s, 9);
            int o = REC * s + 9;
            double reach = BOX_CELLS * cell;
            boolean none = gnx[s] == 0; // NaN: no point is inside, and the lookup answers -1
            surf[o] = none ? Double.NaN : gx0[s] - reach;
            surf[o + 1] = none ? Double.NaN : gx0[s] + (gnx[s] + BOX_CELLS) * cell;
            surf[o + 2] = none ? Double.NaN : gy0[s] - reach;
            surf[o + 3] = none ? Double.NaN : gy0[s] + (gny[s] + BOX_CELLS) * cell;
            surf[o + 4] = gx0[s];
            surf[o + 5] = gy0[s];
            grid[3 * s] = gnx[s];
            grid[3 * s + 1] = gny[s];
            grid[3 * s + 2] = gStart[s];
        }
        int[] counts = new int[total + 1];
        int[] bucketOf = new int[nr];
        for (int r = 0; r < nr; r++) {
            int s = receiverSurface[r];
            if (s < 0) { bucketOf[r] = -1; continue; }
            int b = gStart[s] + bucket(s, lxy[2 * r], lxy[2 * r + 1]);
            bucketOf[r] = b;
            counts[b + 1]++;
        }
        for (int i = 0; i < total; i++) counts[i + 1] += counts[i];
        bucketStart = counts.clone();
        items = new int[counts[total]];
        int[] fill = Arrays.copyOf(counts, total);
        for (int r = 0; r < nr; r++) if (bucketOf[r] >= 0) items[fill[bucketOf[r]]++] = r;
        cells = new int[Math.multiplyExact(total, BUCKET)];
        // surfaces in parallel, each into its own buckets' records and its own lists; the lists are then
        // laid end to end in surface order. A list holds receivers of one surface only, so no list is
        // shared between surfaces and this is the layout one pass over the surfaces in order gives
        // (ReflectorIndexTest compares them).
        Lists[] per = new Lists[ns];
        Parallel.forEach(ns, s -> {
            if (gnx[s] == 0) return;
            Lists out = new Lists();
            for (int j = 0; j < gny[s]; j++) {
                for (int i = 0; i < gnx[s]; i++) split(s, i, j, candidates(s, i, j), out);
            }
            per[s] = out;
        });
        long listed = 0;
        for (Lists l : per) if (l != null) listed += l.n;
        lists = new int[Math.toIntExact(listed)];
        int off = 0;
        for (int s = 0; s < ns; s++) {
            Lists l = per[s];
            if (l == null) continue;
            System.arraycopy(l.v, 0, lists, off, l.n);
            if (off > 0) { // a cell naming list ~k of its surface now names ~(k + off)
                for (int b = gStart[s], end = b + gnx[s] * gny[s]; b < end; b++) {
                    for (int k = b * BUCKET + 4, last = b * BUCKET + 12; k <= last; k++) if (cells[k] < 0) cells[k] -= off;
                }
            }
            off += l.n;
        }
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

    /** The cells' lists as they are built: length, then receivers, list after list; each list once. */
    private static final class Lists {
        int[] v = new int[16];
        int n;
        private final java.util.HashMap<java.util.List<Integer>, Integer> at = new java.util.HashMap<>();

        /** Where list {@code c} starts, added if new (neighbouring buckets share the lists along their common edge). */
        int add(int[] c) {
            return at.computeIfAbsent(Arrays.stream(c).boxed().toList(), k -> {
                if (n + c.length + 1 > v.length) v = Arrays.copyOf(v, Math.max(2 * v.length, n + c.length + 1));
                int start = n;
                v[n++] = c.length;
                System.arraycopy(c, 0, v, n, c.length);
                n += c.length;
                return start;
            });
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
        if (all.length > PRUNE_MAX) return all;
        return prune(all, edge(gx0[s], ci, gnx[s], false), edge(gx0[s], ci, gnx[s], true),
                edge(gy0[s], cj, gny[s], false), edge(gy0[s], cj, gny[s], true));
    }

    /** The centres of {@code all} (ascending) that no other of them beats everywhere in the rectangle, ascending. */
    private int[] prune(int[] all, double x0, double x1, double y0, double y1) {
        int c = all.length;
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
                    double bx = lxy[2 * b] - qx[q], by = lxy[2 * b + 1] - qy[q], ax = lxy[2 * a] - qx[q], ay = lxy[2 * a + 1] - qy[q];
                    double db = bx * bx + by * by, da = ax * ax + ay * ay;
                    least = Math.min(least, db - da);
                    scale = Math.max(scale, Math.max(db, da));
                }
                dominated = least > MARGIN * scale;
            }
            if (!dominated) out[kept++] = b;
        }
        return Arrays.copyOf(out, kept);
    }

    /**
     * Lines of bucket column/row i across one axis (low, high) around the bisector of two of the
     * centres' coordinates {@code c} (of 2 coordinates per centre, axis {@code k}) that lies inside
     * the bucket's range lo .. hi and nearest its middle; +infinity for none (one cell).
     */
    private float[] lines(int[] c, int k, double lo, double hi) {
        double mid = (lo + hi) / 2, best = Double.NaN;
        double[] v = new double[c.length];
        for (int a = 0; a < c.length; a++) v[a] = lxy[2 * c[a] + k];
        Arrays.sort(v);
        for (int a = 0; a + 1 < v.length; a++) {
            if (!(v[a + 1] - v[a] > 1e-3 * cell)) continue; // one row or column of centres
            double m = (v[a] + v[a + 1]) / 2;
            if (m > lo && m < hi && !(Math.abs(m - mid) >= Math.abs(best - mid))) best = m;
        }
        float none = Float.POSITIVE_INFINITY;
        if (Double.isNaN(best)) return new float[] {none, none};
        // about a micrometre either side, more where floats round coarser (the lines are floats)
        double w = 1e-6 * cell + 4 * Math.ulp((float) Math.abs(best));
        float l = (float) (best - w), h = (float) (best + w);
        if (!(l > lo && h < hi && l < h)) return new float[] {none, none};
        return new float[] {l, h};
    }

    /** Fills the record of bucket (ci, cj) of surface s from the bucket's list {@code c}: its lines and cells. */
    private void split(int s, int ci, int cj, int[] c, Lists out) {
        int base = (gStart[s] + cj * gnx[s] + ci) * BUCKET;
        double x0 = edge(gx0[s], ci, gnx[s], false), x1 = edge(gx0[s], ci, gnx[s], true);
        double y0 = edge(gy0[s], cj, gny[s], false), y1 = edge(gy0[s], cj, gny[s], true);
        boolean one = c.length == 1 || c.length > PRUNE_MAX; // one answer, or a sparse surface's unpruned set
        float[] lx = one ? new float[] {Float.POSITIVE_INFINITY, Float.POSITIVE_INFINITY} : lines(c, 0, x0, x1);
        float[] ly = one ? new float[] {Float.POSITIVE_INFINITY, Float.POSITIVE_INFINITY} : lines(c, 1, y0, y1);
        cells[base] = Float.floatToRawIntBits(lx[0]);
        cells[base + 1] = Float.floatToRawIntBits(lx[1]);
        cells[base + 2] = Float.floatToRawIntBits(ly[0]);
        cells[base + 3] = Float.floatToRawIntBits(ly[1]);
        if (one) {
            Arrays.fill(cells, base + 4, base + 13, c.length == 1 ? c[0] : ~out.add(c));
            return;
        }
        // a cell's closed rectangle: a point below a line goes below it, a point on or above it above
        double[] xs = {x0, Math.min(lx[0], x1), Math.min(lx[1], x1), x1}, ys = {y0, Math.min(ly[0], y1), Math.min(ly[1], y1), y1};
        int whole = ~out.add(c);
        for (int sj = 0; sj < 3; sj++) {
            for (int si = 0; si < 3; si++) {
                if (si == 1 || sj == 1) { // the thin strips along the lines: the bucket's list
                    cells[base + 4 + 3 * sj + si] = whole;
                    continue;
                }
                int[] p = prune(c, xs[si], xs[si + 1], ys[sj], ys[sj + 1]);
                cells[base + 4 + 3 * sj + si] = p.length == 1 ? p[0] : ~out.add(p);
            }
        }
    }

    /** Whether both indexes hold the same records and lists, int for int (built on different thread counts, for the test). */
    boolean sameLayout(ReflectorIndex o) {
        return Arrays.equals(cells, o.cells) && Arrays.equals(lists, o.lists);
    }

    /** Receiver nearest to world point p on the surface of triangle {@code tri}, or -1 if that surface has none. */
    int onTriangle(int tri, double px, double py, double pz) {
        int s = triangleSurface[tri];
        if (s < 0) return -1;
        int o = REC * s;
        double x = localX(o, px, py, pz), y = localY(o, px, py, pz);
        if (!inBox(o, x, y)) return gnx[s] == 0 ? -1 : ringSearch(s, x, y);
        return cellAnswer(record(s, x, y), x, y);
    }

    /** SurfaceFrame.localX of the surface at record o, term by term. */
    private double localX(int o, double px, double py, double pz) {
        double[] f = surf;
        return (px - f[o]) * f[o + 3] + (py - f[o + 1]) * f[o + 4] + (pz - f[o + 2]) * f[o + 5];
    }

    /** SurfaceFrame.localY of the surface at record o, term by term. */
    private double localY(int o, double px, double py, double pz) {
        double[] f = surf;
        return (px - f[o]) * f[o + 6] + (py - f[o + 1]) * f[o + 7] + (pz - f[o + 2]) * f[o + 8];
    }

    /** Whether local (x, y) lies in the listed box of the surface at record o (never for a surface without receivers). */
    private boolean inBox(int o, double x, double y) {
        double[] f = surf;
        return x >= f[o + 9] && x <= f[o + 10] && y >= f[o + 11] && y <= f[o + 12];
    }

    /** Start of the record in {@link #cells} of the bucket of surface s holding local (x, y) (in the listed box). */
    private int record(int s, double x, double y) {
        int o = REC * s;
        double fx = (x - surf[o + 13]) / cell, fy = (y - surf[o + 14]) / cell;
        int nx = grid[3 * s], ny = grid[3 * s + 1];
        int ci = Math.max(0, Math.min(nx - 1, (int) fx)), cj = Math.max(0, Math.min(ny - 1, (int) fy));
        return (grid[3 * s + 2] + cj * nx + ci) * BUCKET;
    }

    /** The receiver of the cell of bucket record b holding local (x, y): its own, or the nearest of its list. */
    private int cellAnswer(int b, double x, double y) {
        int[] c = cells;
        int si = (x >= Float.intBitsToFloat(c[b]) ? 1 : 0) + (x >= Float.intBitsToFloat(c[b + 1]) ? 1 : 0);
        int sj = (y >= Float.intBitsToFloat(c[b + 2]) ? 1 : 0) + (y >= Float.intBitsToFloat(c[b + 3]) ? 1 : 0);
        int e = c[b + 4 + 3 * sj + si];
        if (e >= 0) return e;
        int k = ~e, end = k + 1 + lists[k];
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
        for (k++; k < end; k++) {
            int r = lists[k];
            double dx = lxy[2 * r] - x, dy = lxy[2 * r + 1] - y, d = dx * dx + dy * dy;
            if (d < bestD) { // ascending receivers: the first of equal distances is the lowest
                bestD = d;
                best = r;
            }
        }
        return best;
    }

    /** A batch of lookups for one thread, at most {@code max} points at a time ({@link Batch}). */
    Batch batch(int max) {
        return new Batch(max);
    }

    /**
     * The lookups of one receiver's hits, answered together: the same receivers as
     * {@link #onTriangle} point by point. The bucket records of all points are read first, in a loop
     * without branches on what it reads, so their cache misses overlap rather than stall the lookups
     * one by one. Per thread; allocates nothing after construction.
     */
    final class Batch {
        private final int[] tri, rec, at;
        private final double[] p, xy;
        private final float[] albedo;
        private int n, touched;

        private Batch(int max) {
            tri = new int[max];
            rec = new int[max];
            at = new int[max];
            p = new double[3 * max];
            xy = new double[2 * max];
            albedo = new float[max];
        }

        /** Notes a hit on triangle t at world point p with the albedo it reflects with. */
        void put(int t, double px, double py, double pz, float rho) {
            tri[n] = t;
            p[3 * n] = px;
            p[3 * n + 1] = py;
            p[3 * n + 2] = pz;
            albedo[n++] = rho;
        }

        /** Points noted since the last {@link #clear()}. */
        int size() { return n; }

        /** Receiver of point i after {@link #resolve()}, or -1. */
        int receiver(int i) { return rec[i]; }

        /** Albedo noted with point i. */
        float albedo(int i) { return albedo[i]; }

        /** Forgets the points. */
        void clear() { n = 0; }

        /** Finds the receiver of every point noted. */
        void resolve() {
            for (int i = 0; i < n; i++) {
                at[i] = 0;
                int s = triangleSurface[tri[i]];
                if (s < 0) {
                    rec[i] = -1;
                    continue;
                }
                int o = REC * s;
                double x = localX(o, p[3 * i], p[3 * i + 1], p[3 * i + 2]), y = localY(o, p[3 * i], p[3 * i + 1], p[3 * i + 2]);
                if (!inBox(o, x, y)) {
                    rec[i] = gnx[s] == 0 ? -1 : ringSearch(s, x, y);
                    continue;
                }
                rec[i] = Integer.MIN_VALUE; // in a bucket: answered below
                at[i] = record(s, x, y);
                xy[2 * i] = x;
                xy[2 * i + 1] = y;
            }
            int seen = 0;
            if (cells.length > 0) {
                for (int i = 0; i < n; i++) seen |= cells[at[i]] | cells[at[i] + BUCKET - 4]; // both cache lines of a record
            }
            touched = seen;
            for (int i = 0; i < n; i++) if (rec[i] == Integer.MIN_VALUE) rec[i] = cellAnswer(at[i], xy[2 * i], xy[2 * i + 1]);
        }
    }

    /** The nearest centre of the ring set of the point's bucket (points beyond the listed box). */
    private int ringSearch(int s, double x, double y) {
        int ci = Math.max(0, Math.min(gnx[s] - 1, (int) ((x - gx0[s]) / cell)));
        int cj = Math.max(0, Math.min(gny[s] - 1, (int) ((y - gy0[s]) / cell)));
        int best = -1;
        double bestD = Double.POSITIVE_INFINITY;
        for (int r : ringSet(s, ci, cj)) { // ascending: the first of equal distances is the lowest
            double dx = lxy[2 * r] - x, dy = lxy[2 * r + 1] - y, d = dx * dx + dy * dy;
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
