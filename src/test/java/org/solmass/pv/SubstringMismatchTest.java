package org.solmass.pv;

import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Bypass-diode substrings in series (common practice; the substring picture of Deline et al. 2013,
 * Solar Energy 96, 274-282). Analytic cases with the diode voltage drop neglected.
 */
class SubstringMismatchTest {

    @Test
    void uniformIrradianceHasNoMismatch() {
        assertEquals(700, SubstringMismatch.equivalentWm2(new double[] {700, 700, 700}), 1e-12);
    }

    /** One of three substrings fully shaded: its diode bypasses it, the other two give 2/3 of the power. */
    @Test
    void oneOfThreeSubstringsFullyShadedGivesTwoThirds() {
        assertEquals(1000 * 2.0 / 3, SubstringMismatch.equivalentWm2(new double[] {1000, 0, 1000}), 1e-9);
    }

    /**
     * One substring at half light: bypassing it (2 x 1000 / 3 = 667) beats dragging the current down
     * (3 x 500 / 3 = 500), and both lose against the mean 833: mismatch 167 W/m2 equivalent.
     */
    @Test
    void halfShadedSubstringIsBypassedWhenThatGivesMore() {
        assertEquals(2000.0 / 3, SubstringMismatch.equivalentWm2(new double[] {1000, 1000, 500}), 1e-9);
        assertEquals(2500.0 / 3, SubstringMismatch.meanWm2(new double[] {1000, 1000, 500}), 1e-9);
    }

    /** Lightly shaded substring: all three carry its current (3 x 900 / 3 = 900 > 2 x 1000 / 3 = 667). */
    @Test
    void lightlyShadedSubstringLimitsTheCurrent() {
        assertEquals(900, SubstringMismatch.equivalentWm2(new double[] {1000, 900, 1000}), 1e-9);
    }

    /** Bounds that hold for any pattern: max/n <= equivalent <= mean, independent of substring order. */
    @Test
    void equivalentLiesBetweenBrightestOverNAndTheMeanForAnyPattern() {
        Random r = new Random(18);
        for (int c = 0; c < 2000; c++) {
            int n = 1 + r.nextInt(6);
            double[] g = new double[n];
            double max = 0;
            for (int i = 0; i < n; i++) { g[i] = r.nextDouble() * 1100; max = Math.max(max, g[i]); }
            double e = SubstringMismatch.equivalentWm2(g);
            assertTrue(e <= SubstringMismatch.meanWm2(g) + 1e-9 && e >= max / n - 1e-9);
            double[] rev = new double[n];
            for (int i = 0; i < n; i++) rev[i] = g[n - 1 - i];
            assertEquals(e, SubstringMismatch.equivalentWm2(rev), 0);
        }
    }
}
