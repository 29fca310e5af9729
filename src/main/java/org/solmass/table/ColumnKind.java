package org.solmass.table;

/** How the values of a result column are read, coloured and printed. */
public enum ColumnKind {
    /** An amount where more is more: sequential colour ramp. */
    SEQUENTIAL,
    /** A signed difference: diverging ramp, range symmetric about zero. */
    DIVERGING,
    /** Whole numbers with an order (hours levels): printed without decimals, integer legend ticks. */
    INTEGER,
    /** Labels without an order (zone numbers): printed without decimals; one colour per value. */
    CATEGORICAL;

    /** True for kinds whose values are whole numbers everywhere they are printed. */
    public boolean whole() { return this == INTEGER || this == CATEGORICAL; }
}
