package org.solmass.pv;

/**
 * Plane-of-array irradiance on one module (or a group of modules that share it) for one time step,
 * as the ray engine measures it: the parts the incidence-angle modifier treats differently, per
 * bypass-diode substring, with the site's obstructions applied, and the same plane's irradiance with
 * no obstruction (for the shading loss and the reference yield).
 *
 * <p>All irradiances are interval averages in W/m2 on the module plane. Circumsolar diffuse belongs
 * with the beam (it arrives from near the sun's direction and takes the beam's incidence angle; common
 * practice). Arrays have one entry per substring, all of the same length (1 for a module treated as
 * uniformly lit); the arrays are not copied, do not change them after passing them in.
 *
 * @param beamWm2         beam (and circumsolar) irradiance per substring, W/m2, after obstruction
 * @param skyWm2          sky diffuse (isotropic and horizon parts) per substring, W/m2, after obstruction
 * @param reflectedWm2    light reflected by the ground and other surfaces per substring, W/m2
 * @param unobstructedWm2 total irradiance the same plane would get with no obstruction, W/m2 (module
 *                        mean); light reflected by the site's surfaces can make the obstructed mean
 *                        larger, and the shading loss is then negative (a gain)
 * @param incidenceDeg    angle between the sun and the module normal, degrees (beam incidence)
 * @param tiltDeg         module tilt from horizontal, degrees, 0..180
 */
public record ModuleIrradiance(double[] beamWm2, double[] skyWm2, double[] reflectedWm2,
                               double unobstructedWm2, double incidenceDeg, double tiltDeg) {

    public ModuleIrradiance {
        int n = beamWm2.length;
        if (n == 0 || skyWm2.length != n || reflectedWm2.length != n)
            throw new IllegalArgumentException("beam, sky and reflected need one value per substring, the same count: "
                    + n + ", " + skyWm2.length + ", " + reflectedWm2.length);
        if (!(tiltDeg >= 0 && tiltDeg <= 180)) throw new IllegalArgumentException("tilt must lie in 0..180 degrees: " + tiltDeg);
        if (Double.isNaN(unobstructedWm2) || Double.isNaN(incidenceDeg)) throw new IllegalArgumentException("unobstructed irradiance and incidence must be numbers");
    }

    /** A uniformly lit module (one value for the whole module). */
    public static ModuleIrradiance uniform(double beamWm2, double skyWm2, double reflectedWm2, double unobstructedWm2,
                                           double incidenceDeg, double tiltDeg) {
        return new ModuleIrradiance(new double[] {beamWm2}, new double[] {skyWm2}, new double[] {reflectedWm2},
                unobstructedWm2, incidenceDeg, tiltDeg);
    }

    /** Number of substrings given. */
    public int substrings() { return beamWm2.length; }

    /** Mean total irradiance over the substrings after obstruction (beam + sky + reflected), W/m2. */
    public double obstructedMeanWm2() {
        return obstructedMeanWm2(beamWm2, skyWm2, reflectedWm2);
    }

    /** {@link #obstructedMeanWm2()} of per-substring arrays of equal length. */
    static double obstructedMeanWm2(double[] beam, double[] sky, double[] reflected) {
        double s = 0;
        for (int i = 0; i < beam.length; i++) s += beam[i] + sky[i] + reflected[i];
        return s / beam.length;
    }
}
