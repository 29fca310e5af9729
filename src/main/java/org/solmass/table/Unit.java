package org.solmass.table;

/**
 * The unit of a result column, with the text written in files ({@link #symbol()}), the text shown on
 * screen ({@link #display()}) and the number of decimals files use by default. One list for the whole
 * code base: a column names its unit here and nowhere else.
 */
public enum Unit {
    /** Irradiation per square metre over a period. */
    KWH_M2("kWh/m2", "kWh/m\u00b2", 2),
    /** Irradiation on a whole patch or area. */
    KWH("kWh", "kWh", 2),
    /** Irradiance. */
    W_M2("W/m2", "W/m\u00b2", 1),
    /** A share in percent, 0 to 100. */
    PERCENT("%", "%", 2),
    /** Hours. */
    HOURS("h", "h", 2),
    /** Angle in degrees. */
    DEGREES("deg", "\u00b0", 2),
    /** Length in metres. */
    METRES("m", "m", 3),
    /** Area in square metres. */
    SQUARE_METRES("m2", "m\u00b2", 4),
    /** A ratio without unit, 0 to 1 (view factors). */
    RATIO("", "", 4),
    /** An ordinal level (0, 1, 2, ...). */
    LEVEL("level", "", 0),
    /** An identifier number (a zone number). */
    ID("id", "", 0);

    private final String symbol, display;
    private final int decimals;

    Unit(String symbol, String display, int decimals) {
        this.symbol = symbol;
        this.display = display;
        this.decimals = decimals;
    }

    /** As written in files and summary.json ("kWh/m2", "%", "" for ratios). */
    public String symbol() { return symbol; }

    /** As shown on screen and in images ("kWh/m\u00b2"); empty for ratios, levels and ids. */
    public String display() { return display; }

    /** Decimals a column of this unit is written with, unless the column says otherwise. */
    public int decimals() { return decimals; }

    /** The unit whose symbol is {@code s}; ratio for an unknown or empty symbol. */
    public static Unit ofSymbol(String s) {
        for (Unit u : values()) if (u.symbol.equals(s)) return u;
        return RATIO;
    }
}
