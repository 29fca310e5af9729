package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.fixtures.Boxes;
import org.solmass.output.PatchCsvReader;
import org.solmass.viewer.ViewerData;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The analyse command from flags on a tiny model, and the viewer's reading of its results folder. */
class AnalyseEndToEndTest {
    /** Two invented boxes: "low" 10 x 10 x 12 m, and "high" 10 x 6 x 20 m standing 14 m south of it. */
    static final String OBJ = "# two invented boxes\n" + Boxes.onGround(0, 0, 10, 10, 12).obj("low")
            + Boxes.onGround(0, -20, 10, -14, 20).obj("high");

    @Test
    void analyseWritesEveryResultFileAndTheViewerReadsThemBack(@TempDir Path dir) throws Exception {
        Path obj = Boxes.write(dir, "two.obj", OBJ);
        Path out = dir.resolve("res");
        int code = Main.execute("analyse", "--model", obj.toString(), "--lat", "51", "--lon", "10", "--zone", "+01:00",
                "--patch", "2", "--rays", "64", "--context", "high", "--out", out.toString(), "-q");
        assertEquals(Main.EXIT_OK, code);
        for (String f : new String[] {"patches.csv", "summary.json", "map.png", "run.json"}) {
            assertTrue(Files.size(out.resolve(f)) > 0, f);
        }
        PatchCsvReader.Table csv = PatchCsvReader.read(out.resolve("patches.csv"));
        assertTrue(csv.size() > 50);
        ViewerBridge[] b = new ViewerBridge[1];
        ViewerData d = ViewerBridge.fromFolder(out, b);
        assertEquals(csv.size(), d.patches().size());
        double[] annual = d.table().column("annual_kwh_m2");
        for (int i = 0; i < d.patches().size(); i++) {
            assertEquals(csv.value(d.patches().get(i).id(), "annual_kwh_m2"), annual[i], 0.0, "patch " + i);
        }
        assertNoPatchGetsMoreThanItsUnobstructedPlane(d);
        assertEquals(12, d.sunPath().size());
        // the export sheet's period: what run.json records (docs/outputs.md, map.png: the time base and the climate)
        assertEquals(org.solmass.output.RunPeriod.of(org.solmass.output.RunRecord.read(out)), d.period());
        assertTrue(d.period().startsWith("Year of monthly-average days"), d.period());
        assertTrue(d.climate() != null && d.climate().ghiMonthKwhM2()[5] > d.climate().ghiMonthKwhM2()[11],
                "June brighter than December in the northern hemisphere");
    }

    @Test
    void aStudyWhereEveryBlockIsContextIsABadInput(@TempDir Path dir) throws Exception {
        Path obj = Boxes.write(dir, "two.obj", OBJ);
        int code = Main.execute("analyse", "--model", obj.toString(), "--lat", "51", "--lon", "10", "--zone", "+01:00",
                "--context", "high,low", "--out", dir.resolve("res").toString(), "-q");
        assertEquals(Main.EXIT_INPUT, code);
    }

    /**
     * What is physically true of this model. (1) A flat roof in the open receives the global horizontal
     * irradiation (GHI, by definition of GHI), so the roof patches' unobstructed value is the climate's
     * annual GHI. (2) An obstruction only takes sun and sky away and shows, in their place, faces of the
     * high block that look north (its north wall is what the low block's south wall and roof see); a
     * north face receives less than open ground (checked below: the low block's own unobstructed north
     * wall gets less than the GHI), and reflects a fraction of that, so it is darker than the sun and sky
     * it hides. Hence no patch exceeds its own unobstructed plane ({@code unshaded_kwh_m2}). Walls are
     * not held below the roof: a south wall in the open may receive more than a flat roof at 51 N under
     * a clear climate; the high block's shade is what keeps the low block's south wall below.
     * Tolerance: the obstructed sky is a Monte Carlo estimate with standard error {@code svf_std_error}
     * (as a share of the sky seen); three standard errors of the plane's whole unobstructed value bound
     * the error of its sky part (the sky part is at most the whole), plus 0.01 kWh/m2 for the CSV's two
     * decimals.
     */
    private static void assertNoPatchGetsMoreThanItsUnobstructedPlane(ViewerData d) {
        double[] annual = d.table().column("annual_kwh_m2"), unshaded = d.table().column("unshaded_kwh_m2");
        double[] svfError = d.table().column("svf_std_error");
        double ghiYear = java.util.Arrays.stream(d.climate().ghiMonthKwhM2()).sum();
        double northWallOpen = Double.NaN;
        int roofs = 0;
        for (int i = 0; i < annual.length; i++) {
            var p = d.patches().get(i);
            double tol = 3 * svfError[i] * unshaded[i] + 0.01;
            assertTrue(annual[i] <= unshaded[i] + tol, String.format(java.util.Locale.ROOT,
                    "patch %s: %.2f kWh/m2 above its unobstructed plane's %.2f (tolerance %.2f)", p.id(), annual[i], unshaded[i], tol));
            if (p.tiltDeg() < 1e-6) {
                roofs++;
                assertEquals(ghiYear, unshaded[i], 0.05 + 1e-6 * ghiYear, "a flat roof in the open receives the annual GHI");
                assertTrue(annual[i] <= ghiYear + tol, "roof patch " + p.id() + " above the unobstructed roof");
            }
            if (p.blockName().equals("low") && Math.abs(p.tiltDeg() - 90) < 1e-6 && Math.abs(p.azimuthDeg()) < 1e-6) {
                northWallOpen = unshaded[i];
            }
        }
        assertTrue(roofs > 0, "the low block has roof patches");
        assertTrue(northWallOpen < ghiYear, "a north wall in the open receives less than a flat roof: " + northWallOpen);
    }
}
