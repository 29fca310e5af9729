package org.solmass.model;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Faces are turned to face out of their block ({@link Orientation}). Expected values are analytic:
 * the signed volume of a closed shell is the volume of the solid (divergence theorem, common
 * practice), the outward normal of a box face is the axis direction away from the box.
 */
class OrientationTest {
    /** The 10 m box [0,10]^3 as eight vertices and six quads counter-clockwise seen from outside. */
    static final int[][] BOX_FACES = {{1, 3, 4, 2}, {5, 6, 8, 7}, {1, 2, 6, 5}, {3, 7, 8, 4}, {1, 5, 7, 3}, {2, 4, 8, 6}};

    static String box(String name, double x0, double size, int base, boolean[] reversed, boolean bottom) {
        StringBuilder b = new StringBuilder("o " + name + "\n");
        for (int z = 0; z <= 1; z++) for (int y = 0; y <= 1; y++) for (int x = 0; x <= 1; x++) {
            b.append(String.format(Locale.ROOT, "v %s %s %s%n", x0 + size * x, size * y, size * z));
        }
        for (int f = 0; f < 6; f++) {
            if (f == 0 && !bottom) continue;
            int[] q = BOX_FACES[f].clone();
            if (reversed[f]) for (int i = 0; i < 2; i++) { int s = q[i]; q[i] = q[3 - i]; q[3 - i] = s; }
            b.append(String.format(Locale.ROOT, "f %d %d %d %d%n", q[0] + base, q[1] + base, q[2] + base, q[3] + base));
        }
        return b.toString();
    }

    static boolean[] all(boolean x) { return new boolean[]{x, x, x, x, x, x}; }

    static ObjReader.Result read(String obj) { return ObjReader.parse(obj, "t.obj", ModelOptions.defaults()); }

    /** 6 V = sum over triangles of a . ((b - a) x (c - a)) (divergence theorem). */
    static double volume(MassingModel m, int block) {
        double s = 0;
        double[] c = new double[3];
        double[] v = m.vertices();
        for (int t = 0; t < m.triangleCount(); t++) {
            if (m.triangleBlock()[t] != block) continue;
            TriangleGeometry.cross(v, m.triangles(), t, c);
            int a = 3 * m.triangles()[3 * t];
            s += v[a] * c[0] + v[a + 1] * c[1] + v[a + 2] * c[2];
        }
        return s / 6;
    }

    /** Every triangle's normal points away from the point (cx, cy, cz) (true for any face of a box around it). */
    static void assertFacingAwayFrom(MassingModel m, double cx, double cy, double cz) {
        double[] n = new double[3];
        for (int t = 0; t < m.triangleCount(); t++) {
            assertTrue(TriangleGeometry.unitNormal(m.vertices(), m.triangles(), t, n));
            Vec3 p = m.vertex(t, 0);
            double d = (p.x() - cx) * n[0] + (p.y() - cy) * n[1] + (p.z() - cz) * n[2];
            assertTrue(d > 0, "triangle " + t + " of line " + m.triangleLine()[t] + " faces inward");
        }
    }

    @Test
    void aClockwiseBoxIsTurnedOutwardAndEnclosesPlusItsVolume() {
        ObjReader.Result r = read(box("box", 0, 10, 0, all(true), true));
        assertEquals(1000, volume(r.model(), 0), 1e-9, "10 m cube: +1000 m3 once outward");
        assertFacingAwayFrom(r.model(), 5, 5, 5);
        assertEquals(List.of("t.obj:10: block 'box': turned 6 of 6 face(s) to face out of the block (closed shells,"
                + " judged by their signed volume)"), r.warnings());
    }

    @Test
    void anOutwardBoxIsLeftAsWrittenWithoutAWarning() {
        String obj = box("box", 0, 10, 0, all(false), true);
        ObjReader.Result r = read(obj);
        assertEquals(List.of(), r.warnings());
        assertEquals(1000, volume(r.model(), 0), 1e-9);
    }

    @Test
    void oneReversedFaceOfAClosedBoxIsTurnedToAgreeWithItsNeighbours() {
        boolean[] rev = all(false);
        rev[3] = true; // the north wall, line 13
        ObjReader.Result r = read(box("box", 0, 10, 0, rev, true));
        assertFacingAwayFrom(r.model(), 5, 5, 5);
        assertEquals(1, r.warnings().size());
        assertTrue(r.warnings().get(0).startsWith("t.obj:13: block 'box': turned 1 of 6 face(s)"), r.warnings().get(0));
    }

