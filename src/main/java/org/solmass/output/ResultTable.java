package org.solmass.output;

import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Per-patch results as named numeric columns, in the order they are written. Every stage that
 * computes a per-patch quantity adds a column (sky view, irradiation, metrics); the writers and the
 * viewer read them by name. Column names are the CSV header names, e.g. {@code sky_view_factor},
 * {@code annual_kwh_m2}, {@code m01_kwh_m2}.
 */
public final class ResultTable {
    private final List<Patch> patches;
    private final Map<String, double[]> columns = new LinkedHashMap<>();
    private final Map<String, String> units = new LinkedHashMap<>();

    public ResultTable(List<Patch> patches) {
        this.patches = List.copyOf(patches);
    }

    public List<Patch> patches() { return patches; }

    public int size() { return patches.size(); }

    /**
     * Adds or replaces a column.
     *
     * @param name CSV header name
     * @param unit unit for legends and docs ("kWh/m2", "h", "%", "" for ratios)
     * @param values one value per patch, in patch index order
     */
    public ResultTable put(String name, String unit, double[] values) {
        if (values.length != patches.size()) {
            throw new IllegalArgumentException("column " + name + " has " + values.length
                    + " values for " + patches.size() + " patches");
        }
        columns.put(name, values);
        units.put(name, unit);
        return this;
    }

    public boolean has(String name) { return columns.containsKey(name); }

    /** The column's values; throws if absent. */
    public double[] column(String name) {
        double[] c = columns.get(name);
        if (c == null) throw new IllegalArgumentException("no column " + name + " (have " + columns.keySet() + ")");
        return c;
    }

    public String unit(String name) { return units.getOrDefault(name, ""); }

    public List<String> names() { return Collections.unmodifiableList(new ArrayList<>(columns.keySet())); }
}
