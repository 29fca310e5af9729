package org.solmass.study;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.InputException;
import org.solmass.TextInput;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.TimeBaseChoice;
import org.solmass.geo.GeoOptions;
import org.solmass.geo.GeoReference;
import org.solmass.geo.ModelFiles;
import org.solmass.model.LengthUnit;
import org.solmass.model.UpAxis;
import org.solmass.sky.SkyModel;
import org.solmass.sky.SkyModels;
import org.solmass.study.Study.Albedo;
import org.solmass.study.Study.Climate;
import org.solmass.study.Study.GroundIrradiance;
import org.solmass.study.Study.Outputs;
import org.solmass.sun.Site;
import org.solmass.terrain.TerrainSpec;

import java.io.IOException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.DateTimeException;
import java.time.ZoneId;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.function.Function;

/**
 * Reads a study file (JSON, our own format; every key in docs/study-file.md) into a resolved
 * {@link Study}: defaults applied, ranges checked, relative paths resolved against the study file's
 * folder. Unknown keys, wrong types and out-of-range values are {@link InputException}s naming the
 * file and the full key path, e.g. {@code study.json: site.latitude: expected a number from -90 to 90,
 * got "north"}.
 */
public final class StudyReader {
    /** The value of {@code climate.source} that selects the embedded clear-sky model. */
    public static final String CLEAR_SKY = "clear-sky";

    /**
     * The largest study file read (16 MiB). A study is a few KB of JSON; even a per-block albedo map
     * for 100,000 blocks (about 30 bytes each) is 3 MB. The bound keeps a wrong file (a device, a
     * model or a weather file named as the study) from being read whole into memory. One line may be
     * as long as the file: minified JSON is a study on one line.
     */
    public static final int MAX_FILE_BYTES = 16 << 20;

