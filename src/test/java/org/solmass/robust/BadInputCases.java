package org.solmass.robust;

import org.solmass.fixtures.Boxes;

import java.nio.charset.StandardCharsets;
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
    /** Text files (written as UTF-8), the command line, and files given as bytes (other encodings). */
    record Case(Map<String, String> files, String[] args, Map<String, byte[]> bytes) {
        Case(Map<String, String> files, String[] args) {
            this(files, args, Map.of());
        }
    }

    static final Map<String, Case> CASES = new LinkedHashMap<>();

    /** Prepares a case's folder beyond its files; what it returns is closed after the run. */
    interface Setup {
        AutoCloseable prepare(java.nio.file.Path dir) throws Exception;
    }

    /** Cases that need more than files: a read-only folder, a folder held by another run. */
    static final Map<String, Setup> SETUP = new LinkedHashMap<>();

    /** Cases that only fail for a user without root's rights (root may write into a read-only folder). */
    static final java.util.Set<String> NOT_AS_ROOT = new java.util.HashSet<>();

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

    /** An OBJ model given as bytes. */
    private static void objBytes(String id, byte[] obj) {
        CASES.put(id, new Case(Map.of(), withSite("--rays", "16"), Map.of("m.obj", obj)));
    }

    /** A study file given as bytes. */
    private static void studyBytes(String id, byte[] json) {
        CASES.put(id, new Case(Map.of("m.obj", MODEL), new String[] {"analyse", "-q", "@s.json"}, Map.of("s.json", json)));
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

    /** The 10 m box stretched to {@code widthM} along x (one block "wide"). */
    private static String scaledBox(double widthM) {
        return Boxes.closed(0, 0, 0, 10, 10, 10).obj("wide").replace("v 10.0 ", "v " + widthM + " ");
    }

    private static final String GOOD_SITE = "{\"latitude\": 51, \"longitude\": 10, \"zone\": \"Europe/Berlin\"}";

    static {
        GeoBadInputCases.addTo(CASES);   // geo-referenced models
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
        obj("obj-box-far-from-origin", Boxes.closed(0, 0, 0, 10, 10, 10).obj("far").replace("v 0.0 ", "v 1.0E30 "));
        obj("obj-box-1e200-m-wide", scaledBox(1e200));
        obj("obj-box-wider-than-100-km", scaledBox(150_000));
        obj("obj-bow-tie-roof", Boxes.closed(0, 0, 0, 10, 10, 10).obj("roof")   // the roof is the first face (line 6)
                .replaceFirst("f -4 -3 -2 -1", "f -4 -3 -1 -2"));
        CASES.put("obj-only-context-blocks", new Case(Map.of("m.obj", MODEL), withSite("--context", "west,east")));
        CASES.put("obj-unknown-analysed-block", new Case(Map.of("m.obj", MODEL), withSite("--analyse", "north")));
        // "é" is the byte 0xE9 in ISO/IEC 8859-1 (Latin-1) and Windows-1252; in UTF-8 it starts a 3-byte sequence (RFC 3629)
        objBytes("obj-latin-1-byte", concat(ascii("v 0 0 0\nv 1 0 0\nv 0 1 0\n# caf"), new byte[] {(byte) 0xE9}, ascii("\nf 1 2 3\n")));
        objBytes("obj-utf-16-without-bom", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\n".getBytes(StandardCharsets.UTF_16LE));
        obj("obj-line-over-1-mb", "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3 " + "1 ".repeat(1 << 19) + "\n");
        CASES.put("obj-folder", new Case(Map.of(), withModel("@", SITE)));
        CASES.put("obj-device", new Case(Map.of(), withModel("/dev/zero", SITE)));
        CASES.put("obj-path-nul", new Case(Map.of(), withModel("@m\u0000.obj", SITE)));

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
        climate("climate-hourly-negative-wind", "time,ghi_wm2,wind_ms\n2025-01-01T00:00,0,2\n2025-01-01T01:00,0,-3\n");
        climate("climate-hourly-wind-unit", "time,ghi_wm2,ws (km/h)\n2025-01-01T00:00,0,7\n2025-01-01T01:00,0,9\n");
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
        study("study-pv-gcr-one", studyJson(GOOD_SITE, ",\n  \"pv\": {\"ground_coverage_ratio\": 1}"));
        study("study-pv-row-pitch-below-module-width", studyJson(GOOD_SITE, ",\n  \"pv\": {\"row_pitch_m\": 0.8}"));
        study("study-pv-module-wider-than-long", studyJson(GOOD_SITE, ",\n  \"pv\": {\"module\": {\"length_m\": 1.0, \"width_m\": 1.7}}"));
        study("study-reflection-tolerance-zero", studyJson(GOOD_SITE, ",\n  \"reflection\": {\"tolerance_pct\": 0}"));
        study("study-reflection-max-bounces-zero", studyJson(GOOD_SITE, ",\n  \"reflection\": {\"max_bounces\": 0}"));
        study("study-reflection-rays-zero", studyJson(GOOD_SITE, ",\n  \"reflection\": {\"rays\": 0}"));
        study("study-pv-dc-ac-ratio-above-3", studyJson(GOOD_SITE, ",\n  \"pv\": {\"dc_ac_ratio\": 4}"));
        study("study-pv-other-dc-losses-100", studyJson(GOOD_SITE, ",\n  \"pv\": {\"other_dc_losses_pct\": 100}"));
        study("study-vegetation-transmittance-above-1", studyJson(GOOD_SITE, ",\n  \"vegetation\": {\"blocks\": [\"tree*\"], \"transmittance\": 1.2}"));
        study("study-vegetation-month-negative", studyJson(GOOD_SITE,
                ",\n  \"vegetation\": {\"blocks\": [\"tree*\"], \"transmittance\": [0.6, 0.6, 0.6, 0.4, 0.2, -0.2, 0.2, 0.2, 0.2, 0.4, 0.6, 0.6]}"));
        study("study-unknown-block", "{\n  \"model\": {\"file\": \"m.obj\", \"analyse\": [\"west\", \"tower\"]},\n  \"site\": "
                + GOOD_SITE + "\n}\n");
        study("study-block-analysed-and-context", "{\n  \"model\": {\"file\": \"m.obj\", \"analyse\": [\"west\"], \"context\": [\"west\"]},\n  \"site\": "
                + GOOD_SITE + "\n}\n");
        studyBytes("study-latin-1-byte", concat(ascii("{\n  \"name\": \"Caf"), new byte[] {(byte) 0xE9},
                ascii("\",\n  \"model\": {\"file\": \"m.obj\"},\n  \"site\": " + GOOD_SITE + "\n}\n")));
        studyBytes("study-utf-16-without-bom", studyJson(GOOD_SITE, "").getBytes(StandardCharsets.UTF_16BE));
        study("study-larger-than-16-mb", studyJson(GOOD_SITE, "") + " ".repeat(16 << 20));
        CASES.put("study-folder", new Case(Map.of(), new String[] {"analyse", "-q", "@"}));
        CASES.put("study-device", new Case(Map.of(), new String[] {"analyse", "-q", "/dev/zero"}));
        study("study-model-path-nul", "{\n  \"model\": {\"file\": \"m\\u0000.obj\"},\n  \"site\": " + GOOD_SITE + "\n}\n");
        study("study-climate-path-nul", studyJson(GOOD_SITE, ",\n  \"climate\": {\"source\": \"w\\u0000.csv\"}"));

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
        flags("flag-climate-path-nul", withSite("--climate", "@w\u0000.csv"));

        // the output folder, checked before the work (errors before work; the folder held by one run)
        CASES.put("out-is-a-file", new Case(Map.of("m.obj", MODEL, "out", "a file"), withSite()));
        CASES.put("out-parent-is-a-file", new Case(Map.of("m.obj", MODEL, "f", "a file"), outAt("@f/out")));
        study("out-is-the-study-file", studyJson(GOOD_SITE, ",\n  \"outputs\": {\"folder\": \"s.json\"}"));
        CASES.put("out-root", new Case(Map.of("m.obj", MODEL), outAt("/")));
        CASES.put("out-under-proc", new Case(Map.of("m.obj", MODEL), outAt("/proc/self/results")));
        CASES.put("out-name-too-long", new Case(Map.of("m.obj", MODEL), outAt("@" + "a".repeat(300))));
        CASES.put("out-nul-character", new Case(Map.of("m.obj", MODEL), outAt("@out\0x")));
        CASES.put("out-read-only-folder", new Case(Map.of("m.obj", MODEL), outAt("@ro")));
        SETUP.put("out-read-only-folder", dir -> {
            java.nio.file.Path ro = java.nio.file.Files.createDirectory(dir.resolve("ro"));
            java.nio.file.Files.setPosixFilePermissions(ro, java.nio.file.attribute.PosixFilePermissions.fromString("r-xr-xr-x"));
            return () -> java.nio.file.Files.setPosixFilePermissions(ro, java.nio.file.attribute.PosixFilePermissions.fromString("rwxr-xr-x"));
        });
        NOT_AS_ROOT.add("out-read-only-folder");
        CASES.put("out-in-use", new Case(Map.of("m.obj", MODEL), withSite()));
        SETUP.put("out-in-use", dir -> org.solmass.output.FolderClaim.claim(dir.resolve("out"), "--out", null, "another study"));
        CASES.put("sky-view-out-is-a-file", new Case(Map.of("m.obj", MODEL, "out", "a file"),
                new String[] {"sky-view", "-q", "@m.obj", "--out", "@out"}));

        CASES.put("shadows-out-holds-analyse-run", new Case(Map.of("m.obj", MODEL, "s.json", "{\"name\": \"two boxes (invented)\","
                + " \"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"}}"),
                new String[] {"shadows", "-q", "@s.json", "--out", "@out"}));
        SETUP.put("shadows-out-holds-analyse-run", dir -> {   // what an analyse run leaves: run.json beside patches.csv
            java.nio.file.Path out = java.nio.file.Files.createDirectory(dir.resolve("out"));
            java.nio.file.Files.writeString(out.resolve("run.json"), "{}");
            java.nio.file.Files.writeString(out.resolve("patches.csv"), "patch_id\n");
            return () -> { };
        });

        CASES.put("report-out-not-pdf", new Case(Map.of(), new String[] {"report", "@", "--out", "@r.txt"}));

        // terrain: far-horizon files and DEMs (GeoTIFFs written with the NGA TIFF library, invented heights)
        horizon("horizon-azimuth-not-increasing", "azimuth_deg,elevation_deg\n0,1\n100,2\n90,3\n");
        horizon("horizon-elevation-out-of-range", "azimuth_deg,elevation_deg\n0,1\n100,95\n200,3\n");
        horizon("horizon-too-few-rows", "azimuth_deg,elevation_deg\n0,1\n180,2\n");
        dem("dem-not-covering-site", new org.solmass.terrain.GeoTiffFixture().grid(10, 10, 1000, 1100, 10).bytes());
        dem("dem-no-georeferencing", new org.solmass.terrain.GeoTiffFixture().grid(10, 10, 1000, 1100, 10).noGeoreferencing().bytes());
        dem("dem-nodata-at-site", new org.solmass.terrain.GeoTiffFixture().grid(70, 70, -340, 340, 10).nodata(-9999)
                .heights((x, y) -> Math.hypot(x - 45, y - 5) < 8 ? Double.NaN : 2.0).bytes());
        study("study-dem-with-shaded-ground", studyJson(GOOD_SITE,
                ",\n  \"ground_irradiance\": \"shaded\",\n  \"terrain\": {\"dem\": \"d.tif\"}"));
    }

    private static void horizon(String id, String csv) {
        CASES.put(id, new Case(Map.of("m.obj", MODEL, "h.csv", csv), withSite("--rays", "16", "--horizon", "@h.csv")));
    }

    private static void dem(String id, byte[] tif) {
        CASES.put(id, new Case(Map.of("m.obj", MODEL), withSite("--rays", "16", "--dem", "@d.tif"), Map.of("d.tif", tif)));
    }

    /** analyse with the two-box model and the invented site into {@code out}. */
    private static String[] outAt(String out) {
        List<String> a = new ArrayList<>(List.of("analyse", "-q", "--model", "@m.obj", "--out", out));
        a.addAll(Arrays.asList(SITE));
        return a.toArray(String[]::new);
    }

    /** analyse with {@code model} as --model (not the fresh folder's m.obj), plus {@code extra}. */
    private static String[] withModel(String model, String... extra) {
        List<String> a = new ArrayList<>(List.of("analyse", "-q", "--model", model, "--out", "@out"));
        a.addAll(Arrays.asList(extra));
        return a.toArray(String[]::new);
    }

    private static byte[] ascii(String s) {
        return s.getBytes(StandardCharsets.US_ASCII);
    }

    private static byte[] concat(byte[]... parts) {
        java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
        for (byte[] p : parts) out.writeBytes(p);
        return out.toByteArray();
    }

    /** A monthly-means table of the invented Vallmora example with January's GHI replaced. */
    private static String monthly(String januaryGhi) {
        return "month,ghi_kwh_m2_day\n1," + januaryGhi + "\n2,2.43\n3,3.55\n4,4.78\n5,5.68\n6,6.19\n7,6.06\n8,5.25\n9,4.07\n10,2.78\n11,1.77\n12,1.33\n";
    }
}
