package org.solmass;

/**
 * The cautions Solmass shows wherever its results could steer a decision that can hurt someone (roof
 * work, PV electrical and structural design, fire setbacks): one text, read by summary.json, glTF,
 * the terminal, the viewer and the docs.
 */
public final class Cautions {
    /** Carried by every results file, the viewer and the terminal summary. */
    public static final String RESULTS = "Indicative only: a planning aid for early design. Roof work, PV "
            + "electrical and structural design, fire setbacks and grid connection follow local codes and licensed practice.";

    /**
     * Carried by summary.json, the terminal summary and the viewer's set-up whenever the climate is
     * the clear-sky model: its irradiance is that of a cloudless sky every day.
     */
    public static final String CLEAR_SKY = "Clear sky: every day is cloudless, so these values are an upper bound,"
            + " not what typical weather at the site gives; use a climate file for typical values.";

    private Cautions() {}
}
