package org.solmass.cli;

import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
import org.solmass.irradiation.PhaseProgress;

import java.io.PrintStream;

/**
 * Progress on stderr: a bar with an ETA for each phase that has a known amount of work, a line for
 * the others. Bars appear only after the phase has run for a second, so quick runs stay quiet.
 */
final class ConsoleProgress implements PhaseProgress, AutoCloseable {
    private final PrintStream err;
    private final boolean quiet;
    private ProgressBar bar;
    private String phase;
    private long total, started, last;

    ConsoleProgress(PrintStream err, boolean quiet) {
        this.err = err;
        this.quiet = quiet;
    }

    @Override
    public synchronized void begin(String name, long work) {
        closeBar();
        phase = name;
        total = work;
        started = System.nanoTime();
        last = 0;
        if (!quiet && work == 0) err.println("solmass: " + name + " ...");
    }

    @Override
    public synchronized void advance(long done) {
        if (quiet || total == 0 || done < last) return;
        last = done;
        if (bar == null && System.nanoTime() - started > 1_000_000_000L && done < total) {
            bar = new ProgressBarBuilder().setTaskName(phase).setInitialMax(total).setStyle(ProgressBarStyle.ASCII)
                    .setConsumer(new me.tongfei.progressbar.ConsoleProgressBarConsumer(err)).setUpdateIntervalMillis(250)
                    .showSpeed().build();
        }
        if (bar != null) bar.stepTo(done);
    }

    private void closeBar() {
        if (bar != null) {
            bar.stepTo(total);
            bar.close();
            bar = null;
        }
    }

    @Override
    public synchronized void close() {
        closeBar();
    }
}
