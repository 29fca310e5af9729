package org.solmass.metrics;

import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.MultiPoint;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.scene.Scene;
import org.solmass.sun.Site;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SunPosition;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.Patcher;
import org.solmass.surface.SurfaceKind;

import java.time.LocalTime;
import java.time.MonthDay;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ForkJoinPool;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A lone box on open ground against the analytic shadow: the shadow of a vertical edge of height H
 * on horizontal ground has length H / tan(elevation) and points to azimuth + 180 deg (plane geometry,
 * parallel sun rays); the shadow of the whole box is the convex hull of its footprint and the
 * footprint moved by that vector (the Minkowski sum of a convex footprint and a segment), less the
 * footprint. The analytic polygon, its area and boundary distances are computed with JTS (a
 * general-purpose geometry library), not with Solmass code.
 */
class ShadowStudyTest {
    static final int YEAR = 2025;
    static final double W = 10, D = 14, H = 20, CELL = 0.5;
    /** The ground grid: wide enough for the 21 December noon shadow (about 72 m to the north). */
    static final double X0 = -70, Y0 = -70, X1 = 80, Y1 = 100;
    static final SolarCalculator CALC = new SolarCalculator(new Site(51.0, 10.0, 0, ZoneOffset.ofHours(1)));
    static final GeometryFactory GF = new GeometryFactory();

    private record Box(MassingModel model, Scene scene, List<Patch> blockPatches, List<Patch> ground) {}

    private static Box box() {
        MassingModel m = new Obj().block("box").box(0, 0, W, D, H).model();
        Scene scene = Scene.build(m, true, 0);
        List<Patch> blocks = Patcher.build(m, new PatchOptions(1.0, Set.of("box"), false)).patches();
        List<Patch> ground = ShadowStudy.groundGrid(scene, m, null, X0, Y0, X1, Y1, 0, CELL, blocks.size());
        return new Box(m, scene, blocks, ground);
    }

    /** The analytic shadow on the ground (JTS): hull(footprint, footprint + v) minus the footprint. */
    private static Geometry analyticShadow(SunPosition sun) {
        double len = H / Math.tan(Math.toRadians(sun.elevationDeg()));
        double az = Math.toRadians(sun.azimuthDeg() + 180);
        double vx = len * Math.sin(az), vy = len * Math.cos(az);
        double[][] c = {{0, 0}, {W, 0}, {W, D}, {0, D}};
        List<Coordinate> pts = new ArrayList<>();
        for (double[] p : c) {
            pts.add(new Coordinate(p[0], p[1]));
            pts.add(new Coordinate(p[0] + vx, p[1] + vy));
        }
        MultiPoint mp = GF.createMultiPointFromCoords(pts.toArray(new Coordinate[0]));
        Geometry footprint = GF.createPolygon(new Coordinate[] {new Coordinate(0, 0), new Coordinate(W, 0),
                new Coordinate(W, D), new Coordinate(0, D), new Coordinate(0, 0)});
        Geometry grid = GF.toGeometry(new org.locationtech.jts.geom.Envelope(X0, X1, Y0, Y1));
        return mp.convexHull().difference(footprint).intersection(grid);
    }

    /** Three moments with shadows to the north-east, west and north (sun in the south-west, east, south). */
    static final List<ShadowStudy.Moment> MOMENTS = List.of(new ShadowStudy.Moment(MonthDay.of(3, 21), LocalTime.of(15, 0)),
            new ShadowStudy.Moment(MonthDay.of(6, 21), LocalTime.of(9, 0)),
            new ShadowStudy.Moment(MonthDay.of(12, 21), LocalTime.of(12, 0)));

