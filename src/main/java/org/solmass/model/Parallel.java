package org.solmass.model;

import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;
import java.util.function.IntFunction;
import java.util.stream.IntStream;

/**
 * Index loops run on every worker of the calling pool, each worker claiming small chunks of
 * indices one after another until none are left (self-scheduling: Tang and Yew, "Processor
 * self-scheduling for multiple-nested parallel loops", ICPP 1986; common practice in parallel
 * runtimes as "dynamic" scheduling).
 *
 * <p>Why not {@code IntStream.range(0, n).parallel().forEach}: a parallel stream cuts its range into
 * leaves of about n / (4 x the common pool's parallelism) indices, a constant of the JDK
 * ({@code java.util.stream.AbstractTask.LEAF_TARGET}) whatever pool runs it. On 2 cores (common pool
 * parallelism 1) that is 4 to 8 leaves; where the cost per index varies (patches of open roofs and of
 * deep courtyards) the last leaf ran alone for seconds while the other core idled (JFR of
 * {@code bench-analysis --patches 100000}: about 2 s of the visibility pass on one core).
 *
 * <p>Nothing a caller computes may depend on which thread runs an index or in what order (each index
 * writes its own slots): the results are then independent of the thread count and the chunking.
 */
public final class Parallel {
    private Parallel() {}

    /** Chunks per worker the loop aims at: enough that the last chunks are short against the loop. */
    static final int CHUNKS_PER_WORKER = 64;
    /** Largest chunk, indices. */
    static final int MAX_CHUNK = 64;

    /** {@code body} for every index in [0, n), on the calling pool's workers (or the common pool and the caller). */
    public static void forEach(int n, IntConsumer body) {
        int workers = workers();
        forEach(n, Math.max(1, Math.min(MAX_CHUNK, n / (workers * CHUNKS_PER_WORKER))), workers, body);
    }

    /** {@code f} of every index in [0, n), computed as {@link #forEach(int, IntConsumer)} does, as a list in index order. */
    public static <T> List<T> map(int n, IntFunction<T> f) {
        Object[] out = new Object[Math.max(0, n)];
        forEach(n, i -> out[i] = f.apply(i));
        @SuppressWarnings("unchecked") List<T> l = (List<T>) Arrays.asList(out);
        return Collections.unmodifiableList(l);
    }

    /** As {@link #forEach(int, IntConsumer)} with chunks of {@code chunk} indices and at most {@code workers} tasks. */
    static void forEach(int n, int chunk, int workers, IntConsumer body) {
        if (n <= 0) return;
        if (chunk < 1) throw new IllegalArgumentException("chunk must be at least 1: " + chunk);
        int chunks = (int) ((n + (long) chunk - 1) / chunk);
        int tasks = Math.min(workers, chunks);
        if (tasks <= 1) {
            for (int i = 0; i < n; i++) body.accept(i);
            return;
        }
        AtomicInteger next = new AtomicInteger();
        // a stream of as many elements as tasks splits down to single elements, one per worker
        IntStream.range(0, tasks).parallel().forEach(t -> {
            for (int c = next.getAndIncrement(); c < chunks; c = next.getAndIncrement()) {
                int from = c * chunk, to = (int) Math.min(n, (long) from + chunk);
                try {
                    for (int i = from; i < to; i++) body.accept(i);
                } catch (RuntimeException | Error e) {
                    next.set(chunks); // the other tasks claim nothing more; the stream rethrows
                    throw e;
                }
            }
        });
    }

    /** Threads a parallel loop started here runs on: the pool's parallelism inside a pool, else the common pool's plus the caller. */
    static int workers() {
        ForkJoinPool pool = ForkJoinTask.getPool();
        return pool != null ? pool.getParallelism() : ForkJoinPool.getCommonPoolParallelism() + 1;
    }
}
