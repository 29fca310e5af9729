package org.solmass.spark;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.apache.spark.sql.SparkSession;
import org.solmass.Cautions;
import org.solmass.cli.Main;
import org.solmass.geo.GeoReference;
import org.solmass.output.AtomicFiles;
import org.solmass.output.BuildingsWriter;
import org.solmass.output.FolderClaim;
import org.solmass.output.GeoJsonWriter;
import org.solmass.output.Publication;
import org.solmass.output.RunRecord;
import org.solmass.output.ZoneCsvWriter;
import org.solmass.study.StudyWriter;
import org.solmass.table.Column;
import org.solmass.table.Numbers;
import org.solmass.tiles.CityModel;
import org.solmass.tiles.CityPlan;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

/**
 * One city run into a claimed results folder: the Spark stages ({@link CityStages}) write the
 * per-patch Parquet into a hidden staging folder and sum the buildings from the same rows; then
 * the folder is published: {@value #PARQUET} is moved into place (an earlier run's removed first),
 * and the files go through {@link Publication} (staged, then renamed, run.json last with the manifest),
 * among them zones.geojson and zones.csv (the PV zones, city-wide numbers, {@code output.GeoJsonWriter},
 * {@code output.ZoneCsvWriter}) and {@value #PARQUET_INDEX}, which lists every Parquet file with its size and SHA-256, so
 * run.json's manifest covers the Parquet folder too.
 */
final class CityRun {
    static final String PARQUET = "patches.parquet", PARQUET_INDEX = "patches-parquet.json", SUMMARY = "city-summary.json";
    /** Hidden staging folders of a city run inside the results folder. */
    static final String STAGING = ".solmass-city-staging", OLD = ".solmass-city-old";

    private CityRun() {}

    /** What a run did. */
    record Outcome(CityPlan plan, CityStages.Outcome stages, List<BuildingsWriter.Building> buildings, List<Path> written) {}

    static Outcome run(SparkSession spark, CityModel city, CityPlan plan, CityStages.Settings s, FolderClaim claim, double prepareS) {
        Path dir = claim.folder(), staging = dir.resolve(STAGING), parquet = staging.resolve(PARQUET);
        CityJob.deleteTree(staging);
        CityStages.share(s.studyFile(), city);
        CityStages.Outcome o;
        try {
            o = CityStages.run(spark, city, plan, s, parquet);
        } finally {
            CityStages.forget(s.studyFile());
        }
        // area-weighted means of every column but categories (a PV zone number has no mean)
        List<Column> summarised = o.summarised();
        List<BuildingsWriter.Building> buildings = o.buildings();
        ObjectNode totals = totals(buildings, summarised);
        ObjectNode index = index(parquet);

        Path target = dir.resolve(PARQUET), old = dir.resolve(OLD);
        try {
            CityJob.deleteTree(old);
            if (Files.exists(target)) Files.move(target, old, StandardCopyOption.ATOMIC_MOVE);
            Files.move(parquet, target, StandardCopyOption.ATOMIC_MOVE);
            CityJob.deleteTree(old);
            CityJob.deleteTree(staging);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot move the Parquet rows into " + dir + ": " + e.getMessage(), e);
        }
        GeoReference geo = city.prepared().read().reference();
        List<String> cautions = new ArrayList<>(List.of(Cautions.RESULTS));
        if (city.study().climate().isClearSky()) cautions.add(Cautions.CLEAR_SKY);
        Map<String, Long> counts = new LinkedHashMap<>();
        counts.put("patches", o.rows());
        counts.put("receivers", (long) plan.receiverCount());
        counts.put("tiles", (long) plan.tiles().size());
        counts.put("buildings", (long) buildings.size());
        Map<String, Double> timings = new LinkedHashMap<>();
        timings.put("prepare", prepareS);
        timings.putAll(o.stageS());
        RunRecord record = RunRecord.of(Main.version(), city.study(), city.prepared().weather().timeBase().label(), counts, timings, Instant.now());
        List<Path> written;
        try (Publication pub = new Publication(claim)) {
            pub.write(PARQUET_INDEX, p -> AtomicFiles.writeString(p, StudyWriter.pretty(index)));
            pub.write(BuildingsWriter.CSV, p -> BuildingsWriter.writeCsv(p, buildings, summarised));
            if (geo != null) {
                Map<String, double[]> footprints = BuildingsWriter.footprints(city.prepared().model());
                pub.write(BuildingsWriter.GEOJSON, p -> BuildingsWriter.writeGeoJson(p, buildings, summarised, footprints, geo, cautions));
            }
            // as the one-machine run's zones.geojson (WGS84), or local metres for an OBJ model
            if (o.zones() != null) pub.write(GeoJsonWriter.ZONES, p -> GeoJsonWriter.writeZones(p, o.zones(), geo, cautions));
            // as the one-machine run's zones.csv: the rows the tiles printed, city-wide numbers
            if (o.zoneRows() != null) pub.write(ZoneCsvWriter.FILE_NAME, p -> ZoneCsvWriter.write(p, o.zoneRows().numbers(), o.zoneRows().afterNumber()));
            List<String> texts = new ArrayList<>(cautions); // as summary.json: the cautions, then the PV zones' notes
            if (o.zoneRows() != null) texts.addAll(o.zoneRows().notes());
            ObjectNode summary = summary(spark, plan, o, totals, texts, timings);
            pub.write(SUMMARY, p -> AtomicFiles.writeString(p, StudyWriter.pretty(summary)));
            written = new ArrayList<>(List.of(target));
            written.addAll(pub.publish(record));
        }
        return new Outcome(plan, o, buildings, written);
    }

