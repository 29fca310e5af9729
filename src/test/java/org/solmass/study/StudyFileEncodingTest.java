package org.solmass.study;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;

import java.io.ByteArrayOutputStream;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.*;

/**
 * How a study file's bytes are read: UTF-8 with or without a byte-order mark, UTF-16 with one, at most
 * {@link StudyReader#MAX_FILE_BYTES}; paths that cannot be paths name their key.
 */
class StudyFileEncodingTest {
    @TempDir Path dir;

    private static final String STUDY = "{\n  \"name\": \"Hofblock Süd (erfunden)\",\n  \"model\": {\"file\": \"m.obj\"},\n"
            + "  \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"Europe/Berlin\"},\n"
            + "  \"climate\": {\"source\": \"w.csv\"}\n}\n";

    private Path write(byte[] bom, String text, Charset cs) throws Exception {
        ByteArrayOutputStream b = new ByteArrayOutputStream();
        b.writeBytes(bom);
        b.writeBytes(text.getBytes(cs));
        return Files.write(dir.resolve("s.json"), b.toByteArray());
    }

    /**
     * A study saved with a UTF-8 byte-order mark (as Windows Notepad does) or as UTF-16 with one reads as
     * the plain UTF-8 file (marks: Unicode Standard 15.0, section 23.8; RFC 8259, section 8.1, lets a JSON
     * parser ignore a UTF-8 mark).
     */
    @Test
    void aStudyWithAByteOrderMarkReadsAsThePlainUtf8File() throws Exception {
        Study plain = StudyReader.read(write(new byte[0], STUDY, StandardCharsets.UTF_8));
        assertEquals("Hofblock Süd (erfunden)", plain.name());
        assertEquals(plain, StudyReader.read(write(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, STUDY, StandardCharsets.UTF_8)));
        assertEquals(plain, StudyReader.read(write(new byte[] {(byte) 0xFF, (byte) 0xFE}, STUDY, StandardCharsets.UTF_16LE)));
        assertEquals(plain, StudyReader.read(write(new byte[] {(byte) 0xFE, (byte) 0xFF}, STUDY, StandardCharsets.UTF_16BE)));
    }

    /** A JSON error after a byte-order mark keeps its line: the mark is not a line. */
    @Test
    void aJsonErrorInAUtf16StudyNamesItsLine() throws Exception {
        Path f = write(new byte[] {(byte) 0xFF, (byte) 0xFE}, STUDY.replace("\"w.csv\"}", "\"w.csv\",}"), StandardCharsets.UTF_16LE);
        InputException e = assertThrows(InputException.class, () -> StudyReader.read(f));
        assertTrue(e.getMessage().startsWith(f + ":5: not valid JSON"), e.getMessage());
    }

    @Test
    void aStudyOverTheSizeLimitIsRefusedWithoutReadingItAll() throws Exception {
        Path f = dir.resolve("big.json");
        try (var raf = new java.io.RandomAccessFile(f.toFile(), "rw")) {
            raf.setLength(StudyReader.MAX_FILE_BYTES + 1L);
        }
        InputException e = assertThrows(InputException.class, () -> StudyReader.read(f));
        assertEquals(f + ": larger than 16777216 bytes (16 MB), the most a study file may have", e.getMessage());
    }

    /** Every path key of a study, given a NUL character, names that key (model.file, climate.source, outputs.folder). */
    @Test
    void aNulCharacterInAnyPathKeyNamesTheKey() throws Exception {
        String[][] cases = {{"\"m.obj\"", "model.file"}, {"\"w.csv\"", "climate.source"}};
        for (String[] c : cases) {
            Path f = write(new byte[0], STUDY.replace(c[0], c[0].replace(".", "\\u0000.")), StandardCharsets.UTF_8);
            InputException e = assertThrows(InputException.class, () -> StudyReader.read(f));
            assertTrue(e.getMessage().startsWith(f + ": " + c[1] + ": the path \""), e.getMessage());
            assertTrue(e.getMessage().endsWith("contains a NUL character (\\u0000), which no file path can hold"), e.getMessage());
        }
        Path f = write(new byte[0], STUDY.replace("\n}", ",\n  \"outputs\": {\"folder\": \"o\\u0000ut\"}\n}"), StandardCharsets.UTF_8);
        InputException e = assertThrows(InputException.class, () -> StudyReader.read(f));
        assertEquals(f + ": outputs.folder: the path \"o\\u0000ut\" contains a NUL character (\\u0000), which no file path can hold",
                e.getMessage());
        InputException flag = assertThrows(InputException.class, () -> StudyReader.read(null,
                new StudyOverrides().climate("w\0.csv")));
        assertTrue(flag.getMessage().startsWith("--climate: the path \""), flag.getMessage());
    }
}
