package org.solmass.pv;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** The yield chain: loss accounting (IEC 61724-1 yields) and a synthetic clear day. */
class YieldChainTest {
    static final ModuleSpec MOD = ModuleSpec.DEFAULT;
    static final YieldChain CHAIN = YieldChain.defaults(MOD, false);

    /**
     * Standard test conditions (1000 W/m2 at normal incidence, cells at 25 C): no incidence, mismatch
     * or temperature loss; DC = 400 W x 0.95 = 380 W exactly (the STC rating times the other-losses factor).
     */
    @Test
    void standardTestConditionsGiveRatedPowerTimesOtherLossesFactor() {
        double air = 25 - 1000 / (25 + 6.84 * 1);   // air temperature that puts the cells at 25 C
        ModuleDc dc = CHAIN.moduleDc(ModuleIrradiance.uniform(1000, 0, 0, 1000, 0, 30), air, 1);
        assertEquals(400, dc.referenceW(), 1e-9);
        assertEquals(0, dc.shadingW() + dc.incidenceW() + dc.mismatchW() + dc.temperatureW(), 1e-9);
        assertEquals(380, dc.dcW(), 1e-9);
        assertEquals(25, dc.meanCellC(), 1e-9);
    }

    /** Shading is the caller's measurement passed through: 1000 unobstructed, 800 obstructed -> 20 % of the reference. */
    @Test
    void shadingLossIsUnobstructedMinusObstructedIrradiance() {
        ModuleDc dc = CHAIN.moduleDc(ModuleIrradiance.uniform(800, 0, 0, 1000, 0, 30), 20, 1);
        assertEquals(0.2 * 400, dc.shadingW(), 1e-9);
    }

    /**
     * One of three substrings in full shade (beam 0, the sky still reaching it): the substring picture
     * bypasses it or drags the current, whichever gives more; the loss shows up as mismatch, not shading.
     */
    @Test
    void partlyShadedSubstringShowsAsMismatch() {
        ModuleIrradiance in = new ModuleIrradiance(new double[] {900, 900, 0}, new double[] {100, 100, 100}, new double[] {0, 0, 0},
                1000, 0, 30);
        ModuleDc dc = CHAIN.moduleDc(in, 20, 1);
        double id = IncidenceAngleModifier.STANDARD_GLASS.skyDiffuse(30);
        double bright = 900 + 100 * id, dark = 100 * id;
        double equivalent = Math.max(2 * bright / 3, dark);   // bypass the dark substring
        assertEquals(0.4 * ((2 * bright + dark) / 3 - equivalent), dc.mismatchW(), 1e-9);
        assertEquals(0.4 * (1000 - (2 * 1000 + 100) / 3.0), dc.shadingW(), 1e-9);
    }

    /**
     * The losses add up to the difference between the STC-rated energy (reference yield x P0) and the
     * final AC energy, for any inputs: random shading, substrings, incidence, cold and hot cells, clipping.
     */
    @Test
    void lossesAddUpToReferenceMinusFinalEnergy() {
        Random r = new Random(61724);
        for (int c = 0; c < 3000; c++) {
            int n = 1 + r.nextInt(3), modules = 1 + r.nextInt(4);
            List<ModuleIrradiance> ms = new ArrayList<>();
            for (int k = 0; k < modules; k++) {
                double[] b = new double[n], s = new double[n], g = new double[n];
                double sum = 0;
                for (int i = 0; i < n; i++) { b[i] = r.nextDouble() * 1000; s[i] = r.nextDouble() * 300; g[i] = r.nextDouble() * 50; sum += b[i] + s[i] + g[i]; }
                ms.add(new ModuleIrradiance(b, s, g, sum / n * (1 + r.nextDouble() * 0.5), r.nextDouble() * 100, r.nextDouble() * 90));
            }
            YieldChain chain = new YieldChain(MOD, IncidenceAngleModifier.STANDARD_GLASS, CellTemperature.FREE_STANDING, 0.95,
                    new Inverter(0.004, 0.02, 0.01, 0.8 + r.nextDouble()));
            EnergyBalance e = chain.step(ms, -20 + 60 * r.nextDouble(), r.nextDouble() * 8, 0.25 + r.nextDouble());
            assertEquals(e.referenceWh() - e.acWh(), e.lossesWh(), 1e-9 * Math.max(1, e.referenceWh()), "case " + c);
            assertTrue(e.acWh() >= 0 && e.acWh() <= e.referenceWh() * 1.2);
        }
    }

    /**
     * A synthetic clear-sky-like day (invented data): 45 N, equinox (declination 0), module tilted 30 deg
     * facing south, 15-minute steps over the day, air 15 C, wind 2 m/s. Sun: sin(altitude) = cos(45) cos(h);
     * incidence on the south-facing plane cos(theta) = cos(phi - beta) cos(h) at zero declination
     * (Duffie and Beckman, Solar Engineering of Thermal Processes, eq. 1.6.7). Beam: DNI = 1361 x
     * 0.7^(AM^0.678), AM = 1 / sin(altitude) (Meinel and Meinel 1976, common practice); diffuse
     * horizontal an invented 15 % of the beam's horizontal part plus 30 W/m2 x sin(altitude); isotropic sky
     * on the plane, albedo 0.2. The performance ratio of a well-ventilated c-Si system in a temperate
     * climate is 0.75-0.90 (IEC 61724-1 practice; common practice).
     */
    @Test
    void clearDayPerformanceRatioLiesInThePracticeRangeAndLossesBalance() {
        double phi = Math.toRadians(45), beta = Math.toRadians(30);
        EnergyBalance day = EnergyBalance.ZERO;
        for (int k = 0; k < 96; k++) {
            double h = Math.toRadians(((k + 0.5) * 0.25 - 12) * 15);
            double sinAlt = Math.cos(phi) * Math.cos(h);
            if (sinAlt <= 0.02) continue;
            double dni = 1361 * Math.pow(0.7, Math.pow(1 / sinAlt, 0.678));
            double dhi = 0.15 * dni * sinAlt + 30 * sinAlt, ghi = dni * sinAlt + dhi;
            double cosInc = Math.cos(phi - beta) * Math.cos(h);
            double beam = dni * Math.max(0, cosInc), sky = dhi * (1 + Math.cos(beta)) / 2, ground = 0.2 * ghi * (1 - Math.cos(beta)) / 2;
            ModuleIrradiance in = ModuleIrradiance.uniform(beam, sky, ground, beam + sky + ground, Math.toDegrees(Math.acos(cosInc)), 30);
            day = day.plus(CHAIN.step(List.of(in), 15, 2, 0.25));
        }
        double pr = day.performanceRatio();
        assertTrue(pr > 0.75 && pr < 0.90, "PR " + pr);
        assertEquals(day.referenceWh() - day.acWh(), day.lossesWh(), 1e-9 * day.referenceWh());
        assertEquals(0, day.shadingWh(), 1e-9);
        assertTrue(day.incidenceWh() > 0 && day.temperatureWh() > 0 && day.inverterWh() > 0);
    }
}
