package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.metrics.ShadowStudy;
import org.solmass.model.MassingModel;
import org.solmass.output.FolderClaim;
import org.solmass.output.Publication;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;
import org.solmass.output.ShadowPatchTable;
import org.solmass.output.ShadowSheet;
import org.solmass.output.ShadowTable;
import org.solmass.scene.Scene;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;
import org.solmass.sun.SolarCalculator;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.Surface;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalTime;
import java.time.MonthDay;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ForkJoinPool;

/** {@code solmass shadows}: plan-view shadow diagrams of a study at chosen dates and times. */
@Command(name = "shadows", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Shadow diagrams: which patches of the blocks and of the ground are in sun at chosen",
                "dates and times (local standard time), one ray per patch to the sun.",
                "Writes shadows.png (dates as rows, times as columns), shadows.csv (sunlit area",
                "per block and of the ground), shadow-patches.csv (sun or shade per patch and moment)",
                "and run.json (the manifest) to the folder shadows of the study's results or --out."})
public final class ShadowsCommand implements Callable<Integer> {
    /** File names this command writes (and {@link ShadowPatchTable#FILE_NAME}, and run.json). */
    public static final String SHEET = "shadows.png", TABLE = "shadows.csv";
    /** The time base run.json records for a shadow study: chosen moments, no weather. */
    public static final String TIME_BASE = "shadow-moments";

    @Parameters(paramLabel = "STUDY.json", description = "study file (docs/study-file.md)") Path studyFile;
    @Option(names = "--dates", paramLabel = "MM-DD", split = ",", description = "dates (default 03-21,06-21,12-21)") List<String> dates;
    @Option(names = "--times", paramLabel = "HH:MM", split = ",", description = "local standard times (default 09:00,12:00,15:00)") List<String> times;
    @Option(names = "--patch", paramLabel = "METRES", description = "patch size of the blocks (default: the study's patch_m)") Double patch;
    @Option(names = "--ground-cell", paramLabel = "METRES", defaultValue = "2", description = "ground grid cell around the model's own ground faces (default ${DEFAULT-VALUE} m)") double groundCell;
    @Option(names = "--ground-margin", paramLabel = "METRES", description = "ground grid beyond the model on each side (default 40 %% of the model's larger horizontal size, at least 10 m)") Double groundMargin;
    @Option(names = "--threads", paramLabel = "N", defaultValue = "0", description = "worker threads (default: all cores)") int threads;
    @Option(names = "--out", paramLabel = "DIR", description = "output folder (default: the folder shadows inside the study's outputs.folder)") Path out;
    /** The default folder of the sheet and table, inside the study's results folder. */
    static final String FOLDER = "shadows";
    @Option(names = {"-q", "--quiet"}, description = "no progress on stderr") boolean quiet;

    @Override
    public Integer call() {
        List<MonthDay> ds = parseDates();
        List<LocalTime> ts = parseTimes();
        if (!(groundCell > 0) || !Double.isFinite(groundCell)) throw new InputException("--ground-cell", "expected a positive size in metres, got " + groundCell);
        if (groundMargin != null && !(groundMargin >= 0)) throw new InputException("--ground-margin", "expected 0 or more metres, got " + groundMargin);
        if (threads < 0) throw new InputException("--threads", "expected 0 (all cores) or a positive count, got " + threads);
        Study study = StudyReader.read(studyFile, new StudyOverrides().out(out).patchM(patch));
        // a folder of their own: the results folder holds one analyse run, published and verified as a whole
        Path folder = out != null ? study.outputs().folder() : study.outputs().folder().resolve(FOLDER);
        String where = out != null ? "--out" : (study.source() == null ? "outputs.folder" : study.source() + ": outputs.folder");
        refuseAnalyseFolder(folder, where);
        try (FolderClaim claim = FolderClaim.claim(folder, where, studyFile, studyFile.toString())) {   // before the work
            if (claim.note() != null && !quiet) System.err.println("solmass: note: " + claim.note());
            return run(study, claim, ds, ts);
        }
    }

    /**
     * The shadow study is published as a run of its own (run.json with its manifest): a folder that
     * holds an {@code analyse} run is refused, since publishing there would replace that run.
     */
    static void refuseAnalyseFolder(Path folder, String where) {
        Path runJson = folder.resolve(RunRecord.FILE_NAME);
        if (java.nio.file.Files.isRegularFile(runJson) && java.nio.file.Files.exists(folder.resolve(ResultsFolder.PATCHES))) {
            throw new InputException(where, folder.toAbsolutePath().normalize() + " holds the results of an analyse run; "
                    + "give the shadow study a folder of its own, e.g. " + folder.toAbsolutePath().normalize().resolve(FOLDER));
        }
    }

