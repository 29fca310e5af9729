package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * modules.geojson read back as module rings. The files are written by hand in the GeoJSON structure of
 * RFC 7946 (FeatureCollection of Feature with Polygon geometry; section 3.1.6: a linear ring's first and
 * last positions are equivalent), so the reader is checked against the standard, not against our writer.
 */
class ModulesGeoJsonReaderTest {
    @TempDir Path dir;

    @Test
    void closedRfc7946PolygonRingsReadAsTheirFourCornersWithoutTheRepeatedClosingPosition() throws Exception {
        Path f = dir.resolve("modules.geojson");
        Files.writeString(f, """
                {"type":"FeatureCollection","coordinates":"local metres","features":[
                 {"type":"Feature","geometry":{"type":"Polygon","coordinates":[[[0,0,10],[1.7,0,10],[1.7,1.134,10],[0,1.134,10],[0,0,10]]]},
                  "properties":{"zone":1,"module":1}},
                 {"type":"Feature","geometry":{"type":"Polygon","coordinates":[[[2,0,10],[3.7,0,10.5],[3.7,1,10.5],[2,1,10],[2,0,10]]]},
                  "properties":{"zone":2,"module":2}}]}
                """);
        List<double[]> rings = ModulesGeoJsonReader.rings(f);
        assertEquals(2, rings.size());
        assertArrayEquals(new double[] {0, 0, 10, 1.7, 0, 10, 1.7, 1.134, 10, 0, 1.134, 10}, rings.get(0), 0);
        assertArrayEquals(new double[] {2, 0, 10, 3.7, 0, 10.5, 3.7, 1, 10.5, 2, 1, 10}, rings.get(1), 0);
    }

    @Test
    void aCollectionWithoutFeaturesGivesNoRings() throws Exception {
        Path f = dir.resolve("modules.geojson");
        Files.writeString(f, "{\"type\":\"FeatureCollection\",\"features\":[]}");
        assertEquals(0, ModulesGeoJsonReader.rings(f).size());
    }

    @Test
    void aPositionWithoutHeightIsRejectedNamingItsPlace() throws Exception {
        Path f = dir.resolve("modules.geojson");
        Files.writeString(f, "{\"type\":\"FeatureCollection\",\"features\":[{\"type\":\"Feature\",\"geometry\":"
                + "{\"type\":\"Polygon\",\"coordinates\":[[[0,0,1],[1,0],[1,1,1],[0,0,1]]]}}]}");
        InputException e = assertThrows(InputException.class, () -> ModulesGeoJsonReader.rings(f));
        assertEquals(true, e.getMessage().contains("features[0].geometry.coordinates[0][1]"), e.getMessage());
    }

    @Test
    void writerAndReaderAgreeOnAModulesCorners() {
        org.solmass.model.Vec3 o = new org.solmass.model.Vec3(5, 6, 7);
        org.solmass.pv.PvModule m = new org.solmass.pv.PvModule(3, o, new org.solmass.model.Vec3(1.7, 0, 0),
                new org.solmass.model.Vec3(0, 1.134, 0), new org.solmass.model.Vec3(0, 0, 1), false);
        Path f = dir.resolve("w.geojson");
        ModulesGeoJsonWriter.write(f, List.of(m), "invented test");
        double[] r = ModulesGeoJsonReader.rings(f).get(0);
        org.solmass.model.Vec3[] c = m.corners();
        assertEquals(12, r.length);
        for (int k = 0; k < 4; k++) {
            assertEquals(c[k].x(), r[3 * k], 0.0005);
            assertEquals(c[k].y(), r[3 * k + 1], 0.0005);
            assertEquals(c[k].z(), r[3 * k + 2], 0.0005);
        }
    }
}
