package org.solmass.output;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;
import org.solmass.surface.SurfaceKind;

import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;
import static org.solmass.output.Fixtures.patch;

class MonthHourAndRunRecordTest {
    @TempDir Path dir;

    @Test
    void monthHourCsvHasOneRowPerPatchAndMonthWithTwentyFourHours() throws Exception {
        var patches = List.of(patch(0, "P0", 0, "A", SurfaceKind.ROOF, 1), patch(1, "P1", 0, "A", SurfaceKind.FACADE, 1));
        float[] v = new float[2 * 288];
        for (int i = 0; i < v.length; i++) v[i] = i * 0.25f;
        Path f = dir.resolve("month-hour.csv");
        MonthHourCsvWriter.write(f, patches, v);
        try (Reader in = Files.newBufferedReader(f);
             CSVParser p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in)) {
            assertEquals(26, p.getHeaderNames().size());
            assertEquals("h00", p.getHeaderNames().get(2));
            assertEquals("h23", p.getHeaderNames().get(25));
            List<CSVRecord> rows = p.getRecords();
            assertEquals(24, rows.size());
            CSVRecord r = rows.get(12 + 2);                 // patch P1, month 3
            assertEquals("P1", r.get("patch_id"));
            assertEquals("3", r.get("month"));
            assertEquals(String.format(java.util.Locale.ROOT, "%.1f", (288 + 2 * 24 + 5) * 0.25), r.get("h05"));
        }
        assertThrows(IllegalArgumentException.class, () -> MonthHourCsvWriter.write(f, patches, new float[10]));
    }

    @Test
    void runRecordRoundTripsAndDetectsAChangedModel() throws Exception {
        Path obj = dir.resolve("m.obj");
        Files.writeString(obj, "v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\n");
        Study s = StudyReader.read(null, new StudyOverrides().model(obj).latitude(47.0).longitude(8.0).zone("Europe/Zurich"));
        Map<String, Long> counts = new LinkedHashMap<>();
        counts.put("patches", 1200L);
        counts.put("triangles", 1L);
        Map<String, Double> timings = new LinkedHashMap<>();
        timings.put("load", 0.0123);
        timings.put("visibility", 2.5);
        RunRecord r = RunRecord.of("0.1.0-test", s, "average-days", counts, timings, Instant.parse("2026-01-02T03:04:05Z"));
        // SHA-256 of the 32 bytes above, computed independently with sha256sum
        assertEquals(sha256sum(obj), r.modelSha256());
        assertEquals(32, r.modelSizeBytes());   // 4 lines of 8 bytes
        Path out = dir.resolve("results");
        r.write(out.resolve(RunRecord.FILE_NAME));
        RunRecord back = RunRecord.read(out);
        assertEquals(r.study(), back.study());
        assertEquals(r.modelSha256(), back.modelSha256());
        assertEquals(counts, back.counts());
        assertEquals(List.of("load", "visibility"), List.copyOf(back.timingsS().keySet()));
        assertEquals(Instant.parse("2026-01-02T03:04:05Z"), back.finished());
        assertTrue(back.modelUnchanged());
        Files.writeString(obj, "v 0 0 0\nv 2 0 0\nv 0 1 0\nf 1 2 3\n");
        assertFalse(back.modelUnchanged());
        assertThrows(InputException.class, () -> RunRecord.read(dir.resolve("nowhere")));
    }

    private static String sha256sum(Path f) throws Exception {
        Process p = new ProcessBuilder("sha256sum", f.toString()).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.US_ASCII);
        p.waitFor();
        return out.split("\\s+")[0];
    }
}
