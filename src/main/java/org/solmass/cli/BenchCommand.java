package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.bench.BundleRuns;
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
 * ({@link SyntheticDistrict}): BVH build, occlusion rays per second one at a time and in bundles that
 * share a patch origin (as the sky-view and irradiation passes trace them), closest-hit rays, on one
 * thread and on all threads, and a full sky-view-factor pass. Prints a table to stdout.
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
        double[] r1024 = SyntheticDistrict.rays(m, Math.max(1, rays / 1024), 1024, scene.epsilon(), seed);
        int n = r.length / 6, n1024 = r1024.length / 6;

        System.err.println("solmass bench: warming up ...");
        for (int i = 0; i < 3; i++) {
            for (Kind k : Kind.values()) runPass(scene, k.perPoint == 1024 ? r1024 : r, k, 0, k.perPoint == 1024 ? n1024 : n);
        }
        double occ1 = best(() -> time(scene, r, 1, Kind.SINGLE)), occT = best(() -> time(scene, r, threads, Kind.SINGLE));
        double b64 = best(() -> time(scene, r, 1, Kind.BUNDLES_64)), b64T = best(() -> time(scene, r, threads, Kind.BUNDLES_64));
        double b1k = best(() -> time(scene, r1024, 1, Kind.BUNDLES_1024)), b1kT = best(() -> time(scene, r1024, threads, Kind.BUNDLES_1024));
        double cl1 = best(() -> time(scene, r, 1, Kind.CLOSEST)), clT = best(() -> time(scene, r, threads, Kind.CLOSEST));
        double c1k = best(() -> time(scene, r1024, 1, Kind.CLOSEST_1024)), c1kT = best(() -> time(scene, r1024, threads, Kind.CLOSEST_1024));
        long hits = runPass(scene, r, Kind.SINGLE, 0, n);
        long hits1k = runPass(scene, r1024, Kind.BUNDLES_1024, 0, n1024);

        PrintTable t = new PrintTable();
        t.row("district", blocks + " blocks, seed " + seed + " (invented)");
        t.row("triangles", String.format(Locale.ROOT, "%,d", scene.triangleCount()));
        t.row("BVH nodes / depth", String.format(Locale.ROOT, "%,d / %d", scene.nodeCount(), scene.maxDepth()));
        t.row("BVH build", String.format(Locale.ROOT, "%.1f ms CPU time (best of 5, 1 thread)", bestBuild));
        t.row("timing rays", String.format(Locale.ROOT, "%,d as 64 cosine-weighted rays per roof/facade point (%.1f%% occluded);",
                n, 100.0 * hits / n));
        t.row("", String.format(Locale.ROOT, "%,d as 1,024 per point, as sky-view and analyse cast them (%.1f%% occluded)",
                n1024, 100.0 * hits1k / n1024));
        String kernel = scene.bundleTracer().simd() ? "SIMD packets" : "scalar stream, no vector module";
        t.row("occlusion, one ray at a time", mrays(n / occ1) + " 1 thread (per CPU-second), " + perThread(n, occT, threads));
        t.row("occlusion, bundles of 64", mrays(n / b64) + " 1 thread (per CPU-second), " + perThread(n, b64T, threads) + ", " + kernel);
        t.row("occlusion, bundles of 1,024", mrays(n1024 / b1k) + " 1 thread (per CPU-second), " + perThread(n1024, b1kT, threads) + ", " + kernel);
        t.row("closest hit, one ray at a time", mrays(n / cl1) + " 1 thread (per CPU-second), " + perThread(n, clT, threads));
        t.row("closest hit, bundles of 1,024", mrays(n1024 / c1k) + " 1 thread (per CPU-second), " + perThread(n1024, c1kT, threads)
                + (scene.bundleTracer().simd() ? ", SIMD packets" : ", one at a time (no vector module)"));
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

    private static String perThread(int n, double seconds, int threads) {
        return String.format(Locale.ROOT, "%s on %d threads wall clock (%.2f per thread)", mrays(n / seconds), threads, n / seconds / threads / 1e6);
    }

    /** What a timing pass traces: rays one by one (any hit or closest hit), or per point as a bundle. */
    enum Kind {
        SINGLE(1), CLOSEST(1), BUNDLES_64(64), BUNDLES_1024(1024), CLOSEST_1024(1024);

        final int perPoint;

        Kind(int perPoint) { this.perPoint = perPoint; }
    }

    /** Seconds to trace all rays split over {@code threads} threads (whole points per thread). */
    private static double time(Scene scene, double[] r, int threads, Kind kind) throws Exception {
        int points = r.length / 6 / kind.perPoint;
        if (threads == 1) { // CPU time of this thread: robust when other work shares the cores
            long t0 = CPU.getCurrentThreadCpuTime();
            runPass(scene, r, kind, 0, points * kind.perPoint);
            return (CPU.getCurrentThreadCpuTime() - t0) / 1e9;
        }
        ExecutorService ex = Executors.newFixedThreadPool(threads);
        try {
            List<Callable<Long>> jobs = new ArrayList<>();
            for (int i = 0; i < threads; i++) {
                int a = (int) ((long) points * i / threads) * kind.perPoint, b = (int) ((long) points * (i + 1) / threads) * kind.perPoint;
                jobs.add(() -> runPass(scene, r, kind, a, b));
            }
            long t0 = System.nanoTime();
            for (Future<Long> f : ex.invokeAll(jobs)) f.get();
            return (System.nanoTime() - t0) / 1e9;
        } finally {
            ex.shutdown();
        }
    }

    /** Traces rays [a, b) (whole points for bundles); returns how many hit something. */
    static long runPass(Scene scene, double[] r, Kind kind, int a, int b) {
        long hits = 0;
        if (kind == Kind.SINGLE || kind == Kind.CLOSEST) {
            Tracer t = scene.tracer();
            for (int i = a; i < b; i++) {
                int j = 6 * i;
                if (kind == Kind.SINGLE) {
                    if (t.occluded(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY)) hits++;
                } else if (t.closestHit(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY) != Tracer.MISS) {
                    hits++;
                }
            }
            return hits;
        }
        return BundleRuns.trace(scene.bundleTracer(), r, a, b, kind.perPoint, kind == Kind.CLOSEST_1024);
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
