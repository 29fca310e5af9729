package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.check.Plausibility;
import org.solmass.check.Warning;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.TimeBase;
import org.solmass.climate.TimeBaseChoice;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.irradiation.IrradiationSetup;
import org.solmass.irradiation.MemoryEstimate;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.irradiation.CanopyShading;
import org.solmass.irradiation.ShadedIrradiation;
import org.solmass.metrics.MetricContext;
import org.solmass.metrics.Metrics;
import org.solmass.model.MassingModel;
import org.solmass.geo.GeoModel;
import org.solmass.geo.GeoReference;
import org.solmass.geo.ModelFiles;
import org.solmass.scene.Scene;
import org.solmass.study.Study;
import org.solmass.terrain.SiteTerrain;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.Surface;
import org.solmass.table.ResultTable;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;

/**
 * One analysis of a study, stage by stage: model, patches, scene, weather, shading-aware irradiation,
 * result table. Writes nothing (see {@link ResultFiles}); the CLI and the viewer both call it.
 */
public final class AnalysisRun {
    /** Context reflector patches are this many times the analysed patch size. */
    static final double CONTEXT_PATCH_FACTOR = 4;
    /** Seed of every ray stream of an analysis; fixed so that runs repeat exactly. */
    static final long RUN_SEED = 0x5A15_3A55L;

    private AnalysisRun() {}

    /**
     * Everything an analysis produced.
     *
     * @param geo where a geo-referenced model stands in its CRS, or null for an OBJ model
     */
    public record Outcome(Study study, MassingModel model, PatchSet patches, WeatherSeries weather,
                          IrradiationResult result, ResultTable table, List<String> warnings,
                          Map<String, Long> counts, Map<String, Double> timingsS, Metrics.Outcome metrics,
                          GeoReference geo) {}

    /** A study site farther than this from a geo-referenced model's centre gives a warning, metres. */
    static final double SITE_MISMATCH_M = 1000;

    /** The model read with the study's options (any format, {@link ModelFiles}), with the reader's warnings. */
    public static GeoModel loadModel(Study study) {
        return ModelFiles.load(study.model().file(), study.model().options(), study.model().geo());
    }

    /** The warning when the study's site lies more than {@link #SITE_MISMATCH_M} from a geo-referenced model's centre, or null. */
    static String siteMismatch(Study study, GeoReference geo) {
        if (geo == null) return null;
        double d = ModelFiles.distanceM(study.site().latitudeDeg(), study.site().longitudeDeg(), geo.latitudeDeg(), geo.longitudeDeg());
        if (d <= SITE_MISMATCH_M) return null;
        return String.format(java.util.Locale.ROOT, "site.latitude/longitude (%.6f, %.6f) lie %.1f km from the"
                        + " geo-referenced model's centre (%.6f, %.6f); the sun is computed for the study's site:"
                        + " leave both out to take the model's", study.site().latitudeDeg(), study.site().longitudeDeg(),
                d / 1000, geo.latitudeDeg(), geo.longitudeDeg());
    }

    /** Names of the analysed blocks; checks that every named block exists. */
    public static Set<String> analysedBlocks(Study study, MassingModel model) {
        List<String> names = model.blockNames();
        org.solmass.study.StudyReader.checkBlockNames(study, names);
        Set<String> out = new LinkedHashSet<>();
        for (String n : names) if (study.model().isAnalysed(n)) out.add(n);
        if (out.isEmpty()) {
            String where = study.source() == null ? "--context" : study.source() + ": model.context";
            throw new InputException(where, "no block is left to analyse: every block of "
                    + model.source() + " " + names + " is listed as context; list at least one block in"
                    + " model.analyse (--analyse) or drop one from the context");
        }
        return out;
    }

    /** Whether a block has no triangle in the model (a block whose faces are all trees). */
    /**
     * The model without the study's trees, and the crowns as their own scene (null when no triangle is a
     * tree): trees get no patches, do not reflect and do not block (docs/method.md "Vegetation").
     */
    record TreeSplit(MassingModel opaque, org.solmass.scene.Canopy canopy, List<String> warnings) {}

