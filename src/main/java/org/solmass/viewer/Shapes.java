package org.solmass.viewer;

import javafx.geometry.Point3D;
import javafx.scene.paint.Material;
import javafx.scene.shape.Cylinder;
import javafx.scene.transform.Rotate;

/** Small 3D helpers. */
final class Shapes {
    private Shapes() {}

    /** A thin cylinder from a to b (scene frame). */
    static Cylinder rod(Point3D a, Point3D b, double radius, Material m) {
        Point3D d = b.subtract(a);
        double len = d.magnitude();
        Cylinder c = new Cylinder(radius, Math.max(len, 1e-6), 6);
        Point3D mid = a.midpoint(b);
        c.setTranslateX(mid.getX());
        c.setTranslateY(mid.getY());
        c.setTranslateZ(mid.getZ());
        Point3D yAxis = new Point3D(0, 1, 0);
        Point3D axis = yAxis.crossProduct(d);
        double ang = Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, d.normalize().dotProduct(yAxis)))));
        if (axis.magnitude() > 1e-9) c.getTransforms().add(new Rotate(ang, axis));
        c.setMaterial(m);
        c.setMouseTransparent(true);
        return c;
    }
}
