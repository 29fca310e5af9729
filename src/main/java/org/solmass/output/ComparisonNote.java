package org.solmass.output;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.Cautions;
import org.solmass.study.Study;
import org.solmass.sun.Site;
import org.solmass.sun.SunPath;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;

/**
 * What {@code compare} writes as compare.json beside delta.csv: the two runs (ids, study names,
 * folders) and the settings in which they differ other than the geometry, each with the caution it
 * calls for. Differences of annual irradiation between a clear-sky and a weather-file run, or between
 * two sky models, are differences of the inputs, not of the massing; the note says so instead of
 * letting a delta speak for the design. Layout: docs/outputs.md; the fields and tolerances:
 * docs/metrics.md.
 *
 * @param runA the reference run
 * @param runB the other run
 * @param differences the differing settings, in a fixed order (site, zone, climate, sky, time base, patch size)
 */
public record ComparisonNote(PublishedRun runA, PublishedRun runB, List<Difference> differences) {
    public static final String FILE_NAME = "compare.json";
    /**
     * Two sites within this many degrees of latitude and of longitude count as one (about 1 km
     * north-south): the sun's position differs by about as much, under 0.01 degree (common practice:
     * a site is given to two decimals of a degree).
     */
    public static final double SITE_TOLERANCE_DEG = 0.01;
    /** Two patch sizes within this many metres count as one (a rounding of the study file). */
    public static final double PATCH_TOLERANCE_M = 1e-9;

    /**
     * One setting in which the two runs differ.
     *
     * @param field the setting's study key ("site", "zone", "climate", "sky", "time_base", "patch_m")
     * @param a its value in run A, as text
     * @param b its value in run B, as text
     * @param caution what the difference means for the compared values
     */
    public record Difference(String field, String a, String b, String caution) {
        /** One line for the terminal: "sky differs (A perez, B isotropic): ...". */
        public String message() {
            return field + " differs (A " + a + ", B " + b + "): " + caution;
        }
    }

    public ComparisonNote {
        differences = Collections.unmodifiableList(new ArrayList<>(differences));
    }

    /** The settings in which two opened runs differ (run.json's resolved studies and time bases). */
    public static ComparisonNote of(PublishedRun a, PublishedRun b) {
        Study sa = a.record().study(), sb = b.record().study();
        List<Difference> d = new ArrayList<>();
        Site pa = sa.site(), pb = sb.site();
        if (Math.abs(pa.latitudeDeg() - pb.latitudeDeg()) > SITE_TOLERANCE_DEG
                || Math.abs(pa.longitudeDeg() - pb.longitudeDeg()) > SITE_TOLERANCE_DEG) {
            d.add(new Difference("site", latLon(pa), latLon(pb), "the sun's path differs between the runs; the deltas mix "
                    + "the change of place with the change of massing"));
        }
        var oa = pa.standardOffset(SunPath.AVERAGE_DAY_YEAR);
        var ob = pb.standardOffset(SunPath.AVERAGE_DAY_YEAR);
        if (!oa.equals(ob)) {
            d.add(new Difference("zone", pa.zone() + " (" + oa + ")", pb.zone() + " (" + ob + ")", "local standard time differs, "
                    + "so hourly and month-hour values and sun hours on dates are shifted between the runs"));
        }
        String ca = climate(sa), cb = climate(sb);
        if (!ca.equals(cb)) {
            d.add(new Difference("climate", ca, cb, "the weather differs between the runs; irradiation deltas show the change "
                    + "of weather, not only of massing"));
        }
        if (!sa.sky().name().equals(sb.sky().name())) {
            d.add(new Difference("sky", sa.sky().name(), sb.sky().name(), "the diffuse sky model differs; irradiation deltas "
                    + "include the difference between the sky models"));
        }
        if (!a.record().timeBase().equals(b.record().timeBase())) {
            d.add(new Difference("time_base", a.record().timeBase(), b.record().timeBase(), "average days and an hourly year "
                    + "sum the sun differently; irradiation and sunshine-hour deltas include that difference"));
        }
        if (Math.abs(sa.patchM() - sb.patchM()) > PATCH_TOLERANCE_M) {
            d.add(new Difference("patch_m", metres(sa.patchM()), metres(sb.patchM()), "patches of different sizes are matched "
                    + "by position; a matched pair covers different areas, and deltas include the change of resolution"));
        }
        return new ComparisonNote(a, b, d);
    }

    /** Whether the runs differ in any setting besides the geometry. */
    public boolean hasDifferences() {
        return !differences.isEmpty();
    }

    /** compare.json's content. */
    public ObjectNode toTree() {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.set("a", run(runA));
        o.set("b", run(runB));
        ArrayNode diffs = o.putArray("differing_settings");
        for (Difference x : differences) {
            ObjectNode e = diffs.addObject();
            e.put("field", x.field());
            e.put("a", x.a());
            e.put("b", x.b());
        }
        ArrayNode cautions = o.putArray("cautions");
        for (Difference x : differences) cautions.add(x.message());
        cautions.add(Cautions.RESULTS);
        return o;
    }

    /** Writes compare.json (atomically). */
    public void write(Path file) {
        AtomicFiles.writeString(file, org.solmass.study.StudyWriter.pretty(toTree()));
    }

    private static ObjectNode run(PublishedRun r) {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.put("folder", r.folder().toAbsolutePath().normalize().toString());
        if (r.runId() != null) o.put("run_id", r.runId()); else o.putNull("run_id");
        o.put("study", r.record().study().name());
        return o;
    }

    /** "clear-sky" or the climate file's absolute, normalised path. */
    static String climate(Study s) {
        return s.climate().isClearSky() ? "clear-sky" : s.climate().file().toAbsolutePath().normalize().toString();
    }

    private static String latLon(Site s) {
        return String.format(Locale.ROOT, "%.4f N %.4f E", s.latitudeDeg(), s.longitudeDeg());
    }

    private static String metres(double m) {
        return String.format(Locale.ROOT, "%s m", m);
    }
}
