package org.solmass.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.solmass.study.StudyReader;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

/** Fuzz target: study-file text through the study reader (seeds in StudyReaderFuzzTestInputs/). */
class StudyReaderFuzzTest {
    private static Path file;

    @FuzzTest(maxDuration = "10s")
    void studyTextReadsOrFailsWithAnInputError(byte[] data) throws IOException {
        Path f = studyFile();
        Files.write(f, data);
        FuzzCheck.check("StudyReader.read", data.length, () -> StudyReader.read(f));
    }

    private static synchronized Path studyFile() {
        if (file == null) {
            try {
                Path dir = Files.createTempDirectory("solmass-fuzz-study");
                dir.toFile().deleteOnExit();
                file = dir.resolve("study.json");
                file.toFile().deleteOnExit();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return file;
    }
}
