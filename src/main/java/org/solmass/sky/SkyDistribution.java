package org.solmass.sky;

import org.solmass.climate.Step;

/**
 * A sky model given as a radiance distribution over the sky hemisphere rather than as the three
 * parts of Perez et al. (1990). The whole sky diffuse of a step is the distribution integrated over
 * the sky a plane sees: {@code E = integral of L(d) max(0, n . d) domega}, with L scaled per step so
 * that an unobstructed horizontal plane receives the step's DHI exactly ({@link SkyPatches#normalised}).
 * Circumsolar brightening and horizon brightening are parts of the distribution itself, so the
 * model's F1 and F2 are 0 and nothing is added beside the distribution (no double counting; see
 * docs/method.md section 1b).
 *
 * <p>Steps with diffuse light but the sun at or below the horizon (twilight) get the uniform sky:
 * the distributions are defined for the sun above the horizon.
 */
public interface SkyDistribution extends SkyModel {

    /**
     * Relative radiance of the sky (any positive scale) as the product of a gradation, a function of
     * the sky element's zenith angle, and an indicatrix, a function of its angle to the sun: the form
     * of Perez et al. (1993) eq. 1 and of ISO 15469. {@link SkyPatches#normalised} evaluates the
     * gradation once per row of cells and the indicatrix once per cell.
     */
    interface Radiance {
        /** The gradation factor for a sky element with this cos(zenith angle), in [0, 1]. */
        double gradation(double cosZenith);

        /** The indicatrix factor for a sky element at this cos(angle to the sun), in [-1, 1]; 1 for skies without one. */
        double indicatrix(double cosToSun);
    }

    /**
     * The relative radiance of the sky during a step with diffuse light, or null for the uniform
     * sky. Called once per step when a run is set up, never per receiver.
     */
    Radiance radiance(Step step);

    /** The parts are not used: the distribution is the whole diffuse (F1 = F2 = 0). */
    @Override default double circumsolarCoefficient(Step step) { return 0; }

    @Override default double horizonCoefficient(Step step) { return 0; }

    /**
     * The step's normalised radiance per patch into {@code out} (W/m2 per unit cosine-weighted
     * share, see {@link SkyPatches#normalised}); all 0 without diffuse light. The one place where a
     * step becomes a radiance vector: the pipeline's step table and {@link PreparedSky} both call it.
     */
    default void patchRadiance(Step step, SkyPatches patches, double[] out) {
        double dhi = step.dhiWm2();
        if (!(dhi > 0)) {
            java.util.Arrays.fill(out, 0, patches.count(), 0);
            return;
        }
        var sun = step.sun().direction();
        patches.normalised(step.sun().cosZenith() > 0 ? radiance(step) : null, sun.x(), sun.y(), sun.z(), dhi, out);
    }
}
