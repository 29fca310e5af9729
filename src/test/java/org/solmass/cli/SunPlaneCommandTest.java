package org.solmass.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.*;

class SunPlaneCommandTest {

    private static String run(int expectExit, String... args) {
        PrintStream old = System.out;
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        System.setOut(new PrintStream(buf, true, StandardCharsets.UTF_8));
        try {
            assertEquals(expectExit, Main.execute(args), String.join(" ", args));
        } finally {
            System.setOut(old);
        }
        return buf.toString(StandardCharsets.UTF_8);
    }

    /** Reda & Andreas (2008) SPA worked example through the command line. */
    @Test
    void sunCommandReproducesTheSpaExample() throws Exception {
        String out = run(0, "sun", "--lat", "39.742476", "--lon", "-105.1786", "--elevation", "1830.14",
                "--time", "2003-10-17T12:30:30-07:00", "--pressure", "820", "--temperature", "11", "--delta-t", "67",
                "--tilt", "30", "--surface-azimuth", "170", "--format", "json");
        JsonNode j = new ObjectMapper().readTree(out);
        assertEquals(50.11162, j.get("zenith_deg").asDouble(), 1e-4);
        assertEquals(194.34024, j.get("azimuth_deg").asDouble(), 1e-4);
        assertEquals(39.88838, j.get("elevation_deg").asDouble(), 1e-4);
        assertEquals(25.18700, j.get("incidence_deg").asDouble(), 1e-4);
    }

    @Test
    void planeCommandCsvHasThePatchColumnNames() {
        String out = run(0, "plane", "--lat", "47.4", "--lon", "8.5", "--zone", "Europe/Zurich", "--tilt", "0",
                "--surface-azimuth", "180", "--format", "csv", "--sky", "isotropic");
        String[] lines = out.strip().split("\n");
        assertEquals("annual_kwh_m2,beam_kwh_m2,diffuse_kwh_m2,reflected_kwh_m2,m01_kwh_m2,m02_kwh_m2,m03_kwh_m2,m04_kwh_m2,"
                + "m05_kwh_m2,m06_kwh_m2,m07_kwh_m2,m08_kwh_m2,m09_kwh_m2,m10_kwh_m2,m11_kwh_m2,m12_kwh_m2", lines[0]);
        String[] v = lines[1].split(",");
        double annual = Double.parseDouble(v[0]), sum = 0;
        for (int m = 4; m < 16; m++) sum += Double.parseDouble(v[m]);
        assertEquals(annual, sum, 0.01, "annual = sum of months");
        assertEquals(0, Double.parseDouble(v[3]), 0, "horizontal plane sees no ground");
    }

    @Test
    void planeCommandJsonAndTextRun() throws Exception {
        JsonNode j = new ObjectMapper().readTree(run(0, "plane", "--lat", "-33.9", "--lon", "18.4", "--zone", "+02:00",
                "--tilt", "30", "--surface-azimuth", "0", "--format", "json", "--time-base", "hourly-year", "--year", "2025"));
        assertEquals("hourly-year", j.get("time_base").asText());
        assertTrue(j.get("annual_kwh_m2").asDouble() > 0);
        assertTrue(run(0, "plane", "--lat", "47", "--lon", "8", "--zone", "UTC+01:00", "--tilt", "90", "--surface-azimuth", "90").contains("year"));
    }

    @Test
    void badFlagsAreExitTwo() {
        run(2, "sun", "--lat", "95", "--lon", "0", "--time", "2025-01-01T12:00Z");
        run(2, "sun", "--lat", "45", "--lon", "0", "--time", "noon");
        run(2, "sun", "--lat", "45", "--lon", "0", "--time", "2025-01-01T12:00Z", "--tilt", "30");
        run(2, "plane", "--lat", "45", "--lon", "0", "--zone", "Nowhere/City", "--tilt", "30", "--surface-azimuth", "180");
        run(2, "plane", "--lat", "45", "--lon", "0", "--zone", "+01:00", "--tilt", "200", "--surface-azimuth", "180");
        run(2, "plane", "--lat", "45", "--lon", "0", "--zone", "+01:00", "--tilt", "20", "--surface-azimuth", "180", "--sky", "bright");
        run(2, "plane", "--lat", "45", "--lon", "0", "--zone", "+01:00", "--tilt", "20", "--surface-azimuth", "180", "--climate", "/no/such/file.csv");
        run(2, "plane", "--lat", "45", "--lon", "0", "--zone", "+01:00", "--tilt", "20", "--surface-azimuth", "180", "--albedo", "1.5");
    }
}
