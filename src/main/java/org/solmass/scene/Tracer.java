package org.solmass.scene;

/**
 * Per-thread ray queries against a {@link Scene}: any-hit occlusion and closest hit. Owns its
 * traversal stack and the fields of the last hit, so a query allocates nothing. Not thread-safe:
 * make one per thread with {@link Scene#tracer()}.
 *
 * <p>Traversal is the stack-based ordered traversal of Pharr, Jakob and Humphreys, Physically Based
 * Rendering, 3rd ed., 2016, section 4.3.5, on nodes that hold both children's boxes: slab test with a
 * precomputed inverse direction (Kay and Kajiya, 1986, SIGGRAPH "Ray tracing complex scenes") of both
 * children at once, the nearer child entered first and the farther pushed only if its box is hit. Triangles: Moller and Trumbore, 1997, "Fast, minimum
 * storage ray-triangle intersection", Journal of Graphics Tools 2(1), two-sided (no culling of
 * back faces). Intersections run in float on coordinates relative to the scene centre.
 *
 * <p>Ray parameter {@code t}: the hit point is {@code o + t d}; with a unit direction it is the
 * distance in metres. Hits count for {@code 0 < t < tMax}.
 */
public final class Tracer {
    /** {@link #closestHit} result when the ray hits nothing. */
    public static final int MISS = -1;
    /** {@link #closestHit} result when the ray's first hit is the infinite ground plane. */
    public static final int GROUND = -2;
    /**
     * {@link #closestHit} result when the ray leaves the scene (no triangle, no ground plane, no
     * distance limit) and the scene's far horizon ({@link Scene#withHorizon}) obstructs its
     * direction; {@link #t()} is then +infinity.
     */
    public static final int HORIZON = -3;

    private static final float TINY_DIR = 1e-20f;

    private final Scene scene;
    private final float[] nodes;
    private final float[] tris;
    private final int[] stack;
    private final float[] stackT;
    private double hitT = Double.POSITIVE_INFINITY, hitU, hitV;
    private int hitTriangle = MISS;

    Tracer(Scene scene) {
        this.scene = scene;
        this.nodes = scene.nodes;
        this.tris = scene.tris;
        this.stack = new int[scene.maxDepth + 2];
        this.stackT = new float[scene.maxDepth + 2];
    }

    public Scene scene() { return scene; }

    /** Ray parameter of the last {@link #closestHit}, +infinity after a miss. */
    public double t() { return hitT; }

    /** Barycentric u of the last triangle hit (weight of vertex 1); 0 for the ground plane or a miss. */
    public double u() { return hitU; }

    /** Barycentric v of the last triangle hit (weight of vertex 2); 0 for the ground plane or a miss. */
    public double v() { return hitV; }

    /** Result of the last {@link #closestHit}: original triangle index, {@link #GROUND} or {@link #MISS}. */
    public int triangle() { return hitTriangle; }

    /** Ray parameter at which the ray meets the ground plane, or +infinity (no plane / never). */
    private double groundT(double oz, double dz) {
        if (!scene.groundPlane || dz == 0) return Double.POSITIVE_INFINITY;
        double t = (scene.groundZ - oz) / dz;
        return t > 0 ? t : Double.POSITIVE_INFINITY;
    }

    /**
     * Whether anything (a triangle from either side, or the ground plane) lies on the ray at
     * {@code 0 < t < tMax}, or, with {@code tMax} infinite, the far horizon obstructs its direction
     * ({@link Scene#withHorizon}). Stops at the first hit found.
     */
    public boolean occluded(double ox, double oy, double oz, double dx, double dy, double dz, double tMax) {
        if (groundT(oz, dz) < tMax) return true;
        if (tMax == Double.POSITIVE_INFINITY && scene.escapeBlocked(dx, dy, dz)) return true; // far horizon
        if (scene.nodeCount == 0) return false;
        return anyHit((float) (ox - scene.shiftX), (float) (oy - scene.shiftY), (float) (oz - scene.shiftZ),
                (float) dx, (float) dy, (float) dz, (float) Math.min(tMax, Float.MAX_VALUE));
    }

