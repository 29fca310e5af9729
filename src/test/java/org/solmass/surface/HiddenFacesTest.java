package org.solmass.surface;

import org.junit.jupiter.api.Test;
import org.solmass.fixtures.Boxes;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Two boxes that touch along x = 10 (heights 10 m and 6 m), modelled as separate boxes (walls and roof) as
 * massing exports often are: the lower box's west wall is wholly against the taller box and the taller
 * box's east wall is covered from 0 to 6 m. Geometry: the exposed areas are exact rectangles.
 */
class HiddenFacesTest {
    @Test
    void facesAgainstATouchingBlockAreNotPatchedAndExposedPartsAreExact() {
        String obj = Boxes.onGround(0, 0, 10, 8, 10).obj("tall") + Boxes.onGround(10, 0, 20, 8, 6).obj("low");
        var m = ObjReader.parse(obj, "touching.obj", ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(1.0, Set.of(), false));
        double tallEast = 0, lowWest = 0;
        for (Patch p : ps.patches()) {
            if (p.kind() != SurfaceKind.FACADE) continue;
            if (p.blockName().equals("tall") && Math.abs(p.azimuthDeg() - 90) < 1) tallEast += p.areaM2();
            if (p.blockName().equals("low") && Math.abs(p.azimuthDeg() - 270) < 1) lowWest += p.areaM2();
        }
        assertEquals(8 * 4, tallEast, 1e-9, "tall east wall exposed above 6 m: 8 m x 4 m");
        assertEquals(0, lowWest, 1e-9, "low west wall is wholly against the tall block");
        assertEquals(8 * 6 + 8 * 6, ps.hiddenAreaM2(), 1e-9, "both covered parts: 48 m2 each");
    }

    @Test
    void boxesThatDoNotTouchKeepEveryFace() {
        String obj = Boxes.onGround(0, 0, 10, 8, 10).obj("a") + Boxes.onGround(10.5, 0, 20, 8, 6).obj("b");
        var m = ObjReader.parse(obj, "apart.obj", ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(1.0, Set.of(), false));
        assertEquals(0, ps.hiddenAreaM2(), 1e-9);
    }

    /**
     * A terrace of 30 boxes of random widths and heights, touching, 100 km from the origin (plane offsets
     * of 10^5 m, where the search window by plane offset must not lose a pair to rounding), one box
     * written twice under two names. Analytic: each shared wall hides 8 m x the lower height on both
     * sides; the copied box's faces are duplicates of the original's (its walls against its neighbours
     * hidden as well).
     */
    @Test
    void aTerraceFarFromTheOriginHidesEverySharedWall() {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(30);
        StringBuilder obj = new StringBuilder();
        double x = 100_000, expectedHidden = 0, prevH = 0;
        int copied = 17;
        for (int i = 0; i < 30; i++) {
            double w = 4 + Math.floor(rnd.nextDouble() * 8), h = 3 * (1 + rnd.nextInt(6));
            obj.append(Boxes.onGround(x, 50_000, x + w, 50_008, h).obj("b" + i));
            if (i == copied) obj.append(Boxes.onGround(x, 50_000, x + w, 50_008, h).obj("copy"));
            if (i > 0) expectedHidden += 2 * 8 * Math.min(h, prevH) * (i == copied || i == copied + 1 ? 1.5 : 1);
            prevH = h;
            x += w;
        }
        var m = ObjReader.parse(obj.toString(), "terrace.obj", ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(1.0, Set.of(), false));
        assertEquals(expectedHidden, ps.hiddenAreaM2(), 1e-6 * expectedHidden, "hidden wall area");
        var dups = HiddenFaces.duplicates(SurfaceBuilder.build(m));
        org.junit.jupiter.api.Assertions.assertTrue(dups.size() >= 5, "the copy's roof and walls are duplicates: " + dups);
    }
}
