package org.solmass.scene;

import org.solmass.model.MassingModel;
import org.solmass.surface.Patch;

/**
 * The ray-casting scene: a bounding volume hierarchy (BVH) over every triangle of a massing model
 * (analysed and context blocks alike) plus an optional analytic infinite ground plane.
 *
 * <p>Layout (see docs/scene.md): the BVH is built with a binned surface-area heuristic
 * (Wald, 2007, "On fast construction of SAH-based bounding volume hierarchies", IEEE Symposium on
 * Interactive Ray Tracing) and flattened depth-first into one linear array, the first child right
 * after its parent (Pharr, Jakob and Humphreys, Physically Based Rendering, 3rd ed., 2016,
 * section 4.3.4 "Compact BVH for traversal"); each node stores both children's boxes so one node
 * fetch tests two boxes and only boxes that are hit are pushed (the node layout of Aila and Laine,
 * 2009, "Understanding the efficiency of ray traversal on GPUs", High Performance Graphics). Triangles are
 * reordered into leaf order and stored as vertex 0 plus the two edge vectors for the
 * Moller-Trumbore test.
 *
 * <p>Precision: triangles and boxes are stored as {@code float}, relative to the centre of the model's
 * bounding box, so that models in projected coordinates (x ~ 500 000 m) keep sub-millimetre
 * resolution. Queries take world coordinates in {@code double}; the shift is applied per query.
 *
 * <p>Immutable and thread-safe; each thread queries through its own {@link Tracer}.
 */
public final class Scene {
    /**
     * Words per BVH node in {@link #nodes} (64 bytes, one cache line): child A min x,y,z, max x,y,z;
     * child B min x,y,z, max x,y,z; child A reference; child B reference; split axis (int bits,
     * 0..2: child A holds the lower side along it); 1 unused. A reference is the
     * int bit pattern of {@code node << 1} for an interior child, or of
     * {@code (firstTriangle << 3 | (count - 1)) << 1 | 1} for a leaf of 1..8 triangles; both are
     * non-negative ints below 2^31 - 2^23, never a NaN pattern, so they survive float storage.
     */
    static final int NODE_WORDS = 16;
    /** Floats per triangle in {@link #tris}: v0 x,y,z, e1 = v1-v0, e2 = v2-v0. */
    static final int TRI_WORDS = 9;

    final float[] nodes;
    final float[] tris;
    final int[] triOriginal;
    final int maxDepth;
    final int nodeCount;
    /** World coordinates of the storage origin (subtracted from every query point), metres. */
    final double shiftX, shiftY, shiftZ;
    final boolean groundPlane;
    /** Ground plane height in world coordinates, metres. */
    final double groundZ;
    private final double diagonal;
    private final double epsilon;
    private final int triangleCount;
    /** The far horizon; rays that leave the scene at or below it are obstructed ({@link #withHorizon}). */
    final HorizonProfile horizon;
    /** {@code !horizon.isNone()}: the one test the kernels make per escaping ray when there is none. */
    final boolean farHorizon;

    private Scene(BvhBuilder.Result r, double[] bounds, double[] shift, boolean groundPlane, double groundZ,
                  int triangleCount, double epsilonM) {
        this.nodes = r.nodes();
        this.tris = r.tris();
        this.triOriginal = r.triOriginal();
        this.maxDepth = r.maxDepth();
        this.nodeCount = r.nodeCount();
        this.shiftX = shift[0];
        this.shiftY = shift[1];
        this.shiftZ = shift[2];
        this.groundPlane = groundPlane;
        this.groundZ = groundZ;
        this.triangleCount = triangleCount;
        double ex = bounds[3] - bounds[0], ey = bounds[4] - bounds[1], ez = bounds[5] - bounds[2];
        double d = Math.sqrt(ex * ex + ey * ey + ez * ez);
        this.diagonal = Double.isFinite(d) ? d : 0;
        this.epsilon = Double.isNaN(epsilonM) ? epsilonOf(diagonal) : epsilonM;
        this.horizon = HorizonProfile.NONE;
        this.farHorizon = false;
    }

    /** The same tree and ground plane with another far horizon (arrays shared, nothing copied). */
    private Scene(Scene s, HorizonProfile horizon) {
        this.nodes = s.nodes;
        this.tris = s.tris;
        this.triOriginal = s.triOriginal;
        this.maxDepth = s.maxDepth;
        this.nodeCount = s.nodeCount;
        this.shiftX = s.shiftX;
        this.shiftY = s.shiftY;
        this.shiftZ = s.shiftZ;
        this.groundPlane = s.groundPlane;
        this.groundZ = s.groundZ;
        this.triangleCount = s.triangleCount;
        this.diagonal = s.diagonal;
        this.epsilon = s.epsilon;
        this.horizon = horizon;
        this.farHorizon = !horizon.isNone();
    }

