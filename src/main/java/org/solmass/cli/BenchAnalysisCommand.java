package org.solmass.cli;

import org.solmass.bench.SyntheticDistrict;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.model.MassingModel;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.BufferedWriter;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code solmass bench-analysis}: the whole analysis (without writing files) on seeded synthetic
 * districts of growing size, to measure how time and memory grow with the patch count.
 */
@Command(name = "bench-analysis", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Times the whole analysis on synthetic districts of growing size.",
                "Seeded invented geometry; reports load, patches, scene and irradiation times and the peak heap.",
                "Nothing is written."})
public final class BenchAnalysisCommand implements Callable<Integer> {
    @Option(names = "--patches", split = ",", defaultValue = "25000,50000,100000", paramLabel = "N",
            description = "target patch counts (default ${DEFAULT-VALUE})") int[] targets;
    @Option(names = "--patch", defaultValue = "2", paramLabel = "M", description = "patch size (default ${DEFAULT-VALUE} m)") double patch;
    @Option(names = "--rays", defaultValue = "1024", paramLabel = "N", description = "hemisphere rays per patch (default ${DEFAULT-VALUE})") int rays;
    @Option(names = "--time-base", defaultValue = "hourly-year", paramLabel = "BASE", description = "hourly-year (default) or average-days") String timeBase;
    @Mixin SkyFlag sky = new SkyFlag();
    @Option(names = "--threads", defaultValue = "0", paramLabel = "N", description = "worker threads (default: all cores)") int threads;
    @Option(names = "--sun-bins", defaultValue = "0", paramLabel = "N", description = "sky cells the sun is binned into (default: the study default)") int sunBins;
    @Option(names = "--seed", defaultValue = "1", paramLabel = "N", description = "district seed (default ${DEFAULT-VALUE})") long seed;

    /**
     * The process's CPU time (all threads, JIT and GC included) spent in each phase the run announces
     * ({@link PhaseProgress#begin}): on a shared machine a steadier measure than wall time, since
     * other processes' load stretches the wall time but not the CPU time of the work.
     */
    static final class PhaseCpu implements PhaseProgress {
        final java.util.Map<String, String> seconds = new java.util.LinkedHashMap<>();
        /** Wall time per phase, as {@link #seconds}. */
        final java.util.Map<String, String> wall = new java.util.LinkedHashMap<>();
        private final com.sun.management.OperatingSystemMXBean os =
                (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        private String phase;
        private long since, sinceWall;

        @Override public synchronized void begin(String next, long total) {
            long now = os.getProcessCpuTime(), nowWall = System.nanoTime();
            if (phase != null) {
                add(seconds, phase, now - since);
                add(wall, phase, nowWall - sinceWall);
            }
            phase = next;
            since = now;
            sinceWall = nowWall;
        }

        private static void add(java.util.Map<String, String> m, String phase, long nanos) {
            m.merge(phase, String.format(Locale.ROOT, "%.2f", nanos / 1e9),
                    (a, b) -> String.format(Locale.ROOT, "%.2f", Double.parseDouble(a) + Double.parseDouble(b)));
        }

        @Override public void advance(long done) {}
    }

    @Override
    public Integer call() throws IOException {
        Path dir = Files.createTempDirectory("solmass-bench");
        System.out.printf(Locale.ROOT, "%-9s %7s %9s %8s %8s %8s %10s %11s %8s %9s%n", "patches", "blocks", "triangles",
                "load_s", "patch_s", "scene_s", "irrad_s", "total_s", "us/patch", "peak_MB");
        for (int target : targets) {
            int blocks = Math.max(1, (int) Math.round(target / (2600.0 / (patch * patch))));
            Path obj = dir.resolve("district-" + target + ".obj");
            writeObj(SyntheticDistrict.generate(blocks, seed), obj);
            StudyOverrides ov = new StudyOverrides().model(obj).latitude(51.0).longitude(10.0).zone("Europe/Berlin")
                    .timeBase(timeBase).patchM(patch).rays(rays).sky(sky.name).threads(threads).out(dir.resolve("out"));
            if (sunBins != 0) ov.set("--sun-bins", "sun_bins", sunBins); // range-checked by the study reader
            Study study = StudyReader.read(null, ov);
            System.gc();
            resetPeaks();
            long t0 = System.nanoTime();
            PhaseCpu cpu = new PhaseCpu();
            AnalysisRun.Outcome o = AnalysisRun.run(study, cpu);
            double total = (System.nanoTime() - t0) / 1e9;
            cpu.begin("end", 0);
            var t = o.timingsS();
            long n = o.counts().get("patches");
            System.out.printf(Locale.ROOT, "%-9d %7d %9d %8.2f %8.2f %8.2f %10.2f %11.2f %8.1f %9.0f%n", n, blocks,
                    o.counts().get("triangles"), t.get("load"), t.get("patches"), t.get("scene"), t.get("irradiation"),
                    total, total / n * 1e6, peakHeapMb());
            System.out.printf(Locale.ROOT, "  process CPU by phase (s): %s%n", cpu.seconds);
            System.out.printf(Locale.ROOT, "  wall time by phase (s): %s%n", cpu.wall);
        }
        return Main.EXIT_OK;
    }

    private static void writeObj(MassingModel m, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file)) {
            w.write("# invented synthetic district for benchmarking\n");
            double[] v = m.vertices();
            for (int i = 0; i < v.length; i += 3) w.write(String.format(Locale.ROOT, "v %.4f %.4f %.4f%n", v[i], v[i + 1], v[i + 2]));
            int block = -1;
            for (int tr = 0; tr < m.triangleCount(); tr++) {
                if (m.triangleBlock()[tr] != block) {
                    block = m.triangleBlock()[tr];
                    w.write("o " + m.blockNames().get(block) + "\n");
                }
                int[] t = m.triangles();
                w.write("f " + (t[3 * tr] + 1) + " " + (t[3 * tr + 1] + 1) + " " + (t[3 * tr + 2] + 1) + "\n");
            }
        }
    }

    private static void resetPeaks() {
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) if (p.getType() == MemoryType.HEAP) p.resetPeakUsage();
    }

    private static double peakHeapMb() {
        long sum = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) if (p.getType() == MemoryType.HEAP) sum += p.getPeakUsage().getUsed();
        return sum / 1048576.0;
    }
}
