package org.solmass.scene;

import org.solmass.surface.Patch;

/**
 * Cosine-weighted, stratified hemisphere rays about a patch normal, traced through a {@link Scene}
 * and classified as {@link #SKY}, {@link #GROUND} or {@link #BLOCK}. Reusable per thread: it owns
 * one {@link BundleTracer} (the rays of a patch go through the tree together) and allocates nothing
 * per ray or per patch; results go into caller arrays.
 *
 * <p>Sampling: the unit square is cut into a k x k grid of equal cells, one jittered point per cell
 * (stratified sampling, Cochran, Sampling Techniques, 3rd ed., 1977, ch. 5), mapped to the unit disk
 * by the concentric map of Shirley and Chiu, 1997, "A low distortion map between disk and square",
 * Journal of Graphics Tools 2(3), and lifted to the hemisphere by Malley's method
 * {@code z = sqrt(1 - x^2 - y^2)} (Pharr, Jakob and Humphreys, Physically Based Rendering, 3rd ed.,
 * 2016, section 13.6.3), which gives directions with density cos(theta)/pi. Both maps preserve area
 * ratios, so every cell carries the same share 1/k^2 of the cosine-weighted hemisphere. The tangent
 * frame is the branchless basis of Duff et al., 2017, "Building an orthonormal basis, revisited",
 * Journal of Computer Graphics Techniques 6(1).
 *
 * <p>Ray count: a request for N rays uses k = max(1, round(sqrt(N))), i.e. k^2 rays (1024 -> 32 x 32
 * exactly; 1000 -> 1024; 100 -> 100; 50 -> 49). Ray s = row * k + column, row along the first
 * square coordinate.
 *
 * <p>Classification of a ray leaving the patch (horizon = the horizontal plane through the origin):
 * SKY if it escapes with dz >= 0; GROUND if it first meets the infinite ground plane, or a triangle
 * flagged in {@code triangleIsGround}, or escapes with dz &lt; 0 (possible only without a ground
 * plane, where the model's own ground faces stand for the ground and the rest of the lower world is
 * taken as ground too); BLOCK if it first meets any other triangle, or escapes upwards at or below
 * the scene's far horizon ({@link Scene#withHorizon}: distant terrain counts as an obstruction).
 *
 * <p>Determinism: the jitter of a patch comes from a SplitMix64 stream (the generator behind
 * {@code java.util.SplittableRandom}) seeded with {@link #patchSeed(String, long)} of its id and the
 * run seed, never from thread or order.
 */
public final class HemisphereSampler {
    public static final int SKY = 0, GROUND = 1, BLOCK = 2;
    /** Default rays per patch: 32 x 32 strata. */
    public static final int DEFAULT_RAYS = 1024;

    private final BundleTracer bundle;
    private final Scene scene;
    private final int side, count;
    private final double[] origin = new double[3];
    private final double[] groundT, hitDist;
    private final boolean[] blocked;
    private final int[] hitTri;

    /** @param requestedRays rays per patch, positive; rounded to a square grid (see class doc) */
    public HemisphereSampler(Scene scene, int requestedRays) {
        this.scene = scene;
        this.side = gridSide(requestedRays);
        this.count = side * side;
        this.bundle = scene.bundleTracer();
        this.groundT = new double[count];
        this.blocked = new boolean[count];
        this.hitTri = new int[count];
        this.hitDist = new double[count];
    }

    /** Side k of the k x k stratification grid used for a request of {@code requestedRays}. */
    public static int gridSide(int requestedRays) {
        if (requestedRays < 1) throw new IllegalArgumentException("rays per patch must be positive, got " + requestedRays);
        return (int) Math.max(1, Math.round(Math.sqrt(requestedRays)));
    }

    /** Rays actually traced for a request of {@code requestedRays}: gridSide^2. */
    public static int roundedRayCount(int requestedRays) {
        int k = gridSide(requestedRays);
        return k * k;
    }

    public int rayCount() { return count; }

    public int gridSide() { return side; }

    /**
     * 64-bit seed of a patch's ray stream: FNV-1a (Fowler, Noll, Vo) hash of the id's UTF-16 chars,
     * xor the run seed, through the SplitMix64 finaliser (Steele, Lea and Flood, 2014, OOPSLA,
     * "Fast splittable pseudorandom number generators").
     */
    public static long patchSeed(String id, long runSeed) {
        long h = 0xcbf29ce484222325L;
        for (int i = 0; i < id.length(); i++) {
            h ^= id.charAt(i);
            h *= 0x100000001b3L;
        }
        return mix(h ^ mix(runSeed + GOLDEN));
    }

    private static final long GOLDEN = 0x9e3779b97f4a7c15L;

    private static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    /**
     * Fills {@code dir[3s..3s+2]} with the unit world direction of ray s (s &lt; {@link #rayCount()})
     * about the unit normal (nx,ny,nz), jittered from {@code streamSeed}.
     */
    public void directions(double nx, double ny, double nz, long streamSeed, double[] dir) {
        long state = streamSeed;
        double inv = 1.0 / side;
        int s = 0;
        for (int i = 0; i < side; i++) {
            for (int j = 0; j < side; j++, s++) {
                state += GOLDEN;
                double r1 = (mix(state) >>> 11) * 0x1.0p-53;
                state += GOLDEN;
                double r2 = (mix(state) >>> 11) * 0x1.0p-53;
                cosineDirection((i + r1) * inv, (j + r2) * inv, nx, ny, nz, dir, s);
            }
        }
    }

