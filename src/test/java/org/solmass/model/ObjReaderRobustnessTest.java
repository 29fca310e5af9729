package org.solmass.model;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * What the reader does with stray vertices, coordinates out of range and self-intersecting faces.
 * Geometry of the fixtures: the 10 m box [0,10]^3 of {@link OrientationTest} (invented).
 */
class ObjReaderRobustnessTest {
    static final String BOX = OrientationTest.box("box", 0, 10, 0, OrientationTest.all(false), true);

    static ObjReader.Result read(String obj) { return ObjReader.parse(obj, "t.obj", ModelOptions.defaults()); }

    @Test
    void aFarVertexThatNoFaceUsesChangesNoBoundsAndIsReported() {
        ObjReader.Result r = read(BOX + "v 1e7 0 0\n");
        assertArrayEquals(new double[]{0, 0, 0, 10, 10, 10}, r.model().bounds(), 0);
        assertEquals(8, r.model().vertexCount(), "the stray vertex is not kept");
        assertEquals(List.of("t.obj:16: 1 vertex(es) that no face uses lie outside the faces' bounding box"
                + " (the first on this line); ignored"), r.warnings());
    }

    @Test
    void aLowVertexThatNoFaceUsesDoesNotSinkTheGroundLevel() {
        ObjReader.Result r = read("v 0 0 -50\n" + shifted(BOX, 1));
        assertEquals(0, r.model().minZ(), 0, "the box stands on z = 0");
        assertEquals(8, r.model().vertexCount());
        assertEquals(1, r.warnings().size(), r.warnings().toString());
    }

    /** The box text with every face index raised by {@code k} (k vertices written before it). */
    static String shifted(String obj, int k) {
        StringBuilder b = new StringBuilder();
        for (String line : obj.split("\n")) {
            if (line.startsWith("f ")) {
                b.append('f');
                for (String s : line.substring(2).trim().split(" ")) b.append(' ').append(Integer.parseInt(s) + k);
            } else {
                b.append(line);
            }
            b.append('\n');
        }
        return b.toString();
    }

    @Test
    void boundsOfASyntheticModelComeFromTheVerticesItsTrianglesUse() {
        MassingModel m = new MassingModel(null, List.of("b"), List.of(),
                new double[]{0, 0, 0, 1, 0, 0, 0, 1, 0, 1e7, -5, -50}, new int[]{0, 1, 2},
                new int[]{0}, new int[]{-1}, new int[]{0}, 0);
        assertArrayEquals(new double[]{0, 0, 0, 1, 1, 0}, m.bounds(), 0);
        assertEquals(0, m.minZ(), 0);
    }

    @Test
    void aCoordinateBeyondTheSupportedRangeIsRefusedWithItsLine() {
        InputException e = assertThrows(InputException.class,
                () -> read("v 0 0 0\nv 2e8 0 0\nv 0 1 0\nf 1 2 3\n"));
        assertTrue(e.getMessage().startsWith("t.obj:2: vertex at x = 2.00e+08 m is outside the supported range"), e.getMessage());
    }

    @Test
    void theRangeAppliesAfterTheUnit() {
        // a 10 m triangle at 2e10 mm = 2e7 m: inside the range of 1e8 m; the same numbers in metres are not
        String obj = "v 2e10 0 0\nv 2.000001e10 0 0\nv 2e10 1e4 0\nf 1 2 3\n";
        MassingModel m = ObjReader.parse(obj, "t.obj", new ModelOptions(UpAxis.Z, LengthUnit.MM, 0)).model();
        assertEquals(2e7, m.bounds()[0], 0);
        assertThrows(InputException.class, () -> read(obj));
    }

    @Test
    void facesSpanningMoreThan100KmAreRefused() {
        InputException e = assertThrows(InputException.class,
                () -> read("v 0 0 0\nv 100001 0 0\nv 0 1 0\nf 1 2 3\n"));
        assertTrue(e.getMessage().startsWith("t.obj:2: the faces span 100001 m along x"), e.getMessage());
        assertNotNull(read("v 0 0 0\nv 100000 0 0\nv 0 1 0\nf 1 2 3\n"), "exactly 100 km is supported");
    }

    @Test
    void aBowTieFaceIsRefusedAsSelfIntersectingWithItsLine() {
        InputException e = assertThrows(InputException.class,
                () -> read("v 0 0 10\nv 10 0 10\nv 0 10 10\nv 10 10 10\nf 1 2 3 4\n"));
        assertEquals("t.obj:5: face is self-intersecting: its edge from corner 2 to 3 crosses the edge from corner"
                + " 4 to 1 (a bow-tie); expected a simple polygon: reorder its corners or split it", e.getMessage());
    }

    @Test
    void simplePolygonsWhoseEdgesOnlyTouchAreNotSelfIntersecting() {
        // an L (concave), a square with a slit to an inner square hole (edges overlap, never cross),
        // a quad with a repeated corner
        assertNotNull(read("v 0 0 0\nv 4 0 0\nv 4 1 0\nv 1 1 0\nv 1 3 0\nv 0 3 0\nf 1 2 3 4 5 6\n"));
        assertNotNull(read("v 0 0 0\nv 10 0 0\nv 10 10 0\nv 0 10 0\nv 4 4 0\nv 4 6 0\nv 6 6 0\nv 6 4 0\n"
                + "f 1 2 3 4 1 5 6 7 8 5\n"));
        assertNotNull(read("v 0 0 0\nv 1 0 0\nv 1 1 0\nv 0 1 0\nf 1 2 2 3 4\n"));
    }
}
