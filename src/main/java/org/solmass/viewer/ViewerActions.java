package org.solmass.viewer;

import java.nio.file.Path;
import java.util.List;
import java.util.function.BooleanSupplier;

/** What the window asks the rest of Solmass to do; the CLI wires it. Methods run off the FX thread. */
public interface ViewerActions {

    /** The current re-run options, to fill the controls. */
    RerunRequest currentOptions();

    /** The climate sources offered in the re-run control (the user may also type one). */
    default List<String> climateChoices() { return List.of(currentOptions().climateSource()); }

    /** The sky model names offered in the re-run control. */
    default List<String> skyModels() { return List.of(currentOptions().skyModel()); }

    /**
     * Re-runs the analysis with changed options into a new variant folder (earlier results are never
     * overwritten); returns the new data, or null when cancelled.
     */
    ViewerData rerun(RerunRequest request, ProgressSink progress, BooleanSupplier cancelled) throws Exception;

    /** The results folder of the data on show (a re-run's variant folder, or the one opened); null when unknown. */
    default Path shownFolder() { return null; }

    /** The study's results folders holding a run (the first results, then the variants by name); empty when none. */
    default List<Path> variants() { return List.of(); }

    /** Opens one of {@link #variants()}: its data, read from the folder; later re-runs start from its options. */
    default ViewerData openVariant(Path folder) throws Exception {
        throw new UnsupportedOperationException("variants are not available for this data");
    }

    /** The default variant name offered in the re-run control (shown as the name field's prompt); null when none. */
    default String defaultVariantName() { return null; }

    /**
     * Runs a study set up in the window: into its results folder when that holds no results yet,
     * otherwise into a new variant folder beside it (named {@code variantName}, or dated when blank);
     * never over earlier results. The study file is not written (Save does that).
     */
    default ViewerData runStudy(org.solmass.study.Study study, String variantName, ProgressSink progress, BooleanSupplier cancelled)
            throws Exception {
        throw new UnsupportedOperationException("running a new study is not available here");
    }

    /**
     * The data on show with its differences from another results folder of the study ({@code delta_*}
     * quantities: on show minus {@code against}), as {@code solmass compare} matches patches.
     */
    default ViewerData compare(Path against) throws Exception {
        throw new UnsupportedOperationException("comparing is not available for this data");
    }

    /** Writes the per-patch CSV of the data on show. */
    void exportCsv(Path file) throws Exception;

    /** Writes the study summary of the data on show. */
    void exportSummary(Path file) throws Exception;

    /** Actions for data that cannot be re-run or exported (e.g. opened from a results folder). */
    static ViewerActions none(RerunRequest options) {
        return new ViewerActions() {
            @Override public RerunRequest currentOptions() { return options; }
            @Override public ViewerData rerun(RerunRequest r, ProgressSink p, BooleanSupplier c) {
                throw new UnsupportedOperationException("re-run is not available for this data");
            }
            @Override public void exportCsv(Path file) { throw new UnsupportedOperationException("CSV export is not available for this data"); }
            @Override public void exportSummary(Path file) { throw new UnsupportedOperationException("summary export is not available for this data"); }
        };
    }
}
