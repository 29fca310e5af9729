package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.climate.ClimateSpec;

/** Fuzz target: climate text through the HOURLY reader (seeds in HourlyCsvClimateFuzzTestInputs/). */
class HourlyCsvClimateFuzzTest {
    @FuzzTest(maxDuration = "10s")
    void climateTextReadsOrFailsWithAnInputError(byte[] data) {
        ClimateFuzz.read(ClimateSpec.Format.HOURLY, data);
    }
}
