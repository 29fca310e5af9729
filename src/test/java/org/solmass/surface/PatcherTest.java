package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;
import org.solmass.model.LengthUnit;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.UpAxis;
import org.solmass.model.Vec3;

import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

class PatcherTest {

    private static PatchOptions size(double s) { return new PatchOptions(s, Set.of(), false); }

    /** Per surface id, the sum of its patch areas. */
    private static double[] patchAreaBySurface(PatchSet ps) {
        double[] a = new double[ps.surfaces().size()];
        for (Patch p : ps.patches()) a[p.surface()] += p.areaM2();
        return a;
    }

    private static void assertAreasSum(PatchSet ps, String what) {
        double[] a = patchAreaBySurface(ps);
        for (Surface s : ps.surfaces()) {
            boolean patched = ps.isAnalysed(s.block())
                    && (s.kind() != SurfaceKind.UNDERSIDE || ps.options().includeUndersides());
            double expected = patched ? s.areaM2() : 0;
            assertEquals(expected, a[s.id()], 1e-9 * Math.max(1, expected), what + " surface " + s.label());
        }
    }

    @Test
    void boxFacadeOfTenByFourMetresGivesFortySquarePatches() {
        PatchSet ps = Patcher.build(SurfaceBuilderTest.fixture("box_plaza.obj"), PatchOptions.defaults());
        List<Patch> south = ps.patches().stream().filter(p -> p.normal().y() < -0.99).toList();
        assertEquals(40, south.size());
        for (Patch p : south) {
            assertEquals(1.0, p.areaM2(), 1e-12);
            assertEquals(SurfaceKind.FACADE, p.kind());
            assertEquals(180, p.azimuthDeg(), 1e-9); // south facade: azimuth 180, tilt 90 (convention)
            assertEquals(90, p.tiltDeg(), 1e-9);
            assertEquals(0, p.centroid().y(), 1e-12);
        }
        // grid anchored at the surface's min u/v: first patch is the bottom-left cell seen from the south
        Patch first = south.get(0);
        assertTrue(first.id().endsWith("-P0000"), first.id());
        assertEquals(0.5, first.centroid().x(), 1e-12);
        assertEquals(0.5, first.centroid().z(), 1e-12);
        // total: roof 60 + facades 40 + 24 + 40 + 24 + plaza 24 (underside not analysed by default)
        assertEquals(212, ps.totalPatchAreaM2(), 1e-9);
        assertEquals(212, ps.patchCount());
        assertEquals(java.util.Map.of(SurfaceKind.ROOF, 60, SurfaceKind.FACADE, 128, SurfaceKind.GROUND, 24,
                SurfaceKind.UNDERSIDE, 0), ps.patchCountByKind());
        assertAreasSum(ps, "box");
    }

    @Test
    void patchOrientationAndOutlineFollowTheNormal() {
        PatchSet ps = Patcher.build(SurfaceBuilderTest.fixture("box_plaza.obj"), PatchOptions.defaults());
        for (Patch p : ps.patches()) {
            double[] o = p.outline();
            int n = o.length / 3;
            assertTrue(n >= 3);
            // Newell normal of the outline must point along the patch normal (counter-clockwise from the front)
            double nx = 0, ny = 0, nz = 0;
            for (int i = 0; i < n; i++) {
                int a = 3 * i, b = 3 * ((i + 1) % n);
                nx += (o[a + 1] - o[b + 1]) * (o[a + 2] + o[b + 2]);
                ny += (o[a + 2] - o[b + 2]) * (o[a] + o[b]);
                nz += (o[a] - o[b]) * (o[a + 1] + o[b + 1]);
            }
            Vec3 newell = new Vec3(nx, ny, nz);
            assertEquals(2 * p.areaM2(), newell.dot(p.normal()), 1e-9, p.id());
            assertEquals(p.index(), ps.patches().indexOf(p));
        }
        Patch roof = ps.patches().stream().filter(p -> p.kind() == SurfaceKind.ROOF).findFirst().orElseThrow();
        assertEquals(0, roof.tiltDeg(), 0);
        assertEquals(0, roof.azimuthDeg(), 0);
        assertEquals(4, roof.centroid().z(), 1e-12);
        Patch east = ps.patches().stream().filter(p -> p.normal().x() > 0.99 && p.block() == 0).findFirst().orElseThrow();
        assertEquals(90, east.azimuthDeg(), 1e-9);
        Patch west = ps.patches().stream().filter(p -> p.normal().x() < -0.99).findFirst().orElseThrow();
        assertEquals(270, west.azimuthDeg(), 1e-9);
    }

