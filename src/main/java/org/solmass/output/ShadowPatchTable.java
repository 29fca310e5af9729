package org.solmass.output;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;
import org.solmass.InputException;
import org.solmass.metrics.ShadowStudy;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The shadow study per patch (CSV, header first, no comment lines): one row per patch of the blocks
 * (analysed and context) and of the ground, with what a reader needs to draw it (role, block, kind,
 * area, unit normal, outline) and one column per date and time of the study, 1 when the patch is in
 * sun by the shadow rule ({@link ShadowStudy}), 0 when in shade. Numbers are written without trailing
 * zeros (outline to the millimetre, normal to 6 decimals, area to 4). Layout: docs/outputs.md, "The shadow
 * study per patch". The viewer draws the context and ground patches from this file alone.
 */
public final class ShadowPatchTable {
    /** File name, beside shadows.csv. */
    public static final String FILE_NAME = "shadow-patches.csv";
    /** The columns before the frames. */
    public static final List<String> HEADER = List.of("patch_id", "role", "block", "kind", "area_m2",
            "normal_x", "normal_y", "normal_z", "outline_m");
    /** Start of a frame column's name: {@code sunlit_MM-DD_HH:MM}. */
    public static final String FRAME_PREFIX = "sunlit_";

    private ShadowPatchTable() {}

    /**
     * What the file holds, read back.
     *
     * @param patches every row as a patch: index = row, block ids numbered by first appearance of the
     *                block name (-1 for the ground grid's cells), centroid = mean of the outline's corners,
     *                tilt and azimuth from the normal
     * @param roles per row: "analysed", "context" or "ground"
     * @param frames per frame column, "MM-DD HH:MM" (local standard time), in file order
     * @param sunlit per frame, per row: in sun
     */
    public record Table(List<Patch> patches, List<String> roles, List<String> frames, List<boolean[]> sunlit) {
        public Table {
            patches = List.copyOf(patches);
            roles = List.copyOf(roles);
            frames = List.copyOf(frames);
            sunlit = List.copyOf(sunlit);
        }

        /** Per row: in sun at the frame "MM-DD HH:MM"; null when the file has no such column. */
        public boolean[] sunlit(String frame) {
            int i = frames.indexOf(frame);
            return i < 0 ? null : sunlit.get(i);
        }
    }

    /** The frame key and column name of a moment: "MM-DD HH:MM" and {@code sunlit_MM-DD_HH:MM}. */
    public static String frameKey(ShadowStudy.Moment m) {
        return String.format(Locale.ROOT, "%02d-%02d %s", m.date().getMonthValue(), m.date().getDayOfMonth(), m.time());
    }

    static String column(String frameKey) {
        return FRAME_PREFIX + frameKey.replace(' ', '_');
    }

    /**
     * Writes the table atomically.
     *
     * @param patches every patch of the study, in patch order (block patches, then the ground grid)
     * @param analysedBlock per block id: analysed (else context)
     * @param frames the study's frames, each with one in-sun flag per patch
     */
    public static void write(Path file, List<Patch> patches, boolean[] analysedBlock, List<ShadowStudy.Frame> frames) {
        AtomicFiles.writeText(file, w -> {
            CSVPrinter p = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').build());   // not closed: AtomicFiles owns the writer
            List<String> header = new ArrayList<>(HEADER);
            for (ShadowStudy.Frame f : frames) header.add(column(frameKey(f.moment())));
            p.printRecord(header);
            List<String> row = new ArrayList<>();
            StringBuilder outline = new StringBuilder();
            for (int i = 0; i < patches.size(); i++) {
                Patch q = patches.get(i);
                row.clear();
                outline.setLength(0);
                double[] o = q.outline();
                for (int k = 0; k < o.length; k++) outline.append(k == 0 ? "" : " ").append(f(o[k], 3));
                row.add(q.id());
                row.add(ShadowStudy.role(q, analysedBlock));
                row.add(q.blockName());
                row.add(q.kind().label());
                row.add(f(q.areaM2(), 4));
                row.add(f(q.normal().x(), 6));
                row.add(f(q.normal().y(), 6));
                row.add(f(q.normal().z(), 6));
                row.add(outline.toString());
                for (ShadowStudy.Frame fr : frames) row.add(fr.sunlit()[i] ? "1" : "0");
                p.printRecord(row);
            }
            p.flush();
        });
    }

