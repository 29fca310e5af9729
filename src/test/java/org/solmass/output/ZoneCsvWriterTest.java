package org.solmass.output;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.metrics.BestPlane;
import org.solmass.metrics.PvZones;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** zones.csv is a plain table: the header row first, no comment lines (the caution is in summary.json). */
class ZoneCsvWriterTest {
    @TempDir Path dir;

    @Test
    void zonesCsvStartsWithItsHeaderAndReadsBackAsAPlainTable() throws Exception {
        Path sf = dir.resolve("s.json");
        Files.writeString(sf, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"}}");
        Study study = StudyReader.read(sf);
        PvZones.Zone z = new PvZones.Zone(1, 0, "Block, north", 3, "B0-S3", new int[] {0, 1}, 12.5, 1000.0, 12500.0, 4.25,
                2000.0, 30, 180, List.of(), null);
        org.solmass.pv.YieldTotals t = new org.solmass.pv.YieldTotals(2000);
        t.add(new org.solmass.pv.EnergyBalance(2600e3, 100e3, 80e3, 20e3, 200e3, 100e3, 50e3, 50e3, 2000e3), 6, 1);
        org.solmass.pv.ZoneYield y = new org.solmass.pv.ZoneYield(1, 5, false, 30, 180, 2.0, 9.76, 1100, 1150,
                new double[12], t, null, new float[0], new float[0]);
        PvZones.Result r = new PvZones.Result(new BestPlane(36, 182, 1327.4), new double[2], new int[] {1, 1}, List.of(z));
        Path f = dir.resolve("zones.csv");
        ZoneCsvWriter.write(f, r.zones(), new double[] {3.5}, List.of(y));
        List<String> lines = Files.readAllLines(f);
        assertEquals(String.join(",", ZoneCsvWriter.COLUMNS), lines.get(0));
        try (CSVParser p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(Files.newBufferedReader(f))) {
            assertEquals(ZoneCsvWriter.COLUMNS, p.getHeaderNames());
            List<CSVRecord> rows = p.getRecords();
            assertEquals(1, rows.size());
            assertEquals("Block, north", rows.get(0).get("block"));
            assertEquals("12.50", rows.get(0).get("area_m2"));
            assertEquals("2000.0", rows.get(0).get("yield_kwh"));
            assertEquals("2000.0", rows.get(0).get("yield_m06_kwh"));
            assertEquals("0.769", rows.get(0).get("performance_ratio"));
        }
    }
}
