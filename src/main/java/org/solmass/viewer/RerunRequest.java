package org.solmass.viewer;

/**
 * The options a user may change before re-running the analysis from the window.
 *
 * @param patchSizeM patch edge length, metres
 * @param climateSource climate source as the study file names it (a file path or a clear-sky keyword)
 * @param skyModel sky model name, e.g. "perez" or "isotropic"
 * @param variantName name of the new variant folder written beside the study's results folder, or
 *                    null/blank for the default name (docs/viewer.md, "Re-run and variants")
 */
public record RerunRequest(double patchSizeM, String climateSource, String skyModel, String variantName) {
    /** A request for a variant with the default name. */
    public RerunRequest(double patchSizeM, String climateSource, String skyModel) {
        this(patchSizeM, climateSource, skyModel, null);
    }
}
