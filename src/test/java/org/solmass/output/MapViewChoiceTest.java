package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.Patcher;

import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The automatic axonometric view of the map ({@link MapRenderer#bestViewAzimuth}): of the four diagonal
 * views (azimuths 225, 135, 315, 45 at 30 deg elevation) it takes the one that shows the most patch
 * pixels. Expected views follow from orthographic projection (geometry): a vertical patch of area A
 * with outward azimuth a, seen from azimuth v at elevation e, covers A cos(e) cos(a - v) on screen when
 * |a - v| < 90 deg and nothing otherwise (back faces are not drawn).
 */
class MapViewChoiceTest {
    private static final double ELEVATION_DEG = 30;

    /**
     * A lone 20 x 20 x 8 m block whose patches are on two adjacent walls only. A diagonal view sees
     * both walls at 45 deg (2 A cos e cos 45), the two neighbouring diagonals one wall each
     * (A cos e cos 45), the opposite diagonal none. The square block looks the same from the four
     * diagonals (quarter-turn symmetry), so each view has the same scale and the corner between the two
     * walls wins by a factor of two.
     */
    @ParameterizedTest(name = "walls facing {0} and {1} deg -> view from {2} deg")
    @CsvSource({"180, 270, 225", "180, 90, 135", "0, 270, 315", "0, 90, 45"})
    void theViewLooksFromTheCornerBetweenThePatchedWalls(double wallAz1, double wallAz2, double expectedViewAz) {
        MassingModel m = model(Boxes.onGround(0, 0, 20, 20, 8).obj("block"));
        List<Patch> walls = patchesFacing(m, wallAz1, wallAz2);
        assertEquals(expectedViewAz, MapRenderer.bestViewAzimuth(scene(m, walls), ELEVATION_DEG), 0.0);
    }

    /**
     * A 30 x 10 x 8 m block with patches on its south wall (30 m long) and west wall (10 m). In the
     * open the view from the south-west sees both (40 m of wall) against 30 m from the south-east and
     * 10 m from the north-west; the views from 225 and 135 mirror each other (the block is symmetric
     * about x = 15), so they share a scale, and 225 wins by 4 to 3. A context tower 80 m tall on
     * [-60, -10] x [-60, -10] then stands in every line of sight from the block towards the south-west:
     * such a line keeps x - y (between -10 and 30 on the block, within the tower's -50..50), enters the
     * tower at most (30 + 10) * sqrt 2 = 57 m away horizontally and there is at most
     * 8 + 57 tan 30 deg = 41 m high, below the tower's 80 m; the 225 view shows no patch. The 135 and 315
     * views look from opposite sides; the tower sets both their width (x + y from -120 to 40) and their
     * height (its top and the far ground corner, +-50 / sqrt 2 in depth), the same from either side, so
     * they share a scale; their lines of sight leave the block away from the tower. The south wall,
     * three times the west wall, makes 135 the choice.
     */
    @Test
    void aTowerHidingTheBestCornerMovesTheViewToTheLongerVisibleWall() {
        String block = Boxes.onGround(0, 0, 30, 10, 8).obj("block");
        MassingModel open = model(block);
        assertEquals(225.0, MapRenderer.bestViewAzimuth(scene(open, patchesFacing(open, 180, 270)), ELEVATION_DEG), 0.0,
                "in the open the south-west corner shows the most wall");
        MassingModel withTower = model(block + Boxes.onGround(-60, -60, -10, -10, 80).obj("tower"));
        assertEquals(135.0, MapRenderer.bestViewAzimuth(scene(withTower, patchesFacing(withTower, 180, 270)), ELEVATION_DEG), 0.0,
                "the tower hides the south-west view; the south-east view shows the 30 m south wall");
    }

    private static MassingModel model(String obj) {
        return ObjReader.parse(obj, "boxes.obj", ModelOptions.defaults()).model();
    }

    /** The block's patches on the walls with the given outward azimuths (2 m patches). */
    private static List<Patch> patchesFacing(MassingModel m, double... azimuthsDeg) {
        return Patcher.build(m, new PatchOptions(2.0, Set.of("block"), false)).patches().stream()
                .filter(p -> Math.abs(p.tiltDeg() - 90) < 1e-6)
                .filter(p -> Arrays.stream(azimuthsDeg).anyMatch(a -> Math.abs(p.azimuthDeg() - a) < 1e-6))
                .toList();
    }

    /** Every patch in the ramp's middle colour (value 3 on 0..6), a saturated colour the count takes. */
    private static MapScene scene(MassingModel m, List<Patch> patches) {
        boolean[] analysed = new boolean[m.blockNames().size()];
        analysed[m.blockNames().indexOf("block")] = true;
        double[] v = new double[patches.size()];
        Arrays.fill(v, 3);
        assertTrue(patches.size() > 0, "no patches on the chosen walls");
        return new MapScene(m, analysed, patches, v, 0, 6, false, List.of());
    }
}
