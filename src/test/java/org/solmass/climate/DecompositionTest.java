package org.solmass.climate;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

class DecompositionTest {

    /** Erbs et al. (1982) hourly correlation, D&B eq. 2.10.1: continuous at kT = 0.22 and 0.80 (to the 3 decimals of its coefficients). */
    @Test
    void erbsHourlyIsContinuousAtItsBreakpoints() {
        double below = 1 - 0.09 * 0.22, poly = Decomposition.erbsHourlyDiffuseFraction(0.22 + 1e-12);
        assertEquals(below, Decomposition.erbsHourlyDiffuseFraction(0.22), 1e-12);
        assertEquals(0.980, below, 0.0005);
        assertEquals(below, poly, 0.001);
        assertEquals(0.165, Decomposition.erbsHourlyDiffuseFraction(0.80), 0.001, "polynomial end");
        assertEquals(0.165, Decomposition.erbsHourlyDiffuseFraction(0.80 + 1e-9), 0);
        assertEquals(1.0, Decomposition.erbsHourlyDiffuseFraction(0), 0);
        for (double k = 0; k <= 1; k += 0.01) {
            double f = Decomposition.erbsHourlyDiffuseFraction(k);
            assertTrue(f > 0 && f <= 1, "fraction in (0,1] at " + k);
        }
    }

    /** Erbs et al. (1982) monthly correlation, D&B eq. 2.12.1: the two branches differ only through ws; values in (0,1), falling with KT. */
    @Test
    void erbsMonthlyBranchesAndRange() {
        double prev = 2;
        for (double k = 0.3; k <= 0.8; k += 0.05) {
            double a = Decomposition.erbsMonthlyDiffuseFraction(k, 80), b = Decomposition.erbsMonthlyDiffuseFraction(k, 100);
            assertTrue(a > 0 && a < 1 && b > 0 && b < 1);
            assertTrue(a < prev, "falls with KT");
            prev = a;
        }
        // the branch formulas themselves at KT = 0.5 (hand evaluation of eq. 2.12.1)
        assertEquals(1.391 - 3.560 * 0.5 + 4.189 * 0.25 - 2.137 * 0.125, Decomposition.erbsMonthlyDiffuseFraction(0.5, 81.4), 1e-12);
        assertEquals(1.311 - 3.022 * 0.5 + 3.427 * 0.25 - 1.821 * 0.125, Decomposition.erbsMonthlyDiffuseFraction(0.5, 81.5), 1e-12);
    }

    /**
     * Liu & Jordan rd integrates to exactly 1 over the day (its denominator is that integral), so the
     * hourly midpoint sum is within 1 %; Collares-Pereira & Rabl rt is a fit whose daily integral is 1
     * within about 2 % (common practice), for sunset hour angles from 60 to 120 deg.
     */
    @Test
    void hourlyRatiosOfTheDaySumToOne() {
        for (double ws = 60; ws <= 120; ws += 10) {
            double sd = 0, sg = 0;
            for (int k = 0; k < 24 * 60; k++) { // 1-minute midpoints
                double w = Math.toRadians(-180 + (k + 0.5) * 0.25);
                sd += Decomposition.liuJordanDiffuse(Math.cos(w), ws) / 60;
                sg += Decomposition.collaresPereiraRabl(Math.cos(w), ws) / 60;
            }
            assertEquals(1, sd, 0.001, "rd, ws " + ws);
            assertEquals(1, sg, 0.02, "rt, ws " + ws);
            double sdh = 0;
            for (int h = 0; h < 24; h++) sdh += Decomposition.liuJordanDiffuse(Math.cos(Math.toRadians(-180 + (h + 0.5) * 15)), ws);
            assertEquals(1, sdh, 0.01, "rd hourly midpoints, ws " + ws);
        }
    }

    /**
     * Duffie & Beckman (2013) Example 2.8.1 (from memory): Madison, 270 m, 22 August 11:30 solar time,
     * cos z = 0.846, mid-latitude summer: tau_b = 0.62.
     */
    @Test
    void hottelClearSkyDuffieBeckmanExample281() {
        ClearSky cs = new ClearSky(0.27, ClearSky.Type.MIDLATITUDE_SUMMER);
        assertEquals(0.62, cs.beamTransmittance(0.846), 0.005);
        assertEquals(0.271 - 0.294 * 0.62, ClearSky.diffuseTransmittance(0.62), 1e-12);
        assertEquals(ClearSky.Type.MIDLATITUDE_SUMMER, ClearSky.typeFor(43, 8));
        assertEquals(ClearSky.Type.MIDLATITUDE_WINTER, ClearSky.typeFor(-43, 8));
        assertEquals(ClearSky.Type.TROPICAL, ClearSky.typeFor(10, 1));
    }
}
