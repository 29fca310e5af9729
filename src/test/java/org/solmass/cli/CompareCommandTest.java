package org.solmass.cli;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The compare command end to end on two tiny analyses (invented two-block scene, clear sky). */
class CompareCommandTest {
    @TempDir Path dir;

    private static final String BOX = "o %s%n"
            + "v %2$s 0 %4$s%nv %3$s 0 %4$s%nv %3$s 8 %4$s%nv %2$s 8 %4$s%nf -4 -3 -2 -1%n"
            + "v %2$s 0 0%nv %3$s 0 0%nv %3$s 0 %4$s%nv %2$s 0 %4$s%nf -4 -3 -2 -1%n"
            + "v %3$s 0 0%nv %3$s 8 0%nv %3$s 8 %4$s%nv %3$s 0 %4$s%nf -4 -3 -2 -1%n"
            + "v %3$s 8 0%nv %2$s 8 0%nv %2$s 8 %4$s%nv %3$s 8 %4$s%nf -4 -3 -2 -1%n"
            + "v %2$s 8 0%nv %2$s 0 0%nv %2$s 0 %4$s%nv %2$s 8 %4$s%nf -4 -3 -2 -1%n";

    private Path analyse(String name, String obj, String... extra) throws Exception {
        Path model = dir.resolve(name + ".obj");
        Files.writeString(model, obj);
        Path out = dir.resolve(name);
        PrintStream old = System.out;
        System.setOut(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
        try {
            List<String> args = new java.util.ArrayList<>(List.of("analyse", "--model", model.toString(), "--lon", "10",
                    "--zone", "+01:00", "--rays", "64", "--patch", "2", "--no-gltf", "--threads", "2",
                    "--out", out.toString(), "-q"));
            args.addAll(List.of(extra));
            if (!args.contains("--lat")) args.addAll(List.of("--lat", "51"));
            if (!args.contains("--time-base")) args.addAll(List.of("--time-base", "hourly-year"));
            assertEquals(0, Main.execute(args.toArray(String[]::new)));
        } finally {
            System.setOut(old);
        }
        return out;
    }

    private static List<CSVRecord> rows(Path csv) throws Exception {
        try (Reader r = Files.newBufferedReader(csv)) {
            return CSVFormat.RFC4180.builder().setCommentMarker('#').setHeader().setSkipHeaderRecord(true).get().parse(r).getRecords();
        }
    }

    private int compare(Path a, Path b, Path out, String... extra) {
        PrintStream old = System.out, oldErr = System.err;
        System.setOut(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
        ByteArrayOutputStream errBytes = new ByteArrayOutputStream();
        System.setErr(new PrintStream(errBytes, true, StandardCharsets.UTF_8));
        try {
            List<String> args = new java.util.ArrayList<>(List.of("compare", a.toString(), b.toString(), "--out", out.toString()));
            args.addAll(List.of(extra));
            return Main.execute(args.toArray(String[]::new));
        } finally {
            System.setOut(old);
            System.setErr(oldErr);
            err = errBytes.toString(StandardCharsets.UTF_8);
        }
    }

    /** What the last {@link #compare} printed to stderr. */
    private String err = "";

    @Test
    void compareOfAStudyWithItselfHasAllDeltasZero() throws Exception {
        Path a = analyse("a", String.format(BOX, "west", "0", "10", "12") + String.format(BOX, "east", "16", "24", "6"));
        Path out = dir.resolve("self");
        assertEquals(0, compare(a, a, out));
        List<CSVRecord> rows = rows(out.resolve(CompareCommand.DELTA));
        assertTrue(rows.size() > 50);
        for (CSVRecord r : rows) {
            assertEquals("both", r.get("match"));
            assertEquals(r.get("patch_id_a"), r.get("patch_id_b"));
            for (String col : r.getParser().getHeaderNames()) {
                if (col.endsWith("_delta")) assertEquals(0.0, Double.parseDouble(r.get(col)), 0.0, col + " of " + r.get("patch_id_b"));
            }
        }
        for (CSVRecord r : rows(out.resolve(CompareCommand.BLOCKS))) {
            assertEquals("0", r.get("only_a_patches"));
            assertEquals("0", r.get("only_b_patches"));
            for (String col : r.getParser().getHeaderNames()) if (col.endsWith("_delta")) assertEquals(0.0, Double.parseDouble(r.get(col)), 0.0);
        }
        assertTrue(Files.size(out.resolve(CompareCommand.MAP)) > 1000);
    }

    /**
     * Variant B raises the east block from 6 to 14 m: its walls grow (patches only B has), and the
     * west block's wall facing it can only lose sky and sun: the same hemisphere rays (seeded by patch
     * id) and the same sun directions now meet more obstruction, never less, so its sky view factor,
     * sun-hour and sunshine-hour deltas are &lt;= 0 on every matched patch (geometry alone). Annual
     * irradiation is not asserted: the taller neighbour also reflects more light onto the wall.
     */
    @Test
    void raisingANeighbourDarkensTheWallFacingItAndAddsUnmatchedPatches() throws Exception {
        Path a = analyse("a", String.format(BOX, "west", "0", "10", "12") + String.format(BOX, "east", "16", "24", "6"));
        Path b = analyse("b", String.format(BOX, "west", "0", "10", "12") + String.format(BOX, "east", "16", "24", "14"));
        Path out = dir.resolve("ab");
        assertEquals(0, compare(a, b, out));
        int onlyB = 0, eastWall = 0;
        for (CSVRecord r : rows(out.resolve(CompareCommand.DELTA))) {
            if (r.get("match").equals("only_b")) onlyB++;
            assertTrue(!r.get("match").equals("only_a") || !r.get("block").equals("west"), "west block patches all match");
            if (r.get("match").equals("both") && r.get("block").equals("west") && r.get("kind").equals("facade")
                    && Double.parseDouble(r.get("x")) == 10.0) {
                eastWall++;
                for (String q : List.of("sky_view_factor_delta", "sun_hours_0321_delta", "sunshine_h_delta")) {
                    assertTrue(Double.parseDouble(r.get(q)) <= 0, q + " of " + r.get("patch_id_b"));
                }
            }
        }
        assertTrue(onlyB > 0);
        assertTrue(eastWall > 0);
    }

    /**
     * Two runs of one box that differ only in the diffuse sky model (Perez 1990 anisotropic vs
     * isotropic): the difference of annual irradiation is the sky model's, not the massing's, so compare
     * warns naming the field and writes it into compare.json; the geometry is identical, so no other
     * setting may be named.
     */
    @Test
    void runsWithDifferentSkyModelsAreComparedWithAWarningNamingTheSkyModel() throws Exception {
        String box = org.solmass.fixtures.Boxes.onGround(0, 0, 10, 8, 12).obj("box");
        Path a = analyse("a", box, "--sky", "perez");
        Path b = analyse("b", box, "--sky", "isotropic");
        Path out = dir.resolve("ab");
        assertEquals(0, compare(a, b, out));
        assertTrue(err.contains("warning: sky differs (A perez, B isotropic)"), err);
        assertTrue(!err.contains("site differs") && !err.contains("climate differs") && !err.contains("patch_m differs"), err);
        com.fasterxml.jackson.databind.JsonNode note = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(out.resolve(CompareCommand.NOTE).toFile());
        assertEquals(1, note.get("differing_settings").size());
        assertEquals("sky", note.get("differing_settings").get(0).get("field").asText());
        assertEquals("perez", note.get("differing_settings").get(0).get("a").asText());
        assertEquals(org.solmass.output.PublishedRun.open(a).runId(), note.get("a").get("run_id").asText());
        assertTrue(note.get("cautions").toString().contains("sky model"));
        for (CSVRecord r : rows(out.resolve(CompareCommand.DELTA))) assertTrue(r.isConsistent());
        assertTrue(!Files.readString(out.resolve(CompareCommand.DELTA)).contains("#"), "no comment lines in delta.csv");
    }

    /** {@code --strict} turns a differing setting (here the site's latitude, 51 vs 45 N) into a refusal: exit 2, nothing written. */
    @Test
    void strictRefusesRunsOfDifferentSitesWithExitTwo() throws Exception {
        String box = org.solmass.fixtures.Boxes.onGround(0, 0, 10, 8, 12).obj("box");
        Path a = analyse("a", box);
        Path b = analyse("b", box, "--lat", "45");
        Path out = dir.resolve("ab");
        assertEquals(2, compare(a, b, out, "--strict"));
        assertTrue(err.contains("site differs"), err);
        assertTrue(err.contains("refused"), err);
        assertTrue(!Files.exists(out.resolve(CompareCommand.DELTA)) && !Files.exists(out.resolve(CompareCommand.NOTE)));
    }

    /** Two runs with the same settings: no warning, and compare.json lists no differing setting (with or without --strict). */
    @Test
    void runsWithIdenticalSettingsGiveNoWarning() throws Exception {
        String box = org.solmass.fixtures.Boxes.onGround(0, 0, 10, 8, 12).obj("box");
        Path a = analyse("a", box);
        Path b = analyse("b", box);
        Path out = dir.resolve("ab");
        assertEquals(0, compare(a, b, out, "--strict"));
        assertTrue(!err.contains("differs"), err);
        com.fasterxml.jackson.databind.JsonNode note = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(out.resolve(CompareCommand.NOTE).toFile());
        assertEquals(0, note.get("differing_settings").size());
        assertEquals(org.solmass.output.PublishedRun.open(a).record().study().name(), note.get("a").get("study").asText());
    }

    /**
     * The case that was reported: a clear-sky run and a run on a heavily overcast month-hour table
     * (invented here: 80 W/m2 global, all of it diffuse, from 10:00 to 15:00 every month, nothing else)
     * of one unchanged box. compare warns naming the climate and writes both sources into compare.json.
     */
    @Test
    void aClearSkyRunComparedWithAnOvercastTableWarnsNamingTheClimate() throws Exception {
        StringBuilder table = new StringBuilder("# INVENTED overcast table for a test, not measured data\nmonth,hour,ghi_wm2,dhi_wm2\n");
        for (int m = 1; m <= 12; m++) {
            for (int h = 0; h < 24; h++) {
                int v = h >= 10 && h < 15 ? 80 : 0;
                table.append(m).append(',').append(h).append(',').append(v).append(',').append(v).append('\n');
            }
        }
        Path climate = dir.resolve("overcast-month-hour.csv");
        Files.writeString(climate, table);
        String box = org.solmass.fixtures.Boxes.onGround(0, 0, 10, 8, 12).obj("box");
        Path a = analyse("clear", box, "--time-base", "average-days");
        Path b = analyse("overcast", box, "--climate", climate.toString(), "--time-base", "average-days");
        Path out = dir.resolve("ab");
        assertEquals(0, compare(a, b, out));
        assertTrue(err.contains("warning: climate differs (A clear-sky, B " + climate.toAbsolutePath().normalize()), err);
        com.fasterxml.jackson.databind.JsonNode note = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(out.resolve(CompareCommand.NOTE).toFile());
        assertEquals("climate", note.get("differing_settings").get(0).get("field").asText());
        assertEquals(2, compare(a, b, dir.resolve("strict"), "--strict"));
    }
}
