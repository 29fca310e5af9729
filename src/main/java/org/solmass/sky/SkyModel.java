package org.solmass.sky;

import org.solmass.climate.Step;
import org.solmass.sun.SunPosition;

/**
 * A sky diffuse model in the three-part form of Perez et al. (1990, Solar Energy 44(5) 271-289,
 * eq. 9): on a plane of tilt b, Id,T = DHI [(1 - F1)(1 + cos b)/2 + F1 a/b' + F2 sin b], with the
 * circumsolar brightening F1 and the horizon brightening F2 of the step. The isotropic model of Liu
 * &amp; Jordan (1963) is the case F1 = F2 = 0.
 *
 * <p><b>Circumsolar ratio and low-sun guard.</b> a/b' is the beam ratio cos(incidence)/cos(zenith)
 * capped at 1/cos(85 deg) = 11.47 and 0 with the sun behind the plane. Perez et al. write it as
 * max(0, cos theta)/max(cos 85, cos z); the two are equal while the sun is more than 5 deg high.
 * Capping the ratio instead of the denominator keeps the ratio exactly 1 on a horizontal plane, so an
 * unobstructed horizontal plane receives exactly DHI at every sun height.
 */
public interface SkyModel {
    /** cos(85 deg): the Perez et al. (1990) low-sun limit of the circumsolar ratio. */
    double COS_85 = Math.cos(Math.toRadians(85));

    String name();

    /** Circumsolar brightening coefficient F1 of a step (0 for the isotropic sky). */
    double circumsolarCoefficient(Step step);

    /** Horizon brightening coefficient F2 of a step (0 for the isotropic sky). */
    double horizonCoefficient(Step step);

    /** Circumsolar (beam-like) ratio: cosIncidence / cosZenith capped at 1/cos 85, 0 behind the plane. */
    static double circumsolarRatio(double cosIncidence, double cosZenith) {
        if (cosIncidence <= 0) return 0;
        if (cosZenith <= cosIncidence * COS_85) return 1 / COS_85;
        return cosIncidence / cosZenith;
    }

    /**
     * The step's sky diffuse split into its three parts per unit of the geometry each part scales
     * with (W/m2): the isotropic background DHI (1 - F1) per unit sky view factor, the circumsolar
     * part DHI F1 per unit {@link #circumsolarRatio}, the horizon part DHI F2 per unit sin b
     * (Perez et al. 1990, eq. 9). {@link DiffuseParts#NONE} without diffuse light. The one place
     * where a step becomes parts: the pipeline's step table and {@link #diffuse} both call it.
     */
    default DiffuseParts parts(Step step) {
        double dhi = step.dhiWm2();
        if (dhi <= 0) return DiffuseParts.NONE;
        double f1 = circumsolarCoefficient(step), f2 = horizonCoefficient(step);
        return new DiffuseParts(dhi * (1 - f1), dhi * f1, dhi * f2);
    }

    /** The diffuse parts of a step on an unobstructed plane of tilt and surface azimuth (degrees). */
    default DiffuseParts diffuse(Step step, double tiltDeg, double surfaceAzimuthDeg) {
        SunPosition sun = step.sun();
        double r = circumsolarRatio(sun.cosIncidence(tiltDeg, surfaceAzimuthDeg), sun.cosZenith());
        return parts(step).onPlane(r, Math.sin(Math.toRadians(tiltDeg)));
    }
}
