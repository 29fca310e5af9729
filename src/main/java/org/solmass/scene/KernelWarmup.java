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
 * <p>The warm-up exercises every path the passes use (any hit with and without limits, closest hit,
 * double and float directions, the hemisphere direction maker, several direction octants, leaves
 * with several triangles, rays that hit and rays that escape, rays whose far-horizon answers are known), so that the compiled code is not
 * thrown away at the first real call. It changes no result: it runs the kernels on data of its own,
 * and the passes use the same kernels whether it has finished or not.
 *
 * <p>A pass with many receivers runs it first, on the calling thread ({@link #awaitFor}); it runs rounds
 * of {@link #BUNDLES_PER_ROUND} small bundles until {@link #FAST_ROUNDS} rounds in a row take less
 * than 1/{@link #COMPILED_SPEEDUP} of the first (interpreted) round's time, or for {@link #MAX_SECONDS}
 * at most. Measured here (this VM, 2 cores, nothing else running): the first round 1.4 s, rounds of
 * partly compiled code 9-40 ms, then 3.5-4.6 ms, reached after about 3.4 s; the ratio
 * between the first and a compiled round belongs to the code, not to the machine's speed. A pause
 * between rounds leaves a core to the JIT's compiler threads. It also stops when the rounds have not
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
     * 1.2-3 ms each (measured, see above) and the warm-up about 3.4 s of one thread, so below some
     * thousands of receivers it would cost more than it saves.
     */
    public static final int WORTH_RECEIVERS = 5_000;
    private static boolean done;

    private KernelWarmup() {}

    /**
     * Runs the warm-up once per JVM, before a pass of {@code receivers} receivers, when the SIMD
     * kernels are in use and the pass has at least {@link #WORTH_RECEIVERS}; returns at once otherwise.
     * Concurrent callers wait for the one that runs it.
     */
    public static void awaitFor(int receivers) {
        if (receivers < WORTH_RECEIVERS || !BundleTracer.SIMD_AVAILABLE) return;
        synchronized (KernelWarmup.class) {
            if (done) return;
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
        int n = hs.rayCount();
        double[] dir = new double[3 * n], dist = new double[n], limit = new double[n];
        float[] fdir = new float[3 * n];
        int[] cls = new int[n], tri = new int[n], subset = new int[n];
        boolean[] out = new boolean[n], farBlocked = new boolean[n];
        for (int s = 0; s < n; s += 3) farBlocked[s] = true; // rays a far horizon would block
        long begin = System.nanoTime(), first = -1, mark = Long.MAX_VALUE, markedAt = begin;
        int fast = 0, rounds = 0;
        while (fast < FAST_ROUNDS && System.nanoTime() - begin < MAX_SECONDS * 1e9) {
            long t0 = System.nanoTime();
            for (int b = 0; b < BUNDLES_PER_ROUND; b++) {
                double ox = rnd.nextDouble(-12, 12), oy = rnd.nextDouble(-12, 12), oz = rnd.nextDouble(0.5, 22);
                double nx = rnd.nextDouble(-1, 1), ny = rnd.nextDouble(-1, 1), nz = rnd.nextDouble(-1, 1);
                double len = Math.sqrt(nx * nx + ny * ny + nz * nz);
                if (len < 1e-3) continue;
                nx /= len;
                ny /= len;
                nz /= len;
                long seed = rnd.nextLong();
                hs.sampleForReflection(ox, oy, oz, nx, ny, nz, seed, null, false, 2, dir, cls, tri, dist, subset);
                hs.sample(ox, oy, oz, nx, ny, nz, seed, null, dir, cls, tri, dist);
                for (int s = 0; s < n; s++) {
                    fdir[3 * s] = (float) dir[3 * s];
                    fdir[3 * s + 1] = (float) dir[3 * s + 1];
                    fdir[3 * s + 2] = (float) dir[3 * s + 2];
                    limit[s] = 1 + 10 * rnd.nextDouble();
                }
                bt.occluded(ox, oy, oz, fdir, null, n, out);
                bt.occluded(ox, oy, oz, dir, limit, n, out);
                bt.occludedKnownFar(ox, oy, oz, dir, farBlocked, n, out);
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
