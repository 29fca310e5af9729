package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.study.StudyWriter;
import org.solmass.viewer.StudyDraft.Field;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The set-up's values as typed: errors per field in the window's words, and the study they make. */
class StudyDraftTest {
    @TempDir Path dir;

    private StudyDraft draft() throws Exception {
        Path obj = dir.resolve("block.obj");
        Files.writeString(obj, NewStudyEndToEndTest.model(1));
        return new StudyDraft(obj, List.of("lowblock", "shed", "tower"));
    }

    @Test
    void eachMissingOrWrongValueIsNamedAtItsFieldWithoutFlagsOrKeys() throws Exception {
        StudyDraft d = draft();
        d.latitude = "north";
        d.longitude = "200";
        d.zone = "Atlantis/Capital";
        d.patch = "0";
        d.rays = "10.5";
        java.util.Arrays.fill(d.analysed, false);
        Map<Field, String> e = d.check();
        assertEquals(java.util.Set.of(Field.LATITUDE, Field.LONGITUDE, Field.ZONE, Field.PATCH, Field.RAYS, Field.BLOCKS), e.keySet());
        assertTrue(e.get(Field.LATITUDE).startsWith("\"north\" is not a number"), e.get(Field.LATITUDE));
        assertTrue(e.get(Field.LONGITUDE).endsWith("200 is outside."), e.get(Field.LONGITUDE));
        for (String m : e.values()) {
            assertFalse(m.contains("--"), "no command-line flag: " + m);
            assertFalse(m.matches(".*\\b[a-z]+[._][a-z_]+\\b.*") && !m.contains("e.g."), "no study key: " + m);
        }
        StudyDraft.Incomplete x = assertThrows(StudyDraft.Incomplete.class, d::study);
        assertEquals(e, x.errors);
    }

    @Test
    void aCompleteDraftIsTheStudyItsSavedFileReadsBackAs() throws Exception {
        StudyDraft d = draft();
        d.latitude = "51,5";      // a decimal comma, as typed on many keyboards
        d.longitude = "-0.12";
        d.zone = "Europe/London";
        d.toggle(2);              // the tower becomes context
        Study s = d.study();
        assertEquals(51.5, s.site().latitudeDeg());
        assertEquals(List.of("lowblock", "shed"), s.model().analyse());
        assertEquals(List.of("tower"), s.model().context());
        assertTrue(s.climate().isClearSky());
        Path file = Path.of(d.studyFile);
        Files.writeString(file, d.studyText());
        assertEquals(StudyWriter.toJson(s), StudyWriter.toJson(StudyReader.read(file)), "the saved file reads back as the same study");
    }

    @Test
    void offsetsAreTimeZonesInTheUsualSpellings() {
        assertEquals(ZoneOffset.ofHours(1), offset("+01:00"));
        assertEquals(ZoneOffset.ofHours(1), offset("UTC+1"));
        assertEquals(ZoneOffset.ofHours(-5), offset("-5"));
        assertEquals("Asia/Kolkata", StudyDraft.zoneId("Asia/Kolkata").getId());
        assertNull(StudyDraft.zoneId("Berlin"));
    }

    private static ZoneOffset offset(String typed) {
        return StudyDraft.zoneId(typed).getRules().getOffset(java.time.Instant.EPOCH);
    }

    @Test
    void pipelineMessagesLoseTheirFlagsAndKeys() {
        assertEquals("Set the model's unit to mm", GuiWords.of("set model.unit (--unit) to mm"));
        assertEquals("The patch size differs (A 2 m, B 1 m)", GuiWords.of("patch_m differs (A 2 m, B 1 m)"));
    }
}
