package org.solmass.scene;

/**
 * Top-down binned SAH build of the BVH, written straight into the flat depth-first node array.
 *
 * <p>Binned surface-area heuristic after Wald (2007), "On fast construction of SAH-based bounding
 * volume hierarchies", IEEE Symposium on Interactive Ray Tracing, section 3: centroids are binned into
 * {@value #BINS} equal bins along each axis and the split plane with the least estimated cost
 * {@code C_trav + (A_L N_L + A_R N_R) / A} (MacDonald and Booth, 1990, The Visual Computer 6(3)) is
 * taken; a node becomes a leaf when that cost is not below the leaf cost {@code N} and it holds at
 * most {@value #MAX_LEAF} triangles, or when its centroids coincide.
 *
 * <p>The build tree (8 floats per node: bounds, second child or first triangle, count) is then
 * converted to the traversal layout described in {@link Scene}: each interior node holds both
 * children's boxes (padded by a tiny margin so float rounding in the slab test never culls a hit) and
 * references. Leaves hold at most {@value #MAX_LEAF_HARD} triangles.
 */
final class BvhBuilder {
    static final int BINS = 16;
    /** Words per node of the binary build tree: bounds(6), second child / first triangle, count << 2 | split axis. */
    private static final int BIN_WORDS = 8;
    static final int MAX_LEAF = 4;
    /** Leaves never hold more than this (coincident centroids are split by index). */
    static final int MAX_LEAF_HARD = 8;
    /** Traversal cost relative to one triangle test. */
    static final float C_TRAV = 1.0f;

    record Result(float[] nodes, float[] tris, int[] triOriginal, int nodeCount, int maxDepth) {}

    private final int n;
    private final float[] box;   // 6 per triangle, shifted coordinates
    private final float[] cen;   // 3 per triangle
    private final float[] soup;
    private final double[] shift;
    private final int[] idx;
    private float[] nodes;
    private int nodeCount;
    private int maxDepth;
    private final float pad;
    // scratch for binning (one level at a time; recursion reuses it after use)
    private final int[] binCount = new int[BINS];
    private final float[] binBox = new float[BINS * 6];
    private final float[] rightArea = new float[BINS];
    private final int[] rightCount = new int[BINS];

    BvhBuilder(float[] soup, double[] shift) {
        this.soup = soup;
        this.shift = shift;
        this.n = soup.length / 9;
        this.box = new float[6 * n];
        this.cen = new float[3 * n];
        this.idx = new int[n];
        float ext = 0;
        for (int t = 0; t < n; t++) {
            idx[t] = t;
            for (int k = 0; k < 3; k++) {
                float a = (float) (soup[9 * t + k] - shift[k]);
                float b = (float) (soup[9 * t + 3 + k] - shift[k]);
                float c = (float) (soup[9 * t + 6 + k] - shift[k]);
                float lo = Math.min(a, Math.min(b, c)), hi = Math.max(a, Math.max(b, c));
                box[6 * t + k] = lo;
                box[6 * t + 3 + k] = hi;
                cen[3 * t + k] = 0.5f * (lo + hi);
                ext = Math.max(ext, Math.max(Math.abs(lo), Math.abs(hi)));
            }
        }
        // about 16 float steps at the largest stored coordinate, plus an absolute floor
        this.pad = ext * 1e-6f + 1e-6f;
    }

    Result build() {
        if (n >= 1 << 26) throw new IllegalArgumentException("too many triangles for one scene: " + n);
        nodes = new float[Math.max(1, 2 * n - 1) * BIN_WORDS];
        if (n > 0) buildNode(0, n, 0);
        float[] out = toWide();
        float[] tris = new float[n * Scene.TRI_WORDS];
        int[] orig = new int[n];
        for (int i = 0; i < n; i++) {
            int t = idx[i];
            orig[i] = t;
            int s = 9 * t, d = Scene.TRI_WORDS * i;
            for (int k = 0; k < 3; k++) {
                double v0 = soup[s + k] - shift[k];
                tris[d + k] = (float) v0;
                tris[d + 3 + k] = (float) ((soup[s + 3 + k] - shift[k]) - v0);
                tris[d + 6 + k] = (float) ((soup[s + 6 + k] - shift[k]) - v0);
            }
        }
        return new Result(out, tris, orig, wideCount, maxDepth);
    }

    // ---- conversion of the binary build tree to the traversal layout ----

    private float[] wide;
    private int wideCount;
    private static final float EMPTY = 1e30f;

    private boolean isLeaf(int node) {
        return (Float.floatToRawIntBits(nodes[node * BIN_WORDS + 7]) >>> 2) > 0;
    }

