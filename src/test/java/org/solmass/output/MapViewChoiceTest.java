package org.solmass.output;

import org.junit.jupiter.api.Test;
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
    static String box(double x0, double y0, double x1, double y1, double h, int base) {
        StringBuilder b = new StringBuilder();
        double[][] v = {{x0, y0, 0}, {x1, y0, 0}, {x1, y1, 0}, {x0, y1, 0}, {x0, y0, h}, {x1, y0, h}, {x1, y1, h}, {x0, y1, h}};
        for (double[] p : v) b.append("v ").append(p[0]).append(' ').append(p[1]).append(' ').append(p[2]).append('\n');
        int[][] f = {{5, 6, 7, 8}, {1, 2, 6, 5}, {2, 3, 7, 6}, {3, 4, 8, 7}, {4, 1, 5, 8}};
        for (int[] q : f) b.append("f ").append(q[0] + base).append(' ').append(q[1] + base).append(' ')
                .append(q[2] + base).append(' ').append(q[3] + base).append('\n');
        return b.toString();
    }

    @Test
    void aTallTowerSouthWestOfTheBlockMakesAnotherViewWin() {
        String obj = "o block\n" + box(0, 0, 20, 20, 8, 0) + "o tower\n" + box(-30, -30, -10, -10, 80, 8);
        MassingModel m = ObjReader.parse(obj, "tower.obj", ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(2.0, Set.of("block"), false));
        double[] v = new double[ps.patchCount()];
        for (int i = 0; i < v.length; i++) v[i] = i % 7;
        MapScene scene = new MapScene(m, ps.analysedBlocks(), ps.patches(), v, 0, 6, false, List.of());
        assertNotEquals(225.0, MapRenderer.bestViewAzimuth(scene, 30), "the view from the south-west looks through the tower");
    }
}