    /**
     * The ray answer and the per-patch file (output.ShadowPatchTable) read back: every frame lists every
     * patch of the study exactly once with the ray's answer, and the file's ground rows, drawn from its
     * outlines and in-sun flags alone, give the analytic shadow within one patch.
     */
    @Test
    void groundShadowOfABoxMatchesTheAnalyticProjectionWithinOnePatch(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir) {
        Box b = box();
        List<Patch> all = new ArrayList<>(b.blockPatches());
        all.addAll(b.ground());
        List<ShadowStudy.Frame> frames = ShadowStudy.compute(b.scene(), all, CALC, YEAR, MOMENTS);
        java.nio.file.Path file = dir.resolve(org.solmass.output.ShadowPatchTable.FILE_NAME);
        org.solmass.output.ShadowPatchTable.write(file, all, new boolean[] {true}, frames);
        org.solmass.output.ShadowPatchTable.Table t = org.solmass.output.ShadowPatchTable.read(file);
        assertEquals(all.size(), t.patches().size(), "one row per patch");
        assertEquals(all.size(), t.patches().stream().map(Patch::id).distinct().count(), "each patch id once");
        assertEquals(MOMENTS.size(), t.frames().size(), "one column per date and time");
        List<Patch> ground = new ArrayList<>();
        List<Integer> rows = new ArrayList<>();
        for (int i = 0; i < t.patches().size(); i++) {
            assertEquals(all.get(i).id(), t.patches().get(i).id());
            assertEquals(i < b.blockPatches().size() ? "analysed" : "ground", t.roles().get(i));
            if (t.roles().get(i).equals("ground")) {
                ground.add(t.patches().get(i));
                rows.add(i);
            }
        }
        assertEquals(b.ground().size(), ground.size());
        for (int k = 0; k < MOMENTS.size(); k++) {
            ShadowStudy.Moment mo = MOMENTS.get(k);
            boolean[] lit = t.sunlit(org.solmass.output.ShadowPatchTable.frameKey(mo)), groundLit = new boolean[ground.size()];
            assertArrayEquals(frames.get(k).sunlit(), lit, mo + ": the file holds the ray's answer for every patch");
            for (int i = 0; i < ground.size(); i++) groundLit[i] = lit[rows.get(i)];
            assertShadowMatchesProjection(mo, frames.get(k).sun(), ground, groundLit);
        }
    }

    /**
     * The shaded ground patches against the analytic shadow: cells farther than one patch from its
     * outline agree with it, the shaded area and the tip agree within one patch.
     */
    private static void assertShadowMatchesProjection(ShadowStudy.Moment mo, SunPosition sun, List<Patch> groundPatches, boolean[] lit) {
        {
            Geometry shadow = analyticShadow(sun);
            Geometry edge = shadow.getBoundary();
            double shadedArea = 0, tipAlong = Double.NEGATIVE_INFINITY;
            double len = H / Math.tan(Math.toRadians(sun.elevationDeg()));
            double az = Math.toRadians(sun.azimuthDeg() + 180), ux = Math.sin(az), uy = Math.cos(az);
            double tx = (ux > 0 ? W : 0) + len * ux, ty = (uy > 0 ? D : 0) + len * uy, nearTip = Double.POSITIVE_INFINITY;
            for (int i = 0; i < lit.length; i++) {
                Patch p = groundPatches.get(i);
                var pt = GF.createPoint(new Coordinate(p.centroid().x(), p.centroid().y()));
                boolean inside = shadow.contains(pt);
                // away from the analytic outline by more than one patch, the ray agrees with the projection
                if (edge.distance(pt) > CELL) assertEquals(inside, !lit[i], mo + ": ground cell at " + p.centroid());
                if (!lit[i]) {
                    shadedArea += p.areaM2();
                    tipAlong = Math.max(tipAlong, p.centroid().x() * ux + p.centroid().y() * uy);
                    nearTip = Math.min(nearTip, Math.hypot(p.centroid().x() - tx, p.centroid().y() - ty));
                }
            }
            // area: centre sampling misclassifies at most a strip of half a patch along each edge of the
            // outline (the worst case, an edge parallel to the grid just short of the cell centres)
            assertEquals(shadow.getArea(), shadedArea, shadow.getLength() * CELL / 2, mo + ": shadow area, m2");
            // tip (tx, ty): the shadow of the box's vertical edge farthest along azimuth + 180 deg, at
            // H / tan(elevation) from it. It is the vertex of a right-angled wedge of the shadow; the
            // grid's nearest centre inside such a wedge is at most one patch diagonal (CELL sqrt 2) away.
            double diag = CELL * Math.sqrt(2);
            assertEquals(0, nearTip, diag, mo + ": nearest shaded ground patch to the analytic tip, m");
            assertEquals(tx * ux + ty * uy, tipAlong, diag, mo + ": shadow tip along the shadow direction, m");
        }
    }

