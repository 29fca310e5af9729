package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.solmass.model.MassingModel;
import org.solmass.model.SemanticKind;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * A kind the file declares (CityGML's RoofSurface, WallSurface, ...) is kept instead of the
 * classification by normal (SurfaceClassifier's 10 deg facade band, a choice of common practice).
 */
class DeclaredKindTest {
    /** Two coplanar triangles of a plane tilted 85 deg (a mansard's steep roof), side by side. */
    static MassingModel steepPlane(SemanticKind a, SemanticKind b) {
        double t = Math.toRadians(85);
        double dz = Math.sin(t), dy = Math.cos(t);   // up the slope, 1 m
        double[] v = {0, 0, 0, 1, 0, 0, 1, dy, dz, 0, dy, dz};
        int[] tri = {0, 1, 2, 0, 2, 3};
        byte[] kinds = a == null ? null : new byte[]{a.code(), b.code()};
        return new MassingModel(null, List.of("mansard"), List.of(), v, tri, new int[]{0, 0}, new int[]{-1, -1},
                new int[]{1, 1}, 0, kinds);
    }

    @Test
    void steepPlaneIsAFacadeByItsNormal() {
        List<Surface> s = SurfaceBuilder.build(steepPlane(null, null));
        assertEquals(1, s.size());
        assertEquals(SurfaceKind.FACADE, s.get(0).kind());
    }

    @Test
    void steepPlaneDeclaredRoofStaysRoof() {
        List<Surface> s = SurfaceBuilder.build(steepPlane(SemanticKind.ROOF, SemanticKind.ROOF));
        assertEquals(1, s.size());
        assertEquals(SurfaceKind.ROOF, s.get(0).kind());
        assertEquals(85.0, s.get(0).tiltDeg(), 1e-9);
    }

    @Test
    void coplanarTrianglesDeclaredDifferentKindsAreSeparateSurfaces() {
        List<Surface> s = SurfaceBuilder.build(steepPlane(SemanticKind.ROOF, SemanticKind.WALL));
        assertEquals(2, s.size());
        assertEquals(SurfaceKind.ROOF, s.get(0).kind());
        assertEquals(SurfaceKind.FACADE, s.get(1).kind());
    }
}
