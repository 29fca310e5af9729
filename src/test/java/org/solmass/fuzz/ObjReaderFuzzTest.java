package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;

/**
 * Fuzz target: OBJ bytes through the model reader as a file's bytes are read (byte-order mark,
 * decoding, line ends, line length), seeds in ObjReaderFuzzTestInputs/.
 */
class ObjReaderFuzzTest {
    @FuzzTest(maxDuration = "10s")
    void objTextReadsOrFailsWithAnInputError(byte[] data) {
        FuzzCheck.check("ObjReader.load", data.length, () -> {
            try {
                ObjReader.load(new ByteArrayInputStream(data), "fuzz.obj", ModelOptions.defaults());
            } catch (IOException e) {
                throw new UncheckedIOException(e);   // a byte array does not fail
            }
        });
    }
}
