package org.solmass.fuzz;

import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.Site;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.ZoneId;

/** One climate reader fed with fuzzed text, on a fixed invented site (51 N, 10 E, Europe/Berlin). */
final class ClimateFuzz {
    private static final SolarCalculator CALC =
            new SolarCalculator(new Site(51, 10, 200, ZoneId.of("Europe/Berlin")));

    private ClimateFuzz() {}

    static void read(ClimateSpec.Format format, byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        ClimateSpec spec = ClimateSpec.file(Path.of("fuzz.csv")).withFormat(format);
        FuzzCheck.check("climate reader " + format, data.length,
                () -> ClimateSource.parse(CALC, spec, "fuzz.csv", text));
    }
}
