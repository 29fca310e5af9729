package org.solmass.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.fixtures.Boxes;
import org.solmass.output.RunRecord;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.viewer.RerunRequest;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Re-running from the viewer (no window: {@link ViewerBridge} is what the window calls) writes a new
 * variant folder and never touches earlier results. The study is an invented 10 x 8 x 12 m box on
 * clear sky at an invented site.
 */
class ViewerRerunVariantTest {
    @TempDir Path dir;

    private Study boxStudy(double patchM) throws IOException {
        Boxes.write(dir, "box.obj", Boxes.onGround(0, 0, 10, 8, 12).obj("box"));
        Path study = dir.resolve("study.json");
        Files.writeString(study, "{\n"
                + "  \"name\": \"Invented box\",\n"
                + "  \"model\": {\"file\": \"box.obj\", \"up\": \"z\", \"unit\": \"m\"},\n"
                + "  \"site\": {\"latitude\": 51.0, \"longitude\": 10.0, \"zone\": \"+01:00\"},\n"
                + "  \"climate\": {\"source\": \"clear-sky\"},\n"
                + "  \"patch_m\": " + patchM + ",\n"
                + "  \"rays\": 64,\n"
                + "  \"time_base\": \"average-days\",\n"
                + "  \"threads\": 2,\n"
                + "  \"outputs\": {\"folder\": \"results\", \"gltf\": false, \"map\": false}\n"
                + "}\n");
        return StudyReader.read(study);
    }