    /**
     * This scene with a far horizon: every ray that leaves the scene (hits no triangle and not the
     * ground plane, with no distance limit) going up at or below {@code horizon}'s elevation for its
     * azimuth is obstructed ({@link HorizonProfile#obstructs}): {@link Tracer#occluded} is true and
     * {@link Tracer#closestHit} returns {@link Tracer#HORIZON}. Rays going down are left as they are
     * (they meet the ground plane, or count as ground without one). {@link HorizonProfile#NONE}
     * gives the scene without a far horizon.
     */
    public Scene withHorizon(HorizonProfile horizon) {
        return new Scene(this, horizon == null ? HorizonProfile.NONE : horizon);
    }

    /** The far horizon ({@link HorizonProfile#NONE} unless set by {@link #withHorizon}). */
    public HorizonProfile horizon() { return horizon; }

    /**
     * Whether a ray from anywhere along unit (or any-length) direction d that leaves the scene is
     * obstructed by the far horizon: false without one and for rays that do not go up.
     */
    public boolean escapeBlocked(double dx, double dy, double dz) {
        return farHorizon && dz > 0 && horizon.obstructs(dx, dy, dz);
    }

    /**
     * {@link #escapeBlocked} of each of {@code count} directions {@code dir[3s..3s+2]} (as float
     * directions are widened to double), for a fixed set of directions traced from many origins
     * (sun cells, horizon band): the answers depend on the direction only, so a caller computes them
     * once per scene and hands them to {@link BundleTracer#occludedKnownFar}.
     */
    public boolean[] escapeBlocked(float[] dir, int count) {
        boolean[] far = new boolean[count];
        for (int s = 0; s < count; s++) far[s] = escapeBlocked(dir[3 * s], dir[3 * s + 1], dir[3 * s + 2]);
        return far;
    }

    /** As {@link #escapeBlocked(float[], int)} for double directions. */
    public boolean[] escapeBlocked(double[] dir, int count) {
        boolean[] far = new boolean[count];
        for (int s = 0; s < count; s++) far[s] = escapeBlocked(dir[3 * s], dir[3 * s + 1], dir[3 * s + 2]);
        return far;
    }

    /** Relative ray-origin offset: {@value} x the scene's bounding-box diagonal. */
    public static final double EPSILON_PER_DIAGONAL = 1e-5;
    /** Smallest ray-origin offset, metres (1 mm). */
    public static final double MIN_EPSILON_M = 1e-3;

    /**
     * Builds the scene over all triangles of {@code model}.
     *
     * @param model the massing model (triangles in metres, z up)
     * @param infiniteGroundPlane whether to add the analytic plane z = groundZ (it faces up; it blocks
     *                            rays from both sides)
     * @param groundZ height of the ground plane, metres (ignored without the plane)
     */
    public static Scene build(MassingModel model, boolean infiniteGroundPlane, double groundZ) {
        return build(model.triangleSoup(), infiniteGroundPlane, groundZ);
    }

    /**
     * Builds the scene from a triangle soup (9 floats per triangle: the three corners' x,y,z, metres,
     * world coordinates). Triangle indices reported by queries are indices into this soup.
     */
    public static Scene build(float[] soup, boolean infiniteGroundPlane, double groundZ) {
        return build(soup, infiniteGroundPlane, groundZ, null);
    }

    /**
     * The storage origin {@link #build(float[], boolean, double)} picks for a soup (the floor of its
     * bounding box centre, world metres) followed by the ray-origin offset {@link #epsilon()} of that
     * scene: {x, y, z, epsilon}. A part of a model built with the whole model's origin
     * ({@link #build(float[], boolean, double, double[])}) stores its triangles bit for bit as the whole
     * model's scene does (city tiles, org.solmass.tiles).
     */
    public static double[] storageFrame(float[] soup) {
        double[] b = soupBounds(soup);
        double[] f = new double[4];
        if (soup.length > 0) for (int k = 0; k < 3; k++) f[k] = Math.floor((b[k] + b[k + 3]) / 2);
        else b = new double[6];
        double ex = b[3] - b[0], ey = b[4] - b[1], ez = b[5] - b[2];
        double d = Math.sqrt(ex * ex + ey * ey + ez * ez);
        f[3] = epsilonOf(Double.isFinite(d) ? d : 0);
        return f;
    }

    private static double epsilonOf(double diagonal) {
        return Math.max(MIN_EPSILON_M, EPSILON_PER_DIAGONAL * diagonal);
    }

