package org.solmass.metrics;

import org.solmass.table.ColumnFamily;
import org.solmass.table.ResultTable;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Supplier;

/**
 * The registry and driver of the metrics stage: every {@link Metric} Solmass has, in the order they
 * run and their columns appear in patches.csv. Adding a metric is one class and one entry here.
 */
public final class Metrics {
    /** Every metric, in run order. */
    private static final List<Supplier<Metric>> ALL = List.of(SunHoursMetric::new, PvZonesMetric::new,
            VerticalSkyComponentMetric::new);

    private Metrics() {}

    /** New instances of every metric, in run order. */
    public static List<Metric> all() {
        return ALL.stream().map(Supplier::get).toList();
    }

    /** The column families of every metric, in run order. */
    static List<ColumnFamily> columns() {
        List<ColumnFamily> out = new ArrayList<>();
        for (Metric m : all()) out.addAll(m.columns());
        return out;
    }

    /**
     * What the metrics of a run found.
     *
     * @param findings one per metric, in run order
     */
    public record Outcome(List<Metric.Findings> findings) {
        public Outcome {
            findings = List.copyOf(findings);
        }

        /** The findings of the given type (e.g. {@link PvZonesMetric.Found}), if that metric ran. */
        public <T extends Metric.Findings> Optional<T> find(Class<T> type) {
            return findings.stream().filter(type::isInstance).map(type::cast).findFirst();
        }

        /** Every metric's notes for summary.json, in run order. */
        public List<String> notes() {
            return findings.stream().flatMap(f -> f.notes().stream()).toList();
        }

        /** Every metric's terminal lines, in run order. */
        public List<String> summaryLines() {
            return findings.stream().flatMap(f -> f.summaryLines().stream()).toList();
        }

        /** Columns the metrics want statistics of in summary.json. */
        public List<String> summaryColumns() {
            return findings.stream().flatMap(f -> f.summaryColumns().stream()).toList();
        }
    }

    /** Runs every metric on a finished analysis; each adds its columns to {@code table}. */
    public static Outcome run(MetricContext ctx, ResultTable table) {
        List<Metric.Findings> out = new ArrayList<>();
        for (Metric m : all()) out.add(m.compute(ctx, table));
        return new Outcome(out);
    }
}
