package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.model.MassingModel;
import org.solmass.output.PatchCsvReader;
import org.solmass.output.PublishedRun;
import org.solmass.output.ResultsFolder;
import org.solmass.study.Study;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;

import java.util.List;

/**
 * The geometry of a finished run rebuilt from its run record (the study and the model file, which must
 * not have changed since), with its patches.csv read back (checked against run.json): what the
 * elevations and the report draw from a results folder.
 *
 * @param run the results folder
 * @param study the run's resolved study
 * @param model the massing model
 * @param analysed per block whether it was analysed
 * @param patches the analysed patches, in patch index order (the ids of patches.csv)
 * @param table patches.csv
 */
record RunGeometry(PublishedRun run, Study study, MassingModel model, boolean[] analysed, List<Patch> patches,
                   PatchCsvReader.Table table) {

    /**
     * Rebuilds the geometry of a results folder.
     *
     * @throws InputException when the model file changed since the run or its patches no longer match
     */
    static RunGeometry of(PublishedRun run) {
        Study study = run.record().study();
        if (!run.record().modelUnchanged()) {
            throw new InputException(study.model().file().toString(), "the model changed since the run in " + run.folder()
                    + " (its size or SHA-256 differs from run.json); run analyse again");
        }
        PatchCsvReader.Table table = run.read(ResultsFolder.PATCHES, PatchCsvReader::read);
        org.solmass.geo.GeoModel read = AnalysisRun.loadModel(study);
        AnalysisRun.TreeSplit split = AnalysisRun.splitTrees(study, read.model()); // patched as the run did: trees left out
        MassingModel m = split.opaque();
        PatchSet ps = Patcher.build(m, new PatchOptions(study.patchM(), AnalysisRun.patchedBlocks(study, split), false));
        if (ps.patches().size() != table.size() || (table.size() > 0 && table.row(ps.patches().get(0).id()) != 0)) {
            throw new InputException(run.folder().resolve(ResultsFolder.PATCHES).toString(), "holds " + table.size()
                    + " patches, the model rebuilt with the run's settings " + ps.patches().size() + "; run analyse again");
        }
        return new RunGeometry(run, study, m, study.model().analysedMask(m.blockNames()), ps.patches(), table);
    }

    /** A column of patches.csv per patch index (NaN where the file has no value or no row). */
    double[] values(String column) {
        if (!table.has(column)) {
            throw new InputException("--column", "patches.csv of " + run.folder() + " has no column " + column
                    + "; it has " + String.join(", ", table.resultColumns()));
        }
        double[] col = table.column(column), v = new double[patches.size()];
        for (Patch p : patches) {
            int r = table.row(p.id());
            v[p.index()] = r >= 0 ? col[r] : Double.NaN;
        }
        return v;
    }
}
