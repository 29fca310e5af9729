package org.solmass.scene;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.IntVector;
import jdk.incubator.vector.VectorMask;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

/**
 * SIMD kernel behind {@link BundleTracer}: the rays of a bundle (one origin) are cut into packets of
 * one vector's width (16 lanes with AVX-512, 8 with AVX2), each packet from one direction octant
 * (Wald, Slusallek, Benthin and Wagner, 2001, "Interactive rendering with coherent ray tracing",
 * Computer Graphics Forum 20(3)); the packets then walk the tree together as a stream of packets
 * (the ray-stream traversal of Wald, Gribble, Boulos and Kensler, 2007, SCI Institute technical
 * report UUSCI-2007-012, with packets in place of rays): each node is visited once per bundle with
 * the list of packets that reach it, so the node's fetch, branches and stack work are paid once for
 * all of them, and each packet pays one vector slab test of both child boxes. A leaf is tested
 * lane-wise against the lanes that hit its box. Uses the incubating Vector API of the JDK (JEP 414);
 * {@link BundleTracer} uses it only when the module {@code jdk.incubator.vector} is present and falls
 * back to its scalar ray-stream loop otherwise. The far horizon ({@link Scene#withHorizon}) is
 * decided before this kernel, in {@code BundleTracer.load} (any hit: a ray it stops never enters) and
 * after it (closest hit: a ray that hits nothing is checked), so the kernel itself does not change.
 *
 * <p>Lane arithmetic is the arithmetic of {@code Tracer} operation for operation (IEEE single
 * precision, no fused multiply-add, the int-domain slab test), so every lane gives the single-ray
 * answer. No lane mask is needed at interior nodes: a child box lies inside its parent's, and the
 * slab values are monotone in the box bounds, so a lane that misses a parent misses every box below
 * it. At a leaf the lanes that miss the leaf's own box are masked out.
 *
 * <p>Vector values never outlive one small method (they are loaded from the packet arrays each
 * time): C2 then keeps them in registers, where vectors carried across loop iterations, returned
 * from methods it does not inline, or held in methods past its inlining budget are boxed on the heap.
 */
final class VectorOcclusion {
    static final VectorSpecies<Float> F = FloatVector.SPECIES_PREFERRED;
    static final VectorSpecies<Integer> I = IntVector.SPECIES_PREFERRED;
    static final int LANES = F.length();
    private static final float RETIRED = -1f;
    private static final int RETIRED_BITS = Float.floatToRawIntBits(RETIRED);

    private final float[] nodes, tris;
    private final int[] stRef, stBox, stStart, stLen;
    private float[] px = new float[0], py = px, pz = px, pix = px, piy = px, piz = px, plim = px;
    private int[] pray = new int[0];
    /** Closest-hit mode: per lane the leaf-order index of the best triangle so far, as float bits. */
    private float[] pbest = new float[0];
    /** Per lane the distance of its hit of the triangle being tested, or -1. */
    private float[] phit = new float[0];
    private boolean closestMode;
    private static final float NONE = Float.intBitsToFloat(-1);
    private int[] preach = new int[0];
    private int[] pOctant = new int[0], plist = new int[0];
    /**
     * Lanes at the start of the packet arrays that hold the shared rays ({@link #share}): packed once,
     * traced from many origins; every bundle's own packets follow them.
     */
    private int sharedLanes;
    /** The shared lanes' limits before a trace (a trace retires lanes in {@link #plim}). */
    private float[] sharedLim = new float[0];
    /** Slab offsets box - origin of the node being visited: child A lo x,y,z, hi x,y,z, then child B. */
    private final float[] delta = new float[12];

    VectorOcclusion(Scene scene) {
        this.nodes = scene.nodes;
        this.tris = scene.tris;
        int depth = scene.maxDepth + 2;
        stRef = new int[depth];
        stBox = new int[depth];
        stStart = new int[depth];
        stLen = new int[depth];
    }