    /**
     * As {@link #build(float[], boolean, double)} with a given storage frame {x, y, z[, epsilon]}
     * (world metres, whole numbers, as {@link #storageFrame} gives it; null: the soup's own): a part of
     * a model built with the whole model's frame stores its triangles exactly as the whole model's
     * scene does, so a ray meets a triangle at the same distance in both, and its rays leave patches
     * from the same points ({@link #epsilon()} is the frame's fourth value when given).
     */
    public static Scene build(float[] soup, boolean infiniteGroundPlane, double groundZ, double[] storageOrigin) {
        if (soup.length % 9 != 0) throw new IllegalArgumentException("triangle soup length not a multiple of 9");
        int n = soup.length / 9;
        double[] b = soupBounds(soup);
        double[] shift = storageOrigin == null ? storageFrame(soup) : storageOrigin;
        if (n == 0) b = new double[6];
        double eps = storageOrigin != null && storageOrigin.length > 3 ? storageOrigin[3] : Double.NaN;
        shift = new double[] {shift[0], shift[1], shift[2]};
        BvhBuilder.Result r = new BvhBuilder(soup, shift).build();
        return new Scene(r, b, shift, infiniteGroundPlane, groundZ, n, eps);
    }

    private static double[] soupBounds(float[] soup) {
        double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (int i = 0; i < soup.length; i += 3) {
            for (int k = 0; k < 3; k++) {
                b[k] = Math.min(b[k], soup[i + k]);
                b[k + 3] = Math.max(b[k + 3], soup[i + k]);
            }
        }
        return b;
    }

    /**
     * A new scene of this scene's triangles followed by {@code extraSoup} (9 floats per triangle,
     * world coordinates), with the same ground plane and far horizon, the same storage origin and the
     * same ray-origin offset {@link #epsilon()}: for objects added to a model, e.g. PV module racks.
     * Triangle {@code i < triangleCount()} keeps its index; the extra ones follow. The corners of
     * this scene's triangles are read back from storage (float, relative to the storage origin) and
     * stored again relative to the same origin, so they are stored bit for bit as before; a part of
     * a model built in the whole model's frame (a city tile) and the whole model, each with the same
     * extra triangles, cast the same rays from the same points (TiledGroundFacesTest).
     */
    public Scene withTriangles(float[] extraSoup) {
        if (extraSoup.length % 9 != 0) throw new IllegalArgumentException("triangle soup length not a multiple of 9");
        float[] soup = new float[9 * triangleCount + extraSoup.length];
        for (int i = 0; i < triangleCount; i++) {
            int t = TRI_WORDS * i, o = 9 * triOriginal[i];
            for (int k = 0; k < 3; k++) {
                double v0 = tris[t + k] + (k == 0 ? shiftX : k == 1 ? shiftY : shiftZ);
                soup[o + k] = (float) v0;
                soup[o + 3 + k] = (float) (v0 + tris[t + 3 + k]);
                soup[o + 6 + k] = (float) (v0 + tris[t + 6 + k]);
            }
        }
        System.arraycopy(extraSoup, 0, soup, 9 * triangleCount, extraSoup.length);
        Scene extended = build(soup, groundPlane, groundZ, new double[] {shiftX, shiftY, shiftZ, epsilon});
        return horizon.isNone() ? extended : extended.withHorizon(horizon); // the far horizon stays
    }

    /** A new query object for the calling thread (owns its traversal stack; not thread-safe). */
    public Tracer tracer() {
        return new Tracer(this);
    }

    /** A new bundle query object (rays sharing an origin) for the calling thread (not thread-safe). */
    public BundleTracer bundleTracer() {
        return new BundleTracer(this);
    }

    public int triangleCount() { return triangleCount; }

    /** Interior BVH nodes (each holds its two children's boxes). */
    public int nodeCount() { return nodeCount; }

    /** Depth of the deepest BVH leaf (root = 0). */
    public int maxDepth() { return maxDepth; }

    public boolean hasGroundPlane() { return groundPlane; }

    /** Height of the infinite ground plane, metres (meaningful only with {@link #hasGroundPlane()}). */
    public double groundZ() { return groundZ; }

    /** Bounding-box diagonal of all triangles, metres. */
    public double diagonal() { return diagonal; }

    /**
     * Ray-origin offset along a patch normal, metres: {@code max(1 mm, 1e-5 x scene diagonal)}.
     * Float storage relative to the box centre has a resolution of about 6e-8 x |coordinate|, i.e.
     * at most 3e-8 x diagonal, so the offset is over 100 float steps away from the patch's own face
     * (no self-hit) yet far smaller than any patch (no leak through the faces that meet its edges).
     */
    public double epsilon() { return epsilon; }

    /** Origin for rays leaving {@code patch}: its centroid moved {@link #epsilon()} along its normal. */
    public double[] rayOrigin(Patch patch) {
        double[] o = new double[3];
        rayOrigin(patch, o);
        return o;
    }

    /** Allocation-free form of {@link #rayOrigin(Patch)}: writes x,y,z into {@code out[0..2]}. */
    public void rayOrigin(Patch patch, double[] out) {
        out[0] = patch.centroid().x() + epsilon * patch.normal().x();
        out[1] = patch.centroid().y() + epsilon * patch.normal().y();
        out[2] = patch.centroid().z() + epsilon * patch.normal().z();
    }
}
