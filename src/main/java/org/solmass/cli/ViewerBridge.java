package org.solmass.cli;

import org.solmass.Cautions;
import org.solmass.InputException;
import org.solmass.metrics.PatchComparison;
import org.solmass.table.Column;
import org.solmass.table.ResultTable;
import org.solmass.climate.MonthHour;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.model.MassingModel;
import org.solmass.output.ModulesGeoJsonReader;
import org.solmass.output.ModulesGeoJsonWriter;
import org.solmass.output.MonthHourCsvReader;
import org.solmass.output.PatchCsvReader;
import org.solmass.output.PatchCsvWriter;
import org.solmass.output.PublishedRun;
import org.solmass.output.ComparedResults;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;
import org.solmass.output.SummaryWriter;
import org.solmass.output.VariantFolders;
import org.solmass.study.Study;
import org.solmass.sun.Site;
import org.solmass.sun.SunPath;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.viewer.ClimateGlance;
import org.solmass.viewer.ProgressSink;
import org.solmass.viewer.RerunRequest;
import org.solmass.viewer.SunArc;
import org.solmass.viewer.ViewerActions;
import org.solmass.viewer.ShadowFrames;
import org.solmass.viewer.ViewerData;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;

/**
 * Fills the viewer's data from a finished analysis or from a results folder, and carries out the
 * viewer's actions (re-run, exports) with the same stages the CLI uses. The viewer itself computes
 * no physics.
 */
final class ViewerBridge implements ViewerActions {
    /** The study file written into each variant folder. */
    static final String VARIANT_STUDY = "study.json";
    private Study study;
    private AnalysisRun.Outcome last;
    private ResultTable shown;
    /** The study's first results folder; re-runs write variant folders beside it, never into it. */
    private Path firstResults;
    /** The results folder of the data on show. */
    private Path shownFolder;
    private java.time.Clock clock = java.time.Clock.systemDefaultZone();

    ViewerBridge(Study study) {
        this(study, study.outputs().folder());
    }

    private ViewerBridge(Study study, Path firstResults) {
        this.study = study;
        this.firstResults = firstResults.toAbsolutePath().normalize();
    }

    /** A bridge for a new study set up in the window: nothing to show until the first run ({@link #runStudy}). */
    static ViewerBridge forNewStudy() {
        return new ViewerBridge(null, Path.of("results"));
    }

    /** The clock that stamps default variant names (tests fix it). */
    void clock(java.time.Clock c) {
        clock = c;
    }

    /** Runs the study, writes its results folder and returns what the viewer shows. */
    ViewerData analyse(ProgressSink progress, BooleanSupplier cancelled) {
        AnalysisRun.Outcome o;
        try (org.solmass.output.FolderClaim folder = ResultFiles.claim(study, false)) {
            o = AnalysisRun.run(study, new Progress(progress, cancelled));
            ResultFiles.write(o, folder);
        }
        last = o;
        shown = o.table();
        shownFolder = o.study().outputs().folder().toAbsolutePath().normalize();
        return data(o.study(), o.model(), o.patches(), o.table(), o.result().monthHourWm2(), o.weather(), o.warnings())
                .withModuleRings(moduleRings(shownFolder)).withShadows(ShadowFrames.ofFolder(shownFolder))
                .withPeriod(org.solmass.output.RunPeriod.text(o.study(), o.weather().timeBase().label()));
    }

    /** The PV module outlines of a results folder; none when the run wrote no modules.geojson (older results, no PV). */
    static List<double[]> moduleRings(PublishedRun published) {
        if (!published.has(ModulesGeoJsonWriter.FILE_NAME)) return List.of();
        return published.read(ModulesGeoJsonWriter.FILE_NAME, ModulesGeoJsonReader::rings);
    }

    /** The PV module outlines of a folder this bridge has just written; none without modules.geojson. */
    static List<double[]> moduleRings(Path folder) {
        Path f = folder.resolve(ModulesGeoJsonWriter.FILE_NAME);
        return Files.isRegularFile(f) ? ModulesGeoJsonReader.rings(f) : List.of();
    }

