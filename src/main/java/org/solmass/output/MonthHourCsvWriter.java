package org.solmass.output;

import org.solmass.climate.MonthHour;
import org.solmass.surface.Patch;

import java.util.List;
import java.nio.file.Path;

/**
 * Writes month-hour.csv: per patch the 12 x 24 table of mean irradiance (W/m2) on the patch, one row
 * per patch and month with 24 hour columns: {@code patch_id,month,h00,...,h23}. Hour column hNN holds
 * the mean over the month's days of the irradiance from NN:00 to NN+1:00 local standard time; month is
 * 1 to 12. One decimal (W/m2), LF line ends, UTF-8, no comment lines. Layout: docs/outputs.md.
 */
public final class MonthHourCsvWriter {
    public static final int MONTHS = MonthHour.MONTHS, HOURS = MonthHour.HOURS, CELLS = MonthHour.SLOTS;
    static final int DECIMALS = 1;

    private MonthHourCsvWriter() {}

    /** The header line's cells. */
    public static String header() {
        StringBuilder sb = new StringBuilder("patch_id,month");
        for (int h = 0; h < HOURS; h++) sb.append(",h").append(h < 10 ? "0" : "").append(h);
        return sb.toString();
    }

    /**
     * Writes the file atomically.
     *
     * @param patches the patches, in index order
     * @param wm2 mean irradiance, W/m2: patch p, month m (0..11), hour h (0..23) at {@code p * MonthHour.SLOTS + MonthHour.index(m + 1, h)}
     */
    public static void write(Path file, List<Patch> patches, float[] wm2) {
        if (wm2.length != (long) patches.size() * CELLS) {
            throw new IllegalArgumentException("month-hour table has " + wm2.length + " values for "
                    + patches.size() + " patches (need " + CELLS + " each)");
        }
        AtomicFiles.writeText(file, w -> {
            w.write(header());
            w.write('\n');
            StringBuilder sb = new StringBuilder(512);
            for (int p = 0; p < patches.size(); p++) {
                StringBuilder id = new StringBuilder();
                PatchCsvWriter.text(id, patches.get(p).id());
                for (int m = 0; m < MONTHS; m++) {
                    sb.setLength(0);
                    sb.append(id).append(',').append(m + 1);
                    int base = p * CELLS + MonthHour.index(m + 1, 0);
                    for (int h = 0; h < HOURS; h++) {
                        sb.append(',');
                        org.solmass.table.Numbers.append(sb, wm2[base + h], DECIMALS);
                    }
                    sb.append('\n');
                    w.write(sb.toString());
                }
            }
        });
    }
}
