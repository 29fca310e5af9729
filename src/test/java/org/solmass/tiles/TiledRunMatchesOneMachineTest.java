package org.solmass.tiles;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.cli.AnalysisRun;
import org.solmass.fixtures.Boxes;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.table.ResultTable;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Issue 19's check: the same model run on one machine ({@code AnalysisRun}, as {@code solmass
 * analyse}) and cut into several tiles whose halo covers every obstruction gives the same per-patch
 * results within 1e-9 relative, in every column of patches.csv. Possible because receivers keep
 * their global ids and ray seeds (seeds come from patch ids) and tiles are stored in the whole
 * model's frame; the one difference is rounding (reflection summed month by month).
 */
class TiledRunMatchesOneMachineTest {
    @TempDir Path dir;

    /** A street of five blocks (two of them context), shaded ground, sun hours on a date; {@code extra} study keys. */
    static Path study(Path dir, String extraObj, String extraKeys) throws Exception {
        StringBuilder obj = new StringBuilder();
        obj.append(Boxes.onGround(0, 0, 12, 10, 15).obj("a"));
        obj.append(Boxes.onGround(20, 0, 30, 10, 24).obj("b"));
        obj.append(Boxes.onGround(0, 18, 10, 28, 9).obj("c"));
        obj.append(Boxes.onGround(22, 20, 32, 30, 30).obj("tower"));
        obj.append(Boxes.onGround(40, 5, 48, 15, 12).obj("d"));
        obj.append(extraObj);
        Boxes.write(dir, "m.obj", obj.toString());
        Path sf = dir.resolve("s.json");
        Files.writeString(sf, "{\"model\": {\"file\": \"m.obj\", \"context\": [\"tower\", \"d\"]},"
                + " \"site\": {\"latitude\": 48.0, \"longitude\": 11, \"zone\": \"+01:00\"},"
                + " \"climate\": \"clear-sky\", \"patch_m\": 2, \"rays\": 64, \"ground_irradiance\": \"shaded\","
                + " \"sun_hours\": {\"dates\": [\"03-21\"]}" + extraKeys + "}");
        return sf;
    }

    @Test
    void tilesWithAFullHaloEqualTheOneMachineRunInEveryColumn() throws Exception {
        assertTiledEqualsOneMachine(StudyReader.read(study(dir, "", "")));
    }

    @Test
    void treesAttenuateAlikeInTilesAndInTheWholeModel() throws Exception {
        String crown = Boxes.closed(14, 12, 3, 18, 16, 9).obj("tree_1"); // between the blocks a, b and c
        assertTiledEqualsOneMachine(StudyReader.read(study(dir, crown, ", \"vegetation\": {\"blocks\": [\"tree_*\"]}")));
    }

    static void assertTiledEqualsOneMachine(Study study) {
        ResultTable one = AnalysisRun.run(study, PhaseProgress.NONE).table();
        CityModel city = CityModel.of(study);
        LocalCityRunner.CityRun tiled = LocalCityRunner.run(city, CityOptions.defaults().withTileM(15), PhaseProgress.NONE);
        assertTrue(tiled.plan().tiles().size() >= 4, "several tiles: " + tiled.plan().tiles().size());
        assertTrue(tiled.plan().haloM() > 100, "the halo covers the 50 m model: " + tiled.plan().haloM());
        ResultTable cut = tiled.table();
        assertEquals(one.names(), cut.names(), "the same columns as patches.csv, in the same order");
        int compared = 0;
        for (String c : one.names()) {
            double[] a = one.column(c), b = cut.column(c);
            for (int p = 0; p < a.length; p++) {
                if (Double.isNaN(a[p])) {
                    assertTrue(Double.isNaN(b[p]), c + " of " + one.patches().get(p).id() + ": NaN vs " + b[p]);
                    continue;
                }
                double tol = 1e-9 * Math.max(1e-12, Math.abs(a[p]));
                assertEquals(a[p], b[p], tol, c + " of " + one.patches().get(p).id());
                compared++;
            }
        }
        assertTrue(compared > 1000, "values compared: " + compared);
    }
}
