package org.solmass;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.Charset;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.Map;

/**
 * Reading a text file the user gave (an OBJ model, a study file) without surprises: only a regular
 * file is opened (a folder, a device such as {@code /dev/zero} or a named pipe is refused before
 * reading); the encoding is UTF-8, or UTF-8, UTF-16LE or UTF-16BE announced by a byte-order mark
 * (the mark is dropped); text that does not decode, and NUL characters, are {@link InputException}s
 * naming the file, the line and the column; a line is at most {@link #MAX_LINE_BYTES} bytes and a whole
 * file read into memory at most the limit its caller gives, so a huge single-line file is refused
 * before it can exhaust the memory.
 *
 * <p>Byte-order marks: Unicode Standard 15.0, section 23.8 "Specials", U+FEFF; its byte forms
 * EF BB BF (UTF-8), FF FE (UTF-16LE) and FE FF (UTF-16BE) from the same section and RFC 2781 (2000),
 * section 3.2. Line ends are LF, CR LF or a lone CR, as {@link java.io.BufferedReader#readLine()} has them.
 */
public final class TextInput {
    /**
     * The longest line read, in bytes of the file (1 MiB). The longest legitimate line of our inputs is an
     * OBJ face: at about 24 bytes per {@code i/t/n} corner with 7-digit indices, 1 MiB holds a polygon of
     * over 40,000 corners, far beyond any massing face; anything longer is not a text file of ours (a
     * binary file, {@code /dev/zero} copied to a file) and would otherwise be read whole into memory.
     */
    public static final int MAX_LINE_BYTES = 1 << 20;

    /** The encodings read: UTF-8 (with or without a byte-order mark) and UTF-16 with a byte-order mark. */
    public enum Encoding {
        UTF_8("UTF-8", StandardCharsets.UTF_8, 1),
        UTF_16LE("UTF-16LE", StandardCharsets.UTF_16LE, 2),
        UTF_16BE("UTF-16BE", StandardCharsets.UTF_16BE, 2);

        final String label;
        final Charset charset;
        /** Bytes per code unit. */
        final int unit;

        Encoding(String label, Charset charset, int unit) {
            this.label = label;
            this.charset = charset;
            this.unit = unit;
        }

        public String label() { return label; }

        /** The encoding a file's first bytes announce, and the length of its byte-order mark (0 for none). */
        static Encoding detect(byte[] b, int len) {
            if (len >= 2 && (b[0] & 0xFF) == 0xFF && (b[1] & 0xFF) == 0xFE) return UTF_16LE;
            if (len >= 2 && (b[0] & 0xFF) == 0xFE && (b[1] & 0xFF) == 0xFF) return UTF_16BE;
            return UTF_8;
        }

        static int bomLength(byte[] b, int len) {
            if (detect(b, len) != UTF_8) return 2;
            return len >= 3 && (b[0] & 0xFF) == 0xEF && (b[1] & 0xFF) == 0xBB && (b[2] & 0xFF) == 0xBF ? 3 : 0;
        }
    }

    /** A source of lines: {@link java.io.BufferedReader#readLine()} or {@link Lines#readLine()}. */
    @FunctionalInterface
    public interface LineSource {
        /** The next line without its line end, or null at the end of the input. */
        String readLine() throws IOException;
    }

    private TextInput() {}

    /**
     * Refuses a path that is not an existing regular file.
     *
     * @param notFound the message when nothing is there (e.g. "file not found, expected an OBJ model")
     * @param expected what the file should be, for the other messages (e.g. "an OBJ model file")
     * @throws InputException naming the file
     */
    public static void requireRegularFile(Path file, String notFound, String expected) {
        if (Files.isRegularFile(file)) return;
        String where = file.toString();
        if (Files.isDirectory(file)) throw new InputException(where, "is a folder, expected " + expected);
        if (!Files.exists(file)) throw new InputException(where, notFound);
        throw new InputException(where, "is " + kindOf(file) + ", not a regular file; expected " + expected);
    }

    /** "a character device", "a named pipe (FIFO)", ... from the file's Unix mode (st_mode, POSIX.1-2017 sys/stat.h). */
    private static String kindOf(Path file) {
        try {
            Map<String, Object> a = Files.readAttributes(file, "unix:mode");
            int type = ((Integer) a.get("mode")) & 0170000;
            switch (type) {
                case 0020000: return "a character device";
                case 0060000: return "a block device";
                case 0010000: return "a named pipe (FIFO)";
                case 0140000: return "a socket";
                default: break;
            }
        } catch (IOException | RuntimeException e) {
            // no Unix attributes here: fall through to the general words
        }
        return "a device, pipe or socket";
    }

