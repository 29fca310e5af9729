package org.solmass.viewer;

import javafx.geometry.Point3D;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** The model-to-scene conventions (x east, y north, z up; azimuth from north clockwise: common practice). */
class SceneFrameTest {
    private static final double E = 1e-12;

    @Test
    void sunPathInsetDrawsNorthUpEastRightAndTheZenithAtTheCentre() {
        // a plan's orientation (common practice for sun-path charts): north up, east right
        double[] n = SunInset.xy(0, 0, 100, 100, 80), e = SunInset.xy(90, 0, 100, 100, 80),
                s = SunInset.xy(180, 0, 100, 100, 80), z = SunInset.xy(123, 90, 100, 100, 80), h = SunInset.xy(180, 45, 100, 100, 80);
        assertEquals(100, n[0], 1e-9);
        assertEquals(20, n[1], 1e-9);    // screen y grows downwards: north is up
        assertEquals(180, e[0], 1e-9);
        assertEquals(180, s[1], 1e-9);
        assertEquals(100, z[0], 1e-9);
        assertEquals(100, z[1], 1e-9);
        assertEquals(140, h[1], 1e-9);   // equidistant: 45 deg up is half way to the rim
    }

    @Test
    void modelPointsMapOntoTheSameAxesAsSunDirections() {
        SceneFrame f = SceneFrame.of(new double[] {500_000, 5_300_000, 20, 500_100, 5_300_080, 50});
        // centre of a map-coordinate site goes to the origin, ground level to y = 0, precision kept
        assertEquals(0, f.fx(500_050), 0);
        assertEquals(0, f.fz(5_300_040), 0);
        assertEquals(0, f.fy(20), 0);
        assertEquals(0.01f, f.fx(500_050.01), 1e-4);
        // 10 m north, 10 m east, 10 m up
        assertEquals(10, f.fz(5_300_050), 1e-6);
        assertEquals(10, f.fx(500_060), 1e-6);
        assertEquals(-10, f.fy(30), 1e-6);
    }

    @Test
    void theSceneMappingIsARotationNotAMirror() {
        // east x north = up in the model; the images (+x) x (+z) must equal the image of up (-y)
        Point3D east = new Point3D(1, 0, 0), north = new Point3D(0, 0, 1);
        assertPoint(new Point3D(0, -1, 0), east.crossProduct(north));
    }

    private static void assertPoint(Point3D expected, Point3D actual) {
        assertEquals(expected.getX(), actual.getX(), E);
        assertEquals(expected.getY(), actual.getY(), E);
        assertEquals(expected.getZ(), actual.getZ(), E);
    }

    /** The first view frames a sphere that holds every vertex of the model (context blocks included). */
    @Test
    void firstViewSphereHoldsEveryVertexOfTheModel() {
        ViewerData d = SyntheticViewerData.courtyard();
        SceneFrame f = SceneFrame.of(d.model().bounds());
        double[] s = ModelView3D.sphere(d.model().bounds(), f), a = ModelView3D.focus(d, f);
        double[] v = d.model().vertices();
        for (int i = 0; i < v.length; i += 3) {
            double dx = f.fx(v[i]) - s[0], dy = f.fy(v[i + 2]) - s[1], dz = f.fz(v[i + 1]) - s[2];
            assertEquals(true, Math.sqrt(dx * dx + dy * dy + dz * dz) <= s[3] + 1e-3, "vertex " + i / 3 + " outside the first view's sphere");
        }
        assertEquals(true, s[3] >= a[3], "the whole model is at least as large as its analysed part");
    }
}
