package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.climate.ClimateSpec;

/** Fuzz target: climate text through the MONTH_HOUR reader (seeds in MonthHourClimateFuzzTestInputs/). */
class MonthHourClimateFuzzTest {
    @FuzzTest(maxDuration = "10s")
    void climateTextReadsOrFailsWithAnInputError(byte[] data) {
        ClimateFuzz.read(ClimateSpec.Format.MONTH_HOUR, data);
    }
}
