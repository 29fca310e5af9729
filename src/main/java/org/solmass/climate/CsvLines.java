package org.solmass.climate;

import org.solmass.InputException;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** The data lines of one of our plain CSV files: comma separated, no quoting, '#' starts a comment line. */
final class CsvLines {
    record Line(int number, String[] cells) {}

    final String name;
    final Line header;
    final List<Line> rows;

    private CsvLines(String name, Line header, List<Line> rows) {
        this.name = name;
        this.header = header;
        this.rows = rows;
    }

    static CsvLines read(Path file) {
        List<String> text;
        try {
            text = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new InputException(file.toString(), "climate file not found, expected a CSV file of docs/climate-formats.md", e);
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read climate file: " + e.getMessage(), e);
        }
        return of(file.toString(), text);
    }

    /** The lines of a climate text already read; {@code name} names it in messages. */
    static CsvLines of(String name, List<String> text) {
        Line header = null;
        List<Line> rows = new ArrayList<>();
        for (int i = 0; i < text.size(); i++) {
            String t = text.get(i).strip();
            if (i == 0 && t.startsWith("\uFEFF")) t = t.substring(1);
            if (t.isEmpty() || t.startsWith("#")) continue;
            String[] cells = t.split(",", -1);
            for (int c = 0; c < cells.length; c++) cells[c] = cells[c].strip();
            if (header == null) header = new Line(i + 1, cells); else rows.add(new Line(i + 1, cells));
        }
        if (header == null) throw new InputException(name, "empty climate file (no header line)");
        return new CsvLines(name, header, rows);
    }

    String at(Line l) { return InputException.at(name, l.number()); }

    int column(String headerName) {
        for (int i = 0; i < header.cells().length; i++) if (header.cells()[i].equalsIgnoreCase(headerName)) return i;
        return -1;
    }

    /** Number in a cell; NaN for an empty / NaN / NA cell when allowMissing, else an error. */
    double number(Line l, int col, String what, boolean allowMissing) {
        if (col >= l.cells().length) {
            if (allowMissing) return Double.NaN;
            throw new InputException(at(l), "missing " + what + " (column " + (col + 1) + ")");
        }
        String s = l.cells()[col];
        if (s.isEmpty() || s.equalsIgnoreCase("nan") || s.equalsIgnoreCase("na")) {
            if (allowMissing) return Double.NaN;
            throw new InputException(at(l), "missing " + what + " (column " + (col + 1) + ")");
        }
        try {
            return Double.parseDouble(s);
        } catch (NumberFormatException e) {
            throw new InputException(at(l), "expected a number for " + what + ", got '" + s + "'");
        }
    }
}
