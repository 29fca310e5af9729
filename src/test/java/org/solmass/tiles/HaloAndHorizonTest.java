package org.solmass.tiles;

import org.junit.jupiter.api.Test;
import org.solmass.scene.HorizonProfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The halo radius and the far horizon against plain trigonometry (analytic). */
class HaloAndHorizonTest {
    @Test
    void haloOfA100mBuildingAt5DegreesIs1143m() {
        // issue 19: R = (H_max - z_min) / tan(alpha_min); 100 / tan(5 deg) = 1143.005 m (analytic)
        assertEquals(1143.0, Halo.radiusM(100, 0, 5), 0.01);
        assertEquals(1143.0, Halo.radiusM(130, 30, 5), 0.01); // only the height above the lowest receiver counts
        assertEquals(0.0, Halo.radiusM(0, 0, 5), 0.0);
        // a sun at 45 degrees: the shadow is as long as the building is tall (analytic)
        assertEquals(20.0, Halo.radiusM(20, 0, 45), 1e-9);
    }

    @Test
    void anObstructionAtDistanceDAndHeightHRisesAtanHOverD() {
        double d = 400, h = 60;
        // one 1 m cell straight north of a point-sized tile, its near edge at distance d
        HeightRaster r = HeightRaster.of(-0.5, d, 1, 1, 1, new float[] {(float) h});
        double[] e = FarHorizon.elevationsDeg(r, new double[] {0, 0, 0, 0}, 100, 0, 72);
        assertEquals(Math.toDegrees(Math.atan(h / d)), e[0], 1e-9, "north"); // atan(60/400) = 8.53 deg
        assertEquals(0.0, e[36], 0.0, "south sees nothing");
        // from a receiver 20 m up the same cell rises atan((H - z) / d)
        double[] up = FarHorizon.elevationsDeg(r, new double[] {0, 0, 0, 0}, 100, 20, 72);
        assertEquals(Math.toDegrees(Math.atan((h - 20) / d)), up[0], 1e-9);
        // the best estimate measures d to the cell's centre: d + 0.5 m
        double[] est = FarHorizon.elevationsDeg(r, new double[] {0, 0, 0, 0}, 100, 0, 72, false);
        assertEquals(Math.toDegrees(Math.atan(h / (d + 0.5))), est[0], 1e-9);
        assertEquals(0.0, est[36], 0.0);
        // within the halo the cell is geometry, not horizon
        double[] near = FarHorizon.elevationsDeg(r, new double[] {0, 0, 0, 0}, d + 1, 0, 72);
        assertEquals(0.0, near[0], 0.0);
    }

    @Test
    void theHigherOfTerrainAndCityHorizonCounts() {
        HorizonProfile terrain = HorizonProfile.constant(3);
        HorizonProfile city = new HorizonProfile(new double[] {8, 0, 0, 0});
        HorizonProfile both = FarHorizon.max(terrain, city);
        assertEquals(8, both.elevationDegAt(0), 1e-12);
        assertEquals(3, both.elevationDegAt(180), 1e-12);
    }
}
