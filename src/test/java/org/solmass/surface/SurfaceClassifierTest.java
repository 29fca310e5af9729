package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;

import static org.junit.jupiter.api.Assertions.*;

class SurfaceClassifierTest {

    private static Vec3 tilted(double tiltDeg, double azimuthDeg) {
        return Vec3.fromAzimuthElevation(azimuthDeg, 90 - tiltDeg);
    }

    @Test
    void thresholdsAreTenDegreesAroundVertical() {
        assertEquals(SurfaceKind.FACADE, SurfaceClassifier.classify(tilted(90, 0), 10, 0));
        assertEquals(SurfaceKind.FACADE, SurfaceClassifier.classify(tilted(81, 0), 10, 0));
        assertEquals(SurfaceKind.FACADE, SurfaceClassifier.classify(tilted(99, 0), 10, 0));
        assertEquals(SurfaceKind.ROOF, SurfaceClassifier.classify(tilted(79, 0), 10, 0)); // steep roof
        assertEquals(SurfaceKind.ROOF, SurfaceClassifier.classify(tilted(35, 180), 10, 0)); // sloped roof
        assertEquals(SurfaceKind.UNDERSIDE, SurfaceClassifier.classify(tilted(101, 0), 10, 0));
        assertEquals(SurfaceKind.UNDERSIDE, SurfaceClassifier.classify(new Vec3(0, 0, -1), 10, 0));
    }

    @Test
    void upFacingAtGroundLevelIsGround() {
        assertEquals(SurfaceKind.GROUND, SurfaceClassifier.classify(Vec3.UP, 2.05, 2.0));
        assertEquals(SurfaceKind.ROOF, SurfaceClassifier.classify(Vec3.UP, 2.2, 2.0));
    }

    @Test
    void tiltAndAzimuthOfKnownOrientations() {
        // azimuth from north clockwise (common practice); south-facing facade: 180 deg, tilt 90
        assertEquals(180, SurfaceClassifier.azimuthDeg(new Vec3(0, -1, 0)), 1e-12);
        assertEquals(90, SurfaceClassifier.tiltDeg(new Vec3(0, -1, 0)), 1e-12);
        assertEquals(90, SurfaceClassifier.azimuthDeg(new Vec3(1, 0, 0)), 1e-12);
        assertEquals(270, SurfaceClassifier.azimuthDeg(new Vec3(-1, 0, 0)), 1e-12);
        assertEquals(0, SurfaceClassifier.azimuthDeg(new Vec3(0, 1, 0)), 1e-12);
        assertEquals(0, SurfaceClassifier.azimuthDeg(Vec3.UP), 0);
        assertEquals(0, SurfaceClassifier.tiltDeg(Vec3.UP), 0);
        assertEquals(180, SurfaceClassifier.tiltDeg(new Vec3(0, 0, -1)), 0);
        Vec3 sw = tilted(30, 225);
        assertEquals(30, SurfaceClassifier.tiltDeg(sw), 1e-9);
        assertEquals(225, SurfaceClassifier.azimuthDeg(sw), 1e-9);
    }
}
