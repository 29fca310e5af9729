package org.solmass.sun;

import org.solmass.model.Vec3;

/**
 * Apparent (topocentric, refraction-corrected where stated) position of the sun's centre.
 *
 * @param azimuthDeg degrees from geographic north, clockwise (east = 90)
 * @param zenithDeg  degrees from the local vertical downwards (horizon = 90; above 90 below horizon)
 */
public record SunPosition(double azimuthDeg, double zenithDeg) {

    /** Elevation above the horizon, degrees (90 - zenith). */
    public double elevationDeg() { return 90.0 - zenithDeg; }

    public double cosZenith() { return Math.cos(Math.toRadians(zenithDeg)); }

    /** Unit vector towards the sun: x east, y north, z up. */
    public Vec3 direction() { return Vec3.fromAzimuthElevation(azimuthDeg, elevationDeg()); }

    /**
     * Cosine of the angle of incidence of the beam on a plane, cos(theta) = n . s, with the plane's
     * outward normal n = (sin b sin g, sin b cos g, cos b) for tilt b from horizontal and surface
     * azimuth g (from north clockwise, the direction the plane faces). Equivalent to Duffie &amp;
     * Beckman (2013) eq. 1.6.5 (cos theta = cos z cos b + sin z sin b cos(gamma_s - gamma)).
     * Negative when the sun is behind the plane.
     */
    public double cosIncidence(double tiltDeg, double surfaceAzimuthDeg) {
        double b = Math.toRadians(tiltDeg), z = Math.toRadians(zenithDeg);
        double dAz = Math.toRadians(azimuthDeg - surfaceAzimuthDeg);
        return Math.cos(z) * Math.cos(b) + Math.sin(z) * Math.sin(b) * Math.cos(dAz);
    }

    /** Angle of incidence on the plane, degrees in [0, 180] (above 90: sun behind the plane). */
    public double incidenceDeg(double tiltDeg, double surfaceAzimuthDeg) {
        double c = Math.max(-1, Math.min(1, cosIncidence(tiltDeg, surfaceAzimuthDeg)));
        return Math.toDegrees(Math.acos(c));
    }

    /** Outward unit normal of a plane of given tilt and surface azimuth (x east, y north, z up). */
    public static Vec3 planeNormal(double tiltDeg, double surfaceAzimuthDeg) {
        double b = Math.toRadians(tiltDeg), g = Math.toRadians(surfaceAzimuthDeg);
        return new Vec3(Math.sin(b) * Math.sin(g), Math.sin(b) * Math.cos(g), Math.cos(b));
    }
}
