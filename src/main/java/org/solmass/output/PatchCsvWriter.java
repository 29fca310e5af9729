package org.solmass.output;

import org.solmass.surface.Patch;
import org.solmass.table.Column;
import org.solmass.table.Numbers;
import org.solmass.table.ResultTable;

import java.util.ArrayList;
import java.util.List;
import java.nio.file.Path;

/**
 * Writes patches.csv: one row per patch, first the patch's own columns ({@link #PATCH_COLUMNS}), then
 * every column of the {@link ResultTable} in its order. UTF-8 without byte-order mark, LF line ends,
 * comma separated, text quoted only where it holds a comma, quote or line break (RFC 4180 quoting),
 * each column's own decimals ({@link Column#decimals()}, {@link Numbers}); the header row first and no
 * comment lines, so a spreadsheet or a data-frame library opens the file as it is. Layout:
 * docs/outputs.md.
 */
public final class PatchCsvWriter {
    /** The patch columns, in order. */
    public static final List<String> PATCH_COLUMNS = List.of("patch_id", "block", "surface", "kind",
            "x", "y", "z", "nx", "ny", "nz", "area_m2", "tilt_deg", "azimuth_deg");

    /** Decimals of x, y, z (metres: millimetres), normals, area (m2) and angles (deg). */
    static final int XYZ_DECIMALS = 3, NORMAL_DECIMALS = 5, AREA_DECIMALS = 4, ANGLE_DECIMALS = 2;

    private PatchCsvWriter() {}

    /** Writes the table atomically. */
    public static void write(Path file, ResultTable table) {
        List<String> names = table.names();
        for (String n : names) {
            if (PATCH_COLUMNS.contains(n)) throw new IllegalArgumentException("result column " + n + " clashes with a patch column");
        }
        int cols = names.size();
        double[][] values = new double[cols][];
        int[] decimals = new int[cols];
        for (int c = 0; c < cols; c++) {
            values[c] = table.column(names.get(c));
            decimals[c] = table.def(names.get(c)).decimals();
        }
        List<Patch> patches = table.patches();
        AtomicFiles.writeText(file, w -> {
            StringBuilder sb = new StringBuilder(512);
            List<String> header = new ArrayList<>(PATCH_COLUMNS);
            header.addAll(names);
            for (int i = 0; i < header.size(); i++) {
                if (i > 0) sb.append(',');
                text(sb, header.get(i));
            }
            sb.append('\n');
            w.write(sb.toString());
            for (int p = 0; p < patches.size(); p++) {
                sb.setLength(0);
                Patch q = patches.get(p);
                text(sb, q.id());
                sb.append(',');
                text(sb, q.blockName());
                sb.append(',').append(q.surface()).append(',').append(q.kind().label());
                num(sb, q.centroid().x(), XYZ_DECIMALS);
                num(sb, q.centroid().y(), XYZ_DECIMALS);
                num(sb, q.centroid().z(), XYZ_DECIMALS);
                num(sb, q.normal().x(), NORMAL_DECIMALS);
                num(sb, q.normal().y(), NORMAL_DECIMALS);
                num(sb, q.normal().z(), NORMAL_DECIMALS);
                num(sb, q.areaM2(), AREA_DECIMALS);
                num(sb, q.tiltDeg(), ANGLE_DECIMALS);
                num(sb, q.azimuthDeg(), ANGLE_DECIMALS);
                for (int c = 0; c < cols; c++) num(sb, values[c][p], decimals[c]);
                sb.append('\n');
                w.write(sb.toString());
            }
        });
    }

    private static void num(StringBuilder sb, double v, int decimals) {
        sb.append(',');
        Numbers.append(sb, v, decimals);
    }

    /** RFC 4180 quoting: only where needed. */
    static void text(StringBuilder sb, String s) {
        boolean quote = s.indexOf(',') >= 0 || s.indexOf('"') >= 0 || s.indexOf('\n') >= 0 || s.indexOf('\r') >= 0
                || s.startsWith("#") || (!s.isEmpty() && (Character.isWhitespace(s.charAt(0)) || Character.isWhitespace(s.charAt(s.length() - 1))));
        if (!quote) {
            sb.append(s);
            return;
        }
        sb.append('"');
        for (int i = 0; i < s.length(); i++) {
            char ch = s.charAt(i);
            if (ch == '"') sb.append('"');
            sb.append(ch);
        }
        sb.append('"');
    }
}
