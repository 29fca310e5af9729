package org.solmass.robust;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The bad inputs of docs/bad-inputs.md: files written into a fresh folder ({@code @} in an argument
 * stands for it) and the command line. All sites and models are invented.
 */
final class BadInputCases {
    record Case(Map<String, String> files, String[] args) {}

    static final Map<String, Case> CASES = new LinkedHashMap<>();

    private BadInputCases() {}

    private static final String MODEL = BadInputCatalogueTest.TWO_BOXES;
    private static final String[] SITE = {"--lat", "51", "--lon", "10", "--zone", "Europe/Berlin"};

    /** analyse with the two-box model, the invented site, few rays, plus {@code extra}. */
    private static String[] analyse(String... extra) {
        List<String> a = new ArrayList<>(List.of("analyse", "-q", "--model", "@m.obj", "--out", "@out"));
        a.addAll(Arrays.asList(extra));
        return a.toArray(String[]::new);
    }

    private static String[] withSite(String... extra) {
        List<String> a = new ArrayList<>(Arrays.asList(SITE));
        a.addAll(Arrays.asList(extra));
        return analyse(a.toArray(String[]::new));
    }

    private static void obj(String id, String objText) {
        CASES.put(id, new Case(Map.of("m.obj", objText), withSite("--rays", "16")));
    }

    private static void climate(String id, String csv) {
        CASES.put(id, new Case(Map.of("m.obj", MODEL, "w.csv", csv), withSite("--rays", "16", "--climate", "@w.csv")));
    }

    private static void study(String id, String json) {
        CASES.put(id, new Case(Map.of("m.obj", MODEL, "s.json", json), new String[] {"analyse", "-q", "@s.json"}));
    }

    private static void flags(String id, String... args) {
        CASES.put(id, new Case(Map.of("m.obj", MODEL), args));
    }

    /** A valid study with {@code extra} JSON members added at the top level (or replacing site). */
    private static String studyJson(String site, String extra) {
        return "{\n  \"model\": {\"file\": \"m.obj\"},\n  \"site\": " + site + ",\n  \"rays\": 16" + extra + "\n}\n";
    }

    private static final String GOOD_SITE = "{\"latitude\": 51, \"longitude\": 10, \"zone\": \"Europe/Berlin\"}";

