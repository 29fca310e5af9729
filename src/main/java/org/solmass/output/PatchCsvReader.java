package org.solmass.output;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.solmass.InputException;
import org.solmass.metrics.ColumnCatalogue;
import org.solmass.table.Column;
import org.solmass.surface.SurfaceKind;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads a patches.csv written by {@link PatchCsvWriter} (or edited in a spreadsheet) back into values
 * keyed by patch id: for the viewer and for comparing two runs. Leading '#' comment lines (added by hand)
 * are skipped;
 * empty numeric cells read as NaN. Errors name file:line and the column.
 */
public final class PatchCsvReader {
    private PatchCsvReader() {}

    /** The content of a patches.csv. */
    public static final class Table {
        private final List<String> ids;
        private final Map<String, Integer> rowOfId;
        private final List<String> blocks;
        private final int[] surfaces;
        private final SurfaceKind[] kinds;
        private final Map<String, double[]> numbers;
        private final List<String> resultColumns;
        private final List<String> comments;

        Table(List<String> ids, Map<String, Integer> rowOfId, List<String> blocks, int[] surfaces, SurfaceKind[] kinds,
              Map<String, double[]> numbers, List<String> resultColumns, List<String> comments) {
            this.ids = ids;
            this.rowOfId = rowOfId;
            this.blocks = blocks;
            this.surfaces = surfaces;
            this.kinds = kinds;
            this.numbers = numbers;
            this.resultColumns = resultColumns;
            this.comments = comments;
        }

        public int size() { return ids.size(); }

        /** Patch ids in file order. */
        public List<String> ids() { return Collections.unmodifiableList(ids); }

        /** Row index of a patch id, or -1. */
        public int row(String patchId) { return rowOfId.getOrDefault(patchId, -1); }

        public String block(int row) { return blocks.get(row); }

        public int surface(int row) { return surfaces[row]; }

        public SurfaceKind kind(int row) { return kinds[row]; }

        /** The result columns (after the patch columns), in file order. */
        public List<String> resultColumns() { return Collections.unmodifiableList(resultColumns); }

        /** The definition of a result column ({@link ColumnCatalogue}; a generic one for a name no stage declares). */
        public Column def(String column) { return ColumnCatalogue.of(column); }

        /** Comment lines of the file head, without the leading "# ". */
        public List<String> comments() { return Collections.unmodifiableList(comments); }

        public boolean has(String column) { return numbers.containsKey(column); }

        /** A numeric column (x, y, z, nx, ..., azimuth_deg or any result column) in file order. */
        public double[] column(String column) {
            double[] c = numbers.get(column);
            if (c == null) throw new IllegalArgumentException("no numeric column " + column + " (have " + numbers.keySet() + ")");
            return c;
        }

        /** The value of a column for a patch id; NaN where the patch or the value is missing. */
        public double value(String patchId, String column) {
            int r = row(patchId);
            return r < 0 ? Double.NaN : column(column)[r];
        }

        /** Values of a column keyed by patch id, in file order. */
        public Map<String, Double> byId(String column) {
            double[] c = column(column);
            Map<String, Double> out = new LinkedHashMap<>();
            for (int i = 0; i < ids.size(); i++) out.put(ids.get(i), c[i]);
            return out;
        }
    }

    public static Table read(Path file) {
        List<String> comments = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser parser = CSVFormat.RFC4180.builder().setCommentMarker('#').setHeader()
                     .setSkipHeaderRecord(true).setIgnoreSurroundingSpaces(false).get().parse(r)) {
            if (parser.getHeaderComment() != null) {
                for (String c : parser.getHeaderComment().split("\n", -1)) comments.add(c.startsWith(" ") ? c.substring(1) : c);
            }
            List<String> header = parser.getHeaderNames();
            for (int i = 0; i < PatchCsvWriter.PATCH_COLUMNS.size(); i++) {
                String want = PatchCsvWriter.PATCH_COLUMNS.get(i);
                if (i >= header.size() || !header.get(i).equals(want)) {
                    throw new InputException(file.toString(), "column " + (i + 1) + " must be \"" + want
                            + "\" (a patches.csv starts with " + String.join(",", PatchCsvWriter.PATCH_COLUMNS) + "), got "
                            + (i < header.size() ? "\"" + header.get(i) + "\"" : "nothing"));
                }
            }
            List<String> numeric = new ArrayList<>(header.subList(4, header.size()));
            List<String> ids = new ArrayList<>();
            List<String> blocks = new ArrayList<>();
            List<Integer> surfaces = new ArrayList<>();
            List<SurfaceKind> kinds = new ArrayList<>();
            List<double[]> rows = new ArrayList<>();
            Map<String, Integer> rowOfId = new HashMap<>();
            for (CSVRecord rec : parser) {
                String where = InputException.at(file, (int) parser.getCurrentLineNumber());
                if (rec.size() != header.size()) {
                    throw new InputException(where, "expected " + header.size() + " cells, got " + rec.size());
                }
                String id = rec.get(0);
                if (rowOfId.putIfAbsent(id, ids.size()) != null) throw new InputException(where, "patch_id " + id + " appears twice");
                ids.add(id);
                blocks.add(rec.get(1));
                try {
                    surfaces.add(Integer.parseInt(rec.get(2).trim()));
                } catch (NumberFormatException e) {
                    throw new InputException(where, "surface: expected a whole number, got \"" + rec.get(2) + "\"");
                }
                try {
                    kinds.add(SurfaceKind.parse(rec.get(3)));
                } catch (IllegalArgumentException e) {
                    throw new InputException(where, "kind: expected roof, facade, ground or underside, got \"" + rec.get(3) + "\"");
                }
                double[] row = new double[numeric.size()];
                for (int c = 0; c < row.length; c++) {
                    String s = rec.get(c + 4).trim();
                    if (s.isEmpty()) {
                        row[c] = Double.NaN;
                        continue;
                    }
                    try {
                        row[c] = Double.parseDouble(s);
                    } catch (NumberFormatException e) {
                        throw new InputException(where, numeric.get(c) + ": expected a number, got \"" + s + "\"");
                    }
                }
                rows.add(row);
            }
            Map<String, double[]> numbers = new LinkedHashMap<>();
            for (int c = 0; c < numeric.size(); c++) {
                double[] col = new double[rows.size()];
                for (int k = 0; k < col.length; k++) col[k] = rows.get(k)[c];
                numbers.put(numeric.get(c), col);
            }
            int[] surf = surfaces.stream().mapToInt(Integer::intValue).toArray();
            List<String> results = new ArrayList<>(header.subList(PatchCsvWriter.PATCH_COLUMNS.size(), header.size()));
            return new Table(ids, rowOfId, blocks, surf, kinds.toArray(new SurfaceKind[0]), numbers, results, comments);
        } catch (NoSuchFileException e) {
            throw new InputException(file.toString(), "file not found");
        } catch (IOException | IllegalArgumentException | IllegalStateException e) {
            if (e instanceof InputException ie) throw ie;
            throw new InputException(file.toString(), "cannot read patches.csv: " + e.getMessage(), e);
        }
    }
}
