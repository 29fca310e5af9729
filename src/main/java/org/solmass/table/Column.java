package org.solmass.table;

import java.util.Locale;
import java.util.Objects;

/**
 * One per-patch result column: everything a writer, a reader, the viewer, {@code compare}, glTF and
 * the docs need to know about it. Columns are declared by the stage that computes them
 * ({@code irradiation.IrradiationColumns}, each {@code metrics.Metric}) and looked up by name in
 * {@code metrics.ColumnCatalogue}; nothing else spells a label, a unit or a number of decimals.
 *
 * @param name CSV header name, lower case with underscores ({@code annual_kwh_m2})
 * @param unit unit of the values
 * @param label human name for titles, selectors and legends ("Sun hours on 21 March")
 * @param decimals decimals in files (CSV, summary.json, glTF extras)
 * @param kind how values are read and coloured
 * @param description one sentence for docs/outputs.md and tool tips
 * @param cautioned true when the values steer roof or PV decisions: shown together with the caution
 */
public record Column(String name, Unit unit, String label, int decimals, ColumnKind kind, String description,
                     boolean cautioned) {
    public Column {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(description, "description");
        if (!name.matches("[a-z][a-z0-9_]*")) throw new IllegalArgumentException("column name " + name + " is not lower_snake_case");
        if (decimals < 0 || decimals > 8) throw new IllegalArgumentException("column " + name + ": decimals " + decimals + " not in 0..8");
        if (kind.whole() && decimals != 0) throw new IllegalArgumentException("column " + name + ": " + kind + " columns print whole numbers");
    }

    /** A sequential column with its unit's decimals and no caution. */
    public static Column of(String name, Unit unit, String label, String description) {
        return new Column(name, unit, label, unit.decimals(), ColumnKind.SEQUENTIAL, description, false);
    }

    /**
     * A column of a name nobody declared (a file from a newer version, a column added by hand): its
     * name as label, no unit, 4 decimals.
     */
    public static Column unknown(String name) {
        String safe = name.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9_]", "_");
        if (safe.isEmpty() || !Character.isLetter(safe.charAt(0))) safe = "c_" + safe;
        return new Column(safe, Unit.RATIO, name.replace('_', ' '), Unit.RATIO.decimals(), ColumnKind.SEQUENTIAL,
                "Not a Solmass column; read as a number without unit.", false);
    }

    public Column withKind(ColumnKind k) {
        return new Column(name, unit, label, k.whole() ? 0 : decimals, k, description, cautioned);
    }

    public Column withDecimals(int d) { return new Column(name, unit, label, d, kind, description, cautioned); }

    public Column withCaution() { return new Column(name, unit, label, decimals, kind, description, true); }

    /** The label with the unit as shown on screen: "Annual irradiation (kWh/m\u00b2)". */
    public String title() {
        return unit.display().isEmpty() ? label : label + " (" + unit.display() + ")";
    }

    /** A value with the column's decimals and its unit as shown on screen ("1043.25 kWh/m\u00b2"); "no value" for NaN. */
    public String display(double v) {
        if (!Double.isFinite(v)) return "no value";
        String s = Numbers.format(v, decimals);
        return unit.display().isEmpty() ? s : s + " " + unit.display();
    }

    /** The value as written in files: fixed decimals, empty for NaN ({@link Numbers}). */
    public String format(double v) { return Numbers.format(v, decimals); }

    @Override public String toString() { return label; }
}
