package org.solmass.study;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.TextInput;

import java.nio.file.Path;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Command-line flags laid over a study file (flags win). Each value is stored under its study key
 * path, so the reader checks it exactly like a key of the file, but an error names the flag
 * ({@code --lat: expected a number from -90 to 90, got 95}). Relative paths given as flags resolve
 * against the working directory, not the study file's folder.
 *
 * <pre>{@code
 * Study s = StudyReader.read(file, new StudyOverrides().latitude(52.5).rays(256));
 * Study t = StudyReader.read(null, new StudyOverrides().model(obj).latitude(52.5).longitude(13.4).zone("+01:00"));
 * }</pre>
 */
public final class StudyOverrides {
    /** Flags of the {@code analyse} command for the keys a study without a file must have. */
    static final Map<String, String> REQUIRED_FLAGS = Map.of(
            "model.file", "--model", "site.latitude", "--lat", "site.longitude", "--lon", "site.zone", "--zone");

    private final ObjectNode tree = JsonNodeFactory.instance.objectNode();
    private final Map<String, String> flagOfKey = new LinkedHashMap<>();

    /**
     * Sets any study key from a flag.
     *
     * @param flag the flag as the user typed it, for messages ("--lat")
     * @param keyPath the study key path ("site.latitude")
     * @param value a String, Number, Boolean, Path (made absolute against the working directory),
     *              Map (an object of texts) or List of Strings; null (and an empty list, as picocli gives for an absent
     *              repeatable option) leaves the key as it is
     */
    public StudyOverrides set(String flag, String keyPath, Object value) {
        if (value == null || (value instanceof List<?> l && l.isEmpty())) return this;
        String[] parts = keyPath.split("\\.");
        ObjectNode o = tree;
        for (int i = 0; i < parts.length - 1; i++) {
            JsonNode child = o.get(parts[i]);
            o = child instanceof ObjectNode c ? c : o.putObject(parts[i]);
        }
        o.set(parts[parts.length - 1], toNode(value));
        flagOfKey.put(keyPath, flag);
        return this;
    }

    private static JsonNode toNode(Object v) {
        JsonNodeFactory f = JsonNodeFactory.instance;
        if (v instanceof Path p) return f.textNode(p.toAbsolutePath().normalize().toString());
        if (v instanceof String s) return f.textNode(s);
        if (v instanceof Boolean b) return f.booleanNode(b);
        if (v instanceof Integer i) return f.numberNode(i);
        if (v instanceof Long l) return f.numberNode(l);
        if (v instanceof Number n) return f.numberNode(n.doubleValue());
        if (v instanceof Map<?, ?> map) {
            ObjectNode o = f.objectNode();
            map.forEach((k, e) -> o.put(String.valueOf(k), String.valueOf(e)));
            return o;
        }
        if (v instanceof List<?> list) {
            ArrayNode a = f.arrayNode();
            for (Object e : list) a.add(String.valueOf(e));
            return a;
        }
        throw new IllegalArgumentException("unsupported override value " + v.getClass());
    }

    public StudyOverrides model(Path obj) { return set("--model", "model.file", obj); }
    public StudyOverrides up(String axis) { return set("--up", "model.up", axis); }
    public StudyOverrides unit(String unit) { return set("--unit", "model.unit", unit); }
    public StudyOverrides northDeg(Double deg) { return set("--north", "model.north_deg", deg); }
    /** The model file's format: auto, obj, geojson or citygml. */
    public StudyOverrides modelFormat(String format) { return set("--format", "model.format", format); }
    /** EPSG code of the model file's coordinates. */
    public StudyOverrides epsg(Integer code) { return set("--epsg", "model.epsg", code); }
    public StudyOverrides analyse(List<String> blocks) { return set("--analyse", "model.analyse", blocks); }
    public StudyOverrides context(List<String> blocks) { return set("--context", "model.context", blocks); }
    public StudyOverrides latitude(Double deg) { return set("--lat", "site.latitude", deg); }
    public StudyOverrides longitude(Double deg) { return set("--lon", "site.longitude", deg); }
    public StudyOverrides elevationM(Double m) { return set("--elevation", "site.elevation_m", m); }
    public StudyOverrides zone(String zone) { return set("--zone", "site.zone", zone); }

