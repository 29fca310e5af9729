package org.solmass.terrain;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** GeoTIFF DEMs written with the NGA TIFF library (invented heights) read back with their georeferencing. */
class GeoTiffDemTest {
    @TempDir Path dir;

    private Path write(GeoTiffFixture f) throws IOException {
        Path p = dir.resolve("dem.tif");
        Files.write(p, f.bytes());
        return p;
    }

    /**
     * A plane z = 100 + 0.02 x - 0.01 y sampled at pixel centres (PixelIsArea: a sample stands at its
     * pixel's centre, GeoTIFF 1.1, OGC 19-008r4, 7.3.2): bilinear interpolation of a plane is the plane
     * itself, anywhere inside the grid.
     */
    @Test
    void aPlaneReadsBackAtPixelCentresWithItsEpsgCode() throws IOException {
        GeoTiffFixture f = new GeoTiffFixture().grid(20, 10, 500_000, 5_600_000, 5)
                .heights((x, y) -> 100 + 0.02 * (x - 500_000) - 0.01 * (y - 5_600_000));
        Dem d = GeoTiffDem.read(write(f), 0, "terrain.dem_epsg");
        assertEquals(25832, d.epsg());
        assertEquals(500_002.5, d.minX(), 1e-9);
        assertEquals(5_599_997.5, d.maxY(), 1e-9);
        assertEquals(5, d.dx(), 0);
        double x = 500_031.7, y = 5_599_981.1;
        assertEquals(100 + 0.02 * (x - 500_000) - 0.01 * (y - 5_600_000), d.heightAt(x, y), 1e-4); // float samples
        assertTrue(Double.isNaN(d.heightAt(500_000, 5_600_000)), "outside the sample grid");
    }

    @Test
    void nodataSamplesAreHoles() throws IOException {
        GeoTiffFixture f = new GeoTiffFixture().grid(4, 4, 0, 100, 10).nodata(-9999)
                .heights((x, y) -> x > 20 && y > 80 ? Double.NaN : 7.0);
        Dem d = GeoTiffDem.read(write(f), 0, "terrain.dem_epsg");
        assertTrue(Double.isNaN(d.at(3, 0)));
        assertEquals(7.0, d.at(0, 3), 0);
    }

    @Test
    void aTiffWithoutGeoreferencingIsRefused() throws IOException {
        Path p = write(new GeoTiffFixture().noGeoreferencing());
        InputException e = assertThrows(InputException.class, () -> GeoTiffDem.read(p, 0, "terrain.dem_epsg"));
        assertEquals(p + ": has no georeferencing; expected the GeoTIFF tags ModelTiepoint and ModelPixelScale of a north-up grid",
                e.getMessage());
    }

    @Test
    void aGeographicGridIsRefusedAndAMissingCrsNeedsTheStudyKey() throws IOException {
        Path geo = write(new GeoTiffFixture().geoKeys(1024, 2, 2048, 4326));
        assertEquals(geo + ": is in geographic coordinates (degrees, EPSG:4326); expected a projected grid in metres"
                + " (reproject it, e.g. to its UTM zone)",
                assertThrows(InputException.class, () -> GeoTiffDem.read(geo, 0, "terrain.dem_epsg")).getMessage());
        Path none = write(new GeoTiffFixture().geoKeys());
        assertEquals(none + ": declares no coordinate system (no GeoKeyDirectory tag); give its EPSG code in terrain.dem_epsg",
                assertThrows(InputException.class, () -> GeoTiffDem.read(none, 0, "terrain.dem_epsg")).getMessage());
        assertEquals(31256, GeoTiffDem.read(none, 31256, "terrain.dem_epsg").epsg());
    }
}
