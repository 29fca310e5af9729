package org.solmass.irradiation;

import org.solmass.model.MassingModel;
import org.solmass.scene.HemisphereSampler;
import org.solmass.surface.Patch;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceFrame;

import java.util.Arrays;
import java.util.List;

/**
 * Every receiver of a whole model in one global numbering, independent of any one scene: the
 * analysed patches first (id = patch index), then the coarse patches of context blocks, then the
 * ground probes (shaded-ground mode), each with its ray origin (centroid moved the whole model's
 * scene offset along the normal) and the seed of its ray stream (from its patch id, or
 * {@code ground-i-j} for a probe). {@link IrradiationSetup#build} uses it for one machine; a city
 * tile (org.solmass.tiles) uses the same layout, so a receiver computed in a tile has the id and
 * seed it has in the whole model.
 *
 * <p>Also per triangle of the whole scene (the model's triangles, then any terrain's): the surface
 * id (-1: none) and whether it is ground.
 */
public final class ReceiverLayout {
    final Receivers receivers;
    /** World centre x,y,z per receiver (patch centroid; probe at ground level). */
    final double[] centres;
    final SurfaceFrame[] frames;
    final int[] triangleSurface;
    final boolean[] triangleIsGround;
    /** {x0, y0, spacing, nx, ny, firstProbe} or null without probes. */
    final double[] probeGrid;
    private final int context;

    private ReceiverLayout(Receivers receivers, double[] centres, SurfaceFrame[] frames, int[] triangleSurface,
                           boolean[] triangleIsGround, double[] probeGrid, int context) {
        this.receivers = receivers;
        this.centres = centres;
        this.frames = frames;
        this.triangleSurface = triangleSurface;
        this.triangleIsGround = triangleIsGround;
        this.probeGrid = probeGrid;
        this.context = context;
    }