    /** {@code clear-sky} or a weather file (relative to the working directory). */
    public StudyOverrides climate(String source) {
        if (source == null) return this;
        return set("--climate", "climate.source",
                source.equalsIgnoreCase(StudyReader.CLEAR_SKY) ? StudyReader.CLEAR_SKY : TextInput.path(source, "--climate"));
    }

    public StudyOverrides climateFormat(String format) { return set("--climate-format", "climate.format", format); }
    public StudyOverrides climateYear(Integer year) { return set("--year", "climate.year", year); }
    public StudyOverrides stepMinutes(Integer minutes) { return set("--step-minutes", "step_minutes", minutes); }
    public StudyOverrides intervalLabel(String label) { return set("--interval-label", "climate.interval_label", label); }
    /** Longest gap of an hourly file filled, steps (0 = never). */
    public StudyOverrides fillGaps(Integer maxSteps) { return set("--fill-gaps", "climate.fill_gaps", maxSteps); }

    public StudyOverrides dateOrder(String order) { return set("--date-order", "climate.date_order", order); }
    public StudyOverrides clock(String clock) { return set("--clock", "climate.clock", clock); }
    public StudyOverrides irradianceUnit(String unit) { return set("--irradiance-unit", "climate.irradiance_unit", unit); }

    /** Column roles of an hourly file, "time=1,ghi=GlobHor" (role=header name or 1-based column number). */
    public StudyOverrides columns(String text) {
        if (text == null) return this;
        return set("--columns", "climate.columns", org.solmass.climate.ClimateSpec.parseColumns(text, "--columns"));
    }

    public StudyOverrides patchM(Double m) { return set("--patch", "patch_m", m); }
    public StudyOverrides rays(Integer n) { return set("--rays", "rays", n); }
    /** Hemisphere rays that sample reflected light (key {@code reflection.rays}). */
    public StudyOverrides reflectionRays(Integer n) { return set("--reflection-rays", "reflection.rays", n); }
    /** The most reflection bounces (key {@code reflection.max_bounces}). */
    public StudyOverrides maxBounces(Integer n) { return set("--max-bounces", "reflection.max_bounces", n); }
    /** Reflection stops after a bounce adding at most this percentage (key {@code reflection.tolerance_pct}). */
    public StudyOverrides bounceTolerancePct(Double pct) { return set("--bounce-tolerance", "reflection.tolerance_pct", pct); }
    public StudyOverrides sky(String model) { return set("--sky", "sky", model); }
    public StudyOverrides timeBase(String base) { return set("--time-base", "time_base", base); }
    /** Ground albedo. */
    public StudyOverrides albedo(Double a) { return set("--albedo", "albedo.ground", a); }
    public StudyOverrides out(Path folder) { return set("--out", "outputs.folder", folder); }
    public StudyOverrides monthHourCsv(Boolean on) { return set("--month-hour", "outputs.month_hour_csv", on); }
    public StudyOverrides threads(Integer n) { return set("--threads", "threads", n); }
    /** Dates "MM-DD" of the sun-hour metric (replace the study file's list). */
    public StudyOverrides sunHoursDates(List<String> dates) { return set("--sun-hours-date", "sun_hours.dates", dates); }
    public StudyOverrides gltf(Boolean on) { return set("--gltf", "outputs.gltf", on); }

    /** The overrides as a JSON tree shaped like a study file. */
    ObjectNode tree() { return tree; }

    /** Key path -> flag it came from. */
    Map<String, String> flags() { return Collections.unmodifiableMap(flagOfKey); }

    public boolean isEmpty() { return flagOfKey.isEmpty(); }
}
