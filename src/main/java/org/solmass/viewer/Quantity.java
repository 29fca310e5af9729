package org.solmass.viewer;

import org.solmass.output.ResultTable;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A per-patch column the viewer can colour the model by.
 *
 * @param column CSV column name
 * @param label what the selector and legend call it
 * @param unit unit from {@link ResultTable#unit(String)} ("" for ratios)
 * @param diverging true for signed differences (diverging ramp, range symmetric about zero)
 * @param pvOrRoof true when the quantity feeds PV or roof-use decisions (shown with the caution)
 */
public record Quantity(String column, String label, String unit, boolean diverging, boolean pvOrRoof) {

    /** Shown wherever PV or roof quantities are on screen. */
    public static final String CAUTION = "Indicative only: roof work, PV electrical and structural design "
            + "and fire setbacks follow local codes and licensed practice.";

    private static final String[] MONTHS = {"January", "February", "March", "April", "May", "June", "July",
            "August", "September", "October", "November", "December"};

    /** Preferred order of known columns; other numeric columns follow in table order. */
    private static final String[] ORDER = {"annual_kwh_m2", "beam_kwh_m2", "diffuse_kwh_m2", "reflected_kwh_m2",
            "unshaded_kwh_m2", "shading_loss_pct", "sky_view_factor", "ground_view_factor", "annual_kwh"};

    /** The quantities present in a table, best first. */
    public static List<Quantity> available(ResultTable table) {
        List<String> names = table.names();
        List<Quantity> out = new ArrayList<>();
        for (String n : ORDER) if (names.contains(n)) out.add(of(n, table.unit(n)));
        for (int m = 1; m <= 12; m++) {
            String n = String.format(Locale.ROOT, "m%02d_kwh_m2", m);
            if (names.contains(n)) out.add(of(n, table.unit(n)));
        }
        for (String n : names) {
            if (out.stream().noneMatch(q -> q.column.equals(n))) out.add(of(n, table.unit(n)));
        }
        return out;
    }

    /** Quantity of a column with a readable label. */
    public static Quantity of(String column, String unit) {
        boolean pv = column.startsWith("pv_") || column.contains("roof");
        boolean div = column.startsWith("delta_") || column.endsWith("_change") || column.contains("_diff");
        return new Quantity(column, labelOf(column), unit == null ? "" : unit, div, pv);
    }

    static String labelOf(String c) {
        if (c.startsWith("delta_")) return "Change in " + labelOf(c.substring(6)).toLowerCase(Locale.ROOT) + " (this variant minus the other)";
        switch (c) {
            case "annual_kwh_m2": return "Annual irradiation";
            case "beam_kwh_m2": return "Annual beam (direct) irradiation";
            case "diffuse_kwh_m2": return "Annual diffuse sky irradiation";
            case "reflected_kwh_m2": return "Annual ground-reflected irradiation";
            case "unshaded_kwh_m2": return "Annual irradiation without obstructions";
            case "shading_loss_pct": return "Loss to shading by neighbours";
            case "sky_view_factor": return "Sky view factor";
            case "ground_view_factor": return "Ground view factor";
            case "annual_kwh": return "Annual irradiation on the patch (total)";
            default: break;
        }
        if (c.matches("m\\d\\d_kwh_m2")) {
            int m = Integer.parseInt(c.substring(1, 3));
            if (m >= 1 && m <= 12) return MONTHS[m - 1] + " irradiation";
        }
        if (c.startsWith("sun_hours_")) return "Sun hours (" + c.substring(10).replace('_', ' ') + ")";
        if (c.startsWith("pv_")) return "PV: " + c.substring(3).replace('_', ' ');
        return c.replace('_', ' ');
    }

    /** Legend title: the label with its unit. */
    public String title() { return unit.isEmpty() ? label : label + " (" + pretty(unit) + ")"; }

    /** A unit as shown on screen: square metres with a superscript two ("kWh/m2" -> "kWh/m\u00b2"). */
    public static String pretty(String unit) { return unit.replaceAll("m2\\b", "m\u00b2"); }

    @Override public String toString() { return label; }
}