    @Test
    void southSlopeOfAGableRoofIsARoofTiltedThirtyDegreesFacingSouth() {
        // slope rising 3 m horizontally at 30 deg: slope length 3 / cos 30, area 10 x 3 / cos 30 (trigonometry)
        double zr = 4 + 3 * Math.tan(Math.toRadians(30));
        MassingModel m = new TestObj().block("house")
                .quad(0, 0, 4, 10, 0, 4, 10, 3, zr, 0, 3, zr)     // south slope
                .quad(10, 6, 4, 0, 6, 4, 0, 3, zr, 10, 3, zr)     // north slope
                .quad(0, 0, 0, 10, 0, 0, 10, 0, 4, 0, 0, 4)       // south wall
                .model();
        PatchSet ps = Patcher.build(m, PatchOptions.defaults());
        Surface south = ps.surfaces().stream().filter(x -> x.normal().y() < 0 && x.normal().z() > 0.5).findFirst().orElseThrow();
        assertEquals(SurfaceKind.ROOF, south.kind());
        assertEquals(30, south.tiltDeg(), 1e-9);
        assertEquals(180, south.azimuthDeg(), 1e-9);
        assertEquals(30 / Math.cos(Math.toRadians(30)), south.areaM2(), 1e-9);
        assertEquals(Math.sin(Math.toRadians(30)), south.frame().v().z(), 1e-12, "v runs up the slope");
        assertEquals(1, south.frame().u().x(), 1e-12);
        assertAreasSum(ps, "gable");
        for (Patch p : ps.patches()) {
            if (p.surface() != south.id()) continue;
            assertEquals(30, p.tiltDeg(), 1e-9);
            assertEquals(180, p.azimuthDeg(), 1e-9);
        }
        Surface north = ps.surfaces().stream().filter(x -> x.normal().y() > 0 && x.normal().z() > 0.5).findFirst().orElseThrow();
        assertEquals(0, north.azimuthDeg(), 1e-9);
    }

    @Test
    void yUpExportOfTheSameBoxGivesTheSameKindsAndAreas() {
        // the box_plaza block written Y-up: OBJ (x, y, z) = (x, z, -y) of the Z-up model
        MassingModel zUp = SurfaceBuilderTest.fixture("box_plaza.obj");
        StringBuilder sb = new StringBuilder();
        double[] v = zUp.vertices();
        for (int i = 0; i < v.length; i += 3) sb.append("v ").append(v[i]).append(' ').append(v[i + 2]).append(' ').append(-v[i + 1]).append('\n');
        for (int t = 0; t < zUp.triangleCount(); t++) {
            sb.append("f ").append(zUp.triangles()[3 * t] + 1).append(' ').append(zUp.triangles()[3 * t + 1] + 1)
                    .append(' ').append(zUp.triangles()[3 * t + 2] + 1).append('\n');
        }
        MassingModel yUp = org.solmass.model.ObjReader.parse(sb.toString(), "yup.obj",
                new ModelOptions(UpAxis.Y, LengthUnit.M, 0)).model();
        assertArrayEquals(zUp.vertices(), yUp.vertices(), 1e-12);
        double[] a = Patcher.build(zUp, PatchOptions.defaults()).surfaces().stream().mapToDouble(Surface::areaM2).sorted().toArray();
        double[] b = Patcher.build(yUp, PatchOptions.defaults()).surfaces().stream().mapToDouble(Surface::areaM2).sorted().toArray();
        assertArrayEquals(a, b, 1e-9);
    }

    @Test
    void patchAreasSumToSurfaceAreasForRandomBoxes() {
        Random rnd = new Random(2026);
        for (int trial = 0; trial < 25; trial++) {
            TestObj o = new TestObj();
            int boxes = 1 + rnd.nextInt(4);
            for (int b = 0; b < boxes; b++) {
                o.block("b" + b).box(rnd.nextDouble() * 50, rnd.nextDouble() * 50, rnd.nextDouble() * 3,
                        0.3 + rnd.nextDouble() * 12, 0.3 + rnd.nextDouble() * 12, 0.3 + rnd.nextDouble() * 15);
            }
            // random rotation (north angle) so that grid and walls are not aligned with the axes
            MassingModel m = o.model(new ModelOptions(UpAxis.Z, LengthUnit.M, rnd.nextDouble() * 360));
            double s = 0.3 + rnd.nextDouble() * 2;
            PatchSet ps = Patcher.build(m, new PatchOptions(s, Set.of(), rnd.nextBoolean()));
            assertAreasSum(ps, "trial " + trial);
            for (Surface sf : ps.surfaces()) {
                long count = ps.patches().stream().filter(p -> p.surface() == sf.id()).count();
                double minPatch = ps.patches().stream().filter(p -> p.surface() == sf.id())
                        .mapToDouble(Patch::areaM2).min().orElse(Double.NaN);
                if (count > 1) assertTrue(minPatch >= Patcher.SLIVER_FRACTION * s * s - 1e-12,
                        "sliver left in trial " + trial);
            }
        }
    }

