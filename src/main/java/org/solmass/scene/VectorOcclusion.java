package org.solmass.scene;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.IntVector;
import jdk.incubator.vector.VectorMask;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

/**
 * SIMD packet kernel behind {@link BundleTracer}: rays of one direction octant that share an origin
 * go through the tree in packets of one vector's width (16 lanes with AVX-512, 8 with AVX2), after
 * Wald, Slusallek, Benthin and Wagner, 2001, "Interactive rendering with coherent ray tracing",
 * Computer Graphics Forum 20(3): a node is entered when any lane hits its box, the lanes that hit a
 * leaf's box are tested against its triangles together. Uses the incubating Vector API of the JDK
 * (JEP 414); {@link BundleTracer} uses it only when the module {@code jdk.incubator.vector} is
 * present and falls back to its scalar ray-stream loop otherwise.
 *
 * <p>Lane arithmetic is the arithmetic of {@code Tracer} operation for operation (IEEE single
 * precision, no fused multiply-add), so every lane gives the single-ray answer. No lane mask is needed
 * at interior nodes: a child box lies inside its parent's, and the slab values are monotone in the
 * box bounds, so a lane that misses a parent misses every box below it. Leaves are entered with the
 * mask of the lanes that hit the leaf's box.
 */
final class VectorOcclusion {
    static final VectorSpecies<Float> F = FloatVector.SPECIES_PREFERRED;
    static final VectorSpecies<Integer> I = IntVector.SPECIES_PREFERRED;
    static final int LANES = F.length();
    private static final float RETIRED = -1f;
    private static final int RETIRED_BITS = Float.floatToRawIntBits(RETIRED);

    private final float[] nodes, tris;
    private final int[] stRef;
    private final int[] stBox;
    private float[] px = new float[0], py = px, pz = px, pix = px, piy = px, piz = px, plim = px;
    private int[] pray = new int[0];
    private int[] preach = new int[0];
    /** Word offsets (in a box) of the near and far bound per axis for the current octant. */
    private int loX, hiX, loY, hiY, loZ, hiZ, octant;

    VectorOcclusion(Scene scene) {
        this.nodes = scene.nodes;
        this.tris = scene.tris;
        int depth = scene.maxDepth + 2;
        stRef = new int[depth];
        stBox = new int[depth];
    }

    /** Rays per packet: a few vectors, so that one node fetch and one branch serve many rays. */
    static final int PACKET = LANES;

    /**
     * Traces the rays {@code list[start, start + len)} (indices into the per-ray arrays, all of one
     * direction octant) from the shifted origin o; sets
     * {@code out[ray]} for every ray that is blocked.
     */
    void trace(int octant, int[] list, int start, int len, float ox, float oy, float oz,
               float[] dx, float[] dy, float[] dz, float[] ix, float[] iy, float[] iz, float[] lim, boolean[] out) {
        this.octant = octant;
        loX = (octant & 1) != 0 ? 3 : 0;
        loY = (octant & 2) != 0 ? 4 : 1;
        loZ = (octant & 4) != 0 ? 5 : 2;
        hiX = 3 - loX;
        hiY = 5 - loY;
        hiZ = 7 - loZ;
        int padded = (len + LANES - 1) / LANES * LANES;
        ensure(padded);
        for (int k = 0; k < padded; k++) { // packet-contiguous copies; padding lanes are retired
            if (k < len) {
                int i = list[start + k];
                px[k] = dx[i]; py[k] = dy[i]; pz[k] = dz[i];
                pix[k] = ix[i]; piy[k] = iy[i]; piz[k] = iz[i];
                plim[k] = lim[i];
                pray[k] = i;
            } else {
                px[k] = 1; py[k] = 0; pz[k] = 0;
                pix[k] = 1; piy[k] = 1; piz[k] = 1;
                plim[k] = RETIRED;
                pray[k] = -1;
            }
        }
        for (int p = 0; p < padded; p += PACKET) {
            int end = Math.min(padded, p + PACKET);
            packet(p, end, ox, oy, oz);
            for (int k = p; k < end; k++) if (pray[k] >= 0 && plim[k] < 0) out[pray[k]] = true;
        }
    }

    private void ensure(int n) {
        if (px.length >= n) return;
        px = new float[n]; py = new float[n]; pz = new float[n];
        pix = new float[n]; piy = new float[n]; piz = new float[n];
        plim = new float[n];
        pray = new int[n];
        preach = new int[n];
    }

    /**
     * The packet of lanes [p, end); on return plim is negative for the lanes that are blocked.
     * Vector values never outlive one small method (they are loaded from the packet arrays each
     * time): C2 then keeps them in registers, where values carried across loop iterations or large
     * methods would be boxed on the heap.
     */
    private void packet(int p, int end, float ox, float oy, float oz) {
        final float[] n = nodes;
        final int octant = this.octant;
        if (allBlocked(p, end)) return;
        int sp = 0, ref = 0, box = -1;
        while (true) {
            if ((ref & 1) == 0) {
                int b = (ref >>> 1) << 4;
                int hit = 0;
                for (int q = p; q < end && hit != 3; q += LANES) hit |= children(b, q, ox, oy, oz);
                int ra = Float.floatToRawIntBits(n[b + 12]), rb = Float.floatToRawIntBits(n[b + 13]);
                if (hit == 3) {
                    if ((octant >>> Float.floatToRawIntBits(n[b + 14]) & 1) == 0) { // A (lower side) first
                        stRef[sp] = rb; stBox[sp++] = b + 6; ref = ra; box = b;
                    } else {
                        stRef[sp] = ra; stBox[sp++] = b; ref = rb; box = b + 6;
                    }
                    continue;
                }
                if (hit == 1) { ref = ra; box = b; continue; }
                if (hit == 2) { ref = rb; box = b + 6; continue; }
            } else if (leaf(ref, box, p, end, ox, oy, oz)) {
                return; // every lane blocked
            }
            if (sp == 0) return;
            ref = stRef[--sp];
            box = stBox[sp];
        }
    }

