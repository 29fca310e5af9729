package org.solmass.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.solmass.Cautions;
import org.solmass.InputException;
import org.solmass.climate.ClimateReport;
import org.solmass.metrics.ColumnCatalogue;
import org.solmass.output.MapRenderer;
import org.solmass.output.MethodSources;
import org.solmass.output.PdfPages;
import org.solmass.output.PublishedRun;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunPeriod;
import org.solmass.output.RunRecord;
import org.solmass.output.ShadowSheet;
import org.solmass.output.ZoneCsvWriter;
import org.solmass.study.Study;
import org.solmass.table.Column;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * {@code solmass report}: a PDF report of a finished run, read back from its results folder (every file
 * checked against run.json): title, site and inputs, the annual map, the facade elevations, the
 * statistics per facade orientation, storey band and block, the shadow sheet when the shadows command
 * wrote one, the PV roof zones, the cautions and the sources of the methods the run used.
 */
@Command(name = "report", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"PDF report of a finished run: inputs, annual map, facade elevations, statistics per",
                "orientation, storey and block, shadow sheet (when computed), PV zones, cautions, sources."})
public final class ReportCommand implements Callable<Integer> {
    /** The default file name, inside the results folder's report folder. */
    static final String FOLDER = "report", FILE = "report.pdf";
    /** The facade elevations' page size in the report, pixels. */
    static final int PAGE_W = 2000, PAGE_H = 1200;

    @Parameters(paramLabel = "RESULTS", description = "results folder of analyse") Path results;
    @Option(names = "--out", paramLabel = "FILE.pdf", description = "the PDF to write (default: RESULTS/report/report.pdf)") Path out;
    @Option(names = "--column", paramLabel = "NAME", description = "column of patches.csv for the elevations (default annual_kwh_m2)") String column;

