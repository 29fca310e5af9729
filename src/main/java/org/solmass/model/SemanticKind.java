package org.solmass.model;

/**
 * What a file says a face is, where the file says it (CityGML's thematic boundary surfaces, the
 * walls, roof and floor of an extruded GeoJSON footprint); {@link #NONE} for an OBJ face. The
 * surface stage takes a surface's kind from this instead of classifying it by its normal when it is
 * not {@code NONE} ({@code surface.SurfaceClassifier.classify}).
 */
public enum SemanticKind {
    /** Nothing declared (OBJ faces, CityGML LoD1 solids, a ClosureSurface): classified by the normal. */
    NONE,
    /** A roof (CityGML RoofSurface; the flat roof of an extruded footprint). */
    ROOF,
    /** An outside wall (CityGML WallSurface; the walls of an extruded footprint). */
    WALL,
    /** The building's floor on the ground, facing down into it (CityGML GroundSurface; the floor of an extruded footprint). */
    GROUND,
    /** An outside ceiling facing down, e.g. the soffit of a passage (CityGML OuterCeilingSurface). */
    OUTER_CEILING,
    /** An outside floor facing up above the ground, e.g. a terrace (CityGML OuterFloorSurface). */
    OUTER_FLOOR;

    private static final SemanticKind[] VALUES = values();

    /** The kind of code {@link #ordinal()}. */
    public static SemanticKind of(byte code) { return VALUES[code]; }

    /** This kind as the byte stored per triangle ({@link MassingModel#triangleKind()}). */
    public byte code() { return (byte) ordinal(); }
}