    /**
     * Reads a whole text file of at most {@code maxBytes} bytes (after {@link #requireRegularFile}) and
     * decodes it as {@link #decode} does.
     *
     * @param what names the file's kind in messages ("the study file")
     * @throws InputException when the file is larger, does not decode or holds a NUL character
     * @throws IOException when reading fails for another reason
     */
    public static String readAll(Path file, long maxBytes, String what) throws IOException {
        byte[] bytes;
        try (InputStream in = Files.newInputStream(file)) {
            bytes = in.readNBytes((int) Math.min(Integer.MAX_VALUE - 8, maxBytes + 1));
        } catch (AccessDeniedException e) {
            throw new InputException(file.toString(), "permission denied, cannot read " + what, e);
        }
        if (bytes.length > maxBytes) {
            throw new InputException(file.toString(), "larger than " + maxBytes + " bytes"
                    + (maxBytes >= 1 << 20 ? " (" + (maxBytes >> 20) + " MB)" : "") + ", the most " + what + " may have");
        }
        return decode(bytes, file.toString());
    }

    /**
     * Decodes a whole file's bytes: the encoding from the byte-order mark (UTF-8 without one), the mark
     * dropped, every byte checked.
     *
     * @param name the file, for messages
     * @throws InputException at {@code name:line} when a byte sequence does not decode or a NUL character occurs
     */
    public static String decode(byte[] bytes, String name) {
        Encoding enc = Encoding.detect(bytes, bytes.length);
        int bom = Encoding.bomLength(bytes, bytes.length);
        return decode(bytes, bom, bytes.length - bom, enc, name, 1);
    }

    /**
     * Decodes {@code len} bytes strictly.
     *
     * @param firstLine the line number of the first byte (lines inside count on from it)
     */
    static String decode(byte[] b, int off, int len, Encoding enc, String name, int firstLine) {
        String s = new String(b, off, len, enc.charset);   // fast path; replaces what does not decode by U+FFFD
        if (s.indexOf('\uFFFD') < 0 && s.indexOf('\0') < 0) return s;
        CharsetDecoder d = enc.charset.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(b, off, len);
        CharBuffer out = CharBuffer.allocate(len + 1);
        CoderResult r = d.decode(in, out, true);
        if (!r.isError()) r = d.flush(out);
        if (r.isError()) {
            out.flip();
            int[] lc = lineAndColumn(out, out.limit(), firstLine);
            StringBuilder bytes = new StringBuilder(r.length() == 1 ? "byte" : "bytes");
            for (int i = 0; i < r.length() && in.position() + i < off + len; i++) {
                bytes.append(String.format(" 0x%02X", b[in.position() + i] & 0xFF));
            }
            throw new InputException(InputException.at(name, lc[0]), "not " + enc.label + " text (" + bytes
                    + " at column " + lc[1] + "): save the file as UTF-8 (UTF-16 with a byte-order mark is also read)");
        }
        int nul = s.indexOf('\0');
        if (nul >= 0) {
            int[] lc = lineAndColumn(s, nul, firstLine);
            throw new InputException(InputException.at(name, lc[0]), "NUL character at column " + lc[1]
                    + ": not a text file, or UTF-16 without a byte-order mark; save the file as UTF-8");
        }
        return s;
    }

