package org.solmass.irradiation;

import org.solmass.climate.WeatherSeries;
import org.solmass.model.MassingModel;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.Scene;
import org.solmass.sky.SkyModel;
import org.solmass.surface.Patch;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceFrame;

import java.util.List;

/**
 * Assembles the inputs of {@link ShadedIrradiation}: receivers (analysed patches, coarse context
 * patches, ground probes), the reflector index, per-triangle albedo and ground flags, the sun
 * directions (exact or binned) and the step table.
 */
public final class IrradiationSetup {
    /** Ground probes at most, for the shaded-ground option; spacing grows for large sites. */
    static final int MAX_PROBES = 20_000;
    /** Hemisphere rays of reflector-only receivers (context patches, ground probes). */
    public static final int REFLECTOR_RAYS = 256;

    private IrradiationSetup() {}

    /** How the sun is sampled. */
    public enum SunSampling { EXACT, BINNED }

    /**
     * Options of the pipeline.
     *
     * @param patchSizeM the grid size of the analysed patches, metres
     * @param raysPerPatch hemisphere rays of an analysed patch
     * @param groundAlbedo albedo of the ground plane and of ground faces without their own
     * @param shadedGround take the ground's irradiance from shaded ground probes rather than GHI
     * @param sunSampling exact sun rays per step, or binned into a sky subdivision
     * @param sunBins cells of the sky subdivision when binned
     * @param runSeed seed mixed into every ray stream
     * @param keepMonthHour keep the 12 x 24 mean irradiance of every patch
     * @param bounceTolerance reflection stops after the bounce that adds at most this share of the
     *                        reflected total ({@link Reflection})
     * @param maxBounces reflection stops after this many bounces at the latest (1: one bounce)
     */
    public record Options(double patchSizeM, int raysPerPatch, double groundAlbedo, boolean shadedGround, SunSampling sunSampling,
                          int sunBins, long runSeed, boolean keepMonthHour, double bounceTolerance, int maxBounces) {

        /** With the default bounce tolerance (0.5 %) and maximum (20). */
        public Options(double patchSizeM, int raysPerPatch, double groundAlbedo, boolean shadedGround, SunSampling sunSampling,
                       int sunBins, long runSeed, boolean keepMonthHour) {
            this(patchSizeM, raysPerPatch, groundAlbedo, shadedGround, sunSampling, sunBins, runSeed, keepMonthHour,
                    DEFAULT_BOUNCE_TOLERANCE, DEFAULT_MAX_BOUNCES);
        }

        /** The same options with another bounce limit. */
        public Options withBounces(double tolerance, int max) {
            return new Options(patchSizeM, raysPerPatch, groundAlbedo, shadedGround, sunSampling, sunBins, runSeed,
                    keepMonthHour, tolerance, max);
        }
    }

    /** Default share of the reflected total below which one more bounce stops the series (our choice). */
    public static final double DEFAULT_BOUNCE_TOLERANCE = Reflection.DEFAULT_TOLERANCE;
    /** Default largest number of reflection bounces (our choice). */
    public static final int DEFAULT_MAX_BOUNCES = Reflection.DEFAULT_MAX_BOUNCES;

    /**
     * @param surfaces every surface of the model (from the patcher); patches refer to them by id
     * @param analysed analysed patches, index order
     * @param context coarse patches of context blocks (reflectors only), may be empty
     * @param triangleAlbedo albedo of every triangle of the scene: the model's, then the terrain's
     *                       (triangles of the scene beyond the model's count as ground and have no receiver)
     */
    public static ShadedIrradiation.Inputs build(Scene scene, MassingModel model, List<Surface> surfaces,
                                                 List<Patch> analysed, List<Patch> context, float[] triangleAlbedo,
                                                 WeatherSeries weather, SkyModel sky, Options o) {
        int nt = scene.triangleCount(); // the model's triangles, then any terrain's
        int[] triangleSurface = new int[nt];
        java.util.Arrays.fill(triangleSurface, -1);
        boolean[] isGround = Surface.groundTriangles(surfaces, nt);
        java.util.Arrays.fill(isGround, model.triangleCount(), nt, true); // terrain triangles are ground
        SurfaceFrame[] frames = new SurfaceFrame[surfaces.size()];
        for (Surface s : surfaces) {
            frames[s.id()] = s.frame();
            for (int t : s.triangles()) triangleSurface[t] = s.id();
        }
        double[] probeGrid = null;
        int probes = 0;
        double groundZ = scene.groundZ();
        if (o.shadedGround() && scene.hasGroundPlane()) {
            probeGrid = probeGrid(model, analysed.size() + context.size());
            probes = (int) (probeGrid[3] * probeGrid[4]);
        }
        int total = analysed.size() + context.size() + probes;
        Receivers.Builder b = new Receivers.Builder(total, analysed.size());
        double[] centres = new double[3 * total];
        double[] origin = new double[3];
        int r = 0;
        for (List<Patch> list : List.of(analysed, context)) {
            for (Patch p : list) {
                scene.rayOrigin(p, origin);
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
            double eps = scene.epsilon();
            for (int j = 0; j < ny; j++) {
                for (int i = 0; i < nx; i++) {
                    double x = probeGrid[0] + (i + 0.5) * probeGrid[2], y = probeGrid[1] + (j + 0.5) * probeGrid[2];
                    origin[0] = x;
                    origin[1] = y;
                    origin[2] = groundZ + eps;
                    b.add(origin, 0, 0, 1, HemisphereSampler.patchSeed("ground-" + i + "-" + j, o.runSeed()), -1);
                    centres[3 * r] = x;
                    centres[3 * r + 1] = y;
                    centres[3 * r + 2] = groundZ;
                    r++;
                }
            }
        }
        Receivers receivers = b.build();
        ReflectorIndex index = new ReflectorIndex(triangleSurface, frames, receivers.surface, centres,
                o.patchSizeM(), probeGrid);
        SunDirections dirs = o.sunSampling() == SunSampling.EXACT ? SunDirections.exact(weather)
                : SunDirections.binned(weather, new SkySubdivision(o.sunBins()));
        StepTable steps = new StepTable(weather, dirs, sky);
        return new ShadedIrradiation.Inputs(receivers, index, isGround, triangleAlbedo, o.groundAlbedo(),
                o.shadedGround(), steps, dirs, o.raysPerPatch(), Math.min(o.raysPerPatch(), REFLECTOR_RAYS),
                o.keepMonthHour(), o.bounceTolerance(), o.maxBounces());
    }

    /**
     * Probe grid over the model's footprint widened by its height on every side (where most of the
     * ground a facade sees lies): {x0, y0, spacing, nx, ny, firstIndex}. Spacing 2 m, widened so that
     * at most {@link #MAX_PROBES} probes are made.
     */
    static double[] probeGrid(MassingModel model, int patches) {
        double[] bb = model.bounds();
        double margin = Math.max(1, bb[5] - bb[2]);
        double x0 = bb[0] - margin, y0 = bb[1] - margin, w = bb[3] - bb[0] + 2 * margin, h = bb[4] - bb[1] + 2 * margin;
        double spacing = Math.max(2.0, Math.sqrt(w * h / MAX_PROBES));
        int nx = Math.max(1, (int) Math.ceil(w / spacing)), ny = Math.max(1, (int) Math.ceil(h / spacing));
        return new double[] {x0, y0, spacing, nx, ny, 0};
    }
}
