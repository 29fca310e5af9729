package org.solmass.climate;

/**
 * Clear-sky irradiance: beam transmittance of Hottel (1976, Solar Energy 18(2) 129-134) for the 1962
 * US standard atmosphere with 23 km visibility, diffuse by Liu &amp; Jordan (1960) tau_d = 0.271 -
 * 0.294 tau_b, both as in Duffie &amp; Beckman (2013) eqs. 2.8.1, 2.8.2 (and Table 2.8.1 for the
 * climate-type corrections) and eq. 2.8.5. Valid for site altitudes below 2.5 km (clamped to 2.5 km
 * above). Climate type: tropical within 23.45 deg of the equator; otherwise mid-latitude summer in
 * the local summer half (Apr-Sep in the north, Oct-Mar in the south), subarctic summer instead above
 * 60 deg, and mid-latitude winter in the winter half.
 */
public final class ClearSky {
    private final double a0, a1, k;

    /** Climate types of Hottel's corrections r0, r1, rk (Duffie &amp; Beckman 2013 Table 2.8.1). */
    public enum Type {
        TROPICAL(0.95, 0.98, 1.02), MIDLATITUDE_SUMMER(0.97, 0.99, 1.02),
        SUBARCTIC_SUMMER(0.99, 0.99, 1.01), MIDLATITUDE_WINTER(1.03, 1.01, 1.00);
        final double r0, r1, rk;
        Type(double r0, double r1, double rk) { this.r0 = r0; this.r1 = r1; this.rk = rk; }
    }

    public ClearSky(double altitudeKm, Type type) {
        double a = Math.max(0, Math.min(2.5, altitudeKm));
        a0 = type.r0 * (0.4237 - 0.00821 * (6 - a) * (6 - a));
        a1 = type.r1 * (0.5055 + 0.00595 * (6.5 - a) * (6.5 - a));
        k = type.rk * (0.2711 + 0.01858 * (2.5 - a) * (2.5 - a));
    }

    /** The climate type for a latitude (degrees) and month (1..12), as described above. */
    public static Type typeFor(double latitudeDeg, int month) {
        if (Math.abs(latitudeDeg) <= 23.45) return Type.TROPICAL;
        boolean northSummer = month >= 4 && month <= 9;
        boolean summer = latitudeDeg >= 0 ? northSummer : !northSummer;
        if (!summer) return Type.MIDLATITUDE_WINTER;
        return Math.abs(latitudeDeg) >= 60 ? Type.SUBARCTIC_SUMMER : Type.MIDLATITUDE_SUMMER;
    }

    /** Beam transmittance tau_b = a0 + a1 exp(-k / cos z); 0 for the sun at or below the horizon. */
    public double beamTransmittance(double cosZenith) {
        if (cosZenith <= 0) return 0;
        return a0 + a1 * Math.exp(-k / cosZenith);
    }

    /** Diffuse transmittance tau_d = 0.271 - 0.294 tau_b (Liu &amp; Jordan 1960). */
    public static double diffuseTransmittance(double beamTransmittance) {
        return 0.271 - 0.294 * beamTransmittance;
    }
}
