package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.solmass.testkit.ObjBoxes;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;

import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertNotEquals;

/** The automatic axonometric view is not the one in which a tall neighbour hides the analysed block. */
class MapViewChoiceTest {
    @Test
    void aTallTowerSouthWestOfTheBlockMakesAnotherViewWin() {
        String obj = "o block\n" + ObjBoxes.box(0, 0, 20, 20, 8, 0) + "o tower\n" + ObjBoxes.box(-30, -30, -10, -10, 80, 8);
        MassingModel m = ObjReader.parse(obj, "tower.obj", ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(2.0, Set.of("block"), false));
        double[] v = new double[ps.patchCount()];
        for (int i = 0; i < v.length; i++) v[i] = i % 7;
        MapScene scene = new MapScene(m, ps.analysedBlocks(), ps.patches(), v, 0, 6, false, List.of());
        assertNotEquals(225.0, MapRenderer.bestViewAzimuth(scene, 30), "the view from the south-west looks through the tower");
    }
}
