package org.solmass.output;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.solmass.metrics.ShadowStudy;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * The shadow study's table (CSV, header first, no comment lines): one row per date, time and block
 * (and the ground), with the sun position, the area and the sunlit area. Columns: docs/metrics.md,
 * "Shadow studies".
 */
public final class ShadowTable {
    /** Header of the table. */
    public static final List<String> HEADER = List.of("date", "time", "sun_azimuth_deg", "sun_elevation_deg", "name", "role",
            "area_m2", "sunlit_area_m2", "sunlit_pct");

    private ShadowTable() {}

    /** Writes the table atomically. */
    public static void write(Path file, List<ShadowStudy.Area> rows) {
        AtomicFiles.writeText(file, w -> {
            CSVPrinter p = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').build());   // not closed: AtomicFiles owns the writer
            p.printRecord(HEADER);
            for (ShadowStudy.Area a : rows) {
                p.printRecord(String.format(Locale.ROOT, "%02d-%02d", a.moment().date().getMonthValue(), a.moment().date().getDayOfMonth()),
                        a.moment().time().toString(), f(a.sun().azimuthDeg(), 2), f(a.sun().elevationDeg(), 2), a.name(), a.role(),
                        f(a.areaM2(), 2), f(a.sunlitAreaM2(), 2), f(a.sunlitPct(), 1));
            }
            p.flush();
        });
    }

    private static String f(double v, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }
}
