package org.solmass.spark;

import org.apache.spark.sql.SparkSession;
import org.solmass.Cautions;
import org.solmass.cli.Main;
import org.solmass.output.FolderClaim;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.irradiation.MemoryEstimate;
import org.solmass.tiles.CityModel;
import org.solmass.tiles.CityOptions;
import org.solmass.tiles.CityPlan;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Stream;

/**
 * {@code solmass city STUDY --out DIR}: a study cut into tiles and run as Spark jobs (docs/city.md).
 * Local by default ({@code local[*]}: nothing to install); the same class is the main of
 * {@code spark-submit} on a cluster. Exit codes as {@code solmass}: 0 done, 1 failed, 2 bad usage or input.
 */
@Command(name = "city", mixinStandardHelpOptions = true, sortOptions = false, versionProvider = Main.Version.class,
        description = {"Runs a study cut into square tiles as Apache Spark jobs (city scale).",
                "Writes per-patch Parquet (partitioned by tile), buildings.csv/.geojson, city-summary.json and run.json.",
                Cautions.RESULTS})
public final class CityJob implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "STUDY", description = "study file (JSON)") Path study;
    @Option(names = "--out", required = true, paramLabel = "DIR", description = "results folder") Path out;
    @Option(names = "--master", paramLabel = "URL",
            description = "Spark master (default: the one spark-submit gives, else local[*]; local[2,3]: 2 cores, 3 tries per task)") String master;
    @Option(names = "--tile-size", paramLabel = "M", description = "tile side (default ${DEFAULT-VALUE} m)") double tileM = CityOptions.DEFAULT_TILE_M;
    @Option(names = "--halo-cap", paramLabel = "M", description = "largest halo radius (default: none; the halo follows from the tallest building and the lowest sun)") Double haloCapM;
    @Option(names = "--no-far-horizon", description = "no far-horizon profile beyond the halo") boolean noFarHorizon;
    @Option(names = "-q", description = "no progress lines") boolean quiet;

    /** Test hook: this tile's task fails on its first attempt at this stage (first-pass, bounce, finish, write). */
    int failOnceTile = -1;
    String failOnceStage = "";
    /** What the last call ran (for tests and the benchmark). */
    CityRun.Outcome last;

    public static void main(String[] args) {
        System.exit(commandLine().execute(args));
    }

    /** The command line with Solmass's usual exit codes for bad input and failures. */
    static CommandLine commandLine() {
        return commandLine(new CityJob());
    }

    static CommandLine commandLine(CityJob job) {
        CommandLine cl = new CommandLine(job);
        cl.setExecutionExceptionHandler((ex, line, parse) -> failed(ex, line.getErr()));
        cl.setParameterExceptionHandler((ex, args) -> {
            ex.getCommandLine().getErr().println("solmass: " + ex.getMessage());
            ex.getCommandLine().getErr().println("Try 'solmass city --help'.");
            return Main.EXIT_INPUT;
        });
        return cl;
    }

    /**
     * What a failed run prints and its exit code: bad input (also when a task found it, an executor's
     * own check, and it reached the driver wrapped in Spark's exceptions) as one line with exit 2,
     * anything else as "city failed" with exit 1.
     */
    static int failed(Exception ex, java.io.PrintWriter err) {
        for (Throwable c = ex; c != null; c = c.getCause()) {
            if (c instanceof org.solmass.InputException) {
                err.println("solmass: " + c.getMessage());
                return Main.EXIT_INPUT;
            }
        }
        err.println("solmass: city failed: " + ex);
        if (System.getenv("SOLMASS_DEBUG") != null) ex.printStackTrace(err);
        return Main.EXIT_FAILED;
    }

    @Override
    public Integer call() throws IOException {
        if (!(tileM > 0)) throw new CommandLine.ParameterException(new CommandLine(this), "--tile-size must be positive, got " + tileM);
        if (haloCapM != null && !(haloCapM >= 0)) throw new CommandLine.ParameterException(new CommandLine(this), "--halo-cap must be 0 or more, got " + haloCapM);
        Study s = StudyReader.read(study);
        CityStages.partitionsPerCore(new org.apache.spark.SparkConf()); // spark.* settings as spark-submit gives them: checked before the long work
        CityOptions o = CityOptions.defaults().withTileM(tileM).withFarHorizon(!noFarHorizon);
        if (haloCapM != null) o = o.withHaloCapM(haloCapM);
        try (FolderClaim claim = FolderClaim.claim(out, "--out", study, s.name())) {
            Path work = Files.createTempDirectory("solmass-spark-");
            try {
                long t0 = System.nanoTime();
                CityModel city = CityModel.of(s);
                CityPlan plan = city.plan(o);
                double prepareS = (System.nanoTime() - t0) / 1e9;
                requireExecutorMemory(new org.apache.spark.SparkConf(), master, city, plan);
                if (!quiet) System.err.printf(Locale.ROOT, "city: %d tiles of %.0f m, halo %.0f m (uncapped %.0f m, lowest sun %.1f deg, tallest %.1f m),"
                                + " %,d patches, %,d receivers%n", plan.tiles().size(), o.tileM(), plan.haloM(), plan.uncappedHaloM(),
                        plan.minSunElevationDeg(), plan.tallestM(), plan.analysedCount(), plan.receiverCount());
                boolean shared = SparkSession.getDefaultSession().isDefined(); // a caller's session (tests) is left running
                SparkSession spark = CitySpark.session(master, work, plan.tiles().size());
                try {
                    if (!quiet) spark.sparkContext().addSparkListener(new StageProgress(System.err, 2000));
                    CityStages.Settings settings = CityStages.Settings.of(study).failingOnce(failOnceTile, failOnceStage)
                            .holding(spark.sparkContext().getConf().get(CityStages.HOLD_KEY, null));
                    last = CityRun.run(spark, city, plan, settings, claim, prepareS);
                } finally {
                    if (!shared) spark.stop();
                }
                System.out.printf(Locale.ROOT, "city: %,d patches in %d tiles written to %s%n", last.stages().rows(), plan.tiles().size(), claim.folder());
                System.out.println(Cautions.RESULTS);
                return Main.EXIT_OK;
            } finally {
                deleteTree(work);
            }
        }
    }

    /** Spark's reserved heap per executor ({@code UnifiedMemoryManager}: 300 MB) and its default {@code spark.memory.fraction}. */
    static final long SPARK_RESERVED_BYTES = 300L << 20;
    static final double SPARK_MEMORY_FRACTION = 0.6;

    /**
     * On a cluster (a master that is not {@code local}), before any task: every executor prepares the
     * whole study (about {@link MemoryEstimate#forTilesBytes} for its receivers) and runs its tasks'
     * tiles beside it ({@link MemoryEstimate#of} for the largest tile's receivers, counted as analysed,
     * per task running at once: {@code spark.executor.cores / spark.task.cpus}), in the part of the heap
     * Spark leaves to user objects: (spark.executor.memory - 300 MB) x (1 - spark.memory.fraction)
     * (Spark's unified memory manager; the rest holds cached and shuffled blocks). Refused with the
     * executor memory that would do, instead of each executor failing in its first task. In local
     * mode the driver's own check before patching covers it (one JVM).
     */
    static void requireExecutorMemory(org.apache.spark.SparkConf conf, String master, CityModel city, CityPlan plan) {
        String m = master != null ? master : conf.get("spark.master", "local[*]");
        if (m.startsWith("local")) return;
        long heap;
        try {
            heap = conf.getSizeAsBytes("spark.executor.memory", "1g");
        } catch (NumberFormatException e) {
            throw new org.solmass.InputException("spark.executor.memory", "expected a size such as 4g or 512m, got '"
                    + conf.get("spark.executor.memory") + "'");
        }
        double fraction = conf.getDouble("spark.memory.fraction", SPARK_MEMORY_FRACTION);
        int taskCpus = Math.max(1, conf.getInt("spark.task.cpus", 1));
        int tasks = Math.max(1, conf.getInt("spark.executor.cores", 1) / taskCpus);
        int largest = 0;
        for (org.solmass.tiles.Tile t : plan.tiles()) largest = Math.max(largest, t.receivers().length);
        int rays = org.solmass.scene.HemisphereSampler.roundedRayCount(city.study().rays());
        long tile = MemoryEstimate.of(largest, largest, rays, city.prepared().weather().size(), false, taskCpus).bytes();
        long study = MemoryEstimate.forTilesBytes(plan.receiverCount());
        long need = study + tasks * tile;
        double budget = Math.max(0, heap - SPARK_RESERVED_BYTES) * (1 - fraction);
        if (new MemoryEstimate(need, need).fits((long) budget)) return;
        long wantMb = (long) Math.ceil((need / MemoryEstimate.HEADROOM / (1 - fraction) + SPARK_RESERVED_BYTES) / (256L << 20)) * 256;
        throw new org.solmass.InputException("spark.executor.memory", String.format(Locale.ROOT,
                "each executor prepares the whole study (about %.2f GB for %,d receivers) and runs %d tile(s) at a time beside it"
                        + " (about %.2f GB each at the largest tile, %,d receivers), but spark.executor.memory=%s leaves about %.2f GB to them"
                        + " ((memory - 300 MB) x (1 - spark.memory.fraction %.2f)); give the executors at least"
                        + " --conf spark.executor.memory=%dm, smaller tiles (--tile-size) or a larger patch size",
                study / 1073741824.0, plan.receiverCount(), tasks, tile / 1073741824.0, largest,
                conf.get("spark.executor.memory", "1g"), budget / 1073741824.0, fraction, wantMb));
    }

    static void deleteTree(Path p) {
        if (!Files.exists(p)) return;
        try (Stream<Path> s = Files.walk(p)) {
            for (Path q : (Iterable<Path>) s.sorted(Comparator.reverseOrder())::iterator) Files.deleteIfExists(q);
        } catch (IOException e) {
            // scratch space: left for the system's cleaner
        }
    }
}
