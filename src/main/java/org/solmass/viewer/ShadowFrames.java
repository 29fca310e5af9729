package org.solmass.viewer;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.solmass.InputException;
import org.solmass.output.PublishedRun;
import org.solmass.output.RunRecord;
import org.solmass.output.ShadowPatchTable;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;

/**
 * A finished shadow study as the viewer shows it, read from {@code shadows/shadows.csv}
 * ({@code output.ShadowTable}, docs/metrics.md "Shadow studies") and, when the study wrote it, from
 * {@code shadows/shadow-patches.csv} ({@link ShadowPatchTable}, docs/outputs.md); the viewer computes
 * nothing of it. shadows.csv holds one row per date, time and block (and the ground) with the block's
 * sunlit share of its area; the per-patch file holds, per patch of the analysed blocks, the context
 * blocks and the ground, its outline and whether it is in sun at each date and time. Without the
 * per-patch file (results of an earlier Solmass) the viewer's finest unit is the block.
 *
 * @param frames one frame per date and time, in file order
 * @param perPatch the per-patch study; null when the results have none
 */
public record ShadowFrames(List<Frame> frames, ShadowPatchTable.Table perPatch) {
    /** Folder of the shadow study inside a results folder. */
    public static final String FOLDER = "shadows";
    /** Path of the table inside a results folder. */
    public static final String FILE = FOLDER + "/shadows.csv";
    /** Path of the per-patch table inside a results folder. */
    public static final String PATCH_FILE = FOLDER + "/" + ShadowPatchTable.FILE_NAME;

    /**
     * One date and time of the study.
     *
     * @param date "MM-DD"
     * @param time "HH:MM", local standard time
     * @param sunAzimuthDeg sun azimuth, degrees from north clockwise; NaN when the file has no column
     * @param sunElevationDeg sun elevation, degrees; NaN when the file has no column
     * @param sunlitPctByBlock per block name (and "ground"), percent of its area in sun
     */
    public record Frame(String date, String time, double sunAzimuthDeg, double sunElevationDeg,
                        Map<String, Double> sunlitPctByBlock) {
        public Frame {
            sunlitPctByBlock = Map.copyOf(sunlitPctByBlock);
        }

        /** Percent of the block's area in sun at this moment; NaN when the file has no row for it. */
        public double sunlitPct(String blockName) {
            Double v = sunlitPctByBlock.get(blockName);
            return v == null ? Double.NaN : v;
        }
    }

    public ShadowFrames {
        frames = List.copyOf(frames);
    }

    /** A study read from shadows.csv alone (per block). */
    public ShadowFrames(List<Frame> frames) {
        this(frames, null);
    }

    /** Whether the study has sun and shade per patch (shadow-patches.csv). */
    public boolean hasPatches() {
        return perPatch != null && !perPatch.patches().isEmpty();
    }

    /** Per patch of {@link #perPatch}: in sun at this frame; null without the per-patch file or its column. */
    public boolean[] sunlit(Frame f) {
        return perPatch == null || f == null ? null : perPatch.sunlit(f.date() + " " + f.time());
    }

    /** No shadow study. */
    public static final ShadowFrames NONE = new ShadowFrames(List.of());

    public boolean isEmpty() {
        return frames.isEmpty();
    }

    /** The distinct dates, in file order. */
    public List<String> dates() {
        LinkedHashSet<String> s = new LinkedHashSet<>();
        for (Frame f : frames) s.add(f.date());
        return List.copyOf(s);
    }

    /** The distinct times, in file order. */
    public List<String> times() {
        LinkedHashSet<String> s = new LinkedHashSet<>();
        for (Frame f : frames) s.add(f.time());
        return List.copyOf(s);
    }

    /** The frame of this date and time; null when absent. */
    public Frame frame(String date, String time) {
        for (Frame f : frames) if (f.date().equals(date) && f.time().equals(time)) return f;
        return null;
    }

    /**
     * The shadow study of a results folder; {@link #NONE} when it has no {@link #FILE}. When the study
     * folder has a run.json (a study published with its manifest) its files are checked against it
     * ({@link PublishedRun}); an older study folder without one is read as it is.
     */
    public static ShadowFrames ofFolder(Path folder) {
        Path dir = folder.resolve(FOLDER), f = folder.resolve(FILE);
        if (!Files.isRegularFile(f)) return NONE;
        if (Files.isRegularFile(dir.resolve(RunRecord.FILE_NAME))) {
            PublishedRun run = PublishedRun.open(dir);
            String table = f.getFileName().toString();
            ShadowFrames s = run.has(table) ? run.read(table, ShadowFrames::read) : read(f);
            return run.has(ShadowPatchTable.FILE_NAME)
                    ? new ShadowFrames(s.frames(), run.read(ShadowPatchTable.FILE_NAME, ShadowPatchTable::read)) : s;
        }
        Path patches = folder.resolve(PATCH_FILE);
        return Files.isRegularFile(patches) ? new ShadowFrames(read(f).frames(), ShadowPatchTable.read(patches)) : read(f);
    }

    /** Reads a shadows.csv (header first: date, time, name, sunlit_pct required; sun columns optional). */
    public static ShadowFrames read(Path file) {
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build().parse(r)) {
            for (String need : List.of("date", "time", "name", "sunlit_pct")) {
                if (!p.getHeaderMap().containsKey(need)) {
                    throw new InputException(file + ":1", "column '" + need + "' missing; expected the header of solmass shadows");
                }
            }
            boolean az = p.getHeaderMap().containsKey("sun_azimuth_deg"), el = p.getHeaderMap().containsKey("sun_elevation_deg");
            Map<String, Object[]> byMoment = new LinkedHashMap<>();
            for (CSVRecord rec : p) {
                String key = rec.get("date") + " " + rec.get("time");
                Object[] m = byMoment.computeIfAbsent(key, k -> new Object[] {rec.get("date"), rec.get("time"),
                        az ? number(file, rec, "sun_azimuth_deg") : Double.NaN,
                        el ? number(file, rec, "sun_elevation_deg") : Double.NaN, new LinkedHashMap<String, Double>()});
                @SuppressWarnings("unchecked") Map<String, Double> pct = (Map<String, Double>) m[4];
                pct.put(rec.get("name"), number(file, rec, "sunlit_pct"));
            }
            List<Frame> out = new ArrayList<>();
            for (Object[] m : byMoment.values()) {
                @SuppressWarnings("unchecked") Map<String, Double> pct = (Map<String, Double>) m[4];
                out.add(new Frame((String) m[0], (String) m[1], (Double) m[2], (Double) m[3], pct));
            }
            return new ShadowFrames(out);
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read: " + e.getMessage());
        }
    }

    private static double number(Path file, CSVRecord rec, String column) {
        try {
            return Double.parseDouble(rec.get(column));
        } catch (NumberFormatException e) {
            throw new InputException(file + ":" + (rec.getRecordNumber() + 1), column + " '" + rec.get(column) + "' is not a number");
        }
    }
}
