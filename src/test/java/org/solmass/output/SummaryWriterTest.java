package org.solmass.output;

import org.solmass.table.ResultTable;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;
import static org.solmass.output.Fixtures.patch;

class SummaryWriterTest {
    @TempDir Path dir;

    /** Four patches: A roof 2 m2 @1000, A facade 1 m2 @400, B roof 3 m2 @700, B ground 4 m2 @200 (kWh/m2). */
    static ResultTable fixture() {
        ResultTable t = new ResultTable(List.of(
                patch(0, "A-0", 0, "A", SurfaceKind.ROOF, 2),
                patch(1, "A-1", 0, "A", SurfaceKind.FACADE, 1),
                patch(2, "B-0", 1, "B", SurfaceKind.ROOF, 3),
                patch(3, "B-1", 1, "B", SurfaceKind.GROUND, 4)));
        t.put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2"), new double[] {1000, 400, 700, 200});
        t.put(org.solmass.metrics.ColumnCatalogue.of("sky_view_factor"), new double[] {1, 0.5, Double.NaN, 0.25});
        return t;
    }

    private static JsonNode summary() {
        return SummaryWriter.toTree(fixture(), new SummaryWriter.Spec(List.of("annual_kwh_m2", "sky_view_factor", "not_there"),
                "annual_kwh_m2", List.of(300.0, 600.0, 900.0)), null, List.of("invented fixture"));
    }

    @Test
    void areaWeightedMeanMinMaxAndTotalMatchHandComputation() {
        JsonNode all = summary().get("all");
        assertEquals(4, all.get("patches").asInt());
        assertEquals(10.0, all.get("area_m2").asDouble());
        JsonNode a = all.get("annual_kwh_m2");
        // (2*1000 + 1*400 + 3*700 + 4*200) / 10 = 5300 / 10 = 530
        assertEquals(530.0, a.get("mean").asDouble(), 0);
        assertEquals(200.0, a.get("min").asDouble(), 0);
        assertEquals(1000.0, a.get("max").asDouble(), 0);
        assertEquals(5300.0, a.get("total_kwh").asDouble(), 0);
        // sky view factor: the NaN patch (B roof) is left out: (2*1 + 1*0.5 + 4*0.25) / 7 = 3.5 / 7 = 0.5
        assertEquals(0.5, all.get("sky_view_factor").get("mean").asDouble(), 0);
        assertEquals(1, all.get("sky_view_factor").get("missing").asInt());
        assertNull(all.get("sky_view_factor").get("total_kwh"));
    }

    @Test
    void thresholdAreasMatchHandComputation() {
        JsonNode all = summary().get("all");
        JsonNode at = all.get("area_at_or_above_m2");
        assertEquals(6.0, at.get("300").asDouble(), 0);   // 2 + 1 + 3
        assertEquals(5.0, at.get("600").asDouble(), 0);   // 2 + 3
        assertEquals(2.0, at.get("900").asDouble(), 0);   // 2
        assertEquals(60.0, all.get("share_at_or_above_pct").get("300").asDouble(), 0);
        assertEquals(20.0, all.get("share_at_or_above_pct").get("900").asDouble(), 0);
    }

    @Test
    void groupsByKindAndByBlock() {
        JsonNode s = summary();
        assertEquals(820.0, s.get("by_kind").get("roof").get("annual_kwh_m2").get("mean").asDouble(), 0); // (2000+2100)/5
        assertEquals(List.of("roof", "facade", "ground"), names(s.get("by_kind")));
        assertEquals(800.0, s.get("by_block").get("A").get("annual_kwh_m2").get("mean").asDouble(), 0);   // 2400/3
        assertEquals(414.29, s.get("by_block").get("B").get("annual_kwh_m2").get("mean").asDouble(), 0);  // 2900/7 = 414.2857
        assertEquals(700.0, s.get("by_block").get("B").get("by_kind").get("roof").get("annual_kwh_m2").get("max").asDouble(), 0);
        assertFalse(s.get("columns").has("not_there"));
        assertEquals("invented fixture", s.get("cautions").get(0).asText());
    }

    @Test
    void keyOrderIsFixed() {
        JsonNode all = summary().get("all");
        assertEquals(List.of("patches", "area_m2", "annual_kwh_m2", "sky_view_factor", "area_at_or_above_m2", "share_at_or_above_pct"), names(all));
    }

    @Test
    void writtenFileParsesAndIsByteIdenticalForTheSameInput() throws Exception {
        Path a = dir.resolve("a.json"), b = dir.resolve("b.json");
        SummaryWriter.Spec spec = SummaryWriter.Spec.standard(SummaryWriter.DEFAULT_THRESHOLDS);
        SummaryWriter.write(a, fixture(), spec, null, List.of());
        SummaryWriter.write(b, fixture(), spec, null, List.of());
        assertArrayEquals(Files.readAllBytes(a), Files.readAllBytes(b));
        String text = Files.readString(a);
        JsonNode n = new ObjectMapper().readTree(text);
        assertEquals(530.0, n.get("all").get("annual_kwh_m2").get("mean").asDouble(), 0);
        assertTrue(text.endsWith("}\n") && !text.contains("\r"));
    }

    private static List<String> names(JsonNode n) {
        List<String> out = new ArrayList<>();
        for (Iterator<String> it = n.fieldNames(); it.hasNext(); ) out.add(it.next());
        return out;
    }
}
