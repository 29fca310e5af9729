package org.solmass.fuzz;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.Site;

import java.io.IOException;
import java.io.InputStream;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.ZoneId;

import static org.junit.jupiter.api.Assertions.*;

/** Every input the fuzzers found, as a plain test of the fixed behaviour. */
class FuzzRegressionTest {
    private static final SolarCalculator CALC =
            new SolarCalculator(new Site(51, 10, 200, ZoneId.of("Europe/Berlin")));

    private static String resource(String path) throws IOException {
        try (InputStream in = FuzzRegressionTest.class.getResourceAsStream(path)) {
            assertNotNull(in, path);
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    /**
     * Found by HourlyCsvClimateFuzzTest: a 2 KB hourly file whose last row jumps to the year 9578 made
     * the reader allocate arrays for 66 million steps (OutOfMemoryError). Gaps are now checked row by
     * row before any array of the file's span exists. (The found file's line 7 also has more cells than
     * the header, which every reader now refuses first; the minimal file shows the gap check.)
     */
    @Test
    void hourlyFileWithAGapOfMillenniaIsAnInputErrorWithoutLargeAllocation() throws IOException {
        String found = resource("HourlyCsvClimateFuzzTestInputs/climateTextReadsOrFailsWithAnInputError/regression-last-row-in-year-9578.csv");
        assertEquals("f.csv:7: the row has 7 cells but the header (line 1) has 4; a decimal comma in a comma-separated file"
                + " splits numbers: separate the cells with ';' or quote the numbers", refusedWithSmallAllocation(found));
        String minimal = "time,ghi_wm2,dhi_wm2\n2025-01-01T00:00,0,0\n2025-01-01T01:00,0,0\n9578-01-02T23:00,0,0\n";
        assertTrue(refusedWithSmallAllocation(minimal).startsWith("f.csv:3: missing steps ("));
    }

    private static String refusedWithSmallAllocation(String text) {
        var threads = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long tid = Thread.currentThread().getId(), a0 = threads.getThreadAllocatedBytes(tid);
        InputException e = assertThrows(InputException.class, () -> ClimateSource.parse(CALC,
                ClimateSpec.file(Path.of("f.csv")).withFormat(ClimateSpec.Format.HOURLY), "f.csv", text));
        long allocated = threads.getThreadAllocatedBytes(tid) - a0;
        assertTrue(allocated < FuzzCheck.MAX_ALLOCATED_BYTES, allocated + " bytes allocated");
        return e.getMessage();
    }

    /**
     * Found by GeometryFuzzTest: a garbled two-block box file whose faces fold a surface onto itself;
     * a grid cell clipped to a line (no polygon) reached Patcher.toPatch, which threw a
     * NullPointerException. Cells without area are now no patch.
     */
    @Test
    void aPatchCellClippedToALineIsNoPatch() throws IOException {
        String found = resource("GeometryFuzzTestInputs/modelSurfacesAndPatchesOrAnInputError/regression-patch-cell-without-area.obj");
        var m = org.solmass.model.ObjReader.parse(found, "f.obj", org.solmass.model.ModelOptions.defaults()).model();
        var ps = org.solmass.surface.Patcher.build(m, new org.solmass.surface.PatchOptions(1.25, java.util.Set.of(), true));
        assertFalse(ps.patches().isEmpty());
        for (var p : ps.patches()) assertTrue(p.areaM2() > 0, p.id());
    }

    /**
     * Found by GeometryFuzzTest: a garbled file whose faces touch along edges 1e-13 m apart; JTS's
     * classic overlay in HiddenFaces threw a TopologyException ("found non-noded intersection").
     * HiddenFaces now falls back to OverlayNGRobust there; the file gives surfaces and patches or an
     * input error, as the fuzz target requires.
     */
    @Test
    void nearlyCoincidentFacesDoNotBreakTheOverlay() throws IOException {
        String found = resource("GeometryFuzzTestInputs/modelSurfacesAndPatchesOrAnInputError/nearly-coincident-faces-jts-topology");
        try {
            var m = org.solmass.model.ObjReader.parse(found, "f.obj", org.solmass.model.ModelOptions.defaults()).model();
            double[] b = m.bounds();
            double extent = Math.max(b[3] - b[0], Math.max(b[4] - b[1], b[5] - b[2]));
            var ps = org.solmass.surface.Patcher.build(m, new org.solmass.surface.PatchOptions(Math.max(extent / 8, 1e-6), java.util.Set.of(), true));
            for (var p : ps.patches()) assertTrue(p.areaM2() > 0 && Double.isFinite(p.areaM2()), p.id());
        } catch (org.solmass.InputException e) {
            // refusing the file with a message is as good as reading it
        }
    }
}
