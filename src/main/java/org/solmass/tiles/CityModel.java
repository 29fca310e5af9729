package org.solmass.tiles;

import org.solmass.cli.AnalysisRun;
import org.solmass.climate.TimeBase;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.irradiation.IrradiationSetup;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.irradiation.ReceiverLayout;
import org.solmass.irradiation.ShadedIrradiation;
import org.solmass.irradiation.StagedPasses;
import org.solmass.metrics.Metrics;
import org.solmass.model.MassingModel;
import org.solmass.scene.HorizonProfile;
import org.solmass.scene.Scene;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchSet;
import org.solmass.table.ResultTable;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A study prepared for a tiled (city-scale) run, and the three stages of such a run on its tiles.
 * Not serializable: a task rebuilds it from the study file and the driver's {@link #tables}
 * ({@link #load(Path, CityTables)}) and keeps it for all the tiles it runs; what travels between stages is serializable ({@link CityPlan}, {@link Tile},
 * {@link FirstPasses}, {@link StagedPasses.Reflected}).
 *
 * <p>A run, as {@link LocalCityRunner} does it on one machine:
 * <pre>
 *   CityModel city = CityModel.load(studyFile);
 *   CityPlan plan = city.plan(CityOptions.defaults());
 *   List&lt;FirstPasses&gt; firsts = plan.tiles().stream().map(city::firstPass).toList();   // stage 1, per tile
 *   StagedPasses.Reflected refl = city.reflect(firsts);                                 // exchange + bounces
 *   TileRows rows = city.finish(tile, firstOfTile, refl);                                // stage 3, per tile
 * </pre>
 * Every receiver has the id and ray seed of the one-machine run ({@link ReceiverLayout}), and each
 * tile's scene is stored in the whole model's frame ({@link Scene#build(float[], boolean, double, double[])}),
 * so where a tile's halo holds every block its receivers see, its rows equal those of
 * {@code solmass analyse} up to rounding (TiledRunMatchesOneMachineTest).
 */
public final class CityModel {
    private final Study study;
    private final AnalysisRun.Prepared prepared;
    private final ReceiverLayout layout;
    private final IrradiationSetup.Sun sun;
    private final float[] soup;
    private final double[] frame;
    /** Per block: min x, min y, max x, max y, max z (plan bounds and top), NaN for a block without triangles. */
    private final double[][] blockBounds;
    private final Map<Double, HeightRaster> rasters = new HashMap<>();
    /** Per triangle of the whole scene (the model's, then any terrain's): whether it belongs to a GROUND surface. */
    private final boolean[] groundTriangles;

    private CityModel(Study study, AnalysisRun.Prepared prepared, IrradiationSetup.Sun sun) {
        this.study = study;
        this.prepared = prepared;
        this.soup = prepared.soup();
        this.frame = Scene.storageFrame(soup);
        this.layout = ReceiverLayout.of(soup.length / 9, prepared.groundPlane(), prepared.groundZ(), frame[3],
                prepared.model(), prepared.patches().surfaces(), prepared.patches().patches(), prepared.contextPatches(),
                prepared.options());
        this.sun = sun != null ? sun : IrradiationSetup.Sun.of(prepared.weather(), study.sky(), prepared.options());
        this.blockBounds = blockBounds(prepared.model());
        this.groundTriangles = org.solmass.surface.Surface.groundTriangles(prepared.patches().surfaces(), soup.length / 9);
    }

    /** The study file read and prepared (model, patches, weather) as {@code solmass analyse} does. */
    public static CityModel load(Path studyFile) {
        return of(StudyReader.read(studyFile));
    }

    /**
     * The study file read and prepared with the tables the driver computed from the same file
     * ({@link #tables}, sent as bytes): the climate is not read and the sun and sky tables are not
     * computed again (a Spark executor's set-up).
     */
    public static CityModel load(Path studyFile, CityTables tables) {
        return of(StudyReader.read(studyFile), tables);
    }

    /** A study prepared as {@code solmass analyse} does. */
    public static CityModel of(Study study) {
        return new CityModel(study, AnalysisRun.prepare(study, PhaseProgress.NONE, new java.util.LinkedHashMap<>(), null, true), null);
    }

    /** A study prepared with tables computed from it before ({@link #tables}): weather, sun and step table as given. */
    public static CityModel of(Study study, CityTables tables) {
        return new CityModel(study, AnalysisRun.prepare(study, PhaseProgress.NONE, new java.util.LinkedHashMap<>(), tables.weather(), true),
                tables.sun());
    }

    /** The tables every tile shares (weather, sun directions, step table), to send to the executors ({@link CityTables#encode}). */
    public CityTables tables() { return new CityTables(prepared.weather(), sun); }

    public Study study() { return study; }

    public AnalysisRun.Prepared prepared() { return prepared; }

    public ReceiverLayout layout() { return layout; }

    /** The sun directions and step table, computed once for every tile. */
    public IrradiationSetup.Sun sun() { return sun; }

    /** The coarse height raster of the whole model at this cell size (built once, then kept). */
    public synchronized HeightRaster raster(double cellM) {
        return rasters.computeIfAbsent(cellM, c -> HeightRaster.of(prepared.model(), c));
    }

    /** The tiles, halo and far horizons for these options (see {@link CityPlan} for the rules). */
    public CityPlan plan(CityOptions o) {
        return Tiling.plan(this, o);
    }

    double[][] blockBounds() { return blockBounds; }

    /**
     * The scene of a tile: its blocks and the halo's (and any terrain), in the whole model's frame,
     * with the far horizon of its lowest band (the one the metrics of {@link #finish} see).
     */
    public Scene tileScene(Tile t) {
        return baseScene(t).withHorizon(horizon(t, 0));
    }

    private Scene baseScene(Tile t) {
        int[] tris = sceneTriangles(t);
        float[] s = new float[9 * tris.length];
        for (int i = 0; i < tris.length; i++) System.arraycopy(soup, 9 * tris[i], s, 9 * i, 9);
        return Scene.build(s, prepared.groundPlane(), prepared.groundZ(), frame);
    }

    /** The far horizon of band k of a tile composed with the terrain's (the higher counts). */
    private HorizonProfile horizon(Tile t, int band) {
        double[] e = t.horizonDeg(band);
        return FarHorizon.max(prepared.terrain().horizon(), e == null ? HorizonProfile.NONE : new HorizonProfile(e));
    }

    /** Triangles of the whole scene in the tile's scene, ascending: its blocks', then every terrain triangle. */
    public int[] sceneTriangles(Tile t) {
        MassingModel m = prepared.model();
        boolean[] in = new boolean[m.blockNames().size()];
        for (int b : t.sceneBlocks()) in[b] = true;
        int[] tb = m.triangleBlock();
        int n = 0, total = soup.length / 9;
        int[] out = new int[total];
        for (int i = 0; i < total; i++) if (i >= tb.length || in[tb[i]]) out[n++] = i;
        return Arrays.copyOf(out, n);
    }

    /**
     * Stage 1: the first pass of the tile's receivers against its scene, each height band of receivers
     * with its own far horizon ({@link Tile#band}; the tree is built once, {@link Scene#withHorizon}).
     */
    public FirstPasses firstPass(Tile t) {
        Scene scene = baseScene(t);
        ShadedIrradiation.Inputs in = inputs(t);
        if (t.horizonDeg() == null) return StagedPasses.firstPass(scene.withHorizon(horizon(t, 0)), in, t.receivers());
        Map<Integer, List<Integer>> byBand = new java.util.TreeMap<>();
        for (int r : t.receivers()) byBand.computeIfAbsent(t.band(layout.centre(r, 2)), k -> new ArrayList<>()).add(r);
        List<FirstPasses> parts = new ArrayList<>();
        for (var e : byBand.entrySet()) {
            int[] rec = e.getValue().stream().mapToInt(Integer::intValue).toArray();
            parts.add(StagedPasses.firstPass(scene.withHorizon(horizon(t, e.getKey())), in, rec));
        }
        return FirstPasses.concat(parts);
    }

    /**
     * Stage 1 with the tile's parallel loops on at most {@code threads} threads ({@link #onThreads}):
     * what a Spark task runs with its cores ({@code spark.task.cpus}). The same result as
     * {@link #firstPass(Tile)} (no result depends on the thread count).
     */
    public FirstPasses firstPass(Tile t, int threads) {
        return onThreads(threads, () -> firstPass(t));
    }

    /**
     * Runs {@code work} with its parallel loops (Java's parallel streams) in a pool of {@code threads}
     * workers of its own, the calling thread waiting; {@code threads <= 0} runs it in the caller's
     * pool (the JVM's common pool unless the caller is a pool worker). Several tiles run at once in
     * one JVM (a Spark executor's tasks) otherwise share the common pool, whose
     * {@code cores - 1} workers are then fewer than the threads that wait on them: each waiting task
     * thread scans the pool's queues for its own loop's pieces while they run elsewhere (in a JFR
     * profile of {@code local[2]}, 11 % of the first pass's and 10 % of the finish's samples), and the
     * cores are oversubscribed. With one pool per task sized to the task's cores the tasks use what
     * Spark gave them and nothing waits busily. As {@code AnalysisRun.run} runs the one-machine run
     * in its own pool.
     */
    static <T> T onThreads(int threads, java.util.function.Supplier<T> work) {
        return threads <= 0 ? work.get() : AnalysisRun.onPool(threads, work, "tile work");
    }

    private ShadedIrradiation.Inputs inputs(Tile t) {
        ShadedIrradiation.Inputs in = IrradiationSetup.inputs(layout, sceneTriangles(t), prepared.albedo(), sun, prepared.options());
        return prepared.canopy() == null ? in : in.withCanopy(prepared.canopyShading());
    }

    /** Exchange and bounces: the reflection between all receivers from every tile's first pass. */
    public StagedPasses.Reflected reflect(List<FirstPasses> everyTile) {
        IrradiationSetup.Options o = prepared.options();
        return StagedPasses.reflect(FirstPasses.concat(everyTile), layout.analysed(), sun, o.bounceTolerance(), o.maxBounces());
    }

    /**
     * The rows of one tile's analysed patches.
     *
     * @param table the columns of patches.csv for the tile's patches (re-indexed 0.. in the tile; ids global)
     * @param patchIndex the whole model's index of each row's patch
     * @param irradiation the irradiation stage's result for those rows
     */
    public record TileRows(Tile tile, ResultTable table, int[] patchIndex, IrradiationResult irradiation,
                           Metrics.Outcome metrics) {}

    /**
     * Stage 3: the tile's rows with the same columns as patches.csv (irradiation and metrics). The
     * metrics run on the tile's patches and scene; PV zones are numbered within the tile
     * ({@link LocalCityRunner#merge} numbers them as the whole model does).
     */
    public TileRows finish(Tile t, FirstPasses ofTile, StagedPasses.Reflected refl) {
        return finish(t, ofTile, StagedPasses.TileReflected.of(ofTile, refl));
    }

    /**
     * Stage 3 with the tile's parallel loops on at most {@code threads} threads ({@link #onThreads};
     * a Spark task's cores): the same rows as {@link #finish(Tile, FirstPasses, StagedPasses.TileReflected)}.
     */
    public TileRows finish(Tile t, FirstPasses ofTile, StagedPasses.TileReflected refl, int threads) {
        return onThreads(threads, () -> finish(t, ofTile, refl));
    }

    /**
     * Stage 3 with the tile's own part of the reflection (what a distributed run's finish task
     * receives; its arrays follow the tile, not the city): the same rows as {@link #finish(Tile, FirstPasses, StagedPasses.Reflected)}.
     */
    public TileRows finish(Tile t, FirstPasses ofTile, StagedPasses.TileReflected refl) {
        IrradiationResult r = StagedPasses.finish(ofTile, refl, sun, study.rays(),
                IrradiationSetup.reflectorRays(study.rays(), study.reflection().rays()));
        PatchSet all = prepared.patches();
        int n = t.analysedCount(layout.analysed());
        int[] index = new int[n];
        List<Patch> patches = new ArrayList<>(n);
        int k = 0;
        for (int id : t.receivers()) {
            if (id >= layout.analysed()) continue;
            Patch p = all.patches().get(id);
            index[k] = id;
            patches.add(new Patch(k++, p.id(), p.block(), p.blockName(), p.surface(), p.kind(), p.centroid(), p.normal(),
                    p.areaM2(), p.tiltDeg(), p.azimuthDeg(), p.outline()));
        }
        PatchSet tilePatches = new PatchSet(all.model(), all.options(), all.surfaces(), patches, all.analysedBlocks(),
                all.hasGroundFaces(), all.groundLevelZ());
        ResultTable table = new ResultTable(patches);
        IrradiationColumns.addTo(table, r, prepared.weather().timeBase() == TimeBase.HOURLY_YEAR);
        // the tile's scene numbers its triangles in its own order (sceneTriangles): the metrics get
        // the ground flags in that order, not the whole model's (TiledGroundFacesTest)
        int[] tris = sceneTriangles(t);
        boolean[] ground = new boolean[tris.length];
        for (int i = 0; i < tris.length; i++) ground[i] = groundTriangles[tris[i]];
        Metrics.Outcome metrics = Metrics.run(AnalysisRun.metricContext(study, tileScene(t), ground, tilePatches, r, prepared.weather()),
                table);
        return new TileRows(t, table, index, r, metrics);
    }

    private static double[][] blockBounds(MassingModel m) {
        int nb = m.blockNames().size();
        double[][] b = new double[nb][];
        double[] v = m.vertices();
        int[] tr = m.triangles(), tb = m.triangleBlock();
        for (int t = 0; t < m.triangleCount(); t++) {
            double[] bb = b[tb[t]];
            if (bb == null) {
                bb = new double[] {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY,
                        Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
                b[tb[t]] = bb;
            }
            for (int k = 0; k < 3; k++) {
                int o = 3 * tr[3 * t + k];
                bb[0] = Math.min(bb[0], v[o]);
                bb[1] = Math.min(bb[1], v[o + 1]);
                bb[2] = Math.max(bb[2], v[o]);
                bb[3] = Math.max(bb[3], v[o + 1]);
                bb[4] = Math.max(bb[4], v[o + 2]);
            }
        }
        return b;
    }
}
