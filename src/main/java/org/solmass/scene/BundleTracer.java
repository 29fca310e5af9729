package org.solmass.scene;

/**
 * Queries for a bundle of rays that share one origin: the hemisphere rays, horizon rays and sun rays
 * of one patch. Any hit ({@link #occluded}) gives exactly the answers of {@link Tracer#occluded} ray
 * by ray, closest hit ({@link #closestHit}) the distances of {@link Tracer#closestHit} (same float
 * arithmetic, tested), several times faster, because the bundle walks the tree together. With the
 * vector module loaded the SIMD kernel {@link VectorOcclusion} does the walking (packets of rays,
 * streamed); otherwise the scalar loop below does any hit and closest hit goes one ray at a time.
 *
 * <p>Scalar method: ray-stream traversal (Wald, Gribble, Boulos and Kensler, 2007, "SIMD ray stream tracing",
 * SCI Institute technical report UUSCI-2007-012; Barringer and Akenine-Moller, 2014, "Dynamic ray
 * stream traversal", ACM Transactions on Graphics 33(4)): each BVH node is visited at most once per
 * bundle, with the list of the bundle's rays that reach it; one tight, branch-free loop over that list
 * splits it into the lists of rays that hit the first and the second child box. A node is fetched
 * once for all its rays instead of once per ray, and the per-ray work has no unpredictable branches.
 * The child on the near side of the node's split plane (by the sign of the octant's direction along
 * the split axis, as in Pharr, Jakob and Humphreys, Physically Based Rendering, 3rd ed., 2016,
 * section 4.3.5) is entered first so that hits are found early; a ray that hits is retired (its limit
 * set below zero) and drops out of every list after that.
 *
 * <p>Rays are split by direction octant first, so that within one stream the near and far slab of
 * every axis is known per node (Williams, Barrus, Morley and Shirley, 2005, "An efficient and robust
 * ray-box intersection algorithm", Journal of Graphics Tools 10(1)). Because the origin is shared,
 * the slab offsets {@code box - origin} and the triangle terms of the Moller-Trumbore test that
 * depend on the origin only ({@code s = o - v0}, {@code q = s x e1}, {@code e2 . q}) are computed once
 * per node or triangle for the whole stream.
 *
 * <p>Per-thread and reusable; allocates only when a bundle (or a shared set) is larger than any before
 * it. It holds one set of shared rays ({@link #share}): one owner per tracer sets and uses it.
 */
public final class BundleTracer {
    static final float TINY_DIR = 1e-20f;
    private static final float RETIRED = -1f;

    /**
     * Whether the SIMD kernel can run: the JVM was started with {@code --add-modules
     * jdk.incubator.vector} (the {@code solmass} launcher and the build do this) and the system
     * property {@code solmass.simd} is not {@code false}.
     */
    public static final boolean SIMD_AVAILABLE = ModuleLayer.boot().findModule("jdk.incubator.vector").isPresent()
            && !"false".equals(System.getProperty("solmass.simd"));

    private final Scene scene;
    private final float[] nodes, tris;
    private final int[] stRef, stStart, stLen;
    private float[] dx = new float[0], dy = dx, dz = dx, ix = dx, iy = dx, iz = dx, lim = dx;
    private int[] list = new int[0];
    private final int[] octantCount = new int[8], octantStart = new int[8], bucketCount = new int[8 * CELLS * CELLS];
    private int[] key = new int[0];
    private double[] groundT = new double[0];
    private int[] leafTri = new int[0];
    private float[] hitT = new float[0];
    private Tracer single;

    private final VectorOcclusion simd;

    BundleTracer(Scene scene) {
        this(scene, SIMD_AVAILABLE);
    }

    /** @param simd whether to use the SIMD packet kernel ({@link #SIMD_AVAILABLE} must hold) */
    BundleTracer(Scene scene, boolean simd) {
        if (simd && !SIMD_AVAILABLE) throw new IllegalStateException("the jdk.incubator.vector module is not loaded");
        this.simd = simd ? new VectorOcclusion(scene) : null;
        this.scene = scene;
        this.nodes = scene.nodes;
        this.tris = scene.tris;
        int depth = scene.maxDepth + 2;
        stRef = new int[depth];
        stStart = new int[depth];
        stLen = new int[depth];
    }

    public Scene scene() { return scene; }

    /** Whether this tracer runs the SIMD packet kernel (else the scalar ray-stream loop). */
    public boolean simd() { return simd != null; }

