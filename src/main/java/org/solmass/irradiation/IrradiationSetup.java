package org.solmass.irradiation;

import org.solmass.climate.WeatherSeries;
import org.solmass.model.MassingModel;
import org.solmass.scene.Scene;
import org.solmass.sky.SkyModel;
import org.solmass.surface.Patch;
import org.solmass.surface.Surface;

import java.util.List;

/**
 * Assembles the inputs of {@link ShadedIrradiation}: receivers (analysed patches, coarse context
 * patches, ground probes), the reflector index, per-triangle albedo and ground flags, the sun
 * directions (exact or binned) and the step table.
 */
public final class IrradiationSetup {
    /** Ground probes at most, for the shaded-ground option; spacing grows for large sites. */
    static final int MAX_PROBES = 20_000;
    /**
     * Hemisphere rays that sample reflected light: all rays of reflector-only receivers (context
     * patches, ground probes), and the stratified subset of an analysed patch's rays
     * ({@link org.solmass.scene.HemisphereSampler#sampleForReflection}; its view factors use all its
     * rays). Our choice, from the error study in docs/method.md ("Reflection rays").
     */
    public static final int REFLECTOR_RAYS = 256;

    /** Reflection rays of a run of {@code raysPerPatch} rays at the default request ({@link #REFLECTOR_RAYS}). */
    static int reflectorRays(int raysPerPatch) {
        return reflectorRays(raysPerPatch, REFLECTOR_RAYS);
    }

    /**
     * Reflection rays of a run of {@code raysPerPatch} rays with {@code requested} asked for (study key
     * {@code reflection.rays}): the hemisphere rays of a reflector-only receiver, never more than an
     * analysed patch's rays.
     */
    public static int reflectorRays(int raysPerPatch, int requested) {
        return Math.min(raysPerPatch, requested);
    }

    /** Rays of an analysed patch traced with {@code raysPerPatch} requested rays that sample reflected light (default request). */
    public static int reflectionRays(int raysPerPatch) {
        return reflectionRays(raysPerPatch, REFLECTOR_RAYS);
    }

    /** As {@link #reflectionRays(int)} with {@code requested} reflection rays asked for. */
    public static int reflectionRays(int raysPerPatch, int requested) {
        return org.solmass.scene.HemisphereSampler.reflectionRayCount(raysPerPatch, reflectorRays(raysPerPatch, requested));
    }

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
     * @param reflectionRays requested rays that sample reflected light ({@link #reflectorRays(int, int)})
     */
    public record Options(double patchSizeM, int raysPerPatch, double groundAlbedo, boolean shadedGround, SunSampling sunSampling,
                          int sunBins, long runSeed, boolean keepMonthHour, double bounceTolerance, int maxBounces,
                          int reflectionRays) {

        /** With the default reflection rays ({@link #REFLECTOR_RAYS}). */
        public Options(double patchSizeM, int raysPerPatch, double groundAlbedo, boolean shadedGround, SunSampling sunSampling,
                       int sunBins, long runSeed, boolean keepMonthHour, double bounceTolerance, int maxBounces) {
            this(patchSizeM, raysPerPatch, groundAlbedo, shadedGround, sunSampling, sunBins, runSeed, keepMonthHour,
                    bounceTolerance, maxBounces, REFLECTOR_RAYS);
        }

        /** With the default bounce tolerance (0.5 %) and maximum (20). */
        public Options(double patchSizeM, int raysPerPatch, double groundAlbedo, boolean shadedGround, SunSampling sunSampling,
                       int sunBins, long runSeed, boolean keepMonthHour) {
            this(patchSizeM, raysPerPatch, groundAlbedo, shadedGround, sunSampling, sunBins, runSeed, keepMonthHour,
                    DEFAULT_BOUNCE_TOLERANCE, DEFAULT_MAX_BOUNCES);
        }

        /** The same options with another bounce limit. */
        public Options withBounces(double tolerance, int max) {
            return new Options(patchSizeM, raysPerPatch, groundAlbedo, shadedGround, sunSampling, sunBins, runSeed,
                    keepMonthHour, tolerance, max, reflectionRays);
        }

        /** The same options with {@code rays} requested rays for reflected light. */
        public Options withReflectionRays(int rays) {
            return new Options(patchSizeM, raysPerPatch, groundAlbedo, shadedGround, sunSampling, sunBins, runSeed,
                    keepMonthHour, bounceTolerance, maxBounces, rays);
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
        ReceiverLayout layout = ReceiverLayout.of(scene.triangleCount(), scene.hasGroundPlane(), scene.groundZ(),
                scene.epsilon(), model, surfaces, analysed, context, o);
        return inputs(layout, null, triangleAlbedo, Sun.of(weather, sky, o), o);
    }

    /**
     * The inputs for a scene made of {@code triangles} of the whole scene (null: all of them, in
     * order) with the receivers of {@code layout}: hits resolve to the whole model's receivers.
     *
     * @param triangleAlbedo albedo of every triangle of the whole scene
     */
    public static ShadedIrradiation.Inputs inputs(ReceiverLayout layout, int[] triangles, float[] triangleAlbedo,
                                                  Sun sun, Options o) {
        float[] albedo = triangleAlbedo;
        if (triangles != null) {
            albedo = new float[triangles.length];
            for (int i = 0; i < triangles.length; i++) albedo[i] = triangleAlbedo[triangles[i]];
        }
        return new ShadedIrradiation.Inputs(layout.receivers, layout.index(triangles, o.patchSizeM()),
                layout.groundFlags(triangles), albedo, o.groundAlbedo(), o.shadedGround(), sun.steps, sun.directions,
                o.raysPerPatch(), reflectorRays(o.raysPerPatch(), o.reflectionRays()), o.keepMonthHour(), o.bounceTolerance(),
                o.maxBounces());
    }

    /**
     * The sun directions (exact or binned, {@link Options#sunSampling()}) and the step table of a
     * weather series and sky model: computed once per run and shared by every scene of it.
     */
    public static final class Sun {
        final SunDirections directions;
        final StepTable steps;

        /** How many times this JVM computed the tables ({@link #of}): a city run's tests and benchmark read it. */
        private static final java.util.concurrent.atomic.AtomicLong COMPUTED = new java.util.concurrent.atomic.AtomicLong();

        Sun(SunDirections directions, StepTable steps) {
            this.directions = directions;
            this.steps = steps;
        }

        /** The number of {@link #of} calls in this JVM so far (tables read back by {@link SunCodec} do not count). */
        public static long computedCount() { return COMPUTED.get(); }

        public static Sun of(WeatherSeries weather, SkyModel sky, Options o) {
            COMPUTED.incrementAndGet();
            SunDirections dirs = o.sunSampling() == SunSampling.EXACT ? SunDirections.exact(weather)
                    : SunDirections.binned(weather, new SkySubdivision(o.sunBins()));
            return new Sun(dirs, new StepTable(weather, dirs, sky));
        }

        public SunDirections directions() { return directions; }
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