    /**
     * The first thing on the ray at {@code 0 < t < tMax}: the ORIGINAL index of the triangle hit
     * (index into the model's triangles), {@link #GROUND} for the infinite ground plane,
     * {@link #HORIZON} for the far horizon (only with {@code tMax} infinite), or {@link #MISS}. Distance and barycentrics are then in {@link #t()}, {@link #u()}, {@link #v()}.
     */
    public int closestHit(double ox, double oy, double oz, double dx, double dy, double dz, double tMax) {
        double tg = groundT(oz, dz);
        double limit = Math.min(tMax, tg);
        hitT = Double.POSITIVE_INFINITY;
        hitU = hitV = 0;
        hitTriangle = MISS;
        int leafTri = -1;
        float fox = (float) (ox - scene.shiftX), foy = (float) (oy - scene.shiftY), foz = (float) (oz - scene.shiftZ);
        float fdx = (float) dx, fdy = (float) dy, fdz = (float) dz;
        if (scene.nodeCount > 0) leafTri = closest(fox, foy, foz, fdx, fdy, fdz, (float) Math.min(limit, Float.MAX_VALUE));
        if (leafTri >= 0) {
            hitTriangle = scene.triOriginal[leafTri];
            hitT = intersect(tris, leafTri, fox, foy, foz, fdx, fdy, fdz, Float.MAX_VALUE, true);
        } else if (tg < tMax) {
            hitTriangle = GROUND;
            hitT = tg;
        } else if (tMax == Double.POSITIVE_INFINITY && scene.escapeBlocked(dx, dy, dz)) {
            hitTriangle = HORIZON;
        }
        return hitTriangle;
    }

    private boolean anyHit(float ox, float oy, float oz, float dx, float dy, float dz, float tMax) {
        final float[] n = nodes, t = tris;
        final int[] st = stack;
        float ix = 1f / (Math.abs(dx) < TINY_DIR ? Math.copySign(TINY_DIR, dx) : dx);
        float iy = 1f / (Math.abs(dy) < TINY_DIR ? Math.copySign(TINY_DIR, dy) : dy);
        float iz = 1f / (Math.abs(dz) < TINY_DIR ? Math.copySign(TINY_DIR, dz) : dz);
        int loX = ix < 0 ? 3 : 0, hiX = 3 - loX;
        int loY = iy < 0 ? 4 : 1, hiY = 5 - loY;
        int loZ = iz < 0 ? 5 : 2, hiZ = 7 - loZ;
        int sp = 0, ref = 0;
        while (true) {
            if ((ref & 1) == 0) {
                int b = (ref >>> 1) << 4;
                float a0 = (n[b + loX] - ox) * ix, a1 = (n[b + hiX] - ox) * ix;
                float ay0 = (n[b + loY] - oy) * iy, ay1 = (n[b + hiY] - oy) * iy;
                float az0 = (n[b + loZ] - oz) * iz, az1 = (n[b + hiZ] - oz) * iz;
                float b0 = (n[b + 6 + loX] - ox) * ix, b1 = (n[b + 6 + hiX] - ox) * ix;
                float by0 = (n[b + 6 + loY] - oy) * iy, by1 = (n[b + 6 + hiY] - oy) * iy;
                float bz0 = (n[b + 6 + loZ] - oz) * iz, bz1 = (n[b + 6 + hiZ] - oz) * iz;
                int lb = Float.floatToRawIntBits(tMax);
                int an = Math.max(Math.max(bits(a0), bits(ay0)), Math.max(bits(az0), 0));
                int af = Math.min(Math.min(bits(a1), bits(ay1)), Math.min(bits(az1), lb));
                int bn = Math.max(Math.max(bits(b0), bits(by0)), Math.max(bits(bz0), 0));
                int bf = Math.min(Math.min(bits(b1), bits(by1)), Math.min(bits(bz1), lb));
                boolean hitA = an <= af, hitB = bn <= bf;
                if (hitA) {
                    int ra = Float.floatToRawIntBits(n[b + 12]);
                    if (hitB) {
                        int rb = Float.floatToRawIntBits(n[b + 13]);
                        if (bn < an) { st[sp++] = ra; ref = rb; } else { st[sp++] = rb; ref = ra; }
                    } else {
                        ref = ra;
                    }
                    continue;
                }
                if (hitB) { ref = Float.floatToRawIntBits(n[b + 13]); continue; }
            } else {
                int first = ref >>> 4, end = first + ((ref >>> 1) & 7) + 1;
                for (int i = first; i < end; i++) {
                    if (intersect(t, i, ox, oy, oz, dx, dy, dz, tMax, false) > 0f) return true;
                }
            }
            if (sp == 0) return false;
            ref = st[--sp];
        }
    }

