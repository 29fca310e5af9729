package org.solmass;

import org.junit.jupiter.api.Test;
import org.solmass.output.ColourRamp;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ColourRampTest {
    /** A sequential ramp must rise in CIELAB L* (common practice for perceptual ordering). */
    @Test
    void sequentialRampRisesMonotonicallyInLightness() {
        double prev = -1;
        for (int i = 0; i <= 1000; i++) {
            double l = ColourRamp.lightness(ColourRamp.sequential(i / 1000.0));
            assertTrue(l >= prev - 1e-9, "L* falls at t=" + i / 1000.0 + ": " + prev + " -> " + l);
            prev = l;
        }
        double span = ColourRamp.lightness(ColourRamp.sequential(1)) - ColourRamp.lightness(ColourRamp.sequential(0));
        assertTrue(span > 65, "L* span " + span);
    }

    /** Chroma is only reduced to reach the gamut, never lightness: L* stays on its line within 8-bit rounding. */
    @Test
    void sequentialRampKeepsItsDesignLightness() {
        for (int i = 0; i <= 20; i++) {
            double t = i / 20.0;
            double want = ColourRamp.L_LOW + (ColourRamp.L_HIGH - ColourRamp.L_LOW) * t;
            assertEquals(want, ColourRamp.lightness(ColourRamp.sequential(t)), 0.6, "t=" + t);
        }
    }

    @Test
    void divergingRampIsNeutralAtZeroAndDarkensTowardBothEnds() {
        int mid = ColourRamp.diverging(0);
        int r = (mid >> 16) & 255, g = (mid >> 8) & 255, b = mid & 255;
        assertTrue(Math.abs(r - g) <= 2 && Math.abs(g - b) <= 2, "neutral grey at zero: " + Integer.toHexString(mid));
        double prevNeg = 101, prevPos = 101;
        for (int i = 0; i <= 100; i++) {
            double lNeg = ColourRamp.lightness(ColourRamp.diverging(-i / 100.0));
            double lPos = ColourRamp.lightness(ColourRamp.diverging(i / 100.0));
            assertTrue(lNeg <= prevNeg + 1e-9 && lPos <= prevPos + 1e-9);
            prevNeg = lNeg;
            prevPos = lPos;
        }
    }

    /**
     * sRGB white has L* = 100 and black L* = 0 (CIE 15:2004 definition). The sRGB-to-Y row of IEC
     * 61966-2-1 is published to 7 decimals and sums to 1.0000001, so white comes out within 1e-5.
     */
    @Test
    void lightnessOfWhiteAndBlack() {
        assertEquals(100, ColourRamp.lightness(0xFFFFFF), 1e-5);
        assertEquals(0, ColourRamp.lightness(0x000000), 1e-9);
    }
}
