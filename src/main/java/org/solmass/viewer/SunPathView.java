package org.solmass.viewer;

import javafx.geometry.Point3D;
import javafx.scene.Group;
import javafx.scene.Node;
import javafx.scene.paint.Color;
import javafx.scene.paint.PhongMaterial;
import javafx.scene.shape.Sphere;
import javafx.scene.transform.Scale;

import java.util.ArrayList;
import java.util.List;

/**
 * The sun's monthly-average-day paths as thin rods on a dome over the site, with a bead at every
 * whole hour and faint lines joining the same hour across the months; the hour beads sit where the path crosses a whole local standard hour.
 * Rods and beads keep a fixed width on screen ({@link Built#fitTo}): the window rescales them when the
 * camera moves, so the path stays a set of thin lines whether the camera is near or far.
 */
final class SunPathView {
    static final Color ARC = Color.rgb(0x1F, 0x5F, 0x66);
    static final Color HOUR = Color.rgb(0x12, 0x3C, 0x41);

    private SunPathView() {}

    /** Radius of the dome the paths are drawn on, metres, for a model of the given radius. */
    static double domeRadiusM(double modelRadiusM) { return modelRadiusM * 1.3; }

    /** Scene point on a dome of radius r (metres) for an azimuth/elevation. */
    static Point3D onDome(double r, double azDeg, double elDeg) {
        double a = Math.toRadians(azDeg), e = Math.toRadians(elDeg);
        double east = Math.sin(a) * Math.cos(e), north = Math.cos(a) * Math.cos(e), up = Math.sin(e);
        return new Point3D(r * east, -r * up, r * north);
    }

    /** Radius on screen, pixels: arcs of June and December, the other arcs, hour lines, hour beads. */
    static final double SOLSTICE_PX = 1.9, ARC_PX = 1.1, HOUR_LINE_PX = 0.5, BEAD_PX = 3.8;

    /** A rod or bead drawn with radius 1 m and scaled to {@code radiusPx} on screen around {@code at}. */
    private record Sized(Scale scale, Point3D at, double radiusPx, boolean sphere) {}

    /** The sun path and the hour beads of its highest arc, to be labelled with their hours. */
    record Built(Group group, List<Sphere> labelBeads, List<String> labels, List<Sized> sized) {
        /**
         * Scales every rod's cross-section and every bead so that it is its set number of pixels wide
         * as seen from {@code eye} (same frame as the group) with a focal length of {@code focalPx}
         * (pixels per unit of distance at distance 1: half the view height over tan(half the field of view)).
         */
        void fitTo(Point3D eye, double focalPx) {
            for (Sized s : sized) {
                double r = s.radiusPx() * Math.max(1e-6, eye.distance(s.at())) / focalPx;
                s.scale().setX(r);
                s.scale().setZ(r);
                if (s.sphere()) s.scale().setY(r);
            }
        }
    }

    static Built build(List<SunArc> arcs, double radius) {
        Group g = new Group();
        List<Sphere> beads = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        List<Sized> sized = new ArrayList<>();
        SunArc top = null;
        double topEl = -1;
        for (SunArc a : arcs) for (SunArc.Point p : a.points()) if (p.elevationDeg() > topEl) { topEl = p.elevationDeg(); top = a; }
        double r = domeRadiusM(radius);
        PhongMaterial arcMat = new PhongMaterial(ARC);
        PhongMaterial hourMat = new PhongMaterial(HOUR);
        PhongMaterial lineMat = new PhongMaterial(ARC.deriveColor(0, 1, 1.4, 1));
        Point3D[][] hourPts = new Point3D[13][24];
        for (SunArc arc : arcs) {
            List<SunArc.Point> p = arc.points();
            boolean solstice = arc.month() == 6 || arc.month() == 12;
            double rodPx = solstice ? SOLSTICE_PX : ARC_PX;
            for (int i = 0; i + 1 < p.size(); i++) {
                SunArc.Point a = p.get(i), b = p.get(i + 1);
                g.getChildren().add(rod(onDome(r, a.azimuthDeg(), Math.max(0, a.elevationDeg())),
                        onDome(r, b.azimuthDeg(), Math.max(0, b.elevationDeg())), rodPx, arcMat, sized));
                for (int h = (int) Math.ceil(a.localHour()); h < b.localHour() || (h == b.localHour() && i + 2 == p.size()); h++) {
                    if (h < 0 || h > 23) continue;
                    double t = (h - a.localHour()) / Math.max(1e-9, b.localHour() - a.localHour());
                    Point3D pa = onDome(1, a.azimuthDeg(), a.elevationDeg()), pb = onDome(1, b.azimuthDeg(), b.elevationDeg());
                    Point3D d = pa.multiply(1 - t).add(pb.multiply(t)).normalize();
                    if (-d.getY() < 0) continue;   // below the horizon
                    Point3D q = d.multiply(r);
                    if (arc.month() >= 1 && arc.month() <= 12) hourPts[arc.month()][h] = q;
                    Sphere s = new Sphere(1, 8);
                    s.setTranslateX(q.getX());
                    s.setTranslateY(q.getY());
                    s.setTranslateZ(q.getZ());
                    Scale sc = new Scale(r * 0.012, r * 0.012, r * 0.012);
                    s.getTransforms().add(sc);
                    sized.add(new Sized(sc, q, BEAD_PX, true));
                    s.setMaterial(hourMat);
                    s.setMouseTransparent(true);
                    g.getChildren().add(s);
                    if (arc == top) {
                        beads.add(s);
                        labels.add(Integer.toString(h));
                    }
                }
            }
        }
        for (int h = 0; h < 24; h++) {
            List<Point3D> line = new ArrayList<>();
            for (int m = 1; m <= 12; m++) if (hourPts[m][h] != null) line.add(hourPts[m][h]);
            for (int i = 0; i + 1 < line.size(); i++) g.getChildren().add(rod(line.get(i), line.get(i + 1), HOUR_LINE_PX, lineMat, sized));
        }
        return new Built(g, beads, labels, sized);
    }

    /** A rod of radius 1 m from a to b whose cross-section {@link Built#fitTo} scales. */
    private static Node rod(Point3D a, Point3D b, double radiusPx, PhongMaterial m, List<Sized> sized) {
        javafx.scene.shape.Cylinder c = Shapes.rod(a, b, 1, m);
        Scale sc = new Scale(1, 1, 1);     // last in the list: applied first, across the rod's own axis (y)
        c.getTransforms().add(sc);
        sized.add(new Sized(sc, a.midpoint(b), radiusPx, false));
        return c;
    }
}