    /** Line (counting from {@code firstLine}) and 1-based column of the character at {@code index}. */
    private static int[] lineAndColumn(CharSequence text, int index, int firstLine) {
        int line = firstLine, start = 0;
        for (int i = 0; i < index; i++) {
            char c = text.charAt(i);
            if (c == '\n' || (c == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n'))) {
                line++;
                start = i + 1;
            }
        }
        return new int[] {line, index - start + 1};
    }

    /**
     * Parses a path the user typed (a flag or a study key's value).
     *
     * @param where the flag or key, for the message
     * @throws InputException when the text cannot be a path (on Linux: it holds a NUL character)
     */
    public static Path path(String text, String where) {
        try {
            return Path.of(text);
        } catch (InvalidPathException e) {
            throw new InputException(where, invalidPath(text, e));
        }
    }

    /** Why {@code text} is not a path, with control characters shown as JSON escapes ({@code \u0000}). */
    public static String invalidPath(String text, InvalidPathException e) {
        StringBuilder shown = new StringBuilder("\"");
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c < ' ') shown.append(String.format("\\u%04x", (int) c));
            else shown.append(c);
        }
        shown.append('"');
        if (text.indexOf('\0') >= 0) return "the path " + shown + " contains a NUL character (\\u0000), which no file path can hold";
        return "the path " + shown + " is not a valid file path (" + e.getReason() + ")";
    }

    /**
     * A text file read line by line, each line at most {@link #MAX_LINE_BYTES} bytes and decoded
     * strictly (see the class comment). Not thread-safe.
     */
    public static final class Lines implements Closeable, LineSource {
        private final InputStream in;
        private final String name;
        private final String expected;
        private final byte[] buf = new byte[1 << 16];
        private int pos, lim;
        private boolean eof;
        private byte[] line = new byte[256];
        private int lineNo;
        private final Encoding enc;

        /**
         * Opens a file after {@link #requireRegularFile}.
         *
         * @param notFound the message when the file does not exist
         * @param expected what the file should be ("an OBJ model file")
         */
        public static Lines open(Path file, String notFound, String expected) throws IOException {
            requireRegularFile(file, notFound, expected);
            InputStream in;
            try {
                in = Files.newInputStream(file);
            } catch (AccessDeniedException e) {
                throw new InputException(file.toString(), "permission denied, cannot read it; expected " + expected, e);
            }
            return new Lines(in, file.toString(), expected);
        }

        /**
         * Reads a stream.
         *
         * @param name the source, for messages
         * @param expected what it should be, for messages
         */
        public Lines(InputStream in, String name, String expected) throws IOException {
            this.in = in;
            this.name = name;
            this.expected = expected;
            while (lim < 3 && fill()) { /* the first bytes, for the byte-order mark */ }
            enc = Encoding.detect(buf, lim);
            pos = Encoding.bomLength(buf, lim);
        }

        /** The encoding found (UTF-8 unless a UTF-16 byte-order mark starts the file). */
        public Encoding encoding() { return enc; }

        /** Reads more bytes after the unread ones; false at the end of the input. */
        private boolean fill() throws IOException {
            if (eof) return false;
            if (pos > 0) {
                System.arraycopy(buf, pos, buf, 0, lim - pos);
                lim -= pos;
                pos = 0;
            }
            int n = in.read(buf, lim, buf.length - lim);
            if (n < 0) {
                eof = true;
                return false;
            }
            lim += n;
            return true;
        }

        /** The code unit at {@code pos} (a byte for UTF-8, a UTF-16 unit), or -1 when fewer bytes are buffered. */
        private int unitAt(int p) {
            if (enc.unit == 1) return p < lim ? buf[p] & 0xFF : -1;
            if (p + 1 >= lim) return -1;
            int lo = enc == Encoding.UTF_16LE ? buf[p] & 0xFF : buf[p + 1] & 0xFF;
            int hi = enc == Encoding.UTF_16LE ? buf[p + 1] & 0xFF : buf[p] & 0xFF;
            return hi << 8 | lo;
        }

        @Override
        public String readLine() throws IOException {
            int len = 0;
            boolean any = false;
            int u = enc.unit;
            while (true) {
                if (pos + u > lim && !fill() && pos + u > lim) {
                    if (pos < lim) {                      // half a UTF-16 unit at the end: let the decoder say so
                        len = append(len, pos, lim - pos);
                        pos = lim;
                        any = true;
                    }
                    if (!any) return null;
                    break;
                }
                any = true;
                int start = pos, c = -1;
                while (pos + u <= lim) {                  // scan the buffer for a line end
                    c = unitAt(pos);
                    if (c == '\n' || c == '\r') break;
                    pos += u;
                }
                len = append(len, start, pos - start);
                if (pos + u > lim) continue;              // buffer used up inside the line
                pos += u;
                if (c == '\r') {                          // CR LF is one line end
                    if (pos + u > lim) fill();
                    if (unitAt(pos) == '\n') pos += u;
                }
                break;
            }
            lineNo++;
            return decode(line, 0, len, enc, name, lineNo);
        }

        private int append(int len, int from, int n) {
            if (len + n > MAX_LINE_BYTES) {
                throw new InputException(InputException.at(name, lineNo + 1), "line longer than " + MAX_LINE_BYTES
                        + " bytes (1 MB), the most one line may have; expected " + expected);
            }
            if (len + n > line.length) line = java.util.Arrays.copyOf(line, Math.max(len + n, Math.min(MAX_LINE_BYTES, 2 * line.length)));
            System.arraycopy(buf, from, line, len, n);
            return len + n;
        }

        /** The number of the line last read (1 for the first). */
        public int lineNumber() { return lineNo; }

        @Override
        public void close() throws IOException {
            in.close();
        }
    }
}
