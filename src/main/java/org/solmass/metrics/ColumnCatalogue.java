package org.solmass.metrics;

import org.solmass.irradiation.IrradiationColumns;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Every per-patch result column Solmass writes, gathered from the stages that declare them
 * ({@link IrradiationColumns}, each registered {@link Metric}) plus the differences of
 * {@link PatchComparison}: the one lookup from a header name to its {@link Column} for readers
 * (the viewer opening a results folder, {@code compare}) and for the docs (docs/outputs.md is checked
 * against {@link #markdownTable()}).
 */
public final class ColumnCatalogue {
    private ColumnCatalogue() {}

    /** Every declared family, in the order columns appear in patches.csv. */
    public static List<ColumnFamily> families() {
        List<ColumnFamily> out = new ArrayList<>(IrradiationColumns.COLUMNS);
        out.addAll(Metrics.columns());
        return out;
    }

    /** The declared column of a name, including {@code delta_<name>} differences. */
    public static Optional<Column> declared(String name) {
        if (name.startsWith(PatchComparison.DELTA_PREFIX)) {
            return declared(name.substring(PatchComparison.DELTA_PREFIX.length())).map(PatchComparison::delta);
        }
        for (ColumnFamily f : families()) {
            Optional<Column> c = f.match(name);
            if (c.isPresent()) return c;
        }
        return Optional.empty();
    }

    /** The column of a header name: the declared one, or {@link Column#unknown} for a name no stage declares. */
    public static Column of(String name) {
        return declared(name).orElseGet(() -> Column.unknown(name));
    }

    /**
     * The result-column table of docs/outputs.md: one row per family, in patches.csv order, with
     * the unit, decimals, kind, label (of the family's first member) and description.
     */
    public static String markdownTable() {
        StringBuilder sb = new StringBuilder("| column | unit | decimals | kind | label | meaning |\n|---|---|---|---|---|---|\n");
        for (ColumnFamily f : families()) {
            Column c = f.example();
            String name = f.docName().contains(" ... ")
                    ? "`" + f.docName().replace(" ... ", "` ... `") + "`" : "`" + f.docName() + "`";
            sb.append("| ").append(name).append(" | ").append(c.unit().symbol()).append(" | ").append(c.decimals())
                    .append(" | ").append(c.kind().name().toLowerCase(java.util.Locale.ROOT)).append(" | ").append(c.label())
                    .append(" | ").append(c.description()).append(" |\n");
        }
        return sb.toString();
    }
}