    /**
     * Traces the rays of a bundle from the shifted origin o and sets {@code out[ray]} for every ray
     * that is blocked. The rays are laid out in packets by their sort keys ({@link #pack}), so that
     * a packet's lanes share their direction signs. With {@code sharedOut} not null the shared rays
     * ({@link #share}) go through the tree with them, and {@code sharedOut[ray]} is set (true or
     * false) for each shared ray that was packed; a shared ray that was not (its limit was below zero)
     * is left as it is.
     */
    void trace(int count, int[] key, int[] bucketCount, int bucketsPerOctant, float ox, float oy, float oz,
               float[] dx, float[] dy, float[] dz, float[] lim, boolean[] out, boolean[] sharedOut) {
        closestMode = false;
        int base = sharedLanes, k = pack(base, count, key, bucketCount, bucketsPerOctant, dx, dy, dz, lim);
        int first = sharedOut != null ? 0 : base / LANES, packets = (base + k) / LANES - first;
        for (int j = 0; j < packets; j++) plist[j] = first + j;
        if (sharedOut != null) System.arraycopy(sharedLim, 0, plim, 0, base);
        stream(packets, ox, oy, oz);
        for (int j = base; j < base + k; j++) if (pray[j] >= 0 && plim[j] < 0) out[pray[j]] = true;
        if (sharedOut != null) for (int j = 0; j < base; j++) if (pray[j] >= 0) sharedOut[pray[j]] = plim[j] < 0;
    }

    /**
     * Packs rays that will be traced from many origins (the sun directions and horizon band in front of
     * one plane) once, ahead of every bundle's own packets, for {@link #trace} with a {@code sharedOut};
     * keyed as {@link #pack} wants them. Replaces the shared rays before.
     */
    void share(int count, int[] key, int[] bucketCount, int bucketsPerOctant, float[] dx, float[] dy, float[] dz, float[] lim) {
        sharedLanes = 0;
        int k = pack(0, count, key, bucketCount, bucketsPerOctant, dx, dy, dz, lim);
        if (sharedLim.length < k) sharedLim = new float[k];
        System.arraycopy(plim, 0, sharedLim, 0, k);
        sharedLanes = k;
    }

    /**
     * Closest hit instead of any hit for the same bundle layout: {@code leafTri[ray]} = leaf-order
     * index of the nearest triangle with 0 &lt; t &lt; lim[ray], or -1; {@code hitT[ray]} its t (the
     * float of {@code Tracer}'s Moller-Trumbore). Lanes keep their best t as their limit, so boxes
     * beyond it are culled, as in the single-ray closest-hit traversal. The shared rays are not traced
     * (their packets stay as they are).
     */
    void closest(int count, int[] key, int[] bucketCount, int bucketsPerOctant, float ox, float oy, float oz,
                 float[] dx, float[] dy, float[] dz, float[] lim, int[] leafTri, float[] hitT) {
        closestMode = true;
        int base = sharedLanes, k = pack(base, count, key, bucketCount, bucketsPerOctant, dx, dy, dz, lim);
        java.util.Arrays.fill(pbest, base, base + k, NONE);
        int packets = k / LANES;
        for (int j = 0; j < packets; j++) plist[j] = base / LANES + j;
        stream(packets, ox, oy, oz);
        for (int j = base; j < base + k; j++) {
            int ray = pray[j];
            if (ray < 0) continue;
            leafTri[ray] = Float.floatToRawIntBits(pbest[j]);
            hitT[ray] = plim[j];
        }
    }

    /**
     * Counting sort of the rays straight into packets from lane {@code base} (a whole packet; the
     * lanes before it are kept): ray s with {@code key[s] >= 0} (direction octant x bucketsPerOctant +
     * direction cell; -1 for a ray already decided) goes after the rays of smaller keys and of its own
     * key with smaller index; each octant's run is padded with retired lanes to whole packets.
     * {@code bucketCount} holds the rays per key (it is overwritten). Fills the packet arrays and their
     * inverse directions and octants; returns the lanes used from {@code base}. The caller fills the
     * packet list.
     */
    private int pack(int base, int count, int[] key, int[] bucketCount, int bucketsPerOctant,
                     float[] dx, float[] dy, float[] dz, float[] lim) {
        int packets = 0;
        for (int o = 0, b = 0; o < 8; o++) {
            int c = 0;
            for (int e = b + bucketsPerOctant; b < e; b++) c += bucketCount[b];
            packets += (c + LANES - 1) / LANES;
        }
        ensure(base / LANES + packets);
        int at = base, pk = base / LANES;
        for (int o = 0, b = 0; o < 8; o++) {
            int first = at;
            for (int e = b + bucketsPerOctant; b < e; b++) { // bucket b's first lane
                int c = bucketCount[b];
                bucketCount[b] = at;
                at += c;
            }
            int end = first + (at - first + LANES - 1) / LANES * LANES;
            for (; at < end; at++) { // padding lanes are retired
                px[at] = 1; py[at] = 1; pz[at] = 1;
                plim[at] = RETIRED;
                pray[at] = -1;
            }
            while (pk < end / LANES) pOctant[pk++] = o;
        }
        for (int s = 0; s < count; s++) {
            int kk = key[s];
            if (kk < 0) continue;
            int j = bucketCount[kk]++;
            px[j] = dx[s]; py[j] = dy[s]; pz[j] = dz[s];
            plim[j] = lim[s];
            pray[j] = s;
        }
        for (int q = base; q < at; q += LANES) { // inverse directions, as the single-ray tracer takes them
            inverse(px, pix, q);
            inverse(py, piy, q);
            inverse(pz, piz, q);
        }
        return at - base;
    }

