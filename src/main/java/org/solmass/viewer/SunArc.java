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

    /** The sun over each monthly-average day of a site (Klein's days), every 20 minutes while it is up. */
    public static List<SunArc> of(org.solmass.sun.Site site) {
        List<SunArc> arcs = new java.util.ArrayList<>();
        for (org.solmass.sun.SunPath.Arc a : org.solmass.sun.SunPath.averageDayArcs(site, 20)) {
            List<Point> pts = new java.util.ArrayList<>();
            for (org.solmass.sun.SunPath.ArcPoint p : a.points()) pts.add(new Point(p.localHour(), p.azimuthDeg(), p.elevationDeg()));
            arcs.add(new SunArc(a.month(), pts));
        }
        return arcs;
    }

    /**
     * @param localHour local standard time, hours (e.g. 13.5)
     * @param azimuthDeg degrees from north, clockwise
     * @param elevationDeg degrees above the horizon
     */
    public record Point(double localHour, double azimuthDeg, double elevationDeg) {}
}