    /**
     * Reads a finished results folder (run.json, patches.csv, month-hour.csv when the run wrote it),
     * each file checked against run.json's manifest ({@link PublishedRun}).
     */
    static ViewerData fromFolder(Path folder, ViewerBridge[] bridgeOut) {
        PublishedRun published = PublishedRun.open(folder);
        RunRecord run = published.record();
        Study study = run.study();
        if (!Files.exists(study.model().file())) {
            throw new InputException(folder.resolve(RunRecord.FILE_NAME).toString(),
                    "the model " + study.model().file() + " these results were made from is missing");
        }
        List<String> warnings = new ArrayList<>(published.warnings());
        if (!run.modelUnchanged()) {
            warnings.add("the model " + study.model().file() + " changed since these results were made; geometry may not match");
        }
        MassingModel model = AnalysisRun.loadModel(study).model();
        PatchSet ps = Patcher.build(model, new PatchOptions(study.patchM(), AnalysisRun.analysedBlocks(study, model), false));
        PatchCsvReader.Table csv = published.read(ResultsFolder.PATCHES, PatchCsvReader::read);
        ResultTable table = new ResultTable(ps.patches());
        int n = ps.patchCount(), missing = 0;
        int[] row = new int[n];
        for (Patch p : ps.patches()) {
            row[p.index()] = csv.row(p.id());
            if (row[p.index()] < 0) missing++;
        }
        if (missing > 0) warnings.add(missing + " patches of the model have no row in patches.csv");
        for (String col : csv.resultColumns()) {
            double[] src = csv.column(col), v = new double[n];
            for (int i = 0; i < n; i++) v[i] = row[i] >= 0 ? src[row[i]] : Double.NaN;
            table.put(csv.def(col), v);
        }
        float[] monthHour = null;
        if (published.has(ResultsFolder.MONTH_HOUR)) {
            Map<String, float[]> byId = published.read(ResultsFolder.MONTH_HOUR, MonthHourCsvReader::read);
            monthHour = new float[n * MonthHour.SLOTS];
            java.util.Arrays.fill(monthHour, Float.NaN);
            for (Patch p : ps.patches()) {
                float[] v = byId.get(p.id());
                if (v != null) System.arraycopy(v, 0, monthHour, p.index() * MonthHour.SLOTS, MonthHour.SLOTS);
            }
        }
        WeatherSeries weather = AnalysisRun.loadWeather(study);
        ViewerBridge b = new ViewerBridge(study, folder);
        b.shown = table;
        b.shownFolder = folder.toAbsolutePath().normalize();
        bridgeOut[0] = b;
        return data(study, model, ps, table, monthHour, weather, warnings).withModuleRings(moduleRings(published))
                .withShadows(ShadowFrames.ofFolder(folder)).withPeriod(org.solmass.output.RunPeriod.of(run));
    }

    /**
     * The data of results folder B with, for every quantity both folders have, a difference column
     * ({@link PatchComparison#delta(Column)}, B - A) on B's matched patches (NaN where unmatched); the
     * matching is {@code compare}'s.
     */
    static ViewerData withDifferences(ViewerData b, Path folderA, Path folderB) {
        PublishedRun runA = PublishedRun.open(folderA), runB = PublishedRun.open(folderB);
        ComparedResults c = CompareCommand.read(runA, runB, org.solmass.metrics.PatchMatcher.DEFAULT_MAX_ANGLE_DEG);
        ResultTable t = b.table().copy();
        int n = b.patches().size();
        for (Column q : c.comparison().quantities()) {
            double[] byRow = c.delta(q), v = new double[n];
            for (Patch p : b.patches()) {
                int r = c.b().row(p.id());
                v[p.index()] = r >= 0 ? byRow[r] : Double.NaN;
            }
            t.put(PatchComparison.delta(q), v);
        }
        List<String> warnings = new ArrayList<>(b.warnings());
        warnings.addAll(runA.warnings());
        for (org.solmass.output.ComparisonNote.Difference d : org.solmass.output.ComparisonNote.of(runA, runB).differences()) {
            warnings.add(d.message());
        }
        warnings.add(c.matched() + " of " + n + " patches matched with " + folderA);
        return new ViewerData(b.title() + " vs " + runA.record().study().name(), b.model(), b.blockAnalysed(), b.patches(), t,
                b.monthHourWm2(), b.climate(), b.sunPath(), b.latitudeDeg(), b.longitudeDeg(), b.zone(), warnings, b.moduleRings(), b.shadows(), b.period());
    }