    /**
     * Int-domain slab test (as in {@code Tracer}) of both child boxes of the node at nodes[b..] for
     * the lanes [q, q + LANES); the near and far bound of each axis are those of the packet's octant.
     * Returns bit 0 set if any lane hits child A, bit 1 if any lane hits child B. Kept as one method
     * above C2's inlining size, so that the JIT compiles it the same way every run.
     */
    private int children(int b, int q, float ox, float oy, float oz) {
        final float[] n = nodes;
        FloatVector vix = FloatVector.fromArray(F, pix, q), viy = FloatVector.fromArray(F, piy, q),
                viz = FloatVector.fromArray(F, piz, q);
        IntVector limBits = bits(FloatVector.fromArray(F, plim, q));
        IntVector an = bits(vix.mul(n[b + loX] - ox)).max(bits(viy.mul(n[b + loY] - oy)))
                .max(bits(viz.mul(n[b + loZ] - oz)).max(0));
        IntVector af = bits(vix.mul(n[b + hiX] - ox)).min(bits(viy.mul(n[b + hiY] - oy)))
                .min(bits(viz.mul(n[b + hiZ] - oz)).min(limBits));
        IntVector bn = bits(vix.mul(n[b + 6 + loX] - ox)).max(bits(viy.mul(n[b + 6 + loY] - oy)))
                .max(bits(viz.mul(n[b + 6 + loZ] - oz)).max(0));
        IntVector bf = bits(vix.mul(n[b + 6 + hiX] - ox)).min(bits(viy.mul(n[b + 6 + hiY] - oy)))
                .min(bits(viz.mul(n[b + 6 + hiZ] - oz)).min(limBits));
        return (an.compare(VectorOperators.LE, af).anyTrue() ? 1 : 0) | (bn.compare(VectorOperators.LE, bf).anyTrue() ? 2 : 0);
    }

    /** The leaf {@code ref} (box at nodes[box..]) for the lanes [p, end); returns whether every lane is now blocked. */
    private boolean leaf(int ref, int box, int p, int end, float ox, float oy, float oz) {
        int first = ref >>> 4, last = first + ((ref >>> 1) & 7);
        for (int q = p; q < end; q += LANES) {
            if (!reach(box, q, ox, oy, oz)) continue;
            for (int tri = first; tri <= last; tri++) triangle(tri * Scene.TRI_WORDS, q, ox, oy, oz);
        }
        return allBlocked(p, end);
    }

    private boolean allBlocked(int p, int end) {
        boolean live = false;
        for (int q = p; q < end; q += LANES) live |= FloatVector.fromArray(F, plim, q).compare(VectorOperators.GE, 0f).anyTrue();
        return !live;
    }

    /**
     * Writes preach[q..q+LANES): the limit of each lane that hits the leaf box at nodes[box..] (the
     * test of {@link #children}), RETIRED for the others; returns whether any lane reaches the leaf.
     */
    private boolean reach(int box, int q, float ox, float oy, float oz) {
        final float[] n = nodes;
        FloatVector vix = FloatVector.fromArray(F, pix, q), viy = FloatVector.fromArray(F, piy, q),
                viz = FloatVector.fromArray(F, piz, q);
        IntVector limBits = bits(FloatVector.fromArray(F, plim, q));
        IntVector near = bits(vix.mul(n[box + loX] - ox)).max(bits(viy.mul(n[box + loY] - oy)))
                .max(bits(viz.mul(n[box + loZ] - oz)).max(0));
        IntVector far = bits(vix.mul(n[box + hiX] - ox)).min(bits(viy.mul(n[box + hiY] - oy)))
                .min(bits(viz.mul(n[box + hiZ] - oz)).min(limBits));
        VectorMask<Integer> miss = near.compare(VectorOperators.GT, far);
        limBits.blend(RETIRED_BITS, miss).intoArray(preach, q);
        return !miss.allTrue();
    }

    private static IntVector bits(FloatVector v) {
        return v.reinterpretAsInts();
    }

    /**
     * Moller-Trumbore of the triangle at tris[k..k+8] on the lanes [q, q + LANES), with the limits
     * of preach (lanes that missed the leaf box cannot hit); retires the lanes that are blocked.
     */
    private void triangle(int k, int q, float ox, float oy, float oz) {
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
        VectorMask<Float> reject = det.compare(VectorOperators.EQ, 0f)
                .or(u.compare(VectorOperators.LT, 0f)).or(u.compare(VectorOperators.GT, 1f))
                .or(v.compare(VectorOperators.LT, 0f)).or(u.add(v).compare(VectorOperators.GT, 1f));
        VectorMask<Float> hit = reject.not().and(h.compare(VectorOperators.GT, 0f))
                .and(h.compare(VectorOperators.LT, IntVector.fromArray(I, preach, q).reinterpretAsFloats()));
        FloatVector.fromArray(F, plim, q).blend(RETIRED, hit).intoArray(plim, q);
    }
}
