package org.solmass.metrics;

import org.solmass.table.ColumnFamily;
import org.solmass.table.ResultTable;

import java.util.List;

/**
 * A per-patch metric computed after irradiation (sun hours on dates, PV roof zones, ...). A metric is
 * one class: it declares its columns, computes and adds them to the result table, and says what goes
 * into the terminal summary and summary.json. {@link Metrics} runs every registered metric; nothing
 * outside the class knows its column names.
 */
public interface Metric {
    /** Short name for progress and errors ("sun hours"). */
    String name();

    /** The columns the metric may add (the same for every run; see {@link ColumnCatalogue}). */
    List<ColumnFamily> columns();

    /**
     * Computes the metric, adds its columns to {@code table} and returns its findings. Called inside
     * the analysis's worker pool; must not depend on the number of threads.
     */
    Findings compute(MetricContext ctx, ResultTable table);

    /** What a metric found, beyond its columns. */
    interface Findings {
        /** Lines for the terminal summary of {@code analyse}, without leading blanks. */
        List<String> summaryLines();

        /** How its values are to be read, for summary.json's cautions. */
        List<String> notes();

        /** Names of its columns that summary.json gives statistics for. */
        List<String> summaryColumns();

        /** A section of summary.json (key {@link #summaryKey()}), or null. */
        default com.fasterxml.jackson.databind.node.ObjectNode summarySection() { return null; }

        /** Key of {@link #summarySection()} in summary.json. */
        default String summaryKey() { return null; }
    }
}
