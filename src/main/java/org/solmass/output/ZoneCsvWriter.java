package org.solmass.output;

import org.solmass.metrics.PvZones;

import java.nio.file.Path;
import java.util.List;

/**
 * Writes zones.csv: one row per PV roof zone ({@link PvZones}). Same conventions as patches.csv (UTF-8,
 * LF, header row first, no comment lines, RFC 4180 quoting, fixed decimals); the caution, the best plane
 * and the settings go to summary.json. Columns: docs/outputs.md.
 */
public final class ZoneCsvWriter {
    public static final String FILE_NAME = "zones.csv";
    public static final List<String> COLUMNS = List.of("zone", "block", "surface", "patches", "area_m2", "tilt_deg",
            "azimuth_deg", "mean_kwh_m2", "total_kwh", "mean_shading_loss_pct", "yield_kwh");

    private ZoneCsvWriter() {}

    public static void write(Path file, List<PvZones.Zone> zones) {
        AtomicFiles.writeText(file, w -> {
            w.write(String.join(",", COLUMNS) + "\n");
            StringBuilder sb = new StringBuilder(256);
            for (PvZones.Zone z : zones) {
                sb.setLength(0);
                sb.append(z.id()).append(',');
                PatchCsvWriter.text(sb, z.blockName());
                sb.append(',').append(z.surfaceLabel()).append(',').append(z.patches().length);
                num(sb, z.areaM2(), 2);
                num(sb, z.tiltDeg(), 2);
                num(sb, z.azimuthDeg(), 2);
                num(sb, z.meanKwhM2(), 2);
                num(sb, z.totalKwh(), 1);
                num(sb, z.meanShadingLossPct(), 2);
                num(sb, z.yieldKwh(), 1);
                sb.append('\n');
                w.write(sb.toString());
            }
        });
    }

    private static void num(StringBuilder sb, double v, int decimals) {
        sb.append(',');
        org.solmass.table.Numbers.append(sb, v, decimals);
    }
}
