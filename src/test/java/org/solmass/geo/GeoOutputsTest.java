package org.solmass.geo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.output.GeoJsonWriter;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.Patcher;
import org.solmass.table.ResultTable;

import java.nio.file.Path;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** patches.geojson of the bundled footprints: RFC 7946 positions and the model's own CRS, checked independently. */
class GeoOutputsTest {
    @TempDir Path dir;

    @Test
    void patchesGeoJsonGivesWgs84PositionsAndTheFilesUtmCoordinates() throws Exception {
        GeoModel g = GeoJsonFootprintsTest.read();
        List<Patch> patches = Patcher.build(g.model(), new PatchOptions(4.0, Set.of(), false)).patches();
        Path file = dir.resolve(GeoJsonWriter.PATCHES);
        GeoJsonWriter.writePatches(file, new ResultTable(patches), g.reference(), List.of("invented example"));
        JsonNode root = new ObjectMapper().readTree(file.toFile());
        assertEquals("FeatureCollection", root.get("type").asText());
        assertEquals("EPSG:32632", root.get("solmass_crs").asText());
        JsonNode features = root.get("features");
        assertEquals(patches.size(), features.size());
        double worstDeg = 0, worstM = 0;
        for (int i = 0; i < patches.size(); i++) {
            Patch p = patches.get(i);
            JsonNode props = features.get(i).get("properties");
            assertEquals(p.id(), props.get("patch_id").asText());
            // the centroid in the file's CRS: back through the local frame, to the millimetre
            double[] f = g.reference().toFile(p.centroid().x(), p.centroid().y(), p.centroid().z());
            worstM = Math.max(worstM, Math.abs(props.get("crs_x").asDouble() - f[0]) + Math.abs(props.get("crs_y").asDouble() - f[1]));
            // each WGS84 corner equals Snyder's inverse of that corner's UTM coordinates
            JsonNode ring = features.get(i).get("geometry").get("coordinates").get(0);
            JsonNode first = ring.get(0), last = ring.get(ring.size() - 1);
            assertEquals(first.toString(), last.toString(), "a closed ring (RFC 7946, 3.1.6)");
            for (int k = 0; k + 1 < ring.size(); k++) {
                JsonNode c = ring.get(k);
                double[] utm = g.reference().work().fromWgs84(c.get(0).asDouble(), c.get(1).asDouble());
                double[] ll = TransverseMercator.inverseUtm(utm[0], utm[1], GeoJsonFootprintsTest.LON0);
                worstDeg = Math.max(worstDeg, Math.max(Math.abs(ll[0] - c.get(1).asDouble()), Math.abs(ll[1] - c.get(0).asDouble())));
            }
        }
        assertTrue(worstM <= 1e-3, "crs_x, crs_y within 1 mm (3 decimals), got " + worstM);
        assertTrue(worstDeg <= 1e-6, "positions vs Snyder (1987) eqs. 8-17..8-25 within 1e-6 deg, got " + worstDeg);
    }

    @Test
    void formatComesFromTheExtensionThenTheFirstBytes() throws Exception {
        assertEquals(GeoOptions.ModelFormat.GEOJSON, ModelFiles.format(Path.of("a/b.geojson"), GeoOptions.ModelFormat.AUTO));
        assertEquals(GeoOptions.ModelFormat.CITYGML, ModelFiles.format(Path.of("a/b.gml"), null));
        assertEquals(GeoOptions.ModelFormat.OBJ, ModelFiles.format(Path.of("a/b.obj"), GeoOptions.ModelFormat.AUTO));
        assertEquals(GeoOptions.ModelFormat.CITYGML, ModelFiles.format(Path.of("a/b.obj"), GeoOptions.ModelFormat.CITYGML));
        Path json = dir.resolve("model.txt"), xml = dir.resolve("model.dat"), obj = dir.resolve("model");
        java.nio.file.Files.writeString(json, "\uFEFF  {\"type\": \"FeatureCollection\"}");
        java.nio.file.Files.writeString(xml, "<?xml version=\"1.0\"?><core:CityModel/>");
        java.nio.file.Files.writeString(obj, "# OBJ\nv 0 0 0\n");
        assertEquals(GeoOptions.ModelFormat.GEOJSON, ModelFiles.format(json, GeoOptions.ModelFormat.AUTO));
        assertEquals(GeoOptions.ModelFormat.CITYGML, ModelFiles.format(xml, GeoOptions.ModelFormat.AUTO));
        assertEquals(GeoOptions.ModelFormat.OBJ, ModelFiles.format(obj, GeoOptions.ModelFormat.AUTO));
    }

    @Test
    void lonLatFootprintsAreBuiltInTheirUtmZone() {
        // the same square as in UTM zone 32N, given in longitude/latitude (RFC 7946, no crs member)
        Crs utm = Crs.epsg(32632, "test");
        StringBuilder ring = new StringBuilder();
        double[][] corners = {{560000, 5330000}, {560010, 5330000}, {560010, 5330010}, {560000, 5330010}, {560000, 5330000}};
        for (double[] c : corners) {
            double[] ll = utm.toWgs84(c[0], c[1]);
            ring.append(ring.length() == 0 ? "" : ",").append("[").append(ll[0]).append(",").append(ll[1]).append("]");
        }
        String text = "{\"type\":\"Feature\",\"properties\":{\"height\":5},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[" + ring + "]]}}";
        GeoModel g = GeoJsonReader.parse(text, "square.geojson", null, GeoOptions.defaults());
        assertEquals(4326, g.reference().file().epsg());
        assertEquals(32632, g.reference().work().epsg(), "longitude 9.8 E lies in UTM zone 32 (6 deg zones from 180 W)");
        double roof = 0;
        for (Patch p : Patcher.build(g.model(), PatchOptions.defaults()).patches()) if (p.tiltDeg() < 1) roof += p.areaM2();
        assertEquals(100.0, roof, 1e-4, "the 10 m square's roof, back in UTM metres");
    }
}
