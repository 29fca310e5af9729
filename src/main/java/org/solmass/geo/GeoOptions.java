package org.solmass.geo;

import org.solmass.InputException;

import java.util.Locale;

/**
 * How to read a model file beyond {@code model.ModelOptions}: its format, its coordinate reference
 * system and, for GeoJSON footprints, which properties give the height, storeys, base elevation and
 * name. Study keys {@code model.format}, {@code model.epsg} and {@code model.footprints.*}
 * (docs/geo.md).
 *
 * @param format the file's format; {@link ModelFormat#AUTO} detects it from the file
 * @param epsg EPSG code of the file's CRS, or 0 to take it from the file
 * @param heightProperty GeoJSON property with the height above the base, metres
 * @param storeysProperty GeoJSON property with the number of storeys (used when there is no height)
 * @param storeyHeightM height of a storey, metres (with {@code storeysProperty})
 * @param baseProperty GeoJSON property with the base elevation, metres (0 when absent)
 * @param nameProperty GeoJSON property that names the block (then "id"; else "feature N")
 */
public record GeoOptions(ModelFormat format, int epsg, String heightProperty, String storeysProperty,
                         double storeyHeightM, String baseProperty, String nameProperty) {
    public static final String DEFAULT_HEIGHT = "height", DEFAULT_STOREYS = "storeys",
            DEFAULT_BASE = "base_elevation", DEFAULT_NAME = "name";
    public static final double DEFAULT_STOREY_HEIGHT_M = 3.0;

    public GeoOptions {
        if (format == null) format = ModelFormat.AUTO;
        if (epsg < 0) throw new InputException("model.epsg", "EPSG code must be a positive whole number, got " + epsg);
        if (heightProperty == null) heightProperty = DEFAULT_HEIGHT;
        if (storeysProperty == null) storeysProperty = DEFAULT_STOREYS;
        if (baseProperty == null) baseProperty = DEFAULT_BASE;
        if (nameProperty == null) nameProperty = DEFAULT_NAME;
        if (!(storeyHeightM > 0 && storeyHeightM <= 100)) {
            throw new InputException("model.footprints.storey_height_m", "expected a storey height in (0, 100] m, got " + storeyHeightM);
        }
    }

    /** Format detected from the file, CRS from the file, default property names. */
    public static GeoOptions defaults() {
        return new GeoOptions(ModelFormat.AUTO, 0, null, null, DEFAULT_STOREY_HEIGHT_M, null, null);
    }

    /** The same options with another format and EPSG code (0 = from the file). */
    public GeoOptions with(ModelFormat f, int code) {
        return new GeoOptions(f, code, heightProperty, storeysProperty, storeyHeightM, baseProperty, nameProperty);
    }

    /** The model file formats Solmass reads. */
    public enum ModelFormat {
        AUTO, OBJ, GEOJSON, CITYGML;

        /** Lower-case name as written in study files. */
        public String label() { return name().toLowerCase(Locale.ROOT); }
    }
}
