package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.bench.SyntheticDistrict;
import org.solmass.model.MassingModel;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.Scene;
import org.solmass.scene.SkyViewCalculator;
import org.solmass.scene.Tracer;
import org.solmass.surface.Patch;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.Callable;
import java.util.ArrayList;

/**
 * {@code solmass bench}: times the ray-casting core on an invented, seeded district
 * ({@link SyntheticDistrict}): BVH build, occlusion and closest-hit rays per second on one thread and
 * on all threads, and a full sky-view-factor pass. Prints a table to stdout.
 */
@Command(name = "bench", mixinStandardHelpOptions = true,
        description = "Time BVH build, ray queries and sky view factors on a synthetic (invented) district.")
public final class BenchCommand implements Runnable {
    @Option(names = "--blocks", description = "blocks in the synthetic district (default: ${DEFAULT-VALUE}, ~60 triangles each)")
    int blocks = 1000;

    @Option(names = "--seed", description = "seed of the district and the rays (default: ${DEFAULT-VALUE})")
    long seed = 1;

    @Option(names = "--rays", description = "rays per timing pass (default: ${DEFAULT-VALUE})")
    int rays = 1 << 20;

    @Option(names = "--patches", description = "patches for the sky-view pass, 0 to skip (default: ${DEFAULT-VALUE})")
    int patches = 15_000;

    @Option(names = "--rays-per-patch", description = "rays per patch in the sky-view pass (default: ${DEFAULT-VALUE})")
    int raysPerPatch = HemisphereSampler.DEFAULT_RAYS;

    @Option(names = "--threads", description = "threads for the all-threads rows (default: available processors)")
    int threads = Runtime.getRuntime().availableProcessors();

    @Override
    public void run() {
        if (blocks < 1) throw new InputException("--blocks", "must be a positive number of blocks, got " + blocks);
        if (rays < 1024) throw new InputException("--rays", "must be at least 1024, got " + rays);
        if (patches < 0) throw new InputException("--patches", "must be 0 or more, got " + patches);
        if (raysPerPatch < 1) throw new InputException("--rays-per-patch", "must be positive, got " + raysPerPatch);
        if (threads < 1) throw new InputException("--threads", "must be positive, got " + threads);

        System.err.println("solmass bench: generating district ...");
        MassingModel m = SyntheticDistrict.generate(blocks, seed);
        Scene built = null;
        double bestBuild = Double.POSITIVE_INFINITY;
        for (int i = 0; i < 8; i++) { // first builds warm the JIT up
            long t0 = CPU.getCurrentThreadCpuTime();
            built = Scene.build(m, true, 0.0);
            double ms = (CPU.getCurrentThreadCpuTime() - t0) / 1e6;
            if (i >= 3) bestBuild = Math.min(bestBuild, ms);
        }
        Scene scene = built;
        double[] r = SyntheticDistrict.rays(m, Math.max(1, rays / 64), 64, scene.epsilon(), seed);
        int n = r.length / 6;

        System.err.println("solmass bench: warming up ...");
        for (int i = 0; i < 3; i++) { runPass(scene, r, 0, n, true); runPass(scene, r, 0, n, false); }
        double occ1 = best(() -> time(scene, r, 1, true)), occT = best(() -> time(scene, r, threads, true));
        double cl1 = best(() -> time(scene, r, 1, false)), clT = best(() -> time(scene, r, threads, false));
        long hits = runPass(scene, r, 0, n, true);

        PrintTable t = new PrintTable();
        t.row("district", blocks + " blocks, seed " + seed + " (invented)");
        t.row("triangles", String.format(Locale.ROOT, "%,d", scene.triangleCount()));
        t.row("BVH nodes / depth", String.format(Locale.ROOT, "%,d / %d", scene.nodeCount(), scene.maxDepth()));
        t.row("BVH build", String.format(Locale.ROOT, "%.1f ms CPU time (best of 5, 1 thread)", bestBuild));
        t.row("timing rays", String.format(Locale.ROOT, "%,d (64 cosine-weighted per roof/facade point, %.1f%% occluded)",
                n, 100.0 * hits / n));
        t.row("occlusion, 1 thread", mrays(n / occ1) + " (per CPU-second)");
        t.row("occlusion, " + threads + " threads", mrays(n / occT) + " wall clock" + String.format(Locale.ROOT, "  (%.2f per thread)", n / occT / threads / 1e6));
        t.row("closest hit, 1 thread", mrays(n / cl1) + " (per CPU-second)");
        t.row("closest hit, " + threads + " threads", mrays(n / clT) + " wall clock");
        if (patches > 0) {
            List<Patch> ps = SyntheticDistrict.samplePatches(m, patches, seed + 1);
            SkyViewCalculator.compute(scene, ps.subList(0, Math.min(ps.size(), 500)), raysPerPatch, seed, null, null);
            long t0 = System.nanoTime();
            SkyViewCalculator.compute(scene, ps, raysPerPatch, seed, null, null);
            double s = (System.nanoTime() - t0) / 1e9;
            int k = HemisphereSampler.roundedRayCount(raysPerPatch);
            t.row("sky view factors", String.format(Locale.ROOT, "%,d patches x %,d rays: %.2f s wall clock (%s, parallel stream: %d pool threads + caller)",
                    patches, k, s, mrays((double) patches * k / s), java.util.concurrent.ForkJoinPool.getCommonPoolParallelism()));
        }
        t.print();
    }

