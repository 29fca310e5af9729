package org.solmass.output;

import org.solmass.table.Numbers;
import org.solmass.table.ResultTable;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.surface.SurfaceKind;

import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;
import static org.solmass.output.Fixtures.patch;

class PatchCsvTest {
    @TempDir Path dir;

    static ResultTable table() {
        ResultTable t = new ResultTable(List.of(
                patch(0, "B0-S0-P0000", 0, "Block, \"north\"", SurfaceKind.ROOF, 1.0),
                patch(1, "B0-S1-P0001", 0, "Block, \"north\"", SurfaceKind.FACADE, 0.3333333),
                patch(2, "B1-S2-P0000", 1, "Tower", SurfaceKind.GROUND, 0.25)));
        t.put(org.solmass.metrics.ColumnCatalogue.of("sky_view_factor"), new double[] {1.0, 0.41234567, Double.NaN});
        t.put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2"), new double[] {1103.456, 512.005, -0.001});
        t.put(org.solmass.metrics.ColumnCatalogue.of("shading_loss_pct"), new double[] {0, 37.5, 100});
        return t;
    }

    @Test
    void roundTripThroughTheReaderKeepsValuesToTheirDecimals() throws Exception {
        Path f = dir.resolve("patches.csv");
        PatchCsvWriter.write(f, table());
        // a note added by hand above the header (Solmass writes none): the reader skips it
        Files.writeString(f, "# invented fixture\n# units: see docs/outputs.md\n" + Files.readString(f));
        PatchCsvReader.Table r = PatchCsvReader.read(f);
        assertEquals(List.of("B0-S0-P0000", "B0-S1-P0001", "B1-S2-P0000"), r.ids());
        assertEquals(List.of("sky_view_factor", "annual_kwh_m2", "shading_loss_pct"), r.resultColumns());
        assertEquals(List.of("invented fixture", "units: see docs/outputs.md"), r.comments());
        assertEquals("Block, \"north\"", r.block(1));
        assertEquals(SurfaceKind.FACADE, r.kind(1));
        assertEquals(1, r.surface(1));
        assertEquals(0.4123, r.value("B0-S1-P0001", "sky_view_factor"), 0);   // 4 decimals for ratios
        assertTrue(Double.isNaN(r.value("B1-S2-P0000", "sky_view_factor")));  // NaN written as an empty cell
        assertEquals(1103.46, r.value("B0-S0-P0000", "annual_kwh_m2"), 0);    // 2 decimals for kWh/m2
        assertEquals(512.01, r.value("B0-S1-P0001", "annual_kwh_m2"), 0);     // half away from zero
        assertEquals(0.0, r.value("B1-S2-P0000", "annual_kwh_m2"), 0);
        assertEquals(0.3333, r.value("B0-S1-P0001", "area_m2"), 0);
        assertEquals(90.0, r.value("B0-S1-P0001", "tilt_deg"), 0);
        assertEquals(-2.333, r.value("B0-S0-P0000", "y"), 0);                  // 3 decimals for coordinates
        assertTrue(Double.isNaN(r.value("no-such-patch", "annual_kwh_m2")));
    }

    @Test
    void commonsCsvReadsTheFileWithTheDocumentedHeader() throws Exception {
        Path f = dir.resolve("patches.csv");
        PatchCsvWriter.write(f, table());
        try (Reader in = Files.newBufferedReader(f);
             CSVParser p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in)) {
            assertEquals(List.of("patch_id", "block", "surface", "kind", "x", "y", "z", "nx", "ny", "nz", "area_m2",
                    "tilt_deg", "azimuth_deg", "sky_view_factor", "annual_kwh_m2", "shading_loss_pct"), p.getHeaderNames());
            List<CSVRecord> rows = p.getRecords();
            assertEquals(3, rows.size());
            assertEquals("Block, \"north\"", rows.get(0).get("block"));
            assertEquals("roof", rows.get(0).get("kind"));
            assertEquals("1103.46", rows.get(0).get("annual_kwh_m2"));
            assertEquals("1.0000", rows.get(0).get("sky_view_factor"));
            assertEquals("0.00", rows.get(2).get("annual_kwh_m2"));     // -0.001 rounds to 0.00, never "-0.00"
            assertEquals("", rows.get(2).get("sky_view_factor"));
            assertEquals("-1.00000", rows.get(1).get("ny"));
            assertEquals("180.00", rows.get(1).get("azimuth_deg"));
        }
        String text = Files.readString(f);
        assertFalse(text.contains("\r"));
        assertFalse(text.startsWith("\uFEFF"));
    }

    @Test
    void sameInputGivesByteIdenticalFiles() throws Exception {
        Path a = dir.resolve("a.csv"), b = dir.resolve("b.csv");
        PatchCsvWriter.write(a, table());
        PatchCsvWriter.write(b, table());
        assertArrayEquals(Files.readAllBytes(a), Files.readAllBytes(b));
    }

    @Test
    void readerNamesLineAndColumnOfABadNumber() throws Exception {
        Path f = dir.resolve("patches.csv");
        PatchCsvWriter.write(f, table());
        List<String> lines = Files.readAllLines(f);
        lines.set(2, lines.get(2).replace("512.01", "lots"));
        Files.write(f, lines);
        InputException e = assertThrows(InputException.class, () -> PatchCsvReader.read(f));
        assertTrue(e.getMessage().contains("patches.csv:3") && e.getMessage().contains("annual_kwh_m2: expected a number, got \"lots\""), e.getMessage());
    }

    @Test
    void resultColumnMayNotShadowAPatchColumn() {
        ResultTable t = new ResultTable(List.of(patch(0, "p", 0, "A", SurfaceKind.ROOF, 1)));
        t.put(org.solmass.metrics.ColumnCatalogue.of("area_m2"), new double[] {1});
        assertThrows(IllegalArgumentException.class, () -> PatchCsvWriter.write(dir.resolve("x.csv"), t));
    }

    @Test
    void fixedDecimalsAreLocaleIndependent() {
        java.util.Locale before = java.util.Locale.getDefault();
        try {
            java.util.Locale.setDefault(java.util.Locale.GERMANY);
            assertEquals("1234567.50", Numbers.format(1234567.5, 2));
            assertEquals("-0.1250", Numbers.format(-0.125, 4));
            assertEquals("3", Numbers.format(2.5, 0));
            assertEquals("", Numbers.format(Double.POSITIVE_INFINITY, 2));
            assertEquals("12345678901234568.0", Numbers.format(12345678901234568.0, 1));   // exactly representable
        } finally {
            java.util.Locale.setDefault(before);
        }
    }
}