    /** Every file of a folder tree (relative path) with its bytes. */
    private static Map<String, byte[]> snapshot(Path folder) throws IOException {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(folder)) {
            for (Path p : (Iterable<Path>) s.filter(Files::isRegularFile)::iterator) m.put(folder.relativize(p).toString(), Files.readAllBytes(p));
        }
        return m;
    }

    private static void assertSameFiles(Map<String, byte[]> before, Map<String, byte[]> after) {
        assertEquals(before.keySet(), after.keySet());
        for (String f : before.keySet()) assertArrayEquals(before.get(f), after.get(f), f + " changed");
    }

    @Test
    void rerunWithAnotherPatchSizeWritesAVariantFolderAndLeavesTheFirstResultsByteIdentical() throws Exception {
        ViewerBridge bridge = new ViewerBridge(boxStudy(2.0));
        bridge.clock(Clock.fixed(Instant.parse("2026-12-02T01:15:30Z"), ZoneOffset.UTC));
        bridge.analyse((f, m) -> {}, () -> false);
        Path first = dir.resolve("results");
        assertTrue(Files.exists(first.resolve(RunRecord.FILE_NAME)));
        Map<String, byte[]> before = snapshot(first);
        String studyBefore = Files.readString(dir.resolve("study.json"));

        bridge.rerun(new RerunRequest(1.0, "clear-sky", "perez"), (f, m) -> {}, () -> false);

        assertSameFiles(before, snapshot(first));
        assertEquals(studyBefore, Files.readString(dir.resolve("study.json")), "the user's study file is not rewritten");
        Path variant = dir.resolve("results-variant-20261202-011530");
        assertEquals(variant, bridge.shownFolder());
        RunRecord run = RunRecord.read(variant);
        assertEquals(1.0, run.study().patchM(), 0.0);
        assertEquals(2.0, RunRecord.read(first).study().patchM(), 0.0);
        // the variant's study.json is a study the CLI reads, naming the new patch size and the variant folder
        Study again = StudyReader.read(variant.resolve(ViewerBridge.VARIANT_STUDY));
        assertEquals(1.0, again.patchM(), 0.0);
        assertEquals(variant, again.outputs().folder());
        JsonNode n = new ObjectMapper().readTree(variant.resolve(RunRecord.FILE_NAME).toFile());
        assertEquals(1.0, n.get("study").get("patch_m").asDouble(), 0.0);
        // a 10 x 8 x 12 m box (top 80 m2, walls 2 x 120 + 2 x 96 m2): halving the patch edge gives four times the patches
        assertEquals(4 * RunRecord.read(first).counts().get("patches"), run.counts().get("patches"));
    }

    @Test
    void aSecondRerunInTheSameSecondGetsItsOwnFolderAndLeavesTheFirstVariantUntouched() throws Exception {
        ViewerBridge bridge = new ViewerBridge(boxStudy(2.0));
        bridge.clock(Clock.fixed(Instant.parse("2026-12-02T01:15:30Z"), ZoneOffset.UTC));
        bridge.analyse((f, m) -> {}, () -> false);
        bridge.rerun(new RerunRequest(4.0, "clear-sky", "perez"), (f, m) -> {}, () -> false);
        Path v1 = dir.resolve("results-variant-20261202-011530");
        Map<String, byte[]> before = snapshot(v1);
        bridge.rerun(new RerunRequest(2.0, "clear-sky", "isotropic"), (f, m) -> {}, () -> false);
        assertSameFiles(before, snapshot(v1));
        Path v2 = dir.resolve("results-variant-20261202-011530-2");
        assertEquals(v2, bridge.shownFolder());
        assertEquals("isotropic", RunRecord.read(v2).study().sky().name());
    }

    @Test
    void aVariantNameThatExistsIsRefusedAndNothingIsWritten() throws Exception {
        ViewerBridge bridge = new ViewerBridge(boxStudy(2.0));
        bridge.analyse((f, m) -> {}, () -> false);
        Path taken = Files.createDirectory(dir.resolve("taller"));
        Files.writeString(taken.resolve("notes.txt"), "mine");
        InputException e = assertThrows(InputException.class,
                () -> bridge.rerun(new RerunRequest(1.0, "clear-sky", "perez", "taller"), (f, m) -> {}, () -> false));
        assertTrue(e.getMessage().contains("exists already"), e.getMessage());
        assertEquals("mine", Files.readString(taken.resolve("notes.txt")));
        assertEquals(1, snapshot(taken).size());
        // a given name that is free is used as is
        bridge.rerun(new RerunRequest(1.0, "clear-sky", "perez", "finer"), (f, m) -> {}, () -> false);
        assertEquals(1.0, RunRecord.read(dir.resolve("finer")).study().patchM(), 0.0);
        assertThrows(InputException.class,
                () -> bridge.rerun(new RerunRequest(1.0, "clear-sky", "perez", "../elsewhere"), (f, m) -> {}, () -> false));
    }

    /**
     * The study's results folders are listed (first results, then variants by name; an unrelated folder
     * beside them with a run.json of another study's name pattern is not), and opening a variant shows
     * its patches and makes its options the ones a further re-run starts from.
     */
    @Test
    void variantsAreListedBesideTheFirstResultsAndOneCanBeOpened() throws Exception {
        ViewerBridge bridge = new ViewerBridge(boxStudy(2.0));
        bridge.clock(Clock.fixed(Instant.parse("2026-12-02T01:15:30Z"), ZoneOffset.UTC));
        bridge.analyse((f, m) -> {}, () -> false);
        bridge.rerun(new RerunRequest(4.0, "clear-sky", "perez"), (f, m) -> {}, () -> false);
        bridge.rerun(new RerunRequest(1.0, "clear-sky", "isotropic", "finer"), (f, m) -> {}, () -> false);
        Path other = Files.createDirectory(dir.resolve("other-results"));
        Files.copy(dir.resolve("results").resolve(RunRecord.FILE_NAME), other.resolve(RunRecord.FILE_NAME));
        Files.createDirectory(dir.resolve("results-variant-empty"));   // no run.json: not listed
        assertEquals(java.util.List.of(dir.resolve("results"), dir.resolve("finer"), dir.resolve("results-variant-20261202-011530")),
                bridge.variants());
        org.solmass.viewer.ViewerData d = bridge.openVariant(dir.resolve("results-variant-20261202-011530"));
        assertEquals(RunRecord.read(dir.resolve("results-variant-20261202-011530")).counts().get("patches").intValue(), d.patches().size());
        assertEquals(4.0, bridge.currentOptions().patchSizeM(), 0.0);
        assertEquals(dir.resolve("results-variant-20261202-011530"), bridge.shownFolder());
        assertEquals("perez", bridge.currentOptions().skyModel());
    }

    /** A cancelled re-run leaves the data on show, its study and folder as they were; the first results stay byte-identical. */
    @Test
    void aCancelledRerunKeepsTheStudyOnShowAndTheFirstResults() throws Exception {
        ViewerBridge bridge = new ViewerBridge(boxStudy(2.0));
        bridge.analyse((f, m) -> {}, () -> false);
        Path first = dir.resolve("results");
        Map<String, byte[]> before = snapshot(first);
        assertThrows(java.util.concurrent.CancellationException.class,
                () -> bridge.rerun(new RerunRequest(1.0, "clear-sky", "isotropic", "cancelled"), (f, m) -> {}, () -> true));
        assertSameFiles(before, snapshot(first));
        assertEquals(2.0, bridge.currentOptions().patchSizeM(), 0.0);
        assertEquals("perez", bridge.currentOptions().skyModel());
        assertEquals(first, bridge.shownFolder());
        assertTrue(!Files.exists(dir.resolve("cancelled").resolve(RunRecord.FILE_NAME)));
        assertTrue(!bridge.variants().contains(dir.resolve("cancelled")), "a folder without a run is not listed");
    }
}
