package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Results folders written before modules.geojson existed (or without PV) open with no modules and no error. */
class ViewerBridgeModulesTest {
    @TempDir Path dir;

    @Test
    void aFolderWithoutModulesGeoJsonGivesNoModules() {
        assertEquals(0, ViewerBridge.moduleRings(dir).size());
    }

    @Test
    void aFolderWithModulesGeoJsonGivesOneRingPerModule() throws Exception {
        Files.writeString(dir.resolve("modules.geojson"), "{\"type\":\"FeatureCollection\",\"features\":[{\"type\":\"Feature\","
                + "\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[[0,0,3],[1.7,0,3],[1.7,1,3],[0,1,3],[0,0,3]]]}}]}");
        assertEquals(1, ViewerBridge.moduleRings(dir).size());
        assertEquals(12, ViewerBridge.moduleRings(dir).get(0).length);
    }
}
