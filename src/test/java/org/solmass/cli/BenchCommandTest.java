package org.solmass.cli;

import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class BenchCommandTest {
    @Test
    void smallBenchPrintsItsTableAndBadFlagsAreBadInput() {
        PrintStream old = System.out;
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        int code;
        try {
            System.setOut(new PrintStream(buf, true, StandardCharsets.UTF_8));
            code = Main.execute("bench", "--blocks", "16", "--rays", "4096", "--patches", "40", "--rays-per-patch", "64");
        } finally {
            System.setOut(old);
        }
        assertEquals(Main.EXIT_OK, code);
        String out = buf.toString(StandardCharsets.UTF_8);
        for (String row : new String[] {"triangles", "BVH build", "occlusion, one ray at a time", "occlusion, bundles of 64", "occlusion, bundles of 1,024", "closest hit", "closest hit, bundles of 1,024", "sky view factors"}) {
            assertTrue(out.contains(row), "missing row " + row + " in\n" + out);
        }
        assertEquals(Main.EXIT_INPUT, Main.execute("bench", "--blocks", "0"));
        assertEquals(Main.EXIT_INPUT, Main.execute("bench", "--rays-per-patch", "-3"));
    }
}
