package org.solmass.sky;

import org.solmass.climate.Step;

import java.util.ArrayList;
import java.util.List;

/**
 * The CIE standard general skies (ISO 15469:2004 / CIE S 011/E:2003, "Spatial distribution of
 * daylight - CIE standard general sky"), 15 relative luminance distributions from overcast (type 1)
 * to clear (types 12 and 13) and turbid (types 14, 15), and the traditional CIE standard overcast sky
 * of Moon and Spencer (1942, "Illumination from a non-uniform sky", Illuminating Engineering 37,
 * 707-726; CIE 1955), which the standard keeps beside them. Used as the relative radiance of the sky,
 * normalised per step to DHI ({@link SkyDistribution}).
 *
 * <p>General sky, relative to the zenith: {@code L/Lz = f(chi) phi(Z) / (f(Zs) phi(0))} with the
 * gradation {@code phi(Z) = 1 + a exp(b / cos Z)} ({@code phi(90 deg) = 1}) of the element's zenith
 * angle Z and the indicatrix {@code f(chi) = 1 + c [exp(d chi) - exp(d pi/2)] + e cos^2 chi} of its
 * angle chi to the sun, Zs the solar zenith. The (a, b, c, d, e) of the 15 types (six gradation and
 * six indicatrix groups) are from the standard's Table 1, from memory.
 *
 * <p>Traditional overcast sky: {@code L/Lz = (1 + 2 cos Z)/3}, with no dependence on the sun; its
 * horizontal illuminance is {@code 7 pi Lz / 9} ({@link #OVERCAST_HORIZONTAL_PER_LZ}).
 */
public final class CieSky implements SkyDistribution {
    /** {type, a, b, c, d, e} of ISO 15469 Table 1 (from memory). */
    private static final double[][] TYPES = {
            {1, 4.0, -0.70, 0, -1.0, 0.00},
            {2, 4.0, -0.70, 2, -1.5, 0.15},
            {3, 1.1, -0.80, 0, -1.0, 0.00},
            {4, 1.1, -0.80, 2, -1.5, 0.15},
            {5, 0.0, -1.00, 0, -1.0, 0.00},
            {6, 0.0, -1.00, 2, -1.5, 0.15},
            {7, 0.0, -1.00, 5, -2.5, 0.30},
            {8, 0.0, -1.00, 10, -3.0, 0.45},
            {9, -1.0, -0.55, 2, -1.5, 0.15},
            {10, -1.0, -0.55, 5, -2.5, 0.30},
            {11, -1.0, -0.55, 10, -3.0, 0.45},
            {12, -1.0, -0.32, 10, -3.0, 0.45},
            {13, -1.0, -0.32, 16, -3.0, 0.30},
            {14, -1.0, -0.15, 16, -3.0, 0.30},
            {15, -1.0, -0.15, 24, -2.8, 0.15},
    };

    /** Horizontal illuminance of the traditional overcast sky per unit zenith luminance: 7 pi / 9. */
    public static final double OVERCAST_HORIZONTAL_PER_LZ = 7 * Math.PI / 9;

    /** The traditional CIE standard overcast sky (Moon and Spencer 1942). */
    public static final CieSky OVERCAST = new CieSky(0, 0, 0, 0, 0, 0);

    /** The 15 general skies, type 1 first. */
    public static final List<CieSky> GENERAL;

    static {
        List<CieSky> l = new ArrayList<>();
        for (double[] t : TYPES) l.add(new CieSky((int) t[0], t[1], t[2], t[3], t[4], t[5]));
        GENERAL = List.copyOf(l);
    }

    private final int type;
    private final double a, b, c, d, e;

    private CieSky(int type, double a, double b, double c, double d, double e) {
        this.type = type;
        this.a = a;
        this.b = b;
        this.c = c;
        this.d = d;
        this.e = e;
    }

    /** The general sky of a type 1..15. */
    public static CieSky type(int type) { return GENERAL.get(type - 1); }

    /** Type 1..15, or 0 for the traditional overcast sky. */
    public int typeNumber() { return type; }

    /** {a, b, c, d, e} of the type (all 0 for the traditional overcast sky). */
    public double[] parameters() { return new double[] {a, b, c, d, e}; }

    @Override public String name() { return type == 0 ? "cie-overcast" : "cie-" + type; }

    /**
     * The sky component under the traditional overcast sky, in percent, from N cosine-weighted
     * hemisphere rays (pdf cos(theta)/pi) of a plane: {@code sumRelative} = the sum of
     * {@link #overcastRelative} over the rays that reach the sky. The plane's illuminance from the sky
     * it sees is E = integral of L cos(theta) ~ (pi / N) Lz sumRelative (Monte Carlo with that pdf);
     * divided by the unobstructed horizontal plane's {@link #OVERCAST_HORIZONTAL_PER_LZ} Lz. For a
     * vertical plane this is the vertical sky component (39.6 % for an open wall: common practice).
     */
    public static double skyComponentPct(double sumRelative, int rays) {
        return 100 * Math.PI * sumRelative / (rays * OVERCAST_HORIZONTAL_PER_LZ);
    }

    /** Traditional overcast sky relative to the zenith: (1 + 2 cos Z)/3, cos Z = sin of the elevation. */
    public static double overcastRelative(double cosZenith) {
        return (1 + 2 * cosZenith) / 3;
    }

    /** Gradation phi(Z) of ISO 15469 from cos Z (phi = 1 at the horizon). */
    double gradation(double cosZ) {
        return cosZ > 0 ? 1 + a * Math.exp(b / cosZ) : 1;
    }

    /** Indicatrix f(chi) of ISO 15469, chi in radians. */
    double indicatrix(double chiRad) {
        double cc = Math.cos(chiRad);
        return 1 + c * (Math.exp(d * chiRad) - Math.exp(d * Math.PI / 2)) + e * cc * cc;
    }

    /**
     * Luminance relative to the zenith's, L/Lz, of a sky element at zenith angle {@code zenithRad}
     * and angle {@code chiRad} to the sun, with the sun at zenith angle {@code sunZenithRad}.
     */
    public double relativeToZenith(double zenithRad, double chiRad, double sunZenithRad) {
        if (type == 0) return overcastRelative(Math.cos(zenithRad));
        return indicatrix(chiRad) * gradation(Math.cos(zenithRad)) / (indicatrix(sunZenithRad) * gradation(1));
    }

    @Override
    public Radiance radiance(Step step) {
        return new Radiance() { // the constant denominator f(Zs) phi(0) cancels in the normalisation
            @Override public double gradation(double cosZenith) {
                return type == 0 ? overcastRelative(cosZenith) : CieSky.this.gradation(cosZenith);
            }

            @Override public double indicatrix(double cosToSun) {
                return type == 0 ? 1 : CieSky.this.indicatrix(Math.acos(Math.max(-1, Math.min(1, cosToSun))));
            }
        };
    }
}
