package org.solmass.study;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.terrain.TerrainSpec;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The terrain keys of docs/study-file.md: defaults, paths, the writer's round trip, the flags. */
class TerrainKeysTest {
    @TempDir Path dir;

    private Path write(String extra) throws Exception {
        Path p = dir.resolve("s.json");
        Files.writeString(p, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"}"
                + extra + "}");
        return p;
    }

    @Test
    void noTerrainSectionMeansFlatOpenGroundAndTheWriterLeavesItOut() throws Exception {
        Study s = StudyReader.read(write(""));
        assertTrue(s.terrain().isNone());
        assertFalse(StudyWriter.toJson(s).contains("terrain"), "results of earlier versions compare byte for byte");
    }

    @Test
    void terrainKeysReadWithPathsAgainstTheStudyFileAndReadBackEqual() throws Exception {
        Study s = StudyReader.read(write(", \"terrain\": {\"horizon\": \"h.csv\", \"dem\": \"d/dem.tif\", \"dem_epsg\": 25832,"
                + " \"origin_east_m\": 600000, \"origin_north_m\": 5200000.5, \"near_radius_m\": 150, \"far_horizon_from_dem\": false}"));
        assertEquals(new TerrainSpec(dir.resolve("h.csv"), dir.resolve("d/dem.tif"), 25832, 600000, 5200000.5, 150, false), s.terrain());
        Path again = dir.resolve("again.json");
        Files.writeString(again, StudyWriter.toJson(s));
        assertEquals(s.terrain(), StudyReader.read(again).terrain());
    }

    @Test
    void flagsSetTheKeysAndAnUnknownTerrainKeyListsTheKnownOnes() throws Exception {
        Study s = StudyReader.read(write(""), new StudyOverrides().set("--horizon", "terrain.horizon", Path.of("x.csv")));
        assertEquals(Path.of("x.csv").toAbsolutePath().normalize(), s.terrain().horizonCsv());
        String m = assertThrows(InputException.class, () -> StudyReader.read(write(", \"terrain\": {\"dem_file\": \"d.tif\"}"))).getMessage();
        assertTrue(m.contains("terrain.dem_file: unknown key; expected one of horizon, dem, dem_epsg"), m);
    }
}
