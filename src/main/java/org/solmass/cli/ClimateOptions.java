package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.TextInput;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.IrradianceUnit;
import org.solmass.climate.TimeBaseChoice;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import picocli.CommandLine.Option;

import java.nio.file.Files;

/**
 * The weather flags, the same on every command that reads weather ({@code analyse}, {@code plane}).
 * Unset flags stay null: {@code analyse} then keeps the study file's value, {@code plane} the default
 * named in the help.
 */
public final class ClimateOptions {
    @Option(names = "--climate", paramLabel = "clear-sky|FILE", description = "weather: clear-sky (default) or a climate file (docs/climate-formats.md)") String climate;
    @Option(names = "--climate-format", paramLabel = "FORMAT", description = "auto (default), month-hour, monthly (also: monthly-means) or hourly") String format;
    @Option(names = "--time-base", paramLabel = "BASE", description = "auto (default: from the climate source), average-days or hourly-year") String timeBase;
    @Option(names = "--year", paramLabel = "YEAR", description = "calendar year of the clear-sky hourly year (default " + Study.Climate.DEFAULT_YEAR + ")") Integer year;
    @Option(names = "--step-minutes", paramLabel = "MIN", description = "step of generated days (clear sky, monthly means), divides 60 (default 60)") Integer stepMinutes;
    @Option(names = "--interval-label", paramLabel = "start|end", description = "hourly files: a timestamp labels its interval's start (default) or end") String intervalLabel;
    @Option(names = "--columns", paramLabel = "ROLE=COL,...", description = "hourly files: role=header or role=column number, e.g. time=1,ghi=GlobHor,dhi=4") String columns;
    @Option(names = "--date-order", paramLabel = "dmy|mdy|ymd", description = "hourly files: order of day, month and year in dates like 01/02/2025 (default: from the data; an error when the data cannot tell)") String dateOrder;
    @Option(names = "--clock", paramLabel = "standard|dst", description = "hourly files: local timestamps are standard time (default) or clock time with daylight saving of --zone") String clock;
    @Option(names = "--irradiance-unit", paramLabel = "UNIT", description = "unit of irradiance columns whose header names none: W/m2 (default), kW/m2, Wh/m2, kWh/m2, kJ/m2, MJ/m2 or J/cm2 (energies per step)") String irradianceUnit;
    @Option(names = "--fill-gaps", paramLabel = "N", description = "hourly files: fill gaps of up to N steps (0 to 24) by linear interpolation (default 0: never)") Integer fillGaps;

    /** The flags as study keys (climate.*, time_base, step_minutes). */
    StudyOverrides applyTo(StudyOverrides ov) {
        return ov.climate(climate).climateFormat(format).timeBase(timeBase).climateYear(year).stepMinutes(stepMinutes)
                .intervalLabel(intervalLabel).columns(columns).fillGaps(fillGaps)
                .dateOrder(dateOrder).clock(clock).irradianceUnit(irradianceUnit);
    }

    /** The time base asked for (errors name {@code --time-base}). */
    TimeBaseChoice timeBaseChoice() {
        return timeBase == null ? TimeBaseChoice.AUTO : TimeBaseChoice.parse(timeBase, "--time-base");
    }

    /** Date order, clock and irradiance unit from the flags alone (errors name the flag). */
    ClimateSpec.Reading reading() {
        return new ClimateSpec.Reading(dateOrder == null ? null : ClimateSpec.DateOrder.parse(dateOrder, "--date-order"),
                clock == null ? ClimateSpec.Clock.STANDARD : ClimateSpec.Clock.parse(clock, "--clock"),
                irradianceUnit == null ? null : IrradianceUnit.parse(irradianceUnit, "--irradiance-unit"));
    }

    /** What the climate stage reads, from the flags alone (errors name the flag). */
    ClimateSpec spec() {
        if (climate != null) TextInput.path(climate, "--climate");   // a NUL character: an error naming the flag
        ClimateSpec spec = ClimateSpec.parse(climate);
        if (spec.kind() == ClimateSpec.Kind.FILE && !Files.isRegularFile(spec.file())) {
            throw new InputException("--climate", "no such file '" + climate + "' (expected clear-sky or a climate CSV file)");
        }
        int y = year == null ? Study.Climate.DEFAULT_YEAR : year;
        if (y < 1900 || y > 2100) throw new InputException("--year", "expected a whole number from 1900 to 2100, got " + y);
        int step = stepMinutes == null ? 60 : stepMinutes;
        if (step < 1 || 60 % step != 0) {
            throw new InputException("--step-minutes", "expected a whole number of minutes that divides 60, got " + step);
        }
        int fill = fillGaps == null ? 0 : fillGaps;
        if (fill < 0 || fill > Study.Climate.MAX_FILL_GAPS_STEPS) {
            throw new InputException("--fill-gaps", "expected a whole number of steps from 0 to "
                    + Study.Climate.MAX_FILL_GAPS_STEPS + ", got " + fill);
        }
        if (spec.kind() == ClimateSpec.Kind.CLEAR_SKY) spec = timeBaseChoice().clearSky(y);
        return spec.withFormat(format == null ? ClimateSpec.Format.AUTO : ClimateSpec.Format.parse(format, "--climate-format"))
                .withStepMinutes(step)
                .withIntervalLabel(intervalLabel == null ? ClimateSpec.IntervalLabel.START
                        : ClimateSpec.IntervalLabel.parse(intervalLabel, "--interval-label"))
                .withColumns(ClimateSpec.parseColumns(columns, "--columns"))
                .withFillGaps(fill)
                .withReading(reading());
    }
}
