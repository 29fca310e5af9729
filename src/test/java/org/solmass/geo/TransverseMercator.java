package org.solmass.geo;

/**
 * An independent inverse Transverse Mercator for the tests: the series of Snyder, J. P. (1987),
 * Map Projections: A Working Manual, USGS Professional Paper 1395, pp. 63-64, eqs. (8-17) to (8-25)
 * with (3-24), (3-26) and (7-19) for the footpoint latitude; and the meridian convergence of the
 * ellipsoid as the series in longitude difference (from memory: gamma = l sin(phi) [1 + l^2 cos^2(phi)
 * (1 + 3 eta^2 + 2 eta^4) / 3 + l^4 cos^4(phi) (2 - tan^2(phi)) / 15], the form of Redfearn, J. C. B.
 * (1948), Survey Review 9(69):318-322), cross-checked in the test against the sphere's closed form
 * tan(gamma) = tan(l) sin(phi) (from memory; Snyder 1987 discusses it with the spherical TM).
 */
final class TransverseMercator {
    /** WGS84 semi-major axis, metres, and flattening (NIMA TR8350.2, 2000, table 3.1). */
    static final double A = 6378137.0, F = 1 / 298.257223563;
    static final double E2 = 2 * F - F * F, EP2 = E2 / (1 - E2);
    /** UTM scale factor on the central meridian and false easting (common practice: the UTM definition). */
    static final double K0 = 0.9996, FALSE_EASTING = 500000.0;

    private TransverseMercator() {}

    /** {latitude, longitude} in degrees of a UTM point (northern hemisphere) of a zone with central meridian lon0. */
    static double[] inverseUtm(double easting, double northing, double lon0Deg) {
        double x = easting - FALSE_EASTING, y = northing;
        double m = y / K0;                                                               // (8-20), M0 = 0
        double mu = m / (A * (1 - E2 / 4 - 3 * E2 * E2 / 64 - 5 * E2 * E2 * E2 / 256)); // (7-19)
        double s = Math.sqrt(1 - E2);
        double e1 = (1 - s) / (1 + s);                                                   // (3-24)
        double phi1 = mu + (3 * e1 / 2 - 27 * Math.pow(e1, 3) / 32) * Math.sin(2 * mu)   // (3-26)
                + (21 * e1 * e1 / 16 - 55 * Math.pow(e1, 4) / 32) * Math.sin(4 * mu)
                + (151 * Math.pow(e1, 3) / 96) * Math.sin(6 * mu)
                + (1097 * Math.pow(e1, 4) / 512) * Math.sin(8 * mu);
        double sin = Math.sin(phi1), cos = Math.cos(phi1), tan = Math.tan(phi1);
        double c1 = EP2 * cos * cos;                                                     // (8-21)
        double t1 = tan * tan;                                                           // (8-22)
        double n1 = A / Math.sqrt(1 - E2 * sin * sin);                                   // (8-23)
        double r1 = A * (1 - E2) / Math.pow(1 - E2 * sin * sin, 1.5);                    // (8-24)
        double d = x / (n1 * K0);                                                        // (8-25)
        double phi = phi1 - (n1 * tan / r1) * (d * d / 2                                 // (8-17)
                - (5 + 3 * t1 + 10 * c1 - 4 * c1 * c1 - 9 * EP2) * Math.pow(d, 4) / 24
                + (61 + 90 * t1 + 298 * c1 + 45 * t1 * t1 - 252 * EP2 - 3 * c1 * c1) * Math.pow(d, 6) / 720);
        double lam = (d - (1 + 2 * t1 + c1) * Math.pow(d, 3) / 6                         // (8-18)
                + (5 - 2 * c1 + 28 * t1 - 3 * c1 * c1 + 8 * EP2 + 24 * t1 * t1) * Math.pow(d, 5) / 120) / cos;
        return new double[]{Math.toDegrees(phi), lon0Deg + Math.toDegrees(lam)};
    }

    /** Meridian convergence gamma on the ellipsoid, degrees, positive east of the central meridian (north). */
    static double convergenceDeg(double latDeg, double lonDeg, double lon0Deg) {
        double phi = Math.toRadians(latDeg), l = Math.toRadians(lonDeg - lon0Deg);
        double c = Math.cos(phi), t = Math.tan(phi), eta2 = EP2 * c * c;
        double g = l * Math.sin(phi) * (1 + l * l * c * c * (1 + 3 * eta2 + 2 * eta2 * eta2) / 3
                + Math.pow(l, 4) * Math.pow(c, 4) * (2 - t * t) / 15);
        return Math.toDegrees(g);
    }

    /** The sphere's closed form, tan(gamma) = tan(l) sin(phi), degrees. */
    static double sphereConvergenceDeg(double latDeg, double lonDeg, double lon0Deg) {
        return Math.toDegrees(Math.atan(Math.tan(Math.toRadians(lonDeg - lon0Deg)) * Math.sin(Math.toRadians(latDeg))));
    }
}