    /**
     * @param sceneTriangles triangles of the whole scene: the model's, then the terrain's (ground, no receiver)
     * @param groundPlane whether the whole scene has the infinite ground plane (probes need it)
     * @param groundZ its height, metres
     * @param epsilonM the whole scene's ray-origin offset ({@link org.solmass.scene.Scene#epsilon()}), metres
     * @param analysed analysed patches, index order
     * @param context coarse patches of context blocks, may be empty
     */
    public static ReceiverLayout of(int sceneTriangles, boolean groundPlane, double groundZ, double epsilonM,
                                    MassingModel model, List<Surface> surfaces, List<Patch> analysed,
                                    List<Patch> context, IrradiationSetup.Options o) {
        int[] triangleSurface = new int[sceneTriangles];
        Arrays.fill(triangleSurface, -1);
        boolean[] isGround = Surface.groundTriangles(surfaces, sceneTriangles);
        Arrays.fill(isGround, model.triangleCount(), sceneTriangles, true); // terrain triangles are ground
        SurfaceFrame[] frames = new SurfaceFrame[surfaces.size()];
        for (Surface s : surfaces) {
            frames[s.id()] = s.frame();
            for (int t : s.triangles()) triangleSurface[t] = s.id();
        }
        double[] probeGrid = null;
        int probes = 0;
        if (o.shadedGround() && groundPlane) {
            probeGrid = IrradiationSetup.probeGrid(model, analysed.size() + context.size());
            probes = (int) (probeGrid[3] * probeGrid[4]);
        }
        int total = analysed.size() + context.size() + probes;
        Receivers.Builder b = new Receivers.Builder(total, analysed.size());
        double[] centres = new double[3 * total];
        double[] origin = new double[3];
        int r = 0;
        for (List<Patch> list : List.of(analysed, context)) {
            for (Patch p : list) {
                origin[0] = p.centroid().x() + epsilonM * p.normal().x(); // Scene.rayOrigin of the whole scene
                origin[1] = p.centroid().y() + epsilonM * p.normal().y();
                origin[2] = p.centroid().z() + epsilonM * p.normal().z();
                b.add(origin, p.normal().x(), p.normal().y(), p.normal().z(),
                        HemisphereSampler.patchSeed(p.id(), o.runSeed()), p.surface());
                centres[3 * r] = p.centroid().x();
                centres[3 * r + 1] = p.centroid().y();
                centres[3 * r + 2] = p.centroid().z();
                r++;
            }
        }
        if (probeGrid != null) {
            probeGrid[5] = r;
            int nx = (int) probeGrid[3], ny = (int) probeGrid[4];
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    double x = probeGrid[0] + (i + 0.5) * probeGrid[2], y = probeGrid[1] + (j + 0.5) * probeGrid[2];
                    origin[0] = x;
                    origin[1] = y;
                    origin[2] = groundZ + epsilonM;
                    b.add(origin, 0, 0, 1, HemisphereSampler.patchSeed("ground-" + i + "-" + j, o.runSeed()), -1);
                    centres[3 * r] = x;
                    centres[3 * r + 1] = y;
                    centres[3 * r + 2] = groundZ;
                    r++;
                }
            }
        }
        return new ReceiverLayout(b.build(), centres, frames, triangleSurface, isGround, probeGrid, context.size());
    }

    /** Receivers in all. */
    public int count() { return receivers.count; }

    /** Analysed patches (ids 0 .. analysed - 1). */
    public int analysed() { return receivers.analysed; }

    /** Context patches (ids analysed .. analysed + context - 1). */
    public int contextPatches() { return context; }

    /** Ground probes (the last ids). */
    public int probes() { return count() - analysed() - context; }

    /** World centre of receiver r, metres: x, y, z for k = 0, 1, 2. */
    public double centre(int r, int k) { return centres[3 * r + k]; }

    /** Surface id of receiver r, -1 for a ground probe. */
    public int surface(int r) { return receivers.surface[r]; }

    /** Surface id of triangle t of the whole scene, -1 where none. */
    public int triangleSurface(int t) { return triangleSurface[t]; }

    /**
     * The reflector index for a scene made of {@code triangles} of the whole scene (in that order;
     * null: all of them): hits on the scene's triangle i resolve to the whole model's receivers of the
     * surface of triangle {@code triangles[i]}. Receivers on surfaces not in the scene are left out.
     */
    ReflectorIndex index(int[] triangles, double cellM) {
        if (triangles == null) return new ReflectorIndex(triangleSurface, frames, receivers.surface, centres, cellM, probeGrid);
        // a scene of some of the model's triangles (a city tile and its halo): the whole layout's index,
        // built once per layout and cell size, with the scene's triangles mapped to their surfaces.
        // A surface's buckets depend on its own receivers only, and only surfaces of the scene's
        // triangles are ever looked up, so the answers are those of an index of the scene alone.
        int[] ts = new int[triangles.length];
        for (int i = 0; i < triangles.length; i++) ts[i] = triangleSurface[triangles[i]];
        return wholeIndex(cellM).withTriangleSurfaces(ts);
    }

    private ReflectorIndex whole;
    private double wholeCellM = Double.NaN;

    /** The index of every receiver of the layout (built on first use per cell size; tiles share it). */
    private synchronized ReflectorIndex wholeIndex(double cellM) {
        if (whole == null || Double.compare(wholeCellM, cellM) != 0) {
            whole = new ReflectorIndex(triangleSurface, frames, receivers.surface, centres, cellM, probeGrid);
            wholeCellM = cellM;
        }
        return whole;
    }

    /** Ground flags of the scene made of {@code triangles} of the whole scene (null: all). */
    boolean[] groundFlags(int[] triangles) {
        if (triangles == null) return triangleIsGround;
        boolean[] g = new boolean[triangles.length];
        for (int i = 0; i < triangles.length; i++) g[i] = triangleIsGround[triangles[i]];
        return g;
    }
}
