package org.solmass.pv;

/**
 * Incidence-angle modifier (IAM) of a flat-plate PV module: the share of the plane-of-array
 * irradiance that the front glass passes to the cells, relative to normal incidence.
 *
 * <p>Source: N. Martin and J.M. Ruiz (2001), "Calculation of the PV modules angular losses under field
 * conditions by means of an analytical model", Solar Energy Materials &amp; Solar Cells 70, 25-38.
 * <ul>
 *   <li>Beam (their eq. for the direct component): {@code IAM_b(theta) = (1 - exp(-cos(theta)/ar)) / (1 - exp(-1/ar))},
 *       0 at and beyond 90 degrees.</li>
 *   <li>Isotropic sky diffuse on a plane of tilt beta (their closed-form approximation):
 *       {@code IAM_d = 1 - exp(-(c1 t + c2 t^2) / ar)} with
 *       {@code t = sin(beta) + (pi - beta - sin(beta)) / (1 + cos(beta))}.</li>
 *   <li>Ground-reflected (isotropic ground): the same with
 *       {@code t = sin(beta) + (beta - sin(beta)) / (1 - cos(beta))}.</li>
 *   <li>{@code c1 = 4 / (3 pi)}; {@code c2 = 0.5 ar - 0.154} (the paper's linear fit of c2 on ar; from memory).</li>
 * </ul>
 * The angular-loss coefficient {@code ar} is 0.16 for a clean module with standard (untextured, uncoated)
 * glass: the value the paper reports for typical clean c-Si modules (from memory; the paper's range for
 * clean modules is about 0.14-0.17). Dirt raises ar (more angular loss). Validity: flat glass-fronted
 * modules, tilt 0..180 degrees; the closed forms assume an isotropic sky and an isotropic ground.
 *
 * @param ar angular-loss coefficient, dimensionless, in (0, 1]
 */
public record IncidenceAngleModifier(double ar) {

    /** Clean module with standard glass: ar = 0.16 (Martin and Ruiz 2001, from memory). */
    public static final IncidenceAngleModifier STANDARD_GLASS = new IncidenceAngleModifier(0.16);

    /** c1 = 4 / (3 pi) of Martin and Ruiz (2001). */
    public static final double C1 = 4 / (3 * Math.PI);

    public IncidenceAngleModifier {
        if (!(ar > 0 && ar <= 1)) throw new IllegalArgumentException("angular-loss coefficient ar must lie in (0, 1]: " + ar);
    }

    /** c2 = 0.5 ar - 0.154 of Martin and Ruiz (2001) (from memory). */
    public double c2() { return 0.5 * ar - 0.154; }

    /**
     * Beam IAM at an angle of incidence (degrees from the module normal); 0 at 90 degrees and beyond.
     */
    public double beam(double incidenceDeg) {
        double c = Math.cos(Math.toRadians(incidenceDeg));
        if (!(c > 0)) return 0;
        return -Math.expm1(-c / ar) / -Math.expm1(-1 / ar);
    }

    /**
     * IAM of the isotropic sky diffuse on a plane tilted tiltDeg from horizontal (0..180); by symmetry
     * it equals {@link #groundReflected} at 180 - tilt ((pi - b - sin b) / (1 + cos b) is the ground
     * term at pi - b), which also gives the limit 0 for a plane facing straight down.
     */
    public double skyDiffuse(double tiltDeg) {
        return groundReflected(180 - tiltDeg);
    }

    /**
     * IAM of isotropic ground-reflected light on a plane tilted tiltDeg from horizontal (0..180);
     * the limit at tilt 0 (a plane that sees no ground) is 0.
     */
    public double groundReflected(double tiltDeg) {
        return closedForm(trigTerm(Math.toRadians(tiltDeg)));
    }

    /** sin b + (b - sin b) / (1 - cos b), with its limit at b -> 0 (series b^3/6 over b^2/2 gives b / 3). */
    static double trigTerm(double b) {
        double s = Math.sin(b);
        double oneMinusCos = 2 * Math.sin(b / 2) * Math.sin(b / 2);
        return s + (b < 1e-4 ? b / 3 : (b - s) / oneMinusCos);
    }

    private double closedForm(double t) {
        return -Math.expm1(-(C1 * t + c2() * t * t) / ar);
    }
}
