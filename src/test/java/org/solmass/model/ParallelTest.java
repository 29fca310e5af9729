package org.solmass.model;

import org.junit.jupiter.api.Test;

import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.atomic.AtomicIntegerArray;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@link Parallel}: every index exactly once, on the calling pool's workers; a failure reaches the caller. */
class ParallelTest {

    @Test
    void everyIndexOnceWhateverTheChunkAndWorkers() {
        for (int n : new int[]{0, 1, 2, 63, 64, 65, 1000, 10_007}) {
            for (int chunk : new int[]{1, 3, 64, 5000}) {
                for (int workers : new int[]{1, 2, 3, 8}) {
                    AtomicIntegerArray seen = new AtomicIntegerArray(Math.max(1, n));
                    Parallel.forEach(n, chunk, workers, i -> seen.incrementAndGet(i));
                    for (int i = 0; i < n; i++) assertEquals(1, seen.get(i), "index " + i + " of " + n + ", chunk " + chunk + ", workers " + workers);
                }
            }
        }
    }

    /** In a pool of 3 workers the loop uses the pool's threads (and several of them, for a loop of slow indices). */
    @Test
    void runsOnThePoolsWorkers() throws Exception {
        ForkJoinPool pool = new ForkJoinPool(3);
        try {
            ConcurrentHashMap<Thread, Boolean> threads = new ConcurrentHashMap<>();
            AtomicIntegerArray seen = new AtomicIntegerArray(600);
            pool.submit(() -> Parallel.forEach(600, i -> {
                threads.put(Thread.currentThread(), true);
                seen.incrementAndGet(i);
                try {
                    Thread.sleep(1);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            })).get();
            for (int i = 0; i < 600; i++) assertEquals(1, seen.get(i));
            assertTrue(threads.size() >= 2, "threads used: " + threads.size());
            for (Thread t : threads.keySet()) assertTrue(t instanceof java.util.concurrent.ForkJoinWorkerThread && ((java.util.concurrent.ForkJoinWorkerThread) t).getPool() == pool, t.getName());
        } finally {
            pool.shutdown();
        }
    }

    @Test
    void aFailureReachesTheCaller() {
        IllegalStateException e = assertThrows(IllegalStateException.class, () -> Parallel.forEach(10_000, 7, 2, i -> {
            if (i == 4321) throw new IllegalStateException("index " + i);
        }));
        // thrown on another worker, the fork/join framework rethrows the same type with the original as its cause
        Throwable original = e.getCause() instanceof IllegalStateException c ? c : e;
        assertEquals("index 4321", original.getMessage());
    }
}
