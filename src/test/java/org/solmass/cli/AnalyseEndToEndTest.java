package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.output.PatchCsvReader;
import org.solmass.viewer.ViewerData;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The analyse command from flags on a tiny model, and the viewer's reading of its results folder. */
class AnalyseEndToEndTest {
    static final String OBJ = String.join("\n",
            "# two invented boxes",
            "v 0 0 0", "v 10 0 0", "v 10 10 0", "v 0 10 0", "v 0 0 12", "v 10 0 12", "v 10 10 12", "v 0 10 12",
            "o low", "f 5 6 7 8", "f 1 2 6 5", "f 2 3 7 6", "f 3 4 8 7", "f 4 1 5 8",
            "v 0 -20 0", "v 10 -20 0", "v 10 -14 0", "v 0 -14 0", "v 0 -20 20", "v 10 -20 20", "v 10 -14 20", "v 0 -14 20",
            "o high", "f 13 14 15 16", "f 9 10 14 13", "f 10 11 15 14", "f 11 12 16 15", "f 12 9 13 16", "");

    @Test
    void analyseWritesEveryResultFileAndTheViewerReadsThemBack(@TempDir Path dir) throws Exception {
        Path obj = dir.resolve("two.obj");
        Files.writeString(obj, OBJ);
        Path out = dir.resolve("res");
        int code = Main.execute("analyse", "--model", obj.toString(), "--lat", "51", "--lon", "10", "--zone", "+01:00",
                "--patch", "2", "--rays", "64", "--context", "high", "--out", out.toString(), "-q");
        assertEquals(Main.EXIT_OK, code);
        for (String f : new String[] {"patches.csv", "summary.json", "map.png", "run.json"}) {
            assertTrue(Files.size(out.resolve(f)) > 0, f);
        }
        PatchCsvReader.Table csv = PatchCsvReader.read(out.resolve("patches.csv"));
        assertTrue(csv.size() > 50);
        // the low block's north facade faces away from the high block and the sun: no patch is brighter than the roof
        ViewerBridge[] b = new ViewerBridge[1];
        ViewerData d = ViewerBridge.fromFolder(out, b);
        assertEquals(csv.size(), d.patches().size());
        double[] annual = d.table().column("annual_kwh_m2");
        for (int i = 0; i < d.patches().size(); i++) {
            assertEquals(csv.value(d.patches().get(i).id(), "annual_kwh_m2"), annual[i], 0.0, "patch " + i);
        }
        assertEquals(12, d.sunPath().size());
        assertTrue(d.climate() != null && d.climate().ghiMonthKwhM2()[5] > d.climate().ghiMonthKwhM2()[11],
                "June brighter than December in the northern hemisphere");
    }

    @Test
    void aStudyWhereEveryBlockIsContextIsABadInput(@TempDir Path dir) throws Exception {
        Path obj = dir.resolve("two.obj");
        Files.writeString(obj, OBJ);
        int code = Main.execute("analyse", "--model", obj.toString(), "--lat", "51", "--lon", "10", "--zone", "+01:00",
                "--context", "high,low", "--out", dir.resolve("res").toString(), "-q");
        assertEquals(Main.EXIT_INPUT, code);
    }
}
