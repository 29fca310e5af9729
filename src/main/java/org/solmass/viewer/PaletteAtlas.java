package org.solmass.viewer;

/**
 * The texture layout of a patch mesh: every patch owns a square cell of {@link #CELL} x {@link #CELL}
 * texels (cells in rows of {@code cols}), drawn in its colour with a one-texel darker border so the
 * patch grid reads as faint outlines. The geometry and its texture coordinates never change;
 * recolouring rewrites the texels only, which is one texture upload instead of a mesh rebuild.
 */
public final class PaletteAtlas {
    /** Cell edge, texels. */
    public static final int CELL = 6;
    /** Brightness factor of the outline texels (1 = no outline). */
    public static final double OUTLINE = 0.88;

    public final int cols, width, height;

    /** Layout for n patches. */
    public PaletteAtlas(int n) {
        this.cols = Math.max(1, (int) Math.ceil(Math.sqrt(n)));
        int rows = Math.max(1, (n + cols - 1) / cols);
        this.width = cols * CELL;
        this.height = rows * CELL;
    }

    /** Texture u of local coordinate lu (0..1 across the patch) in cell c. */
    public float u(int c, float lu) {
        return ((c % cols) * CELL + 0.5f + lu * (CELL - 1f)) / width;
    }

    /** Texture v of local coordinate lv (0..1 across the patch) in cell c. */
    public float v(int c, float lv) {
        return ((c / cols) * CELL + 0.5f + lv * (CELL - 1f)) / height;
    }

    /** The cell a texture coordinate falls in (inverse of {@link #u}/{@link #v}). */
    public int cellAt(float u, float v) {
        int cx = Math.min(cols - 1, (int) (u * width / CELL)), cy = (int) (v * height / CELL);
        return cy * cols + cx;
    }

    /**
     * Writes ARGB texels (row-major, width x height): cell c in colour {@code rgbOfCell[c]}
     * (0xRRGGBB), its border darkened by {@link #OUTLINE}.
     */
    public void fill(int[] rgbOfCell, int[] out) {
        for (int c = 0; c < rgbOfCell.length; c++) {
            int rgb = 0xFF000000 | rgbOfCell[c], edge = 0xFF000000 | darken(rgbOfCell[c], OUTLINE);
            int x0 = (c % cols) * CELL, y0 = (c / cols) * CELL;
            for (int y = 0; y < CELL; y++) {
                int row = (y0 + y) * width + x0;
                boolean by = y == 0 || y == CELL - 1;
                for (int x = 0; x < CELL; x++) out[row + x] = by || x == 0 || x == CELL - 1 ? edge : rgb;
            }
        }
    }

    static int darken(int rgb, double f) {
        int r = (int) Math.round(((rgb >> 16) & 255) * f), g = (int) Math.round(((rgb >> 8) & 255) * f),
                b = (int) Math.round((rgb & 255) * f);
        return (r << 16) | (g << 8) | b;
    }
}