    @Test
    void lShapedAndHoledSurfacesSumToTheirAnalyticAreas() {
        // L-shape from the fixture (6 m2, elementary geometry) and a 10 x 10 roof with a 4 x 4 hole (84 m2)
        MassingModel l = SurfaceBuilderTest.fixture("lshape.obj");
        MassingModel ring = new TestObj()
                .quad(0, 0, 5, 10, 0, 5, 7, 3, 5, 3, 3, 5)
                .quad(10, 0, 5, 10, 10, 5, 7, 7, 5, 7, 3, 5)
                .quad(10, 10, 5, 0, 10, 5, 3, 7, 5, 7, 7, 5)
                .quad(0, 10, 5, 0, 0, 5, 3, 3, 5, 3, 7, 5).model();
        for (double s : new double[]{0.3, 0.7, 1.0, 1.3, 2.9}) {
            PatchSet pl = Patcher.build(l, size(s));
            assertEquals(12, pl.totalPatchAreaM2(), 1e-9, "two L-shapes at " + s);
            assertAreasSum(pl, "L at " + s);
            PatchSet pr = Patcher.build(ring, size(s));
            assertEquals(84, pr.totalPatchAreaM2(), 1e-9, "ring at " + s);
            assertAreasSum(pr, "ring at " + s);
        }
    }

    @Test
    void sliverIsMergedIntoTheNeighbourSharingTheLongestBoundary() {
        // 2.1 m x 1 m wall at 1 m patches: cells of 1, 1 and 0.1 m2; the 0.1 m2 sliver joins the second cell
        MassingModel m = new TestObj().quad(0, 0, 0, 2.1, 0, 0, 2.1, 0, 1, 0, 0, 1).model();
        PatchSet ps = Patcher.build(m, PatchOptions.defaults());
        assertEquals(2, ps.patchCount());
        assertEquals(1.0, ps.patches().get(0).areaM2(), 1e-12);
        assertEquals(1.1, ps.patches().get(1).areaM2(), 1e-12);
        // area centroid of the merged 1.1 x 1 piece spanning x 1..2.1 (elementary geometry)
        assertEquals(1.55, ps.patches().get(1).centroid().x(), 1e-12);
        assertEquals(4, ps.patches().get(1).outline().length / 3, "merged piece is one rectangle");
    }

    @Test
    void surfaceSmallerThanTheSliverLimitStaysOnePatch() {
        MassingModel m = new TestObj().quad(0, 0, 0, 0.2, 0, 0, 0.2, 0, 0.2, 0, 0, 0.2).model();
        PatchSet ps = Patcher.build(m, PatchOptions.defaults());
        assertEquals(1, ps.patchCount());
        assertEquals(0.04, ps.patches().get(0).areaM2(), 1e-12);
    }

    @Test
    void cellCoveringBothArmsOfAUGivesTwoPatches() {
        // U-shaped wall 1 m wide, 2 m tall, arms 0.4 m wide around a 0.2 m gap from 0.5 m up:
        // the lower cell holds 1 x 0.5 + 2 x 0.4 x 0.5 = 0.9 m2; the upper cell clips to two separate
        // 0.4 x 1 m parts, each its own patch (elementary geometry)
        MassingModel m = new TestObj().poly(0, 0, 0, 1, 0, 0, 1, 0, 2, 0.6, 0, 2, 0.6, 0, 0.5, 0.4, 0, 0.5,
                0.4, 0, 2, 0, 0, 2).model();
        PatchSet ps = Patcher.build(m, PatchOptions.defaults());
        assertEquals(3, ps.patchCount());
        assertEquals(0.9, ps.patches().get(0).areaM2(), 1e-12);
        assertEquals(0.4, ps.patches().get(1).areaM2(), 1e-12);
        assertEquals(0.4, ps.patches().get(2).areaM2(), 1e-12);
    }

    @Test
    void idsAreUniqueAndStableAcrossRuns() {
        MassingModel m = SurfaceBuilderTest.fixture("box_plaza.obj");
        List<String> a = Patcher.build(m, size(0.7)).patches().stream().map(Patch::id).toList();
        List<String> b = Patcher.build(SurfaceBuilderTest.fixture("box_plaza.obj"), size(0.7)).patches().stream()
                .map(Patch::id).toList();
        assertEquals(a, b);
        assertEquals(a.size(), new HashSet<>(a).size());
        assertTrue(a.get(0).matches("B0-S0-P0000"), a.get(0));
    }

