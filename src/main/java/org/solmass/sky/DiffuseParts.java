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
        return Math.max(0, backgroundPerSvf * skyViewFactor + circumsolar * sunVisible + horizon * horizonVisible);
    }
}