    @Test
    void facadesFacingAwayFromTheSunAreShadedAndThoseFacingItAreLit() {
        Box b = box();
        ShadowStudy.Moment mo = new ShadowStudy.Moment(MonthDay.of(3, 21), LocalTime.of(15, 0));
        SunPosition sun = ShadowStudy.sunAt(CALC, YEAR, mo);
        assertTrue(sun.azimuthDeg() > 180 && sun.azimuthDeg() < 270, "sun in the south-west at 15:00 in March (from memory)");
        boolean[] lit = ShadowStudy.sunlit(b.scene(), b.blockPatches(), sun);
        int facades = 0;
        for (int i = 0; i < lit.length; i++) {
            Patch p = b.blockPatches().get(i);
            Vec3 n = p.normal();
            if (p.kind() == SurfaceKind.ROOF) assertTrue(lit[i], "roof of a lone box is in sun");
            if (p.kind() != SurfaceKind.FACADE) continue;
            facades++;
            boolean facesSun = n.dot(sun.direction()) > 0;
            assertEquals(facesSun, lit[i], "facade patch facing azimuth " + p.azimuthDeg());
            if (n.y() > 0.9 || n.x() > 0.9) assertFalse(lit[i], "north and east facades face away from a south-west sun");
        }
        assertEquals(2 * (W + D) * H, facades, 1e-9, "one 1 m patch per square metre of facade");
    }

    @Test
    void nothingIsInSunWhenTheSunIsBelowTheHorizon() {
        Box b = box();
        SunPosition night = ShadowStudy.sunAt(CALC, YEAR, new ShadowStudy.Moment(MonthDay.of(12, 21), LocalTime.of(22, 0)));
        assertTrue(night.elevationDeg() < 0);
        for (boolean l : ShadowStudy.sunlit(b.scene(), b.ground(), night)) assertFalse(l);
    }

    @Test
    void groundCellsInsideTheBoxAreLeftOut() {
        Box b = box();
        for (Patch p : b.ground()) {
            boolean inside = p.centroid().x() > 0 && p.centroid().x() < W && p.centroid().y() > 0 && p.centroid().y() < D;
            assertFalse(inside, "ground cell under the box at " + p.centroid());
        }
        assertEquals(((X1 - X0) * (Y1 - Y0) - W * D) / (CELL * CELL), b.ground().size(), 1e-9, "grid cells of the rectangle less the footprint");
    }

    @Test
    void resultsDoNotDependOnTheThreadCount() throws Exception {
        Box b = box();
        List<Patch> all = new ArrayList<>(b.blockPatches());
        all.addAll(b.ground());
        List<ShadowStudy.Moment> ms = ShadowStudy.moments(ShadowStudy.DEFAULT_DATES, ShadowStudy.DEFAULT_TIMES);
        List<boolean[]> runs = new ArrayList<>();
        for (int threads : new int[] {1, 3}) {
            ForkJoinPool pool = new ForkJoinPool(threads);
            try {
                for (ShadowStudy.Frame f : pool.submit(() -> ShadowStudy.compute(b.scene(), all, CALC, YEAR, ms)).get()) runs.add(f.sunlit());
            } finally {
                pool.shutdown();
            }
        }
        for (int k = 0; k < ms.size(); k++) assertArrayEquals(runs.get(k), runs.get(k + ms.size()));
    }
}
