package org.solmass.study;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.MonthDay;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The sun_hours, pv and outputs.gltf keys of docs/study-file.md. */
class MetricsKeysTest {
    @TempDir Path dir;

    private Study read(String extra) throws Exception {
        Path p = dir.resolve("s.json");
        Files.writeString(p, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"}"
                + extra + "}");
        return StudyReader.read(p);
    }

    private String error(String extra) {
        return assertThrows(InputException.class, () -> read(extra)).getMessage();
    }

    @Test
    void defaultsAreTheDocumentedOnes() throws Exception {
        Study s = read("");
        assertEquals(List.of(MonthDay.of(3, 21)), s.sunHours().dates());
        assertEquals(5, s.sunHours().stepMinutes());
        assertEquals(5.0, s.sunHours().minElevationDeg());
        assertEquals(Study.Pv.DEFAULTS, s.pv());
        assertEquals(org.solmass.pv.ModuleSpec.DEFAULT, s.pv().layout().module());
        assertTrue(s.outputs().gltf());
    }

    @Test
    void keysReadAndWriteBack() throws Exception {
        Study s = read(", \"climate\": {\"year\": 2024}, \"sun_hours\": {\"dates\": [\"02-29\", \"12-21\"], \"step_minutes\": 10, \"min_elevation_deg\": 0},"
                + " \"pv\": {\"suitable_pct\": 75, \"min_zone_m2\": 4, \"module_efficiency\": 0.22, \"performance_ratio\": 0.85},"
                + " \"outputs\": {\"gltf\": false}");
        assertEquals(List.of(MonthDay.of(2, 29), MonthDay.of(12, 21)), s.sunHours().dates());
        assertEquals(new Study.SunHours(List.of(MonthDay.of(2, 29), MonthDay.of(12, 21)), 10, 0), s.sunHours());
        assertEquals(75, s.pv().suitablePct());
        assertEquals(4, s.pv().minZoneM2());
        assertEquals(0.85, s.pv().performanceRatio());
        assertEquals(0.22, s.pv().moduleEfficiency(), 1e-12);
        assertEquals(0.22 * 1000 * org.solmass.pv.ModuleSpec.DEFAULT.areaM2(), s.pv().layout().module().stcPowerW(), 1e-9);
        assertTrue(!s.outputs().gltf());
        Path again = dir.resolve("again.json");
        Files.writeString(again, StudyWriter.toJson(s));
        Study t = StudyReader.read(again);
        assertEquals(s.sunHours(), t.sunHours());
        assertEquals(s.pv(), t.pv());
        assertEquals(s.outputs(), t.outputs());
    }

    @Test
    void layoutKeysReadAndWriteBack() throws Exception {
        Study s = read(", \"pv\": {\"setback_m\": 0.6, \"rack_tilt_deg\": 20, \"rack_azimuth_deg\": 170, \"ground_coverage_ratio\": 0.5,"
                + " \"rack_clearance_m\": 0.3, \"flat_max_tilt_deg\": 8, \"facades\": true,"
                + " \"module\": {\"length_m\": 2.0, \"width_m\": 1.0, \"power_w\": 420, \"temp_coeff_pct_per_k\": -0.3, \"substrings\": 2}}");
        org.solmass.pv.LayoutOptions lo = s.pv().layout();
        assertEquals(new org.solmass.pv.ModuleSpec(2.0, 1.0, 420, -0.003, 2), lo.module());
        assertEquals(0.6, lo.setbackM());
        assertEquals(20, lo.rackTiltDeg());
        assertEquals(170, lo.rackAzimuthDeg(51));
        assertEquals(0.5, lo.groundCoverageRatio());
        assertEquals(2.0, lo.pitchM(), 1e-12);
        assertEquals(0.3, lo.rackClearanceM());
        assertEquals(8, lo.flatMaxTiltDeg());
        assertTrue(lo.facades());
        assertEquals(0.21, s.pv().moduleEfficiency(), 1e-12);
        Path again = dir.resolve("again.json");
        Files.writeString(again, StudyWriter.toJson(s));
        assertEquals(s.pv(), StudyReader.read(again).pv());
        assertEquals(180, read("").pv().layout().rackAzimuthDeg(51));
        assertEquals(0, read("").pv().layout().rackAzimuthDeg(-33));
    }

    @Test
    void badValuesNameTheKey() {
        assertTrue(error(", \"sun_hours\": {\"dates\": [\"13-01\"]}").contains("sun_hours.dates[0]"));
        assertTrue(error(", \"sun_hours\": {\"dates\": [\"3-21\"]}").contains("MM-DD"));
        assertTrue(error(", \"sun_hours\": {\"dates\": [\"02-29\"]}").contains("2025"));
        assertTrue(error(", \"sun_hours\": {\"dates\": [\"03-21\", \"03-21\"]}").contains("twice"));
        assertTrue(error(", \"sun_hours\": {\"step_minutes\": 7}").contains("sun_hours.step_minutes"));
        assertTrue(error(", \"pv\": {\"suitable_pct\": 120}").contains("pv.suitable_pct"));
        assertTrue(error(", \"pv\": {\"module_efficiency\": 0}").contains("pv.module_efficiency"));
        assertTrue(error(", \"pv\": {\"colour\": 1}").contains("pv"));
        assertTrue(error(", \"pv\": {\"ground_coverage_ratio\": 1}").contains("pv.ground_coverage_ratio"));
        assertTrue(error(", \"pv\": {\"row_pitch_m\": 0.5}").contains("pv.row_pitch_m"));
        assertTrue(error(", \"pv\": {\"module\": {\"width_m\": 2.5}}").contains("pv.module.width_m"));
        assertTrue(error(", \"pv\": {\"module_efficiency\": 0.2, \"module\": {\"power_w\": 400}}").contains("not both"));
    }

    @Test
    void sunHoursDateFlagsReplaceTheFileListAndNameTheFlag() throws Exception {
        Path p = dir.resolve("f.json");
        Files.writeString(p, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"},"
                + " \"sun_hours\": {\"dates\": [\"06-21\"]}}");
        Study s = StudyReader.read(p, new StudyOverrides().sunHoursDates(List.of("02-01", "03-01")));
        assertEquals(List.of(MonthDay.of(2, 1), MonthDay.of(3, 1)), s.sunHours().dates());
        String msg = assertThrows(InputException.class,
                () -> StudyReader.read(p, new StudyOverrides().sunHoursDates(List.of("99-99")))).getMessage();
        assertTrue(msg.contains("--sun-hours-date"), msg);
    }
}
