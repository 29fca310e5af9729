package org.solmass.model;

import org.solmass.InputException;

import java.util.Locale;

/**
 * Which OBJ axis points up. Solmass works with x east, y north, z up; the default is {@link #Z}
 * because massing exports from urban CAD tools are usually Z-up.
 */
public enum UpAxis {
    /** OBJ (x, y, z) is used as is. The default. */
    Z,
    /**
     * OBJ y is up: (x, y, z) maps to (x, -z, y). This is a +90 degree rotation about x, so the frame
     * stays right-handed and the OBJ's -z ("into the screen" in Y-up tools) becomes +y (north).
     */
    Y;

    /**
     * Maps an OBJ point into the Z-up frame, writing into {@code out[off..off+2]}.
     */
    public void apply(double x, double y, double z, double[] out, int off) {
        if (this == Z) {
            out[off] = x; out[off + 1] = y; out[off + 2] = z;
        } else {
            out[off] = x; out[off + 1] = -z; out[off + 2] = y;
        }
    }

    /**
     * Parses "y" or "z" (any case).
     *
     * @param where flag or key name used in the error message
     */
    public static UpAxis parse(String s, String where) {
        String t = s == null ? "" : s.trim().toUpperCase(Locale.ROOT);
        for (UpAxis a : values()) if (a.name().equals(t)) return a;
        throw new InputException(where, "unknown up axis '" + s + "', expected y or z");
    }
}
