package org.solmass.output;

import org.solmass.table.ResultTable;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

class ResultsFolderTest {
    @TempDir Path dir;

    @Test
    void writesEveryFileAndTheyReadBack() throws Exception {
        SyntheticScene s = SyntheticScene.district(2.0);
        Path obj = dir.resolve("district.obj");
        Files.writeString(obj, "# stands in for the model file of this invented scene\n");
        Study study = StudyReader.read(null, new StudyOverrides().model(obj).latitude(47.0).longitude(8.0).zone("+01:00")
                .context(List.of("Neighbour east", "Neighbour south")).out(dir.resolve("out")).monthHourCsv(true));
        ResultTable t = new ResultTable(s.patches);
        double[] v = s.values();
        t.put(org.solmass.metrics.ColumnCatalogue.of("sky_view_factor"), new double[v.length]);
        t.put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2"), v);
        float[] mh = new float[s.patches.size() * 288];
        for (int i = 0; i < mh.length; i++) mh[i] = (i % 24) * 10.5f;
        RunRecord run = RunRecord.of("test", study, "average-days", Map.of("patches", (long) v.length), Map.of(), Instant.EPOCH);
        List<Path> files = ResultsFolder.write(new ResultsFolder.Results(study, s.model(), t, mh, run, List.of("invented scene")));
        Path out = dir.resolve("out");
        assertEquals(List.of(out.resolve("patches.csv"), out.resolve("month-hour.csv"), out.resolve("summary.json"),
                out.resolve("map.png"), out.resolve("patches.gltf"), out.resolve("run.json")), files);
        assertEquals(v.length, PatchCsvReader.read(out.resolve("patches.csv")).size());
        Map<String, float[]> back = MonthHourCsvReader.read(out.resolve("month-hour.csv"));
        assertEquals(v.length, back.size());
        assertEquals(mh[288 + 5 * 24 + 7], back.get(s.patches.get(1).id())[5 * 24 + 7], 0.05f);   // 1 decimal
        JsonNode sum = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertEquals(v.length, sum.get("all").get("patches").asInt());
        assertEquals("invented scene", sum.get("cautions").get(0).asText());
        assertEquals(study, RunRecord.read(out).study());
        assertTrue(Files.size(out.resolve("map.png")) > 10_000);
    }

    @Test
    void readersRefuseAnIncompleteFolderAndWarnAboutARunJsonWithoutManifest() throws Exception {
        SyntheticScene s = SyntheticScene.district(4.0);
        Path obj = Files.writeString(dir.resolve("district.obj"), "# stands in for the model file of this invented scene\n");
        Path out = dir.resolve("out");
        Study study = StudyReader.read(null, new StudyOverrides().model(obj).latitude(47.0).longitude(8.0).zone("+01:00")
                .context(List.of("Neighbour east", "Neighbour south")).out(out).gltf(false));
        ResultTable t = new ResultTable(s.patches);
        t.put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2"), s.values());
        RunRecord run = RunRecord.of("test", study, "average-days", Map.of(), Map.of(), Instant.EPOCH);
        ResultsFolder.write(new ResultsFolder.Results(study, s.model(), t, null, run, List.of("invented scene")));

        PublishedRun ok = PublishedRun.open(out);
        assertTrue(ok.warnings().isEmpty());
        assertTrue(ok.has("patches.csv") && !ok.has("patches.gltf"));
        assertEquals(s.patches.size(), ok.read("patches.csv", PatchCsvReader::read).size());

        // run.json of a Solmass before manifests: read, with a warning
        com.fasterxml.jackson.databind.node.ObjectNode tree = (com.fasterxml.jackson.databind.node.ObjectNode)
                new ObjectMapper().readTree(out.resolve("run.json").toFile());
        tree.remove(List.of("run_id", "outputs"));
        Files.writeString(out.resolve("run.json"), tree.toString());
        PublishedRun legacy = PublishedRun.open(out);
        assertEquals(1, legacy.warnings().size());
        assertTrue(legacy.warnings().get(0).endsWith("was written by a Solmass without run manifests: its files cannot be checked "
                + "to belong to one run; run analyse again to be sure"), legacy.warnings().get(0));

        // outputs without run.json: incomplete; an empty folder: no results folder
        Files.delete(out.resolve("run.json"));
        InputException e = assertThrows(InputException.class, () -> PublishedRun.open(out));
        assertEquals(out + ": results folder is incomplete: the run that wrote it was interrupted (no run.json beside its files); "
                + "run analyse again", e.getMessage());
        Path empty = Files.createDirectory(dir.resolve("empty"));
        e = assertThrows(InputException.class, () -> PublishedRun.open(empty));
        assertTrue(e.getMessage().endsWith("no run record here (is this a Solmass results folder?)"), e.getMessage());
    }

    @Test
    void unknownBlockNamesInTheStudyAreNamed() {
        Study study = StudyReader.read(null, new StudyOverrides().model(Path.of("m.obj")).latitude(1.0).longitude(1.0)
                .zone("UTC").analyse(List.of("A", "Z")));
        InputException e = assertThrows(InputException.class, () -> StudyReader.checkBlockNames(study, List.of("A", "B")));
        assertEquals("--analyse: no block named \"Z\" in the model (it has: A, B)", e.getMessage());
        StudyReader.checkBlockNames(StudyReader.read(null, new StudyOverrides().model(Path.of("m.obj")).latitude(1.0)
                .longitude(1.0).zone("UTC").analyse(List.of("B"))), List.of("A", "B"));
    }

    @Test
    void columnLabelsAreReadable() {
        assertEquals("Annual irradiation", org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2").label());
        assertEquals("March irradiation", org.solmass.metrics.ColumnCatalogue.of("m03_kwh_m2").label());
        assertEquals("sun hours", org.solmass.metrics.ColumnCatalogue.of("sun_hours").label());   // declared by no stage
    }
}
