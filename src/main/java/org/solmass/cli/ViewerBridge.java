package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.model.MassingModel;
import org.solmass.output.MonthHourCsvReader;
import org.solmass.output.PatchCsvReader;
import org.solmass.output.PatchCsvWriter;
import org.solmass.output.ResultTable;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;
import org.solmass.output.SummaryWriter;
import org.solmass.study.Study;
import org.solmass.sun.Site;
import org.solmass.sun.SolarCalculator;
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
import org.solmass.viewer.ViewerData;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
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
    private Study study;
    private AnalysisRun.Outcome last;
    private ResultTable shown;

    ViewerBridge(Study study) {
        this.study = study;
    }

    /** Runs the study, writes its results folder and returns what the viewer shows. */
    ViewerData analyse(ProgressSink progress, BooleanSupplier cancelled) {
        AnalysisRun.Outcome o = AnalysisRun.run(study, new Progress(progress, cancelled));
        ResultFiles.write(o);
        last = o;
        shown = o.table();
        return data(o.study(), o.model(), o.patches(), o.table(), o.result().monthHourWm2(), o.weather(), o.warnings());
    }

    /** Reads a finished results folder (run.json, patches.csv, month-hour.csv if present). */
    static ViewerData fromFolder(Path folder, ViewerBridge[] bridgeOut) {
        RunRecord run = RunRecord.read(folder);
        Study study = run.study();
        if (!Files.exists(study.model().file())) {
            throw new InputException(folder.resolve(RunRecord.FILE_NAME).toString(),
                    "the model " + study.model().file() + " these results were made from is missing");
        }
        List<String> warnings = new ArrayList<>();
        if (!run.modelUnchanged()) {
            warnings.add("the model " + study.model().file() + " changed since these results were made; geometry may not match");
        }
        MassingModel model = AnalysisRun.loadModel(study).model();
        PatchSet ps = Patcher.build(model, new PatchOptions(study.patchM(), AnalysisRun.analysedBlocks(study, model), false));
        PatchCsvReader.Table csv = PatchCsvReader.read(folder.resolve(ResultsFolder.PATCHES));
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
            table.put(col, unitOf(col), v);
        }
        float[] monthHour = null;
        Path mh = folder.resolve(ResultsFolder.MONTH_HOUR);
        if (Files.exists(mh)) {
            Map<String, float[]> byId = MonthHourCsvReader.read(mh);
            monthHour = new float[n * 288];
            java.util.Arrays.fill(monthHour, Float.NaN);
            for (Patch p : ps.patches()) {
                float[] v = byId.get(p.id());
                if (v != null) System.arraycopy(v, 0, monthHour, p.index() * 288, 288);
            }
        }
        WeatherSeries weather = AnalysisRun.loadWeather(study);
        ViewerBridge b = new ViewerBridge(study);
        b.shown = table;
        bridgeOut[0] = b;
        return data(study, model, ps, table, monthHour, weather, warnings);
    }

    /**
     * The data of results folder B with, for every quantity both folders have, a column
     * {@code delta_<quantity>} = B - A on B's matched patches (NaN where unmatched); see
     * {@link CompareCommand} for the matching.
     */
    static ViewerData withDifferences(ViewerData b, Path folderA, Path folderB) {
        RunRecord runA = RunRecord.read(folderA), runB = RunRecord.read(folderB);
        CompareCommand.Comparison c = CompareCommand.compare(folderA.resolve(ResultsFolder.PATCHES),
                folderB.resolve(ResultsFolder.PATCHES), 0.5 * Math.min(runA.study().patchM(), runB.study().patchM()),
                org.solmass.metrics.PatchMatcher.DEFAULT_MAX_ANGLE_DEG);
        ResultTable t = new ResultTable(b.patches());
        for (String col : b.table().names()) t.put(col, b.table().unit(col), b.table().column(col));
        int n = b.patches().size();
        for (String q : c.quantities()) {
            double[] byRow = c.delta(q), v = new double[n];
            for (Patch p : b.patches()) {
                int r = c.b().row(p.id());
                v[p.index()] = r >= 0 ? byRow[r] : Double.NaN;
            }
            t.put("delta_" + q, unitOf(q), v);
        }
        List<String> warnings = new ArrayList<>(b.warnings());
        warnings.add(c.matched() + " of " + n + " patches matched with " + folderA);
        return new ViewerData(b.title() + " vs " + runA.study().name(), b.model(), b.blockAnalysed(), b.patches(), t,
                b.monthHourWm2(), b.climate(), b.sunPath(), b.latitudeDeg(), b.longitudeDeg(), b.zone(), warnings);
    }

    static String unitOf(String column) {
        if (column.endsWith("_kwh_m2")) return "kWh/m2";
        if (column.endsWith("_kwh")) return "kWh";
        if (column.endsWith("_pct")) return "%";
        if (column.endsWith("_h") || column.startsWith("sun_hours")) return "h";
        return "";
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
        return new ViewerData(study.name(), model, ps.analysedBlocks(), ps.patches(), table, monthHour,
                glance, sunPath(site), site.latitudeDeg(), site.longitudeDeg(), zoneLabel(site), warnings);
    }

    static String zoneLabel(Site site) {
        ZoneOffset off = site.standardOffset(SunPath.AVERAGE_DAY_YEAR);
        return "UTC" + (off.getTotalSeconds() == 0 ? "" : off.getId());
    }

    /** Mean GHI and DHI per month and hour of the input, and monthly totals. */
    static ClimateGlance glance(WeatherSeries w) {
        double[] g = new double[288], d = new double[288], h = new double[288], gm = new double[12], dm = new double[12];
        for (Step st : w.steps()) {
            int slot = (st.month() - 1) * 24 + Math.min(23, (int) Math.floor(st.localStandardHour()));
            double wh = st.weightedHours();
            g[slot] += st.ghiWm2() * wh;
            d[slot] += st.dhiWm2() * wh;
            h[slot] += wh;
            gm[st.month() - 1] += st.ghiWm2() * wh / 1000;
            dm[st.month() - 1] += st.dhiWm2() * wh / 1000;
        }
        for (int k = 0; k < 288; k++) {
            g[k] = h[k] > 0 ? g[k] / h[k] : 0;
            d[k] = h[k] > 0 ? d[k] / h[k] : 0;
        }
        return new ClimateGlance(w.source(), g, d, gm, dm);
    }

    /** The sun over each monthly-average day (Klein's days), every 20 minutes while it is up. */
    static List<SunArc> sunPath(Site site) {
        SolarCalculator calc = new SolarCalculator(site);
        ZoneOffset off = site.standardOffset(SunPath.AVERAGE_DAY_YEAR);
        List<SunArc> arcs = new ArrayList<>();
        for (int m = 1; m <= 12; m++) {
            List<SunArc.Point> pts = new ArrayList<>();
            for (SunPath.Sample s : SunPath.averageDay(calc, m, 20)) {
                if (s.sunUpFraction() <= 0 || s.sun().elevationDeg() <= 0) continue;
                LocalDateTime t = LocalDateTime.ofInstant(s.start(), off);
                double hour = t.getHour() + t.getMinute() / 60.0 + s.durationH() / 2;
                pts.add(new SunArc.Point(hour, s.sun().azimuthDeg(), s.sun().elevationDeg()));
            }
            arcs.add(new SunArc(m, pts));
        }
        return arcs;
    }

    @Override
    public RerunRequest currentOptions() {
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

    @Override
    public ViewerData rerun(RerunRequest r, ProgressSink progress, BooleanSupplier cancelled) {
        com.fasterxml.jackson.databind.node.ObjectNode t = org.solmass.study.StudyWriter.toTree(study);
        t.put("patch_m", r.patchSizeM());
        t.put("sky", r.skyModel());
        com.fasterxml.jackson.databind.node.ObjectNode climate = t.putObject("climate");
        climate.put("source", r.climateSource());
        Path base = study.source() != null ? study.source().getParent() : Path.of("").toAbsolutePath();
        study = org.solmass.study.StudyReader.fromTree(t, study.source(), base, "re-run");
        return analyse(progress, cancelled);
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
            SummaryWriter.write(file, shown, SummaryWriter.Spec.standard(study.outputs().thresholdsKwhM2()), run,
                    List.of(ResultFiles.CAUTION));
        } else {
            SummaryWriter.write(file, shown, SummaryWriter.Spec.standard(study.outputs().thresholdsKwhM2()), null,
                    List.of(ResultFiles.CAUTION));
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