    /** Traversal layout: one 16-word node per interior node of the build tree (see Scene). */
    private float[] toWide() {
        if (n == 0) return new float[0];
        wide = new float[Math.max(1, nodeCount / 2) * Scene.NODE_WORDS];
        if (isLeaf(0)) { // single leaf: a root whose second child is an empty (inverted) box
            wideCount = 1;
            writeChild(0, 0, 0);
            for (int k = 0; k < 3; k++) { wide[6 + k] = EMPTY; wide[9 + k] = -EMPTY; }
            wide[13] = wide[12];
        } else {
            emit(0);
        }
        return java.util.Arrays.copyOf(wide, wideCount * Scene.NODE_WORDS);
    }

    private int emit(int node) {
        int w = wideCount++;
        int second = Float.floatToRawIntBits(nodes[node * BIN_WORDS + 6]);
        writeChild(w * Scene.NODE_WORDS, 0, node + 1);
        writeChild(w * Scene.NODE_WORDS, 1, second);
        wide[w * Scene.NODE_WORDS + 14] = Float.intBitsToFloat(Float.floatToRawIntBits(nodes[node * BIN_WORDS + 7]) & 3);
        return w;
    }

    /** Child {@code slot} (0 or 1) of the wide node at word {@code wb}: bounds and reference. */
    private void writeChild(int wb, int slot, int child) {
        System.arraycopy(nodes, child * BIN_WORDS, wide, wb + 6 * slot, 6);
        int ref;
        if (isLeaf(child)) {
            int start = Float.floatToRawIntBits(nodes[child * BIN_WORDS + 6]);
            int count = Float.floatToRawIntBits(nodes[child * BIN_WORDS + 7]) >>> 2;
            ref = ((start << 3 | (count - 1)) << 1) | 1;
        } else {
            ref = emit(child) << 1;
        }
        wide[wb + 12 + slot] = Float.intBitsToFloat(ref);
    }

