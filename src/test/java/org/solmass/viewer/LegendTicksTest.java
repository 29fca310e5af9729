package org.solmass.viewer;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

/** Expected ticks worked by hand from Heckbert's nice-number rule (Graphics Gems, 1990). */
class LegendTicksTest {

    @Test
    void annualRangeGetsTicksEveryTwoHundred() {
        // (1150 - 140) / 5 = 202 -> nice 2 x 100
        assertEquals(200, LegendTicks.step(140, 1150, 5), 1e-12);
        assertArrayEquals(new double[] {200, 400, 600, 800, 1000}, LegendTicks.ticks(140, 1150, 5), 1e-9);
    }

    @Test
    void unitRangeGetsExactDecimalTicks() {
        // 1 / 5 = 0.2 -> nice 2 x 0.1; multiples are exact, no 0.6000000000000001
        double[] t = LegendTicks.ticks(0, 1, 5);
        assertArrayEquals(new double[] {0, 0.2, 0.4, 0.6, 0.8, 1.0}, t, 0);
        assertEquals("0.6", LegendTicks.format(t[3], 0.2));
        assertEquals(1, LegendTicks.decimals(0.2));
        assertEquals(0, LegendTicks.decimals(200));
    }

    @Test
    void symmetricDifferenceRangeIsCentredOnZero() {
        // 6 / 5 = 1.2 -> nice 1
        assertArrayEquals(new double[] {-3, -2, -1, 0, 1, 2, 3}, LegendTicks.ticks(-3, 3, 5), 0);
    }

    @Test
    void everyTickLiesInsideTheRange() {
        java.util.Random r = new java.util.Random(5);
        for (int i = 0; i < 500; i++) {
            double a = (r.nextDouble() - 0.5) * Math.pow(10, r.nextInt(8) - 3), b = a + r.nextDouble() * Math.pow(10, r.nextInt(8) - 3) + 1e-6;
            double[] t = LegendTicks.ticks(a, b, 5);
            double step = LegendTicks.step(a, b, 5);
            for (double v : t) {
                assertEquals(true, v >= a - step * 1e-6 && v <= b + step * 1e-6, v + " outside " + a + ".." + b);
            }
            assertEquals(true, t.length >= 2 && t.length <= 12, "tick count " + t.length + " for " + a + ".." + b);
        }
    }

    @Test
    void emptyRangeGivesOneTick() {
        assertArrayEquals(new double[] {4}, LegendTicks.ticks(4, 4, 5), 0);
    }
}