    static TreeSplit splitTrees(Study study, MassingModel model) {
        if (!study.vegetation().any()) return new TreeSplit(model, null, List.of());
        List<String> warnings = new ArrayList<>(study.vegetation().unmatched(model));
        boolean[] tree = study.vegetation().treeTriangles(model);
        boolean[] opaque = new boolean[tree.length];
        for (int i = 0; i < tree.length; i++) opaque[i] = !tree[i];
        MassingModel crowns = model.subset(tree);
        if (crowns.triangleCount() == 0) return new TreeSplit(model, null, warnings);
        return new TreeSplit(model.subset(opaque), org.solmass.scene.Canopy.build(crowns.triangleSoup()), warnings);
    }

    /** The blocks that get patches: the analysed blocks, less those made only of tree faces. */
    static Set<String> patchedBlocks(Study study, TreeSplit split) {
        Set<String> analysed = analysedBlocks(study, split.opaque());
        if (split.canopy() != null) analysed.removeIf(blockWithoutTriangles(split.opaque()));
        return analysed;
    }

    private static java.util.function.Predicate<String> blockWithoutTriangles(MassingModel model) {
        boolean[] has = new boolean[model.blockNames().size()];
        for (int b : model.triangleBlock()) has[b] = true;
        return name -> !has[model.blockNames().indexOf(name)];
    }

    /** The weather series of the study, with the time base resolved. */
    public static WeatherSeries loadWeather(Study study) {
        return ClimateSource.load(study.site(), study.climateSpec());
    }

    /** Runs the whole analysis on {@code threads} worker threads (0 = all cores). */
    public static Outcome run(Study study, PhaseProgress progress) {
        int threads = study.threads() > 0 ? study.threads() : Runtime.getRuntime().availableProcessors();
        return onPool(threads, () -> compute(study, progress), "analysis");
    }