    /**
     * Maps a point (u, v) of the unit square to a direction of density cos(theta)/pi about the unit
     * normal n (concentric map, Malley's method, tangent frame of Duff et al., see the class doc)
     * into {@code dir[3s..3s+2]}. The one place where a square point becomes a ray direction.
     */
    public static void cosineDirection(double u, double v, double nx, double ny, double nz, double[] dir, int s) {
        double sign = Math.copySign(1.0, nz);
        double a = -1.0 / (sign + nz), b = nx * ny * a;
        double t1x = 1 + sign * nx * nx * a, t1y = sign * b, t1z = -sign * nx;
        double t2x = b, t2y = sign + ny * ny * a, t2z = -ny;
        double ua = 2 * u - 1, ub = 2 * v - 1;
        double x, y;
        if (ua == 0 && ub == 0) { x = 0; y = 0; }
        else { // the two wedges of the map, chosen by selects rather than a branch (half of them would mispredict)
            boolean aMajor = Math.abs(ua) > Math.abs(ub);
            double r = aMajor ? ua : ub;
            double th = aMajor ? Math.PI / 4 * (ub / ua) : Math.PI / 2 - Math.PI / 4 * (ua / ub);
            x = r * Math.cos(th); y = r * Math.sin(th);
        }
        double z = Math.sqrt(Math.max(0, 1 - x * x - y * y));
        dir[3 * s] = x * t1x + y * t2x + z * nx;
        dir[3 * s + 1] = x * t1y + y * t2y + z * ny;
        dir[3 * s + 2] = x * t1z + y * t2z + z * nz;
    }

    /**
     * Full sampling of one patch: direction, class, hit triangle (original index, {@link Tracer#GROUND}
     * for the ground plane, {@link Tracer#MISS} for an escaping ray) and hit distance in metres
     * (+infinity when escaping) of every ray, from {@link Scene#rayOrigin(Patch)}.
     *
     * @param triangleIsGround per original triangle, whether it counts as ground; may be null
     * @param dir 3 x rayCount, cls / tri / dist rayCount each (caller-owned, reused)
     */
    public void sample(Patch patch, long runSeed, boolean[] triangleIsGround,
                       double[] dir, int[] cls, int[] tri, double[] dist) {
        scene.rayOrigin(patch, origin);
        sample(origin[0], origin[1], origin[2], patch.normal().x(), patch.normal().y(), patch.normal().z(),
                patchSeed(patch.id(), runSeed), triangleIsGround, dir, cls, tri, dist);
    }

    /** As {@link #sample(Patch, long, boolean[], double[], int[], int[], double[])} from any point and unit normal. */
    public void sample(double ox, double oy, double oz, double nx, double ny, double nz, long streamSeed,
                       boolean[] triangleIsGround, double[] dir, int[] cls, int[] tri, double[] dist) {
        directions(nx, ny, nz, streamSeed, dir);
        bundle.closestHit(ox, oy, oz, dir, count, tri, dist); // the patch's rays go through the tree together
        for (int s = 0; s < count; s++) cls[s] = classOf(tri[s], dir[3 * s + 2], triangleIsGround);
    }

    /** Class of a ray from its {@link Tracer#closestHit} result and vertical direction component. */
    public static int classOf(int hit, double dz, boolean[] triangleIsGround) {
        if (hit >= 0) return triangleIsGround != null && triangleIsGround[hit] ? GROUND : BLOCK;
        if (hit == Tracer.GROUND) return GROUND;
        if (hit == Tracer.HORIZON) return BLOCK; // far terrain: an obstruction, not sky
        return dz < 0 ? GROUND : SKY;
    }

    /**
     * Classes only (no distances), for view factors. Without ground-flagged triangles this needs
     * only any-hit queries: a ray is BLOCK if a triangle lies before the ground plane (or anywhere,
     * when it never meets the plane), GROUND if it then meets the plane, otherwise SKY or GROUND by
     * the sign of dz as in the class doc. Gives the same classes as {@link #sample}. The rays of the
     * patch go through the tree together ({@link BundleTracer}).
     */
    public void classify(Patch patch, long runSeed, boolean[] triangleIsGround, double[] dir, int[] cls) {
        scene.rayOrigin(patch, origin);
        double ox = origin[0], oy = origin[1], oz = origin[2];
        directions(patch.normal().x(), patch.normal().y(), patch.normal().z(), patchSeed(patch.id(), runSeed), dir);
        if (triangleIsGround != null) { // ground-flagged triangles: the first hit decides
            bundle.closestHit(ox, oy, oz, dir, count, hitTri, hitDist);
            for (int s = 0; s < count; s++) cls[s] = classOf(hitTri[s], dir[3 * s + 2], triangleIsGround);
            return;
        }
        for (int s = 0; s < count; s++) { // ray parameter of the ground plane, from either side
            double dz = dir[3 * s + 2], tg = Double.POSITIVE_INFINITY;
            if (scene.hasGroundPlane() && dz != 0) {
                double t = (scene.groundZ() - oz) / dz;
                if (t > 0) tg = t;
            }
            groundT[s] = tg;
        }
        bundle.occluded(ox, oy, oz, dir, groundT, count, blocked); // a triangle before the plane?
        for (int s = 0; s < count; s++) {
            if (blocked[s]) cls[s] = BLOCK;
            else if (groundT[s] < Double.POSITIVE_INFINITY) cls[s] = GROUND;
            else cls[s] = dir[3 * s + 2] < 0 ? GROUND : SKY;
        }
    }
}
