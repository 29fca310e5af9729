package org.solmass.table;

import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Per-patch results as {@link Column}s with one value per patch, in the order they are written. Every
 * stage that computes a per-patch quantity adds its declared columns (sky view, irradiation, metrics);
 * the writers, the summary, the viewer and {@code compare} read the column's definition from here, so
 * a unit, label or number of decimals is never guessed from a name.
 */
public final class ResultTable {
    private final List<Patch> patches;
    private final Map<String, Column> defs = new LinkedHashMap<>();
    private final Map<String, double[]> values = new LinkedHashMap<>();

    public ResultTable(List<Patch> patches) {
        this.patches = List.copyOf(patches);
    }

    public List<Patch> patches() { return patches; }

    public int size() { return patches.size(); }

    /**
     * Adds or replaces a column.
     *
     * @param values one value per patch, in patch index order (NaN where there is none)
     */
    public ResultTable put(Column column, double[] values) {
        if (values.length != patches.size()) {
            throw new IllegalArgumentException("column " + column.name() + " has " + values.length
                    + " values for " + patches.size() + " patches");
        }
        defs.put(column.name(), column);
        this.values.put(column.name(), values);
        return this;
    }

    /** A copy with the same patches and columns (the value arrays are shared). */
    public ResultTable copy() {
        ResultTable t = new ResultTable(patches);
        for (Column c : defs.values()) t.put(c, values.get(c.name()));
        return t;
    }

    public boolean has(String name) { return values.containsKey(name); }

    /** The column's values; throws if absent. */
    public double[] column(String name) {
        double[] c = values.get(name);
        if (c == null) throw new IllegalArgumentException("no column " + name + " (have " + values.keySet() + ")");
        return c;
    }

    /** The definition of a present column; throws if absent. */
    public Column def(String name) {
        Column c = defs.get(name);
        if (c == null) throw new IllegalArgumentException("no column " + name + " (have " + values.keySet() + ")");
        return c;
    }

    /** The column definitions in table order. */
    public List<Column> columns() { return List.copyOf(defs.values()); }

    public List<String> names() { return Collections.unmodifiableList(new ArrayList<>(values.keySet())); }
}
