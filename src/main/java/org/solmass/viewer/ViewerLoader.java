package org.solmass.viewer;

import java.util.function.BooleanSupplier;

/**
 * Produces the data to show; runs on a background thread while the window shows a progress bar
 * and a cancel button (e.g. analysing a study before viewing it).
 */
@FunctionalInterface
public interface ViewerLoader {
    /**
     * @param progress progress reports for the bar
     * @param cancelled becomes true when the user cancels; the loader should stop soon and may
     *                  return null or throw {@link java.util.concurrent.CancellationException}
     */
    ViewerData load(ProgressSink progress, BooleanSupplier cancelled) throws Exception;

    /** A loader that returns data already at hand. */
    static ViewerLoader of(ViewerData data) { return (p, c) -> data; }
}
