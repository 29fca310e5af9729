package org.solmass.viewer;

/**
 * The texture the patch meshes sample: one square cell per palette entry (256 ramp colours, the
 * missing-value colour and the below-threshold colour), each with a one-texel darker border so the
 * patch grid reads as faint outlines. Patches take their colour from the texture coordinates of
 * their corners, so recolouring rewrites texture coordinates, not nodes.
 */
public final class PaletteAtlas {
    /** Cell edge, texels. */
    public static final int CELL = 16;
    /** Cells per atlas row. */
    public static final int COLS = 16;
    /** Rows of cells: 256 ramp entries + 2 special entries need 17 rows of 16. */
    public static final int ROWS = 17;
    public static final int WIDTH = COLS * CELL, HEIGHT = ROWS * CELL;
    /** Brightness factor of the outline texels (1 = no outline). */
    public static final double OUTLINE = 0.80;

    private PaletteAtlas() {}

    /** ARGB pixels (row-major, WIDTH x HEIGHT) for a scale's palette. */
    public static int[] pixels(ColourScale scale) {
        int[] px = new int[WIDTH * HEIGHT];
        for (int c = 0; c < COLS * ROWS; c++) {
            int rgb = c <= ColourScale.BELOW_INDEX ? scale.rgbOfIndex(c) : ColourScale.NAN_RGB;
            int edge = darken(rgb, OUTLINE);
            int x0 = (c % COLS) * CELL, y0 = (c / COLS) * CELL;
            for (int y = 0; y < CELL; y++) {
                for (int x = 0; x < CELL; x++) {
                    boolean border = x == 0 || y == 0 || x == CELL - 1 || y == CELL - 1;
                    px[(y0 + y) * WIDTH + x0 + x] = 0xFF000000 | (border ? edge : rgb);
                }
            }
        }
        return px;
    }

    static int darken(int rgb, double f) {
        int r = (int) Math.round(((rgb >> 16) & 255) * f), g = (int) Math.round(((rgb >> 8) & 255) * f),
                b = (int) Math.round((rgb & 255) * f);
        return (r << 16) | (g << 8) | b;
    }

    /** Texture u of local coordinate lu (0..1 across the patch) in cell c. */
    public static float u(int c, float lu) {
        return ((c % COLS) * CELL + 0.5f + lu * (CELL - 1f)) / WIDTH;
    }

    /** Texture v of local coordinate lv (0..1 across the patch) in cell c. */
    public static float v(int c, float lv) {
        return ((c / COLS) * CELL + 0.5f + lv * (CELL - 1f)) / HEIGHT;
    }

    /** The palette cell a texture coordinate falls in (inverse of {@link #u}/{@link #v}). */
    public static int cellAt(float u, float v) {
        int cx = Math.min(COLS - 1, (int) (u * WIDTH / CELL)), cy = Math.min(ROWS - 1, (int) (v * HEIGHT / CELL));
        return cy * COLS + cx;
    }
}
