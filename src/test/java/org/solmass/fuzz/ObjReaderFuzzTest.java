package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.nio.charset.StandardCharsets;

/** Fuzz target: OBJ text through the model reader (seeds in ObjReaderFuzzTestInputs/). */
class ObjReaderFuzzTest {
    @FuzzTest(maxDuration = "10s")
    void objTextReadsOrFailsWithAnInputError(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        FuzzCheck.check("ObjReader.parse", data.length,
                () -> ObjReader.parse(text, "fuzz.obj", ModelOptions.defaults()));
    }
}