    private static final int SIGN = 0x80000000, TINY_BITS = Float.floatToRawIntBits(BundleTracer.TINY_DIR);

    /**
     * {@code inv[q..] = 1 / (|d| < TINY ? copySign(TINY, d) : d)} lane by lane: the single-ray
     * formula, so the values are the same bit for bit.
     */
    private static void inverse(float[] d, float[] inv, int q) {
        FloatVector v = FloatVector.fromArray(F, d, q);
        IntVector b = v.reinterpretAsInts();
        FloatVector tiny = b.and(SIGN).or(TINY_BITS).reinterpretAsFloats();
        v.blend(tiny, v.abs().compare(VectorOperators.LT, BundleTracer.TINY_DIR)).intoArray(inv, q);
        FloatVector.broadcast(F, 1f).div(FloatVector.fromArray(F, inv, q)).intoArray(inv, q);
    }

    /** Room for {@code packets} packets in all; the packets already there (the shared ones) are kept. */
    private void ensure(int packets) {
        int n = packets * LANES;
        if (pOctant.length < packets) {
            pOctant = java.util.Arrays.copyOf(pOctant, packets);
            plist = new int[packets + 2 * packets * (stRef.length)];
        }
        if (px.length >= n) return;
        px = java.util.Arrays.copyOf(px, n); py = java.util.Arrays.copyOf(py, n); pz = java.util.Arrays.copyOf(pz, n);
        pix = java.util.Arrays.copyOf(pix, n); piy = java.util.Arrays.copyOf(piy, n); piz = java.util.Arrays.copyOf(piz, n);
        plim = java.util.Arrays.copyOf(plim, n);
        pray = java.util.Arrays.copyOf(pray, n);
        preach = new int[n];
        pbest = new float[n];
        phit = new float[n];
    }