    private int buildNode(int start, int end, int depth) {
        int node = nodeCount++;
        maxDepth = Math.max(maxDepth, depth);
        int b = node * BIN_WORDS;
        float bx0 = Float.POSITIVE_INFINITY, by0 = bx0, bz0 = bx0, bx1 = Float.NEGATIVE_INFINITY, by1 = bx1, bz1 = bx1;
        float cx0 = Float.POSITIVE_INFINITY, cy0 = cx0, cz0 = cx0, cx1 = Float.NEGATIVE_INFINITY, cy1 = cx1, cz1 = cx1;
        for (int i = start; i < end; i++) {
            int t = idx[i], o = 6 * t, c = 3 * t;
            bx0 = Math.min(bx0, box[o]); by0 = Math.min(by0, box[o + 1]); bz0 = Math.min(bz0, box[o + 2]);
            bx1 = Math.max(bx1, box[o + 3]); by1 = Math.max(by1, box[o + 4]); bz1 = Math.max(bz1, box[o + 5]);
            cx0 = Math.min(cx0, cen[c]); cy0 = Math.min(cy0, cen[c + 1]); cz0 = Math.min(cz0, cen[c + 2]);
            cx1 = Math.max(cx1, cen[c]); cy1 = Math.max(cy1, cen[c + 1]); cz1 = Math.max(cz1, cen[c + 2]);
        }
        nodes[b] = bx0 - pad; nodes[b + 1] = by0 - pad; nodes[b + 2] = bz0 - pad;
        nodes[b + 3] = bx1 + pad; nodes[b + 4] = by1 + pad; nodes[b + 5] = bz1 + pad;
        int count = end - start;
        if (count == 1) return leaf(b, start, count, node);
        if (count > MAX_LEAF_HARD && allSameCentroid(start, end)) return split(b, node, start, (start + end) >>> 1, end, depth, 0);
        float[] cmin = {cx0, cy0, cz0}, cext = {cx1 - cx0, cy1 - cy0, cz1 - cz0};
        float parentArea = Math.max(area(bx1 - bx0, by1 - by0, bz1 - bz0), Float.MIN_NORMAL);
        float bestCost = Float.POSITIVE_INFINITY;
        int bestAxis = -1, bestSplit = -1;
        for (int axis = 0; axis < 3; axis++) {
            if (!(cext[axis] > 0)) continue;
            float scale = BINS / cext[axis];
            java.util.Arrays.fill(binCount, 0);
            for (int k = 0; k < BINS; k++) {
                binBox[6 * k] = binBox[6 * k + 1] = binBox[6 * k + 2] = Float.POSITIVE_INFINITY;
                binBox[6 * k + 3] = binBox[6 * k + 4] = binBox[6 * k + 5] = Float.NEGATIVE_INFINITY;
            }
            for (int i = start; i < end; i++) {
                int t = idx[i];
                int k = bin(cen[3 * t + axis], cmin[axis], scale);
                binCount[k]++;
                int o = 6 * t, q = 6 * k;
                for (int j = 0; j < 3; j++) {
                    binBox[q + j] = Math.min(binBox[q + j], box[o + j]);
                    binBox[q + 3 + j] = Math.max(binBox[q + 3 + j], box[o + 3 + j]);
                }
            }
            // sweep from the right: area and count of bins k..BINS-1
            float[] acc = {Float.POSITIVE_INFINITY, Float.POSITIVE_INFINITY, Float.POSITIVE_INFINITY,
                    Float.NEGATIVE_INFINITY, Float.NEGATIVE_INFINITY, Float.NEGATIVE_INFINITY};
            int cnt = 0;
            for (int k = BINS - 1; k > 0; k--) {
                grow(acc, k);
                cnt += binCount[k];
                rightCount[k] = cnt;
                rightArea[k] = cnt == 0 ? 0 : area(acc[3] - acc[0], acc[4] - acc[1], acc[5] - acc[2]);
            }
            acc[0] = acc[1] = acc[2] = Float.POSITIVE_INFINITY;
            acc[3] = acc[4] = acc[5] = Float.NEGATIVE_INFINITY;
            cnt = 0;
            for (int k = 0; k < BINS - 1; k++) { // split between bin k and k+1
                grow(acc, k);
                cnt += binCount[k];
                int rc = rightCount[k + 1];
                if (cnt == 0 || rc == 0) continue;
                float la = area(acc[3] - acc[0], acc[4] - acc[1], acc[5] - acc[2]);
                float cost = C_TRAV + (la * cnt + rightArea[k + 1] * rc) / parentArea;
                if (cost < bestCost) {
                    bestCost = cost;
                    bestAxis = axis;
                    bestSplit = k;
                }
            }
        }
        if (bestAxis < 0) return leaf(b, start, count, node); // all centroids coincide (count <= 8 here)
        if (count <= MAX_LEAF && !(bestCost < count)) return leaf(b, start, count, node);
        // partition idx[start,end) by bin <= bestSplit
        float scale = BINS / cext[bestAxis];
        int i = start, j = end - 1;
        while (i <= j) {
            if (bin(cen[3 * idx[i] + bestAxis], cmin[bestAxis], scale) <= bestSplit) i++;
            else { int tmp = idx[i]; idx[i] = idx[j]; idx[j] = tmp; j--; }
        }
        int mid = i;
        if (mid == start || mid == end) mid = (start + end) >>> 1; // cannot happen with a valid split
        return split(b, node, start, mid, end, depth, bestAxis);
    }

    /** Interior node: children [start, mid) (the lower side along {@code axis}) and [mid, end). */
    private int split(int b, int node, int start, int mid, int end, int depth, int axis) {
        buildNode(start, mid, depth + 1);
        int second = buildNode(mid, end, depth + 1);
        nodes[b + 6] = Float.intBitsToFloat(second);
        nodes[b + 7] = Float.intBitsToFloat(axis); // count 0 (interior), low bits: split axis
        return node;
    }

    private boolean allSameCentroid(int start, int end) {
        int t0 = idx[start];
        for (int i = start + 1; i < end; i++) {
            int t = idx[i];
            if (cen[3 * t] != cen[3 * t0] || cen[3 * t + 1] != cen[3 * t0 + 1] || cen[3 * t + 2] != cen[3 * t0 + 2]) return false;
        }
        return true;
    }

    private int leaf(int b, int start, int count, int node) {
        nodes[b + 6] = Float.intBitsToFloat(start);
        nodes[b + 7] = Float.intBitsToFloat(count << 2);
        return node;
    }

    private void grow(float[] acc, int k) {
        if (binCount[k] == 0) return;
        int q = 6 * k;
        for (int j = 0; j < 3; j++) {
            acc[j] = Math.min(acc[j], binBox[q + j]);
            acc[3 + j] = Math.max(acc[3 + j], binBox[q + 3 + j]);
        }
    }

    private static int bin(float c, float min, float scale) {
        int k = (int) ((c - min) * scale);
        return k < 0 ? 0 : Math.min(k, BINS - 1);
    }

    private static float area(float ex, float ey, float ez) {
        return 2f * (ex * ey + ey * ez + ez * ex);
    }
}
