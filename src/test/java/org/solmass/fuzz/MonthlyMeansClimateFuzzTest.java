package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.climate.ClimateSpec;

/** Fuzz target: climate text through the MONTHLY_MEANS reader (seeds in MonthlyMeansClimateFuzzTestInputs/). */
class MonthlyMeansClimateFuzzTest {
    @FuzzTest(maxDuration = "10s")
    void climateTextReadsOrFailsWithAnInputError(byte[] data) {
        ClimateFuzz.read(ClimateSpec.Format.MONTHLY_MEANS, data);
    }
}