    private static final java.lang.management.ThreadMXBean CPU = java.lang.management.ManagementFactory.getThreadMXBean();

    private static String mrays(double perSecond) {
        return String.format(Locale.ROOT, "%.2f Mrays/s", perSecond / 1e6);
    }

    private interface Timed { double run() throws Exception; }

    private static double best(Timed f) {
        double b = Double.POSITIVE_INFINITY;
        try {
            for (int i = 0; i < 3; i++) b = Math.min(b, f.run());
        } catch (Exception e) {
            throw new IllegalStateException(e);
        }
        return b;
    }

    /** Seconds to trace all rays split over {@code threads} threads. */
    private static double time(Scene scene, double[] r, int threads, boolean occlusion) throws Exception {
        int n = r.length / 6;
        if (threads == 1) { // CPU time of this thread: robust when other work shares the cores
            long t0 = CPU.getCurrentThreadCpuTime();
            runPass(scene, r, 0, n, occlusion);
            return (CPU.getCurrentThreadCpuTime() - t0) / 1e9;
        }
        ExecutorService ex = Executors.newFixedThreadPool(threads);
        try {
            List<Callable<Long>> jobs = new ArrayList<>();
            for (int i = 0; i < threads; i++) {
                int a = (int) ((long) n * i / threads), b = (int) ((long) n * (i + 1) / threads);
                jobs.add(() -> runPass(scene, r, a, b, occlusion));
            }
            long t0 = System.nanoTime();
            for (Future<Long> f : ex.invokeAll(jobs)) f.get();
            return (System.nanoTime() - t0) / 1e9;
        } finally {
            ex.shutdown();
        }
    }

    /** Traces rays [a, b); returns how many hit something. */
    static long runPass(Scene scene, double[] r, int a, int b, boolean occlusion) {
        Tracer t = scene.tracer();
        long hits = 0;
        for (int i = a; i < b; i++) {
            int j = 6 * i;
            if (occlusion) {
                if (t.occluded(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY)) hits++;
            } else if (t.closestHit(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY) != Tracer.MISS) {
                hits++;
            }
        }
        return hits;
    }

    /** Two-column aligned table. */
    private static final class PrintTable {
        private final List<String[]> rows = new ArrayList<>();

        void row(String k, String v) { rows.add(new String[] {k, v}); }

        void print() {
            int w = 0;
            for (String[] r : rows) w = Math.max(w, r[0].length());
            System.out.println("Solmass ray-casting benchmark");
            for (String[] r : rows) System.out.printf(Locale.ROOT, "  %-" + w + "s  %s%n", r[0], r[1]);
        }
    }
}
