package org.solmass.cli;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
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
    }
}
