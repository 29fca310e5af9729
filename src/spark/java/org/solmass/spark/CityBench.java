package org.solmass.spark;

import org.solmass.cli.AnalysisRun;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.IrradiationSetup;
import org.solmass.irradiation.StagedPasses;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.tiles.CityModel;
import org.solmass.tiles.CityOptions;
import org.solmass.tiles.CityPlan;
import org.solmass.tiles.CityTables;
import org.solmass.tiles.SyntheticCity;
import org.solmass.tiles.Tile;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * The city runner's benchmark (not part of the test suite; docs/city.md): on an invented synthetic
 * city ({@link SyntheticCity}) of about N patches, the one-machine run ({@code AnalysisRun}, as
 * {@code solmass analyse}, all cores) against {@code solmass city} on {@code local[2]}, as patches per
 * second per core and their ratio; then, per tile size, the largest tile's first pass alone: its
 * receivers, scene triangles, the bytes its {@link FirstPasses} hold and the peak heap while it runs
 * (what one task needs, besides the prepared study every task holds); the size of the tables the
 * driver broadcasts and an executor's set-up with and without them; and the peak heap of the largest
 * tile's finish task with the whole layout's reflection arrays and with the tile's own.
 * Run: {@code java -cp target/classes:$(cat target/city-classpath.txt) org.solmass.spark.CityBench --patches 100000}
 * (with the launcher's JVM options; see the solmass script).
 */
@Command(name = "city-bench", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Times one machine against local[2] on an invented synthetic city; task memory per tile size.")
public final class CityBench implements Callable<Integer> {
    @Option(names = "--patches", defaultValue = "100000", paramLabel = "N", description = "target patches (default ${DEFAULT-VALUE})") long patches;
    @Option(names = "--seed", defaultValue = "1", paramLabel = "N", description = "city seed (default ${DEFAULT-VALUE})") long seed;
    @Option(names = "--master", defaultValue = "local[2]", paramLabel = "URL", description = "Spark master (default ${DEFAULT-VALUE})") String master;
    @Option(names = "--tile-size", defaultValue = "250", paramLabel = "M", description = "tile side of the Spark run (default ${DEFAULT-VALUE} m)") double tileM;
    @Option(names = "--halo-cap", paramLabel = "M", description = "largest halo radius (default: none)") Double haloCapM;
    @Option(names = "--memory-tiles", split = ",", defaultValue = "125,250,500", paramLabel = "M", description = "tile sides for the memory table (default ${DEFAULT-VALUE})") double[] memoryTiles;
    @Option(names = "--skip-one-machine", description = "only the Spark run and the memory table") boolean skipOne;
    @Option(names = "--memory-only", description = "only the tables, the executor set-up and the memory table") boolean memoryOnly;
    @Option(names = "--no-memory", description = "no memory table (the timed runs only)") boolean noMemory;
    @Option(names = "--spark-cores", paramLabel = "N", description = "cores of the Spark run's executors (default: N of local[N]; give it for a cluster)") Integer sparkCoresGiven;
    @Option(names = "--warm-up", defaultValue = "20000", paramLabel = "N",
            description = "before the timed runs, a city of about N patches (another seed) through both paths, untimed; 0: none (default ${DEFAULT-VALUE})") long warmUp;

    public static void main(String[] args) {
        System.exit(new CommandLine(new CityBench()).execute(args));
    }

    @Override
    public Integer call() throws Exception {
        if (sparkCoresGiven != null ? sparkCoresGiven < 1 : CitySpark.localCores(master) < 1) {
            throw new CommandLine.ParameterException(new CommandLine(this), sparkCoresGiven != null
                    ? "--spark-cores must be 1 or more, got " + sparkCoresGiven
                    : "--spark-cores is needed with --master " + master + " (the executors' cores in all, for patches per second per core)");
        }
        Path dir = Files.createTempDirectory("solmass-city-bench");
        SyntheticCity.Written w = SyntheticCity.write(dir.resolve("city"), SyntheticCity.Spec.of(patches, seed));
        Study study = StudyReader.read(w.study());
        System.out.printf(Locale.ROOT, "invented city: %d buildings, about %d patches, tallest %.1f m%n", w.buildings(), w.estimatedPatches(), w.tallestM());
        int cores = Runtime.getRuntime().availableProcessors();
        if (warmUp > 0 && !memoryOnly) warmUp(dir);
        double oneRate = Double.NaN;
        if (!skipOne && !memoryOnly) {
            System.gc();
            long t0 = System.nanoTime(), c0 = processCpuNanos();
            AnalysisRun.Outcome o = AnalysisRun.run(study, PhaseProgress.NONE);
            double s = (System.nanoTime() - t0) / 1e9;
            long n = o.counts().get("patches");
            oneRate = n / s / cores;
            System.out.printf(Locale.ROOT, "one machine (%d cores): %d patches in %.1f s (process CPU %.1f s) = %.1f patches/s/core; phases %s%n", cores, n, s,
                    (processCpuNanos() - c0) / 1e9, oneRate, o.timingsS());
        }
        if (!memoryOnly) {
            int code = spark(dir, w, oneRate);
            if (code != 0) return code;
        }
        if (!noMemory) memory(w, CityModel.of(study));
        CityJob.deleteTree(dir);
        return 0;
    }

    /**
     * Both paths once on a small invented city of another seed, untimed, so that the timed runs start
     * alike with compiled code (the JIT's, the kernel warm-up's): without it the one-machine run, first
     * in the JVM, paid the JVM's warm-up and the Spark run after it did not, which flattered the ratio
     * (docs/city.md, "Warm and cold JVMs"). This warms this JVM, so in local mode both sides; on a
     * cluster master each run is an application with executors of its own, which start cold whatever
     * ran before. A cold local start is measured with {@code --warm-up 0 --skip-one-machine}.
     */
    private void warmUp(Path dir) throws Exception {
        long t0 = System.nanoTime();
        SyntheticCity.Written w = SyntheticCity.write(dir.resolve("warm-up"), SyntheticCity.Spec.of(warmUp, seed + 1000));
        if (!skipOne) AnalysisRun.run(StudyReader.read(w.study()), PhaseProgress.NONE);
        List<String> args = new ArrayList<>(List.of(w.study().toString(), "--out", dir.resolve("warm-up-out").toString(),
                "--master", master, "--tile-size", Double.toString(tileM), "-q"));
        if (haloCapM != null) args.addAll(List.of("--halo-cap", Double.toString(haloCapM)));
        int code = CityJob.commandLine(new CityJob()).execute(args.toArray(new String[0]));
        if (code != 0) throw new IllegalStateException("the warm-up's Spark run failed: exit code " + code);
        System.out.printf(Locale.ROOT, "warm-up: a %d-patch invented city through both paths, untimed (%.1f s)%n", warmUp, (System.nanoTime() - t0) / 1e9);
    }

    /** The Spark run of the city, as {@code solmass city} does it: patches per second per core, and against one machine. */
    private int spark(Path dir, SyntheticCity.Written w, double oneRate) {
        CityJob job = new CityJob();
        long cpu0 = processCpuNanos();
        long t1 = System.nanoTime();
        String[] args = haloCapM == null
                ? new String[] {w.study().toString(), "--out", dir.resolve("out").toString(), "--master", master, "--tile-size", Double.toString(tileM), "-q"}
                : new String[] {w.study().toString(), "--out", dir.resolve("out").toString(), "--master", master, "--tile-size", Double.toString(tileM),
                "--halo-cap", Double.toString(haloCapM), "-q"};
        int code = CityJob.commandLine(job).execute(args);
        double s = (System.nanoTime() - t1) / 1e9;
        double cpuS = (processCpuNanos() - cpu0) / 1e9;
        if (code != 0) return code;
        int sparkCores = sparkCoresGiven != null ? sparkCoresGiven : CitySpark.localCores(master);
        long n = job.last.stages().rows();
        double rate = n / s / sparkCores;
        CityPlan plan = job.last.plan();
        System.out.printf(Locale.ROOT, "%s (%d cores): %d patches, %d tiles of %.0f m, halo %.0f m: %.1f s (Spark start included) = %.1f patches/s/core;"
                        + " stages %s; process CPU %.1f s, per stage %s%n", master, sparkCores, n, plan.tiles().size(), tileM, plan.haloM(), s, rate,
                job.last.stages().stageS(), cpuS, job.last.stages().stageCpuS());
        if (!skipOne) System.out.printf(Locale.ROOT, "ratio %s / one machine, patches per second per core: %.2f%n", master, rate / oneRate);
        return 0;
    }

    /** Per tile size, the largest tile's first pass and finish task alone (what one task holds). */
    private void memory(SyntheticCity.Written w, CityModel city) {
        executorSetUp(w.study(), city);

        // the whole layout's reflection, once (from the Spark run's tiling): what the finish tasks below read
        CityOptions ro = CityOptions.defaults().withTileM(tileM);
        if (haloCapM != null) ro = ro.withHaloCapM(haloCapM);
        java.util.List<FirstPasses> firsts = new java.util.ArrayList<>();
        for (Tile t : city.plan(ro).tiles()) firsts.add(city.firstPass(t));
        StagedPasses.Reflected whole = city.reflect(firsts);
        firsts = null;

        System.out.printf(Locale.ROOT, "%n%-8s %6s %10s %12s %14s %16s %12s %12s %12s %12s %12s %12s %12s%n", "tile_m", "tiles", "halo_m", "receivers", "scene_tris",
                "first_pass_MB", "peak_heap_MB", "in_all_MB", "in_own_MB", "irr_all_MB", "irr_own_MB", "finish_all_MB", "finish_own_MB");
        for (double tm : memoryTiles) {
            CityOptions o = CityOptions.defaults().withTileM(tm);
            if (haloCapM != null) o = o.withHaloCapM(haloCapM);
            CityPlan p = city.plan(o);
            Tile big = p.tiles().get(0);
            for (Tile t : p.tiles()) if (t.receivers().length > big.receivers().length) big = t;
            System.gc();
            long before = heapUsed();
            resetPeaks();
            FirstPasses fp = city.firstPass(big);
            double peak = (peakHeap() - before) / 1048576.0;
            double[] finish = finishHeap(city, p, big, fp, whole);
            System.out.printf(Locale.ROOT, "%-8.0f %6d %10.0f %12d %14d %16.1f %12.0f %12.2f %12.2f %12.1f %12.1f %12.1f %12.1f%n", tm, p.tiles().size(), p.haloM(),
                    big.receivers().length, city.sceneTriangles(big).length, fp.bytes() / 1048576.0, peak, whole.bytes() / 1048576.0,
                    StagedPasses.TileReflected.of(fp, whole).bytes() / 1048576.0, finish[0], finish[1], finish[2], finish[3]);
        }
    }

    /**
     * What an executor's set-up costs with and without the driver's tables (weather, sun directions,
     * step table; {@link CityTables}): their size as sent, and the study prepared from its file alone
     * or with them, interleaved, twice each.
     */
    private static void executorSetUp(Path studyFile, CityModel driver) {
        long e0 = System.nanoTime();
        byte[] bytes = driver.tables().encode();
        double encodeS = (System.nanoTime() - e0) / 1e9;
        long d0 = System.nanoTime();
        CityTables.decode(bytes);
        double decodeS = (System.nanoTime() - d0) / 1e9;
        System.out.printf(Locale.ROOT, "%ntables broadcast: %d bytes (%d steps, %d sun directions), encoded in %.3f s, decoded in %.3f s%n",
                bytes.length, driver.prepared().weather().size(), driver.sun().directions().count(), encodeS, decodeS);
        for (int round = 0; round < 2; round++) {
            System.gc();
            long computed = IrradiationSetup.Sun.computedCount();
            long t0 = System.nanoTime();
            CityModel.load(studyFile);
            double alone = (System.nanoTime() - t0) / 1e9;
            long computedAlone = IrradiationSetup.Sun.computedCount() - computed;
            System.gc();
            computed = IrradiationSetup.Sun.computedCount();
            long t1 = System.nanoTime();
            CityModel.load(studyFile, CityTables.decode(bytes));
            double with = (System.nanoTime() - t1) / 1e9;
            System.out.printf(Locale.ROOT, "executor set-up: from the study file %.2f s (sun tables computed %d), with the tables %.2f s (computed %d)%n",
                    alone, computedAlone, with, IrradiationSetup.Sun.computedCount() - computed);
        }
    }

    /**
     * Peak heap of a finish task on {@code big}, MB, as the task builds its input and runs, with the
     * whole layout's arrays (12 doubles per analysed patch of the city, one per receiver, filled where
     * the tile reads, as the finish stage did before) and with the tile's own ({@link StagedPasses.TileReflected}):
     * {irradiation part (input + {@code StagedPasses.finish}) whole, own; whole finish (with the metrics) whole, own}.
     */
    private static double[] finishHeap(CityModel city, CityPlan p, Tile big, FirstPasses fp, StagedPasses.Reflected whole) {
        double[] out = new double[4];
        for (int part = 0; part < 2; part++) {
            for (int form = 0; form < 2; form++) {
                System.gc();
                long before = heapUsed();
                resetPeaks();
                if (form == 0) {
                    StagedPasses.Reflected r = wholeInput(p, fp, whole);
                    if (part == 0) StagedPasses.finish(fp, r, city.sun(), city.study().rays(),
                            IrradiationSetup.reflectorRays(city.study().rays(), city.study().reflection().rays()));
                    else city.finish(big, fp, r);
                } else {
                    StagedPasses.TileReflected r = StagedPasses.TileReflected.of(fp, whole);
                    if (part == 0) StagedPasses.finish(fp, r, city.sun(), city.study().rays(),
                            IrradiationSetup.reflectorRays(city.study().rays(), city.study().reflection().rays()));
                    else city.finish(big, fp, r);
                }
                out[2 * part + form] = (peakHeap() - before) / 1048576.0;
            }
        }
        return out;
    }

    /** The whole layout's arrays as the finish task built them before: filled where the tile reads. */
    private static StagedPasses.Reflected wholeInput(CityPlan p, FirstPasses fp, StagedPasses.Reflected whole) {
        int analysed = p.analysedCount();
        double[] refl = new double[12 * analysed], total = new double[p.receiverCount()];
        for (int i = 0; i < fp.size(); i++) {
            int id = fp.id(i);
            if (id < analysed) System.arraycopy(whole.reflMonthWh(), 12 * id, refl, 12 * id, 12);
            total[id] = whole.totalAnnualWh()[id];
        }
        for (int j : org.solmass.irradiation.TileBounces.needed(fp)) total[j] = whole.totalAnnualWh()[j];
        return new StagedPasses.Reflected(refl, total, whole.bounceWh(), whole.converged(), whole.tolerance(), whole.maxBounces());
    }

    /** The JVM's CPU time so far (all threads), ns; -1 where the platform does not tell. */
    private static long processCpuNanos() {
        return ManagementFactory.getOperatingSystemMXBean() instanceof com.sun.management.OperatingSystemMXBean os ? os.getProcessCpuTime() : -1;
    }

    private static void resetPeaks() {
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) if (p.getType() == MemoryType.HEAP) p.resetPeakUsage();
    }

    private static long peakHeap() {
        long sum = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) if (p.getType() == MemoryType.HEAP) sum += p.getPeakUsage().getUsed();
        return sum;
    }

    private static long heapUsed() {
        long sum = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) if (p.getType() == MemoryType.HEAP) sum += p.getUsage().getUsed();
        return sum;
    }
}
