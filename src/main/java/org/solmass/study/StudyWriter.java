package org.solmass.study;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectWriter;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.nio.file.Path;
import java.util.Map;
import java.util.TreeMap;

/**
 * Writes a resolved {@link Study} as a study file: the same keys {@link StudyReader} reads, every
 * default written out, paths absolute, keys in the documented order, map entries sorted by name.
 * Reading the output back gives an equal study (a test checks this).
 */
public final class StudyWriter {
    private static final ObjectWriter PRETTY;

    static {
        DefaultIndenter lf = new DefaultIndenter("  ", "\n");
        DefaultPrettyPrinter pp = new DefaultPrettyPrinter().withObjectIndenter(lf).withArrayIndenter(lf);
        PRETTY = new ObjectMapper().writer(pp);
    }

    private StudyWriter() {}

    /** The study as a JSON object, keys in the order of docs/study-file.md. */
    public static ObjectNode toTree(Study s) {
        JsonNodeFactory f = JsonNodeFactory.instance;
        ObjectNode root = f.objectNode();
        root.put("name", s.name());
        if (!s.description().isEmpty()) root.put("description", s.description());

        ObjectNode m = root.putObject("model");
        m.put("file", path(s.model().file()));
        m.put("up", Study.Named.labelOf(s.model().up()));
        m.put("unit", Study.Named.labelOf(s.model().unit()));
        m.put("north_deg", s.model().northDeg());
        strings(m.putArray("analyse"), s.model().analyse());
        strings(m.putArray("context"), s.model().context());
        geo(m, s.model().geo());

        ObjectNode site = root.putObject("site");
        site.put("latitude", s.site().latitudeDeg());
        site.put("longitude", s.site().longitudeDeg());
        site.put("elevation_m", s.site().elevationM());
        site.put("zone", s.site().zone().getId());

        ObjectNode c = root.putObject("climate");
        Study.Climate cl = s.climate();
        c.put("source", cl.isClearSky() ? StudyReader.CLEAR_SKY : path(cl.file()));
        if (!cl.isClearSky()) c.put("format", cl.format().label());
        c.put("interval_label", cl.intervalLabel().label());
        if (cl.fillGapsMaxSteps() == 0 || cl.fillGapsMaxSteps() == Study.Climate.FILL_GAPS_STEPS) {
            c.put("fill_gaps", cl.fillGaps());
        } else {
            c.put("fill_gaps", cl.fillGapsMaxSteps());
        }
        c.put("year", cl.year());
        if (!cl.columns().isEmpty()) {   // left out when empty, so that results of earlier versions compare byte for byte
            ObjectNode columns = c.putObject("columns");
            new TreeMap<>(cl.columns()).forEach(columns::put);
        }
        // the reading keys only when set, so that results of earlier versions compare byte for byte
        if (cl.reading().dateOrder() != null) c.put("date_order", cl.reading().dateOrder().label());
        if (cl.reading().clock() != org.solmass.climate.ClimateSpec.Clock.STANDARD) c.put("clock", cl.reading().clock().label());
        if (cl.reading().irradianceUnit() != null) c.put("irradiance_unit", cl.reading().irradianceUnit().label());

        ObjectNode a = root.putObject("albedo");
        a.put("ground", s.albedo().ground());
        a.put("blocks_default", s.albedo().blocksDefault());
        numbers(a.putObject("blocks"), s.albedo().blocks());
        numbers(a.putObject("materials"), s.albedo().materials());

        root.put("ground_irradiance", s.groundIrradiance().label());
        root.put("patch_m", s.patchM());
        root.put("rays", s.rays());
        root.put("sky", s.sky().name());
        root.put("time_base", s.timeBase().label());
        root.put("sun_bins", s.sunBins());
        root.put("step_minutes", s.stepMinutes());

        ObjectNode o = root.putObject("outputs");
        o.put("folder", path(s.outputs().folder()));
        o.put("month_hour_csv", s.outputs().monthHourCsv());
        o.put("map", s.outputs().map());
        o.put("map_width_px", s.outputs().mapWidthPx());
        o.put("map_height_px", s.outputs().mapHeightPx());
        ArrayNode t = o.putArray("thresholds_kwh_m2");
        for (double v : s.outputs().thresholdsKwhM2()) t.add(v);
        o.put("gltf", s.outputs().gltf());
        o.put("storey_height_m", s.outputs().storeyHeightM());
        root.put("threads", s.threads());

        ObjectNode sh = root.putObject("sun_hours");
        ArrayNode dates = sh.putArray("dates");
        for (java.time.MonthDay d : s.sunHours().dates()) dates.add(String.format("%02d-%02d", d.getMonthValue(), d.getDayOfMonth()));
        sh.put("step_minutes", s.sunHours().stepMinutes());
        sh.put("min_elevation_deg", s.sunHours().minElevationDeg());

        if (s.vegetation().any()) {
            ObjectNode veg = root.putObject("vegetation");
            s.vegetation().blockPatterns().forEach(veg.putArray("blocks")::add);
            s.vegetation().materialPatterns().forEach(veg.putArray("materials")::add);
            veg.put("kind", s.vegetation().kind().label());
            if (s.vegetation().transmittance() != null) {
                com.fasterxml.jackson.databind.node.ArrayNode tr = veg.putArray("transmittance");
                for (double x : s.vegetation().transmittance()) tr.add(x);
            }
        }
        if (!s.reflection().isDefault()) { // left out at the defaults, so that results of earlier versions compare byte for byte
            ObjectNode rf = root.putObject("reflection");
            rf.put("tolerance_pct", s.reflection().tolerancePct());
            rf.put("max_bounces", s.reflection().maxBounces());
            rf.put("rays", s.reflection().rays());
        }
        ObjectNode pv = root.putObject("pv");
        pv.put("suitable_pct", s.pv().suitablePct());
        pv.put("min_zone_m2", s.pv().minZoneM2());
        pv.put("performance_ratio", s.pv().performanceRatio());
        org.solmass.pv.LayoutOptions lo = s.pv().layout();
        pv.put("setback_m", lo.setbackM());
        pv.put("flat_max_tilt_deg", lo.flatMaxTiltDeg());
        pv.put("rack_tilt_deg", lo.rackTiltDeg());
        if (!Double.isNaN(lo.rackAzimuthDeg())) pv.put("rack_azimuth_deg", lo.rackAzimuthDeg());
        pv.put("ground_coverage_ratio", lo.groundCoverageRatio());
        if (lo.rowPitchM() > 0) pv.put("row_pitch_m", lo.rowPitchM());
        pv.put("rack_clearance_m", lo.rackClearanceM());
        pv.put("facades", lo.facades());
        if (!lo.defaultElectrical()) { // left out at the defaults, so that results of earlier versions compare byte for byte
            pv.put("dc_ac_ratio", lo.dcAcRatio());
            pv.put("other_dc_losses_pct", Math.rint((1 - lo.dcOtherFactor()) * 100 * 1e9) / 1e9);
        }
        ObjectNode mod = pv.putObject("module");
        mod.put("length_m", lo.module().lengthM());
        mod.put("width_m", lo.module().widthM());
        mod.put("power_w", lo.module().stcPowerW());
        mod.put("temp_coeff_pct_per_k", Math.rint(lo.module().tempCoeffPerK() * 100 * 1e9) / 1e9);
        mod.put("substrings", lo.module().bypassSubstrings());

        org.solmass.terrain.TerrainSpec tr = s.terrain();
        if (!tr.isNone()) { // left out without terrain, so that results of earlier versions compare byte for byte
            ObjectNode te = root.putObject("terrain");
            if (tr.horizonCsv() != null) te.put("horizon", path(tr.horizonCsv()));
            if (tr.dem() != null) te.put("dem", path(tr.dem()));
            if (tr.demEpsg() > 0) te.put("dem_epsg", tr.demEpsg());
            te.put("origin_east_m", tr.originEastM());
            te.put("origin_north_m", tr.originNorthM());
            te.put("near_radius_m", tr.nearRadiusM());
            te.put("far_horizon_from_dem", tr.farHorizonFromDem());
        }
        return root;
    }

