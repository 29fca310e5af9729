package org.solmass.viewer;

import javafx.beans.property.DoubleProperty;
import javafx.beans.property.SimpleDoubleProperty;
import javafx.geometry.Point3D;
import javafx.scene.Group;
import javafx.scene.PerspectiveCamera;
import javafx.scene.SubScene;
import javafx.scene.input.MouseButton;
import javafx.scene.transform.Rotate;
import javafx.scene.transform.Translate;

/**
 * An orbit camera around a target point: left drag orbits, right or middle drag pans, the wheel
 * zooms. Heading is the compass direction the camera looks towards (0 = looking north, 90 = east);
 * pitch is how far it looks down (0 = level, 90 = straight down).
 */
public final class CameraRig {
    private final PerspectiveCamera camera = new PerspectiveCamera(true);
    private final Group rig = new Group();
    private final Translate target = new Translate();
    private final Rotate yaw = new Rotate(0, Rotate.Y_AXIS);
    private final Rotate pitch = new Rotate(0, Rotate.X_AXIS);
    private final Translate back = new Translate();
    private final DoubleProperty heading = new SimpleDoubleProperty();
    private final javafx.beans.property.IntegerProperty moves = new javafx.beans.property.SimpleIntegerProperty();
    private final double radius;
    private final double[] focus, siteFocus;
    private double lastX, lastY;

    /**
     * @param siteRadiusM half the diagonal of the whole model, metres (zoom limits, clipping)
     * @param focus {x, y, z, radius} in the scene frame of what the fixed views and "analysed" frame
     * @param siteFocus the same for the whole model with its context, what the first 3D view frames
     */
    public CameraRig(double siteRadiusM, double[] focus, double[] siteFocus) {
        this.radius = siteRadiusM;
        this.focus = focus.clone();
        this.siteFocus = siteFocus.clone();
        camera.setFieldOfView(30);
        rig.getChildren().add(camera);
        camera.getTransforms().addAll(target, yaw, pitch, back);
        preset("orbit");
    }

    /** Distance at which a sphere of the focus radius fills the view height with a margin. */
    private double fit(double margin) {
        return fit(margin, focus);
    }

    private double fit(double margin, double[] sphere) {
        return margin * sphere[3] / Math.sin(Math.toRadians(camera.getFieldOfView() / 2));
    }

    public PerspectiveCamera camera() { return camera; }

    public Group node() { return rig; }

    /** Counts camera changes (for overlays that follow the view). */
    public javafx.beans.property.ReadOnlyIntegerProperty movesProperty() { return moves; }

    /** Heading in degrees from north, clockwise (for the north arrow). */
    public DoubleProperty headingProperty() { return heading; }

    /**
     * @param headingDeg compass direction looked towards, degrees from north clockwise
     * @param pitchDeg downward look, degrees (0 level .. 90 from above)
     * @param distance distance from the target, metres
     */
    public void setView(double headingDeg, double pitchDeg, double distance) {
        yaw.setAngle(headingDeg);
        pitch.setAngle(-Math.max(-5, Math.min(90, pitchDeg)));
        back.setZ(-distance);
        heading.set(headingDeg);
        clip();
        moves.set(moves.get() + 1);
    }

    /**
     * Fixed views: "orbit" (the first view: the whole model with its context, from the south-west and
     * above), "analysed" (the same direction, framing the analysed patches), "top" or the side looked
     * from, "N", "E", "S", "W" (framing the analysed patches).
     */
    public void preset(String which) {
        if (which.equals("orbit")) {
            target.setX(siteFocus[0]);
            target.setY(siteFocus[1]);
            target.setZ(siteFocus[2]);
            setView(30, 38, fit(1.05, siteFocus));
            return;
        }
        target.setX(focus[0]);
        target.setY(focus[1]);
        target.setZ(focus[2]);
        switch (which) {
            case "top": setView(0, 90, fit(1.2)); break;
            case "N": setView(180, 10, fit(1.2)); break;
            case "E": setView(270, 10, fit(1.2)); break;
            case "S": setView(0, 10, fit(1.2)); break;
            case "W": setView(90, 10, fit(1.2)); break;
            case "sun":
                target.setY(-0.3 * 1.3 * radius);
                setView(165, 24, 1.3 * radius * 1.3 / Math.sin(Math.toRadians(camera.getFieldOfView() / 2)));
                break;
            default: setView(30, 38, fit(1.3)); break;   // "analysed"
        }
    }

    public double headingDeg() { return yaw.getAngle(); }

    /** The camera's position in the frame of the rig's parent (the scene frame of the model). */
    public Point3D eye() { return camera.localToParent(0, 0, 0); }

    /** Pixels per metre at one metre's distance for a view {@code heightPx} high (the camera's field of view is vertical). */
    public double focalPx(double heightPx) { return heightPx / 2 / Math.tan(Math.toRadians(camera.getFieldOfView() / 2)); }

    public double pitchDeg() { return -pitch.getAngle(); }

    public double distance() { return -back.getZ(); }

    private void clip() {
        double d = distance();
        camera.setNearClip(Math.max(0.05, d * 0.02));
        camera.setFarClip(d + 20 * radius);
    }

    /** Connects mouse handling to a sub-scene. */
    public void attach(SubScene s) {
        s.setOnMousePressed(e -> {
            lastX = e.getSceneX();
            lastY = e.getSceneY();
        });
        s.setOnMouseDragged(e -> {
            double dx = e.getSceneX() - lastX, dy = e.getSceneY() - lastY;
            lastX = e.getSceneX();
            lastY = e.getSceneY();
            if (e.getButton() == MouseButton.PRIMARY) {
                setView(headingDeg() + dx * 0.3, pitchDeg() + dy * 0.3, distance());
            } else {
                pan(dx, dy, s.getHeight());
            }
        });
        s.setOnScroll(e -> {
            double f = Math.pow(1.0015, -e.getDeltaY());
            setView(headingDeg(), pitchDeg(), Math.max(0.2 * radius, Math.min(20 * radius, distance() * f)));
        });
    }

    private void pan(double dx, double dy, double viewHeight) {
        double metresPerPixel = 2 * distance() * Math.tan(Math.toRadians(camera.getFieldOfView() / 2)) / Math.max(1, viewHeight);
        double h = Math.toRadians(headingDeg()), p = Math.toRadians(pitchDeg());
        // camera right and up vectors in the scene frame (x right/east, y down, z north at heading 0)
        double rx = Math.cos(h), rz = -Math.sin(h);
        double ux = Math.sin(h) * Math.sin(p), uy = -Math.cos(p), uz = Math.cos(h) * Math.sin(p);
        double mx = -dx * metresPerPixel, my = dy * metresPerPixel;
        target.setX(target.getX() + rx * mx + ux * my);
        target.setY(target.getY() + uy * my);
        target.setZ(target.getZ() + rz * mx + uz * my);
        setView(headingDeg(), pitchDeg(), distance());   // counts the move
    }
}
