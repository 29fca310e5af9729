package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.solmass.model.VertexWelder;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.model.Vec3;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class SurfaceBuilderTest {

    static MassingModel fixture(String name) {
        try {
            return ObjReader.read(Path.of(SurfaceBuilderTest.class.getResource("/obj/" + name).toURI()),
                    ModelOptions.defaults());
        } catch (java.net.URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    private static Surface byNormal(List<Surface> ss, int block, double x, double y, double z) {
        Vec3 n = new Vec3(x, y, z);
        return ss.stream().filter(s -> s.block() == block && s.normal().dot(n) > 0.9999).findFirst().orElseThrow();
    }

    @Test
    void groundMaskFlagsExactlyThePlazaTriangles() {
        org.solmass.model.MassingModel m = fixture("box_plaza.obj");
        List<Surface> ss = SurfaceBuilder.build(m);
        boolean[] ground = Surface.groundTriangles(ss, m.triangleCount());
        assertEquals(m.triangleCount(), ground.length);
        for (int t = 0; t < m.triangleCount(); t++) {
            assertEquals(m.triangleBlock()[t] == 1, ground[t], "triangle " + t + " (block 1 is the plaza)");
        }
    }

    @Test
    void boxGivesFourFacadesRoofUndersideAndThePlazaIsGround() {
        List<Surface> ss = SurfaceBuilder.build(fixture("box_plaza.obj"));
        assertEquals(7, ss.size());
        // 10 x 6 x 4 m block (fixture comment); areas by elementary geometry
        assertSurface(byNormal(ss, 0, 0, 0, 1), SurfaceKind.ROOF, 60);
        assertSurface(byNormal(ss, 0, 0, 0, -1), SurfaceKind.UNDERSIDE, 60);
        assertSurface(byNormal(ss, 0, 0, -1, 0), SurfaceKind.FACADE, 40);
        assertSurface(byNormal(ss, 0, 1, 0, 0), SurfaceKind.FACADE, 24);
        assertSurface(byNormal(ss, 0, 0, 1, 0), SurfaceKind.FACADE, 40);
        assertSurface(byNormal(ss, 0, -1, 0, 0), SurfaceKind.FACADE, 24);
        assertSurface(byNormal(ss, 1, 0, 0, 1), SurfaceKind.GROUND, 24);
        // the south facade's two triangles (own vertex copies) became one surface
        assertEquals(2, byNormal(ss, 0, 0, -1, 0).triangles().length);
        for (int i = 0; i < ss.size(); i++) assertEquals(i, ss.get(i).id());
    }

    private static void assertSurface(Surface s, SurfaceKind kind, double area) {
        assertEquals(kind, s.kind());
        assertEquals(area, s.areaM2(), 1e-9);
        assertEquals(0, s.polygon().getNumInteriorRing());
    }

    @Test
    void roofWithCourtyardOpeningIsOnePolygonWithAHole() {
        // 10 x 10 m roof with a 4 x 4 m opening, written as four trapezoids: area 100 - 16 = 84 m2
        MassingModel m = new TestObj().block("ring")
                .quad(0, 0, 5, 10, 0, 5, 7, 3, 5, 3, 3, 5)
                .quad(10, 0, 5, 10, 10, 5, 7, 7, 5, 7, 3, 5)
                .quad(10, 10, 5, 0, 10, 5, 3, 7, 5, 7, 7, 5)
                .quad(0, 10, 5, 0, 0, 5, 3, 3, 5, 3, 7, 5)
                .quad(20, 0, 0, 21, 0, 0, 21, 1, 0, 20, 1, 0) // a low face elsewhere so the roof is not ground
                .model();
        Surface roof = SurfaceBuilder.build(m).get(0);
        assertEquals(SurfaceKind.ROOF, roof.kind());
        assertEquals(84, roof.areaM2(), 1e-9);
        assertEquals(1, roof.polygon().getNumInteriorRing());
        assertEquals(8, roof.triangles().length);
    }

    @Test
    void noisyDuplicatedVerticesOfARotatedWallWeldIntoOneSurface() {
        // 6 x 3 m wall split into 3 x 3 quads, each with its own vertex copies carrying +-3e-7 m of
        // noise (float32-like), model rotated by 37 deg: one surface of 18 m2, no holes
        java.util.Random rnd = new java.util.Random(5);
        TestObj o = new TestObj();
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                double[] c = {2 * i, 0, j, 2 * i + 2, 0, j, 2 * i + 2, 0, j + 1, 2 * i, 0, j + 1};
                for (int k = 0; k < c.length; k++) if (k % 3 != 1) c[k] += (rnd.nextDouble() - 0.5) * 6e-7;
                o.quad(c);
            }
        }
        MassingModel m = o.model(new ModelOptions(org.solmass.model.UpAxis.Z, org.solmass.model.LengthUnit.M, 37));
        List<Surface> ss = SurfaceBuilder.build(m);
        assertEquals(1, ss.size());
        assertEquals(0, ss.get(0).polygon().getNumInteriorRing());
        assertEquals(18, ss.get(0).areaM2(), 1e-5); // noise of 3e-7 m on a 18 m perimeter: < 1e-5 m2
        assertEquals(18, ss.get(0).triangles().length);
    }

    @Test
    void smallRealOpeningIsKeptAsAHole() {
        // 4 x 4 m roof with a 0.1 x 0.1 m opening (far wider than the weld tolerance): area 16 - 0.01
        MassingModel m = new TestObj()
                .quad(0, 0, 3, 4, 0, 3, 2.05, 1.95, 3, 1.95, 1.95, 3)
                .quad(4, 0, 3, 4, 4, 3, 2.05, 2.05, 3, 2.05, 1.95, 3)
                .quad(4, 4, 3, 0, 4, 3, 1.95, 2.05, 3, 2.05, 2.05, 3)
                .quad(0, 4, 3, 0, 0, 3, 1.95, 1.95, 3, 1.95, 2.05, 3).model();
        Surface s = SurfaceBuilder.build(m).get(0);
        assertEquals(1, s.polygon().getNumInteriorRing());
        assertEquals(15.99, s.areaM2(), 1e-9);
    }

    @Test
    void welderMapsCloseVerticesToTheFirstOne() {
        double[] v = {0, 0, 0, 1, 0, 0, 1e-7, 0, 0, 1, 2e-7, 0, 0.5, 0.5, 0.5};
        assertArrayEquals(new int[]{0, 1, 0, 1, 4}, VertexWelder.weld(v, 1e-6));
    }

    @Test
    void tJunctionNeighboursMergeIntoOneSurface() {
        MassingModel m = new TestObj()
                .quad(0, 0, 0, 2, 0, 0, 2, 2, 0, 0, 2, 0)
                .quad(2, 0, 0, 4, 0, 0, 4, 1, 0, 2, 1, 0)
                .quad(2, 1, 0, 4, 1, 0, 4, 2, 0, 2, 2, 0).model();
        List<Surface> ss = SurfaceBuilder.build(m);
        assertEquals(1, ss.size());
        assertEquals(8, ss.get(0).areaM2(), 1e-9);
    }

    @Test
    void nearDuplicateVerticesAreWelded() {
        double e = 1e-6; // below the weld tolerance 1e-6 x diagonal (4.5e-6 m here), like float32 export noise
        MassingModel m = new TestObj()
                .quad(0, 0, 0, 2, 0, 0, 2, 2, 0, 0, 2, 0)
                .quad(2 + e, 0, 0, 4, 0, 0, 4, 2, 0, 2 - e, 2, 0).model();
        List<Surface> ss = SurfaceBuilder.build(m);
        assertEquals(1, ss.size());
        assertEquals(0, ss.get(0).polygon().getNumInteriorRing());
        assertEquals(8, ss.get(0).areaM2(), 1e-6);
    }

    @Test
    void coplanarButDisjointOrInOtherBlocksStaySeparate() {
        MassingModel m = new TestObj().block("a")
                .quad(0, 0, 3, 1, 0, 3, 1, 1, 3, 0, 1, 3)
                .quad(5, 0, 3, 6, 0, 3, 6, 1, 3, 5, 1, 3)
                .block("b")
                .quad(1, 0, 3, 2, 0, 3, 2, 1, 3, 1, 1, 3).model();
        List<Surface> ss = SurfaceBuilder.build(m);
        assertEquals(3, ss.size());
        assertEquals(List.of(0, 0, 1), ss.stream().map(Surface::block).toList());
        assertEquals(List.of(0, 1, 0), ss.stream().map(Surface::indexInBlock).toList());
        // each part keeps the two triangles of its own quad (triangles 0-1, 2-3, 4-5 in file order)
        assertArrayEquals(new int[]{0, 1}, ss.get(0).triangles());
        assertArrayEquals(new int[]{2, 3}, ss.get(1).triangles());
        assertArrayEquals(new int[]{4, 5}, ss.get(2).triangles());
    }

    @Test
    void coplanarNeedsNormalsWithinOneDegreeAndCornersWithinTheDistanceTolerance() {
        // hinge along x = 2 at z = 0, second panel 2 m wide rising at angle a; plane tolerance 1 mm
        // {angle deg, expected up-facing surfaces}: 0.02 deg lifts the far edge 0.7 mm (merged);
        // 0.5 deg lifts it 17 mm (normals close, planes apart: separate); 2 deg exceeds the angle limit.
        for (double[] c : new double[][]{{0.02, 1}, {0.5, 2}, {2.0, 2}}) {
            double a = Math.toRadians(c[0]);
            double x = 2 + 2 * Math.cos(a), z = 2 * Math.sin(a);
            MassingModel m = new TestObj()
                    .quad(0, 0, 0, 2, 0, 0, 2, 2, 0, 0, 2, 0)
                    .quad(2, 0, 0, x, 0, z, x, 2, z, 2, 2, 0).model();
            long up = SurfaceBuilder.build(m).stream().filter(s -> s.normal().z() > 0.9).count();
            assertEquals((int) c[1], up, "hinge angle " + c[0]);
        }
    }

    @Test
    void parallelPlanesFiveMillimetresApartStaySeparate() {
        MassingModel m = new TestObj()
                .quad(0, 0, 0, 2, 0, 0, 2, 2, 0, 0, 2, 0)
                .quad(2, 0, 0.005, 4, 0, 0.005, 4, 2, 0.005, 2, 2, 0.005).model();
        assertEquals(2, SurfaceBuilder.build(m).size());
    }

    @Test
    void finelyTessellatedCurvedWallDoesNotDriftIntoOnePlane() {
        TestObj o = new TestObj();
        int n = 180; // half cylinder of radius 20 m in 1-degree steps: 180 degrees of turning
        for (int i = 0; i < n; i++) {
            double a0 = Math.toRadians(i), a1 = Math.toRadians(i + 1);
            double x0 = 20 * Math.cos(a0), y0 = 20 * Math.sin(a0), x1 = 20 * Math.cos(a1), y1 = 20 * Math.sin(a1);
            o.quad(x0, y0, 0, x1, y1, 0, x1, y1, 3, x0, y0, 3);
        }
        List<Surface> ss = SurfaceBuilder.build(o.model());
        assertTrue(ss.size() >= 60, "surfaces: " + ss.size()); // each plane spans at most ~2 degrees of turn
        for (Surface s : ss) assertEquals(SurfaceKind.FACADE, s.kind());
    }

    @Test
    void framesFollowTheConvention() {
        List<Surface> ss = SurfaceBuilder.build(fixture("box_plaza.obj"));
        Surface roof = byNormal(ss, 0, 0, 0, 1), south = byNormal(ss, 0, 0, -1, 0);
        Surface bottom = byNormal(ss, 0, 0, 0, -1), east = byNormal(ss, 0, 1, 0, 0);
        assertVec(new Vec3(1, 0, 0), roof.frame().u());
        assertVec(new Vec3(0, 1, 0), roof.frame().v());
        assertVec(new Vec3(1, 0, 0), south.frame().u());   // along the wall, to the right seen from the south
        assertVec(new Vec3(0, 0, 1), south.frame().v());   // up
        assertVec(new Vec3(0, 1, 0), east.frame().u());
        assertVec(new Vec3(1, 0, 0), bottom.frame().u());
        assertVec(new Vec3(0, -1, 0), bottom.frame().v());
        for (Surface s : ss) {
            SurfaceFrame f = s.frame();
            assertVec(f.normal(), f.u().cross(f.v()));     // right-handed
            var env = s.polygon().getEnvelopeInternal();
            assertEquals(0, env.getMinX(), 1e-12);
            assertEquals(0, env.getMinY(), 1e-12);
            for (var c : s.polygon().getCoordinates()) {     // polygon lies on the plane n.p = d
                assertEquals(s.planeOffsetM(), f.toWorld(c.x, c.y).dot(s.normal()), 1e-9);
            }
        }
        assertVec(new Vec3(0, 0, 4), roof.frame().origin());
    }

    private static void assertVec(Vec3 e, Vec3 a) {
        assertEquals(e.x(), a.x(), 1e-12, "x of " + a);
        assertEquals(e.y(), a.y(), 1e-12, "y of " + a);
        assertEquals(e.z(), a.z(), 1e-12, "z of " + a);
    }
}
