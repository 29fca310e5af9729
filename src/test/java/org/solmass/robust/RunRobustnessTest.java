package org.solmass.robust;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.cli.Main;
import org.solmass.output.PatchCsvReader;
import org.solmass.output.Publication;
import org.solmass.output.PublishedRun;
import org.solmass.output.ResultsFolder;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Runs as a user sees them: exit codes in process and in a child JVM, a results folder that is one run
 * whatever happens while it is published (SIGKILL at every step, a full disk, a second run at the same
 * time, a run with fewer outputs), output permissions from the umask, and patches.csv byte-identical
 * whatever the thread count.
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
        assertEquals(Main.EXIT_INPUT, Main.execute(analyse(blocked).toArray(String[]::new)), "--out is a file: bad input, found before the work");
        System.setProperty(FAIL_AT_WRITE, "1");   // a full disk at the first output
        try {
            assertEquals(Main.EXIT_FAILED, Main.execute(analyse(dir.resolve("full")).toArray(String[]::new)));
        } finally {
            System.clearProperty(FAIL_AT_WRITE);
        }
    }

    @Test
    void exitCodesOfAChildProcessAreZeroDoneTwoBadInputOneFailed() throws Exception {
        Path blocked = Files.writeString(dir.resolve("a-file"), "not a folder");
        Process ok = child(analyse(dir.resolve("ok"))), bad = child(List.of("analyse", "--lat", "95")),
                notAFolder = child(analyse(blocked)), failed = child(analyse(dir.resolve("full")), "-D" + FAIL_AT_WRITE + "=2");
        assertEquals(0, exitOf(ok));
        assertEquals(2, exitOf(bad));
        assertEquals(2, exitOf(notAFolder));
        assertEquals(1, exitOf(failed));
    }

    private static final String FAIL_AT_WRITE = "solmass.test.failAtWrite";

    /** What a reader finds in a results folder: every file of one run, checked, or a refusal. */
    private record Seen(String runId, Map<String, byte[]> files, String refusal) {}

    private static Seen read(Path out) {
        try {
            PublishedRun run = PublishedRun.open(out);
            Map<String, byte[]> files = new LinkedHashMap<>();
            for (String name : ResultsFolder.OUTPUT_NAMES) {
                if (run.has(name)) files.put(name, run.read(name, RunRobustnessTest::bytes));
            }
            return new Seen(run.runId(), files, null);
        } catch (InputException e) {
            return new Seen(null, Map.of(), e.getMessage());
        }
    }

    private static byte[] bytes(Path p) {
        try {
            return Files.readAllBytes(p);
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /** The folder shows the complete run {@code before}: same id, same files byte for byte. */
    private static void assertShows(Seen before, Path out, String when) {
        Seen now = read(out);
        assertNull(now.refusal(), when + ": " + now.refusal());
        assertEquals(before.runId(), now.runId(), when);
        assertEquals(before.files().keySet(), now.files().keySet(), when);
        for (String f : before.files().keySet()) assertArrayEquals(before.files().get(f), now.files().get(f), when + ": " + f);
    }

    /** A child analyse whose merged stdout and stderr are collected line by line. */
    private static final class Watched {
        final Process process;
        final List<String> lines = java.util.Collections.synchronizedList(new ArrayList<>());

        Watched(List<String> args, String... jvmOptions) throws IOException {
            List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx512m"));
            cmd.addAll(List.of(jvmOptions));
            cmd.addAll(List.of("-cp", System.getProperty("java.class.path"), "org.solmass.cli.Main"));
            cmd.addAll(args);
            process = new ProcessBuilder(cmd).redirectErrorStream(true).start();
            Thread t = new Thread(() -> {
                try (var r = new java.io.BufferedReader(new java.io.InputStreamReader(process.getInputStream()))) {
                    for (String l; (l = r.readLine()) != null; ) lines.add(l);
                } catch (IOException ignored) {
                    // the process was killed
                }
            });
            t.setDaemon(true);
            t.start();
        }

        private boolean seen(String prefix) {
            synchronized (lines) {
                for (String l : lines) if (l.startsWith(prefix)) return true;
            }
            return false;
        }

        /** Waits until a line starts with {@code prefix} (true) or the process ends without one (false). */
        boolean awaitLine(String prefix) throws InterruptedException {
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
            while (System.nanoTime() < deadline) {
                if (seen(prefix)) return true;
                if (!process.isAlive()) {
                    Thread.sleep(300);   // let the reader thread take the last lines
                    return seen(prefix);
                }
                Thread.sleep(20);
            }
            fail("no line " + prefix + " within 120 s: " + lines);
            return false;
        }

        void kill() throws InterruptedException {
            process.destroyForcibly();   // SIGKILL on Linux
            assertTrue(process.waitFor(30, TimeUnit.SECONDS));
        }
    }

    /**
     * Kills a run (SIGKILL) before each step of publishing in turn (removing the old run.json, each
     * output's move, removing an output of the earlier run, moving run.json) and checks after each kill
     * that a reader sees the previous complete run or refuses the folder as incomplete; never a mix.
     * The earlier run writes month-hour.csv, the killed one does not, so removing it is one of the steps.
     */
    @Test
    void runKilledAtEveryStepOfPublishingLeavesThePreviousRunOrAnIncompleteFolderNeverAMix() throws Exception {
        Path out = dir.resolve("results");
        Files.writeString(Files.createDirectories(out).resolve("notes.txt"), "the user's own notes");
        int steps = 0;
        for (int k = 1; ; k++) {
            assertEquals(Main.EXIT_OK, Main.execute(analyse(out, "--month-hour").toArray(String[]::new)), "the earlier run, before kill " + k);
            Seen before = read(out);
            assertNull(before.refusal());
            Watched w = new Watched(analyse(out, "--albedo", "0.6"), "-Dsolmass.test.pauseBeforeMoveMs=60000",
                    "-Dsolmass.test.pauseAtMove=" + k);
            if (!w.awaitLine("solmass: test hook: before move " + k + ":")) {
                assertEquals(0, w.process.waitFor(), "the run without a step " + k + " finishes: " + w.lines);
                break;
            }
            w.kill();
            steps = k;
            Seen after = read(out);
            if (after.refusal() != null) {
                assertTrue(k > 1, "before the first step the folder still shows the earlier run: " + after.refusal());
                assertEquals(out + ": results folder is incomplete: the run that wrote it was interrupted "
                        + "(no run.json beside its files); run analyse again", after.refusal());
                assertEquals(Main.EXIT_INPUT, Main.execute("compare", out.toString(), out.toString()), "compare refuses it");
            } else {
                assertShows(before, out, "killed before step " + k);
            }
            assertEquals("the user's own notes", Files.readString(out.resolve("notes.txt")));
        }
        assertTrue(steps >= 8, "remove run.json, move patches, zones, summary, map, glTF, remove month-hour, move run.json: " + steps);
        Seen last = read(out);   // the last, unkilled run published completely, without the earlier run's month-hour.csv
        assertNull(last.refusal());
        assertFalse(Files.exists(out.resolve("month-hour.csv")));
        assertFalse(Files.exists(out.resolve(Publication.STAGING)));
    }

    @Test
    void aStaleLockOfAKilledRunIsTakenOverWithANote() throws Exception {
        Path out = dir.resolve("results");
        Watched killed = new Watched(analyse(out), "-Dsolmass.test.pauseBeforeMoveMs=60000", "-Dsolmass.test.pauseAtMove=2");
        assertTrue(killed.awaitLine("solmass: test hook: before move 2:"));
        killed.kill();
        Watched next = new Watched(analyse(out));
        assertEquals(0, next.process.waitFor(), next.lines.toString());
        assertTrue(next.awaitLine("solmass: note: an earlier run into " + out + " did not finish (pid " + killed.process.pid() + " on "),
                next.lines.toString());
        assertNull(read(out).refusal());
    }

    @Test
    void aSecondRunIntoAFolderInUseRefusesBeforeAnyWorkNamingTheFirst() throws Exception {
        Path out = dir.resolve("results");
        Watched first = new Watched(analyse(out), "-Dsolmass.test.pauseBeforeMoveMs=60000", "-Dsolmass.test.pauseAtMove=1");
        try {
            assertTrue(first.awaitLine("solmass: test hook: before move 1:"));
            java.io.StringWriter err = new java.io.StringWriter();
            picocli.CommandLine cl = Main.commandLine();
            cl.setErr(new java.io.PrintWriter(err, true));
            assertEquals(Main.EXIT_INPUT, cl.execute(analyse(out).toArray(String[]::new)));
            assertTrue(err.toString().startsWith("solmass: --out: " + out + " is in use by another Solmass run (pid "
                    + first.process.pid() + " on "), err.toString());
            assertTrue(err.toString().contains(", study \"m\" (from flags)); wait for it to finish or give another folder"), err.toString());
        } finally {
            first.kill();
        }
    }

    @Test
    void aRunWithFewerOutputsLeavesNoneOfTheEarlierRunsExtraFilesAndKeepsTheUsersFiles() throws IOException {
        Path out = dir.resolve("results");
        assertEquals(Main.EXIT_OK, Main.execute(analyse(out, "--month-hour").toArray(String[]::new)));
        assertTrue(Files.exists(out.resolve("patches.gltf")) && Files.exists(out.resolve("month-hour.csv")));
        Files.writeString(out.resolve("notes.txt"), "mine");
        Files.writeString(Files.createDirectories(out.resolve("compare")).resolve("delta.csv"), "also mine");
        assertEquals(Main.EXIT_OK, Main.execute(analyse(out, "--no-gltf").toArray(String[]::new)));
        assertFalse(Files.exists(out.resolve("patches.gltf")));
        assertFalse(Files.exists(out.resolve("month-hour.csv")));
        assertEquals("mine", Files.readString(out.resolve("notes.txt")));
        assertEquals("also mine", Files.readString(out.resolve("compare/delta.csv")));
        Seen s = read(out);
        assertNull(s.refusal());
        assertEquals(List.of("patches.csv", "zones.csv", "pv-series.csv", "modules.geojson", "summary.json", "map.png"),
                List.copyOf(s.files().keySet()));
    }

    /**
     * The outputs get the permissions of the user's umask: the child runs under {@code umask 027}, so
     * each file must be rw-r----- (0666 less 027, as POSIX open(2) creates files), not the rw------- of
     * temporary files.
     */
    @Test
    void outputFilesFollowTheUmask() throws Exception {
        Path out = dir.resolve("results");
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx512m",
                "-cp", System.getProperty("java.class.path"), "org.solmass.cli.Main"));
        cmd.addAll(analyse(out));
        StringBuilder sh = new StringBuilder("umask 027; exec");
        for (String c : cmd) sh.append(" '").append(c.replace("'", "'\\''")).append('\'');
        Process p = new ProcessBuilder("sh", "-c", sh.toString()).redirectErrorStream(true)
                .redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        assertEquals(0, exitOf(p));
        List<String> outputs = new ArrayList<>(List.of("run.json"));
        outputs.addAll(read(out).files().keySet());
        assertTrue(outputs.size() >= 5, outputs.toString());
        for (String f : outputs) {
            assertEquals("rw-r-----", java.nio.file.attribute.PosixFilePermissions.toString(
                    Files.getPosixFilePermissions(out.resolve(f))), f);
        }
    }

    /** A full disk (simulated: the k-th output fails half written) at each output in turn leaves the previous run whole. */
    @Test
    void aFullDiskAtAnyOutputLeavesThePreviousRunVerifiable() throws IOException {
        Path out = dir.resolve("results");
        assertEquals(Main.EXIT_OK, Main.execute(analyse(out).toArray(String[]::new)));
        Seen before = read(out);
        int outputs = before.files().size();
        assertTrue(outputs >= 5);
        for (int k = 1; k <= outputs; k++) {
            System.setProperty(FAIL_AT_WRITE, Integer.toString(k));
            try {
                assertEquals(Main.EXIT_FAILED, Main.execute(analyse(out, "--albedo", "0.6").toArray(String[]::new)), "full at " + k);
            } finally {
                System.clearProperty(FAIL_AT_WRITE);
            }
            assertShows(before, out, "disk full at output " + k);
            assertFalse(Files.exists(out.resolve(Publication.STAGING)), "staged files removed");
            assertTrue(tempFiles(out).isEmpty());
        }
        assertEquals(Main.EXIT_OK, Main.execute(analyse(out, "--albedo", "0.6").toArray(String[]::new)));
        assertNotEquals(before.runId(), read(out).runId());
    }

    /** A file changed after the run is refused by the readers instead of being shown with the others. */
    @Test
    void aFileThatDoesNotBelongToTheRecordedRunIsRefused() throws IOException {
        Path a = dir.resolve("a"), b = dir.resolve("b");
        assertEquals(Main.EXIT_OK, Main.execute(analyse(a).toArray(String[]::new)));
        assertEquals(Main.EXIT_OK, Main.execute(analyse(b, "--albedo", "0.6").toArray(String[]::new)));
        Files.copy(b.resolve("patches.csv"), a.resolve("patches.csv"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        InputException e = assertThrows(InputException.class, () -> PublishedRun.open(a).read("patches.csv", PatchCsvReader::read));
        assertEquals(a.resolve("patches.csv") + ": does not belong to the run recorded in run.json (its size or SHA-256 differs): "
                + "the file was changed after the run; run analyse again", e.getMessage());
        assertEquals(Main.EXIT_INPUT, Main.execute("compare", a.toString(), b.toString(), "--out", dir.resolve("c").toString()));
    }

    /** Throws what it is given, as running out of memory somewhere in a command would. */
    @picocli.CommandLine.Command(name = "exhaust")
    static final class Exhaust implements java.util.concurrent.Callable<Integer> {
        private final Throwable thrown;

        Exhaust(Throwable thrown) {
            this.thrown = thrown;
        }

        @Override
        public Integer call() {
            if (thrown instanceof Error e) throw e;
            throw (RuntimeException) thrown;
        }
    }

    @Test
    void runningOutOfMemoryIsExit1WithAMessageNotAStackTrace() {
        for (Throwable t : new Throwable[] {new OutOfMemoryError("Java heap space"),
                new java.util.concurrent.CompletionException(new OutOfMemoryError("Java heap space"))}) {
            picocli.CommandLine cl = Main.commandLine();
            cl.addSubcommand(new Exhaust(t));
            java.io.StringWriter err = new java.io.StringWriter();
            cl.setErr(new java.io.PrintWriter(err, true));
            assertEquals(Main.EXIT_FAILED, Main.execute(cl, "exhaust"), t.toString());
            List<String> lines = err.toString().lines().toList();
            assertEquals(1, lines.size(), err.toString());
            assertTrue(lines.get(0).startsWith("solmass: out of memory: the Java heap (at most "), lines.get(0));
            assertTrue(lines.get(0).contains("give Java more heap with SOLMASS_JAVA_OPTS=-Xmx... (the launcher's default is -Xmx8g), "
                    + "or a larger patch size (--patch, patch_m) or fewer rays; no results were written"), lines.get(0));
        }
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