    static {
        // OBJ files
        CASES.put("obj-missing-file", new Case(Map.of(), withSite()));
        obj("obj-empty", "");
        obj("obj-no-faces", "v 0 0 0\nv 1 0 0\nv 0 1 0\n");
        obj("obj-vertex-two-coordinates", "v 0 0 0\nv 1 0\nv 0 1 0\nf 1 2 3\n");
        obj("obj-vertex-not-a-number", "v 0 0 0\nv 1 0 0\nv 0 one 0\nf 1 2 3\n");
        obj("obj-vertex-not-finite", "v 0 0 0\nv 1 0 Infinity\nv 0 1 0\nf 1 2 3\n");
        obj("obj-face-index-zero", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 0 1 2\n");
        obj("obj-face-index-out-of-range", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 4\n");
        obj("obj-face-relative-index-before-first", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf -1 -2 -4\n");
        obj("obj-face-two-vertices", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2\n");
        obj("obj-face-index-not-integer", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3.5\n");
        obj("obj-all-faces-degenerate", "v 0 0 0\nv 1 0 0\nv 2 0 0\nf 1 2 3\n");
        CASES.put("obj-only-context-blocks", new Case(Map.of("m.obj", MODEL), withSite("--context", "west,east")));
        CASES.put("obj-unknown-analysed-block", new Case(Map.of("m.obj", MODEL), withSite("--analyse", "north")));

        // climate files
        climate("climate-empty", "# only a comment\n");
        climate("climate-unknown-header", "date,global\n2025-01-01,3\n");
        climate("climate-month-hour-month-13", "month,hour,ghi_wm2,dhi_wm2\n13,0,0,0\n");
        climate("climate-month-hour-twice", "month,hour,ghi_wm2,dhi_wm2\n1,0,0,0\n1,0,0,0\n");
        climate("climate-month-hour-missing-row", "month,hour,ghi_wm2,dhi_wm2\n1,0,0,0\n");
        climate("climate-month-hour-not-a-number", "month,hour,ghi_wm2,dhi_wm2\n1,0,dark,0\n");
        climate("climate-month-hour-missing-column", "month,hour,ghi_wm2\n1,0,0\n");
        climate("climate-monthly-negative", monthly("-0.5"));
        climate("climate-monthly-above-extraterrestrial", monthly("12"));
        climate("climate-hourly-bad-timestamp", "time,ghi_wm2\n2025-01-01T00:00,0\n01/01/2025 01:00,0\n");
        climate("climate-hourly-not-increasing", "time,ghi_wm2\n2025-01-01T00:00,0\n2025-01-01T01:00,0\n2025-01-01T01:00,0\n");
        climate("climate-hourly-gap", "time,ghi_wm2\n2025-01-01T00:00,0\n2025-01-01T01:00,0\n2025-01-01T05:00,0\n");
        climate("climate-hourly-step-not-dividing-an-hour", "time,ghi_wm2\n2025-01-01T00:00,0\n2025-01-01T00:45,0\n");
        climate("climate-hourly-no-irradiance-column", "time,dhi_wm2\n2025-01-01T00:00,0\n2025-01-01T01:00,0\n");
        climate("climate-row-more-cells-than-header", "time,ghi_wm2,dhi_wm2\n2025-01-01T00:00,0,0\n2025-01-01T01:00,0,5,0,0\n");
        climate("climate-ambiguous-date-order", "time,ghi_wm2\n01/02/2025 00:00,0\n01/02/2025 01:00,0\n");
        climate("climate-unknown-unit-in-header", "time,GHI (W/ft2)\n2025-01-01T00:00,0\n2025-01-01T01:00,0\n");
        climate("climate-year-3001", "time,ghi_wm2\n3001-01-01T00:00,0\n3001-01-01T01:00,0\n");
        climate("climate-header-column-twice", "time,ghi,dhi,ghi\n2025-01-01T00:00,0,0,0\n2025-01-01T01:00,0,0,0\n");
        climate("climate-line-too-long", "time,ghi_wm2\n" + "0".repeat(70_000) + "\n");
        climate("climate-row-fewer-cells-than-header", "time,ghi_wm2,dhi_wm2\n2025-01-01T00:00,0\n2025-01-01T01:00,0,0\n");
        climate("climate-unclosed-quote", "time,ghi_wm2\n\"2025-01-01T00:00,0\n2025-01-01T01:00,0\n");
        climate("climate-mixed-decimal-marks", "time;ghi_wm2\n2025-01-01T00:00;0,5\n2025-01-01T01:00;0.5\n");
        CASES.put("climate-missing-file", new Case(Map.of("m.obj", MODEL), withSite("--climate", "@nowhere.csv")));

        // study files
        CASES.put("study-missing-file", new Case(Map.of(), new String[] {"analyse", "@nothere.json"}));
        study("study-not-json", "{\"model\": {\"file\": \"m.obj\"},\n \"site\": {\"latitude\": 51,,}\n}\n");
        study("study-latitude-95", studyJson("{\"latitude\": 95, \"longitude\": 10, \"zone\": \"Europe/Berlin\"}", ""));
        study("study-latitude-missing", studyJson("{\"longitude\": 10, \"zone\": \"Europe/Berlin\"}", ""));
        study("study-unknown-time-zone", studyJson("{\"latitude\": 51, \"longitude\": 10, \"zone\": \"Europe/Veldhaven\"}", ""));
        study("study-patch-zero", studyJson(GOOD_SITE, ",\n  \"patch_m\": 0"));
        study("study-patch-negative", studyJson(GOOD_SITE, ",\n  \"patch_m\": -2"));
        study("study-rays-zero", studyJson(GOOD_SITE, ",\n  \"rays\": 0").replace("\"rays\": 16,", ""));
        study("study-unknown-key", studyJson(GOOD_SITE, ",\n  \"ray_count\": 64"));
        study("study-unknown-sky", studyJson(GOOD_SITE, ",\n  \"sky\": \"cloudy\""));
        study("study-unknown-block", "{\n  \"model\": {\"file\": \"m.obj\", \"analyse\": [\"west\", \"tower\"]},\n  \"site\": "
                + GOOD_SITE + "\n}\n");
        study("study-block-analysed-and-context", "{\n  \"model\": {\"file\": \"m.obj\", \"analyse\": [\"west\"], \"context\": [\"west\"]},\n  \"site\": "
                + GOOD_SITE + "\n}\n");

        // command-line flags
        flags("flag-nothing-given", "analyse");
        flags("flag-unknown", "analyse", "--raytrace", "@m.obj");
        flags("flag-rays-not-a-number", "analyse", "--model", "@m.obj", "--rays", "many");
        flags("flag-latitude-95", analyse("--lat", "95", "--lon", "10", "--zone", "Europe/Berlin"));
        flags("flag-unknown-time-zone", analyse("--lat", "51", "--lon", "10", "--zone", "CET+1"));
        flags("flag-missing-zone", analyse("--lat", "51", "--lon", "10"));
        flags("flag-patch-zero", withSite("--patch", "0"));
        flags("flag-patch-negative", withSite("--patch", "-1"));
        flags("flag-rays-zero", withSite("--rays", "0"));
        flags("flag-unknown-unit", withSite("--unit", "furlong"));
        flags("flag-unknown-up-axis", withSite("--up", "x"));
        flags("flag-threads-negative", withSite("--threads", "-2"));
    }

    /** A monthly-means table of the invented Vallmora example with January's GHI replaced. */
    private static String monthly(String januaryGhi) {
        return "month,ghi_kwh_m2_day\n1," + januaryGhi + "\n2,2.43\n3,3.55\n4,4.78\n5,5.68\n6,6.19\n7,6.06\n8,5.25\n9,4.07\n10,2.78\n11,1.77\n12,1.33\n";
    }
}
