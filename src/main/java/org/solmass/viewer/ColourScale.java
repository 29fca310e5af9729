package org.solmass.viewer;

import org.solmass.output.ColourRamp;

/**
 * Maps values to one of 256 entries of the pipeline's colour ramp ({@link ColourRamp}), clamping to
 * the range; NaN maps to {@link #NAN_INDEX}.
 *
 * @param min value at the low end of the ramp
 * @param max value at the high end of the ramp
 * @param diverging true: the diverging ramp (differences), false: the sequential ramp
 */
public record ColourScale(double min, double max, boolean diverging) {
    public static final int STEPS = 256;
    /** Palette index for a missing value (drawn neutral). */
    public static final int NAN_INDEX = 256;
    /** Palette index for a patch below the threshold (drawn faded). */
    public static final int BELOW_INDEX = 257;
    /** Colour for missing values, 0xRRGGBB. */
    public static final int NAN_RGB = 0x9A9A9A;
    /** Colour for patches below the threshold, 0xRRGGBB (light neutral so the rest stands out). */
    public static final int BELOW_RGB = 0xD9D7D2;

    /** The range of the finite values (symmetric about zero when diverging); {0,1} when there are none. */
    public static ColourScale auto(double[] values, boolean diverging) {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (double v : values) {
            if (Double.isFinite(v)) {
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
        }
        if (lo > hi) return new ColourScale(0, 1, diverging);
        if (diverging) {
            double a = Math.max(Math.abs(lo), Math.abs(hi));
            return new ColourScale(a == 0 ? -1 : -a, a == 0 ? 1 : a, true);
        }
        return new ColourScale(lo, hi, false);
    }

    /** Palette index 0..255 of a value, or {@link #NAN_INDEX} when it is not finite. */
    public int index(double v) {
        if (!Double.isFinite(v)) return NAN_INDEX;
        double t = ColourRamp.normalise(v, min, max);
        return (int) Math.round(t * (STEPS - 1));
    }

    /** sRGB 0xRRGGBB of a value. */
    public int rgb(double v) {
        int i = index(v);
        return i == NAN_INDEX ? NAN_RGB : rgbOfIndex(i);
    }

    /** sRGB 0xRRGGBB of palette index i (0..257). */
    public int rgbOfIndex(int i) {
        if (i == NAN_INDEX) return NAN_RGB;
        if (i == BELOW_INDEX) return BELOW_RGB;
        double t = i / (STEPS - 1.0);
        return diverging ? ColourRamp.diverging(2 * t - 1) : ColourRamp.sequential(t);
    }

    /** Palette indices of all values; those below {@code threshold} (when finite) get {@link #BELOW_INDEX}. */
    public int[] indices(double[] values, double threshold) {
        int[] out = new int[values.length];
        boolean thr = Double.isFinite(threshold);
        for (int i = 0; i < values.length; i++) {
            double v = values[i];
            out[i] = thr && Double.isFinite(v) && v < threshold ? BELOW_INDEX : index(v);
        }
        return out;
    }
}