    /** Closest triangle (leaf-order index) with t in (0, tMax), or -1. */
    private int closest(float ox, float oy, float oz, float dx, float dy, float dz, float tMax) {
        final float[] n = nodes, t = tris, stT = stackT;
        final int[] st = stack;
        float ix = 1f / (Math.abs(dx) < TINY_DIR ? Math.copySign(TINY_DIR, dx) : dx);
        float iy = 1f / (Math.abs(dy) < TINY_DIR ? Math.copySign(TINY_DIR, dy) : dy);
        float iz = 1f / (Math.abs(dz) < TINY_DIR ? Math.copySign(TINY_DIR, dz) : dz);
        int loX = ix < 0 ? 3 : 0, hiX = 3 - loX;
        int loY = iy < 0 ? 4 : 1, hiY = 5 - loY;
        int loZ = iz < 0 ? 5 : 2, hiZ = 7 - loZ;
        int sp = 0, ref = 0, best = -1;
        float bestT = tMax;
        while (true) {
            if ((ref & 1) == 0) {
                int b = (ref >>> 1) << 4;
                float a0 = (n[b + loX] - ox) * ix, a1 = (n[b + hiX] - ox) * ix;
                float ay0 = (n[b + loY] - oy) * iy, ay1 = (n[b + hiY] - oy) * iy;
                float az0 = (n[b + loZ] - oz) * iz, az1 = (n[b + hiZ] - oz) * iz;
                float b0 = (n[b + 6 + loX] - ox) * ix, b1 = (n[b + 6 + hiX] - ox) * ix;
                float by0 = (n[b + 6 + loY] - oy) * iy, by1 = (n[b + 6 + hiY] - oy) * iy;
                float bz0 = (n[b + 6 + loZ] - oz) * iz, bz1 = (n[b + 6 + hiZ] - oz) * iz;
                int lb = Float.floatToRawIntBits(bestT);
                int an = Math.max(Math.max(bits(a0), bits(ay0)), Math.max(bits(az0), 0));
                int af = Math.min(Math.min(bits(a1), bits(ay1)), Math.min(bits(az1), lb));
                int bn = Math.max(Math.max(bits(b0), bits(by0)), Math.max(bits(bz0), 0));
                int bf = Math.min(Math.min(bits(b1), bits(by1)), Math.min(bits(bz1), lb));
                boolean hitA = an <= af, hitB = bn <= bf;
                if (hitA) {
                    int ra = Float.floatToRawIntBits(n[b + 12]);
                    if (hitB) {
                        int rb = Float.floatToRawIntBits(n[b + 13]);
                        if (bn < an) { stT[sp] = Float.intBitsToFloat(an); st[sp++] = ra; ref = rb; } else { stT[sp] = Float.intBitsToFloat(bn); st[sp++] = rb; ref = ra; }
                    } else {
                        ref = ra;
                    }
                    continue;
                }
                if (hitB) { ref = Float.floatToRawIntBits(n[b + 13]); continue; }
            } else {
                int first = ref >>> 4, end = first + ((ref >>> 1) & 7) + 1;
                for (int i = first; i < end; i++) {
                    float h = intersect(t, i, ox, oy, oz, dx, dy, dz, bestT, false);
                    if (h > 0f) { bestT = h; best = i; }
                }
            }
            do { // pop, skipping entries that start beyond the closest hit so far
                if (sp == 0) return best;
                ref = st[--sp];
            } while (stT[sp] > bestT);
        }
    }

