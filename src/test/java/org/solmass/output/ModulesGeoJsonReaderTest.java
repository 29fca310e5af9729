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

    /**
     * A geo-referenced model: the corners are written in the model's CRS, declared by the 2008 GeoJSON
     * {@code crs} member (urn:ogc:def:crs:EPSG::25832), and read back to local metres. Expected CRS
     * position by hand from GeoReference's definition of the local frame (local = rotation by the north
     * angle of the working CRS's easting/northing less the origin), so the rotation back is checked too;
     * the edge lengths in the projected CRS equal the module's (a rotation keeps lengths). Within 1 mm
     * (the file keeps mm).
     */
    @Test
    void aGeoReferencedModelsModulesAreInItsCrsAndReadBackToLocalMetres() throws Exception {
        org.solmass.geo.Crs utm = org.solmass.geo.Crs.epsg(25832, "test");
        org.solmass.geo.GeoReference geo = org.solmass.geo.GeoReference.around(utm, 690_000, 5_335_000, 690_200, 5_335_100);
        assertEquals(true, Math.abs(geo.northDeg()) > 0.5, "a site east of the central meridian has a north angle: " + geo.northDeg());
        org.solmass.pv.PvModule m = new org.solmass.pv.PvModule(2, new org.solmass.model.Vec3(-40.25, 12.5, 18), new org.solmass.model.Vec3(1.7, 0, 0),
                new org.solmass.model.Vec3(0, 1.1, 0.3), new org.solmass.model.Vec3(0, -0.26, 0.96), true);
        Path f = dir.resolve("geo.geojson");
        ModulesGeoJsonWriter.write(f, List.of(m), "invented test", geo);
        com.fasterxml.jackson.databind.JsonNode root = new com.fasterxml.jackson.databind.ObjectMapper().readTree(f.toFile());
        assertEquals("urn:ogc:def:crs:EPSG::25832", root.path("crs").path("properties").path("name").asText());
        com.fasterxml.jackson.databind.JsonNode ring = root.path("features").path(0).path("geometry").path("coordinates").path(0);
        org.solmass.model.Vec3[] c = m.corners();
        double a = Math.toRadians(geo.northDeg());
        for (int k = 0; k < 4; k++) {
            double x = c[k].x(), y = c[k].y();
            assertEquals(geo.originX() + x * Math.cos(a) + y * Math.sin(a), ring.get(k).get(0).asDouble(), 0.001, "easting of corner " + k);
            assertEquals(geo.originY() - x * Math.sin(a) + y * Math.cos(a), ring.get(k).get(1).asDouble(), 0.001, "northing of corner " + k);
            assertEquals(c[k].z(), ring.get(k).get(2).asDouble(), 0.001);
        }
        double edge = Math.hypot(ring.get(1).get(0).asDouble() - ring.get(0).get(0).asDouble(), ring.get(1).get(1).asDouble() - ring.get(0).get(1).asDouble());
        assertEquals(1.7, edge, 0.002, "the module's long edge in the CRS");
        double[] back = ModulesGeoJsonReader.rings(f).get(0);
        for (int k = 0; k < 4; k++) {
            assertEquals(c[k].x(), back[3 * k], 0.001);
            assertEquals(c[k].y(), back[3 * k + 1], 0.001);
            assertEquals(c[k].z(), back[3 * k + 2], 0.001);
        }
        // a model whose file is in longitude/latitude (CityGML or GeoJSON in EPSG:4326): degrees, read back through its UTM working CRS
        org.solmass.geo.GeoReference ll = org.solmass.geo.GeoReference.around(org.solmass.geo.Crs.epsg(4326, "test"), 11.5, 48.1, 11.502, 48.101);
        ModulesGeoJsonWriter.write(f, List.of(m), "invented test", ll);
        double[] lonLat = ll.toWgs84(c[0].x(), c[0].y(), c[0].z());
        com.fasterxml.jackson.databind.JsonNode p0 = new com.fasterxml.jackson.databind.ObjectMapper().readTree(f.toFile())
                .path("features").path(0).path("geometry").path("coordinates").path(0).path(0);
        assertEquals(lonLat[0], p0.get(0).asDouble(), 1e-8);
        assertEquals(lonLat[1], p0.get(1).asDouble(), 1e-8);
        double[] back2 = ModulesGeoJsonReader.rings(f).get(0);
        for (int k = 0; k < 4; k++) {
            assertEquals(c[k].x(), back2[3 * k], 0.001);
            assertEquals(c[k].y(), back2[3 * k + 1], 0.001);
        }
    }
}
