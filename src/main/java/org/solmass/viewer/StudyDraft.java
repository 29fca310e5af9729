package org.solmass.viewer;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.InputException;
import org.solmass.model.LengthUnit;
import org.solmass.model.UpAxis;
import org.solmass.sky.SkyModels;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.study.StudyWriter;

import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.time.DateTimeException;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * What the new-study set-up has gathered: the values as the user typed them, checked field by field
 * in the window's words, and turned into a {@link Study} through the study file's own reader
 * ({@link StudyReader#fromTree}), so a set-up and a study file mean the same thing. No JavaFX here.
 */
final class StudyDraft {
    /** The fields of the set-up; an error belongs to one of them and is shown beside it. */
    enum Field { NAME, MODEL, BLOCKS, LATITUDE, LONGITUDE, ZONE, ELEVATION, CLIMATE, SKY, PATCH, RAYS, RESULTS, STUDY_FILE }

    /** Raised when the draft is not yet a study: one message per field, in the window's words. */
    static final class Incomplete extends Exception {
        final Map<Field, String> errors;

        Incomplete(Map<Field, String> errors) {
            super(errors.toString());
            this.errors = errors;
        }
    }

    final Path modelFile;
    final List<String> blocks;
    final boolean[] analysed;
    String name;
    UpAxis up = UpAxis.Z;
    LengthUnit unit = LengthUnit.M;
    String latitude = "", longitude = "", zone = "", elevation = "0";
    boolean clearSky = true;
    String climateFile = "";
    String sky = SkyModels.standard().name();
    String patch = fmt(Study.DEFAULT_PATCH_M), rays = Integer.toString(Study.DEFAULT_RAYS);
    boolean map = true, gltf = Study.Outputs.DEFAULT_GLTF, monthHour = true;
    String resultsFolder, studyFile;

    /** A draft for a model: every block analysed, clear sky, the defaults of the study file. */
    StudyDraft(Path modelFile, List<String> blocks) {
        this.modelFile = modelFile.toAbsolutePath().normalize();
        this.blocks = List.copyOf(blocks);
        this.analysed = new boolean[blocks.size()];
        java.util.Arrays.fill(analysed, true);
        String base = baseName(this.modelFile);
        name = base;
        Path dir = this.modelFile.getParent();
        resultsFolder = dir.resolve(base + "-results").toString();
        studyFile = dir.resolve(base + "-study.json").toString();
    }

    /** Sets which blocks are analysed after the model was read again (new up axis or unit keeps the names). */
    void toggle(int block) {
        analysed[block] = !analysed[block];
    }

    int analysedCount() {
        int n = 0;
        for (boolean a : analysed) if (a) n++;
        return n;
    }

    /** Field errors of the values as typed (empty when the draft can become a study). */
    Map<Field, String> check() {
        Map<Field, String> e = new EnumMap<>(Field.class);
        if (name == null || name.isBlank()) e.put(Field.NAME, "Give the study a name.");
        if (analysedCount() == 0) e.put(Field.BLOCKS, "Pick at least one block to analyse; the others stay as context.");
        number(e, Field.LATITUDE, latitude, -90, 90, "Latitude is degrees north, from -90 (south pole) to 90 (north pole)");
        number(e, Field.LONGITUDE, longitude, -180, 180, "Longitude is degrees east, from -180 to 180 (west is negative)");
        number(e, Field.ELEVATION, elevation, -500, 9000, "Elevation is metres above sea level, from -500 to 9000");
        if (zone.isBlank()) {
            e.put(Field.ZONE, "Pick the site's time zone from the list, or type an offset such as +01:00.");
        } else if (zoneId(zone) == null) {
            e.put(Field.ZONE, "\"" + zone.trim() + "\" is not a time zone: pick one from the list, or type an offset such as +01:00.");
        }
        if (!clearSky) {
            Path f = path(climateFile);
            if (climateFile.isBlank()) e.put(Field.CLIMATE, "Choose a climate file, or use the clear sky.");
            else if (f == null || !Files.isRegularFile(f)) e.put(Field.CLIMATE, "No climate file at " + climateFile.trim() + ".");
        }
        if (SkyModels.find(sky) == null) e.put(Field.SKY, "Choose a sky model from the list.");
        double p = parse(patch);
        if (!(p > 0 && p <= 100)) e.put(Field.PATCH, "Patch size is the edge of a patch in metres, more than 0 and at most 100.");
        double r = parse(rays);
        if (!(r >= 1 && r <= (1 << 20) && r == Math.rint(r))) e.put(Field.RAYS, "Rays per patch is a whole number from 1 to 1,048,576.");
        if (resultsFolder == null || resultsFolder.isBlank() || path(resultsFolder) == null) e.put(Field.RESULTS, "Give a folder for the results.");
        if (studyFile == null || studyFile.isBlank() || path(studyFile) == null) e.put(Field.STUDY_FILE, "Give a file name for the study.");
        else if (!studyFile.trim().toLowerCase(Locale.ROOT).endsWith(".json")) e.put(Field.STUDY_FILE, "The study file name ends in .json.");
        return e;
    }

    /** The draft as a study file's JSON tree (the keys of docs/study-file.md; relative to nothing: paths are absolute). */
    ObjectNode tree() {
        ObjectNode root = JsonNodeFactory.instance.objectNode();
        root.put("name", name.trim());
        ObjectNode m = root.putObject("model");
        m.put("file", modelFile.toString());
        m.put("up", Study.Named.labelOf(up));
        m.put("unit", Study.Named.labelOf(unit));
        ArrayNode an = m.putArray("analyse"), cx = m.putArray("context");
        for (int i = 0; i < blocks.size(); i++) (analysed[i] ? an : cx).add(blocks.get(i));
        ObjectNode s = root.putObject("site");
        s.put("latitude", parse(latitude));
        s.put("longitude", parse(longitude));
        s.put("elevation_m", parse(elevation));
        ZoneId z = zoneId(zone);
        s.put("zone", z == null ? zone.trim() : z.getId());
        root.putObject("climate").put("source", clearSky ? StudyReader.CLEAR_SKY : path(climateFile).toString());
        root.put("patch_m", parse(patch));
        root.put("rays", (int) parse(rays));
        root.put("sky", sky);
        ObjectNode o = root.putObject("outputs");
        o.put("folder", path(resultsFolder).toString());
        o.put("month_hour_csv", monthHour);
        o.put("map", map);
        o.put("gltf", gltf);
        return root;
    }

    /**
     * The study this draft describes, read by the study file's reader (its defaults for every key the
     * set-up does not show).
     *
     * @throws Incomplete with one message per field when a value is missing or out of range
     */
    Study study() throws Incomplete {
        Map<Field, String> e = check();
        if (!e.isEmpty()) throw new Incomplete(e);
        Path file = path(studyFile);
        try {
            return StudyReader.fromTree(tree(), file, file.getParent(), "set-up");
        } catch (InputException ex) {   // a rule of the study file the checks above do not know
            Map<Field, String> one = new EnumMap<>(Field.class);
            one.put(fieldOf(ex.getMessage()), GuiWords.of(ex.getMessage().replaceFirst("^set-up: [a-z_.\\[\\]0-9]+: ", "")));
            throw new Incomplete(one);
        }
    }

    /** The study file text Save writes (the same writer as a variant's study.json). */
    String studyText() throws Incomplete {
        return StudyWriter.toJson(study());
    }

    private static Field fieldOf(String message) {
        String m = message == null ? "" : message;
        if (m.contains("site.latitude")) return Field.LATITUDE;
        if (m.contains("site.longitude")) return Field.LONGITUDE;
        if (m.contains("site.zone")) return Field.ZONE;
        if (m.contains("site.elevation")) return Field.ELEVATION;
        if (m.contains("climate")) return Field.CLIMATE;
        if (m.contains("patch_m")) return Field.PATCH;
        if (m.contains("rays")) return Field.RAYS;
        if (m.contains("outputs")) return Field.RESULTS;
        if (m.contains("model.analyse") || m.contains("model.context")) return Field.BLOCKS;
        if (m.contains("sky")) return Field.SKY;
        if (m.contains("model")) return Field.MODEL;
        return Field.NAME;
    }

    private static void number(Map<Field, String> e, Field f, String text, double lo, double hi, String rule) {
        double v = parse(text);
        if (text.isBlank()) e.put(f, rule + ".");
        else if (Double.isNaN(v)) e.put(f, "\"" + text.trim() + "\" is not a number. " + rule + ".");
        else if (v < lo || v > hi) e.put(f, rule + "; " + text.trim() + " is outside.");
    }

    /** A number as typed, with a point or (alone) a comma as decimal mark; NaN when it is none. */
    static double parse(String s) {
        if (s == null) return Double.NaN;
        String t = s.trim();
        if (t.indexOf(',') >= 0 && t.indexOf('.') < 0 && t.indexOf(',') == t.lastIndexOf(',')) t = t.replace(',', '.');
        try {
            double v = Double.parseDouble(t);
            return Double.isFinite(v) ? v : Double.NaN;
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    /** An IANA zone or an offset ("+01:00", "UTC+1", "-5"); null when it is neither. */
    static ZoneId zoneId(String s) {
        String t = s == null ? "" : s.trim();
        if (t.isEmpty()) return null;
        try {
            return ZoneId.of(t);
        } catch (DateTimeException e) {
            try {
                String off = t.replaceFirst("^(?i)(UTC|GMT)", "");
                if (off.matches("[+-]\\d{1,2}")) off = off.charAt(0) + String.format(Locale.ROOT, "%02d", Integer.parseInt(off.substring(1))) + ":00";
                return java.time.ZoneOffset.of(off);
            } catch (DateTimeException | NumberFormatException e2) {
                return null;
            }
        }
    }

    static Path path(String s) {
        if (s == null || s.isBlank()) return null;
        try {
            return Path.of(s.trim()).toAbsolutePath().normalize();
        } catch (InvalidPathException e) {
            return null;
        }
    }

    static String fmt(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }

    private static String baseName(Path p) {
        String n = p.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }

    /** The block names as listed (analysed first is not implied; the model's order). */
    List<String> analysedNames() {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < blocks.size(); i++) if (analysed[i]) out.add(blocks.get(i));
        return out;
    }
}
