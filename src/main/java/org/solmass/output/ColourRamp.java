package org.solmass.output;

/**
 * Solmass's own colour ramps, defined in CIE L*C*h (CIELAB in polar form) and converted to sRGB.
 *
 * <p>The sequential ramp "dusk to noon" runs from a deep slate blue (low values) through a muted
 * plum and terracotta to a pale sand yellow (high values). Its lightness L* rises linearly from 22 to
 * 94, so the order of values reads in greyscale and under the common colour-vision deficiencies
 * (which mostly remove the red-green axis, not lightness). Hue turns from 265 deg to 90 deg through
 * the reds, chroma peaks mid-ramp and falls at both ends so the ends stay inside the sRGB gamut.
 *
 * <p>The diverging ramp for differences runs from a blue (negative) through a neutral light grey at
 * zero to an orange-brown (positive), both arms monotonic in L* towards zero.
 *
 * <p>Conversions: CIELAB to XYZ with the D65 white (CIE 15:2004), XYZ to linear sRGB and the sRGB
 * transfer curve (IEC 61966-2-1:1999). Out-of-gamut colours are brought in by reducing chroma at
 * constant L* and hue, so lightness is kept exactly.
 */
public final class ColourRamp {
    private static final int SIZE = 256;
    private static final int[] SEQUENTIAL = new int[SIZE];
    private static final int[] DIVERGING = new int[SIZE];

    /** Lightness at the low and high ends of the sequential ramp (CIELAB L*). */
    public static final double L_LOW = 22, L_HIGH = 94;

    static {
        for (int i = 0; i < SIZE; i++) {
            double t = i / (SIZE - 1.0);
            SEQUENTIAL[i] = sequentialLch(t);
            DIVERGING[i] = divergingLch(2 * t - 1);
        }
        keepLightnessRising(SEQUENTIAL);
    }

    /**
     * Rounding to 8-bit sRGB can make L* dip by a few hundredths between neighbouring entries where
     * hue turns fast; nudge such an entry by one code value per channel to the nearest colour that
     * does not fall below its predecessor.
     */
    private static void keepLightnessRising(int[] lut) {
        for (int i = 1; i < lut.length; i++) {
            double floor = lightness(lut[i - 1]);
            if (lightness(lut[i]) >= floor) continue;
            int best = lut[i];
            double bestCost = Double.POSITIVE_INFINITY;
            for (int dr = -1; dr <= 1; dr++) for (int dg = -1; dg <= 1; dg++) for (int db = -1; db <= 1; db++) {
                int r = clamp8(((lut[i] >> 16) & 255) + dr), g = clamp8(((lut[i] >> 8) & 255) + dg), b = clamp8((lut[i] & 255) + db);
                int c = (r << 16) | (g << 8) | b;
                double l = lightness(c);
                double cost = Math.abs(dr) + Math.abs(dg) + Math.abs(db);
                if (l >= floor && cost < bestCost) {
                    best = c;
                    bestCost = cost;
                }
            }
            lut[i] = best;
        }
    }

    private static int clamp8(int v) { return Math.max(0, Math.min(255, v)); }

    private ColourRamp() {}

    /** sRGB colour (0xRRGGBB) of the sequential ramp at t in [0,1] (clamped; NaN gives mid grey). */
    public static int sequential(double t) {
        if (Double.isNaN(t)) return 0x808080;
        return SEQUENTIAL[index(t)];
    }

    /** sRGB colour (0xRRGGBB) of the diverging ramp at s in [-1,1] (clamped), neutral at 0. */
    public static int diverging(double s) {
        if (Double.isNaN(s)) return 0x808080;
        return DIVERGING[index((s + 1) / 2)];
    }

    /** Value v mapped to [0,1] on the range [lo,hi] (clamped); a zero-width range gives 0.5. */
    public static double normalise(double v, double lo, double hi) {
        if (!(hi > lo)) return 0.5;
        return Math.max(0, Math.min(1, (v - lo) / (hi - lo)));
    }

    private static int index(double t) {
        double c = Math.max(0, Math.min(1, t));
        return (int) Math.round(c * (SIZE - 1));
    }

    private static int sequentialLch(double t) {
        double l = L_LOW + (L_HIGH - L_LOW) * t;
        double hue = 265 + (450 - 265) * t;           // 265 -> 450 (= 90) through 360 (reds)
        double chroma = 20 + 24 * Math.sin(Math.PI * t);
        return lchToRgb(l, chroma, hue);
    }

    private static int divergingLch(double s) {
        double a = Math.abs(s);
        double l = 92 - 52 * a;                        // 92 at zero, 40 at the ends
        double chroma = 55 * Math.pow(a, 0.8);
        double hue = s < 0 ? 255 : 55;
        return lchToRgb(l, chroma, hue);
    }

    /** CIE L*C*h to sRGB 0xRRGGBB, reducing chroma until in gamut. */
    static int lchToRgb(double l, double c, double hDeg) {
        double h = Math.toRadians(hDeg);
        for (double cc = c; cc >= 0; cc -= 0.25) {
            double[] rgb = labToLinearRgb(l, cc * Math.cos(h), cc * Math.sin(h));
            if (inGamut(rgb)) return pack(rgb);
        }
        return pack(labToLinearRgb(l, 0, 0));
    }

    private static boolean inGamut(double[] rgb) {
        for (double v : rgb) if (v < -1e-9 || v > 1 + 1e-9) return false;
        return true;
    }

    /** CIELAB (D65) to linear sRGB. CIE 15:2004 inverse transform; IEC 61966-2-1 matrix. */
    static double[] labToLinearRgb(double l, double a, double b) {
        double fy = (l + 16) / 116, fx = fy + a / 500, fz = fy - b / 200;
        double x = 0.95047 * finv(fx), y = 1.00000 * finv(fy), z = 1.08883 * finv(fz);
        return new double[] {
                3.2404542 * x - 1.5371385 * y - 0.4985314 * z,
                -0.9692660 * x + 1.8760108 * y + 0.0415560 * z,
                0.0556434 * x - 0.2040259 * y + 1.0572252 * z};
    }

    private static double finv(double f) {
        double d = 6.0 / 29;
        return f > d ? f * f * f : 3 * d * d * (f - 4.0 / 29);
    }

    private static int pack(double[] lin) {
        int r = encode(lin[0]), g = encode(lin[1]), b = encode(lin[2]);
        return (r << 16) | (g << 8) | b;
    }

    private static int encode(double v) {
        double c = Math.max(0, Math.min(1, v));
        double s = c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
        return (int) Math.round(s * 255);
    }

    /** CIELAB L* of an sRGB colour 0xRRGGBB (IEC 61966-2-1 decoding, CIE 15:2004 L*). */
    public static double lightness(int rgb) {
        double r = decode((rgb >> 16) & 255), g = decode((rgb >> 8) & 255), b = decode(rgb & 255);
        double y = 0.2126729 * r + 0.7151522 * g + 0.0721750 * b;
        double e = 216.0 / 24389, k = 24389.0 / 27;
        double fy = y > e ? Math.cbrt(y) : (k * y + 16) / 116;
        return 116 * fy - 16;
    }

    private static double decode(int v8) {
        double s = v8 / 255.0;
        return s <= 0.04045 ? s / 12.92 : Math.pow((s + 0.055) / 1.055, 2.4);
    }
}
