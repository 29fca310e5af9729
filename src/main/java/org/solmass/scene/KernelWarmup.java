package org.solmass.scene;

import java.util.SplittableRandom;

/**
 * Brings the SIMD ray kernels ({@link VectorOcclusion}, {@link VectorDirections}) to compiled code
 * before a long pass starts, on a small invented scene, once per JVM.
 *
 * <p>Why: the JDK's vector API is fast only once the JIT's optimising compiler (C2) has compiled the
 * methods that use it; before that, in the interpreter and in the first-tier compiled code, every
 * vector operation runs the API's Java fallback, which allocates and loops lane by lane. Measured on
 * the 113,467-patch bench district ({@code bench-analysis --patches 100000}, 2 threads): the first
 * 5,000 receivers of the first pass took about 2,960 microseconds each, the later ones 150-340; that
 * start-up alone was a third of the pass's thread time. The JIT compiles a method after it has run
 * a number of times (HotSpot's tiered thresholds, thousands of calls or loop turns), whatever the
 * input size, so running the kernels on bundles of a few rays against a few dozen triangles reaches
 * those counts for a small part of the cost of real patches in slow code.
 *
 * <p>The warm-up calls the kernels as the first pass calls them ({@code ShadedIrradiation.Worker}):
 * an analysed patch's reflection subset to its first hits and the rest of its hemisphere with shared
 * sun-like rays ({@link HemisphereSampler#queueForReflection}, {@link BundleTracer#occludedWithShared},
 * {@link HemisphereSampler#classifyRest}), then a reflector-only receiver (every ray to its first hit,
 * {@link HemisphereSampler#sample}, and the shared rays alone); the shared rays change every tenth
 * bundle, some are behind a far horizon; leaves hold several triangles; rays hit and escape. The JIT
 * then compiles the methods the pass calls, with branch profiles like the pass's. Measured on the
 * bench district ({@code bench-analysis --patches 100000}, 2 cores, one run each way, in turn): an
 * earlier warm-up through other entry points (the whole-hemisphere {@code sample}, any-hit bundles with
 * float directions and with limits) left the visibility pass about 0.9 s slower (8.9-9.0 s against
 * 9.8-9.9 s), compiled code being replaced at the pass's first calls. It changes no result: it runs
 * the kernels on data of its own, and the passes use the same kernels whether it has finished or not.
 *
 * <p>A pass with many receivers runs it first, on the calling thread ({@link #awaitFor}); it runs rounds
 * of {@link #BUNDLES_PER_ROUND} small bundles until {@link #FAST_ROUNDS} rounds in a row take less
 * than 1/{@link #COMPILED_SPEEDUP} of the first (interpreted) round's time, or for {@link #MAX_SECONDS}
 * at most. Measured here (this VM, 2 cores, at the start of the bench district's pass): the first
 * round 0.55 s, rounds of partly compiled code 12-175 ms, then 3.5-8 ms, then under 2.2 ms after
 * about 1.55 s (1.5-2.7 s over one session's runs, as the VM's speed varied); the ratio between
 * the first and a compiled round belongs to the code, not to the machine's speed. Started when the
 * scene was being built (0.6 s before the pass) it took the scene's cores and gained nothing. A
 * pause between rounds leaves a core to the JIT's compiler threads. It also stops when the rounds have not
 * become twice as fast for {@link #STALL_SECONDS} (kernels already compiled). The JIT goes on
 * compiling for some seconds after it (a second warm-up in the same JVM ran its rounds in 0.9-2 ms),
 * now on the pass's own calls. Started on a thread of its own while the model was cut into patches
 * (both cores busy), it had not reached compiled code after 8 s, so it runs when the pass is about
 * to start.
 */
public final class KernelWarmup {
    static final int BUNDLES_PER_ROUND = 100;
    /** A round this many times faster than the first counts as compiled code. */
    static final int COMPILED_SPEEDUP = 250;
    static final int FAST_ROUNDS = 3;
    static final double MAX_SECONDS = 8;
    /**
     * Or it stops when the rounds have not become twice as fast for this long: when the kernels were
     * already compiled (an earlier pass in the same JVM) the first round is no slower than the
     * others and the speed-up above never comes.
     */
    static final double STALL_SECONDS = 1.0;
    /**
     * Receivers of a pass from which the warm-up pays: the first receivers in slow code cost about
     * 1.2-3 ms each (measured, see above) and the warm-up 1.5-2.7 s of one thread, so below some
     * thousands of receivers it would cost more than it saves.
     */
    public static final int WORTH_RECEIVERS = 5_000;
    private static boolean done;

    private KernelWarmup() {}

    /** Whether {@link #awaitFor} would run the warm-up now for a pass of {@code receivers} receivers. */
    public static boolean pendingFor(int receivers) {
        synchronized (KernelWarmup.class) {
            return receivers >= WORTH_RECEIVERS && BundleTracer.SIMD_AVAILABLE && !done;
        }
    }

