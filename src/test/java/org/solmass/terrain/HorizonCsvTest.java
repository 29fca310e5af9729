package org.solmass.terrain;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;
import org.solmass.scene.HorizonProfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class HorizonCsvTest {
    /**
     * Rows at uneven spacing are joined linearly in azimuth and across north (the definition of the
     * file format, docs/terrain.md): halfway between 350 deg (4) and 20 deg (10) is 5 deg, at 4 + 6 x 15/30 = 7.
     */
    @Test
    void rowsAreJoinedLinearlyAcrossNorth() {
        HorizonProfile h = HorizonCsv.parse("azimuth_deg,elevation_deg\n# measured on site (invented)\n20,10\n90,2\n200,12.5\n350,4\n", "h.csv");
        assertEquals(7.0, h.elevationDegAt(5), 1e-12);
        assertEquals(10.0, h.elevationDegAt(20), 1e-12);
        assertEquals(2 + (12.5 - 2) * 55 / 110, h.elevationDegAt(145), 1e-12);
        assertEquals(4.0, h.elevationDegAt(350), 1e-12);
        assertEquals(HorizonCsv.SAMPLES, h.size());
    }

    @Test
    void negativeElevationsCountAsTheHorizontal() {
        HorizonProfile h = HorizonCsv.parse("azimuth_deg,elevation_deg\n0,-2\n120,-1\n240,-3\n", "h.csv");
        assertEquals(0, h.maxElevationDeg(), 0);
    }

    private static String message(String text) {
        return assertThrows(InputException.class, () -> HorizonCsv.parse(text, "h.csv")).getMessage();
    }

    @Test
    void badRowsAreNamedByFileAndLine() {
        assertEquals("h.csv:4: azimuths must increase from row to row, got 90 after 100",
                message("azimuth_deg,elevation_deg\n0,1\n100,2\n90,3\n"));
        assertEquals("h.csv:3: elevation_deg must lie in (-90, 90) degrees, got 95",
                message("azimuth_deg,elevation_deg\n0,1\n100,95\n200,3\n"));
        assertEquals("h.csv:2: azimuth_deg must lie in [0, 360) degrees from north, got 360",
                message("azimuth_deg,elevation_deg\n360,1\n"));
        assertEquals("h.csv:1: expected the header azimuth_deg,elevation_deg, got \"0,1\"", message("0,1\n10,2\n"));
        assertEquals("h.csv:3: elevation_deg: expected a number, got \"high\"", message("azimuth_deg,elevation_deg\n0,1\n10,high\n"));
        assertEquals("h.csv: expected at least 3 rows of azimuth_deg,elevation_deg around the horizon, got 2",
                message("azimuth_deg,elevation_deg\n0,1\n180,2\n"));
    }
}
