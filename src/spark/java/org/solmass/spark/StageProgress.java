package org.solmass.spark;

import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerJobStart;
import org.apache.spark.scheduler.SparkListenerStageCompleted;
import org.apache.spark.scheduler.SparkListenerTaskEnd;
import org.apache.spark.scheduler.StageInfo;

import java.io.PrintStream;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Progress of a city run per stage on stderr: {@code city: first pass: 3/8 tasks}. The last stage of
 * each job whose description was set by {@link #label} is counted (the runner names each of its jobs;
 * their last stage runs one task per partition of tiles, {@code CityStages.TilePartitioner}; the
 * shuffles before it are not shown); tasks are counted
 * as they succeed (a retried task counts once, when it succeeds). Lines are
 * printed at most every {@code everyMs} milliseconds per stage, and always at a stage's end.
 */
public final class StageProgress extends SparkListener {
    private final PrintStream out;
    private final long everyMs;
    private final Map<Integer, Counter> stages = new ConcurrentHashMap<>();

    private static final class Counter {
        final String label;
        final int tasks;
        int done;
        long lastPrint;

        Counter(String label, int tasks) {
            this.label = label;
            this.tasks = tasks;
        }
    }

    public StageProgress(PrintStream out, long everyMs) {
        this.out = out;
        this.everyMs = everyMs;
    }

    /** The description of the runner's next jobs (what the progress line names), in the job's local properties. */
    public static void label(org.apache.spark.api.java.JavaSparkContext sc, String what) {
        sc.setJobDescription(what);
    }

    @Override
    public void onJobStart(SparkListenerJobStart e) {
        java.util.Properties p = e.properties();
        String label = p == null ? null : p.getProperty("spark.job.description");
        if (label == null) return;
        StageInfo last = null;
        for (StageInfo si : scala.jdk.javaapi.CollectionConverters.asJava(e.stageInfos())) {
            if (last == null || si.stageId() > last.stageId()) last = si;
        }
        if (last != null) stages.put(last.stageId(), new Counter(label, last.numTasks()));
    }

    @Override
    public void onTaskEnd(SparkListenerTaskEnd e) {
        Counter c = stages.get(e.stageId());
        if (c == null || !e.taskInfo().successful()) return;
        synchronized (c) {
            c.done++;
            long now = System.currentTimeMillis();
            if (c.done == c.tasks || now - c.lastPrint >= everyMs) {
                c.lastPrint = now;
                out.printf(Locale.ROOT, "city: %s: %d/%d tasks%n", c.label, c.done, c.tasks);
                out.flush();
            }
        }
    }

    @Override
    public void onStageCompleted(SparkListenerStageCompleted e) {
        stages.remove(e.stageInfo().stageId());
    }
}
