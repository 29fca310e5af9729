package org.solmass.fuzz;

import org.solmass.InputException;

import java.lang.management.ManagementFactory;

/**
 * The failure criteria every fuzz target applies to one input: the code under test may return or
 * throw Solmass's documented {@link InputException}; anything else propagates and Jazzer reports it.
 * In fuzzing mode (JAZZER_FUZZ set) an input of up to {@link #SMALL_INPUT_BYTES} bytes must also
 * finish within {@link #MAX_NANOS} and allocate at most {@link #MAX_ALLOCATED_BYTES} (16 000 times a
 * 4 KB input: "memory out of proportion"). Time is checked only while fuzzing, never in the
 * ordinary replay of the corpus, so the unit-test run has no timed assertion; an input over either
 * limit is run once more and judged by the second run, since the first inputs also load classes,
 * which the fuzzer instruments on the same thread, and compile.
 */
final class FuzzCheck {
    static final int SMALL_INPUT_BYTES = 8192;
    static final long MAX_NANOS = 1_000_000_000L;
    static final long MAX_ALLOCATED_BYTES = 64L << 20;
    static final boolean FUZZING = System.getenv("JAZZER_FUZZ") != null && !System.getenv("JAZZER_FUZZ").isEmpty();

    private static final com.sun.management.ThreadMXBean THREADS =
            (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();

    private FuzzCheck() {}

    private static long rerunNanos(Runnable target) {
        long t0 = System.nanoTime();
        try {
            target.run();
        } catch (InputException expected) {
            // as above
        }
        return System.nanoTime() - t0;
    }

    private static long rerunBytes(Runnable target) {
        long tid = Thread.currentThread().getId();
        long a0 = THREADS.getThreadAllocatedBytes(tid);
        try {
            target.run();
        } catch (InputException expected) {
            // as above
        }
        return THREADS.getThreadAllocatedBytes(tid) - a0;
    }

    /** Runs one input through {@code target}, applying the criteria above. */
    static void check(String what, int inputBytes, Runnable target) {
        long tid = Thread.currentThread().getId();
        long a0 = THREADS.getThreadAllocatedBytes(tid);
        long t0 = System.nanoTime();
        try {
            target.run();
        } catch (InputException expected) {
            if (expected.getMessage() == null || expected.getMessage().isBlank()) {
                throw new AssertionError(what + ": an input error without a message", expected);
            }
        }
        long ns = System.nanoTime() - t0;
        long bytes = THREADS.getThreadAllocatedBytes(tid) - a0;
        if (FUZZING && ns > MAX_NANOS) ns = rerunNanos(target); // the first inputs also pay for class loading and JIT
        if (inputBytes <= SMALL_INPUT_BYTES && bytes > MAX_ALLOCATED_BYTES) bytes = rerunBytes(target); // and for loading classes
        if (inputBytes <= SMALL_INPUT_BYTES && bytes > MAX_ALLOCATED_BYTES) {
            throw new AssertionError(String.format("%s allocated %.0f MB on a %d-byte input (limit %d MB)",
                    what, bytes / 1e6, inputBytes, MAX_ALLOCATED_BYTES >> 20));
        }
        if (FUZZING && inputBytes <= SMALL_INPUT_BYTES && ns > MAX_NANOS) {
            throw new AssertionError(String.format("%s took %.2f s on a %d-byte input (limit 1 s)",
                    what, ns / 1e9, inputBytes));
        }
    }
}
