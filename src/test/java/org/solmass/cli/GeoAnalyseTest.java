package org.solmass.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** analyse on the invented CityGML house of sample-geo: the GeoJSON outputs are published with the rest. */
class GeoAnalyseTest {
    @TempDir Path dir;

    @Test
    void houseResultsCarryGeoJsonZonesInTheManifest() throws Exception {
        CommandLine cl = Main.commandLine();
        StringWriter err = new StringWriter();
        cl.setErr(new PrintWriter(err, true));
        cl.setOut(new PrintWriter(new StringWriter(), true));
        int code = cl.execute("analyse", "-q", "sample-geo/study-house.json", "--out", dir.toString(), "--rays", "16", "--threads", "1");
        assertEquals(0, code, err.toString());
        ObjectMapper om = new ObjectMapper();
        List<String> listed = new ArrayList<>();
        for (JsonNode o : om.readTree(dir.resolve("run.json").toFile()).get("outputs")) listed.add(o.get("file").asText());
        assertTrue(listed.containsAll(List.of("patches.csv", "patches.geojson", "zones.geojson", "summary.json")), listed.toString());
        JsonNode geo = om.readTree(dir.resolve("summary.json").toFile()).get("geo_reference");
        assertEquals("EPSG:25832", geo.get("crs").asText());
        assertEquals(560105.0, geo.get("origin_x").asDouble(), 0.0);   // centre of 560100..560110, rounded
        JsonNode zones = om.readTree(dir.resolve("zones.geojson").toFile()).get("features");
        assertEquals(1, zones.size(), "the south roof is the one PV zone");
        JsonNode z = zones.get(0).get("properties");
        assertEquals(50.0, z.get("area_m2").asDouble(), 1e-9, "10 m x 5 m slope (rise 3 m, run 4 m)");
        assertEquals(36.87, z.get("tilt_deg").asDouble(), 0.005);
        // the zone lies on the south slope: its corners' mean northing between eaves (5330100) and ridge (5330104)
        double n = z.get("crs_y").asDouble();
        assertTrue(n > 5330100 && n < 5330104, "crs_y " + n);
    }
}
