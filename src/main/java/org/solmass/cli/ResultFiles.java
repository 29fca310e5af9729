package org.solmass.cli;

import org.solmass.Cautions;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

/**
 * Writes the files of a finished analysis into the study's output folder; each file is written to a
 * temporary file and moved into place, so a failed or killed run leaves the previous results whole.
 */
public final class ResultFiles {
    private ResultFiles() {}

    /**
     * Writes patches.csv, month-hour.csv (when asked), zones.csv, summary.json, map.png, patches.gltf
     * (when asked) and run.json; returns the paths.
     */
    public static List<Path> write(AnalysisRun.Outcome o) {
        RunRecord run = RunRecord.of(Main.version(), o.study(), o.weather().timeBase().label(), o.counts(),
                o.timingsS(), Instant.now());
        List<String> notes = new java.util.ArrayList<>();
        for (String w : o.warnings()) notes.add("warning: " + w); // the warnings analyse printed, kept with the results
        return ResultsFolder.write(new ResultsFolder.Results(o.study(), o.model(), o.table(),
                o.result().monthHourWm2(), run, List.of(Cautions.RESULTS), o.metrics(), notes));
    }
}