    private int run(Study study, FolderClaim claim, List<MonthDay> ds, List<LocalTime> ts) {
        long t0 = System.nanoTime();
        org.solmass.geo.GeoModel read = AnalysisRun.loadModel(study);
        for (String w : read.warnings()) System.err.println("solmass: warning: " + w);
        MassingModel m = read.model();
        boolean[] analysed = study.model().analysedMask(m.blockNames());
        PatchSet ps = Patcher.build(m, new PatchOptions(study.patchM(), new LinkedHashSet<>(m.blockNames()), false));
        Scene scene = Scene.build(m, !ps.hasGroundFaces(), ps.groundLevelZ());
        List<Patch> patches = new ArrayList<>(ps.patches());
        double[] b = m.bounds();
        double margin = groundMargin != null ? groundMargin : Math.max(10, 0.4 * Math.max(b[3] - b[0], b[4] - b[1]));
        boolean[] groundTri = ps.hasGroundFaces() ? Surface.groundTriangles(ps.surfaces(), m.triangleCount()) : null;
        patches.addAll(ShadowStudy.groundGrid(scene, m, groundTri, b[0] - margin, b[1] - margin, b[3] + margin, b[4] + margin,
                ps.groundLevelZ(), groundCell, patches.size()));
        List<ShadowStudy.Moment> moments = ShadowStudy.moments(ds, ts);
        SolarCalculator calc = new SolarCalculator(study.site());
        int year = study.climate().year();
        ForkJoinPool pool = new ForkJoinPool(threads > 0 ? threads : Runtime.getRuntime().availableProcessors());
        List<ShadowStudy.Frame> frames;
        try {
            if (!quiet) System.err.printf("solmass: shadows: %d patches x %d moments%n", patches.size(), moments.size());
            frames = pool.submit(() -> ShadowStudy.compute(scene, patches, calc, year, moments)).get();
        } catch (Exception e) {
            if (e.getCause() instanceof RuntimeException re) throw re;
            throw new IllegalStateException(e);
        } finally {
            pool.shutdownNow();
        }
        Path folder = claim.folder();
        Path png = folder.resolve(SHEET), csv = folder.resolve(TABLE), perPatch = folder.resolve(ShadowPatchTable.FILE_NAME);
        try (Publication pub = new Publication(claim)) {
            pub.write(TABLE, f -> ShadowTable.write(f, ShadowStudy.areas(patches, frames, analysed)));
            pub.write(ShadowPatchTable.FILE_NAME, f -> ShadowPatchTable.write(f, patches, analysed, frames));
            pub.write(SHEET, f -> ShadowSheet.write(f, m, analysed, patches, frames, ts.size(), study.name()));
            Map<String, Long> counts = new LinkedHashMap<>();
            counts.put("patches", (long) patches.size());
            counts.put("ground_grid_patches", (long) (patches.size() - ps.patchCount()));
            counts.put("dates", (long) ds.size());
            counts.put("times", (long) ts.size());
            Map<String, Double> timings = new LinkedHashMap<>();
            timings.put("total", AnalysisRun.seconds(t0));
            pub.publish(RunRecord.of(Main.version(), study, TIME_BASE, counts, timings, Instant.now()));
        }
        System.out.printf("solmass shadows: %s%n", study.name());
        System.out.printf("  %d patches (blocks and ground), %d dates x %d times, year %d, local standard time (UTC%s)%n",
                patches.size(), ds.size(), ts.size(), year, study.site().standardOffset(year));
        System.out.printf("  time %.2f s%n", AnalysisRun.seconds(t0));
        System.out.println("  wrote " + png);
        System.out.println("  wrote " + csv);
        System.out.println("  wrote " + perPatch);
        return Main.EXIT_OK;
    }

    private List<MonthDay> parseDates() {
        if (dates == null || dates.isEmpty()) return ShadowStudy.DEFAULT_DATES;
        List<MonthDay> out = new ArrayList<>();
        for (String d : dates) {
            try {
                out.add(MonthDay.parse("--" + d.trim()));
            } catch (DateTimeParseException e) {
                throw new InputException("--dates", "expected MM-DD, got \"" + d + "\"");
            }
        }
        return List.copyOf(new LinkedHashSet<>(out));
    }

    private List<LocalTime> parseTimes() {
        if (times == null || times.isEmpty()) return ShadowStudy.DEFAULT_TIMES;
        List<LocalTime> out = new ArrayList<>();
        for (String t : times) {
            try {
                out.add(LocalTime.parse(t.trim().length() == 4 ? "0" + t.trim() : t.trim()));
            } catch (DateTimeParseException e) {
                throw new InputException("--times", "expected HH:MM, got \"" + t + "\"");
            }
        }
        return List.copyOf(new LinkedHashSet<>(out));
    }
}
