package org.solmass.viewer;

import org.solmass.irradiation.IrradiationColumns;
import org.solmass.table.Column;
import org.solmass.table.ColumnKind;
import org.solmass.table.ResultTable;

import java.util.ArrayList;
import java.util.List;

/**
 * A per-patch column the viewer can colour the model by: a view of the column's definition
 * ({@link Column}), which alone knows its label, unit, decimals and kind.
 *
 * @param def the column's definition
 */
public record Quantity(Column def) {

    /** Preferred order of the irradiation columns; the months follow, then the other columns in table order. */
    private static final List<Column> ORDER = List.of(IrradiationColumns.ANNUAL, IrradiationColumns.BEAM,
            IrradiationColumns.DIFFUSE, IrradiationColumns.REFLECTED, IrradiationColumns.UNSHADED,
            IrradiationColumns.SHADING_LOSS, IrradiationColumns.SKY_VIEW_FACTOR, IrradiationColumns.GROUND_VIEW_FACTOR,
            IrradiationColumns.ANNUAL_KWH);

    /** The quantities present in a table, best first. */
    public static List<Quantity> available(ResultTable table) {
        List<String> names = table.names();
        List<Quantity> out = new ArrayList<>();
        for (Column c : ORDER) if (names.contains(c.name())) out.add(new Quantity(table.def(c.name())));
        for (int m = 1; m <= 12; m++) {
            String n = IrradiationColumns.month(m).name();
            if (names.contains(n)) out.add(new Quantity(table.def(n)));
        }
        for (Column c : table.columns()) {
            if (out.stream().noneMatch(q -> q.column().equals(c.name()))) out.add(new Quantity(c));
        }
        return out;
    }

    /** The column's CSV name. */
    public String column() { return def.name(); }

    /** What the selector and legend call it. */
    public String label() { return def.label(); }

    /** The unit as shown on screen ("kWh/m\u00b2"; empty for ratios, levels and ids). */
    public String unit() { return def.unit().display(); }

    /** Signed differences: diverging ramp, range symmetric about zero. */
    public boolean diverging() { return def.kind() == ColumnKind.DIVERGING; }

    /** The quantity feeds PV or roof-use decisions: shown with the caution. */
    public boolean pvOrRoof() { return def.cautioned(); }

    /** Legend title: the label with its unit. */
    public String title() { return def.title(); }

    /**
     * A value for the hover text and panels: whole numbers for integer and categorical columns, else
     * 2 decimals below 10 and none above; "no value" for NaN.
     */
    public String format(double v) {
        if (!Double.isFinite(v)) return "no value";
        int dec = def.kind().whole() || Math.abs(v) >= 10 ? 0 : 2;
        String s = String.format(java.util.Locale.ROOT, "%,." + dec + "f", v);
        return unit().isEmpty() ? s : s + " " + unit();
    }

    @Override public String toString() { return def.label(); }
}
