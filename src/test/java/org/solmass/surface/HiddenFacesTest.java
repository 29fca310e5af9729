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
}
