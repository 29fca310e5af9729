package org.solmass.model;

/**
 * The eight compass sectors of an azimuth (degrees from north, clockwise; the project's convention):
 * 45 deg sectors centred on the eight directions, so north is [337.5, 22.5). One rule for the patch
 * panel, the map caption and summary.json's facade statistics.
 */
public final class Compass {
    private static final String[] SHORT = {"N", "NE", "E", "SE", "S", "SW", "W", "NW"};
    private static final String[] LONG = {"north", "north-east", "east", "south-east", "south", "south-west", "west",
            "north-west"};

    private Compass() {}

    /** Index 0 (north) to 7 (north-west) of the sector of {@code azimuthDeg}; any finite angle. */
    public static int sector(double azimuthDeg) {
        return (int) Math.floorMod(Math.round(azimuthDeg / 45.0), 8L);
    }

    /** "N", "NE", ... "NW". */
    public static String shortName(double azimuthDeg) {
        return SHORT[sector(azimuthDeg)];
    }

    /** "north", "north-east", ... "north-west". */
    public static String longName(double azimuthDeg) {
        return LONG[sector(azimuthDeg)];
    }

    /** The short names in sector order. */
    public static String[] shortNames() {
        return SHORT.clone();
    }
}
