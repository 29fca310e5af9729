package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.fixtures.Boxes;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.metrics.PvZonesMetric;
import org.solmass.pv.ZoneYield;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The case of the PV planner issue: a lone block with a flat, wholly unshaded roof at 44.5 N reached
 * 78 % of the best tilted plane and gave no PV zone. Racked modules on a flat roof see the rack plane,
 * so the roof is suitable; its zone gets racked modules.
 */
class FlatRoofSuitabilityTest {
    @TempDir Path dir;

    @Test
    void anUnshadedFlatRoofIsSuitableAndGetsRackedModules() throws Exception {
        Boxes.write(dir, "m.obj", Boxes.onGround(0, 0, 20, 12, 9).obj("lone"));
        Path sf = dir.resolve("s.json");
        Files.writeString(sf, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 44.5, \"longitude\": 10, \"zone\": \"+01:00\"},"
                + " \"climate\": \"clear-sky\", \"patch_m\": 2, \"rays\": 64}");
        Study study = StudyReader.read(sf);
        AnalysisRun.Outcome o = AnalysisRun.run(study, PhaseProgress.NONE);
        PvZonesMetric.Found f = o.metrics().find(PvZonesMetric.Found.class).orElseThrow();
        double[] suit = o.table().column(PvZonesMetric.SUITABILITY.name());
        int roofs = 0;
        for (Patch p : o.patches().patches()) {
            if (p.kind() != SurfaceKind.ROOF) continue;
            roofs++;
            // nothing shades it: the shading loss is the hemisphere sampling's noise only
            assertTrue(o.result().shadingLossPct(p.index()) < 1, "shading " + o.result().shadingLossPct(p.index()));
            assertTrue(suit[p.index()] >= 80, "suitability " + suit[p.index()]);
        }
        assertTrue(roofs > 0);
        assertEquals(1, f.zones().zones().size());
        ZoneYield y = f.yieldOf(0);
        assertTrue(y.racked());
        // 20 x 12 m roof, 1 m setback: 18 m / 1.722 m = 10 modules per row; rows of 1.134 cos 15 deg
        // every 1.134 / 0.4 m in 10 m: floor((10 - 1.0954) / 2.835) + 1 = 4 rows
        assertEquals(40, y.modules());
        assertEquals(16.0, y.kwp(), 1e-9);
        assertTrue(y.shadingLossPct() < 2, "module shading " + y.shadingLossPct());
    }

    @Test
    void facadesOnRequestGetFlushModulesOnTheSunnyWall() throws Exception {
        Boxes.write(dir, "m.obj", Boxes.onGround(0, 0, 20, 12, 9).obj("lone"));
        Path sf = dir.resolve("s.json");
        Files.writeString(sf, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 44.5, \"longitude\": 10, \"zone\": \"+01:00\"},"
                + " \"climate\": \"clear-sky\", \"patch_m\": 2, \"rays\": 64, \"pv\": {\"facades\": true}}");
        AnalysisRun.Outcome o = AnalysisRun.run(StudyReader.read(sf), PhaseProgress.NONE);
        PvZonesMetric.Found f = o.metrics().find(PvZonesMetric.Found.class).orElseThrow();
        // the roof and the south wall (the best vertical plane faces about south); east, west and
        // north walls lose more than 20 % against it
        assertEquals(2, f.zones().zones().size());
        ZoneYield wall = f.yieldOf(0).racked() ? f.yieldOf(1) : f.yieldOf(0);
        assertTrue(!wall.racked());
        assertEquals(90, wall.tiltDeg(), 1e-6);
        assertEquals(180, wall.azimuthDeg(), 1e-6);
        // 20 x 9 m wall, 1 m setback: floor(18 / 1.134) = 15 columns of portrait modules,
        // floor(7 / 1.722) = 4 rows
        assertEquals(60, wall.modules());
    }
}
