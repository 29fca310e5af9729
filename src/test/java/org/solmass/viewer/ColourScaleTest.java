package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.output.ColourRamp;

import static org.junit.jupiter.api.Assertions.assertEquals;

class ColourScaleTest {
    private final ColourScale s = new ColourScale(100, 1100, false);

    @Test
    void rangeEndsMapToTheRampEnds() {
        // the legend's ends are the ramp's ends (pipeline ramp, ColourRamp)
        assertEquals(0, s.index(100));
        assertEquals(255, s.index(1100));
        assertEquals(ColourRamp.sequential(0), s.rgb(100));
        assertEquals(ColourRamp.sequential(1), s.rgb(1100));
        assertEquals(128, s.index(600), "mid value -> mid entry (127.5 rounds half up)");
    }

    @Test
    void valuesOutsideTheRangeAreClampedToTheEnds() {
        assertEquals(0, s.index(-5000));
        assertEquals(255, s.index(1e9));
    }

    @Test
    void missingValuesGetTheNeutralEntry() {
        assertEquals(ColourScale.NAN_INDEX, s.index(Double.NaN));
        assertEquals(ColourScale.NAN_INDEX, s.index(Double.POSITIVE_INFINITY));
        assertEquals(ColourScale.NAN_RGB, s.rgb(Double.NaN));
    }

    @Test
    void automaticRangeSpansTheFiniteValuesOnly() {
        ColourScale a = ColourScale.auto(new double[] {3, Double.NaN, -2, 7, Double.NEGATIVE_INFINITY}, false);
        assertEquals(-2, a.min());
        assertEquals(7, a.max());
    }

    @Test
    void differencesUseASymmetricRangeSoZeroIsNeutral() {
        ColourScale d = ColourScale.auto(new double[] {-3, 1, 8}, true);
        assertEquals(-8, d.min());
        assertEquals(8, d.max());
        // zero sits on the diverging ramp's neutral centre (index 127.5 -> 128, ramp value s = +1/255)
        assertEquals(ColourRamp.diverging(1 / 255.0), d.rgb(0));
    }

    @Test
    void noFiniteValuesGiveAUnitRange() {
        ColourScale a = ColourScale.auto(new double[] {Double.NaN}, false);
        assertEquals(0, a.min());
        assertEquals(1, a.max());
    }

    @Test
    void thresholdFadesOnlyValuesBelowIt() {
        int[] c = s.indices(new double[] {500, 600, 700, Double.NaN}, 600);
        assertEquals(ColourScale.BELOW_INDEX, c[0]);
        assertEquals(s.index(600), c[1], "at the threshold counts as at or above");
        assertEquals(s.index(700), c[2]);
        assertEquals(ColourScale.NAN_INDEX, c[3]);
    }
}