    /** city-summary.json: cautions first, the run, the plan, the reflection, the area-weighted totals. */
    private static ObjectNode summary(SparkSession spark, CityPlan plan, CityStages.Outcome o, ObjectNode totals,
                                      List<String> cautions, Map<String, Double> timings) {
        ObjectNode n = JsonNodeFactory.instance.objectNode();
        n.put("caution", cautions.get(0));
        ArrayNode c = n.putArray("cautions");
        cautions.forEach(c::add);
        ObjectNode run = n.putObject("run");
        run.put("solmass_version", Main.version());
        run.put("spark_version", spark.version());
        run.put("master", spark.sparkContext().master());
        run.put("finished_utc", Instant.now().toString());
        ObjectNode t = run.putObject("timings_s");
        timings.forEach((k, v) -> t.put(k, Math.round(v * 1000) / 1000.0));
        ObjectNode p = n.putObject("tiles");
        p.put("count", plan.tiles().size());
        p.put("partitions", o.partitions());
        p.put("tile_m", plan.options().tileM());
        p.put("halo_m", plan.haloM());
        p.put("uncapped_halo_m", plan.uncappedHaloM());
        p.put("halo_capped", plan.haloM() < plan.uncappedHaloM());
        p.put("lowest_sun_elevation_deg", plan.minSunElevationDeg());
        p.put("tallest_m", plan.tallestM());
        p.put("far_horizon", plan.options().farHorizon());
        p.put("receivers", plan.receiverCount());
        p.put("patches", plan.analysedCount());
        long max = 0, sum = 0;
        for (long b : o.firstPassBytes()) {
            max = Math.max(max, b);
            sum += b;
        }
        p.put("first_pass_bytes_max", max);
        p.put("first_pass_bytes_mean", o.firstPassBytes().length == 0 ? 0 : sum / o.firstPassBytes().length);
        ObjectNode r = n.putObject("reflection");
        r.put("note", "energy each bounce added, summed over the analysed patches (as the one-machine run stops on it)");
        ArrayNode b = r.putArray("bounce_sums_kwh_m2");
        for (double w : o.bounceWh()) b.add(w / 1000);
        r.put("converged", o.converged());
        n.set("totals", totals);
        return n;
    }

    /** Area-weighted means over every patch (from the buildings' sums), each with its column's decimals. */
    private static ObjectNode totals(List<BuildingsWriter.Building> buildings, List<Column> columns) {
        ObjectNode n = JsonNodeFactory.instance.objectNode();
        double area = 0, roof = 0, facade = 0;
        long patches = 0;
        for (BuildingsWriter.Building b : buildings) {
            area += b.areaM2();
            roof += b.roofAreaM2();
            facade += b.facadeAreaM2();
            patches += b.patches();
        }
        n.put("patches", patches);
        n.put("area_m2", Double.parseDouble(Numbers.format(area, 2)));
        n.put("roof_area_m2", Double.parseDouble(Numbers.format(roof, 2)));
        n.put("facade_area_m2", Double.parseDouble(Numbers.format(facade, 2)));
        ObjectNode means = n.putObject("area_weighted_means");
        for (int c = 0; c < columns.size(); c++) {
            double va = 0, a = 0;
            for (BuildingsWriter.Building b : buildings) {
                if (Double.isNaN(b.means()[c])) continue;
                va += b.means()[c] * b.valueAreaM2()[c];
                a += b.valueAreaM2()[c];
            }
            Column col = columns.get(c);
            if (a > 0) means.put(col.name(), Double.parseDouble(col.format(va / a)));
        }
        return n;
    }

    /** patches-parquet.json: every file of the Parquet folder (relative path, size, SHA-256). */
    static ObjectNode index(Path parquet) {
        ObjectNode n = JsonNodeFactory.instance.objectNode();
        n.put("folder", PARQUET);
        n.put("partitioned_by", PatchRows.TILE);
        ArrayNode files = n.putArray("files");
        try (Stream<Path> s = Files.walk(parquet)) {
            for (Path f : (Iterable<Path>) s.filter(Files::isRegularFile).sorted()::iterator) {
                String rel = parquet.relativize(f).toString().replace('\\', '/');
                if (rel.endsWith(".crc")) continue;
                files.addObject().put("file", rel).put("size_bytes", Files.size(f)).put("sha256", RunRecord.sha256(f));
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot list the Parquet rows in " + parquet + ": " + e.getMessage(), e);
        }
        return n;
    }
}
