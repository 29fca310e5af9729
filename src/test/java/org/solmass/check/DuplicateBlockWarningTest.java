package org.solmass.check;

import org.junit.jupiter.api.Test;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.surface.HiddenFaces;
import org.solmass.surface.SurfaceBuilder;
import org.solmass.fixtures.Boxes;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A block written twice under two names is found as coincident faces facing the same way. Expected
 * areas are elementary geometry of the invented 10 x 8 x 10 m box without a floor: roof 80 m2,
 * walls 2 x 100 + 2 x 80 m2, 440 m2 in all.
 */
class DuplicateBlockWarningTest {
    static MassingModel read(String obj) { return ObjReader.parse(obj, "d.obj", ModelOptions.defaults()).model(); }

    @Test
    void aBlockWrittenTwiceUnderTwoNamesIsWarnedWithItsWholeArea() {
        MassingModel m = read(Boxes.onGround(0, 0, 10, 8, 10).obj("a") + Boxes.onGround(0, 0, 10, 8, 10).obj("b"));
        var surfaces = SurfaceBuilder.build(m);
        double area = 0;
        for (HiddenFaces.Duplicate d : HiddenFaces.duplicates(surfaces)) area += d.areaM2();
        assertEquals(440, area, 1e-9);
        List<Warning> w = Plausibility.surfaces(m, surfaces);
        assertEquals(1, w.size());
        assertEquals("model-duplicate-block", w.get(0).code());
        assertTrue(w.get(0).text().startsWith("blocks 'a' and 'b' have 440.0 m2 of faces in the same place facing the same way"),
                w.get(0).text());
    }

    @Test
    void blocksThatTouchOrStandApartAreNotDuplicates() {
        // touching along x = 10: the shared wall faces are coincident but opposite (hidden faces, not duplicates)
        MassingModel touching = read(Boxes.onGround(0, 0, 10, 8, 10).obj("a") + Boxes.onGround(10, 0, 20, 8, 6).obj("b"));
        assertEquals(List.of(), Plausibility.surfaces(touching, SurfaceBuilder.build(touching)));
        // side by side along y with roofs at one height: coplanar roofs facing the same way but not overlapping
        MassingModel apart = read(Boxes.onGround(0, 0, 10, 8, 10).obj("a") + Boxes.onGround(0, 9, 10, 17, 10).obj("b"));
        assertEquals(List.of(), Plausibility.surfaces(apart, SurfaceBuilder.build(apart)));
    }

    @Test
    void aBlockShiftedByAMetreSharesOnlyTheOverlap() {
        // copy shifted 1 m east: roofs overlap 9 x 8 = 72 m2, south and north walls 9 x 10 = 90 m2 each
        MassingModel m = read(Boxes.onGround(0, 0, 10, 8, 10).obj("a") + Boxes.onGround(1, 0, 11, 8, 10).obj("b"));
        double area = 0;
        for (HiddenFaces.Duplicate d : HiddenFaces.duplicates(SurfaceBuilder.build(m))) area += d.areaM2();
        assertEquals(72 + 90 + 90, area, 1e-9);
    }
}
