package org.solmass.viewer;

import org.solmass.climate.MonthHour;
import org.solmass.model.MassingModel;
import org.solmass.table.ResultTable;
import org.solmass.surface.Patch;

import java.util.List;

/**
 * Everything the viewer shows, filled by the pipeline; the viewer computes no physics from it.
 *
 * @param title window title, e.g. the study name
 * @param model the massing model (metres, x east, y north, z up)
 * @param blockAnalysed per block id, true when its surfaces were analysed; other blocks are context
 *                      and drawn neutral grey
 * @param patches the analysed patches, index = row of {@code table}
 * @param table per-patch result columns (CSV names and units)
 * @param monthHourWm2 mean irradiance per patch, month and local standard hour, W/m2, laid out as
 *                     {@code [patch * MonthHour.SLOTS + MonthHour.index(month, hour)]}; may be null
 * @param climate the input climate at a glance; may be null
 * @param sunPath the sun's path on the monthly-average days; may be empty
 * @param latitudeDeg site latitude, degrees north
 * @param longitudeDeg site longitude, degrees east
 * @param zone time zone label of the local standard time, e.g. "UTC+01:00"
 * @param warnings messages for the status line (e.g. from import or climate checks)
 * @param moduleRings outlines of the placed PV modules (results' modules.geojson), each
 *                    {x0, y0, z0, x1, ...} in world metres without the closing corner; may be empty
 * @param shadows the results' shadow study (shadows/shadows.csv and, when written, the per-patch
 *                shadows/shadow-patches.csv); {@link ShadowFrames#NONE} without it
 * @param period what the run's annual values cover, in words ({@code output.RunPeriod}, e.g. "Year of
 *               monthly-average days, climate site.csv"); null when not known (a set-up, synthetic data)
 */
public record ViewerData(String title, MassingModel model, boolean[] blockAnalysed, List<Patch> patches,
                         ResultTable table, float[] monthHourWm2, ClimateGlance climate,
                         List<SunArc> sunPath, double latitudeDeg, double longitudeDeg, String zone,
                         List<String> warnings, List<double[]> moduleRings,
                         ShadowFrames shadows, String period) {

    public ViewerData {
        if (table.size() != patches.size()) {
            throw new IllegalArgumentException("table has " + table.size() + " rows for " + patches.size() + " patches");
        }
        if (monthHourWm2 != null && monthHourWm2.length != patches.size() * MonthHour.SLOTS) {
            throw new IllegalArgumentException("monthHourWm2 has " + monthHourWm2.length
                    + " values, expected patches x 12 x 24 = " + patches.size() * MonthHour.SLOTS);
        }
        if (blockAnalysed.length != model.blockNames().size()) {
            throw new IllegalArgumentException("blockAnalysed has " + blockAnalysed.length + " entries for "
                    + model.blockNames().size() + " blocks");
        }
        for (int i = 0; i < patches.size(); i++) {
            if (patches.get(i).index() != i) {
                throw new IllegalArgumentException("patch at position " + i + " has index " + patches.get(i).index());
            }
        }
        sunPath = sunPath == null ? List.of() : List.copyOf(sunPath);
        warnings = warnings == null ? List.of() : List.copyOf(warnings);
        moduleRings = moduleRings == null ? List.of() : List.copyOf(moduleRings);
        shadows = shadows == null ? ShadowFrames.NONE : shadows;
        for (double[] r : moduleRings) {
            if (r.length < 9 || r.length % 3 != 0) {
                throw new IllegalArgumentException("a module ring has " + r.length + " coordinates, expected 3 per corner and at least 3 corners");
            }
        }
    }

    /** Data without PV modules (results without modules.geojson). */
    public ViewerData(String title, MassingModel model, boolean[] blockAnalysed, List<Patch> patches,
                      ResultTable table, float[] monthHourWm2, ClimateGlance climate,
                      List<SunArc> sunPath, double latitudeDeg, double longitudeDeg, String zone,
                      List<String> warnings) {
        this(title, model, blockAnalysed, patches, table, monthHourWm2, climate, sunPath, latitudeDeg, longitudeDeg,
                zone, warnings, List.of(), ShadowFrames.NONE, null);
    }

    /** Data without a shadow study (results without shadows/shadows.csv). */
    public ViewerData(String title, MassingModel model, boolean[] blockAnalysed, List<Patch> patches,
                      ResultTable table, float[] monthHourWm2, ClimateGlance climate,
                      List<SunArc> sunPath, double latitudeDeg, double longitudeDeg, String zone,
                      List<String> warnings, List<double[]> moduleRings) {
        this(title, model, blockAnalysed, patches, table, monthHourWm2, climate, sunPath, latitudeDeg, longitudeDeg,
                zone, warnings, moduleRings, ShadowFrames.NONE, null);
    }

    /** The same data with this shadow study. */
    public ViewerData withShadows(ShadowFrames s) {
        return new ViewerData(title, model, blockAnalysed, patches, table, monthHourWm2, climate, sunPath,
                latitudeDeg, longitudeDeg, zone, warnings, moduleRings, s, period);
    }

    /** The same data with this period of the run's values ({@code output.RunPeriod}). */
    public ViewerData withPeriod(String p) {
        return new ViewerData(title, model, blockAnalysed, patches, table, monthHourWm2, climate, sunPath,
                latitudeDeg, longitudeDeg, zone, warnings, moduleRings, shadows, p);
    }

    /** The same data with these PV module outlines. */
    public ViewerData withModuleRings(List<double[]> rings) {
        return new ViewerData(title, model, blockAnalysed, patches, table, monthHourWm2, climate, sunPath,
                latitudeDeg, longitudeDeg, zone, warnings, rings, shadows, period);
    }

    /** Mean irradiance of a patch in a month (1..12) at local standard hour h (0..23), W/m2; NaN if absent. */
    public double monthHour(int patch, int month, int hour) {
        if (monthHourWm2 == null) return Double.NaN;
        return monthHourWm2[patch * MonthHour.SLOTS + MonthHour.index(month, hour)];
    }
}
