package org.solmass.climate;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.solmass.InputException;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The header and data rows of a climate CSV in any common spreadsheet dialect, parsed with Apache
 * Commons CSV: separator {@code ,} {@code ;} or tab (the one found most often outside quotes in the
 * header line), decimal point or decimal comma (decided from the numbers of the data rows, never
 * both), quoted cells and headers, UTF-8 with or without a byte-order mark (UTF-16 with one), CRLF,
 * LF or CR line ends. Blank lines and lines starting with {@code #} are skipped; a quoted cell may not
 * span lines. Every row must have as many cells as the header. See docs/climate-formats.md.
 */
final class ClimateTable {
    /** A row: its line in the file (1-based) and its cells, trimmed. */
    record Line(int number, String[] cells) {}

    /**
     * A header cell split into its name and the unit in brackets after it: {@code GHI (W/m2)} is
     * name {@code ghi}, unit {@code W/m2}; no brackets: unit null.
     */
    record HeaderName(String text, String name, String unit) {
        /** Splits at the last opening bracket of a cell that ends in a closing one (linear in the cell's length). */
        static HeaderName of(String text) {
            String t = text.strip();
            char last = t.isEmpty() ? ' ' : t.charAt(t.length() - 1);
            if (last == ')' || last == ']') {
                int open = t.lastIndexOf(last == ')' ? '(' : '[');
                String name = open > 0 ? t.substring(0, open).strip() : "";
                String unit = open > 0 ? t.substring(open + 1, t.length() - 1).strip() : "";
                if (!name.isEmpty() && unit.chars().noneMatch(c -> c == '(' || c == ')' || c == '[' || c == ']')) {
                    return new HeaderName(text, name.toLowerCase(Locale.ROOT), unit);
                }
            }
            return new HeaderName(text, t.toLowerCase(Locale.ROOT), null);
        }
    }

    /**
     * The dialect found.
     *
     * @param separator    the cell separator
     * @param decimalComma whether numbers use a decimal comma
     * @param byteOrderMark the encoding's byte-order mark the file started with, or "" for none
     * @param lineEnd      the first line end: "CRLF", "LF", "CR" or "" (one line)
     * @param quoted       whether any cell was quoted
     */
    record Dialect(char separator, boolean decimalComma, String byteOrderMark, String lineEnd, boolean quoted) {
        /** The separator as a word for reports: "comma", "semicolon", "tab". */
        String separatorName() { return separator == ';' ? "semicolon" : separator == '\t' ? "tab" : "comma"; }
    }

    /** Longest line read, characters: a row of a climate file is far shorter. */
    static final int MAX_LINE_CHARS = 64 * 1024;
    /** Largest climate file read, bytes: a year of 1-minute steps with a dozen columns is about 50 MB. */
    static final long MAX_FILE_BYTES = 256L * 1024 * 1024;

    /** Put before decoded UTF-16 text so that the report can name the encoding (two byte-order marks never start a UTF-8 text that reads). */
    private static final String UTF16_MARK = "\uFEFF\uFEFF";
    private static final Pattern COMMA_NUMBER = Pattern.compile("[-+]?\\d*,\\d+");
    private static final Pattern POINT_NUMBER = Pattern.compile("[-+]?\\d*\\.\\d+([eE][-+]?\\d+)?");

    final String name;
    final Line header;
    final HeaderName[] names;
    final List<Line> rows;
    final Dialect dialect;

    private ClimateTable(String name, Line header, List<Line> rows, Dialect dialect) {
        this.name = name;
        this.header = header;
        this.rows = rows;
        this.dialect = dialect;
        this.names = new HeaderName[header.cells().length];
        for (int i = 0; i < names.length; i++) names[i] = HeaderName.of(header.cells()[i]);
    }

    static ClimateTable read(Path file) {
        byte[] bytes;
        try (InputStream in = Files.newInputStream(file)) {
            bytes = bounded(file.toString(), in);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new InputException(file.toString(), "climate file not found, expected a CSV file of docs/climate-formats.md", e);
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read climate file: " + e.getMessage(), e);
        }
        return of(file.toString(), decode(file.toString(), bytes));
    }

    /**
     * The bytes of a stream, refused when the file is larger than {@link #MAX_FILE_BYTES} or a line
     * longer than {@link #MAX_LINE_CHARS} (a binary or endless input such as /dev/zero), before
     * memory runs out.
     */
    private static byte[] bounded(String name, InputStream in) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream(1 << 16);
        byte[] buf = new byte[1 << 16];
        long total = 0, lineLen = 0;
        int line = 1;
        for (int n; (n = in.read(buf)) > 0; ) {
            for (int i = 0; i < n; i++) {
                if (buf[i] == '\n' || buf[i] == '\r') {
                    if (buf[i] == '\n') line++;
                    lineLen = 0;
                } else if (++lineLen > MAX_LINE_CHARS * 4L) {   // UTF-8: up to 4 bytes a character
                    throw new InputException(InputException.at(name, line), "line longer than " + MAX_LINE_CHARS
                            + " characters; a climate file has one row of a table per line (is this a CSV file?)");
                }
            }
            total += n;
            if (total > MAX_FILE_BYTES) {
                throw new InputException(name, "larger than " + MAX_FILE_BYTES / (1024 * 1024)
                        + " MB; a climate file of a year of 1-minute steps is about 50 MB (is this a CSV file?)");
            }
            out.write(buf, 0, n);
        }
        return out.toByteArray();
    }

    /** UTF-8 (a byte-order mark is dropped), or UTF-16 when the file starts with its byte-order mark. */
    private static String decode(String name, byte[] b) {
        if (b.length >= 2 && ((b[0] == (byte) 0xFE && b[1] == (byte) 0xFF) || (b[0] == (byte) 0xFF && b[1] == (byte) 0xFE))) {
            return UTF16_MARK + new String(b, StandardCharsets.UTF_16).replaceFirst("^\uFEFF", "");
        }
        CharsetDecoder d = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(b);
        CharBuffer out = CharBuffer.allocate(b.length + 1);
        CoderResult r = d.decode(in, out, true);
        if (!r.isError()) r = d.flush(out);
        if (r.isError()) {
            int line = 1;
            for (int i = 0; i < in.position(); i++) if (b[i] == '\n') line++;
            throw new InputException(InputException.at(name, line), "not UTF-8 text (byte " + (in.position() + 1)
                    + " of the file); save the climate file as UTF-8 (or UTF-16 with a byte-order mark)");
        }
        return out.flip().toString();
    }

    /** The rows of a climate text already read; {@code name} names it in messages. */
    static ClimateTable of(String name, String text) {
        String bom = "";
        if (text.startsWith(UTF16_MARK)) { text = text.substring(UTF16_MARK.length()); bom = "UTF-16"; }
        else if (text.startsWith("\uFEFF")) { text = text.substring(1); bom = "UTF-8"; }
        List<int[]> spans = new ArrayList<>();   // {start, end, line number} of each kept line
        String lineEnd = "";
        int lineNo = 1;
        for (int i = 0, n = text.length(); i <= n; lineNo++) {
            int j = i;
            while (j < n && text.charAt(j) != '\n' && text.charAt(j) != '\r') j++;
            if (j - i > MAX_LINE_CHARS) {
                throw new InputException(InputException.at(name, lineNo), "line longer than " + MAX_LINE_CHARS
                        + " characters; a climate file has one row of a table per line (is this a CSV file?)");
            }
            String t = text.substring(i, j).strip();
            if (!t.isEmpty() && !t.startsWith("#")) spans.add(new int[] {i, j, lineNo});
            if (j >= n) break;
            boolean crlf = text.charAt(j) == '\r' && j + 1 < n && text.charAt(j + 1) == '\n';
            if (lineEnd.isEmpty()) lineEnd = crlf ? "CRLF" : text.charAt(j) == '\r' ? "CR" : "LF";
            i = j + (crlf ? 2 : 1);
        }
        if (spans.isEmpty()) throw new InputException(name, "empty climate file (no header line)");
        int[] h = spans.get(0);
        char sep = separator(text.substring(h[0], h[1]));
        CSVFormat format = CSVFormat.DEFAULT.builder().setDelimiter(sep).setQuote('"').setTrim(true)
                .setIgnoreSurroundingSpaces(true).get();
        List<String[]> all = cells(name, format, text, spans);
        Line header = new Line(h[2], all.get(0));
        List<Line> rows = new ArrayList<>(spans.size() - 1);
        for (int k = 1; k < spans.size(); k++) {
            int[] s = spans.get(k);
            String[] cells = all.get(k);
            if (cells.length != header.cells().length) {
                String where = InputException.at(name, s[2]);
                String counts = "the row has " + cells.length + " cells but the header (line " + header.number() + ") has " + header.cells().length;
                if (cells.length > header.cells().length && sep == ',') {
                    throw new InputException(where, counts + "; a decimal comma in a comma-separated file splits numbers:"
                            + " separate the cells with ';' or quote the numbers");
                }
                throw new InputException(where, counts + (cells.length < header.cells().length
                        ? "; leave a missing value as an empty cell between two separators" : ""));
            }
            rows.add(new Line(s[2], cells));
        }
        boolean comma = decimalComma(name, rows);
        boolean quoted = false;
        for (int[] sp : spans) quoted |= text.substring(sp[0], sp[1]).indexOf('"') >= 0;
        return new ClimateTable(name, header, rows, new Dialect(sep, comma, bom, lineEnd, quoted));
    }

    /** The candidate (',', ';', tab) found most often outside quotes in the header line; ',' on a tie. */
    private static char separator(String headerLine) {
        int comma = 0, semi = 0, tab = 0;
        boolean inQuotes = false;
        for (char c : headerLine.toCharArray()) {
            if (c == '"') inQuotes = !inQuotes;
            else if (!inQuotes) { if (c == ',') comma++; else if (c == ';') semi++; else if (c == '\t') tab++; }
        }
        if (semi > comma && semi >= tab) return ';';
        if (tab > comma && tab > semi) return '\t';
        return ',';
    }

    /**
     * The cells of each kept line, in one pass of Commons CSV over the kept lines joined by LF. A
     * record whose cell holds a line end began with a quote that did not close on its line.
     */
    private static List<String[]> cells(String name, CSVFormat format, String text, List<int[]> spans) {
        StringBuilder kept = new StringBuilder(text.length() + 1);
        for (int[] sp : spans) kept.append(text, sp[0], sp[1]).append('\n');
        List<String[]> out = new ArrayList<>(spans.size());
        try (CSVParser p = CSVParser.parse(kept.toString(), format)) {
            for (CSVRecord r : p) {
                String[] v = r.values();
                for (String c : v) if (c.indexOf('\n') >= 0) throw quote(name, spans.get(out.size())[2]);
                out.add(v);
            }
        } catch (IOException | UncheckedIOException | IllegalStateException e) {
            throw quote(name, spans.get(Math.min(out.size(), spans.size() - 1))[2]);
        }
        if (out.size() != spans.size()) throw quote(name, spans.get(Math.min(out.size(), spans.size() - 1))[2]);
        return out;
    }

    private static InputException quote(String name, int line) {
        return new InputException(InputException.at(name, line), "a quote (\") in this line is not closed, or text follows"
                + " a closing quote; a quoted cell must close on the same line, before the next separator");
    }

    /**
     * Whether the numbers use a decimal comma: some cell is a number with a comma and none is one
     * with a point. Both kinds in one file are an error naming one of each.
     */
    private static boolean decimalComma(String name, List<Line> rows) {
        String commaAt = null, pointAt = null;
        for (Line l : rows) {
            for (String c : l.cells()) {
                if (commaAt == null && COMMA_NUMBER.matcher(c).matches()) commaAt = InputException.at(name, l.number()) + " '" + c + "'";
                else if (pointAt == null && POINT_NUMBER.matcher(c).matches()) pointAt = InputException.at(name, l.number()) + " '" + c + "'";
            }
            if (commaAt != null && pointAt != null) {
                throw new InputException(name, "numbers with a decimal comma (" + commaAt + ") and with a decimal point ("
                        + pointAt + ") in one file; use one decimal mark throughout");
            }
        }
        return commaAt != null;
    }

    String at(Line l) { return InputException.at(name, l.number()); }

    String headerAt() { return InputException.at(name, header.number()); }

    /**
     * The column whose header is {@code headerName}: the whole cell or its name without the unit,
     * case-insensitive; -1 when none. Two such columns are an error naming both.
     */
    int column(String headerName) {
        int found = -1;
        for (int i = 0; i < names.length; i++) {
            if (names[i].text().equalsIgnoreCase(headerName) || names[i].name().equalsIgnoreCase(headerName)) {
                if (found >= 0) {
                    throw new InputException(headerAt(), "the header has two columns named '" + headerName + "' (columns "
                            + (found + 1) + " and " + (i + 1) + "); rename one, or say which to use with --columns");
                }
                found = i;
            }
        }
        return found;
    }

    /** The unit written in the header of a column, or null. */
    String unit(int col) { return names[col].unit(); }

    /** Number in a cell; NaN for an empty / NaN / NA cell when allowMissing, else an error. */
    double number(Line l, int col, String what, boolean allowMissing) {
        String s = l.cells()[col];
        if (s.isEmpty() || s.equalsIgnoreCase("nan") || s.equalsIgnoreCase("na")) {
            if (allowMissing) return Double.NaN;
            throw new InputException(at(l), "missing " + what + " (column " + (col + 1) + ")");
        }
        String t = s;
        if (dialect.decimalComma) {
            if (s.indexOf('.') >= 0) throw new InputException(at(l), "expected a number with a decimal comma for " + what + ", got '" + s + "'");
            t = s.replace(',', '.');
        }
        try {
            return Double.parseDouble(t);
        } catch (NumberFormatException e) {
            throw new InputException(at(l), "expected a number for " + what + ", got '" + s + "'");
        }
    }

    /**
     * The unit of an irradiance column: the one its header names (a name ending in {@code _wm2} is
     * W/m2), else the option, else W/m2. An unknown unit, or a header and an option that disagree: error.
     */
    IrradianceUnit irradianceUnit(int col, IrradianceUnit option) {
        String u = names[col].unit();
        IrradianceUnit fromHeader = u != null ? IrradianceUnit.find(u) : names[col].name().endsWith("_wm2") ? IrradianceUnit.W_M2 : null;
        if (u != null && fromHeader == null) {
            throw new InputException(headerAt(), "unknown unit '" + u + "' in the header '" + header.cells()[col]
                    + "'; expected one of " + IrradianceUnit.known());
        }
        if (fromHeader != null && option != null && option != fromHeader) {
            throw new InputException(headerAt(), "the header '" + header.cells()[col] + "' says " + fromHeader.label()
                    + " but the irradiance unit given is " + option.label() + "; drop the option or correct the header");
        }
        return fromHeader != null ? fromHeader : option != null ? option : IrradianceUnit.W_M2;
    }

    /** The dialect for the climate report. */
    ClimateReport.Reading reading(String format, java.util.Map<String, String> columns, java.util.Map<String, String> units,
                                  String timestamps, List<String> notes) {
        return new ClimateReport.Reading(format, dialect.separatorName(), dialect.decimalComma() ? "comma" : "point",
                dialect.byteOrderMark().isEmpty() ? "UTF-8" : dialect.byteOrderMark() + " (byte-order mark)",
                dialect.lineEnd().isEmpty() ? "LF" : dialect.lineEnd(), dialect.quoted(), columns, units, timestamps, notes);
    }
}
