package org.solmass.model;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.solmass.InputException;

import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class ObjReaderTest {

    static Path fixture(String name) {
        try {
            return Path.of(ObjReaderTest.class.getResource("/obj/" + name).toURI());
        } catch (URISyntaxException | NullPointerException e) {
            throw new IllegalStateException("missing fixture " + name, e);
        }
    }

    static ObjReader.Result load(String name) { return ObjReader.load(fixture(name), ModelOptions.defaults()); }

    /** Sum of triangle areas (half the cross-product length; elementary vector geometry). */
    static double area(MassingModel m) {
        double s = 0;
        for (int t = 0; t < m.triangleCount(); s += areaOf(m, t), t++) { }
        return s;
    }

    static double areaOf(MassingModel m, int t) {
        Vec3 a = m.vertex(t, 0), b = m.vertex(t, 1), c = m.vertex(t, 2);
        return 0.5 * b.minus(a).cross(c.minus(a)).length();
    }

    static Vec3 normalOf(MassingModel m, int t) {
        Vec3 a = m.vertex(t, 0), b = m.vertex(t, 1), c = m.vertex(t, 2);
        return b.minus(a).cross(c.minus(a)).normalized();
    }

    @ParameterizedTest
    @ValueSource(strings = {"form_i.obj", "form_it.obj", "form_in.obj", "form_itn.obj", "negative.obj",
            "quad.obj", "continuation.obj"})
    void everyFaceFormGivesTheTwoSquareMetreRectangle(String file) {
        MassingModel m = load(file).model();
        assertEquals(4, m.vertexCount());
        assertEquals(2, m.triangleCount());
        assertEquals(2.0, area(m), 1e-12); // 2 m x 1 m rectangle
        for (int t = 0; t < 2; t++) assertEquals(1.0, normalOf(m, t).z(), 1e-12, "winding kept (faces up)");
        assertEquals(List.of(file.replace(".obj", "")), m.blockNames(), "faces before o/g: block named after the file");
        assertEquals(0, m.degenerateDropped());
    }

    @Test
    void continuationLinesJoinAndKeepTheFirstLineNumber() {
        MassingModel m = load("continuation.obj").model();
        assertEquals(new Vec3(2, 1, 0), new Vec3(m.vertices()[6], m.vertices()[7], m.vertices()[8]));
        assertEquals(9, m.triangleLine()[0]);
    }

    @Test
    void concaveLShapeWithCollinearVerticesHasItsAnalyticArea() {
        MassingModel m = load("lshape.obj").model();
        assertEquals(List.of("flat", "standing"), m.blockNames());
        double flat = 0, standing = 0;
        for (int t = 0; t < m.triangleCount(); t++) {
            double a = areaOf(m, t);
            assertTrue(a > 0);
            if (m.triangleBlock()[t] == 0) {
                flat += a;
                assertEquals(1.0, normalOf(m, t).z(), 1e-12);
            } else {
                standing += a;
                assertEquals(1.0, normalOf(m, t).y(), 1e-12); // reversed order faces +y
            }
        }
        // L = 4 x 1 plus 1 x 2 = 6 m2 (elementary geometry)
        assertEquals(6.0, flat, 1e-12);
        assertEquals(6.0, standing, 1e-12);
    }

    @Test
    void usemtlNamesAreKeptPerTriangleAndLinesPointsIgnored() {
        ObjReader.Result r = load("usemtl.obj");
        MassingModel m = r.model();
        assertEquals(List.of("glass", "brick"), m.materialNames());
        assertArrayEquals(new int[]{0, 1, 0}, m.triangleMaterial());
        assertArrayEquals(new int[]{9, 11, 15}, m.triangleLine());
        assertEquals(List.of("tower"), m.blockNames());
        assertTrue(r.warnings().isEmpty(), r.warnings().toString());
    }

    @Test
    void trianglesWithoutMaterialHaveMinusOne() {
        assertArrayEquals(new int[]{-1, -1}, load("form_i.obj").model().triangleMaterial());
    }

    @Test
    void oAndGNameBlocksAndRepeatedNamesAppend() {
        ObjReader.Result r = load("blocks.obj");
        MassingModel m = r.model();
        assertEquals(List.of("blocks", "north", "south"), m.blockNames());
        assertArrayEquals(new int[]{0, 1, 2, 1}, m.triangleBlock());
        assertEquals(1, r.warnings().size(), r.warnings().toString());
        assertTrue(r.warnings().get(0).contains("blocks.obj:16"), r.warnings().get(0));
        assertTrue(r.warnings().get(0).contains("'foo'"), r.warnings().get(0));
    }

    @Test
    void zeroAreaTrianglesAreDroppedAndCounted() {
        ObjReader.Result r = load("degenerate.obj");
        assertEquals(1, r.model().triangleCount());
        assertEquals(1, r.model().degenerateDropped());
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("degenerate")));
    }

    @Test
    void nearlyFlatButRealTriangleIsKept() {
        // height 1e-6 of a 1 m edge is far above the 1e-9 relative degenerate limit
        MassingModel m = ObjReader.parse("v 0 0 0\nv 1 0 0\nv 0.5 1e-6 0\nf 1 2 3\n", "thin.obj",
                ModelOptions.defaults()).model();
        assertEquals(1, m.triangleCount());
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
            "bad_index_range.obj|bad_index_range.obj:4|out of range",
            "bad_index_zero.obj|bad_index_zero.obj:4|index 0",
            "bad_face_two.obj|bad_face_two.obj:5|at least 3",
            "bad_coord_text.obj|bad_coord_text.obj:2|not a number",
            "bad_coord_nan.obj|bad_coord_nan.obj:3|not finite",
            "bad_coord_inf.obj|bad_coord_inf.obj:2|not finite",
            "empty.obj|empty.obj|no vertices",
            "no_faces.obj|no_faces.obj|no faces"})
    void badInputNamesFileLineAndWhatWasExpected(String file, String where, String what) {
        InputException e = assertThrows(InputException.class, () -> load(file));
        assertTrue(e.getMessage().contains(where), e.getMessage());
        assertTrue(e.getMessage().contains(what), e.getMessage());
        assertTrue(e.where().endsWith(where), e.where());
    }

    @Test
    void relativeIndexBeforeTheFirstVertexIsAnError() {
        InputException e = assertThrows(InputException.class, () ->
                ObjReader.parse("v 0 0 0\nv 1 0 0\nf -1 -2 -3\n", "rel.obj", ModelOptions.defaults()));
        assertTrue(e.getMessage().contains("rel.obj:3"), e.getMessage());
    }

    @Test
    void nonIntegerFaceIndexIsAnError() {
        InputException e = assertThrows(InputException.class, () ->
                ObjReader.parse("v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 x/3\n", "idx.obj", ModelOptions.defaults()));
        assertTrue(e.getMessage().contains("idx.obj:4"), e.getMessage());
    }

    @Test
    void trailingCommentsAfterVerticesAndFacesAreIgnored() {
        MassingModel m = ObjReader.parse("v 0 0 0 # origin\nv 1 0 0\nv 0 1 0\nf 1 2 3 # first\n", "c.obj",
                ModelOptions.defaults()).model();
        assertEquals(1, m.triangleCount());
    }

    @Test
    void byteOrderMarkAndWindowsLineEndsAreAccepted() {
        ObjReader.Result r = ObjReader.parse("\uFEFFv 0 0 0\r\nv 1 0 0\r\nv 0 1 0\r\nf 1 2 3\r\n", "bom.obj",
                ModelOptions.defaults());
        assertEquals(3, r.model().vertexCount());
        assertTrue(r.warnings().isEmpty(), r.warnings().toString());
    }

    @Test
    void stringSourceWithoutNameUsesDefaultBlock() {
        MassingModel m = ObjReader.parse("v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\n", "", ModelOptions.defaults()).model();
        assertEquals(List.of("default"), m.blockNames());
        assertNull(m.source());
    }

    @Test
    void fileSourceIsRecorded() {
        assertEquals(fixture("quad.obj"), ObjReader.read(fixture("quad.obj"), ModelOptions.defaults()).source());
    }

    @Test
    void missingFileIsAnInputError() {
        InputException e = assertThrows(InputException.class,
                () -> ObjReader.read(Path.of("no/such/model.obj"), ModelOptions.defaults()));
        assertTrue(e.getMessage().contains("model.obj"));
    }
}