    /**
     * All packets walk the tree together, as rays do in the scalar stream of {@link BundleTracer}:
     * each node is visited once, with the list of packets that reach it, and one loop sorts them
     * into the lists of the two children (list regions are allocated above {@code top} and freed in
     * stack order).
     */
    private void stream(int packets, float ox, float oy, float oz) {
        final float[] n = nodes;
        final int[] l = plist, oct = pOctant;
        int sp = 0, ref = 0, box = -1, start = 0, len = packets, top = packets;
        while (true) {
            if ((ref & 1) == 0) {
                int b = (ref >>> 1) << 4;
                int aStart = top, bStart = top + len, na = 0, nb = 0;
                int ra = Float.floatToRawIntBits(n[b + 12]), rb = Float.floatToRawIntBits(n[b + 13]);
                final float[] d = delta; // box - origin, once per node
                d[0] = n[b] - ox; d[1] = n[b + 1] - oy; d[2] = n[b + 2] - oz;
                d[3] = n[b + 3] - ox; d[4] = n[b + 4] - oy; d[5] = n[b + 5] - oz;
                d[6] = n[b + 6] - ox; d[7] = n[b + 7] - oy; d[8] = n[b + 8] - oz;
                d[9] = n[b + 9] - ox; d[10] = n[b + 10] - oy; d[11] = n[b + 11] - oz;
                // int-domain slab test (as in Tracer) of both child boxes for each packet, with the
                // near and far bound of each axis picked by the packet's octant; a packet whose
                // lanes are all retired hits nothing
                int curOct = -1;
                float nax = 0, nay = 0, naz = 0, fax = 0, fay = 0, faz = 0, nbx = 0, nby = 0, nbz = 0, fbx = 0, fby = 0, fbz = 0;
                for (int k = start, end = start + len; k < end; k++) {
                    int pk = l[k], o = oct[pk];
                    if (o != curOct) { // lists keep octant order (shared packets, then the bundle's own): at most 15 changes
                        curOct = o;
                        int lx = (o & 1) != 0 ? 3 : 0, ly = (o & 2) != 0 ? 4 : 1, lz = (o & 4) != 0 ? 5 : 2;
                        nax = d[lx]; nay = d[ly]; naz = d[lz]; fax = d[3 - lx]; fay = d[5 - ly]; faz = d[7 - lz];
                        nbx = d[6 + lx]; nby = d[6 + ly]; nbz = d[6 + lz]; fbx = d[9 - lx]; fby = d[11 - ly]; fbz = d[13 - lz];
                    }
                    int q = pk * LANES;
                    FloatVector vix = FloatVector.fromArray(F, pix, q), viy = FloatVector.fromArray(F, piy, q),
                            viz = FloatVector.fromArray(F, piz, q);
                    IntVector limBits = FloatVector.fromArray(F, plim, q).reinterpretAsInts();
                    IntVector an = vix.mul(nax).reinterpretAsInts().max(viy.mul(nay).reinterpretAsInts()).max(viz.mul(naz).reinterpretAsInts().max(0));
                    IntVector af = vix.mul(fax).reinterpretAsInts().min(viy.mul(fay).reinterpretAsInts()).min(viz.mul(faz).reinterpretAsInts().min(limBits));
                    IntVector bn = vix.mul(nbx).reinterpretAsInts().max(viy.mul(nby).reinterpretAsInts()).max(viz.mul(nbz).reinterpretAsInts().max(0));
                    IntVector bf = vix.mul(fbx).reinterpretAsInts().min(viy.mul(fby).reinterpretAsInts()).min(viz.mul(fbz).reinterpretAsInts().min(limBits));
                    int hit = (an.compare(VectorOperators.LE, af).anyTrue() ? 1 : 0) | (bn.compare(VectorOperators.LE, bf).anyTrue() ? 2 : 0);
                    l[aStart + na] = pk;
                    na += hit & 1;
                    l[bStart + nb] = pk;
                    nb += hit >>> 1;
                }
                top = bStart + nb;
                // branch-free choice of the next node (few mispredictions): with both children hit,
                // the near side of the split first (direction signs of the first packet), the other
                // pushed; with one hit, that one; with none, pop
                boolean both = na > 0 && nb > 0;
                boolean aFirst = both ? (oct[l[aStart]] >>> Float.floatToRawIntBits(n[b + 14]) & 1) == 0 : na > 0;
                stRef[sp] = aFirst ? rb : ra;
                stBox[sp] = aFirst ? b + 6 : b;
                stStart[sp] = aFirst ? bStart : aStart;
                stLen[sp] = aFirst ? nb : na;
                sp += both ? 1 : 0;
                ref = aFirst ? ra : rb;
                box = aFirst ? b : b + 6;
                start = aFirst ? aStart : bStart;
                len = aFirst ? na : nb;
                if (len > 0) continue;
            } else {
                for (int k = start, end = start + len; k < end; k++) {
                    int pk = l[k];
                    leaf(ref, box, pk * LANES, oct[pk], ox, oy, oz);
                }
            }
            if (sp == 0) return;
            ref = stRef[--sp];
            box = stBox[sp];
            start = stStart[sp];
            len = stLen[sp];
            top = start + len;
        }
    }

    /** The leaf {@code ref} (box at nodes[box..]) for the packet at lane q. */
    private void leaf(int ref, int box, int q, int octant, float ox, float oy, float oz) {
        if (!reach(box, q, octant, ox, oy, oz)) return;
        int first = ref >>> 4, last = first + ((ref >>> 1) & 7);
        for (int tri = first; tri <= last; tri++) triangle(tri * Scene.TRI_WORDS, q, ox, oy, oz);
    }

    /**
     * Writes preach[q..q+LANES): the limit of each lane that hits the leaf box at nodes[box..] (the
     * test of the stream loop), RETIRED for the others; returns whether any lane reaches the leaf.
     */
    private boolean reach(int box, int q, int octant, float ox, float oy, float oz) {
        final float[] n = nodes;
        int loX = (octant & 1) != 0 ? 3 : 0, hiX = 3 - loX;
        int loY = (octant & 2) != 0 ? 4 : 1, hiY = 5 - loY;
        int loZ = (octant & 4) != 0 ? 5 : 2, hiZ = 7 - loZ;
        FloatVector vix = FloatVector.fromArray(F, pix, q), viy = FloatVector.fromArray(F, piy, q),
                viz = FloatVector.fromArray(F, piz, q);
        IntVector limBits = FloatVector.fromArray(F, plim, q).reinterpretAsInts();
        IntVector near = vix.mul(n[box + loX] - ox).reinterpretAsInts().max(viy.mul(n[box + loY] - oy).reinterpretAsInts())
                .max(viz.mul(n[box + loZ] - oz).reinterpretAsInts().max(0));
        IntVector far = vix.mul(n[box + hiX] - ox).reinterpretAsInts().min(viy.mul(n[box + hiY] - oy).reinterpretAsInts())
                .min(viz.mul(n[box + hiZ] - oz).reinterpretAsInts().min(limBits));
        VectorMask<Integer> miss = near.compare(VectorOperators.GT, far);
        limBits.blend(RETIRED_BITS, miss).intoArray(preach, q);
        return !miss.allTrue();
    }

