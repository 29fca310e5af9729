package org.solmass.output;

import org.solmass.irradiation.IrradiationColumns;
import org.solmass.metrics.Metric;
import org.solmass.metrics.Metrics;
import org.solmass.metrics.PvZones;
import org.solmass.metrics.PvZonesMetric;
import org.solmass.model.MassingModel;
import org.solmass.study.Study;
import org.solmass.table.Column;
import org.solmass.table.ResultTable;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes a whole results folder in one call: patches.csv, month-hour.csv (when the study asks and the
 * table is given), zones.csv (when the PV metric ran), summary.json, map.png (when the study asks),
 * patches.gltf (when the study asks) and, last, run.json, so a folder with a run.json is complete.
 * Every file is written atomically ({@link AtomicFiles}).
 */
public final class ResultsFolder {
    public static final String PATCHES = "patches.csv", SUMMARY = "summary.json", MAP = "map.png",
            MONTH_HOUR = "month-hour.csv";
    /** The column the map, glTF colours and the thresholds use. */
    public static final Column MAIN_COLUMN = IrradiationColumns.ANNUAL;

    private ResultsFolder() {}

    /**
     * What a run produced.
     *
     * @param study the resolved study (its outputs section says where and what)
     * @param model the massing model as imported
     * @param table per-patch results, patches in index order
     * @param monthHourWm2 mean irradiance per patch, month and hour ({@link MonthHourCsvWriter}), or null
     * @param run the run record
     * @param cautions texts for summary.json (the caution first)
     * @param metrics what the metrics found (PV zones for zones.csv and the map, notes, summary sections)
     * @param notes further notes for summary.json (e.g. the warnings of the run)
     */
    public record Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                          RunRecord run, List<String> cautions, Metrics.Outcome metrics, List<String> notes) {
        public Results {
            cautions = List.copyOf(cautions);
            notes = List.copyOf(notes);
            if (metrics == null) metrics = new Metrics.Outcome(List.of());
        }

        /** Results without metrics or notes. */
        public Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                       RunRecord run, List<String> cautions) {
            this(study, model, table, monthHourWm2, run, cautions, null, List.of());
        }
    }

    /** Writes the files and returns their paths in the order written. */
    public static List<Path> write(Results r) {
        Study.Outputs o = r.study().outputs();
        Path dir = o.folder();
        List<Path> written = new ArrayList<>();
        Path patches = dir.resolve(PATCHES);
        PatchCsvWriter.write(patches, r.table());
        written.add(patches);
        if (o.monthHourCsv() && r.monthHourWm2() != null) {
            Path mh = dir.resolve(MONTH_HOUR);
            MonthHourCsvWriter.write(mh, r.table().patches(), r.monthHourWm2());
            written.add(mh);
        }
        PvZones.Result pv = r.metrics().find(PvZonesMetric.Found.class).map(PvZonesMetric.Found::zones).orElse(null);
        if (pv != null) {
            Path zones = dir.resolve(ZoneCsvWriter.FILE_NAME);
            ZoneCsvWriter.write(zones, pv.zones());
            written.add(zones);
        }
        Path summary = dir.resolve(SUMMARY);
        SummaryWriter.Spec spec = SummaryWriter.Spec.standard(o.thresholdsKwhM2()).with(r.metrics().summaryColumns());
        List<String> texts = new ArrayList<>(r.cautions());
        texts.addAll(r.metrics().notes());
        texts.addAll(r.notes());
        com.fasterxml.jackson.databind.node.ObjectNode tree = SummaryWriter.toTree(r.table(), spec, r.run(), texts);
        for (Metric.Findings f : r.metrics().findings()) if (f.summarySection() != null) tree.set(f.summaryKey(), f.summarySection());
        AtomicFiles.writeString(summary, org.solmass.study.StudyWriter.pretty(tree));
        written.add(summary);
        if (o.map() && !r.table().names().isEmpty()) {
            Column col = r.table().has(MAIN_COLUMN.name()) ? MAIN_COLUMN : r.table().columns().get(0);
            Path map = dir.resolve(MAP);
            List<double[]> outlines = new ArrayList<>();
            if (pv != null) for (PvZones.Zone z : pv.zones()) outlines.addAll(z.outlines());
            MapRenderer.write(map, r.model(), r.study().model().analysedMask(r.model().blockNames()), r.table().patches(),
                    r.table().column(col.name()), col.label(), col.unit().symbol(),
                    MapRenderer.Options.of(o.mapWidthPx(), o.mapHeightPx(), r.study().name()),
                    new MapRenderer.Extras(false, outlines, "PV roof zone (zones.csv)"));
            written.add(map);
        }
        if (o.gltf() && r.table().has(MAIN_COLUMN.name()) && r.table().size() > 0) {
            Path gltf = dir.resolve(GltfWriter.FILE_NAME);
            GltfWriter.write(gltf, r.table(), MAIN_COLUMN.name(), "Solmass " + r.run().solmassVersion(), r.cautions());
            written.add(gltf);
        }
        Path run = dir.resolve(RunRecord.FILE_NAME);
        r.run().write(run);
        written.add(run);
        return written;
    }
}
