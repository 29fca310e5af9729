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
 * Journal of Graphics Tools 2(3) (sine and cosine from fdlibm's kernels, see {@link #cosineDirection}),
 * and lifted to the hemisphere by Malley's method
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
    /**
     * Scratch of {@link #sampleForReflection} and {@link #queueForReflection}: directions of the subset
     * (hitDir) and of the other rays (partDir), the other rays' far-horizon answers, ray numbers and
     * whether the ground plane limits them, subset marks.
     */
    private final double[] partDir, hitDir;
    private final int[] restRay;
    private final boolean[] inSubset, partFar, restGround;
    /** The vector direction maker, or null without the vector module. */
    private final VectorDirections lanes;

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
        this.partDir = new double[3 * count];
        this.hitDir = new double[3 * count];
        this.partFar = new boolean[count];
        this.restGround = new boolean[count];
        this.restRay = new int[count];
        this.inSubset = new boolean[count];
        this.lanes = BundleTracer.SIMD_AVAILABLE ? new VectorDirections(side) : null;
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

    static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    /**
     * Fills {@code dir[3s..3s+2]} with the unit world direction of ray s (s &lt; {@link #rayCount()})
     * about the unit normal (nx,ny,nz), jittered from {@code streamSeed}. With the vector module
     * loaded the rays are made several at a time ({@link VectorDirections}), with the same arithmetic
     * as {@link #cosineDirection}, so the directions are the same bit for bit.
     */
    public void directions(double nx, double ny, double nz, long streamSeed, double[] dir) {
        if (lanes != null) lanes.directions(nx, ny, nz, streamSeed, dir);
        else scalarDirections(side, nx, ny, nz, streamSeed, dir);
    }

    /** {@link #directions} one ray at a time, for a k x k grid of side {@code side}. */
    static void scalarDirections(int side, double nx, double ny, double nz, long streamSeed, double[] dir) {
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

    /** Increment of the SplitMix64 state per draw (the golden-ratio gamma of Steele, Lea and Flood, 2014). */
    static final long GOLDEN = 0x9e3779b97f4a7c15L;

    /**
     * Maps a point (u, v) of the unit square to a direction of density cos(theta)/pi about the unit
     * normal n (concentric map, Malley's method, tangent frame of Duff et al., see the class doc)
     * into {@code dir[3s..3s+2]}. The one place where a square point becomes a ray direction
     * ({@link VectorDirections} does the same operations lane by lane).
     *
     * <p>The concentric map takes (a, b) = (2u - 1, 2v - 1) to radius r and angle theta: r = a,
     * theta = (pi/4)(b/a) where |a| &gt; |b|, else r = b, theta = pi/2 - (pi/4)(a/b) (Shirley and
     * Chiu, 1997, eq. 4 and its second wedge). In the second wedge cos(theta) = sin(phi) and
     * sin(theta) = cos(phi) with phi = (pi/4)(a/b), so both wedges need the sine and cosine of an
     * angle in [-pi/4, pi/4] only, which {@link #sinKernel} and {@link #cosKernel} give without range
     * reduction or branches (the wedge is chosen by selects; half of the branches would mispredict).
     */
    public static void cosineDirection(double u, double v, double nx, double ny, double nz, double[] dir, int s) {
        double sign = Math.copySign(1.0, nz);
        double a = -1.0 / (sign + nz), b = nx * ny * a;
        double t1x = 1 + sign * nx * nx * a, t1y = sign * b, t1z = -sign * nx;
        double t2x = b, t2y = sign + ny * ny * a, t2z = -ny;
        double ua = 2 * u - 1, ub = 2 * v - 1;
        boolean aMajor = Math.abs(ua) > Math.abs(ub);
        double r = aMajor ? ua : ub;
        double phi = r == 0 ? 0 : Math.PI / 4 * ((aMajor ? ub : ua) / r); // r == 0 only at the centre
        double c = cosKernel(phi), sn = sinKernel(phi);
        double x = r * (aMajor ? c : sn), y = r * (aMajor ? sn : c);
        double z = Math.sqrt(Math.max(0, 1 - x * x - y * y));
        dir[3 * s] = x * t1x + y * t2x + z * nx;
        dir[3 * s + 1] = x * t1y + y * t2y + z * ny;
        dir[3 * s + 2] = x * t1z + y * t2z + z * nz;
    }

    /*
     * Sine and cosine on [-pi/4, pi/4]: the kernels __kernel_sin and __kernel_cos of fdlibm 5.3
     * (Sun Microsystems, 1993; k_sin.c and k_cos.c, the library behind java.lang.StrictMath), with a
     * zero tail: minimax polynomials of degree 13 and 14, error below 1 ulp (k_sin.c, k_cos.c
     * comments). For |x| <= pi/4 StrictMath.sin and StrictMath.cos are exactly these kernels, so the
     * values equal StrictMath's bit for bit (tested); unlike Math.sin/cos they are the same on every
     * platform, and plain multiplications and additions, so the same arithmetic runs in vector lanes.
     */
    static final double S1 = -1.66666666666666324348e-01, S2 = 8.33333333332248946124e-03,
            S3 = -1.98412698298579493134e-04, S4 = 2.75573137070700676789e-06,
            S5 = -2.50507602534068634195e-08, S6 = 1.58969099521155010221e-10;
    static final double C1 = 4.16666666666666019037e-02, C2 = -1.38888888888741095749e-03,
            C3 = 2.48015872894767294178e-05, C4 = -2.75573143513906633035e-07,
            C5 = 2.08757232129817482790e-09, C6 = -1.13596475577881948265e-11;
    /** |x| below 2^-27: sin x = x and cos x = 1 in double precision (fdlibm's early exits). */
    static final double TINY_ANGLE = 0x1.0p-27;
    /** fdlibm's cosine switches to its second form at |x| = 0.3 (high word 0x3FD33333). */
    static final double COS_SPLIT = Double.longBitsToDouble(0x3FD3333300000000L);
    /** From here on (high word above 0x3FE90000, |x| &gt; 0.78125) fdlibm's cosine takes qx = 0.28125. */
    static final double COS_QX_FIXED = Double.longBitsToDouble(0x3FE9000100000000L);

    /** sin x for |x| &lt;= pi/4 (fdlibm __kernel_sin(x, 0, 0)). */
    static double sinKernel(double x) {
        if (Math.abs(x) < TINY_ANGLE) return x;
        double z = x * x, v = z * x;
        double r = S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)));
        return x + v * (S1 + z * r);
    }

    /** cos x for |x| &lt;= pi/4 (fdlibm __kernel_cos(x, 0)). */
    static double cosKernel(double x) {
        double ax = Math.abs(x);
        if (ax < TINY_ANGLE) return 1;
        double z = x * x;
        double r = z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
        if (ax < COS_SPLIT) return 1 - (0.5 * z - z * r);
        double qx = ax >= COS_QX_FIXED ? 0.28125 : cosQx(ax);
        double hz = 0.5 * z - qx, a = 1 - qx;
        return a - (hz - z * r);
    }

    /** fdlibm's qx for 0.3 &lt;= |x| &lt; COS_QX_FIXED: |x|/4 with the low 32 bits of the double cleared. */
    static double cosQx(double ax) {
        return Double.longBitsToDouble((Double.doubleToRawLongBits(ax) & 0xFFFFFFFF00000000L) - 0x0020000000000000L);
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

    /**
     * Side f of the square blocks of strata that each give one reflection ray ({@link #sampleForReflection}):
     * the largest divisor f of the grid side k with {@code (k / f)^2 >= reflectionRays} (1024 rays and 256
     * reflection rays: f = 2, a 16 x 16 grid of 2 x 2 blocks); 1 (every ray) when no such f above 1 exists.
     */
    public static int reflectionBlock(int side, int reflectionRays) {
        int want = gridSide(reflectionRays);
        for (int f = side; f > 1; f--) if (side % f == 0 && side / f >= want) return f;
        return 1;
    }

    /** Rays in the reflection subset of {@link #sampleForReflection} for these requests: (k / f)^2. */
    public static int reflectionRayCount(int requestedRays, int reflectionRays) {
        int k = gridSide(requestedRays), f = reflectionBlock(k, reflectionRays);
        return (k / f) * (k / f);
    }

    /** Salt of the reflection rays' choice, so that it is independent of the jitter stream (our constant). */
    static final long SUBSET_SALT = 0x5eed_0f_4ef1ec7L;

    /**
     * Full view-factor sampling of one patch, with closest hits only where reflection needs them. All
     * {@link #rayCount()} rays are made and classified as {@link #sample} does (the same directions and
     * the same classes); the hit triangle and distance are found for a stratified subset only: the k x k
     * grid is cut into (k/f)^2 blocks of f x f cells ({@link #reflectionBlock}) and each block gives the
     * ray of one of its cells, chosen uniformly from the patch's seed. The chosen ray is uniform over its
     * block, and every block carries the same share of the cosine-weighted hemisphere, so the subset is
     * itself a stratified cosine-weighted sample of (k/f)^2 rays (Cochran, Sampling Techniques, 3rd ed.,
     * 1977, ch. 5 and 7: one unit drawn per stratum; Pharr, Jakob and Humphreys, Physically Based
     * Rendering, 3rd ed., 2016, 13.8.1 for stratified estimators), and a reflected-light sum over it is
     * unbiased.
     *
     * <p>The other rays need only any-hit queries up to the ground plane (as {@link #classify}); the
     * subset's rays need the first hit (what they reflect). With {@code allHits} (or ground-flagged
     * triangles, whose class needs the first hit) every ray is traced to its first hit as in {@link #sample};
     * the subset is the same either way.
     *
     * @param block side f of the blocks ({@link #reflectionBlock}); 1: every ray is in the subset
     * @param subset out: the subset's ray indices, ascending ((k/f)^2 of them; room for {@link #rayCount()} needed)
     * @return the number of rays in the subset; {@code tri}, {@code dist} are set for those (and for
     *         every ray when all were traced to their first hit)
     */
    public int sampleForReflection(double ox, double oy, double oz, double nx, double ny, double nz, long streamSeed,
                                   boolean[] triangleIsGround, boolean allHits, int block, double[] dir, int[] cls,
                                   int[] tri, double[] dist, int[] subset) {
        if (block <= 1) {
            sample(ox, oy, oz, nx, ny, nz, streamSeed, triangleIsGround, dir, cls, tri, dist);
            for (int s = 0; s < count; s++) subset[s] = s;
            return count;
        }
        int m = chooseSubset(side, block, streamSeed, inSubset, subset);
        if (allHits || triangleIsGround != null) {
            sample(ox, oy, oz, nx, ny, nz, streamSeed, triangleIsGround, dir, cls, tri, dist);
            return m;
        }
        int r = queueRest(ox, oy, oz, nx, ny, nz, streamSeed, m, dir, cls, tri, dist, subset, partDir, groundT, partFar, 0);
        bundle.occludedKnownFar(ox, oy, oz, partDir, groundT, partFar, r, blocked);
        classifyRest(blocked, dir, cls, tri, dist);
        return m;
    }

    /**
     * The first half of {@link #sampleForReflection} for a reflection block above 1, without
     * ground-flagged triangles and without {@code allHits}, for a caller that traces the other rays
     * in a bundle of its own with other rays of the same origin (horizon band, sun): makes the
     * directions, picks the subset (returned through {@code subset}; {@link #reflectionSubsetSize()}
     * gives its size), traces the subset to its first hits and sets its classes, then puts the other
     * rays into the caller's bundle from index {@code at}: direction, limit (the ground plane's
     * distance, or +infinity) and the far horizon's answer ({@link BundleTracer#occludedKnownFar}).
     * {@link #classifyRest} reads their answers. Returns the bundle's new end. The answers are those
     * of {@link #sampleForReflection} (which runs the same two halves around a bundle of its own).
     */
    public int queueForReflection(double ox, double oy, double oz, double nx, double ny, double nz, long streamSeed,
                                  int block, double[] dir, int[] cls, int[] tri, double[] dist, int[] subset,
                                  double[] qDir, double[] qT, boolean[] qFar, int at) {
        if (block <= 1) throw new IllegalArgumentException("a reflection block above 1 is needed, got " + block);
        int m = chooseSubset(side, block, streamSeed, inSubset, subset);
        return queueRest(ox, oy, oz, nx, ny, nz, streamSeed, m, dir, cls, tri, dist, subset, qDir, qT, qFar, at);
    }

    /** Rays in the subset of the last {@link #queueForReflection} (the one {@link #classifyRest} completes). */
    public int reflectionSubsetSize() { return subsetSize; }

    private int subsetSize, restFrom;

    /** Directions, the subset's first hits and classes, and the other rays into the bundle at {@code at}. */
    private int queueRest(double ox, double oy, double oz, double nx, double ny, double nz, long streamSeed, int m,
                          double[] dir, int[] cls, int[] tri, double[] dist, int[] subset,
                          double[] qDir, double[] qT, boolean[] qFar, int at) {
        subsetSize = m;
        directions(nx, ny, nz, streamSeed, dir);
        for (int q = 0; q < m; q++) copyDirection(dir, subset[q], hitDir, q);
        bundle.closestHit(ox, oy, oz, hitDir, m, hitTri, hitDist);
        for (int q = 0; q < m; q++) {
            int s = subset[q];
            tri[s] = hitTri[q];
            dist[s] = hitDist[q];
            cls[s] = classOf(hitTri[q], dir[3 * s + 2], null);
        }
        restFrom = at;
        int rest = 0;
        for (int s = 0; s < count; s++) { // the rays outside the subset, ascending, without a branch per ray
            restRay[rest] = s;
            rest += inSubset[s] ? 0 : 1;
        }
        boolean plane = scene.hasGroundPlane();
        double rise = scene.groundZ() - oz;
        for (int k = 0; k < rest; k++) {
            int s = restRay[k], r = at + k;
            // groundPlaneT(oz, dz) without its branches: dz = 0 gives t = +-infinity or NaN, never a finite t > 0
            double dz = dir[3 * s + 2], t = rise / dz, tg = plane && t > 0 ? t : Double.POSITIVE_INFINITY;
            copyDirection(dir, s, qDir, r);
            qT[r] = tg; // as classify: a triangle before the plane blocks
            qFar[r] = tg == Double.POSITIVE_INFINITY && scene.escapeBlocked(dir[3 * s], dir[3 * s + 1], dz);
            restGround[k] = tg < Double.POSITIVE_INFINITY;
        }
        return at + rest;
    }

    /**
     * The second half of {@link #queueForReflection}: the classes of the rays it queued, from their
     * answers ({@code blocked} from the index it was given), as {@link #classify} sets them; their
     * {@code tri} is {@link Tracer#MISS} and {@code dist} NaN (not traced to a first hit).
     */
    public void classifyRest(boolean[] blocked, double[] dir, int[] cls, int[] tri, double[] dist) {
        int rest = count - subsetSize;
        for (int k = 0; k < rest; k++) {
            int s = restRay[k];
            tri[s] = Tracer.MISS;
            dist[s] = Double.NaN; // not traced to a first hit
            if (blocked[restFrom + k]) cls[s] = BLOCK;
            else if (restGround[k]) cls[s] = GROUND;
            else cls[s] = dir[3 * s + 2] < 0 ? GROUND : SKY;
        }
    }

    /** Ray parameter at which a ray from height {@code oz} with vertical component {@code dz} meets the ground plane, from either side; +infinity when it does not (or there is none). */
    private double groundPlaneT(double oz, double dz) {
        if (!scene.hasGroundPlane() || dz == 0) return Double.POSITIVE_INFINITY;
        double t = (scene.groundZ() - oz) / dz;
        return t > 0 ? t : Double.POSITIVE_INFINITY;
    }

    /** {@code to[3r..3r+2] = from[3s..3s+2]}: three stores, cheaper than a call to arraycopy per ray. */
    private static void copyDirection(double[] from, int s, double[] to, int r) {
        to[3 * r] = from[3 * s];
        to[3 * r + 1] = from[3 * s + 1];
        to[3 * r + 2] = from[3 * s + 2];
    }

    /**
     * The reflection subset of a k x k grid ({@link #sampleForReflection}): per f x f block (row-major
     * over the blocks), cell {@code q} of the block from a SplitMix64 draw of the seed and the block
     * number; marks them in {@code mark} and lists them ascending in {@code subset} (which needs room for
     * side^2 entries: the listing writes each cell's index before it knows whether to keep it). Returns their number.
     */
    static int chooseSubset(int side, int block, long streamSeed, boolean[] mark, int[] subset) {
        int blocks = side / block, cells = block * block;
        java.util.Arrays.fill(mark, 0, side * side, false);
        long base = mix(streamSeed ^ SUBSET_SALT);
        for (int bi = 0; bi < blocks; bi++) {
            for (int bj = 0; bj < blocks; bj++) {
                long h = mix(base + (long) (bi * blocks + bj + 1) * GOLDEN);
                int q = (int) ((h >>> 33) % cells);
                mark[(bi * block + q / block) * side + bj * block + q % block] = true;
            }
        }
        int m = 0;
        for (int s = 0; s < side * side; s++) { // without a branch per cell (a quarter are marked, at random)
            subset[m] = s;
            m += mark[s] ? 1 : 0;
        }
        return m;
    }

    /** Whether {@code triangleIsGround} flags any triangle (false for null or all false). */
    public static boolean anyFlagged(boolean[] triangleIsGround) {
        if (triangleIsGround == null) return false;
        for (boolean g : triangleIsGround) if (g) return true;
        return false;
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
        classify(origin[0], origin[1], origin[2], patch.normal().x(), patch.normal().y(), patch.normal().z(),
                patchSeed(patch.id(), runSeed), triangleIsGround, dir, cls);
    }

    /**
     * As {@link #classify(Patch, long, boolean[], double[], int[])} from any point and unit normal: the
     * classes {@link #sample(double, double, double, double, double, double, long, boolean[], double[], int[], int[], double[])}
     * gives for the same arguments, without first hits.
     */
    public void classify(double ox, double oy, double oz, double nx, double ny, double nz, long streamSeed,
                         boolean[] triangleIsGround, double[] dir, int[] cls) {
        directions(nx, ny, nz, streamSeed, dir);
        if (triangleIsGround != null) { // ground-flagged triangles: the first hit decides
            bundle.closestHit(ox, oy, oz, dir, count, hitTri, hitDist);
            for (int s = 0; s < count; s++) cls[s] = classOf(hitTri[s], dir[3 * s + 2], triangleIsGround);
            return;
        }
        for (int s = 0; s < count; s++) groundT[s] = groundPlaneT(oz, dir[3 * s + 2]);
        bundle.occluded(ox, oy, oz, dir, groundT, count, blocked); // a triangle before the plane?
        for (int s = 0; s < count; s++) {
            if (blocked[s]) cls[s] = BLOCK;
            else if (groundT[s] < Double.POSITIVE_INFINITY) cls[s] = GROUND;
            else cls[s] = dir[3 * s + 2] < 0 ? GROUND : SKY;
        }
    }

    /**
     * Which rays of {@link #classify(Patch, long, boolean[], double[], int[])} (no ground-flagged
     * triangles) reach the sky: {@code sky[s]} is true exactly where that method gives
     * {@link #SKY}. Only the rays that can reach it are traced: a ray going down ({@code dz < 0})
     * ends on the ground plane, on a triangle or, with neither, counts as ground, so it is never sky;
     * nor is a ray that meets the ground plane from below (an origin under it).
     * For metrics that weigh the visible sky alone (the vertical sky component): a vertical patch's
     * downward half is not traced. The rays traced are those of {@code classify}, with no limit as
     * there, so the answers are the same. Uses the sampler's scratch arrays: not between a
     * {@link #queueForReflection} and its {@link #classifyRest} on the same sampler.
     */
    public void skyRays(Patch patch, long runSeed, double[] dir, boolean[] sky) {
        scene.rayOrigin(patch, origin);
        double ox = origin[0], oy = origin[1], oz = origin[2];
        directions(patch.normal().x(), patch.normal().y(), patch.normal().z(), patchSeed(patch.id(), runSeed), dir);
        int up = 0;
        for (int s = 0; s < count; s++) {
            sky[s] = false;
            double dz = dir[3 * s + 2];
            // down, or up into the ground plane from an origin under it: ground or blocked in classify
            if (dz < 0 || groundPlaneT(oz, dz) < Double.POSITIVE_INFINITY) continue;
            copyDirection(dir, s, partDir, up);
            restRay[up++] = s;
        }
        bundle.occluded(ox, oy, oz, partDir, null, up, blocked); // no limit, as classify gives these rays
        for (int k = 0; k < up; k++) sky[restRay[k]] = !blocked[k];
    }
}