    static ViewerData data(Study study, MassingModel model, PatchSet ps, ResultTable table, float[] monthHour,
                           WeatherSeries weather, List<String> warnings) {
        Site site = study.site();
        ClimateGlance glance = glance(weather);
        Path climateFile = study.climate().file();
        if (climateFile != null && climateFile.getFileName() != null) {   // the file name reads better than its full path
            glance = new ClimateGlance(glance.source().replace(climateFile.toString(), climateFile.getFileName().toString()),
                    glance.ghiWm2(), glance.dhiWm2(), glance.ghiMonthKwhM2(), glance.dhiMonthKwhM2());
        }
        if (study.climate().isClearSky() && !warnings.contains(Cautions.CLEAR_SKY)) {
            warnings = new ArrayList<>(warnings);
            warnings.add(Cautions.CLEAR_SKY);
        }
        return new ViewerData(study.name(), model, ps.analysedBlocks(), ps.patches(), table, monthHour,
                glance, sunPath(site), site.latitudeDeg(), site.longitudeDeg(), zoneLabel(site), warnings);
    }

    static String zoneLabel(Site site) {
        ZoneOffset off = site.standardOffset(SunPath.AVERAGE_DAY_YEAR);
        return "UTC" + (off.getTotalSeconds() == 0 ? "" : off.getId());
    }

    /** Mean GHI and DHI per month and hour of the input, and monthly totals. */
    static ClimateGlance glance(WeatherSeries w) {
        org.solmass.climate.MonthHourMeans m = org.solmass.climate.MonthHourMeans.of(w);
        return new ClimateGlance(w.source(), m.ghiWm2(), m.dhiWm2(), m.ghiMonthKwhM2(), m.dhiMonthKwhM2());
    }

    /** The sun over each monthly-average day (Klein's days), every 20 minutes while it is up. */
    static List<SunArc> sunPath(Site site) {
        return SunArc.of(site);
    }

    @Override
    public RerunRequest currentOptions() {
        if (study == null) return new RerunRequest(Study.DEFAULT_PATCH_M, org.solmass.study.StudyReader.CLEAR_SKY, org.solmass.sky.SkyModels.standard().name());
        String climate = study.climate().isClearSky() ? "clear-sky" : study.climate().file().toString();
        return new RerunRequest(study.patchM(), climate, study.sky().name());
    }

    @Override
    public List<String> climateChoices() {
        List<String> c = new ArrayList<>();
        c.add(currentOptions().climateSource());
        if (!c.contains("clear-sky")) c.add("clear-sky");
        return c;
    }

    @Override
    public List<String> skyModels() {
        return org.solmass.sky.SkyModels.names();
    }

    /**
     * Re-runs the study with the request's options into a new variant folder beside the first results
     * folder ({@link VariantFolders}); writes the variant's resolved study as study.json there first
     * (so it can be run again from the command line), then the results. The first results and earlier
     * variants are not touched.
     */
    @Override
    public ViewerData rerun(RerunRequest r, ProgressSink progress, BooleanSupplier cancelled) {
        com.fasterxml.jackson.databind.node.ObjectNode t = org.solmass.study.StudyWriter.toTree(study);
        t.put("patch_m", r.patchSizeM());
        t.put("sky", r.skyModel());
        com.fasterxml.jackson.databind.node.ObjectNode climate = t.putObject("climate");
        climate.put("source", r.climateSource());
        Path base = study.source() != null ? study.source().toAbsolutePath().getParent() : Path.of("").toAbsolutePath();
        // resolve before creating the folder: a bad option makes no empty variant folder
        org.solmass.study.StudyReader.fromTree(t.deepCopy(), study.source(), base, "re-run");
        Path dir = VariantFolders.create(firstResults, r.variantName(), java.time.LocalDateTime.now(clock));
        ((com.fasterxml.jackson.databind.node.ObjectNode) t.get("outputs")).put("folder", dir.toString());
        Path studyFile = dir.resolve(VARIANT_STUDY);
        Study variant = org.solmass.study.StudyReader.fromTree(t, studyFile, base, "re-run");
        org.solmass.output.AtomicFiles.writeString(studyFile, org.solmass.study.StudyWriter.toJson(variant));
        Study before = study;
        study = variant;
        try {
            return analyse(progress, cancelled);
        } catch (RuntimeException e) {   // cancelled or failed: the data on show, and its study, stay
            study = before;
            throw e;
        }
    }

