package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.io.IOException;
import java.nio.file.Files;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** Mutated fixtures either import (and patch) or fail with an InputException naming the source. */
class ImportAndPatchFuzzTest {
    private static final String[] FIXTURES = {"box_plaza.obj", "lshape.obj", "usemtl.obj", "blocks.obj", "continuation.obj"};
    private static final String[] TOKENS = {" ", "\n", "\\\n", "/", "//", "-", "0", "1", "-1", "9", "f ", "v ", "o x",
            "g", "#", "1e308", "nan", "2.5", "\t", "usemtl", "-0"};

    @Test
    void mutatedObjNeverFailsWithAnythingButAnInputError() throws IOException, java.net.URISyntaxException {
        Random rnd = new Random(99);
        int ok = 0, rejected = 0;
        for (int trial = 0; trial < 250; trial++) {
            String base = Files.readString(java.nio.file.Path.of(ImportAndPatchFuzzTest.class.getResource("/obj/" + FIXTURES[trial % FIXTURES.length]).toURI()));
            StringBuilder sb = new StringBuilder(base);
            int edits = 1 + rnd.nextInt(4);
            for (int e = 0; e < edits; e++) {
                int at = rnd.nextInt(sb.length() + 1);
                switch (rnd.nextInt(3)) {
                    case 0 -> sb.insert(at, TOKENS[rnd.nextInt(TOKENS.length)]);
                    case 1 -> { if (at < sb.length()) sb.deleteCharAt(at); }
                    default -> { if (at < sb.length()) sb.setCharAt(at, (char) (32 + rnd.nextInt(95))); }
                }
            }
            try {
                MassingModel m = ObjReader.parse(sb.toString(), "fuzz.obj", ModelOptions.defaults()).model();
                assertTrue(m.triangleCount() > 0);
                for (double x : m.vertices()) assertTrue(Double.isFinite(x));
                if (m.bounds()[3] - m.bounds()[0] < 1e4 && m.bounds()[4] - m.bounds()[1] < 1e4
                        && m.bounds()[5] - m.bounds()[2] < 1e4) {
                    Patcher.build(m, PatchOptions.defaults());
                }
                ok++;
            } catch (InputException ex) {
                assertTrue(ex.getMessage().startsWith("fuzz.obj"), ex.getMessage());
                rejected++;
            }
        }
        assertTrue(ok > 0 && rejected > 0, ok + " accepted, " + rejected + " rejected");
    }
}