    /**
     * Runs {@code work} inside a fork-join pool of {@code threads} workers of its own, so that its
     * parallel loops use those workers (not the JVM's common pool); unwraps what it throws.
     */
    public static <T> T onPool(int threads, java.util.function.Supplier<T> work, String what) {
        ForkJoinPool pool = new ForkJoinPool(threads);
        try {
            return pool.submit(work::get).get();
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException re) throw re;
            if (c instanceof Error err) throw err;
            throw new IllegalStateException(c);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(what + " interrupted", e);
        } finally {
            pool.shutdownNow();
        }
    }

    /**
     * An analysis up to the inputs of the irradiation stage, which need no scene: the model read and
     * split from its trees, the patches, the context patches, the terrain, the per-triangle albedo of
     * the whole scene, the weather and the pipeline options. The one-machine run and the city tiles
     * (org.solmass.tiles) both start here.
     *
     * @param canopy tree crowns as their own scene, or null
     * @param albedo albedo of every triangle of the whole scene (the model's, then the terrain's)
     */
    public record Prepared(Study study, GeoModel read, MassingModel model, org.solmass.scene.Canopy canopy,
                           PatchSet patches, List<org.solmass.surface.Patch> contextPatches, SiteTerrain terrain,
                           float[] albedo, WeatherSeries weather, IrradiationSetup.Options options, List<String> warnings) {
        /** The whole scene's triangles: the model's, then the terrain's (9 floats each, world metres). */
        public float[] soup() {
            float[] m = model.triangleSoup();
            if (terrain.triangleCount() == 0) return m;
            float[] t = terrain.soup(), soup = java.util.Arrays.copyOf(m, m.length + t.length);
            System.arraycopy(t, 0, soup, m.length, t.length);
            return soup;
        }

        /** Whether the scene has the infinite ground plane (always with terrain). */
        public boolean groundPlane() { return terrain.triangleCount() > 0 || !patches.hasGroundFaces(); }

        /** Height of the ground plane: the model's ground level, or with terrain the lowest point of its mesh. */
        public double groundZ() {
            return terrain.triangleCount() == 0 ? patches.groundLevelZ() : Math.min(terrain.lowestZ(), patches.groundLevelZ());
        }

        /** Tree crowns as the irradiation stage takes them, or null. */
        public CanopyShading canopyShading() {
            return canopy == null ? null : new CanopyShading(canopy, study.vegetation().monthly(study.site().latitudeDeg()));
        }
    }

    /** {@link Prepared} for a study; timings of "load" and "patches" go into {@code t}. */
    public static Prepared prepare(Study study, PhaseProgress progress, Map<String, Double> t) {
        return prepare(study, progress, t, null);
    }

    /**
     * {@link Prepared} for a study with its weather series already loaded ({@link #loadWeather}; a city
     * run's executors get it from the driver's tables), or null to load it.
     */
    public static Prepared prepare(Study study, PhaseProgress progress, Map<String, Double> t, WeatherSeries loaded) {
        return prepare(study, progress, t, loaded, false);
    }

    /**
     * As {@link #prepare(Study, PhaseProgress, Map, WeatherSeries)}; {@code forTiles}: the study is
     * prepared for a city run, which cuts it into tiles ({@code tiles.CityModel}), so the memory check
     * before patching counts what that JVM holds ({@link MemoryEstimate#forTilesBeforePatching}), not
     * the one-machine run's arrays.
     */
    public static Prepared prepare(Study study, PhaseProgress progress, Map<String, Double> t, WeatherSeries loaded, boolean forTiles) {
        List<String> warnings = new ArrayList<>();
        long t0 = System.nanoTime();

        progress.begin("load", 0);
        GeoModel read = loadModel(study);
        MassingModel model = read.model();
        warnings.addAll(read.warnings());
        String mismatch = siteMismatch(study, read.reference());
        if (mismatch != null) warnings.add(mismatch);
        WeatherSeries weather = loaded != null ? loaded : loadWeather(study);
        for (String x : weather.report().repairs()) warnings.add("climate repaired: " + x);
        for (String x : weather.report().warnings()) warnings.add("climate: " + x);
        for (Warning x : Plausibility.check(model, study.site(), weather)) warnings.add(x.toString());
        if (study.timeBase() == TimeBaseChoice.AVERAGE_DAYS && weather.timeBase() != TimeBase.AVERAGE_DAYS) {
            throw new InputException("time_base", "the climate source " + weather.source()
                    + " is an hourly year; monthly-average days need a month-hour table, monthly means or clear-sky");
        }
        TreeSplit split = splitTrees(study, model);
        warnings.addAll(split.warnings());
        org.solmass.scene.Canopy canopy = split.canopy();
        model = split.opaque();
        t.put("load", seconds(t0));

        long t1 = System.nanoTime();
        progress.begin("patches", 0);
        Set<String> analysed = patchedBlocks(study, split);
        try {
            requireMemoryForPatches(study, model, analysed, forTiles);
        } catch (InputException e) {   // a model in millimetres read as metres ends here: say so first
            throw warnings.isEmpty() ? e : e.withHint(". The input already gave these warnings, which may be the cause: "
                    + String.join("; ", warnings));
        }
        PatchSet patches = Patcher.build(model, new PatchOptions(study.patchM(), analysed, false));
        for (Warning x : Plausibility.surfaces(model, patches.surfaces())) warnings.add(x.toString());
        double hidden = patches.hiddenAreaM2();
        if (hidden > 0.5) {
            warnings.add(String.format(java.util.Locale.ROOT, "%.0f m2 of analysed faces lie against a touching block "
                    + "(coincident faces with opposite normals) and were left out: they face solid mass", hidden));
        }
        Set<String> context = new LinkedHashSet<>(model.blockNames());
        context.removeAll(analysed);
        List<org.solmass.surface.Patch> contextPatches = context.isEmpty() ? List.of()
                : Patcher.build(model, patches.surfaces(),
                        new PatchOptions(study.patchM() * CONTEXT_PATCH_FACTOR, context, false)).patches();
        if (patches.patches().isEmpty()) {
            throw new InputException("model.analyse", "the analysed blocks " + analysed + " have no surface to analyse");
        }
        t.put("patches", seconds(t1));

        SiteTerrain terrain = siteTerrain(study, patches);
        float[] albedo = study.albedo().perTriangle(model, Surface.groundTriangles(patches.surfaces(), model.triangleCount()));
        if (terrain.triangleCount() > 0) { // terrain triangles follow the model's: ground, with the ground albedo
            int nm = albedo.length;
            albedo = java.util.Arrays.copyOf(albedo, nm + terrain.triangleCount());
            java.util.Arrays.fill(albedo, nm, albedo.length, (float) study.albedo().ground());
        }
        warnings.addAll(terrain.notes());
        IrradiationSetup.Options o = new IrradiationSetup.Options(study.patchM(), study.rays(),
                study.albedo().ground(), study.groundIrradiance() == Study.GroundIrradiance.SHADED,
                weather.timeBase() == TimeBase.AVERAGE_DAYS ? IrradiationSetup.SunSampling.EXACT
                        : IrradiationSetup.SunSampling.BINNED,
                study.sunBins(), RUN_SEED, true)
                .withBounces(study.reflection().toleranceFraction(), study.reflection().maxBounces())
                .withReflectionRays(study.reflection().rays());
        return new Prepared(study, read, model, canopy, patches, contextPatches, terrain, albedo, weather, o, warnings);
    }

    private static Outcome compute(Study study, PhaseProgress progress) {
        Map<String, Double> t = new LinkedHashMap<>();
        Map<String, Long> counts = new LinkedHashMap<>();
        Prepared pr = prepare(study, progress, t);
        List<String> warnings = pr.warnings();
        GeoModel read = pr.read();
        MassingModel model = pr.model();
        org.solmass.scene.Canopy canopy = pr.canopy();
        PatchSet patches = pr.patches();
        List<org.solmass.surface.Patch> contextPatches = pr.contextPatches();
        WeatherSeries weather = pr.weather();

        long t2 = System.nanoTime();
        Scene scene = scene(pr);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(scene, model, patches.surfaces(), patches.patches(),
                contextPatches, pr.albedo(), weather, study.sky(), pr.options());
        if (canopy != null) in = in.withCanopy(pr.canopyShading());
        t.put("scene", seconds(t2));
        requireMemory(study, in, patches.patchCount());

        long t3 = System.nanoTime();
        IrradiationResult r = ShadedIrradiation.run(scene, in, progress);
        t.put("irradiation", seconds(t3));

        long t4 = System.nanoTime();
        progress.begin("metrics", 0);
        ResultTable table = new ResultTable(patches.patches());
        IrradiationColumns.addTo(table, r, weather.timeBase() == TimeBase.HOURLY_YEAR);
        Metrics.Outcome metrics = Metrics.run(metricContext(study, scene, patches, r, weather), table);
        t.put("metrics", seconds(t4));

        counts.put("blocks", (long) model.blockNames().size());
        counts.put("triangles", (long) model.triangleCount());
        counts.put("surfaces", (long) patches.surfaces().size());
        counts.put("patches", (long) patches.patchCount());
        counts.put("context_patches", (long) contextPatches.size());
        if (canopy != null) counts.put("tree_triangles", (long) canopy.triangleCount());
        counts.put("steps", (long) weather.size());
        counts.put("sun_directions", (long) r.sunDirections());
        counts.put("rays_per_patch", (long) org.solmass.scene.HemisphereSampler.roundedRayCount(study.rays()));
        if (pr.terrain().triangleCount() > 0) counts.put("terrain_triangles", (long) pr.terrain().triangleCount());
        counts.put("reflection_bounces", (long) r.bounces().used());
        counts.put("reflection_max_bounces", (long) r.bounces().maxBounces());
        return new Outcome(study, model, patches, weather, r, table, warnings, counts, t, metrics, read.reference());
    }

    /**
     * The study's terrain placed about the analysed patches: site centre = centre of their bounding
     * box in x and y; the far horizon of a DEM is seen from their mean centroid height.
     */
    static SiteTerrain siteTerrain(Study study, PatchSet patches) {
        if (study.terrain().isNone()) return SiteTerrain.NONE;
        double x0 = Double.POSITIVE_INFINITY, x1 = Double.NEGATIVE_INFINITY, y0 = x0, y1 = x1, z = 0;
        for (org.solmass.surface.Patch p : patches.patches()) {
            x0 = Math.min(x0, p.centroid().x());
            x1 = Math.max(x1, p.centroid().x());
            y0 = Math.min(y0, p.centroid().y());
            y1 = Math.max(y1, p.centroid().y());
            z += p.centroid().z();
        }
        double g = patches.groundLevelZ();
        double eye = Math.max(0, z / Math.max(1, patches.patchCount()) - g);
        return SiteTerrain.build(study.terrain(), (x0 + x1) / 2, (y0 + y1) / 2, g, eye);
    }

    /**
     * The scene: the model's triangles, then the terrain's (ground); the ground plane (at the model's
     * ground level, or with terrain at the lowest point of the terrain mesh) and the far horizon.
     */
    static Scene scene(Prepared pr) {
        return Scene.build(pr.soup(), pr.groundPlane(), pr.groundZ()).withHorizon(pr.terrain().horizon());
    }

    /**
     * Refuses, before the visibility phase, a study whose arrays would not fit the free heap
     * ({@link MemoryEstimate}); a second look after a garbage collection avoids refusing for garbage.
     */
    static void requireMemory(Study study, ShadedIrradiation.Inputs in, long patches) {
        int threads = study.threads() > 0 ? study.threads() : Runtime.getRuntime().availableProcessors();
        MemoryEstimate m = MemoryEstimate.of(in, threads);
        if (m.fits(MemoryEstimate.freeHeapBytes())) return;
        System.gc();
        m.requireFits(MemoryEstimate.freeHeapBytes(), study.patchM(), study.rays(), patches,
                study.source() == null ? "--patch" : study.source() + ": patch_m");
    }

    /**
     * The same check before patching, from the area of the blocks' faces that get patches (a huge
     * model at a small patch size would otherwise fill the heap inside the patcher).
     */
    static void requireMemoryForPatches(Study study, MassingModel model, Set<String> analysed, boolean forTiles) {
        double[] v = model.vertices();
        int[] tr = model.triangles();
        double inA = 0, ctxA = 0;
        double[] cr = new double[3];
        for (int t = 0; t < model.triangleCount(); t++) {
            org.solmass.model.TriangleGeometry.cross(v, tr, t, cr);
            double cz = cr[2], len = org.solmass.model.TriangleGeometry.length(cr), area = 0.5 * len;
            if (cz < -0.9 * len) continue; // undersides are not patched
            if (analysed.contains(model.blockNames().get(model.triangleBlock()[t]))) inA += area; else ctxA += area;
        }
        int threads = study.threads() > 0 ? study.threads() : Runtime.getRuntime().availableProcessors();
        int rays = org.solmass.scene.HemisphereSampler.roundedRayCount(study.rays());
        MemoryEstimate m = forTiles
                ? MemoryEstimate.forTilesBeforePatching(inA, study.patchM(), ctxA, study.patchM() * CONTEXT_PATCH_FACTOR)
                : MemoryEstimate.beforePatching(inA, study.patchM(), ctxA, study.patchM() * CONTEXT_PATCH_FACTOR,
                rays, IrradiationSetup.reflectorRays(rays, study.reflection().rays()), true, threads);
        if (m.fits(MemoryEstimate.freeHeapBytes())) return;
        System.gc();
        long patches = (long) Math.ceil(inA / (study.patchM() * study.patchM()));
        String where = study.source() == null ? "--patch" : study.source() + ": patch_m";
        if (forTiles) m.requireFitsForTiles(MemoryEstimate.freeHeapBytes(), study.patchM(), patches, where,
                "on a cluster --driver-memory, and spark.executor.memory for the executors; ./solmass city: SOLMASS_JAVA_OPTS=-Xmx..., default -Xmx8g");
        else m.requireFits(MemoryEstimate.freeHeapBytes(), study.patchM(), study.rays(), patches, where);
    }

    /**
     * What the metrics read: the finished stages and the study's metric settings, for the whole
     * model's scene (the model's triangles in its order, then any terrain's; ground flags from the
     * patches' GROUND surfaces).
     */
    public static MetricContext metricContext(Study study, Scene scene, PatchSet patches, IrradiationResult r, WeatherSeries weather) {
        return metricContext(study, scene, Surface.groundTriangles(patches.surfaces(), scene.triangleCount()), patches, r, weather);
    }

    /**
     * The metrics' context for a scene that is not the whole model's in the model's order (a city
     * tile's, in the city runner), with that scene's ground flags in its own numbering.
     */
    public static MetricContext metricContext(Study study, Scene scene, boolean[] sceneIsGround, PatchSet patches,
                                              IrradiationResult r, WeatherSeries weather) {
        return new MetricContext(scene, sceneIsGround, patches, r, weather, study.sky(), study.site(), study.climate().year(),
                study.albedo().ground(), study.patchM(), study.rays(), RUN_SEED, study.metricSettings());
    }

    static double seconds(long since) {
        return (System.nanoTime() - since) / 1e9;
    }
}