    @Test
    void resultDoesNotDependOnTheThreadCount() throws Exception {
        TestObj o = new TestObj();
        for (int b = 0; b < 6; b++) o.block("b" + b).box(b * 7.3, b * 2.1, 0, 5.5, 4.25, 3 + b);
        MassingModel m = o.model(new ModelOptions(UpAxis.Z, LengthUnit.M, 23));
        PatchOptions opt = size(0.8);
        java.util.concurrent.ForkJoinPool one = new java.util.concurrent.ForkJoinPool(1);
        java.util.concurrent.ForkJoinPool four = new java.util.concurrent.ForkJoinPool(4);
        try {
            PatchSet a = one.submit(() -> Patcher.build(m, opt)).get();
            PatchSet b = four.submit(() -> Patcher.build(m, opt)).get();
            assertEquals(a.patchCount(), b.patchCount());
            for (int i = 0; i < a.patchCount(); i++) {
                Patch p = a.patches().get(i), q = b.patches().get(i);
                assertEquals(p.id(), q.id());
                assertEquals(p.areaM2(), q.areaM2(), 0);
                assertEquals(p.centroid(), q.centroid());
                assertArrayEquals(p.outline(), q.outline(), 0);
            }
        } finally {
            one.shutdown();
            four.shutdown();
        }
    }

    @Test
    void onlyTheNamedBlocksArePatchedWithTheSameIds() {
        MassingModel m = SurfaceBuilderTest.fixture("box_plaza.obj");
        PatchSet all = Patcher.build(m, PatchOptions.defaults());
        PatchSet plaza = Patcher.build(m, new PatchOptions(1.0, Set.of("plaza"), false));
        assertFalse(plaza.isAnalysed(0));
        assertTrue(plaza.isAnalysed(1));
        assertEquals(7, plaza.surfaces().size(), "surfaces of every block are kept for the scene");
        assertEquals(24, plaza.patchCount());
        assertTrue(plaza.patches().stream().allMatch(p -> p.blockName().equals("plaza") && p.kind() == SurfaceKind.GROUND));
        List<String> fromAll = all.patches().stream().filter(p -> p.block() == 1).map(Patch::id).toList();
        assertEquals(fromAll, plaza.patches().stream().map(Patch::id).toList());
        for (int i = 0; i < plaza.patchCount(); i++) assertEquals(i, plaza.patches().get(i).index());
    }

    @Test
    void unknownBlockNameIsAnInputErrorListingTheBlocks() {
        MassingModel m = SurfaceBuilderTest.fixture("box_plaza.obj");
        InputException e = assertThrows(InputException.class,
                () -> Patcher.build(m, new PatchOptions(1.0, Set.of("tower"), false)));
        assertTrue(e.getMessage().contains("'tower'"), e.getMessage());
        assertTrue(e.getMessage().contains("block, plaza"), e.getMessage());
    }

    @Test
    void undersidesArePatchedOnlyOnRequest() {
        MassingModel m = SurfaceBuilderTest.fixture("box_plaza.obj");
        PatchSet ps = Patcher.build(m, new PatchOptions(1.0, Set.of(), true));
        assertEquals(60, ps.patches().stream().filter(p -> p.kind() == SurfaceKind.UNDERSIDE).count());
        assertAreasSum(ps, "with undersides");
    }

    @Test
    void groundPlaneInfoTellsWhetherGroundFacesExist() {
        PatchSet withPlaza = Patcher.build(SurfaceBuilderTest.fixture("box_plaza.obj"), PatchOptions.defaults());
        assertTrue(withPlaza.hasGroundFaces());
        assertEquals(0, withPlaza.groundLevelZ(), 0);
        PatchSet box = Patcher.build(new TestObj().box(0, 0, 1.5, 3, 3, 3).model(), PatchOptions.defaults());
        assertFalse(box.hasGroundFaces());
        assertEquals(1.5, box.groundLevelZ(), 0);
    }

    @Test
    void hugeSurfaceForThePatchSizeIsAnInputErrorNotAHang() {
        // a 100 km wall (e.g. millimetres read as metres) at 1 m patches: 1e5 x 5e4 cells
        MassingModel m = new TestObj().quad(0, 0, 0, 1e5, 0, 0, 1e5, 0, 5e4, 0, 0, 5e4).model();
        InputException e = assertThrows(InputException.class, () -> Patcher.build(m, PatchOptions.defaults()));
        assertTrue(e.getMessage().contains("B0-S0"), e.getMessage());
    }

    @Test
    void patchSizeMustBePositive() {
        assertThrows(InputException.class, () -> new PatchOptions(0, Set.of(), false));
        assertThrows(InputException.class, () -> new PatchOptions(Double.NaN, Set.of(), false));
    }
}