    @Override
    public Integer call() {
        Path file = out != null ? out : results.resolve(FOLDER).resolve(FILE);
        if (out != null && !file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".pdf")) {
            throw new InputException("--out", "expected a file name ending in .pdf, got " + file);
        }
        PublishedRun run = PublishedRun.open(results);
        for (String w : run.warnings()) System.err.println("solmass: warning: " + w);
        Path parent = file.toAbsolutePath().getParent();
        org.solmass.output.FolderClaim.prepareWritable(parent, out != null ? "--out" : results.toString());
        List<String> notes = write(run, file, column);
        for (String n : notes) System.err.println("solmass: note: " + n);
        System.out.printf("solmass report: %s%n  wrote %s%n", run.record().study().name(), file);
        return Main.EXIT_OK;
    }

    /** Writes the report of a results folder; returns notes on parts left out (and why). */
    static List<String> write(PublishedRun run, Path file, String column) {
        RunRecord rec = run.record();
        Study study = rec.study();
        JsonNode summary = run.read(ResultsFolder.SUMMARY, ReportCommand::json);
        List<String> notes = new ArrayList<>();
        ClimateReport climate = null;
        try {
            climate = AnalysisRun.loadWeather(study).report();
        } catch (RuntimeException e) {
            notes.add("climate totals left out: " + e.getMessage());
        }
        RunGeometry geo = null;
        try {
            geo = RunGeometry.of(run);
        } catch (InputException e) {
            notes.add("facade elevations left out: " + e.getMessage());
        }
        String period = RunPeriod.of(rec);
        try (PdfPages pdf = new PdfPages(study.name() + " - solar irradiation report",
                study.name() + " - Solmass " + rec.solmassVersion() + " - indicative only: see the cautions")) {
            pdf.newPage();
            pdf.heading("Solar irradiation report: " + study.name(), 1);
            if (study.description() != null && !study.description().isBlank()) pdf.paragraph(study.description(), 11, false);
            pdf.paragraph(Cautions.RESULTS, 10, true);
            pdf.heading("Site and inputs", 2);
            pdf.keyValues(inputs(run, rec, climate, period), 9.5f, 150);
            pdf.heading("Results at a glance", 2);
            pdf.keyValues(glance(summary), 9.5f, 150);

            BufferedImage map = run.has(ResultsFolder.MAP) ? run.read(ResultsFolder.MAP, ReportCommand::image) : null;
            if (map == null && geo != null) {
                Column main = ResultsFolder.MAIN_COLUMN;
                map = MapRenderer.render(geo.model(), geo.analysed(), geo.patches(), geo.values(main.name()), main.label(),
                        main.unit().symbol(), MapRenderer.Options.of(study.outputs().mapWidthPx(), study.outputs().mapHeightPx(),
                                study.name()).withPeriod(period));
            }
            if (map != null) {
                pdf.picture("Annual irradiation map", map, "map.png of the results folder: an axonometric view and the plan "
                        + "(north up, with scale bar); " + period + ".");
            } else {
                notes.add("map left out: the run wrote no map.png and its geometry could not be rebuilt");
            }
            if (geo != null) {
                for (ElevationsCommand.Page p : ElevationsCommand.pages(geo, column, PAGE_W, PAGE_H)) {
                    pdf.picture("Facade elevations: " + p.block(), p.image(), p.facadePatches() + " facade patches, each drawn "
                            + "once at its true shape; the key plan numbers the facades. Same page as "
                            + "./solmass elevations writes.");
                }
            }
            pdf.newPage();
            pdf.heading("Facades by orientation", 2);
            statistics(pdf, summary.get("by_facade_orientation"), "Orientation", summary.path("by_kind").get("facade"), "All facades");
            JsonNode storeys = summary.get("by_facade_storey");
            if (storeys != null) {
                pdf.heading("Facades by storey band (" + storeys.path("storey_height_m").asText() + " m storeys above z = "
                        + storeys.path("base_z").asText() + " m)", 2);
                statistics(pdf, storeys, "Height band", null, null);
            }
            pdf.heading("By block", 2);
            statistics(pdf, summary.get("by_block"), "Block", summary.get("all"), "All analysed");

            Path sheet = run.folder().resolve(ShadowsCommand.FOLDER).resolve(ShadowsCommand.SHEET);
            if (Files.isRegularFile(sheet)) {
                pdf.picture("Shadow diagrams", image(sheet), "Written by ./solmass shadows into the results folder's shadows "
                        + "folder (not part of the analyse run's manifest). " + ShadowSheet.CAUTION);
            } else {
                notes.add("no shadow sheet: run ./solmass shadows STUDY to add one (" + sheet + ")");
            }

            pdf.newPage();
            pdf.heading("PV roof zones", 2);
            pvZones(pdf, run, summary);
            pdf.heading("Cautions", 2);
            List<String> cautions = new ArrayList<>(List.of(Cautions.RESULTS));
            for (JsonNode c : summary.path("cautions")) if (!cautions.contains(c.asText())) cautions.add(c.asText());
            pdf.bullets(cautions, 9.5f);
            pdf.heading("Sources of the methods used", 2);
            pdf.bullets(MethodSources.of(study, rec.timeBase(), climate, geo != null ? geo.table().resultColumns()
                    : columns(summary)), 9.5f);
            pdf.paragraph("Methods and equations: docs/method.md, docs/sun-sky-climate.md and docs/metrics.md of Solmass "
                    + rec.solmassVersion() + ". Demo data shipped with Solmass is invented.", 9, true);
            pdf.save(file, rec.finished());
        }
        return notes;
    }

    private static List<String[]> inputs(PublishedRun run, RunRecord rec, ClimateReport climate, String period) {
        Study s = rec.study();
        List<String[]> kv = new ArrayList<>();
        kv.add(new String[] {"Results folder", run.folder().toAbsolutePath().normalize() + (run.runId() != null ? " (run " + run.runId() + ")" : "")});
        kv.add(new String[] {"Finished", rec.finished() == null ? "not recorded" : rec.finished() + " (UTC)"});
        kv.add(new String[] {"Model file", s.model().file() + ", " + rec.modelSizeBytes() + " bytes, SHA-256 "
                + rec.modelSha256().substring(0, Math.min(16, rec.modelSha256().length())) + "..."});
        kv.add(new String[] {"Model settings", "up axis " + s.model().up().name().toLowerCase(Locale.ROOT) + ", unit "
                + s.model().unit().name().toLowerCase(Locale.ROOT) + ", north "
                + fmt(s.model().northDeg(), 1) + " deg; context blocks: " + (s.model().context().isEmpty() ? "none" : String.join(", ", s.model().context()))});
        kv.add(new String[] {"Site", String.format(Locale.ROOT, "latitude %.4f, longitude %.4f, elevation %.0f m, time zone %s (local standard time UTC%s)",
                s.site().latitudeDeg(), s.site().longitudeDeg(), s.site().elevationM(), s.site().zone(), s.site().standardOffset(s.climate().year()))});
        kv.add(new String[] {"Climate source", s.climate().isClearSky() ? "clear-sky model (no weather file)" : s.climate().file().toString()});
        kv.add(new String[] {"Period", period});
        if (climate != null && climate.total() != null) {
            ClimateReport.Totals t = climate.total();
            kv.add(new String[] {"Climate, annual totals", String.format(Locale.ROOT,
                    "GHI %.1f kWh/m2, DHI %.1f kWh/m2, DNI %.1f kWh/m2 (normal to the sun)", t.ghiKwhM2(), t.dhiKwhM2(), t.dniKwhM2())});
            if (climate.reading() != null) kv.add(new String[] {"Climate format", climate.reading().format()});
        } else {
            kv.add(new String[] {"Climate, annual totals", "not available (the climate source could not be read again)"});
        }
        kv.add(new String[] {"Sky model", s.sky().name()});
        kv.add(new String[] {"Patch size", fmt(s.patchM(), 2) + " m; " + s.rays() + " hemisphere rays per patch"});
        kv.add(new String[] {"Albedo", "ground " + fmt(s.albedo().ground(), 2) + ", blocks " + fmt(s.albedo().blocksDefault(), 2)});
        StringBuilder counts = new StringBuilder();
        for (Map.Entry<String, Long> e : rec.counts().entrySet()) counts.append(counts.length() == 0 ? "" : ", ").append(e.getKey()).append(' ').append(e.getValue());
        kv.add(new String[] {"Counts", counts.toString()});
        kv.add(new String[] {"Version", "Solmass " + rec.solmassVersion() + " (run); report by Solmass " + Main.version()});
        return kv;
    }

    private static List<String[]> glance(JsonNode summary) {
        List<String[]> kv = new ArrayList<>();
        JsonNode all = summary.path("all");
        kv.add(new String[] {"Analysed area", all.path("patches").asText() + " patches, " + all.path("area_m2").asText() + " m2"});
        JsonNode a = all.path("annual_kwh_m2");
        if (!a.isMissingNode()) {
            kv.add(new String[] {"Annual irradiation", "area-weighted mean " + a.path("mean").asText() + " kWh/m2 (min "
                    + a.path("min").asText() + ", max " + a.path("max").asText() + "), total " + a.path("total_kwh").asText() + " kWh"});
        }
        for (Iterator<Map.Entry<String, JsonNode>> it = summary.path("by_kind").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            kv.add(new String[] {"  " + e.getKey(), e.getValue().path("area_m2").asText() + " m2, mean "
                    + e.getValue().path("annual_kwh_m2").path("mean").asText() + " kWh/m2"});
        }
        return kv;
    }

    /**
     * A table of a summary.json breakdown: per entry the patches, area and the annual irradiation's
     * mean, min, max and total, the mean shading loss and sky view factor; a last row of the total.
     */
    private static void statistics(PdfPages pdf, JsonNode section, String first, JsonNode total, String totalName) {
        if (section == null || !section.isObject()) {
            pdf.paragraph("Not in summary.json (written by an earlier Solmass).", 9.5f, true);
            return;
        }
        Column annual = ColumnCatalogue.of("annual_kwh_m2"), loss = ColumnCatalogue.of("shading_loss_pct"),
                svf = ColumnCatalogue.of("sky_view_factor");
        pdf.paragraph(annual.label() + " (" + annual.unit().display() + "), area-weighted over the patches of each row; "
                + loss.label().toLowerCase(Locale.ROOT) + " (" + loss.unit().display() + ") and " + svf.label().toLowerCase(Locale.ROOT)
                + " as area-weighted means.", 9, true);
        String[] header = {first, "Patches", "Area (m2)", "Mean", "Min", "Max", "Total (kWh)", "Shading loss", "Sky view"};
        List<String[]> rows = new ArrayList<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = section.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            if (e.getValue().isObject()) rows.add(row(e.getKey(), e.getValue()));
        }
        if (total != null && totalName != null) rows.add(row(totalName, total));
        pdf.table(header, rows, new float[] {2.2f, 1, 1.2f, 1, 1, 1, 1.5f, 1.2f, 1},
                new boolean[] {false, true, true, true, true, true, true, true, true}, 9.5f);
    }

    private static String[] row(String name, JsonNode n) {
        JsonNode a = n.path("annual_kwh_m2");
        return new String[] {name, n.path("patches").asText(), n.path("area_m2").asText(), a.path("mean").asText(),
                a.path("min").asText(), a.path("max").asText(), a.path("total_kwh").asText(),
                n.path("shading_loss_pct").path("mean").asText(), n.path("sky_view_factor").path("mean").asText()};
    }

    /** zones.csv's layout and yield columns, and its energy balance, as two tables of the columns the file has. */
    static final List<String> PV_LAYOUT = List.of("zone", "block", "surface", "area_m2", "mounting", "modules", "kwp",
            "poa_kwh_m2", "module_shading_loss_pct", "yield_kwh", "specific_yield_kwh_kwp", "performance_ratio");
    static final List<String> PV_BALANCE = List.of("zone", "reference_kwh", "shading_loss_kwh", "incidence_loss_kwh",
            "mismatch_loss_kwh", "temperature_loss_kwh", "other_dc_loss_kwh", "inverter_loss_kwh", "clipping_loss_kwh", "yield_kwh");

    private static void pvZones(PdfPages pdf, PublishedRun run, JsonNode summary) {
        JsonNode pv = summary.get("pv_zones");
        if (pv != null) {
            JsonNode best = pv.path("best_plane");
            pdf.paragraph("Roof patches with a suitability of at least " + pv.path("suitable_pct").asText() + " % (what the site"
                    + " leaves of the best unobstructed plane: tilt " + best.path("tilt_deg").asText() + " deg, azimuth "
                    + best.path("azimuth_deg").asText() + " deg, " + best.path("annual_kwh_m2").asText() + " kWh/m2 per year),"
                    + " zones of at least " + pv.path("min_zone_m2").asText() + " m2. Modules are placed in each zone with"
                    + " setbacks (racked rows on flat roofs, flush on pitched ones); the yield follows each module's"
                    + " plane-of-array irradiance through the loss chain of docs/pv.md. Indicative: layout, electrical,"
                    + " structural and fire-setback design belong to licensed practice and local codes.", 9.5f, false);
        }
        if (!run.has(ZoneCsvWriter.FILE_NAME)) {
            pdf.paragraph("The run wrote no zones.csv.", 9.5f, true);
            return;
        }
        List<List<String>> table = run.read(ZoneCsvWriter.FILE_NAME, ReportCommand::csv);
        if (table.size() <= 1) {
            pdf.paragraph("No roof area met the settings: no PV zone.", 9.5f, true);
            return;
        }
        zoneTable(pdf, table, PV_LAYOUT);
        if (table.get(0).contains("reference_kwh")) {
            pdf.paragraph("Energy balance per zone, kWh per year: reference (plane-of-array irradiation x kWp / 1 kW/m2)"
                    + " minus each loss equals the yield.", 9f, true);
            zoneTable(pdf, table, PV_BALANCE);
        }
    }

    /** The named columns of a CSV table (header first) that the file has, in the given order. */
    private static void zoneTable(PdfPages pdf, List<List<String>> table, List<String> wanted) {
        List<String> head = table.get(0);
        List<Integer> at = new ArrayList<>();
        for (String w : wanted) if (head.contains(w)) at.add(head.indexOf(w));
        String[] header = new String[at.size()];
        boolean[] right = new boolean[at.size()];
        for (int i = 0; i < at.size(); i++) {
            header[i] = head.get(at.get(i));
            right[i] = !header[i].equals("block") && !header[i].equals("surface") && !header[i].equals("mounting");
        }
        List<String[]> rows = new ArrayList<>();
        for (int r = 1; r < table.size(); r++) {
            List<String> row = table.get(r);
            String[] out = new String[at.size()];
            for (int i = 0; i < at.size(); i++) out[i] = at.get(i) < row.size() ? row.get(at.get(i)) : "";
            rows.add(out);
        }
        pdf.table(header, rows, null, right, 8f);
    }

    private static List<String> columns(JsonNode summary) {
        List<String> c = new ArrayList<>();
        summary.path("columns").fieldNames().forEachRemaining(c::add);
        return c;
    }

    private static String fmt(double v, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    private static JsonNode json(Path p) {
        try {
            return new ObjectMapper().readTree(p.toFile());
        } catch (IOException e) {
            throw new InputException(p.toString(), "cannot read: " + e.getMessage(), e);
        }
    }

    static BufferedImage image(Path p) {
        try {
            BufferedImage img = ImageIO.read(p.toFile());
            if (img == null) throw new InputException(p.toString(), "is not a PNG image Java can read");
            return img;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static List<List<String>> csv(Path p) {
        try (CSVParser parser = CSVParser.parse(Files.readString(p, StandardCharsets.UTF_8), CSVFormat.DEFAULT)) {
            List<List<String>> out = new ArrayList<>();
            for (CSVRecord r : parser) out.add(r.toList());
            return out;
        } catch (IOException e) {
            throw new InputException(p.toString(), "cannot read: " + e.getMessage(), e);
        }
    }
}
