package org.solmass.spark;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.study.StudyReader;
import org.solmass.table.ResultTable;
import org.solmass.tiles.CityModel;
import org.solmass.tiles.CityOptions;
import org.solmass.tiles.LocalCityRunner;
import org.solmass.tiles.SyntheticCity;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * The README's way onto a cluster, run on a standalone Spark cluster started on this machine: a
 * master and a worker of two cores, each a JVM of its own, launching two executor JVMs; the job
 * submitted as the README says ({@code spark-submit --class org.solmass.spark.CityJob}, i.e. Spark's
 * {@code org.apache.spark.deploy.SparkSubmit}) with target/solmass-city.jar, the jar {@code mvn
 * package} builds for clusters.
 *
 * <p>The cluster's Spark installation is laid out here as a distribution lays it out: a folder
 * SPARK_HOME/jars holding Spark's own jars only (every artifact under Spark in Maven's dependency tree,
 * the duplicates Maven omitted included; target/city-dependency-tree.json), so the executors find
 * Solmass and its other libraries (JTS excepted, which Spark ships) only in the submitted jar. Run
 * with every library on the executors' class path, a jar missing a library would pass unnoticed.
 *
 * <p>Checks, on a small invented city ({@code tiles.SyntheticCity}, seeded) cut into 50 m tiles:
 * <ul>
 * <li>the job ends with exit code 0 although one executor JVM is killed (SIGKILL) while the first
 * bounce's tasks run: a test hook ({@code CityStages.HOLD_KEY}) holds them until the test has killed
 * it, after the first pass is done and cached. The driver logs the lost executor and its lost
 * running task (ExecutorLostFailure), which Spark runs again, with the cached first-pass results and
 * shuffle files it needs recomputed from the lineage;</li>
 * <li>every patch is in the Parquet rows exactly once, each value equal to the sequential tiled run
 * ({@code tiles.LocalCityRunner}, no Spark) to the last bit: seeds come from patch ids and the
 * bounces add the same terms in the same order, whatever JVM runs a tile;</li>
 * <li>buildings.csv, buildings.geojson, zones.csv and zones.geojson are byte-identical to a
 * {@code local[2]} run of the same study in this JVM.</li>
 * </ul>
 * Slow for a unit test (Spark's JVMs start in about 10 s, the job about 40 s), so it runs after
 * {@code package}, as an integration test (maven-failsafe-plugin, {@code mvn verify}).
 */
class CityClusterIT {
    @TempDir Path dir;

    @Test
    void theCityJarSubmittedToAStandaloneClusterGivesTheTiledRunsRowsToTheLastBitThoughAnExecutorIsKilled() throws Exception {
        Path target = Path.of("target").toAbsolutePath();
        Path cityJar = target.resolve("solmass-city.jar");
        assertTrue(Files.isRegularFile(cityJar), "target/solmass-city.jar (mvn package) missing");
        Path home = sparkHome(target, target.resolve("cluster-it").resolve("spark-home")); // under target/: JUnit would warn on every link in a @TempDir
        Path study = SyntheticCity.write(dir.resolve("city"), new SyntheticCity.Spec(1500, 2.0, 7, 32632, 500_000, 5_316_000, 64)).study();
        ResultTable tiled = LocalCityRunner.run(CityModel.of(StudyReader.read(study)), CityOptions.defaults().withTileM(50),
                PhaseProgress.NONE).table();

        List<Process> started = new ArrayList<>();
        Thread reaper = new Thread(() -> destroy(started)); // should this JVM be stopped mid-test
        Runtime.getRuntime().addShutdownHook(reaper);
        try {
            Path masterLog = dir.resolve("master.log"), workerLog = dir.resolve("worker.log");
            Process master = spark(home, masterLog, List.of("-Dspark.master.rest.enabled=false"), "org.apache.spark.deploy.master.Master",
                    "--host", "127.0.0.1", "--port", "0", "--webui-port", "0");
            started.add(master);
            // the port the master bound (asked for any free one: no race with other programs for a chosen port)
            String url = awaitLine(masterLog, "Starting Spark master at ", master, 90).replaceAll(".*Starting Spark master at (spark://\\S+).*", "$1");
            awaitLine(masterLog, "I have been elected leader", master, 90);
            Process worker = spark(home, workerLog, List.of(), "org.apache.spark.deploy.worker.Worker",
                    "--host", "127.0.0.1", "--webui-port", "0", "--cores", "2", "--memory", "3g",
                    "--work-dir", dir.resolve("work").toString(), url);
            started.add(worker);
            awaitLine(masterLog, "Registering worker", worker, 90);

            Path out = dir.resolve("cluster-out"), submitLog = dir.resolve("submit.log"), release = dir.resolve("release");
            Process submit = spark(home, submitLog, List.of("-Xmx1g"), "org.apache.spark.deploy.SparkSubmit",
                    "--class", "org.solmass.spark.CityJob", "--master", url,
                    "--conf", "spark.executor.cores=1", "--conf", "spark.executor.memory=1g",
                    "--conf", "spark.default.parallelism=2",
                    "--conf", "spark.executor.extraJavaOptions=--add-modules jdk.incubator.vector -Djava.io.tmpdir=" + scratch(),
                    "--conf", CityStages.HOLD_KEY + "=" + release, // the first bounce's tasks wait for the file
                    cityJar.toString(), study.toString(), "--out", out.toString(), "--tile-size", "50");
            started.add(submit);
            // the first pass is done and cached, and the first bounce's tasks are running (held): kill an executor
            awaitFile(Path.of(release + ".waiting"), submit, submitLog, 300);
            ProcessHandle executor = worker.descendants().filter(p -> p.info().commandLine().orElse("").contains("CoarseGrainedExecutorBackend"))
                    .findFirst().orElseThrow(() -> new AssertionError("no executor JVM under the worker"));
            executor.destroyForcibly();
            executor.onExit().get(30, TimeUnit.SECONDS);
            Files.writeString(release, "go\n");
            assertTrue(submit.waitFor(600, TimeUnit.SECONDS), "the job did not end in 10 minutes; " + tail(submitLog));
            String log = Files.readString(submitLog);
            assertEquals(0, submit.exitValue(), "exit code; " + tail(submitLog));
            assertTrue(log.contains("Lost executor"), "the driver saw the executor lost; " + tail(submitLog));
            // its running task was lost with it and run again elsewhere (Spark's TaskSetManager)
            assertTrue(log.contains("ExecutorLostFailure"), "a task lost with the executor; " + tail(submitLog));

            Path local = dir.resolve("local-out");
            SparkSession spark = CitySpark.session("local[2]", dir.resolve("local-spark"), 4);
            try {
                int code = CityJob.commandLine(new CityJob()).execute(study.toString(), "--out", local.toString(),
                        "--master", "local[2]", "--tile-size", "50", "-q");
                assertEquals(0, code, "local[2] run's exit code");
                assertRowsEqualToTheLastBit(tiled, spark, out);
                assertRowsEqualToTheLastBit(tiled, spark, local);
            } finally {
                spark.stop();
            }
            for (String f : List.of("buildings.csv", "buildings.geojson", "zones.csv", "zones.geojson")) {
                assertTrue(Files.size(out.resolve(f)) > 0, f + " written");
                assertEquals(-1L, Files.mismatch(local.resolve(f), out.resolve(f)), f + ": the cluster's and local[2]'s differ");
            }
        } finally {
            destroy(started);
            Runtime.getRuntime().removeShutdownHook(reaper);
        }
    }

    /** The processes started and their children (executors), killed, and waited for. */
    private static void destroy(List<Process> started) {
        for (int i = started.size() - 1; i >= 0; i--) {
            Process p = started.get(i);
            List<ProcessHandle> children = p.descendants().toList();
            children.forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            try {
                p.waitFor(30, TimeUnit.SECONDS);
                for (ProcessHandle c : children) c.onExit().get(30, TimeUnit.SECONDS);
            } catch (Exception e) {
                // gone or stuck: nothing more to do
            }
        }
    }

    /** Scratch space of the Spark JVMs (block manager, shuffle files), inside the test's folder. */
    private Path scratch() throws IOException {
        return Files.createDirectories(dir.resolve("scratch"));
    }

    private static void assertRowsEqualToTheLastBit(ResultTable tiled, SparkSession spark, Path out) {
        Map<String, Row> rows = new HashMap<>();
        for (Row r : spark.read().parquet(out.resolve(CityRun.PARQUET).toString()).collectAsList()) {
            assertEquals(null, rows.put(r.getString(0), r), "patch " + r.getString(0) + " twice in " + out);
        }
        assertEquals(tiled.size(), rows.size(), out + ": every patch exactly once");
        int compared = 0;
        for (int p = 0; p < tiled.size(); p++) {
            Row r = rows.get(tiled.patches().get(p).id());
            assertTrue(r != null, out + ": patch " + tiled.patches().get(p).id() + " missing");
            for (String c : tiled.names()) {
                double a = tiled.column(c)[p], b = r.getDouble(r.fieldIndex(c));
                assertEquals(Double.doubleToLongBits(a), Double.doubleToLongBits(b), out + ": " + c + " of patch " + p + ": " + a + " vs " + b);
                compared++;
            }
        }
        assertTrue(compared > 1000, "values compared " + compared);
    }

    /**
     * SPARK_HOME/jars with Spark's own jars: the artifacts under {@code org.apache.spark} in the
     * verbose dependency tree (omitted duplicates included: Spark needs them too), taken from the
     * class path Maven resolved (target/city-classpath.txt).
     */
    static Path sparkHome(Path target, Path home) throws IOException {
        JsonNode tree = new ObjectMapper().readTree(target.resolve("city-dependency-tree.json").toFile());
        Set<String> spark = new LinkedHashSet<>();
        for (JsonNode top : tree.path("children")) {
            if ("org.apache.spark".equals(top.path("groupId").asText())) collect(top, spark);
        }
        assertTrue(spark.contains("org.apache.spark:spark-core_2.13"), "Spark in target/city-dependency-tree.json");
        Path jars = home.resolve("jars");
        if (Files.isDirectory(jars)) { // an earlier run's links: the versions may have changed since
            try (var old = Files.list(jars)) {
                for (Path l : old.toList()) Files.delete(l);
            }
        }
        Files.createDirectories(jars);
        int linked = 0;
        for (String entry : Files.readString(target.resolve("city-classpath.txt")).trim().split(File.pathSeparator)) {
            Path jar = Path.of(entry);
            String path = jar.toString().replace(File.separatorChar, '/');
            boolean isSpark = false;
            for (String ga : spark) {
                int colon = ga.indexOf(':');
                if (path.contains("/" + ga.substring(0, colon).replace('.', '/') + "/" + ga.substring(colon + 1) + "/")) isSpark = true;
            }
            if (isSpark && !Files.exists(jars.resolve(jar.getFileName()))) {
                Files.createSymbolicLink(jars.resolve(jar.getFileName()), jar);
                linked++;
            }
        }
        assertTrue(linked > 100, "Spark's jars: " + linked);
        for (String solmassOnly : new String[] {"commons-csv", "picocli", "citygml4j-core", "proj4j", "pdfbox", "solarpositioning"}) {
            try (var listed = Files.list(jars)) {
                assertTrue(listed.noneMatch(j -> j.getFileName().toString().startsWith(solmassOnly + "-")),
                        solmassOnly + " is Solmass's library, not Spark's: it must come from the submitted jar");
            }
        }
        return home;
    }

    private static void collect(JsonNode node, Set<String> into) {
        into.add(node.path("groupId").asText() + ":" + node.path("artifactId").asText());
        for (JsonNode c : node.path("children")) collect(c, into);
    }

    /** A Spark JVM as Spark's scripts start one: SPARK_HOME/jars on the class path, Java 17's opened modules. */
    private Process spark(Path home, Path log, List<String> jvm, String main, String... args) throws IOException {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.add("-Xmx512m");
        cmd.addAll(jvm);
        cmd.add("-XX:+IgnoreUnrecognizedVMOptions");
        for (String p : new String[] {"java.lang", "java.lang.invoke", "java.lang.reflect", "java.io", "java.net", "java.nio",
                "java.util", "java.util.concurrent", "java.util.concurrent.atomic", "jdk.internal.ref", "sun.nio.ch", "sun.nio.cs",
                "sun.security.action", "sun.util.calendar"}) {
            cmd.add("--add-opens=java.base/" + p + "=ALL-UNNAMED");
        }
        cmd.add("-Dio.netty.tryReflectionSetAccessible=true");
        cmd.add("-Djava.io.tmpdir=" + scratch());
        cmd.add("-cp");
        cmd.add(home.resolve("jars") + File.separator + "*");
        cmd.add(main);
        cmd.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile());
        Map<String, String> env = pb.environment();
        env.put("SPARK_HOME", home.toString());
        env.put("SPARK_SCALA_VERSION", "2.13"); // what a distribution's scripts set; the worker's executor launch needs it
        env.put("SPARK_LOCAL_IP", "127.0.0.1");
        env.put("SPARK_LOCAL_DIRS", scratch().toString()); // block manager and shuffle files of the worker's executors
        for (String v : new String[] {"SPARK_DIST_CLASSPATH", "SPARK_CONF_DIR", "HADOOP_CONF_DIR", "YARN_CONF_DIR"}) env.remove(v); // not a developer's own
        return pb.start();
    }

    /** Waits for a line holding {@code text} in the log; returns the line. */
    private static String awaitLine(Path log, String text, Process p, int seconds) throws Exception {
        long end = System.nanoTime() + seconds * 1_000_000_000L;
        while (System.nanoTime() < end) {
            if (Files.exists(log)) {
                for (String line : Files.readAllLines(log)) if (line.contains(text)) return line;
            }
            if (!p.isAlive()) fail("ended before \"" + text + "\": " + tail(log));
            Thread.sleep(200);
        }
        fail("no \"" + text + "\" in " + seconds + " s: " + tail(log));
        return null;
    }

    private static void awaitFile(Path file, Process p, Path log, int seconds) throws Exception {
        long end = System.nanoTime() + seconds * 1_000_000_000L;
        while (System.nanoTime() < end) {
            if (Files.exists(file)) return;
            if (!p.isAlive()) fail("ended before " + file.getFileName() + ": " + tail(log));
            Thread.sleep(200);
        }
        fail("no " + file.getFileName() + " in " + seconds + " s: " + tail(log));
    }

    private static String tail(Path log) throws IOException {
        if (!Files.exists(log)) return "(no log)";
        String s = Files.readString(log);
        return log.getFileName() + ":\n" + s.substring(Math.max(0, s.length() - 4000));
    }

}
