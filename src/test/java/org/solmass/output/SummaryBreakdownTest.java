package org.solmass.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.cli.Main;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.fixtures.Boxes;
import org.solmass.output.PatchCsvReader;
import org.solmass.sky.Perez;
import org.solmass.sky.PreparedSky;
import org.solmass.sun.Site;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Path;
import java.time.ZoneId;
import java.util.Iterator;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** summary.json's facade breakdowns: by compass sector, by storey band, by surface. */
class SummaryBreakdownTest {
    @TempDir Path dir;

    @Test
    void compassSectorsAreCentredOnTheEightDirections() {
        assertEquals("N", SummaryWriter.Breakdown.sector(0));
        assertEquals("N", SummaryWriter.Breakdown.sector(22.4));
        assertEquals("NE", SummaryWriter.Breakdown.sector(22.5));
        assertEquals("S", SummaryWriter.Breakdown.sector(180));
        assertEquals("NW", SummaryWriter.Breakdown.sector(337.4));
        assertEquals("N", SummaryWriter.Breakdown.sector(337.5));
        assertEquals("N", SummaryWriter.Breakdown.sector(359.99));
        assertEquals("3-6 m", SummaryWriter.Breakdown.bandLabel(1, 3));
        assertEquals("2.5-5 m", SummaryWriter.Breakdown.bandLabel(1, 2.5));
    }

    /**
     * A lone 12 x 12 x 12 m box on open ground (invented), clear sky: the four facade sectors hold the
     * four walls, their areas add up to the facade total, the storey bands of 3 m hold a quarter each,
     * and each wall's area-weighted mean equals the unobstructed vertical plane of the same orientation
     * (the plane calculator, {@link PreparedSky#sum}) within 4 standard errors of the wall's patches
     * (they differ only by their ray seeds: nothing obstructs a lone box's walls). Ground albedo 0: the
 * ground by the box lies in its own shadow (shaded ground, the default), which the plane does not know.
     */
    @Test
    void loneBoxWallsMatchTheUnobstructedVerticalPlanes() throws Exception {
        Path model = Boxes.write(dir, "box.obj", Boxes.onGround(0, 0, 12, 12, 12).obj("box"));
        Path out = dir.resolve("out");
        assertEquals(Main.EXIT_OK, Main.execute("analyse", "-q", "--model", model.toString(), "--lat", "51", "--lon", "10",
                "--zone", "Europe/Berlin", "--patch", "1.5", "--rays", "256", "--albedo", "0", "--no-gltf", "--out", out.toString()));
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        JsonNode orient = s.get("by_facade_orientation");
        assertEquals(4, orient.size(), orient.toString());
        double sum = 0;
        for (Iterator<JsonNode> it = orient.elements(); it.hasNext(); ) sum += it.next().get("area_m2").asDouble();
        assertEquals(s.get("by_kind").get("facade").get("area_m2").asDouble(), sum, 1e-9);
        assertEquals(4 * 144, sum, 1e-6);
        JsonNode storeys = s.get("by_facade_storey");
        for (String band : new String[] {"0-3 m", "3-6 m", "6-9 m", "9-12 m"}) assertEquals(144, storeys.get(band).get("area_m2").asDouble(), 1e-6, band);

        Site site = new Site(51, 10, 0, ZoneId.of("Europe/Berlin"));
        WeatherSeries w = ClimateSource.load(site, ClimateSpec.clearSky());
        PreparedSky sky = PreparedSky.of(w, Perez.INSTANCE);
        PatchCsvReader.Table t = PatchCsvReader.read(out.resolve("patches.csv"));
        double[] az = t.column("azimuth_deg"), annual = t.column("annual_kwh_m2");
        for (Map.Entry<String, Double> e : Map.of("N", 0.0, "E", 90.0, "S", 180.0, "W", 270.0).entrySet()) {
            double plane = sky.sum(90, e.getValue(), 0.0).annualKwhM2();
            double mean = 0, sq = 0;
            int n = 0;
            for (int r = 0; r < t.size(); r++) {
                if (t.kind(r) != SurfaceKind.FACADE || !SummaryWriter.Breakdown.sector(az[r]).equals(e.getKey())) continue;
                mean += annual[r];
                sq += annual[r] * annual[r];
                n++;
            }
            mean /= n;
            double se = Math.sqrt(Math.max(0, sq / n - mean * mean) / (n - 1));
            double summarised = orient.get(e.getKey()).get("annual_kwh_m2").get("mean").asDouble();
            assertEquals(mean, summarised, 0.01, "equal patch areas: the area-weighted mean is the plain mean");
            assertTrue(Math.abs(mean - plane) <= 4 * se + 0.01,
                    e.getKey() + ": walls " + mean + " vs plane " + plane + " (standard error " + se + ")");
        }
    }
}
