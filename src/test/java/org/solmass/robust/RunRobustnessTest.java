package org.solmass.robust;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.cli.Main;
import org.solmass.output.PatchCsvReader;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Runs as a user sees them: exit codes in process and in a child JVM, results that survive a SIGKILL
 * in the middle of writing, and patches.csv byte-identical whatever the thread count.
 */
class RunRobustnessTest {
    @TempDir Path dir;

    private Path model() throws IOException {
        Path m = dir.resolve("m.obj");
        if (!Files.exists(m)) Files.writeString(m, BadInputCatalogueTest.TWO_BOXES);
        return m;
    }

    /** analyse of the invented two-box model at an invented site, clear sky, few rays. */
    private List<String> analyse(Path out, String... extra) throws IOException {
        List<String> a = new ArrayList<>(List.of("analyse", "-q", "--model", model().toString(), "--lat", "51", "--lon", "10",
                "--zone", "Europe/Berlin", "--patch", "2", "--rays", "64", "--out", out.toString()));
        a.addAll(List.of(extra));
        return a;
    }

    private static Process child(List<String> args, String... jvmOptions) throws IOException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx512m"));
        cmd.addAll(List.of(jvmOptions));
        cmd.addAll(List.of("-cp", System.getProperty("java.class.path"), "org.solmass.cli.Main"));
        cmd.addAll(args);
        return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
    }

    private static int exitOf(Process p) throws InterruptedException {
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "child did not finish");
        return p.exitValue();
    }

    @Test
    void exitCodesInProcessAreZeroDoneTwoBadInputOneFailed() throws IOException {
        assertEquals(Main.EXIT_OK, Main.execute(analyse(dir.resolve("ok")).toArray(String[]::new)));
        assertEquals(Main.EXIT_INPUT, Main.execute("analyse", "-q", "--model", model().toString(), "--lat", "95", "--lon", "10",
                "--zone", "Europe/Berlin", "--out", dir.resolve("bad").toString()));
        assertEquals(Main.EXIT_INPUT, Main.execute("analyse", "--no-such-flag"));
        Path blocked = Files.writeString(dir.resolve("a-file"), "not a folder");
        assertEquals(Main.EXIT_FAILED, Main.execute(analyse(blocked).toArray(String[]::new)));
    }

    @Test
    void exitCodesOfAChildProcessAreZeroDoneTwoBadInputOneFailed() throws Exception {
        Path blocked = Files.writeString(dir.resolve("a-file"), "not a folder");
        Process ok = child(analyse(dir.resolve("ok"))), bad = child(List.of("analyse", "--lat", "95")),
                failed = child(analyse(blocked));
        assertEquals(0, exitOf(ok));
        assertEquals(2, exitOf(bad));
        assertEquals(1, exitOf(failed));
    }

    @Test
    void runKilledWhileWritingLeavesThePreviousResultsIntactAndReadable() throws Exception {
        Path out = dir.resolve("results");
        assertEquals(Main.EXIT_OK, Main.execute(analyse(out).toArray(String[]::new)));
        byte[] patches = Files.readAllBytes(out.resolve("patches.csv")), summary = Files.readAllBytes(out.resolve("summary.json"));

        // a different study into the same folder, paused with its first file complete but not yet moved in
        Process p = child(analyse(out, "--albedo", "0.6"), "-Dsolmass.test.pauseBeforeMoveMs=60000");
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (tempFiles(out).isEmpty()) {
            assertTrue(p.isAlive(), "the run ended before writing");
            assertTrue(System.nanoTime() < deadline, "no temporary file appeared");
            Thread.sleep(20);
        }
        p.destroyForcibly(); // SIGKILL on Linux
        assertTrue(p.waitFor(30, TimeUnit.SECONDS));
        assertNotEquals(0, p.exitValue());

        assertArrayEquals(patches, Files.readAllBytes(out.resolve("patches.csv")));
        assertArrayEquals(summary, Files.readAllBytes(out.resolve("summary.json")));
        PatchCsvReader.Table t = PatchCsvReader.read(out.resolve("patches.csv"));
        assertTrue(t.size() > 0);
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertTrue(s.isObject() && s.size() > 0);
    }

    private static List<Path> tempFiles(Path folder) throws IOException {
        try (Stream<Path> s = Files.list(folder)) {
            return s.filter(f -> f.getFileName().toString().endsWith(".tmp")).toList();
        }
    }

    @Test
    void patchesCsvIsByteIdenticalWithOneTwoAndFourThreadsAndAcrossRuns() throws IOException {
        byte[] first = null;
        for (String threads : new String[] {"1", "2", "4", "1"}) {
            Path out = dir.resolve("t" + threads + "-" + System.nanoTime());
            assertEquals(Main.EXIT_OK, Main.execute(analyse(out, "--threads", threads, "--context", "east").toArray(String[]::new)));
            byte[] b = Files.readAllBytes(out.resolve("patches.csv"));
            if (first == null) first = b;
            else assertArrayEquals(first, b, "patches.csv with " + threads + " threads");
        }
    }

    @Test
    void analysePrintsAPlausibilityWarningForSwappedCoordinates() throws Exception {
        Path log = dir.resolve("stderr.txt");
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx512m",
                "-cp", System.getProperty("java.class.path"), "org.solmass.cli.Main", "analyse", "-q", "--model", model().toString(),
                "--lat", "10", "--lon", "51", "--zone", "Europe/Berlin", "--patch", "4", "--rays", "16", "--out", dir.resolve("w").toString()));
        Process p = new ProcessBuilder(cmd).redirectError(log.toFile()).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        assertEquals(0, exitOf(p));
        String err = Files.readString(log);
        assertTrue(err.contains("solmass: warning: the longitude 51.0000 is 36 degrees from the standard meridian 15.0 of the zone Europe/Berlin"), err);
        assertTrue(err.contains("[site-lat-lon-swapped]"), err);
        // and summary.json keeps it beside the cautions
        JsonNode texts = new ObjectMapper().readTree(dir.resolve("w").resolve("summary.json").toFile()).get("cautions");
        boolean kept = false;
        for (JsonNode t : texts) kept |= t.asText().startsWith("warning: the longitude 51.0000") && t.asText().endsWith("[site-lat-lon-swapped]");
        assertTrue(kept, texts.toString());
    }
}
