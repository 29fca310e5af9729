package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A finished run's geometry is rebuilt the way the run built it: with trees (study key
 * {@code vegetation}) left out of the patched model, so the elevations and the report of such a run
 * find patches.csv's patches (before, the rebuild patched the crowns too and refused the folder).
 */
class RunGeometryTreesTest {
    @TempDir Path dir;

    private static final String MODEL = String.join("\n", "o box",
            "v 0 0 0", "v 12 0 0", "v 12 8 0", "v 0 8 0", "v 0 0 18", "v 12 0 18", "v 12 8 18", "v 0 8 18",
            "f 5 6 7 8", "f 1 2 6 5", "f 2 3 7 6", "f 3 4 8 7", "f 4 1 5 8",
            "o tree1",
            "v 20 0 2", "v 26 0 2", "v 26 6 2", "v 20 6 2", "v 20 0 9", "v 26 0 9", "v 26 6 9", "v 20 6 9",
            "f 13 14 15 16", "f 9 10 14 13", "f 10 11 15 14", "f 11 12 16 15", "f 12 9 13 16", "f 9 12 11 10", "");

    @Test
    void elevationsOfARunWithTreesFindItsPatches() throws Exception {
        Files.writeString(dir.resolve("m.obj"), MODEL);
        Files.writeString(dir.resolve("s.json"), "{\"name\": \"Box and tree (invented)\", \"model\": {\"file\": \"m.obj\"},"
                + " \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"}, \"patch_m\": 2, \"rays\": 16,"
                + " \"vegetation\": {\"blocks\": [\"tree*\"], \"kind\": \"evergreen\"}}");
        Path results = dir.resolve("r");
        PrintStream old = System.out;
        System.setOut(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
        try {
            assertEquals(0, Main.execute("analyse", dir.resolve("s.json").toString(), "--out", results.toString(), "-q"));
            assertEquals(0, Main.execute("elevations", results.toString()), "the rebuilt patches match patches.csv");
        } finally {
            System.setOut(old);
        }
        assertTrue(Files.exists(results.resolve("elevations").resolve("box.png")));
    }
}
