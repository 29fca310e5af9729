package org.solmass.viewer;

/**
 * The options a user may change before re-running the analysis from the window.
 *
 * @param patchSizeM patch edge length, metres
 * @param climateSource climate source as the study file names it (a file path or a clear-sky keyword)
 * @param skyModel sky model name, e.g. "perez" or "isotropic"
 */
public record RerunRequest(double patchSizeM, String climateSource, String skyModel) {}