    /**
     * Runs a study set up in the window. The first run goes into the study's results folder when that
     * does not exist or is empty (and no name is given); any other run into a new variant folder beside
     * it ({@link VariantFolders}). The folder gets the study that ran as study.json first, as a
     * re-run's does. Earlier results are never written into.
     */
    @Override
    public ViewerData runStudy(Study s, String variantName, ProgressSink progress, BooleanSupplier cancelled) throws java.io.IOException {
        Path results = s.outputs().folder().toAbsolutePath().normalize();
        boolean fresh = !Files.exists(results) || (Files.isDirectory(results) && isEmpty(results));
        Path dir;
        if (fresh && (variantName == null || variantName.isBlank())) {
            Files.createDirectories(results);
            dir = results;
        } else {
            dir = VariantFolders.create(results, variantName, java.time.LocalDateTime.now(clock));
        }
        com.fasterxml.jackson.databind.node.ObjectNode t = org.solmass.study.StudyWriter.toTree(s);
        ((com.fasterxml.jackson.databind.node.ObjectNode) t.get("outputs")).put("folder", dir.toString());
        Path studyFile = dir.resolve(VARIANT_STUDY);
        Study run = org.solmass.study.StudyReader.fromTree(t, studyFile, dir, "set-up");
        org.solmass.output.AtomicFiles.writeString(studyFile, org.solmass.study.StudyWriter.toJson(run));
        Study before = study;
        Path firstBefore = firstResults;
        study = run;
        firstResults = results;
        try {
            return analyse(progress, cancelled);
        } catch (RuntimeException e) {   // cancelled or failed: what was on show stays
            study = before;
            firstResults = firstBefore;
            throw e;
        }
    }

    private static boolean isEmpty(Path dir) throws java.io.IOException {
        try (java.util.stream.Stream<Path> s = Files.list(dir)) {
            return s.findAny().isEmpty();
        }
    }

    /** The data on show (read back from its folder) with its differences from {@code against}. */
    @Override
    public ViewerData compare(Path against) {
        if (shownFolder == null) throw new IllegalStateException("no results on show to compare");
        ViewerBridge[] b = new ViewerBridge[1];
        ViewerData d = fromFolder(shownFolder, b);
        return withDifferences(d, against, shownFolder);
    }

    @Override
    public Path shownFolder() {
        return shownFolder;
    }

    @Override
    public List<Path> variants() {
        return VariantFolders.list(firstResults, VARIANT_STUDY);
    }

    /** Reads a variant folder ({@link #fromFolder}); its study becomes the one later re-runs start from. */
    @Override
    public ViewerData openVariant(Path folder) {
        ViewerBridge[] read = new ViewerBridge[1];
        ViewerData d = fromFolder(folder, read);
        study = read[0].study;
        shown = read[0].shown;
        shownFolder = folder.toAbsolutePath().normalize();
        last = null;
        return d;
    }

    @Override
    public String defaultVariantName() {
        if (study == null) return null;
        return firstResults.getFileName() + VariantFolders.INFIX + "yyyyMMdd-HHmmss";
    }

    @Override
    public void exportCsv(Path file) {
        PatchCsvWriter.write(file, shown);
    }

    @Override
    public void exportSummary(Path file) {
        if (last != null) {
            RunRecord run = RunRecord.of(Main.version(), last.study(), last.weather().timeBase().label(), last.counts(),
                    last.timingsS(), java.time.Instant.now());
            SummaryWriter.write(file, shown, SummaryWriter.Spec.standard(study.outputs().thresholdsKwhM2()).withStoreyHeight(study.outputs().storeyHeightM()), run,
                    List.of(Cautions.RESULTS));
        } else {
            SummaryWriter.write(file, shown, SummaryWriter.Spec.standard(study.outputs().thresholdsKwhM2()).withStoreyHeight(study.outputs().storeyHeightM()), null,
                    List.of(Cautions.RESULTS));
        }
    }

    /** Pipeline progress to the viewer's bar, with cancellation between work units. */
    private static final class Progress implements PhaseProgress {
        private final ProgressSink sink;
        private final BooleanSupplier cancelled;
        private String phase = "";
        private long total;

        Progress(ProgressSink sink, BooleanSupplier cancelled) {
            this.sink = sink;
            this.cancelled = cancelled;
        }

        @Override
        public void begin(String name, long work) {
            if (cancelled.getAsBoolean()) throw new CancellationException("analysis cancelled");
            phase = name;
            total = work;
            sink.progress(work == 0 ? -1 : 0, name);
        }

        @Override
        public void advance(long done) {
            if (cancelled.getAsBoolean()) throw new CancellationException("analysis cancelled");
            if (total > 0) sink.progress((double) done / total, phase);
        }
    }
}
