package org.solmass.viewer;

import java.util.List;

/**
 * The sun's path on one monthly-average day, above the horizon.
 *
 * @param month 1..12
 * @param points positions in order of time
 */
public record SunArc(int month, List<Point> points) {
    public SunArc {
        points = List.copyOf(points);
    }

    /**
     * @param localHour local standard time, hours (e.g. 13.5)
     * @param azimuthDeg degrees from north, clockwise
     * @param elevationDeg degrees above the horizon
     */
    public record Point(double localHour, double azimuthDeg, double elevationDeg) {}
}
