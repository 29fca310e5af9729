package org.solmass.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.IrradianceUnit;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.*;

/** {@code solmass climate}: the report of an invented two-day file, as text and as JSON; the study keys of the reading. */
class ClimateCommandTest {
    /** Two invented June days at 51 N 10 E, semicolon + decimal comma, GHI in Wh/m2 per hour (= W/m2 for hourly steps). */
    static String twoDays() {
        StringBuilder b = new StringBuilder("# INVENTED\n\"Zeit\";\"GHI [Wh/m2]\";\"DHI [Wh/m2]\"\n");
        for (int d = 1; d <= 2; d++) for (int h = 0; h < 24; h++) {
            double g = h >= 6 && h <= 18 ? 600 * Math.sin(Math.PI * (h - 5.5) / 14) : 0;
            b.append(String.format("%02d.06.2025 %02d:00;%s;%s%n", d + 12, h, Long.toString(Math.round(g)), Long.toString(Math.round(g / 2))));
        }
        return b.toString();
    }

    private static String run(String... args) {
        PrintStream old = System.out;
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
            assertEquals(0, Main.execute(args));
        } finally {
            System.setOut(old);
        }
        return out.toString(StandardCharsets.UTF_8);
    }

    @Test
    void climateReportsTheDialectColumnsPeriodAndTotals(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("w.csv");
        Files.writeString(f, twoDays());
        String text = run("climate", f.toString(), "--lat", "51", "--lon", "10", "--zone", "Europe/Berlin", "--columns", "time=Zeit");
        assertTrue(text.contains("dialect      separator semicolon, decimal point, UTF-8, LF line ends, quoted cells"), text);
        assertTrue(text.contains("ghi = 'GHI [Wh/m2]' in Wh/m2 per step"), text);
        assertTrue(text.contains("period       2025-06-13T00:00 to 2025-06-14T23:00, 48 steps of 60 min (hourly-year)"), text);
        JsonNode j = new ObjectMapper().readTree(run("climate", f.toString(), "--lat", "51", "--lon", "10", "--zone", "Europe/Berlin",
                "--columns", "time=Zeit", "--format", "json"));
        // Wh/m2 per hour summed / 1000 = kWh/m2: the sum of the rounded values written above
        double sum = 0;
        for (int h = 6; h <= 18; h++) sum += Math.round(600 * Math.sin(Math.PI * (h - 5.5) / 14));
        assertEquals(2 * sum / 1000, j.at("/report/total/ghiKwhM2").asDouble(), 1e-9);
        assertEquals("semicolon", j.at("/report/reading/separator").asText());
        assertEquals(6, j.at("/report/months/0/month").asInt());
    }

    @Test
    void theStudyKeysOfTheReadingReachTheClimateSpec(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("w.csv"), twoDays());
        Path s = dir.resolve("s.json");
        Files.writeString(s, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"Europe/Berlin\"},"
                + " \"climate\": {\"source\": \"w.csv\", \"date_order\": \"dmy\", \"clock\": \"dst\", \"irradiance_unit\": \"Wh/m2\"}}");
        Files.writeString(dir.resolve("m.obj"), "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\n");
        Study study = StudyReader.read(s);
        ClimateSpec.Reading r = study.climateSpec().reading();
        assertEquals(new ClimateSpec.Reading(ClimateSpec.DateOrder.DMY, ClimateSpec.Clock.DST, IrradianceUnit.WH_M2), r);
    }
}
