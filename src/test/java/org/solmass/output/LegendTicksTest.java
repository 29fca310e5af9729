package org.solmass.output;

import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

class LegendTicksTest {
    /** The 1-2-5 series of "nice" steps (common practice for axis labels). */
    private static boolean oneTwoFive(double step) {
        double e = Math.floor(Math.log10(step) + 1e-9);
        double m = step / Math.pow(10, e);
        return Math.abs(m - 1) < 1e-9 || Math.abs(m - 2) < 1e-9 || Math.abs(m - 5) < 1e-9;
    }

    @Test
    void stepsAreOneTwoFiveAndTicksCoverTheRange() {
        Random rnd = new Random(42);
        for (int i = 0; i < 2000; i++) {
            double lo = (rnd.nextDouble() - 0.3) * Math.pow(10, rnd.nextInt(8) - 3);
            double hi = lo + rnd.nextDouble() * Math.pow(10, rnd.nextInt(8) - 3) + 1e-6;
            int max = 3 + rnd.nextInt(8);
            double step = LegendTicks.step(lo, hi, max);
            double[] t = LegendTicks.ticks(lo, hi, max);
            assertTrue(oneTwoFive(step), "step " + step);
            assertTrue(t.length >= 1 && t.length <= max, lo + ".." + hi + ": " + t.length + " ticks, max " + max);
            for (int k = 0; k < t.length; k++) {
                assertTrue(t[k] >= lo - 1e-9 * Math.abs(step) * 10 && t[k] <= hi + 1e-9 * Math.abs(step) * 10, "tick inside the range");
                if (k > 0) assertEquals(step, t[k] - t[k - 1], step * 1e-6);
            }
            assertTrue(t[0] - lo < step + 1e-9 && hi - t[t.length - 1] < step + 1e-9, "ticks reach within a step of both ends");
            // the step is the smallest one allowed: the next smaller 1-2-5 step would give too many ticks
        }
    }

    @Test
    void typicalIrradiationRangeGetsRoundTicks() {
        assertArrayEquals(new double[] {400, 600, 800, 1000, 1200}, LegendTicks.ticks(255, 1300, 8), 1e-9);
        assertEquals("0.25", LegendTicks.label(0.25, 0.05));
        assertEquals("1200", LegendTicks.label(1200, 200));
        assertArrayEquals(new double[] {0.2, 1.0}, LegendTicks.niceRange(0.23, 0.97, 5), 1e-12);
    }

    @Test
    void emptyRangeGivesOneTick() {
        assertArrayEquals(new double[] {5}, LegendTicks.ticks(5, 5, 6));
    }
}
