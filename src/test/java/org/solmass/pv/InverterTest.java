package org.solmass.pv;

import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** Schmidt and Sauer (1996) loss model p_dc = p_ac + p0 + v p_ac + r p_ac^2; clipping at the AC rating. */
class InverterTest {
    static final Inverter INV = Inverter.DEFAULT;

    /** By hand: at half load p_dc = 0.5 + 0.004 + 0.01 + 0.0025 = 0.5165, eta = 0.5 / 0.5165 = 0.96805. */
    @Test
    void efficiencyAtHalfLoadMatchesTheLossModelByHand() {
        assertEquals(0.96805, INV.efficiencyAtAc(0.5), 1e-5);
        assertEquals(1 / 1.034, INV.efficiencyAtAc(1), 1e-12);
        assertEquals(0.05 / 0.055025, INV.efficiencyAtAc(0.05), 1e-12);
    }

    /** The quadratic loss model peaks where p0 / p = r p, i.e. p = sqrt(p0 / r) (calculus). */
    @Test
    void efficiencyPeaksAtTheSquareRootOfSelfConsumptionOverOhmicCoefficient() {
        double pk = Math.sqrt(INV.p0() / INV.r());
        assertTrue(INV.efficiencyAtAc(pk) > INV.efficiencyAtAc(pk * 0.95));
        assertTrue(INV.efficiencyAtAc(pk) > INV.efficiencyAtAc(pk * 1.05));
    }

    /**
     * European efficiency (EN 50530 weights; common practice) by hand from the curve:
     * 0.03 x 0.9087 + 0.06 x 0.9425 + 0.13 x 0.9597 + 0.10 x 0.9649 + 0.48 x 0.9681 + 0.20 x 0.9671 = 0.9632;
     * the documented target is "about 96 %", typical of string inverters (common practice).
     */
    @Test
    void defaultEuropeanEfficiencyIsAbout96Percent() {
        assertEquals(0.9632, INV.europeanEfficiency(), 2e-4);
    }

    @Test
    void acForDcInvertsDcForAc() {
        Random r = new Random(5);
        for (int i = 0; i < 1000; i++) {
            double ac = r.nextDouble() * 1.2;
            assertEquals(ac, INV.acForDc(INV.dcForAc(ac)), 1e-12);
        }
        assertEquals(0, INV.acForDc(INV.p0()), 0);
    }

    /** Clipping: 1500 W DC into a 1000 W inverter gives exactly 1000 W; it draws 1034 W; 466 W are clipped. */
    @Test
    void outputIsClippedExactlyAtTheAcRating() {
        Inverter.Conversion c = INV.convert(1500, 1000);
        assertEquals(1000, c.acW(), 0);
        assertEquals(34, c.lossW(), 1e-9);
        assertEquals(466, c.clippedW(), 1e-9);
        Inverter.Conversion below = INV.convert(500, 1000);
        assertEquals(0, below.clippedW(), 0);
        assertEquals(500, below.acW() + below.lossW(), 1e-9);
    }

    /** AC rating from the DC/AC ratio: 12 kWp at 1.2 gives 10 kW. */
    @Test
    void acRatingIsArrayPowerOverDcAcRatio() {
        assertEquals(10000, INV.acRatingW(12000), 1e-9);
    }
}
