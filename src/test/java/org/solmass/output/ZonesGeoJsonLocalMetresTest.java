package org.solmass.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.Cautions;
import org.solmass.metrics.PvZones;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * zones.geojson of a model without geo-reference (an OBJ model, as the city run writes it): the zone
 * in local metres, the exterior ring counter-clockwise (RFC 7946, section 3.1.6, right-hand rule)
 * with the same corners, its plan area by the shoelace formula (Gauss's area formula, common
 * practice) that of the invented 10 m x 6 m roof, and the caution in the file.
 */
class ZonesGeoJsonLocalMetresTest {
    @TempDir Path dir;

    @Test
    void aZoneOfALocalModelIsWrittenInLocalMetresCounterClockwiseWithItsAreaAndTheCaution() throws Exception {
        // invented: a flat roof 10 m x 6 m at 5 m, given clockwise in plan
        double[] ring = {0, 0, 5, 0, 6, 5, 10, 6, 5, 10, 0, 5};
        PvZones.Zone z = new PvZones.Zone(1, 0, "block-a", 3, "B1-S4", new int[] {0, 1}, 60, 1000, 60000, 5, 9600,
                0, 180, List.of(ring), null);
        Path f = dir.resolve(GeoJsonWriter.ZONES);
        GeoJsonWriter.writeZones(f, List.of(z), null, List.of(Cautions.RESULTS));
        JsonNode fc = new ObjectMapper().readTree(f.toFile());
        assertTrue(fc.path("coordinates").asText().startsWith("local metres"), "says local metres");
        assertEquals(Cautions.RESULTS, fc.path("caution").asText(), "caution");
        JsonNode feature = fc.path("features").get(0);
        assertFalse(feature.path("properties").has("crs_x"), "no CRS centroid without a CRS");
        assertEquals(60, feature.path("properties").path("area_m2").asDouble(), 1e-9, "area_m2");
        JsonNode pts = feature.path("geometry").path("coordinates").get(0).get(0);
        assertEquals(5, pts.size(), "4 corners and the first again");
        assertEquals(pts.get(0).toString(), pts.get(4).toString(), "closed ring");
        double twiceArea = 0;
        for (int k = 0; k < 4; k++) {
            JsonNode a = pts.get(k), b = pts.get(k + 1);
            twiceArea += a.get(0).asDouble() * b.get(1).asDouble() - b.get(0).asDouble() * a.get(1).asDouble();
            assertEquals(5, a.get(2).asDouble(), 1e-9, "height kept");
        }
        assertEquals(2 * 60, twiceArea, 1e-9, "counter-clockwise (positive) with the roof's 60 m2");
    }
}