    /**
     * Moller-Trumbore of the triangle at tris[k..k+8] on the lanes [q, q + LANES), with the limits
     * of preach (lanes that missed the leaf box cannot hit); retires the lanes that are blocked, or
     * in closest-hit mode keeps the nearer hit per lane (float bits move through blend unchanged).
     * Three small methods rather than one: a large one can run past C2's inlining budget, and a
     * Vector API call that is not inlined runs the API's allocating Java code.
     */
    private void triangle(int k, int q, float ox, float oy, float oz) {
        distances(k, q, ox, oy, oz);
        if (closestMode) keepNearest(k, q);
        else retireBlocked(q);
    }

    /** phit[q..q+LANES) = t of each lane's hit of the triangle at tris[k..] with t > 0, else -1. */
    private void distances(int k, int q, float ox, float oy, float oz) {
        final float[] t = tris;
        float e1x = t[k + 3], e1y = t[k + 4], e1z = t[k + 5];
        float e2x = t[k + 6], e2y = t[k + 7], e2z = t[k + 8];
        float sx = ox - t[k], sy = oy - t[k + 1], sz = oz - t[k + 2];
        float qx = sy * e1z - sz * e1y, qy = sz * e1x - sx * e1z, qz = sx * e1y - sy * e1x;
        float tq = e2x * qx + e2y * qy + e2z * qz;
        FloatVector vdx = FloatVector.fromArray(F, px, q), vdy = FloatVector.fromArray(F, py, q),
                vdz = FloatVector.fromArray(F, pz, q);
        FloatVector ppx = vdy.mul(e2z).sub(vdz.mul(e2y)), ppy = vdz.mul(e2x).sub(vdx.mul(e2z)),
                ppz = vdx.mul(e2y).sub(vdy.mul(e2x));
        FloatVector det = ppx.mul(e1x).add(ppy.mul(e1y)).add(ppz.mul(e1z));
        FloatVector inv = FloatVector.broadcast(F, 1f).div(det);
        FloatVector u = ppx.mul(sx).add(ppy.mul(sy)).add(ppz.mul(sz)).mul(inv);
        FloatVector v = vdx.mul(qx).add(vdy.mul(qy)).add(vdz.mul(qz)).mul(inv);
        FloatVector h = inv.mul(tq);
        VectorMask<Float> miss = det.compare(VectorOperators.EQ, 0f)
                .or(u.compare(VectorOperators.LT, 0f)).or(u.compare(VectorOperators.GT, 1f))
                .or(v.compare(VectorOperators.LT, 0f)).or(u.add(v).compare(VectorOperators.GT, 1f))
                .or(h.compare(VectorOperators.GT, 0f).not()); // also NaN
        h.blend(-1f, miss).intoArray(phit, q);
    }

    /** Any hit: lanes whose hit lies before their limit (and that reached the leaf) are retired. */
    private void retireBlocked(int q) {
        FloatVector h = FloatVector.fromArray(F, phit, q);
        FloatVector reach = IntVector.fromArray(I, preach, q).reinterpretAsFloats();
        VectorMask<Float> hit = h.compare(VectorOperators.GT, 0f).and(h.compare(VectorOperators.LT, reach));
        FloatVector.fromArray(F, plim, q).blend(RETIRED, hit).intoArray(plim, q);
    }

    /** Closest hit: lanes that reached the leaf keep the triangle at tris[k..] if it is nearer than their best. */
    private void keepNearest(int k, int q) {
        FloatVector h = FloatVector.fromArray(F, phit, q);
        FloatVector best = FloatVector.fromArray(F, plim, q);
        FloatVector reach = IntVector.fromArray(I, preach, q).reinterpretAsFloats();
        VectorMask<Float> hit = h.compare(VectorOperators.GT, 0f).and(h.compare(VectorOperators.LT, best))
                .and(reach.compare(VectorOperators.GE, 0f));
        best.blend(h, hit).intoArray(plim, q);
        FloatVector.fromArray(F, pbest, q).blend(Float.intBitsToFloat(k / Scene.TRI_WORDS), hit).intoArray(pbest, q);
    }
}