    private static final ObjectMapper MAPPER = new ObjectMapper()
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);

    private StudyReader() {}

    /** Reads a study file with no flags on top. */
    public static Study read(Path file) {
        return read(file, new StudyOverrides());
    }

    /**
     * Reads a study file and lays command-line flags over it.
     *
     * @param file the study file, or null to build the study from the flags alone (then the flags must
     *             give at least --model, --lat, --lon and --zone; relative paths resolve against the
     *             working directory)
     * @param overrides flags, may be empty
     */
    public static Study read(Path file, StudyOverrides overrides) {
        ObjectNode root = file == null ? JsonNodeFactory.instance.objectNode() : parse(file);
        if (root.get("climate") instanceof com.fasterxml.jackson.databind.node.TextNode shorthand) {
            root.putObject("climate").set("source", shorthand);   // so that climate flags merge into it
        }
        merge(root, overrides.tree());
        Path base = file == null ? Path.of("").toAbsolutePath() : file.toAbsolutePath().getParent();
        Map<String, String> flags = overrides.flags();
        Function<String, String> where = key -> {
            String bare = key.replaceAll("\\[\\d+]$", "");
            for (String k = bare; ; k = k.substring(0, k.lastIndexOf('.'))) {   // climate.columns.ghi -> --columns
                String flag = flags.get(k);
                if (flag != null) return flag;
                if (k.indexOf('.') < 0) break;
            }
            if (file == null) return StudyOverrides.REQUIRED_FLAGS.getOrDefault(bare, key);
            return file + ": " + key;
        };
        return fromTree(root, file == null ? null : file.toAbsolutePath().normalize(), base, where);
    }

    /**
     * Reads a study already parsed into a JSON tree (e.g. the "study" object of run.json).
     *
     * @param tree the study object
     * @param source the study file to record as its source, or null
     * @param baseDir folder relative paths resolve against
     * @param label what to name in messages before the key path (a file name)
     */
    public static Study fromTree(JsonNode tree, Path source, Path baseDir, String label) {
        if (!tree.isObject()) throw new InputException(label, "expected a study object { ... }");
        return fromTree((ObjectNode) tree, source, baseDir, key -> label + ": " + key);
    }

    private static Study fromTree(ObjectNode root, Path source, Path base, Function<String, String> where) {
        JsonCursor c = new JsonCursor(root, "", where);
        String name = c.text("name", null);
        String description = c.text("description", "");

        JsonCursor m = c.object("model");
        Path modelFile = path(m, "file", null, base);
        Study.Model model = new Study.Model(modelFile,
                m.choice("up", UpAxis.values(), Study.Named::labelOf, UpAxis.Z),
                m.choice("unit", LengthUnit.values(), Study.Named::labelOf, LengthUnit.M),
                m.number("north_deg", 0.0, -360, 360),
                m.strings("analyse"),
                m.strings("context"),
                geoOptions(m));
        for (int i = 0; i < model.context().size(); i++) {
            if (model.analyse().contains(model.context().get(i))) {
                throw m.error("context[" + i + "]", "block \"" + model.context().get(i)
                        + "\" is also listed in model.analyse; a block is either analysed or context");
            }
        }
        m.finish();

        JsonCursor s = c.object("site");
        double lat, lon;
        if (!s.has("latitude") && !s.has("longitude") && modelFile != null
                && ModelFiles.isGeoReferenced(modelFile, model.geo().format())) {
            // a geo-referenced model stands where its centre is (docs/geo.md)
            GeoReference ref = ModelFiles.load(modelFile, model.options(), model.geo()).reference();
            lat = ref.latitudeDeg();
            lon = ref.longitudeDeg();
        } else {
            lat = s.number("latitude", null, -90, 90);
            lon = s.number("longitude", null, -180, 180);
        }
        double elev = s.number("elevation_m", 0.0, -500, 9000);
        String zone = s.string("zone", null);
        ZoneId zoneId;
        try {
            zoneId = ZoneId.of(zone);
        } catch (DateTimeException e) {
            throw s.error("zone", "expected an IANA time zone such as \"Europe/Berlin\" or a UTC offset such as \"+02:00\", got \"" + zone + "\"");
        }
        s.finish();
        Site site = new Site(lat, lon, elev, zoneId);

        Climate climate = climate(c, base);

        JsonCursor a = c.object("albedo");
        Albedo albedo = new Albedo(a.number("ground", Albedo.DEFAULT_GROUND, 0, 1),
                a.number("blocks_default", Albedo.DEFAULT_BLOCKS, 0, 1),
                a.numberMap("blocks", 0, 1), a.numberMap("materials", 0, 1));
        a.finish();

        boolean groundGiven = c.has("ground_irradiance");
        GroundIrradiance ground = c.choice("ground_irradiance", GroundIrradiance.class, GroundIrradiance.SHADED);
        double patchM = c.positive("patch_m", Study.DEFAULT_PATCH_M, 0, 100);
        int rays = c.integer("rays", Study.DEFAULT_RAYS, 1, Study.MAX_RAYS);
        SkyModel sky = SkyModels.byName(c.oneOf("sky", SkyModels.names(), SkyModels.standard().name()), "sky");
        TimeBaseChoice timeBase = c.choice("time_base", TimeBaseChoice.values(), TimeBaseChoice::label, TimeBaseChoice.AUTO);
        int sunBins = c.integer("sun_bins", Study.DEFAULT_SUN_BINS, 16, 1 << 20);
        int step = c.integer("step_minutes", Study.DEFAULT_STEP_MINUTES, 1, 60);
        if (60 % step != 0) throw c.error("step_minutes", "expected a whole number of minutes that divides 60 (1, 2, 3, 4, 5, 6, 10, 12, 15, 20, 30, 60), got " + step);

        JsonCursor o = c.object("outputs");
        Outputs outputs = new Outputs(path(o, "folder", "results", base),
                o.bool("month_hour_csv", false), o.bool("map", true),
                o.integer("map_width_px", Outputs.DEFAULT_MAP_WIDTH, 400, 8000),
                o.integer("map_height_px", Outputs.DEFAULT_MAP_HEIGHT, 300, 8000),
                o.ascendingNumbers("thresholds_kwh_m2", Outputs.DEFAULT_THRESHOLDS, 0, 100_000, 32),
                o.bool("gltf", Outputs.DEFAULT_GLTF),
                o.positive("storey_height_m", Outputs.DEFAULT_STOREY_HEIGHT_M, 0, 100));
        o.finish();
        int threads = c.integer("threads", 0, 0, 4096);
        Study.SunHours sunHours = sunHours(c, climate.year());
        Study.Pv pv = pv(c);
        TerrainSpec terrain = terrain(c, base);
        // shaded ground samples the flat plane: with a DEM the default is unshaded; asking for shaded is an error
        if (terrain.dem() != null && !groundGiven) ground = GroundIrradiance.UNSHADED;
        if (terrain.dem() != null && ground == GroundIrradiance.SHADED) {
            throw c.error("ground_irradiance", "\"shaded\" samples the flat ground plane and cannot be combined with a DEM"
                    + " (terrain.dem); use \"unshaded\" (the terrain then reflects the ground albedo x GHI)");
        }
        Vegetation vegetation = vegetation(c);
        JsonCursor rf = c.object("reflection");
        Study.Reflection reflection = new Study.Reflection(
                rf.positive("tolerance_pct", Study.Reflection.DEFAULTS.tolerancePct(), 0, 100),
                rf.integer("max_bounces", Study.Reflection.DEFAULTS.maxBounces(), 1, Study.Reflection.MAX_BOUNCES),
                rf.integer("rays", Study.Reflection.DEFAULTS.rays(), 1, Study.MAX_RAYS));
        rf.finish();
        c.finish();

        if (name == null || name.isBlank()) name = baseName(source != null ? source : modelFile);
        return new Study(name, description, source, model, site, climate, albedo, ground, patchM, rays, sky,
                timeBase, sunBins, step, outputs, threads, sunHours, pv, terrain, vegetation, reflection);
    }

    /** The {@code terrain} section: far-horizon file, DEM and its placement (docs/study-file.md). */
    private static TerrainSpec terrain(JsonCursor c, Path base) {
        if (c.raw("terrain") == null) return TerrainSpec.NONE;
        JsonCursor k = c.object("terrain");
        Path horizon = k.raw("horizon") != null ? path(k, "horizon", null, base) : null;
        Path dem = k.raw("dem") != null ? path(k, "dem", null, base) : null;
        int epsg = k.integer("dem_epsg", 0, 1024, 999_999);
        double e = k.number("origin_east_m", 0.0, -1e8, 1e8), n = k.number("origin_north_m", 0.0, -1e8, 1e8);
        double r = k.number("near_radius_m", TerrainSpec.DEFAULT_NEAR_RADIUS_M, 0, 50_000);
        boolean fromDem = k.bool("far_horizon_from_dem", true);
        k.finish();
        return new TerrainSpec(horizon, dem, epsg, e, n, r, fromDem);
    }

    /** {@code model.format}, {@code model.epsg} and the {@code model.footprints} section. */
    private static GeoOptions geoOptions(JsonCursor m) {
        GeoOptions.ModelFormat format = m.choice("format", GeoOptions.ModelFormat.values(), GeoOptions.ModelFormat::label,
                GeoOptions.ModelFormat.AUTO);
        int epsg = m.integer("epsg", 0, 1, 999_999);
        JsonCursor f = m.object("footprints");
        GeoOptions o = new GeoOptions(format, epsg, f.string("height_property", GeoOptions.DEFAULT_HEIGHT),
                f.string("storeys_property", GeoOptions.DEFAULT_STOREYS),
                f.positive("storey_height_m", GeoOptions.DEFAULT_STOREY_HEIGHT_M, 0, 100),
                f.string("base_property", GeoOptions.DEFAULT_BASE), f.string("name_property", GeoOptions.DEFAULT_NAME));
        f.finish();
        return o;
    }

    /**
     * The {@code vegetation} section: block-name and material patterns of trees, their leaf habit
     * ({@code kind}) and optionally {@code transmittance}, one number for every month or 12 (January first).
     */
    private static Vegetation vegetation(JsonCursor c) {
        if (!c.has("vegetation")) {
            c.raw("vegetation");
            return Vegetation.NONE;
        }
        JsonCursor v = c.object("vegetation");
        List<String> blocks = v.strings("blocks"), materials = v.strings("materials");
        String kindName = v.oneOf("kind", java.util.Arrays.stream(Vegetation.Kind.values()).map(Vegetation.Kind::label).toList(),
                Vegetation.Kind.DECIDUOUS.label());
        Vegetation.Kind kind = Vegetation.Kind.valueOf(kindName.toUpperCase(java.util.Locale.ROOT));
        double[] t = null;
        com.fasterxml.jackson.databind.JsonNode n = v.raw("transmittance");
        String expected = "expected a transmittance from 0 to 1 (one number, or 12 numbers January to December)";
        if (n != null) {
            if (n.isNumber()) {
                t = new double[12];
                java.util.Arrays.fill(t, v.number("transmittance", null, 0, 1));
            } else if (n.isArray() && n.size() == 12) {
                t = new double[12];
                for (int i = 0; i < 12; i++) {
                    com.fasterxml.jackson.databind.JsonNode e = n.get(i);
                    if (!e.isNumber() || !(e.asDouble() >= 0 && e.asDouble() <= 1)) {
                        throw v.error("transmittance[" + i + "]", expected + ", got " + JsonCursor.shown(e));
                    }
                    t[i] = e.asDouble();
                }
            } else {
                throw v.error("transmittance", expected + ", got " + JsonCursor.shown(n));
            }
        }
        v.finish();
        if (blocks.isEmpty() && materials.isEmpty()) {
            throw c.error("vegetation", "expected vegetation.blocks or vegetation.materials: name patterns of the tree blocks or their materials");
        }
        return new Vegetation(blocks, materials, kind, t);
    }

    /** The {@code sun_hours} section: dates as "MM-DD" (valid in the study's year), step and minimum elevation. */
    private static Study.SunHours sunHours(JsonCursor c, int year) {
        JsonCursor k = c.object("sun_hours");
        List<java.time.MonthDay> dates = new java.util.ArrayList<>();
        if (k.raw("dates") == null) {
            dates.addAll(Study.SunHours.DEFAULT_DATES);
        } else {
            List<String> texts = k.strings("dates");
            if (texts.size() > 12) throw k.error("dates", "expected at most 12 dates, got " + texts.size());
            for (int i = 0; i < texts.size(); i++) {
                String t = texts.get(i).trim();
                java.time.MonthDay d;
                try {
                    if (!t.matches("\\d\\d-\\d\\d")) throw new DateTimeException(t);
                    d = java.time.MonthDay.parse("--" + t);
                } catch (DateTimeException e) {
                    throw k.error("dates[" + i + "]", "expected a date as \"MM-DD\" such as \"03-21\", got \"" + t + "\"");
                }
                if (!d.isValidYear(year)) throw k.error("dates[" + i + "]", t + " does not exist in " + year + " (climate.year)");
                if (dates.contains(d)) throw k.error("dates[" + i + "]", t + " is listed twice");
                dates.add(d);
            }
        }
        int step = k.integer("step_minutes", Study.SunHours.DEFAULT_STEP_MINUTES, 1, 60);
        if (60 % step != 0) throw k.error("step_minutes", "expected a whole number of minutes that divides 60 (1, 2, 3, 4, 5, 6, 10, 12, 15, 20, 30, 60), got " + step);
        double minEl = k.number("min_elevation_deg", Study.SunHours.DEFAULT_MIN_ELEVATION_DEG, 0, 45);
        k.finish();
        return new Study.SunHours(dates, step, minEl);
    }

    /** The {@code pv} section. */
    private static Study.Pv pv(JsonCursor c) {
        JsonCursor k = c.object("pv");
        org.solmass.pv.LayoutOptions d = org.solmass.pv.LayoutOptions.DEFAULTS;
        org.solmass.pv.ModuleSpec m = module(k, d.module());
        if (k.has("module_efficiency")) {
            if (k.has("module") && k.object("module").has("power_w")) {
                throw k.error("module_efficiency", "give either module_efficiency or module.power_w, not both");
            }
            double eff = k.positive("module_efficiency", m.efficiency(), 0, 1);
            m = new org.solmass.pv.ModuleSpec(m.lengthM(), m.widthM(), eff * 1000 * m.areaM2(), m.tempCoeffPerK(), m.bypassSubstrings());
        }
        double gcr = k.positive("ground_coverage_ratio", d.groundCoverageRatio(), 0, 0.95);
        double pitch = k.number("row_pitch_m", 0.0, 0, 100);
        if (k.has("row_pitch_m") && pitch < m.widthM()) {
            throw k.error("row_pitch_m", String.format(java.util.Locale.ROOT,
                    "expected at least the module width %.3f m (rows would overlap), got %s", m.widthM(), k.raw("row_pitch_m")));
        }
        org.solmass.pv.LayoutOptions lo = new org.solmass.pv.LayoutOptions(m,
                k.number("setback_m", d.setbackM(), 0, 50),
                k.number("flat_max_tilt_deg", d.flatMaxTiltDeg(), 0, 30),
                k.number("rack_tilt_deg", d.rackTiltDeg(), 0, 60),
                k.has("rack_azimuth_deg") ? k.number("rack_azimuth_deg", null, 0, 360) % 360 : Double.NaN,
                gcr, pitch,
                k.number("rack_clearance_m", d.rackClearanceM(), 0, 5),
                k.bool("facades", d.facades()),
                k.number("dc_ac_ratio", d.dcAcRatio(), 0.5, 3),
                // percent of DC power lost to soiling, wiring, module quality; the default's exact factor when not given
                k.raw("other_dc_losses_pct") != null ? 1 - k.number("other_dc_losses_pct", null, 0, 50) / 100 : d.dcOtherFactor());
        Study.Pv pv = new Study.Pv(k.number("suitable_pct", Study.Pv.DEFAULT_SUITABLE_PCT, 0, 100),
                k.number("min_zone_m2", Study.Pv.DEFAULT_MIN_ZONE_M2, 0, 1e6),
                m.efficiency(),
                k.positive("performance_ratio", Study.Pv.DEFAULT_PERFORMANCE_RATIO, 0, 1), lo);
        k.finish();
        return pv;
    }

    /** The {@code pv.module} section: the module's datasheet values. */
    private static org.solmass.pv.ModuleSpec module(JsonCursor pv, org.solmass.pv.ModuleSpec d) {
        JsonCursor k = pv.object("module");
        double length = k.positive("length_m", d.lengthM(), 0, 5);
        double width = k.positive("width_m", d.widthM(), 0, 5);
        if (width > length) {
            throw k.error("width_m", String.format(java.util.Locale.ROOT,
                    "expected at most the module length %s m (the width is the short side), got %s", fmtM(length), k.raw("width_m")));
        }
        org.solmass.pv.ModuleSpec m = new org.solmass.pv.ModuleSpec(length, width,
                k.positive("power_w", d.stcPowerW(), 0, 2000),
                k.has("temp_coeff_pct_per_k") ? Math.rint(k.number("temp_coeff_pct_per_k", null, -1.99, 0) * 1e10) / 1e12 : d.tempCoeffPerK(),
                k.integer("substrings", d.bypassSubstrings(), 1, 12));
        k.finish();
        return m;
    }

    private static String fmtM(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v);
    }

    private static Climate climate(JsonCursor c, Path base) {
        JsonNode raw = c.raw("climate");
        if (raw != null && raw.isTextual()) {               // shorthand: "climate": "clear-sky" | "file.csv"
            ObjectNode o = JsonNodeFactory.instance.objectNode();
            o.set("source", raw);
            raw = o;
        }
        if (raw != null && !raw.isObject()) throw c.error("climate", "expected an object { \"source\": ... } or a text value, got " + JsonCursor.shown(raw));
        JsonCursor k = c.child("climate", raw == null ? JsonNodeFactory.instance.objectNode() : raw);
        String source = k.string("source", CLEAR_SKY);
        Path file = source.equalsIgnoreCase(CLEAR_SKY) ? null : k.path("source", source, base);
        ClimateSpec.Format format = k.choice("format", ClimateSpec.Format.values(), ClimateSpec.Format::label,
                ClimateSpec.Format.AUTO);
        Climate climate = new Climate(file, file == null ? ClimateSpec.Format.AUTO : format,   // format is moot for clear-sky
                k.choice("interval_label", ClimateSpec.IntervalLabel.values(), ClimateSpec.IntervalLabel::label,
                        ClimateSpec.IntervalLabel.START),
                fillGaps(k),
                k.integer("year", Climate.DEFAULT_YEAR, 1900, 2100),
                columns(k),
                new ClimateSpec.Reading(k.choice("date_order", ClimateSpec.DateOrder.values(), ClimateSpec.DateOrder::label, null),
                        k.choice("clock", ClimateSpec.Clock.values(), ClimateSpec.Clock::label, ClimateSpec.Clock.STANDARD),
                        k.choice("irradiance_unit", org.solmass.climate.IrradianceUnit.values(),
                                org.solmass.climate.IrradianceUnit::label, null)));
        k.finish();
        return climate;
    }

    /** {@code climate.fill_gaps}: true (= {@link Climate#FILL_GAPS_STEPS} steps), false (= 0) or a number of steps. */
    private static int fillGaps(JsonCursor k) {
        JsonNode n = k.raw("fill_gaps");
        if (n != null && n.isBoolean()) return n.asBoolean() ? Climate.FILL_GAPS_STEPS : 0;
        if (n != null && !n.isNumber()) {
            throw k.error("fill_gaps", "expected true, false or a whole number of steps from 0 to " + Climate.MAX_FILL_GAPS_STEPS
                    + ", got " + JsonCursor.shown(n));
        }
        return k.integer("fill_gaps", 0, 0, Climate.MAX_FILL_GAPS_STEPS);
    }

    /** {@code climate.columns}: role -> header name (text) or 1-based column number. */
    private static Map<String, String> columns(JsonCursor k) {
        JsonCursor m = k.object("columns");
        Map<String, String> out = new java.util.LinkedHashMap<>();
        List<String> roles = ClimateSpec.COLUMN_ROLES;
        for (String role : m.keys()) {
            if (!roles.contains(role)) throw m.error(role, "unknown column role; expected one of " + String.join(", ", roles));
            JsonNode v = m.raw(role);
            if (v != null && v.isNumber() && v.canConvertToExactIntegral()) {
                out.put(role, Integer.toString(m.integer(role, 0, 1, 10_000)));
            } else {
                out.put(role, m.string(role, null));
            }
        }
        m.finish();
        return out;
    }

    private static Path path(JsonCursor o, String key, String dflt, Path base) {
        return o.path(key, o.string(key, dflt), base);
    }

    private static String baseName(Path p) {
        String n = p.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }

    private static ObjectNode parse(Path file) {
        TextInput.requireRegularFile(file, "study file not found", "a study file (JSON)");
        String text;
        try {
            text = TextInput.readAll(file, MAX_FILE_BYTES, "a study file");
        } catch (NoSuchFileException e) {
            throw new InputException(file.toString(), "study file not found");
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read the study file: " + e.getMessage(), e);
        }
        JsonNode n;
        try {
            n = MAPPER.readTree(text);
        } catch (JsonProcessingException e) {
            JsonLocation loc = e.getLocation();
            String where = loc == null ? file.toString() : InputException.at(file, loc.getLineNr());
            throw new InputException(where, "not valid JSON: " + e.getOriginalMessage(), e);
        }
        if (n == null || !n.isObject()) throw new InputException(file.toString(), "expected a JSON object { ... } at the top");
        return (ObjectNode) n;
    }

    /** Deep merge: objects merge key by key, anything else in {@code over} replaces. */
    static void merge(ObjectNode into, ObjectNode over) {
        Iterator<Map.Entry<String, JsonNode>> it = over.fields();
        while (it.hasNext()) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode have = into.get(e.getKey());
            if (have instanceof ObjectNode h && e.getValue() instanceof ObjectNode v) merge(h, v);
            else into.set(e.getKey(), e.getValue().deepCopy());
        }
    }

    /**
     * Checks that every name in model.analyse and model.context is a block of the model.
     *
     * @param blockNames the model's block names
     * @throws InputException naming the study file and key (or the flag, for a study made from flags)
     */
    public static void checkBlockNames(Study study, List<String> blockNames) {
        String[] keys = {"analyse", "context"};
        List<List<String>> lists = List.of(study.model().analyse(), study.model().context());
        for (int k = 0; k < 2; k++) {
            List<String> names = lists.get(k);
            for (int i = 0; i < names.size(); i++) {
                if (blockNames.contains(names.get(i))) continue;
                String where = study.source() == null ? "--" + keys[k] : study.source() + ": model." + keys[k] + "[" + i + "]";
                String have = String.join(", ", blockNames.subList(0, Math.min(20, blockNames.size())))
                        + (blockNames.size() > 20 ? ", ..." : "");
                throw new InputException(where, "no block named \"" + names.get(i) + "\" in the model (it has: " + have + ")");
            }
        }
    }

}
