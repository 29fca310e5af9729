package org.solmass.scene;

/**
 * Cosine-weighted view factors of one patch's hemisphere (dimensionless, each in [0,1], summing
 * to 1): the fraction of the diffuse radiation leaving the patch that would reach the sky, the
 * ground and obstructing blocks (view factor definition: Modest, Radiative Heat Transfer, 3rd ed.,
 * 2013, eq. 4.9; estimated by cosine-weighted Monte Carlo, see {@link SkyViewCalculator}).
 *
 * @param sky sky view factor (SVF): rays escaping above the horizon
 * @param ground ground view factor: rays reaching the ground plane, a ground-flagged triangle, or
 *               escaping below the horizon
 * @param obstruction obstruction view factor: rays hitting a (non-ground) block triangle
 * @param skyStdError estimated standard error of {@code sky} (collapsed-strata estimator; 0 when
 *                    every ray agrees)
 */
public record ViewFactors(double sky, double ground, double obstruction, double skyStdError) {
}