    /** IEEE bit pattern as an int: orders like the float for values >= +0, negative for values < 0 or -0. */
    static int bits(float f) { return Float.floatToRawIntBits(f); }

    /**
     * Moller-Trumbore test of leaf-order triangle {@code i}: t in (0, tMax) or -1. With
     * {@code keepUv} the barycentrics are stored in the hit fields.
     */
    private float intersect(float[] t, int i, float ox, float oy, float oz, float dx, float dy, float dz,
                            float tMax, boolean keepUv) {
        int k = i * Scene.TRI_WORDS;
        float e1x = t[k + 3], e1y = t[k + 4], e1z = t[k + 5];
        float e2x = t[k + 6], e2y = t[k + 7], e2z = t[k + 8];
        float px = dy * e2z - dz * e2y, py = dz * e2x - dx * e2z, pz = dx * e2y - dy * e2x;
        float det = e1x * px + e1y * py + e1z * pz;
        if (det == 0f) return -1f;
        float inv = 1f / det;
        float sx = ox - t[k], sy = oy - t[k + 1], sz = oz - t[k + 2];
        float u = (sx * px + sy * py + sz * pz) * inv;
        if (u < 0f || u > 1f) return -1f;
        float qx = sy * e1z - sz * e1y, qy = sz * e1x - sx * e1z, qz = sx * e1y - sy * e1x;
        float v = (dx * qx + dy * qy + dz * qz) * inv;
        if (v < 0f || u + v > 1f) return -1f;
        float h = (e2x * qx + e2y * qy + e2z * qz) * inv;
        if (!(h > 0f && h < tMax)) return -1f;
        if (keepUv) { hitU = u; hitV = v; }
        return h;
    }

    /**
     * Brute-force closest hit over every triangle (no BVH), same kernel: the reference the BVH is
     * tested against, and a fallback for tiny scenes. Returns like {@link #closestHit}.
     */
    public int closestHitBruteForce(double ox, double oy, double oz, double dx, double dy, double dz, double tMax) {
        double tg = groundT(oz, dz);
        float fox = (float) (ox - scene.shiftX), foy = (float) (oy - scene.shiftY), foz = (float) (oz - scene.shiftZ);
        float best = (float) Math.min(Math.min(tMax, tg), Float.MAX_VALUE);
        int bi = -1;
        int count = tris.length / Scene.TRI_WORDS;
        for (int i = 0; i < count; i++) {
            float h = intersect(tris, i, fox, foy, foz, (float) dx, (float) dy, (float) dz, best, false);
            if (h > 0f) { best = h; bi = i; }
        }
        hitU = hitV = 0;
        if (bi >= 0) {
            hitTriangle = scene.triOriginal[bi];
            hitT = intersect(tris, bi, fox, foy, foz, (float) dx, (float) dy, (float) dz, Float.MAX_VALUE, true);
        } else if (tg < tMax) {
            hitTriangle = GROUND;
            hitT = tg;
        } else {
            hitTriangle = tMax == Double.POSITIVE_INFINITY && scene.escapeBlocked(dx, dy, dz) ? HORIZON : MISS;
            hitT = Double.POSITIVE_INFINITY;
        }
        return hitTriangle;
    }
}
