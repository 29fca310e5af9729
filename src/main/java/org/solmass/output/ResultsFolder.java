package org.solmass.output;

import org.solmass.metrics.PvZones;
import org.solmass.model.MassingModel;
import org.solmass.study.Study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes a whole results folder in one call: patches.csv, month-hour.csv (when the study asks and the
 * table is given), summary.json, map.png (when the study asks) and, last, run.json, so a folder with
 * a run.json is complete. Every file is written atomically ({@link AtomicFiles}).
 */
public final class ResultsFolder {
    public static final String PATCHES = "patches.csv", SUMMARY = "summary.json", MAP = "map.png",
            MONTH_HOUR = "month-hour.csv";
    /** The column the map and the thresholds use. */
    public static final String MAIN_COLUMN = "annual_kwh_m2";

    private ResultsFolder() {}

    /**
     * What a run produced.
     *
     * @param study the resolved study (its outputs section says where and what)
     * @param model the massing model as imported
     * @param table per-patch results, patches in index order
     * @param monthHourWm2 mean irradiance per patch, month and hour ({@link MonthHourCsvWriter}), or null
     * @param run the run record
     * @param cautions texts for summary.json
     * @param pv PV roof zones for zones.csv, the map's outlines and the summary; null for none
     * @param notes further notes for summary.json (e.g. how the metrics are to be read)
     */
    public record Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                          RunRecord run, List<String> cautions, PvZones.Result pv, List<String> notes) {
        public Results {
            cautions = List.copyOf(cautions);
            notes = List.copyOf(notes);
        }

        /** Results without PV zones or notes. */
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
        if (r.pv() != null) {
            Path zones = dir.resolve(ZoneCsvWriter.FILE_NAME);
            ZoneCsvWriter.write(zones, r.pv().zones(), zoneComments(r.study(), r.pv(), r.cautions()));
            written.add(zones);
        }
        Path summary = dir.resolve(SUMMARY);
        List<String> summaryColumns = new ArrayList<>(SummaryWriter.Spec.standard(o.thresholdsKwhM2()).columns());
        for (String c : r.table().names()) if (c.startsWith("sun_hours_") || c.equals("sunshine_h")) summaryColumns.add(c);
        SummaryWriter.Spec spec = new SummaryWriter.Spec(summaryColumns, MAIN_COLUMN, o.thresholdsKwhM2());
        List<String> texts = new ArrayList<>(r.cautions());
        texts.addAll(r.notes());
        com.fasterxml.jackson.databind.node.ObjectNode tree = SummaryWriter.toTree(r.table(), spec, r.run(), texts);
        if (r.pv() != null) tree.set("pv_zones", pvSummary(r.study(), r.pv()));
        AtomicFiles.writeString(summary, org.solmass.study.StudyWriter.pretty(tree));
        written.add(summary);
        if (o.map() && !r.table().names().isEmpty()) {
            String col = r.table().has(MAIN_COLUMN) ? MAIN_COLUMN : r.table().names().get(0);
            Path map = dir.resolve(MAP);
            List<double[]> outlines = new ArrayList<>();
            if (r.pv() != null) for (PvZones.Zone z : r.pv().zones()) outlines.addAll(z.outlines());
            MapRenderer.write(map, r.model(), r.study().model().analysedMask(r.model().blockNames()), r.table().patches(),
                    r.table().column(col), labelOf(col), r.table().unit(col),
                    MapRenderer.Options.of(o.mapWidthPx(), o.mapHeightPx(), r.study().name()),
                    new MapRenderer.Extras(false, outlines, "PV roof zone (zones.csv)"));
            written.add(map);
        }
        if (o.gltf() && r.table().has(MAIN_COLUMN) && r.table().size() > 0) {
            Path gltf = dir.resolve(GltfWriter.FILE_NAME);
            GltfWriter.write(gltf, r.table(), MAIN_COLUMN, "Solmass " + r.run().solmassVersion(), r.cautions());
            written.add(gltf);
        }
        Path run = dir.resolve(RunRecord.FILE_NAME);
        r.run().write(run);
        written.add(run);
        return written;
    }

    /** The '#' lines of zones.csv: the cautions, the reference plane and the settings. */
    static List<String> zoneComments(Study study, PvZones.Result pv, List<String> cautions) {
        List<String> out = new ArrayList<>();
        out.add("Solmass PV roof zones: " + study.name());
        out.addAll(cautions);
        if (cautions.stream().noneMatch(c -> c.contains("licensed practice"))) out.add("Indicative only: structure, fire setbacks, electrical design and grid connection follow local codes and licensed practice.");
        out.add(String.format(java.util.Locale.ROOT, "Best unobstructed plane at the site: tilt %.0f deg, azimuth %.0f deg, %.1f kWh/m2 per year",
                pv.best().tiltDeg(), pv.best().azimuthDeg(), pv.best().annualKwhM2()));
        Study.Pv s = study.pv();
        out.add(String.format(java.util.Locale.ROOT, "Suitable roof patch: at least %.0f %% of that plane; zones of at least %.1f m2; "
                + "yield_kwh = total_kwh x module efficiency %.3f x performance ratio %.3f (full coverage assumed)",
                s.suitablePct(), s.minZoneM2(), s.moduleEfficiency(), s.performanceRatio()));
        return out;
    }

    private static com.fasterxml.jackson.databind.node.ObjectNode pvSummary(Study study, PvZones.Result pv) {
        var o = com.fasterxml.jackson.databind.node.JsonNodeFactory.instance.objectNode();
        var b = o.putObject("best_plane");
        b.put("tilt_deg", pv.best().tiltDeg());
        b.put("azimuth_deg", pv.best().azimuthDeg());
        b.put("annual_kwh_m2", round(pv.best().annualKwhM2(), 1));
        o.put("suitable_pct", study.pv().suitablePct());
        o.put("min_zone_m2", study.pv().minZoneM2());
        o.put("module_efficiency", study.pv().moduleEfficiency());
        o.put("performance_ratio", study.pv().performanceRatio());
        o.put("zones", pv.zones().size());
        o.put("area_m2", round(pv.totalAreaM2(), 2));
        o.put("total_kwh", round(pv.zones().stream().mapToDouble(PvZones.Zone::totalKwh).sum(), 1));
        o.put("yield_kwh", round(pv.totalYieldKwh(), 1));
        return o;
    }

    private static double round(double v, int d) {
        double s = Math.pow(10, d);
        return Math.round(v * s) / s;
    }

    /** A readable name of a result column for titles and legends. */
    public static String labelOf(String column) {
        return switch (column) {
            case "annual_kwh_m2" -> "Annual irradiation";
            case "beam_kwh_m2" -> "Annual beam irradiation";
            case "diffuse_kwh_m2" -> "Annual sky diffuse irradiation";
            case "reflected_kwh_m2" -> "Annual reflected irradiation";
            case "unshaded_kwh_m2" -> "Annual irradiation without obstruction";
            case "shading_loss_pct" -> "Loss by shading";
            case "sky_view_factor" -> "Sky view factor";
            case "ground_view_factor" -> "Ground view factor";
            case "annual_kwh" -> "Annual irradiation per patch";
            case "sunshine_h" -> "Annual sunshine hours seen";
            case "pv_suitability_pct" -> "PV suitability (share of the best plane)";
            default -> {
                if (column.matches("sun_(hours|level)_\\d{4}")) {
                    java.time.MonthDay d = java.time.MonthDay.of(Integer.parseInt(column.substring(column.length() - 4, column.length() - 2)),
                            Integer.parseInt(column.substring(column.length() - 2)));
                    String day = d.getDayOfMonth() + " " + d.getMonth().getDisplayName(java.time.format.TextStyle.FULL, java.util.Locale.ENGLISH);
                    yield (column.startsWith("sun_hours") ? "Sun hours on " : "EN 17037 sunlight level on ") + day;
                }
                if (column.matches("m(0[1-9]|1[0-2])_kwh_m2")) {
                    int m = Integer.parseInt(column.substring(1, 3));
                    yield java.time.Month.of(m).getDisplayName(java.time.format.TextStyle.FULL, java.util.Locale.ENGLISH) + " irradiation";
                }
                yield column.replace('_', ' ');
            }
        };
    }
}
