package org.solmass.cli;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.output.ShadowPatchTable;
import org.solmass.output.ShadowTable;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code solmass shadows} on a lone box (invented geometry and site) from a study file. */
class ShadowsCommandTest {
    @TempDir Path dir;

    private static final String BOX = String.join("\n", "o box",
            "v 0 0 0", "v 12 0 0", "v 12 8 0", "v 0 8 0", "v 0 0 18", "v 12 0 18", "v 12 8 18", "v 0 8 18",
            "f 5 6 7 8", "f 1 2 6 5", "f 2 3 7 6", "f 3 4 8 7", "f 4 1 5 8", "");

    /**
     * At 12:00 standard time on 21 June at 10 deg E (zone +01:00) the sun is a little east of south
     * (solar noon near 12:20, from memory), so the roof, the south and the east walls are wholly in sun
     * and the north and west walls in shade: 96 + 216 + 144 = 456 of 816 m2 (box geometry).
     */
    @Test
    void csvHasHeaderFirstAndTheBoxSunlitAreaOfRoofSouthAndEastWalls() throws Exception {
        Files.writeString(dir.resolve("box.obj"), BOX);
        Files.writeString(dir.resolve("study.json"), "{\"name\": \"box (invented)\", \"model\": {\"file\": \"box.obj\"},"
                + " \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"}}");
        Path out = dir.resolve("out");
        PrintStream old = System.out;
        System.setOut(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
        try {
            assertEquals(0, Main.execute("shadows", dir.resolve("study.json").toString(), "--dates", "06-21", "--times", "12:00",
                    "--out", out.toString(), "-q"));
        } finally {
            System.setOut(old);
        }
        assertTrue(Files.size(out.resolve(ShadowsCommand.SHEET)) > 0);
        List<String> lines = Files.readAllLines(out.resolve(ShadowsCommand.TABLE));
        assertEquals(String.join(",", ShadowTable.HEADER), lines.get(0), "header first, no comment lines");
        List<CSVRecord> rows;
        try (Reader r = Files.newBufferedReader(out.resolve(ShadowsCommand.TABLE))) {
            rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(r).getRecords();
        }
        assertEquals(2, rows.size(), "one block and the ground");
        CSVRecord box = rows.get(0);
        assertEquals("box", box.get("name"));
        double az = Double.parseDouble(box.get("sun_azimuth_deg"));
        assertTrue(az > 160 && az < 180, "sun a little east of south: " + az);
        assertEquals(816, Double.parseDouble(box.get("area_m2")), 1e-9);
        assertEquals(456, Double.parseDouble(box.get("sunlit_area_m2")), 1e-9);
        assertEquals("ground", rows.get(1).get("role"));

        // the per-patch file: published with the sheet and the table (run.json's manifest), every patch
        // once, and the block's patches in sun add up to the same 456 m2 (box geometry, as above)
        org.solmass.output.PublishedRun run = org.solmass.output.PublishedRun.open(out);
        for (String f : List.of(ShadowsCommand.SHEET, ShadowsCommand.TABLE, ShadowPatchTable.FILE_NAME)) {
            assertTrue(run.has(f), f + " in run.json's manifest");
        }
        ShadowPatchTable.Table t = run.read(ShadowPatchTable.FILE_NAME, ShadowPatchTable::read);
        assertEquals(List.of("06-21 12:00"), t.frames());
        assertEquals(t.patches().size(), t.patches().stream().map(org.solmass.surface.Patch::id).distinct().count(), "each patch once");
        double boxArea = 0, boxSunlit = 0, groundArea = 0, groundSunlit = 0;
        boolean[] lit = t.sunlit("06-21 12:00");
        for (int i = 0; i < lit.length; i++) {
            double a = t.patches().get(i).areaM2();
            if (t.roles().get(i).equals("ground")) {
                groundArea += a;
                if (lit[i]) groundSunlit += a;
            } else {
                assertEquals("analysed", t.roles().get(i));
                boxArea += a;
                if (lit[i]) boxSunlit += a;
            }
        }
        assertEquals(816, boxArea, 1e-3);
        assertEquals(456, boxSunlit, 1e-3);
        assertEquals(Double.parseDouble(rows.get(1).get("area_m2")), groundArea, 0.01, "ground area as in shadows.csv");
        assertEquals(Double.parseDouble(rows.get(1).get("sunlit_area_m2")), groundSunlit, 0.01, "ground sunlit area as in shadows.csv");
    }
}
