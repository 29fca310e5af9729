package org.solmass.geo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.solmass.model.MassingModel;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The bundled invented footprints (sample-geo/footprints.geojson, EPSG:32632) read and extruded. */
class GeoJsonFootprintsTest {
    static final Path FILE = Path.of("sample-geo/footprints.geojson");
    /** Central meridian of UTM zone 32, degrees east (common practice: zone n has 6n - 183). */
    static final double LON0 = 9.0;

    static GeoModel read() { return GeoJsonReader.read(FILE, GeoOptions.defaults()); }

    @Test
    void siteLatitudeLongitudeMatchSnyderInverseTransverseMercator() {
        GeoReference ref = read().reference();
        assertEquals(32632, ref.file().epsg());
        // the origin is the footprints' bounding-box centre (559980..560060, 5329990..5330042) rounded
        assertEquals(560020.0, ref.originX(), 0.0);
        assertEquals(5330016.0, ref.originY(), 0.0);
        double[] ll = TransverseMercator.inverseUtm(ref.originX(), ref.originY(), LON0);
        assertEquals(ll[0], ref.latitudeDeg(), 1e-6, "latitude vs Snyder (1987) eqs. 8-17..8-25");
        assertEquals(ll[1], ref.longitudeDeg(), 1e-6, "longitude vs Snyder (1987) eqs. 8-17..8-25");
    }

    @Test
    void northAngleIsMinusTheMeridianConvergence() {
        GeoReference ref = read().reference();
        double gamma = TransverseMercator.convergenceDeg(ref.latitudeDeg(), ref.longitudeDeg(), LON0);
        double sphere = TransverseMercator.sphereConvergenceDeg(ref.latitudeDeg(), ref.longitudeDeg(), LON0);
        assertTrue(gamma > 0.5 && gamma < 0.7, "east of the central meridian in the north: gamma > 0, got " + gamma);
        assertEquals(sphere, gamma, 1e-5, "ellipsoid series vs the sphere's closed form (eta^2 terms are tiny here)");
        assertEquals(-gamma, ref.northDeg(), 1e-6, "true north lies gamma anticlockwise of grid north");
    }

    @Test
    void patchAreasAreFootprintPerimeterTimesHeightPlusRoofArea() throws Exception {
        MassingModel m = read().model();
        assertEquals(java.util.List.of("Hall A", "Tower B", "Annex C"), m.blockNames());
        PatchSet ps = Patcher.build(m, new PatchOptions(1.0, Set.of(), false));
        JsonNode features = new ObjectMapper().readTree(Files.readString(FILE)).get("features");
        double[] heights = {12.0, 8 * GeoOptions.DEFAULT_STOREY_HEIGHT_M, 6.0};
        for (int f = 0; f < 3; f++) {
            JsonNode g = features.get(f).get("geometry");
            double perimeter = 0, area = 0;
            Iterable<JsonNode> polys = g.get("type").asText().equals("Polygon") ? java.util.List.of(g.get("coordinates")) : g.get("coordinates");
            for (JsonNode poly : polys) {
                for (int r = 0; r < poly.size(); r++) {
                    JsonNode ring = poly.get(r);
                    double a2 = 0;
                    for (int i = 0; i + 1 < ring.size(); i++) {
                        double x0 = ring.get(i).get(0).asDouble(), y0 = ring.get(i).get(1).asDouble();
                        double x1 = ring.get(i + 1).get(0).asDouble(), y1 = ring.get(i + 1).get(1).asDouble();
                        perimeter += Math.hypot(x1 - x0, y1 - y0);
                        a2 += x0 * y1 - x1 * y0;   // shoelace
                    }
                    area += r == 0 ? Math.abs(a2) / 2 : -Math.abs(a2) / 2;
                }
            }
            double walls = 0, roof = 0;
            for (Patch p : ps.patches()) {
                if (p.block() != f) continue;
                if (p.kind() == SurfaceKind.FACADE) walls += p.areaM2();
                else if (p.kind() == SurfaceKind.ROOF) roof += p.areaM2();
                else throw new AssertionError("unexpected patch kind " + p.kind());
            }
            String b = m.blockNames().get(f);
            assertEquals(perimeter * heights[f], walls, 1e-6 * walls, b + ": walls = perimeter x height");
            assertEquals(area, roof, 1e-6 * roof, b + ": roof = footprint area (shoelace)");
        }
    }

    @Test
    void localFrameKeepsMillimetresAndMapsBackToTheFileCoordinates() {
        GeoReference ref = read().reference();
        double[] local = ref.toLocal(560060.0, 5330020.0, 24.0);
        double[] back = ref.toFile(local[0], local[1], local[2]);
        assertEquals(560060.0, back[0], 1e-6);
        assertEquals(5330020.0, back[1], 1e-6);
        assertEquals(24.0, back[2], 0.0);
        assertEquals(Math.hypot(40, 4), Math.hypot(local[0], local[1]), 1e-9, "the rotation keeps distances from the origin");
        // the same corner given in WGS84 longitude/latitude (as a terrain model in another CRS would) lands within 1 mm
        Crs wgs = Crs.epsg(Crs.WGS84, "test");
        double[] ll = ref.work().toWgs84(560060.0, 5330020.0);
        double[] viaWgs = ref.toLocal(wgs, ll[0], ll[1], 24.0);
        assertEquals(local[0], viaWgs[0], 1e-3);
        assertEquals(local[1], viaWgs[1], 1e-3);
    }
}
