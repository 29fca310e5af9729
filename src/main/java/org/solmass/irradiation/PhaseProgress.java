package org.solmass.irradiation;

/** Receives the progress of a long computation as named phases with a known amount of work. */
public interface PhaseProgress {
    /** A new phase starts, with {@code total} units of work (0 when unknown). */
    void begin(String phase, long total);

    /** {@code done} units of the current phase are finished (monotonic, from any thread). */
    void advance(long done);

    /** Progress that is discarded. */
    PhaseProgress NONE = new PhaseProgress() {
        @Override public void begin(String phase, long total) {}
        @Override public void advance(long done) {}
    };
}
