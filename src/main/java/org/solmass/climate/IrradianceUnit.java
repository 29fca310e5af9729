package org.solmass.climate;

import org.solmass.InputException;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * Units an irradiance column may be given in, and their conversion to the interval-mean irradiance in
 * W/m2 that every reader works with. A power unit (W/m2, kW/m2) is already a mean over the interval;
 * an energy unit is the irradiation of the interval, divided by the interval's length.
 *
 * <p>Factors (SI definitions, common practice): 1 Wh = 3600 J = 3.6 kJ; 1 kWh = 3600 kJ = 3.6 MJ;
 * 1 J/cm2 = 10^4 J/m2 = 10 kJ/m2 = 10/3.6 Wh/m2.
 */
public enum IrradianceUnit {
    W_M2("W/m2", false, 1, 1),
    KW_M2("kW/m2", false, 1000, 1),
    WH_M2("Wh/m2", true, 1, 1),
    KWH_M2("kWh/m2", true, 1000, 1),
    KJ_M2("kJ/m2", true, 1, 3.6),
    MJ_M2("MJ/m2", true, 1000, 3.6),
    J_CM2("J/cm2", true, 10, 3.6);

    private final String label;
    private final boolean perInterval;
    private final double times, per;

    /**
     * W/m2 (power unit) or Wh/m2 (energy unit) per unit = times / per (two factors, so that a value
     * converted to the unit and back comes out as it was wherever the arithmetic allows).
     */
    IrradianceUnit(String label, boolean perInterval, double times, double per) {
        this.label = label;
        this.perInterval = perInterval;
        this.times = times;
        this.per = per;
    }

    /** The unit as written in docs, flags and the climate report, e.g. {@code kJ/m2}. */
    public String label() { return label; }

    /** Whether a value is the irradiation of its interval (an energy), not a mean irradiance. */
    public boolean perInterval() { return perInterval; }

    /** The interval-mean irradiance in W/m2 of a value in this unit over an interval of {@code durationH} hours. */
    public double toWm2(double value, double durationH) {
        double v = value * times / per;
        return perInterval ? v / durationH : v;
    }

    /** The unit a text names (case, spaces, {@code ²}, {@code ^2} and {@code m-2} forms accepted), or null. */
    public static IrradianceUnit find(String text) {
        String t = normal(text);
        for (IrradianceUnit u : values()) if (normal(u.label).equals(t)) return u;
        return null;
    }

    /** @param where the flag, key or file:line named in the error */
    public static IrradianceUnit parse(String text, String where) {
        IrradianceUnit u = find(text);
        if (u == null) throw new InputException(where, "unknown irradiance unit '" + text + "'; expected one of " + known());
        return u;
    }

    /** The labels, for messages and help. */
    public static String known() {
        return Arrays.stream(values()).map(IrradianceUnit::label).collect(Collectors.joining(", "));
    }

    private static String normal(String s) {
        String t = s == null ? "" : s.strip().toLowerCase(Locale.ROOT).replace(" ", "").replace("²", "2").replace("^2", "2")
                .replace("per", "/");
        if (t.endsWith("cm-2") && !t.contains("/")) t = t.substring(0, t.length() - 4) + "/cm2";
        if (t.endsWith("m-2") && !t.contains("/")) t = t.substring(0, t.length() - 3) + "/m2";   // W m-2
        return t;
    }
}
