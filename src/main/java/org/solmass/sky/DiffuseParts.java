package org.solmass.sky;

/**
 * Sky diffuse irradiance on a plane split into the parts obstruction acts on (W/m2).
 *
 * <p>For an unobstructed plane of tilt b the sky diffuse is
 * {@code backgroundPerSvf x (1 + cos b)/2 + circumsolar + horizon}. An obstructed patch uses
 * {@link #combine}: the background times the patch's sky view factor, the circumsolar part times the
 * sun's visibility (0..1), the horizon part times the visible share of the horizon band (0..1).
 *
 * <p>Signs: the circumsolar part is >= 0. The horizon part DHI F2 sin b is negative when the Perez
 * F2 is negative (horizon darkening of overcast and low-brightness skies, the first epsilon bins).
 * The background DHI (1 - F1) is slightly negative in the rare clear high-sun cases with F1 &gt; 1.
 * The sum is therefore clamped at 0 in {@link #unobstructed} and {@link #combine}; components never
 * go negative in Solmass output.
 *
 * @param backgroundPerSvf W/m2 to multiply by the plane's sky view factor (isotropic background)
 * @param circumsolar      W/m2 on the plane, to multiply by the sun's visibility
 * @param horizon          W/m2 on the plane, to multiply by the visible share of the horizon band
 */
public record DiffuseParts(double backgroundPerSvf, double circumsolar, double horizon) {

    /** No diffuse light (a step with DHI 0). */
    public static final DiffuseParts NONE = new DiffuseParts(0, 0, 0);

    /**
     * The one three-part sum of Perez et al. (1990, Solar Energy 44(5) 271-289, eq. 9) with each part
     * obstructed on its own, clamped at 0: {@code max(0, background x svf + circumsolar + horizon x
     * horizonShare)}. Every caller (the unobstructed plane, the obstructed patch, the month-hour slot
     * sums of the pipeline, the plane search) adds the parts here and nowhere else. Allocation-free,
     * for the hot loop; the order of the additions is part of the contract (results are compared
     * byte for byte).
     *
     * @param backgroundPerSvf isotropic background, per unit sky view factor
     * @param skyViewFactor    the plane's sky view factor, (1 + cos b)/2 unobstructed
     * @param circumsolar      circumsolar part on the plane, already times the sun's visibility
     * @param horizonPerShare  horizon part per unit of {@code horizonShare}
     * @param horizonShare     sin b unobstructed; sin b times the visible share of the horizon band otherwise
     */
    public static double sum(double backgroundPerSvf, double skyViewFactor, double circumsolar,
                             double horizonPerShare, double horizonShare) {
        return Math.max(0, backgroundPerSvf * skyViewFactor + circumsolar + horizonPerShare * horizonShare);
    }

    /**
     * These parts of a step per unit geometry (background per unit sky view factor, circumsolar per
     * unit circumsolar ratio, horizon per unit sin b, see {@link SkyModel#parts}) on a plane.
     *
     * @param circumsolarRatio {@link SkyModel#circumsolarRatio} of the plane
     * @param sinTilt          sin b of the plane
     */
    public DiffuseParts onPlane(double circumsolarRatio, double sinTilt) {
        return new DiffuseParts(backgroundPerSvf, circumsolar * circumsolarRatio, horizon * sinTilt);
    }

    /** Sky diffuse on the unobstructed plane of the given tilt, W/m2, >= 0. */
    public double unobstructed(double tiltDeg) {
        return combine((1 + Math.cos(Math.toRadians(tiltDeg))) / 2, 1, 1);
    }

    /**
     * Sky diffuse reaching an obstructed plane, W/m2, clamped at 0.
     *
     * @param skyViewFactor    share of the isotropic sky irradiance the plane receives, [0, (1+cos b)/2]
     * @param sunVisible       visibility of the sun from the plane, [0, 1]
     * @param horizonVisible   visible share of the horizon band, [0, 1]
     */
    public double combine(double skyViewFactor, double sunVisible, double horizonVisible) {
        return sum(backgroundPerSvf, skyViewFactor, circumsolar * sunVisible, horizon, horizonVisible);
    }
}
