package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

class ThresholdTest {

    private static List<Patch> patches(double... areas) {
        List<Patch> ps = new ArrayList<>();
        for (int i = 0; i < areas.length; i++) {
            ps.add(new Patch(i, "P" + i, 0, "b", 0, SurfaceKind.ROOF, Vec3.ZERO, Vec3.UP, areas[i], 0, 0, new double[9]));
        }
        return ps;
    }

    @Test
    void areaCountsPatchesAtOrAboveTheValue() {
        List<Patch> ps = patches(2, 3, 5, 7);
        Threshold t = Threshold.of(ps, new double[] {800, 1000, 999.9, 1200}, 1000);
        assertEquals(2, t.count());
        assertEquals(3 + 7, t.areaM2(), 1e-12);
        assertEquals(17, t.totalAreaM2(), 1e-12);
        assertEquals(10 / 17.0, t.share(), 1e-12);
    }

    @Test
    void missingValuesCountNowhere() {
        Threshold t = Threshold.of(patches(2, 3), new double[] {Double.NaN, 50}, 0);
        assertEquals(1, t.count());
        assertEquals(3, t.areaM2(), 0);
        assertEquals(3, t.totalAreaM2(), 0);
    }

    @Test
    void syntheticCourtyardRoofAreaMatchesItsBoxes() {
        // every synthetic roof value is >= 1035 kWh/m2 and every facade value < 800: the threshold
        // picks exactly the roofs, whose area is the sum of the four boxes' footprints
        ViewerData d = SyntheticViewerData.courtyard();
        Threshold t = Threshold.of(d.patches(), d.table().column("annual_kwh_m2"), 1000);
        double roofs = 0;
        for (int b = 0; b < 4; b++) {
            double[] k = SyntheticViewerData.BLOCKS[b];
            roofs += (k[2] - k[0]) * (k[3] - k[1]);
        }
        assertEquals(roofs, t.areaM2(), 1e-6);
    }
}
