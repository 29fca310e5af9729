package org.solmass.output;

import org.solmass.model.MassingModel;
import org.solmass.study.Study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes a whole results folder in one call: patches.csv, month-hour.csv (when the study asks and the
 * table is given), summary.json, map.png (when the study asks) and, last, run.json, so a folder with
 * a run.json is complete. Every file is written atomically ({@link AtomicFiles}).
 */
public final class ResultsFolder {
    public static final String PATCHES = "patches.csv", SUMMARY = "summary.json", MAP = "map.png",
            MONTH_HOUR = "month-hour.csv";
    /** The column the map and the thresholds use. */
    public static final String MAIN_COLUMN = "annual_kwh_m2";

    private ResultsFolder() {}

    /**
     * What a run produced.
     *
     * @param study the resolved study (its outputs section says where and what)
     * @param model the massing model as imported
     * @param table per-patch results, patches in index order
     * @param monthHourWm2 mean irradiance per patch, month and hour ({@link MonthHourCsvWriter}), or null
     * @param run the run record
     * @param cautions texts for summary.json
     */
    public record Results(Study study, MassingModel model, ResultTable table, float[] monthHourWm2,
                          RunRecord run, List<String> cautions) {
        public Results {
            cautions = List.copyOf(cautions);
        }
    }

    /** Writes the files and returns their paths in the order written. */
    public static List<Path> write(Results r) {
        Study.Outputs o = r.study().outputs();
        Path dir = o.folder();
        List<Path> written = new ArrayList<>();
        Path patches = dir.resolve(PATCHES);
        PatchCsvWriter.write(patches, r.table());
        written.add(patches);
        if (o.monthHourCsv() && r.monthHourWm2() != null) {
            Path mh = dir.resolve(MONTH_HOUR);
            MonthHourCsvWriter.write(mh, r.table().patches(), r.monthHourWm2());
            written.add(mh);
        }
        Path summary = dir.resolve(SUMMARY);
        SummaryWriter.write(summary, r.table(), SummaryWriter.Spec.standard(o.thresholdsKwhM2()), r.run(), r.cautions());
        written.add(summary);
        if (o.map() && !r.table().names().isEmpty()) {
            String col = r.table().has(MAIN_COLUMN) ? MAIN_COLUMN : r.table().names().get(0);
            Path map = dir.resolve(MAP);
            MapRenderer.write(map, r.model(), r.study().model().analysedMask(r.model().blockNames()), r.table().patches(),
                    r.table().column(col), labelOf(col), r.table().unit(col),
                    MapRenderer.Options.of(o.mapWidthPx(), o.mapHeightPx(), r.study().name()));
            written.add(map);
        }
        Path run = dir.resolve(RunRecord.FILE_NAME);
        r.run().write(run);
        written.add(run);
        return written;
    }

    /** A readable name of a result column for titles and legends. */
    public static String labelOf(String column) {
        return switch (column) {
            case "annual_kwh_m2" -> "Annual irradiation";
            case "beam_kwh_m2" -> "Annual beam irradiation";
            case "diffuse_kwh_m2" -> "Annual sky diffuse irradiation";
            case "reflected_kwh_m2" -> "Annual reflected irradiation";
            case "unshaded_kwh_m2" -> "Annual irradiation without obstruction";
            case "shading_loss_pct" -> "Loss by shading";
            case "sky_view_factor" -> "Sky view factor";
            case "ground_view_factor" -> "Ground view factor";
            case "annual_kwh" -> "Annual irradiation per patch";
            default -> {
                if (column.matches("m(0[1-9]|1[0-2])_kwh_m2")) {
                    int m = Integer.parseInt(column.substring(1, 3));
                    yield java.time.Month.of(m).getDisplayName(java.time.format.TextStyle.FULL, java.util.Locale.ENGLISH) + " irradiation";
                }
                yield column.replace('_', ' ');
            }
        };
    }
}
