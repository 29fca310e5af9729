package org.solmass.viewer;

/** Receives progress of a long job; may be called from any thread. */
@FunctionalInterface
public interface ProgressSink {
    /**
     * @param fraction done, 0..1, or a negative value when unknown
     * @param message what is being done, short
     */
    void progress(double fraction, String message);

    ProgressSink NONE = (f, m) -> {};
}
