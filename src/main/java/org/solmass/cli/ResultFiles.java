package org.solmass.cli;

import org.solmass.Cautions;
import org.solmass.output.FolderClaim;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;
import org.solmass.study.Study;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

/**
 * The results folder of an analysis: claimed (checked and locked) before the work starts, then
 * written and published as one run (docs/outputs.md, "How a results folder is published"), so a
 * failed or killed run never leaves files of two runs that a reader takes for one.
 */
public final class ResultFiles {
    private ResultFiles() {}

    /**
     * Checks and locks the study's output folder before any work; prints a note when an earlier run's
     * lock is taken over.
     *
     * @param outFlag whether the folder came from {@code --out} (it is named so in messages; else the
     *                study key {@code outputs.folder})
     * @throws org.solmass.InputException when the folder cannot take results or another run holds it
     */
    public static FolderClaim claim(Study study, boolean outFlag) {
        String where = outFlag || study.source() == null ? "--out" : study.source() + ": outputs.folder";
        String label = study.source() != null ? study.source().toString() : "\"" + study.name() + "\" (from flags)";
        FolderClaim c = FolderClaim.claim(study.outputs().folder(), where, study.source(), label);
        if (c.note() != null) System.err.println("solmass: note: " + c.note());
        return c;
    }

    /**
     * Writes patches.csv, month-hour.csv (when asked), zones.csv, summary.json, map.png, patches.gltf
     * (when asked) and run.json into the claimed folder; returns the paths.
     */
    public static List<Path> write(AnalysisRun.Outcome o, FolderClaim claim) {
        RunRecord run = RunRecord.of(Main.version(), o.study(), o.weather().timeBase().label(), o.counts(),
                o.timingsS(), Instant.now());
        List<String> notes = new java.util.ArrayList<>();
        for (String w : o.warnings()) notes.add("warning: " + w); // the warnings analyse printed, kept with the results
        return ResultsFolder.write(new ResultsFolder.Results(o.study(), o.model(), o.table(),
                o.result().monthHourWm2(), run, cautions(o.study()), o.metrics(), notes, o.geo()), claim);
    }

    /** The cautions of a run's results: the one for results, and the clear-sky one when the climate is the clear sky. */
    static List<String> cautions(org.solmass.study.Study study) {
        return study.climate().isClearSky() ? List.of(Cautions.RESULTS, Cautions.CLEAR_SKY) : List.of(Cautions.RESULTS);
    }
}