    /** The study as pretty JSON text with LF line ends and a final newline. */
    public static String toJson(Study s) {
        return pretty(toTree(s));
    }

    /** Any JSON tree as Solmass writes JSON: two-space indent, LF line ends, final newline. */
    public static String pretty(JsonNode n) {
        try {
            return PRETTY.writeValueAsString(n) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static String path(Path p) { return p.toAbsolutePath().normalize().toString(); }

    private static void strings(ArrayNode a, Iterable<String> values) {
        for (String v : values) a.add(v);
    }

    private static void numbers(ObjectNode o, Map<String, Double> values) {
        for (Map.Entry<String, Double> e : new TreeMap<>(values).entrySet()) o.put(e.getKey(), e.getValue());
    }

    /** model.format, model.epsg and model.footprints, each only when not the default (an OBJ study writes none). */
    private static void geo(ObjectNode m, org.solmass.geo.GeoOptions g) {
        org.solmass.geo.GeoOptions d = org.solmass.geo.GeoOptions.defaults();
        if (g.format() != d.format()) m.put("format", g.format().label());
        if (g.epsg() != 0) m.put("epsg", g.epsg());
        if (g.equals(d.with(g.format(), g.epsg()))) return;
        ObjectNode f = m.putObject("footprints");
        f.put("height_property", g.heightProperty());
        f.put("storeys_property", g.storeysProperty());
        f.put("storey_height_m", g.storeyHeightM());
        f.put("base_property", g.baseProperty());
        f.put("name_property", g.nameProperty());
    }
}
