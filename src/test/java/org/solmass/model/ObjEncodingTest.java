package org.solmass.model;

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
 * How the OBJ reader reads a file's bytes: UTF-8 with or without a byte-order mark, UTF-16 with one,
 * lines bounded, other files refused before reading (see org.solmass.TextInput).
 */
class ObjEncodingTest {
    @TempDir Path dir;

    private Path write(String name, byte[] bom, String text, Charset cs) throws Exception {
        ByteArrayOutputStream b = new ByteArrayOutputStream();
        b.writeBytes(bom);
        b.writeBytes(text.getBytes(cs));
        return Files.write(dir.resolve(name), b.toByteArray());
    }

    private static void assertSameModel(MassingModel a, MassingModel b) {
        assertArrayEquals(a.vertices(), b.vertices());
        assertArrayEquals(a.triangles(), b.triangles());
        assertArrayEquals(a.triangleLine(), b.triangleLine());
        assertEquals(a.materialNames(), b.materialNames());
        assertEquals(a.blockNames(), b.blockNames());
    }

    /**
     * The byte-order marks FF FE (UTF-16LE), FE FF (UTF-16BE) and EF BB BF (UTF-8): Unicode Standard 15.0,
     * section 23.8; the text is encoded by the JDK's own encoders.
     */
    @Test
    void aModelSavedAsUtf16OrWithAUtf8ByteOrderMarkReadsAsTheUtf8File() throws Exception {
        String text = Files.readString(ObjReaderTest.fixture("usemtl.obj")).replace("\n", "\r\n") + "# Dachfläche\r\n";
        ModelOptions o = ModelOptions.defaults();
        MassingModel plain = ObjReader.read(write("m.obj", new byte[0], text, StandardCharsets.UTF_8), o);
        assertSameModel(plain, ObjReader.read(write("m.obj", new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, text, StandardCharsets.UTF_8), o));
        assertSameModel(plain, ObjReader.read(write("m.obj", new byte[] {(byte) 0xFF, (byte) 0xFE}, text, StandardCharsets.UTF_16LE), o));
        assertSameModel(plain, ObjReader.read(write("m.obj", new byte[] {(byte) 0xFE, (byte) 0xFF}, text, StandardCharsets.UTF_16BE), o));
    }

    /** 0xE9 is "é" in ISO/IEC 8859-1; alone it is not UTF-8 (RFC 3629, section 3). */
    @Test
    void aLatin1ByteNamesTheLineAndColumn() throws Exception {
        Path f = write("m.obj", new byte[0], "v 0 0 0\nv 1 0 0\nv 0 1 0\nusemtl café\nf 1 2 3\n", StandardCharsets.ISO_8859_1);
        InputException e = assertThrows(InputException.class, () -> ObjReader.read(f, ModelOptions.defaults()));
        assertEquals(f + ":4: not UTF-8 text (byte 0xE9 at column 11): save the file as UTF-8 (UTF-16 with a "
                + "byte-order mark is also read)", e.getMessage());
    }

    /** Continuation lines join into one statement; the joined statement has the same bound as a line. */
    @Test
    void aStatementContinuedBeyondTheLineLimitIsRefusedAtItsFirstLine() throws Exception {
        String line = "1 ".repeat(100_000) + "\\\n";                      // 200 KB a line
        Path f = write("m.obj", new byte[0], "v 0 0 0\nf " + line.repeat(6) + "1\n", StandardCharsets.UTF_8);
        InputException e = assertThrows(InputException.class, () -> ObjReader.read(f, ModelOptions.defaults()));
        assertTrue(e.getMessage().startsWith(f + ":2: statement continued (trailing \\) to over 1048576 characters"), e.getMessage());
    }

    @Test
    void aDeviceIsRefusedBeforeReading() {
        Path zero = Path.of("/dev/zero");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.exists(zero));
        InputException e = assertThrows(InputException.class, () -> ObjReader.read(zero, ModelOptions.defaults()));
        assertEquals("/dev/zero: is a character device, not a regular file; expected an OBJ model", e.getMessage());
    }
}