    /**
     * Runs the warm-up once per JVM, before a pass of {@code receivers} receivers, when the SIMD
     * kernels are in use and the pass has at least {@link #WORTH_RECEIVERS}; returns at once otherwise.
     * Concurrent callers wait for the one that runs it.
     */
    public static void awaitFor(int receivers) {
        synchronized (KernelWarmup.class) {
            if (!pendingFor(receivers)) return;
            run();
            done = true;
        }
    }

    /** The warm-up itself, on the calling thread; returns the rounds run. */
    static int run() {
        SplittableRandom rnd = new SplittableRandom(0x5eedL);
        float[] soup = new float[9 * 48]; // 48 triangles of about 2 m in a 20 m cube: leaves with several triangles
        for (int t = 0; t < 48; t++) {
            double cx = rnd.nextDouble(-10, 10), cy = rnd.nextDouble(-10, 10), cz = rnd.nextDouble(0, 20);
            for (int v = 0; v < 3; v++) {
                soup[9 * t + 3 * v] = (float) (cx + rnd.nextDouble(-2, 2));
                soup[9 * t + 3 * v + 1] = (float) (cy + rnd.nextDouble(-2, 2));
                soup[9 * t + 3 * v + 2] = (float) (cz + rnd.nextDouble(-2, 2));
            }
        }
        Scene scene = Scene.build(soup, true, 0.0);
        HemisphereSampler hs = new HemisphereSampler(scene, 16);
        BundleTracer bt = scene.bundleTracer();
        int n = hs.rayCount(), shared = 24;
        double[] dir = new double[3 * n], dist = new double[n], qDir = new double[3 * n], qT = new double[n];
        double[] sunDir = new double[3 * shared];
        int[] cls = new int[n], tri = new int[n], subset = new int[n];
        boolean[] out = new boolean[n], qFar = new boolean[n], sunFar = new boolean[shared], sunOut = new boolean[shared];
        long begin = System.nanoTime(), first = -1, mark = Long.MAX_VALUE, markedAt = begin;
        int fast = 0, rounds = 0;
        while (fast < FAST_ROUNDS && System.nanoTime() - begin < MAX_SECONDS * 1e9) {
            long t0 = System.nanoTime();
            for (int b = 0; b < BUNDLES_PER_ROUND; b++) {
                double ox = rnd.nextDouble(-12, 12), oy = rnd.nextDouble(-12, 12), oz = rnd.nextDouble(0.5, 22);
                double nx = rnd.nextDouble(-1, 1), ny = rnd.nextDouble(-1, 1), nz = rnd.nextDouble(-1, 1);
                double len = Math.sqrt(nx * nx + ny * ny + nz * nz);
                if (b % 10 == 0) { // a new plane: its sun-like directions (up, some behind a far horizon) shared
                    for (int s = 0; s < shared; s++) {
                        double x = rnd.nextDouble(-1, 1), y = rnd.nextDouble(-1, 1), z = rnd.nextDouble(0.05, 1);
                        double l = Math.sqrt(x * x + y * y + z * z);
                        sunDir[3 * s] = x / l;
                        sunDir[3 * s + 1] = y / l;
                        sunDir[3 * s + 2] = z / l;
                        sunFar[s] = s % 7 == 0;
                    }
                    bt.share(sunDir, sunFar, shared);
                }
                if (len < 1e-3) continue;
                nx /= len;
                ny /= len;
                nz /= len;
                long seed = rnd.nextLong();
                // as the first pass calls them: an analysed patch (reflection subset to first hits, the
                // rest with the shared rays), then a reflector-only receiver (every ray to its first hit)
                int end = hs.queueForReflection(ox, oy, oz, nx, ny, nz, seed, 2, dir, cls, tri, dist, subset, qDir, qT, qFar, 0);
                bt.occludedWithShared(ox, oy, oz, qDir, qT, qFar, end, out, sunOut);
                hs.classifyRest(out, dir, cls, tri, dist);
                hs.sample(ox, oy, oz, nx, ny, nz, seed, null, dir, cls, tri, dist);
                bt.occludedWithShared(ox, oy, oz, dir, null, qFar, 0, out, sunOut);
            }
            long now = System.nanoTime(), t = now - t0;
            if (first < 0) first = t;
            else fast = t * COMPILED_SPEEDUP < first ? fast + 1 : 0;
            rounds++;
            if (t * 2 <= mark) { // the rounds still get twice as fast now and then: compiling goes on
                mark = t;
                markedAt = now;
            } else if (now - markedAt > STALL_SECONDS * 1e9) {
                break; // kernels compiled before (an earlier pass in this JVM), or compiling has stalled
            }
            try {
                Thread.sleep(2);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                break;
            }
        }
        return rounds;
    }
}