    @Test
    void aBlockOfTwoClosedShellsIsOrientedPerShell() {
        // one block, two separate cubes: the first outward, the second clockwise
        String obj = box("pair", 0, 10, 0, all(false), true) + box("pair", 20, 10, 8, all(true), true).replace("o pair\n", "");
        ObjReader.Result r = read(obj);
        MassingModel m = r.model();
        assertEquals(2000, volume(m, 0), 1e-9, "two 10 m cubes, each +1000 m3");
        double[] n = new double[3];
        for (int t = 0; t < m.triangleCount(); t++) {
            TriangleGeometry.unitNormal(m.vertices(), m.triangles(), t, n);
            Vec3 p = m.vertex(t, 0);
            double cx = p.x() < 15 ? 5 : 25;
            assertTrue((p.x() - cx) * n[0] + (p.y() - 5) * n[1] + (p.z() - 5) * n[2] > 0, "triangle " + t);
        }
        assertTrue(r.warnings().get(0).contains("turned 6 of 12 face(s)"), r.warnings().toString());
    }

    @Test
    void aClockwiseBoxWithoutABottomIsTurnedAsAnOpenMeshWithAWarning() {
        ObjReader.Result r = read(box("open", 0, 10, 0, all(true), false));
        assertFacingAwayFrom(r.model(), 5, 5, 5);
        assertEquals(1, r.warnings().size());
        assertTrue(r.warnings().get(0).contains("block 'open': turned 5 of 5 face(s)")
                && r.warnings().get(0).contains("an open mesh"), r.warnings().get(0));
    }

    @Test
    void aSingleDownwardHorizontalFaceIsTurnedUp() {
        ObjReader.Result r = read("o plaza\nv 0 0 0\nv 0 10 0\nv 10 10 0\nv 10 0 0\nf 1 2 3 4\n");
        double[] n = new double[3];
        for (int t = 0; t < 2; t++) {
            TriangleGeometry.unitNormal(r.model().vertices(), r.model().triangles(), t, n);
            assertEquals(1, n[2], 1e-12);
        }
        assertEquals(1, r.warnings().size());
    }

    @Test
    void aSingleVerticalFaceHasNoEvidenceAndIsLeftAsWritten() {
        ObjReader.Result r = read("o fence\nv 0 0 0\nv 0 0 2\nv 10 0 2\nv 10 0 0\nf 1 2 3 4\n");
        double[] n = new double[3];
        TriangleGeometry.unitNormal(r.model().vertices(), r.model().triangles(), 0, n);
        assertEquals(1, n[1], 1e-12, "(0,0,2)-(0,0,0) x (10,0,2)-(0,0,0) points +y");
        assertEquals(List.of(), r.warnings());
    }

    @Test
    void aFaceWrittenTwiceBackToBackIsLeftAsWritten() {
        ObjReader.Result r = read("o sheet\nv 0 0 0\nv 10 0 0\nv 10 10 0\nf 1 2 3\nf 1 3 2\n");
        assertEquals(List.of(), r.warnings());
        assertArrayEquals(new int[]{0, 1, 2, 0, 2, 1}, r.model().triangles());
    }

    @Test
    void stackedBoxesInOneBlockKeepTheirHiddenFacesOpposite() {
        // two outward cubes, one on the other, in one block: the shared square is written twice
        // (lower roof up, upper floor down); nothing is turned
        StringBuilder b = new StringBuilder("o stack\n");
        for (int c = 0; c < 2; c++) {
            for (int z = 0; z <= 1; z++) for (int y = 0; y <= 1; y++) for (int x = 0; x <= 1; x++) {
                b.append(String.format(Locale.ROOT, "v %d %d %d%n", 10 * x, 10 * y, 10 * (z + c)));
            }
            for (int[] q : BOX_FACES) b.append(String.format(Locale.ROOT, "f %d %d %d %d%n",
                    q[0] + 8 * c, q[1] + 8 * c, q[2] + 8 * c, q[3] + 8 * c));
        }
        ObjReader.Result r = read(b.toString());
        assertEquals(List.of(), r.warnings());
        assertEquals(2000, volume(r.model(), 0), 1e-9);
    }

    @Test
    void aPlazaMeetingAWallInOneBlockIsLeftAsWritten() {
        // a plaza facing up and a wall facing the plaza share an edge: the mesh faces into the corner
        // they make ("away" and "up" disagree); no closed shell gives a habit, so it stays as written
        ObjReader.Result r = read("o site\nv 0 0 0\nv 10 0 0\nv 10 10 0\nv 0 10 0\nv 0 10 5\nv 10 10 5\n"
                + "f 1 2 3 4\nf 4 3 6 5\n");
        assertEquals(List.of(), r.warnings());
        double[] n = new double[3];
        TriangleGeometry.unitNormal(r.model().vertices(), r.model().triangles(), 2, n);
        assertEquals(-1, n[1], 1e-12, "the wall at y = 10 faces the plaza (-y)");
    }

    @Test
    void turnedFacesAreCountedPerBlockByName() {
        List<String> names = new ArrayList<>();
        String obj = box("a", 0, 10, 0, all(true), true) + box("b", 20, 10, 8, all(false), true);
        for (String w : read(obj).warnings()) names.add(w.substring(w.indexOf("block")));
        assertEquals(1, names.size());
        assertTrue(names.get(0).startsWith("block 'a': turned 6 of 6"), names.toString());
    }
}
