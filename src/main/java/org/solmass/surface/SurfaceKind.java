package org.solmass.surface;

import java.util.Locale;

/** What a planar surface is, for analysis and reporting. Thresholds are in {@code SurfaceClassifier}. */
public enum SurfaceKind {
    /** Faces up, above the ground level. */
    ROOF,
    /** Near-vertical. */
    FACADE,
    /** Faces up, at ground level: a courtyard floor, a street or a plaza modelled as a face. */
    GROUND,
    /** Faces down (soffits, overhang undersides); not analysed by default. */
    UNDERSIDE;

    /** Lower-case name as written in CSV and JSON. */
    public String label() { return name().toLowerCase(Locale.ROOT); }

    public static SurfaceKind parse(String s) { return valueOf(s.trim().toUpperCase(Locale.ROOT)); }
}
