package org.solmass;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.BufferedReader;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.*;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

class TextInputTest {
    @TempDir Path dir;

    private static List<String> lines(byte[] bytes) throws IOException {
        List<String> out = new ArrayList<>();
        try (TextInput.Lines l = new TextInput.Lines(new ByteArrayInputStream(bytes), "t.txt", "a test file")) {
            for (String s; (s = l.readLine()) != null; ) out.add(s);
        }
        return out;
    }

    /** The JDK's BufferedReader (a general-purpose library) as the reference for splitting lines. */
    private static List<String> reference(String text) throws IOException {
        List<String> out = new ArrayList<>();
        BufferedReader r = new BufferedReader(new StringReader(text));
        for (String s; (s = r.readLine()) != null; ) out.add(s);
        return out;
    }

    private static byte[] withBom(byte[] bom, String text, Charset cs) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes(bom);
        out.writeBytes(text.getBytes(cs));
        return out.toByteArray();
    }

    /**
     * Property: for random texts (ASCII, Latin, CJK and a character outside the BMP; LF, CR LF and lone CR
     * line ends; lines long enough to cross the 64 KB read buffer) the lines are BufferedReader's, in
     * UTF-8 without and with a byte-order mark and in UTF-16LE/BE with one (marks: Unicode Standard 15.0,
     * section 23.8, and RFC 2781, section 3.2).
     */
    @Test
    void linesOfEveryAcceptedEncodingAreThoseOfTheJdkLineReader() throws IOException {
        String[] pieces = {"v 1 2 3", "é", "日本", "\uD834\uDD1E", " ", "\t", "f 1//2 3//4", "\n", "\r\n", "\r", "\n\n"};
        Random rnd = new Random(12);
        for (int round = 0; round < 200; round++) {
            StringBuilder b = new StringBuilder();
            int n = rnd.nextInt(round < 190 ? 40 : 4000);
            for (int i = 0; i < n; i++) {
                if (round >= 190 && rnd.nextInt(50) == 0) b.append("x".repeat(70_000));
                b.append(pieces[rnd.nextInt(pieces.length)]);
            }
            String text = b.toString();
            List<String> expected = reference(text);
            assertEquals(expected, lines(text.getBytes(StandardCharsets.UTF_8)), "UTF-8, round " + round);
            assertEquals(expected, lines(withBom(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, text, StandardCharsets.UTF_8)), "UTF-8 BOM");
            assertEquals(expected, lines(withBom(new byte[] {(byte) 0xFF, (byte) 0xFE}, text, StandardCharsets.UTF_16LE)), "UTF-16LE");
            assertEquals(expected, lines(withBom(new byte[] {(byte) 0xFE, (byte) 0xFF}, text, StandardCharsets.UTF_16BE)), "UTF-16BE");
        }
    }

    /** ISO/IEC 8859-1 encodes "é" as the single byte 0xE9, which cannot stand alone in UTF-8 (RFC 3629, section 3). */
    @Test
    void aLatin1ByteIsRefusedWithItsLineColumnAndValue() {
        byte[] latin1 = "v 0 0 0\nv 1 0 0 # café\n".getBytes(StandardCharsets.ISO_8859_1);
        InputException e = assertThrows(InputException.class, () -> lines(latin1));
        assertEquals("t.txt:2: not UTF-8 text (byte 0xE9 at column 14): save the file as UTF-8 (UTF-16 with a "
                + "byte-order mark is also read)", e.getMessage());
        InputException whole = assertThrows(InputException.class, () -> TextInput.decode(latin1, "t.txt"));
        assertEquals(e.getMessage(), whole.getMessage());
    }

    @Test
    void aFileEndingInHalfAUtf16UnitIsRefused() {
        byte[] odd = withBom(new byte[] {(byte) 0xFF, (byte) 0xFE}, "ab\ncd", StandardCharsets.UTF_16LE);
        byte[] cut = java.util.Arrays.copyOf(odd, odd.length - 1);
        InputException e = assertThrows(InputException.class, () -> lines(cut));
        assertTrue(e.getMessage().startsWith("t.txt:2: not UTF-16LE text (byte 0x64 at column 2)"), e.getMessage());
    }

    @Test
    void utf16WithoutAByteOrderMarkIsRefusedAtItsFirstNul() {
        InputException e = assertThrows(InputException.class, () -> lines("v 0 0 0\n".getBytes(StandardCharsets.UTF_16LE)));
        assertEquals("t.txt:1: NUL character at column 2: not a text file, or UTF-16 without a byte-order mark; "
                + "save the file as UTF-8", e.getMessage());
    }

    /** The bound is exact: a line of MAX_LINE_BYTES bytes reads, one byte more does not. */
    @Test
    void aLineOfTheLimitReadsAndOneByteMoreIsRefused() throws IOException {
        byte[] atLimit = ("a\n" + "x".repeat(TextInput.MAX_LINE_BYTES) + "\n").getBytes(StandardCharsets.UTF_8);
        assertEquals(TextInput.MAX_LINE_BYTES, lines(atLimit).get(1).length());
        byte[] over = ("a\n" + "x".repeat(TextInput.MAX_LINE_BYTES + 1)).getBytes(StandardCharsets.UTF_8);
        InputException e = assertThrows(InputException.class, () -> lines(over));
        assertEquals("t.txt:2: line longer than 1048576 bytes (1 MB), the most one line may have; expected a test file",
                e.getMessage());
    }

    @Test
    void aWholeFileOverItsLimitIsRefusedBeforeDecoding() throws IOException {
        Path f = dir.resolve("big.json");
        try (var raf = new java.io.RandomAccessFile(f.toFile(), "rw")) {
            raf.setLength(1001);                                    // zeros: would also fail decoding
        }
        InputException e = assertThrows(InputException.class, () -> TextInput.readAll(f, 1000, "a test file"));
        assertEquals(f + ": larger than 1000 bytes, the most a test file may have", e.getMessage());
        Files.writeString(f, "\uFEFF{}");
        assertEquals("{}", TextInput.readAll(f, 1000, "a test file"));
    }

    /** A named pipe would block the reader until a writer opens it: it is refused without opening it. */
    @Test
    void aNamedPipeIsRefusedWithoutBlocking() throws Exception {
        Path fifo = dir.resolve("pipe.obj");
        Process p;
        try {
            p = new ProcessBuilder("mkfifo", fifo.toString()).start();
        } catch (IOException noMkfifo) {
            assumeTrue(false, "mkfifo not available");
            return;
        }
        assumeTrue(p.waitFor(10, TimeUnit.SECONDS) && p.exitValue() == 0, "mkfifo failed");
        InputException e = assertTimeoutPreemptively(java.time.Duration.ofSeconds(10),
                () -> assertThrows(InputException.class, () -> TextInput.Lines.open(fifo, "not found", "an OBJ model")));
        assertEquals(fifo + ": is a named pipe (FIFO), not a regular file; expected an OBJ model", e.getMessage());
        InputException folder = assertThrows(InputException.class, () -> TextInput.requireRegularFile(dir, "not found", "an OBJ model"));
        assertEquals(dir + ": is a folder, expected an OBJ model", folder.getMessage());
        InputException none = assertThrows(InputException.class,
                () -> TextInput.requireRegularFile(dir.resolve("none.obj"), "file not found", "an OBJ model"));
        assertEquals(dir.resolve("none.obj") + ": file not found", none.getMessage());
    }

    @Test
    void aPathWithANulCharacterNamesTheFlagAndShowsTheCharacterEscaped() {
        InputException e = assertThrows(InputException.class, () -> TextInput.path("a\0b.obj", "--model"));
        assertEquals("--model: the path \"a\\u0000b.obj\" contains a NUL character (\\u0000), which no file path can hold",
                e.getMessage());
        assertEquals(Path.of("a/b.obj"), TextInput.path("a/b.obj", "--model"));
    }
}
