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
 * patches.gltf (when the study asks) and, last, run.json with the manifest. The outputs are staged
 * complete and published together ({@link Publication}); readers check them ({@link PublishedRun}).
 */
public final class ResultsFolder {
    public static final String PATCHES = "patches.csv", SUMMARY = "summary.json", MAP = "map.png",
            MONTH_HOUR = "month-hour.csv";
    /** Every output a run may write (run.json apart): what a results folder holds. */
    public static final List<String> OUTPUT_NAMES = List.of(PATCHES, MONTH_HOUR, ZoneCsvWriter.FILE_NAME,
            PvSeriesCsvWriter.FILE_NAME, ModulesGeoJsonWriter.FILE_NAME, SUMMARY, MAP, GltfWriter.FILE_NAME,
            GeoJsonWriter.PATCHES, GeoJsonWriter.ZONES);
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
     * @param geo where a geo-referenced model stands (patches.geojson, zones.geojson and summary.json's
     *            "geo_reference" are written), or null for a model in local coordinates
     */
    public record Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                          RunRecord run, List<String> cautions, Metrics.Outcome metrics, List<String> notes,
                          org.solmass.geo.GeoReference geo) {
        public Results {
            cautions = List.copyOf(cautions);
            notes = List.copyOf(notes);
            if (metrics == null) metrics = new Metrics.Outcome(List.of());
        }

        /** Results of a model in local coordinates. */
        public Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                       RunRecord run, List<String> cautions, Metrics.Outcome metrics, List<String> notes) {
            this(study, model, table, monthHourWm2, run, cautions, metrics, notes, null);
        }

        /** Results without metrics or notes. */
        public Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                       RunRecord run, List<String> cautions) {
            this(study, model, table, monthHourWm2, run, cautions, null, List.of());
        }
    }

    /** Claims the study's output folder, writes the files and returns their paths in the order written. */
    public static List<Path> write(Results r) {
        Study s = r.study();
        try (FolderClaim claim = FolderClaim.claim(s.outputs().folder(), "outputs.folder", s.source(), s.name())) {
            return write(r, claim);
        }
    }

    /** Writes the files into a folder already claimed (the study's output folder) and returns their paths in the order written. */
    public static List<Path> write(Results r, FolderClaim claim) {
        Study.Outputs o = r.study().outputs();
        if (!claim.folder().equals(o.folder().toAbsolutePath().normalize())) {
            throw new IllegalArgumentException("the claimed folder " + claim.folder() + " is not the study's " + o.folder());
        }
        try (Publication pub = new Publication(claim)) {
            stage(r, o, pub);
            return pub.publish(r.run());
        }
    }

    private static void stage(Results r, Study.Outputs o, Publication pub) {
        pub.write(PATCHES, p -> PatchCsvWriter.write(p, r.table()));
        if (o.monthHourCsv() && r.monthHourWm2() != null) {
            pub.write(MONTH_HOUR, p -> MonthHourCsvWriter.write(p, r.table().patches(), r.monthHourWm2()));
        }
        PvZonesMetric.Found found = r.metrics().find(PvZonesMetric.Found.class).orElse(null);
        PvZones.Result pv = found == null ? null : found.zones();
        if (found != null) {
            pub.write(ZoneCsvWriter.FILE_NAME, p -> ZoneCsvWriter.write(p, pv.zones(), found.orientationLossPct(),
                    found.arrays().zones()));
            if (!found.arrays().zones().isEmpty()) {
                pub.write(PvSeriesCsvWriter.FILE_NAME, p -> PvSeriesCsvWriter.write(p, found.arrays().poa().weather(),
                        found.arrays().zones()));
            }
            pub.write(ModulesGeoJsonWriter.FILE_NAME, p -> ModulesGeoJsonWriter.write(p, found.arrays().modules(),
                    org.solmass.Cautions.RESULTS, r.geo()));
        }
        SummaryWriter.Spec spec = SummaryWriter.Spec.standard(o.thresholdsKwhM2()).with(r.metrics().summaryColumns())
                .withStoreyHeight(o.storeyHeightM());
        List<String> texts = new ArrayList<>(r.cautions());
        texts.addAll(r.metrics().notes());
        texts.addAll(r.notes());
        com.fasterxml.jackson.databind.node.ObjectNode tree = SummaryWriter.toTree(r.table(), spec, r.run(), texts);
        for (Metric.Findings f : r.metrics().findings()) if (f.summarySection() != null) tree.set(f.summaryKey(), f.summarySection());
        if (r.geo() != null) {
            tree.set("geo_reference", geoSection(r.geo()));
            pub.write(GeoJsonWriter.PATCHES, p -> GeoJsonWriter.writePatches(p, r.table(), r.geo(), r.cautions()));
            if (pv != null) pub.write(GeoJsonWriter.ZONES, p -> GeoJsonWriter.writeZones(p, pv.zones(), r.geo(), r.cautions()));
        }
        pub.write(SUMMARY, p -> AtomicFiles.writeString(p, org.solmass.study.StudyWriter.pretty(tree)));
        if (o.map() && !r.table().names().isEmpty()) {
            Column col = r.table().has(MAIN_COLUMN.name()) ? MAIN_COLUMN : r.table().columns().get(0);
            List<double[]> outlines = new ArrayList<>();
            if (pv != null) for (PvZones.Zone z : pv.zones()) outlines.addAll(z.outlines());
            if (found != null) for (org.solmass.pv.PvModule m : found.arrays().modules()) outlines.add(moduleRing(m));
            pub.write(MAP, p -> MapRenderer.write(p, r.model(), r.study().model().analysedMask(r.model().blockNames()), r.table().patches(),
                    r.table().column(col.name()), col.label(), col.unit().symbol(),
                    MapRenderer.Options.of(o.mapWidthPx(), o.mapHeightPx(), r.study().name()).withPeriod(RunPeriod.of(r.run())),
                    new MapRenderer.Extras(false, outlines, "PV zone (zones.csv) and modules (modules.geojson)")));
        }
        if (o.gltf() && r.table().has(MAIN_COLUMN.name()) && r.table().size() > 0) {
            pub.write(GltfWriter.FILE_NAME, p -> GltfWriter.write(p, r.table(), MAIN_COLUMN.name(),
                    "Solmass " + r.run().solmassVersion(), r.cautions()));
        }
    }

    /**
     * summary.json's "geo_reference": the model's CRS, the local origin and north angle, and how a
     * patches.csv x, y turns back into the CRS: E = origin_x + x cos(a) + y sin(a),
     * N = origin_y - x sin(a) + y cos(a), with a = north_deg (docs/geo.md).
     */
    static com.fasterxml.jackson.databind.node.ObjectNode geoSection(org.solmass.geo.GeoReference g) {
        var o = com.fasterxml.jackson.databind.node.JsonNodeFactory.instance.objectNode();
        o.put("crs", g.file().name());
        o.put("crs_definition", g.file().definition());
        o.put("working_crs", g.work().name());
        o.put("origin_x", g.originX());
        o.put("origin_y", g.originY());
        o.put("north_deg", g.northDeg());
        o.put("latitude", g.latitudeDeg());
        o.put("longitude", g.longitudeDeg());
        o.put("patches_csv_xy", "local: x, y in metres from the origin, rotated by north_deg so that +y is true north;"
                + " E = origin_x + x cos(north_deg) + y sin(north_deg), N = origin_y - x sin(north_deg) + y cos(north_deg)"
                + " in working_crs; patches.geojson gives each patch in WGS84 and in crs");
        return o;
    }

    /** A module's outline as a closed polyline of x,y,z triples (first corner not repeated). */
    private static double[] moduleRing(org.solmass.pv.PvModule m) {
        org.solmass.model.Vec3[] c = m.corners();
        double[] out = new double[12];
        for (int k = 0; k < 4; k++) {
            out[3 * k] = c[k].x();
            out[3 * k + 1] = c[k].y();
            out[3 * k + 2] = c[k].z();
        }
        return out;
    }
}
