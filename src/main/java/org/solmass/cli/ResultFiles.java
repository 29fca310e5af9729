package org.solmass.cli;

import org.solmass.output.MapRenderer;
import org.solmass.output.MonthHourCsvWriter;
import org.solmass.output.PatchCsvWriter;
import org.solmass.output.RunRecord;
import org.solmass.output.SummaryWriter;
import org.solmass.study.Study;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes the files of a finished analysis into the study's output folder; each file is written to a
 * temporary file and moved into place, so a failed or killed run leaves the previous results whole.
 */
public final class ResultFiles {
    /** The caution carried by every results file a roof or PV decision could be taken from. */
    public static final String CAUTION = "Indicative only: a planning aid for early design. Roof work, PV "
            + "electrical and structural design, fire setbacks and grid connection follow local codes and licensed practice.";

    private ResultFiles() {}

    /** Writes patches.csv, summary.json, run.json, map.png and (when asked) month-hour.csv; returns the paths. */
    public static List<Path> write(AnalysisRun.Outcome o, double writeStartedS) {
        Study study = o.study();
        Path dir = study.outputs().folder();
        try {
            Files.createDirectories(dir);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot create the output folder " + dir + ": " + e.getMessage(), e);
        }
        List<Path> written = new ArrayList<>();
        List<String> comments = List.of(
                "Solmass " + Main.version() + " - study " + study.name() + " - " + o.weather().source(),
                "x,y,z centroid in metres (x east, y north, z up); azimuth from north clockwise; irradiation in kWh/m2 per year",
                CAUTION);
        Path csv = dir.resolve("patches.csv");
        PatchCsvWriter.write(csv, o.table(), comments);
        written.add(csv);

        RunRecord run = RunRecord.of(Main.version(), study, o.weather().timeBase().label(), o.counts(), o.timingsS(),
                Instant.now());
        Path summary = dir.resolve("summary.json");
        SummaryWriter.write(summary, o.table(), SummaryWriter.Spec.standard(study.outputs().thresholdsKwhM2()), run,
                List.of(CAUTION));
        written.add(summary);
        Path runFile = dir.resolve(RunRecord.FILE_NAME);
        run.write(runFile);
        written.add(runFile);

        if (study.outputs().map()) {
            Path map = dir.resolve("map.png");
            MapRenderer.write(map, o.model(), o.patches().analysedBlocks(), o.patches().patches(),
                    o.result().annual(), "annual irradiation", "kWh/m2",
                    MapRenderer.Options.of(study.outputs().mapWidthPx(), study.outputs().mapHeightPx(), study.name()));
            written.add(map);
        }
        if (study.outputs().monthHourCsv() && o.result().monthHourWm2() != null) {
            Path mh = dir.resolve("month-hour.csv");
            MonthHourCsvWriter.write(mh, o.patches().patches(), o.result().monthHourWm2());
            written.add(mh);
        }
        return written;
    }
}