    /** Reads a table written by {@link #write}. */
    public static Table read(Path file) {
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build().parse(r)) {
            for (String need : HEADER) {
                if (!p.getHeaderMap().containsKey(need)) {
                    throw new InputException(file + ":1", "column '" + need + "' missing; expected the header of solmass shadows' " + FILE_NAME);
                }
            }
            List<String> frameCols = new ArrayList<>(), frames = new ArrayList<>();
            for (String h : p.getHeaderNames()) {
                if (h.startsWith(FRAME_PREFIX)) {
                    frameCols.add(h);
                    frames.add(h.substring(FRAME_PREFIX.length()).replace('_', ' '));
                }
            }
            List<Patch> patches = new ArrayList<>();
            List<String> roles = new ArrayList<>();
            List<List<Boolean>> flags = new ArrayList<>();
            for (int k = 0; k < frameCols.size(); k++) flags.add(new ArrayList<>());
            Map<String, Integer> blocks = new LinkedHashMap<>();
            for (CSVRecord rec : p) {
                String where = file + ":" + (rec.getRecordNumber() + 1);
                String role = rec.get("role");
                SurfaceKind kind;
                try {
                    kind = SurfaceKind.parse(rec.get("kind"));
                } catch (IllegalArgumentException e) {
                    throw new InputException(where, "kind '" + rec.get("kind") + "' is not one of roof, facade, ground, underside");
                }
                String block = rec.get("block");
                int blockId = ShadowStudy.GROUND.equals(block) && kind == SurfaceKind.GROUND ? -1 : blocks.computeIfAbsent(block, b -> blocks.size());
                Vec3 n = new Vec3(number(where, rec, "normal_x"), number(where, rec, "normal_y"), number(where, rec, "normal_z"));
                double[] outline = outline(where, rec.get("outline_m"));
                double cx = 0, cy = 0, cz = 0;
                int m = outline.length / 3;
                for (int k = 0; k < m; k++) {
                    cx += outline[3 * k] / m;
                    cy += outline[3 * k + 1] / m;
                    cz += outline[3 * k + 2] / m;
                }
                double tiltDeg = Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, n.z()))));
                double azimuthDeg = Math.hypot(n.x(), n.y()) < 1e-9 ? 0 : (Math.toDegrees(Math.atan2(n.x(), n.y())) + 360) % 360;
                patches.add(new Patch(patches.size(), rec.get("patch_id"), blockId, block, -1, kind, new Vec3(cx, cy, cz), n,
                        number(where, rec, "area_m2"), tiltDeg, azimuthDeg, outline));
                roles.add(role);
                for (int k = 0; k < frameCols.size(); k++) {
                    String v = rec.get(frameCols.get(k)).trim();
                    if (!v.equals("0") && !v.equals("1")) throw new InputException(where, frameCols.get(k) + " '" + v + "' is neither 0 (shade) nor 1 (sun)");
                    flags.get(k).add(v.equals("1"));
                }
            }
            List<boolean[]> sunlit = new ArrayList<>();
            for (List<Boolean> l : flags) {
                boolean[] b = new boolean[l.size()];
                for (int i = 0; i < b.length; i++) b[i] = l.get(i);
                sunlit.add(b);
            }
            return new Table(patches, roles, frames, sunlit);
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read: " + e.getMessage());
        } catch (IllegalStateException | IllegalArgumentException e) {   // a row with fewer cells than the header
            throw new InputException(file.toString(), "not a table of solmass shadows: " + e.getMessage());
        }
    }

    private static double[] outline(String where, String s) {
        String[] parts = s.trim().split("\\s+");
        if (parts.length < 9 || parts.length % 3 != 0) {
            throw new InputException(where, "outline_m has " + parts.length + " numbers, expected x y z of at least 3 corners");
        }
        double[] o = new double[parts.length];
        for (int i = 0; i < o.length; i++) {
            try {
                o[i] = Double.parseDouble(parts[i]);
            } catch (NumberFormatException e) {
                throw new InputException(where, "outline_m number '" + parts[i] + "' is not a number");
            }
        }
        return o;
    }

    private static double number(String where, CSVRecord rec, String column) {
        try {
            return Double.parseDouble(rec.get(column));
        } catch (NumberFormatException e) {
            throw new InputException(where, column + " '" + rec.get(column) + "' is not a number");
        }
    }

    /** {@code v} rounded to {@code decimals}, without trailing zeros (1.500 is written 1.5, 22.000 is 22, -0.000 is 0). */
    static String f(double v, int decimals) {
        String s = String.format(Locale.ROOT, "%." + decimals + "f", v);
        if (s.indexOf('.') >= 0) {
            int end = s.length();
            while (s.charAt(end - 1) == '0') end--;
            if (s.charAt(end - 1) == '.') end--;
            s = s.substring(0, end);
        }
        return s.equals("-0") ? "0" : s;
    }
}
