package org.solmass.model;

import org.solmass.InputException;

import java.util.Locale;

/** Length unit of OBJ coordinates, with its factor to metres. */
public enum LengthUnit {
    M(1.0),
    CM(0.01),
    MM(0.001),
    /** International foot, exactly 0.3048 m (common practice; international yard and pound agreement, 1959). */
    FT(0.3048);

    private final double toMetres;

    LengthUnit(double toMetres) { this.toMetres = toMetres; }

    /** Metres per unit. */
    public double toMetres() { return toMetres; }

    /**
     * Parses m, cm, mm or ft (any case).
     *
     * @param where flag or key name used in the error message
     */
    public static LengthUnit parse(String s, String where) {
        String t = s == null ? "" : s.trim().toUpperCase(Locale.ROOT);
        for (LengthUnit u : values()) if (u.name().equals(t)) return u;
        throw new InputException(where, "unknown length unit '" + s + "', expected m, cm, mm or ft");
    }
}
