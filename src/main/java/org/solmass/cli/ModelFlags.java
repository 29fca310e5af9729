package org.solmass.cli;

import org.solmass.geo.GeoOptions;
import org.solmass.model.LengthUnit;
import org.solmass.model.ModelOptions;
import org.solmass.model.UpAxis;
import org.solmass.study.StudyOverrides;
import picocli.CommandLine.Option;

/**
 * How to read the OBJ file, the same on every command that reads a model ({@code analyse},
 * {@code sky-view}): {@code --up}, {@code --unit}, {@code --north}, {@code --format}, {@code --epsg}.
 */
public final class ModelFlags {
    @Option(names = "--up", paramLabel = "z|y", description = "model up axis: z or y (default z)") String up;
    @Option(names = "--unit", paramLabel = "UNIT", description = "model unit: m, cm, mm, ft (default m)") String unit;
    @Option(names = "--north", paramLabel = "DEG", description = "angle from the model's +y axis to true north, clockwise (default 0)") Double north;
    @Option(names = "--format", paramLabel = "FORMAT", description = "model file format: auto, obj, geojson, citygml (default auto: from the file)") String format;
    @Option(names = "--epsg", paramLabel = "CODE", description = "EPSG code of a GeoJSON or CityGML model's coordinates (default: from the file)") Integer epsg;

    /** The flags as study keys (model.*). */
    StudyOverrides applyTo(StudyOverrides ov) {
        return ov.up(up).unit(unit).northDeg(north).modelFormat(format).epsg(epsg);
    }

    /** The model file's format and CRS from the flags alone (errors name the flag). */
    GeoOptions geoOptions() {
        GeoOptions.ModelFormat f = GeoOptions.ModelFormat.AUTO;
        if (format != null) {
            try {
                f = GeoOptions.ModelFormat.valueOf(format.trim().toUpperCase(java.util.Locale.ROOT));
            } catch (IllegalArgumentException e) {
                throw new org.solmass.InputException("--format", "expected one of auto, obj, geojson, citygml, got \"" + format + "\"");
            }
        }
        if (epsg != null && epsg <= 0) throw new org.solmass.InputException("--epsg", "expected a positive EPSG code, got " + epsg);
        return GeoOptions.defaults().with(f, epsg == null ? 0 : epsg);
    }

    /** The model reader's options from the flags alone (errors name the flag). */
    ModelOptions options() {
        return new ModelOptions(up == null ? UpAxis.Z : UpAxis.parse(up, "--up"),
                unit == null ? LengthUnit.M : LengthUnit.parse(unit, "--unit"), north == null ? 0 : north);
    }
}
