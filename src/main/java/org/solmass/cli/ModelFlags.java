package org.solmass.cli;

import org.solmass.model.LengthUnit;
import org.solmass.model.ModelOptions;
import org.solmass.model.UpAxis;
import org.solmass.study.StudyOverrides;
import picocli.CommandLine.Option;

/**
 * How to read the OBJ file, the same on every command that reads a model ({@code analyse},
 * {@code sky-view}): {@code --up}, {@code --unit}, {@code --north}.
 */
public final class ModelFlags {
    @Option(names = "--up", paramLabel = "z|y", description = "model up axis: z or y (default z)") String up;
    @Option(names = "--unit", paramLabel = "UNIT", description = "model unit: m, cm, mm, ft (default m)") String unit;
    @Option(names = "--north", paramLabel = "DEG", description = "angle from the model's +y axis to true north, clockwise (default 0)") Double north;

    /** The flags as study keys (model.*). */
    StudyOverrides applyTo(StudyOverrides ov) {
        return ov.up(up).unit(unit).northDeg(north);
    }

    /** The model reader's options from the flags alone (errors name the flag). */
    ModelOptions options() {
        return new ModelOptions(up == null ? UpAxis.Z : UpAxis.parse(up, "--up"),
                unit == null ? LengthUnit.M : LengthUnit.parse(unit, "--unit"), north == null ? 0 : north);
    }
}