    /**
     * For rays {@code s < count} from the common origin o (world coordinates, metres) along unit
     * directions {@code dir[3s..3s+2]}: {@code out[s]} = whether anything (a triangle from either side,
     * or the ground plane) lies on the ray at {@code 0 < t < tMax[s]}, or the far horizon obstructs a
     * ray with no limit (decided before the tree is walked); {@code tMax == null} means
     * +infinity for every ray. Equal to {@link Tracer#occluded} for each ray.
     */
    public void occluded(double ox, double oy, double oz, double[] dir, double[] tMax, int count, boolean[] out) {
        ensure(count);
        int queued = 0;
        for (int s = 0; s < count; s++) {
            double ddx = dir[3 * s], ddy = dir[3 * s + 1], ddz = dir[3 * s + 2];
            queued += load(s, ox, oy, oz, ddx, ddy, ddz, tMax == null ? Double.POSITIVE_INFINITY : tMax[s], out);
        }
        trace(ox, oy, oz, count, queued, out);
    }

    /** As {@link #occluded(double, double, double, double[], double[], int, boolean[])} with float directions. */
    public void occluded(double ox, double oy, double oz, float[] dir, double[] tMax, int count, boolean[] out) {
        ensure(count);
        int queued = 0;
        for (int s = 0; s < count; s++) {
            queued += load(s, ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2],
                    tMax == null ? Double.POSITIVE_INFINITY : tMax[s], out);
        }
        trace(ox, oy, oz, count, queued, out);
    }

    /**
     * As {@link #occluded(double, double, double, double[], double[], int, boolean[])} with no limit,
     * for directions whose far-horizon answers the caller has already: {@code far[s]} must be
     * {@link Scene#escapeBlocked(double[], int)} of direction s (computed once for a set of directions
     * traced from many origins). A ray with {@code far[s]} is blocked without being traced; for the
     * others the far horizon is not asked again. The answers are those of {@code occluded}: the far
     * horizon, the ground plane and the tree each block a ray on their own, whatever the order.
     */
    public void occludedKnownFar(double ox, double oy, double oz, double[] dir, boolean[] far, int count, boolean[] out) {
        occludedKnownFar(ox, oy, oz, dir, null, far, count, out);
    }

    /**
     * As {@link #occludedKnownFar(double, double, double, double[], boolean[], int, boolean[])} with a
     * limit per ray ({@code tMax == null}: none): {@code far[s]} must be the far horizon's answer
     * ({@link Scene#escapeBlocked(double, double, double)}) for a ray without a limit, and false for a
     * ray with one (the far horizon lies beyond every limit). Rays of several kinds from one origin
     * (hemisphere, horizon band, sun) can so go through the tree as one bundle.
     */
    public void occludedKnownFar(double ox, double oy, double oz, double[] dir, double[] tMax, boolean[] far, int count, boolean[] out) {
        trace(ox, oy, oz, count, loadKnownFar(ox, oy, oz, dir, tMax, far, count, out), out);
    }

    /** Stores rays s &lt; count of {@link #occludedKnownFar}; returns how many need the tree. */
    private int loadKnownFar(double ox, double oy, double oz, double[] dir, double[] tMax, boolean[] far, int count, boolean[] out) {
        ensure(count);
        int queued = 0;
        for (int s = 0; s < count; s++) {
            if (far[s]) {
                out[s] = true;
                lim[s] = RETIRED;
                continue;
            }
            queued += load(s, ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2],
                    tMax == null ? Double.POSITIVE_INFINITY : tMax[s], false, out);
        }
        return queued;
    }

    /**
     * Sets the shared rays: directions {@code dir[3s..3s+2]} (s &lt; count) with no limit that the
     * caller traces from many origins with {@link #occludedWithShared}, and their far-horizon answers
     * {@code far[s]} ({@link Scene#escapeBlocked(double[], int)}): the sun directions and horizon band
     * in front of one plane, the same for every patch of that plane. With the SIMD kernel they are
     * sorted into packets here, once, instead of with every bundle. Replaces the shared rays before.
     */
    public void share(double[] dir, boolean[] far, int count) {
        if (sharedDir.length < 3 * count) {
            sharedDir = new double[3 * count];
            sharedFar = new boolean[count];
        }
        System.arraycopy(dir, 0, sharedDir, 0, 3 * count);
        System.arraycopy(far, 0, sharedFar, 0, count);
        sharedCount = count;
        sharedUp = false;
        sharedDown = false;
        for (int s = 0; s < count; s++) {
            sharedUp |= dir[3 * s + 2] > 0;
            sharedDown |= dir[3 * s + 2] < 0;
        }
        sharedPacked = simd != null && scene.nodeCount > 0;
        if (!sharedPacked) return;
        ensure(count);
        for (int s = 0; s < count; s++) { // as load() with no limit and no ground plane: the far horizon's rays never enter
            dx[s] = (float) dir[3 * s];
            dy[s] = (float) dir[3 * s + 1];
            dz[s] = (float) dir[3 * s + 2];
            lim[s] = far[s] ? RETIRED : Float.MAX_VALUE; // (float) min(+infinity, Float.MAX_VALUE), as load() sets it
        }
        keys(count);
        simd.share(count, key, bucketCount, CELLS * CELLS, dx, dy, dz, lim);
    }

    /**
     * {@link #occludedKnownFar(double, double, double, double[], double[], boolean[], int, boolean[])}
     * of rays {@code s < count} and, in the same pass, of the shared rays ({@link #share}):
     * {@code sharedOut[i]} = whether shared ray i is blocked from origin o. The answers are those of
     * tracing the shared rays as a bundle of their own with {@code occludedKnownFar}: a ray's answer
     * does not depend on the rays traced with it. The shared packets are used when the ground plane
     * cannot decide a shared ray from this origin (below the plane an upward ray meets it; above it a
     * downward one does); otherwise, and without the SIMD kernel, the shared rays are traced as a
     * second bundle. With {@code count == 0}, {@code out} and {@code sharedOut} may be one array.
     */
    public void occludedWithShared(double ox, double oy, double oz, double[] dir, double[] tMax, boolean[] far, int count,
                                   boolean[] out, boolean[] sharedOut) {
        if (sharedCount < 0) throw new IllegalStateException("no shared rays: call share() first");
        double rise = scene.groundZ - oz; // as load(): the plane meets a ray whose dz has the sign of rise
        boolean planeDecides = scene.groundPlane && (rise > 0 ? sharedUp : rise < 0 && sharedDown);
        if (!sharedPacked || planeDecides) {
            occludedKnownFar(ox, oy, oz, dir, tMax, far, count, out);
            occludedKnownFar(ox, oy, oz, sharedDir, null, sharedFar, sharedCount, sharedOut);
            return;
        }
        loadKnownFar(ox, oy, oz, dir, tMax, far, count, out);
        packedTraces++;
        System.arraycopy(sharedFar, 0, sharedOut, 0, sharedCount); // the packed ones are set by the kernel
        keys(count);
        float fox = (float) (ox - scene.shiftX), foy = (float) (oy - scene.shiftY), foz = (float) (oz - scene.shiftZ);
        simd.trace(count, key, bucketCount, CELLS * CELLS, fox, foy, foz, dx, dy, dz, lim, out, sharedOut);
    }

    /** The shared rays ({@link #share}): directions, far-horizon answers, count (-1: none yet). */
    private double[] sharedDir = new double[0];
    private boolean[] sharedFar = new boolean[0];
    private int sharedCount = -1;
    /** Whether some shared direction points up (dz &gt; 0) or down (dz &lt; 0): the ground plane's cases. */
    private boolean sharedUp, sharedDown;
    /** Whether the SIMD kernel holds the shared rays' packets. */
    private boolean sharedPacked;
    /** Calls of {@link #occludedWithShared} that used the shared packets (for the test that checks they are used). */
    long packedTraces;

    private int load(int s, double ox, double oy, double oz, double ddx, double ddy, double ddz, double tMax, boolean[] out) {
        return load(s, ox, oy, oz, ddx, ddy, ddz, tMax, true, out);
    }

    /**
     * Stores ray s; returns 1 if it needs the tree, 0 if the ground plane (or nothing) decided it.
     * {@code askFar}: whether the far horizon is asked for a ray with no limit.
     */
    private int load(int s, double ox, double oy, double oz, double ddx, double ddy, double ddz, double tMax,
                     boolean askFar, boolean[] out) {
        double rise = scene.groundZ - oz; // as Tracer.groundT; t > 0 needs rise and ddz of one sign
        if (scene.groundPlane && (rise > 0 ? ddz > 0 : rise < 0 && ddz < 0)) {
            double t = rise / ddz;
            if (t > 0 && t < tMax) {
                out[s] = true;
                lim[s] = RETIRED;
                return 0;
            }
        }
        if (askFar && tMax == Double.POSITIVE_INFINITY && scene.escapeBlocked(ddx, ddy, ddz)) { // far horizon: as Tracer
            out[s] = true;
            lim[s] = RETIRED;
            return 0;
        }
        out[s] = false;
        float fx = (float) ddx, fy = (float) ddy, fz = (float) ddz;
        dx[s] = fx;
        dy[s] = fy;
        dz[s] = fz;
        if (simd == null) { // the SIMD kernel takes the inverses itself, 16 at a time
            ix[s] = 1f / (Math.abs(fx) < TINY_DIR ? Math.copySign(TINY_DIR, fx) : fx);
            iy[s] = 1f / (Math.abs(fy) < TINY_DIR ? Math.copySign(TINY_DIR, fy) : fy);
            iz[s] = 1f / (Math.abs(fz) < TINY_DIR ? Math.copySign(TINY_DIR, fz) : fz);
        }
        if (scene.nodeCount == 0) {
            lim[s] = RETIRED;
            return 0;
        }
        lim[s] = (float) Math.min(tMax, Float.MAX_VALUE);
        return 1;
    }

    private void ensure(int count) {
        if (dx.length >= count) return;
        dx = new float[count];
        dy = new float[count];
        dz = new float[count];
        ix = new float[count];
        iy = new float[count];
        iz = new float[count];
        lim = new float[count];
        key = new int[count];
        // the scalar stream keeps the child lists of the current path above the sorted rays
        list = new int[simd != null ? count : count + 2 * count * (scene.maxDepth + 2)];
    }

    /**
     * Direction octant from the sign bits: bit 0 for x, 1 for y, 2 for z set when negative. The sign
     * bit is the sign of the inverse direction too (the tiny-component clamp keeps it, and -0 gives a
     * negative inverse), which picks the near and far slab of each axis.
     */
    static int octant(float dx, float dy, float dz) {
        return (Float.floatToRawIntBits(dx) >>> 31) | (Float.floatToRawIntBits(dy) >>> 31) << 1
                | (Float.floatToRawIntBits(dz) >>> 31) << 2;
    }

    /**
     * Direction cells per axis within an octant for the ray order: rays are sorted (counting sort) by
     * octant, then by a CELLS x CELLS grid on (|dx|, |dy|), so that neighbouring rays in a stream or
     * packet point alike (Wald et al., 2001, coherent packets).
     */
    private static final int CELLS = 4;

    private static int cell(float dx, float dy) {
        int cx = Math.min(CELLS - 1, (int) (Math.abs(dx) * CELLS)), cy = Math.min(CELLS - 1, (int) (Math.abs(dy) * CELLS));
        return cx * CELLS + cy;
    }

    private void trace(double wox, double woy, double woz, int count, int queued, boolean[] out) {
        if (queued == 0) return;
        keys(count);
        float ox = (float) (wox - scene.shiftX), oy = (float) (woy - scene.shiftY), oz = (float) (woz - scene.shiftZ);
        if (simd != null) {
            simd.trace(count, key, bucketCount, CELLS * CELLS, ox, oy, oz, dx, dy, dz, lim, out, null);
            return;
        }
        sort(count);
        for (int o = 0; o < 8; o++) {
            if (octantCount[o] > 0) stream(o, octantStart[o], octantCount[o], queued, ox, oy, oz, out);
        }
    }

    /** Sort key of each live ray (lim >= 0; -1 for the others): octant, then cell; counts per key in bucketCount. */
    private void keys(int count) {
        final int[] cnt = bucketCount, key = this.key;
        java.util.Arrays.fill(cnt, 0);
        for (int s = 0; s < count; s++) {
            if (lim[s] < 0) { key[s] = -1; continue; }
            int k = key(dx[s], dy[s], dz[s]);
            key[s] = k;
            cnt[k]++;
        }
    }

    private static int key(float dx, float dy, float dz) {
        return octant(dx, dy, dz) * CELLS * CELLS + cell(dx, dy);
    }

    /** Counting sort of the keyed rays ({@link #keys}) into {@code list} by octant and cell; fills the octant runs. */
    private void sort(int count) {
        final int[] cnt = bucketCount, key = this.key;
        int at = 0;
        for (int k = 0; k < cnt.length; k++) {
            int c = cnt[k];
            cnt[k] = at;
            at += c;
        }
        for (int o = 0; o < 8; o++) {
            octantStart[o] = cnt[o * CELLS * CELLS];
            octantCount[o] = (o == 7 ? at : cnt[(o + 1) * CELLS * CELLS]) - octantStart[o];
        }
        for (int s = 0; s < count; s++) if (key[s] >= 0) list[cnt[key[s]]++] = s;
    }

    /**
     * Closest hit of rays {@code s < count} from the common origin o along unit directions
     * {@code dir[3s..3s+2]}, with no distance limit: {@code tri[s]} = as {@link Tracer#closestHit}
     * (original triangle index, {@link Tracer#GROUND}, {@link Tracer#HORIZON} or {@link Tracer#MISS}) and {@code dist[s]} =
     * its {@link Tracer#t()}. The same distance as one ray at a time; when two triangles meet the ray
     * at exactly the same distance (a shared edge) either may be reported, as for the single ray.
     * With the SIMD kernel the rays go through the tree together; otherwise one at a time.
     */
    public void closestHit(double ox, double oy, double oz, double[] dir, int count, int[] tri, double[] dist) {
        if (simd == null || scene.nodeCount == 0) {
            if (single == null) single = scene.tracer();
            for (int s = 0; s < count; s++) {
                tri[s] = single.closestHit(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], Double.POSITIVE_INFINITY);
                dist[s] = single.t();
            }
            return;
        }
        ensure(count);
        if (groundT.length < count) {
            groundT = new double[count];
            leafTri = new int[count];
            hitT = new float[count];
        }
        final int[] cnt = bucketCount;
        java.util.Arrays.fill(cnt, 0);
        boolean plane = scene.groundPlane;
        double rise = scene.groundZ - oz;
        for (int s = 0; s < count; s++) {
            double ddz = dir[3 * s + 2], t = rise / ddz; // as Tracer.groundT
            double tg = plane && ddz != 0 && t > 0 ? t : Double.POSITIVE_INFINITY;
            groundT[s] = tg;
            float fx = (float) dir[3 * s], fy = (float) dir[3 * s + 1], fz = (float) ddz;
            dx[s] = fx;
            dy[s] = fy;
            dz[s] = fz;
            lim[s] = (float) Math.min(tg, Float.MAX_VALUE);
            int k = key(fx, fy, fz);
            key[s] = k;
            cnt[k]++;
        }
        float fox = (float) (ox - scene.shiftX), foy = (float) (oy - scene.shiftY), foz = (float) (oz - scene.shiftZ);
        simd.closest(count, key, cnt, CELLS * CELLS, fox, foy, foz, dx, dy, dz, lim, leafTri, hitT);
        for (int s = 0; s < count; s++) {
            if (leafTri[s] >= 0) {
                tri[s] = scene.triOriginal[leafTri[s]];
                dist[s] = hitT[s];
            } else if (groundT[s] < Double.POSITIVE_INFINITY) {
                tri[s] = Tracer.GROUND;
                dist[s] = groundT[s];
            } else {
                tri[s] = scene.escapeBlocked(dir[3 * s], dir[3 * s + 1], dir[3 * s + 2]) ? Tracer.HORIZON : Tracer.MISS;
                dist[s] = Double.POSITIVE_INFINITY;
            }
        }
    }

    /** Traverses the tree with the rays list[start, start+len) of one direction octant. */
    private void stream(int octant, int start, int len, int top, float ox, float oy, float oz, boolean[] out) {
        final float[] n = nodes, t = tris;
        final float[] ix = this.ix, iy = this.iy, iz = this.iz, lim = this.lim;
        final int[] l = list;
        int loX = (octant & 1) != 0 ? 3 : 0, hiX = 3 - loX;
        int loY = (octant & 2) != 0 ? 4 : 1, hiY = 5 - loY;
        int loZ = (octant & 4) != 0 ? 5 : 2, hiZ = 7 - loZ;
        int sp = 0, ref = 0;
        while (true) {
            if ((ref & 1) == 0) {
                int b = (ref >>> 1) << 4;
                float ax0 = n[b + loX] - ox, ax1 = n[b + hiX] - ox;
                float ay0 = n[b + loY] - oy, ay1 = n[b + hiY] - oy;
                float az0 = n[b + loZ] - oz, az1 = n[b + hiZ] - oz;
                float bx0 = n[b + 6 + loX] - ox, bx1 = n[b + 6 + hiX] - ox;
                float by0 = n[b + 6 + loY] - oy, by1 = n[b + 6 + hiY] - oy;
                float bz0 = n[b + 6 + loZ] - oz, bz1 = n[b + 6 + hiZ] - oz;
                int aStart = top, bStart = top + len, na = 0, nb = 0;
                for (int k = start, end = start + len; k < end; k++) {
                    int i = l[k];
                    float rx = ix[i], ry = iy[i], rz = iz[i], m = lim[i];
                    int mi = Float.floatToRawIntBits(m);
                    int an = Math.max(Math.max(bits(ax0 * rx), bits(ay0 * ry)), Math.max(bits(az0 * rz), 0));
                    int af = Math.min(Math.min(bits(ax1 * rx), bits(ay1 * ry)), Math.min(bits(az1 * rz), mi));
                    int bn = Math.max(Math.max(bits(bx0 * rx), bits(by0 * ry)), Math.max(bits(bz0 * rz), 0));
                    int bf = Math.min(Math.min(bits(bx1 * rx), bits(by1 * ry)), Math.min(bits(bz1 * rz), mi));
                    l[aStart + na] = i;
                    na += an <= af ? 1 : 0;
                    l[bStart + nb] = i;
                    nb += bn <= bf ? 1 : 0;
                }
                int ra = Float.floatToRawIntBits(n[b + 12]), rb = Float.floatToRawIntBits(n[b + 13]);
                top = bStart + nb;
                if (na > 0 && nb > 0) {
                    if ((octant >>> Float.floatToRawIntBits(n[b + 14]) & 1) == 0) { // A (lower side) first
                        stRef[sp] = rb; stStart[sp] = bStart; stLen[sp++] = nb;
                        ref = ra; start = aStart; len = na;
                    } else {
                        stRef[sp] = ra; stStart[sp] = aStart; stLen[sp++] = na;
                        ref = rb; start = bStart; len = nb;
                    }
                    continue;
                }
                if (na > 0) { ref = ra; start = aStart; len = na; continue; }
                if (nb > 0) { ref = rb; start = bStart; len = nb; continue; }
            } else {
                leaf(t, ref, start, len, ox, oy, oz, out);
            }
            if (sp == 0) return;
            ref = stRef[--sp];
            start = stStart[sp];
            len = stLen[sp];
            top = start + len;
        }
    }

    private static int bits(float f) { return Float.floatToRawIntBits(f); }

    /**
     * Moller-Trumbore tests of one leaf's triangles against the live rays of the list, with the terms
     * that depend only on the shared origin hoisted; the arithmetic is that of {@code Tracer.intersect}
     * operation for operation, so the answers are identical.
     */
    private void leaf(float[] t, int ref, int start, int len, float ox, float oy, float oz, boolean[] out) {
        final float[] dx = this.dx, dy = this.dy, dz = this.dz, lim = this.lim;
        final int[] l = list;
        int first = ref >>> 4, last = first + ((ref >>> 1) & 7);
        for (int tri = first; tri <= last; tri++) {
            int k = tri * Scene.TRI_WORDS;
            float e1x = t[k + 3], e1y = t[k + 4], e1z = t[k + 5];
            float e2x = t[k + 6], e2y = t[k + 7], e2z = t[k + 8];
            float sx = ox - t[k], sy = oy - t[k + 1], sz = oz - t[k + 2];
            float qx = sy * e1z - sz * e1y, qy = sz * e1x - sx * e1z, qz = sx * e1y - sy * e1x;
            float tq = e2x * qx + e2y * qy + e2z * qz;
            for (int j = start, end = start + len; j < end; j++) {
                int i = l[j];
                float m = lim[i];
                if (m < 0f) continue; // retired by an earlier hit
                float rx = dx[i], ry = dy[i], rz = dz[i];
                float px = ry * e2z - rz * e2y, py = rz * e2x - rx * e2z, pz = rx * e2y - ry * e2x;
                float det = e1x * px + e1y * py + e1z * pz;
                if (det == 0f) continue;
                float inv = 1f / det;
                float u = (sx * px + sy * py + sz * pz) * inv;
                if (u < 0f || u > 1f) continue;
                float v = (rx * qx + ry * qy + rz * qz) * inv;
                if (v < 0f || u + v > 1f) continue;
                float h = tq * inv;
                if (h > 0f && h < m) {
                    out[i] = true;
                    lim[i] = RETIRED;
                }
            }
        }
    }
}
