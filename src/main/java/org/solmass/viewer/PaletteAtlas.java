package org.solmass.viewer;

/**
 * The texture layout of a patch mesh: every patch owns a square cell of {@code cell} x {@code cell}
 * texels (cells in rows of {@code cols}), drawn in its colour with a one-texel darker border so the
 * patch grid reads as faint outlines. Cells are as large as a budget of {@link #BUDGET} texels per
 * mesh allows, from {@link #MIN_CELL} to {@link #MAX_CELL}: the border stays thin however close
 * the camera comes (textures are sampled bilinearly, so a small cell blurs its border). The geometry and its texture coordinates never change;
 * recolouring rewrites the texels only, which is one texture upload instead of a mesh rebuild.
 */
public final class PaletteAtlas {
    /** Smallest and largest cell edge, texels. */
    public static final int MIN_CELL = 6, MAX_CELL = 16;
    /** Texels per mesh texture the cell size is chosen for (2 Mi texels = 8 MiB). */
    public static final int BUDGET = 1 << 21;
    /** Cell edge of this layout, texels. */
    public final int cell;
    /** Brightness factor of the outline texels (1 = no outline). */
    public static final double OUTLINE = 0.88;

    public final int cols, width, height;

    /** Layout for n patches. */
    public PaletteAtlas(int n) {
        this.cols = Math.max(1, (int) Math.ceil(Math.sqrt(n)));
        int rows = Math.max(1, (n + cols - 1) / cols);
        this.cell = Math.max(MIN_CELL, Math.min(MAX_CELL, (int) Math.floor(Math.sqrt(BUDGET / (double) Math.max(1, n)))));
        this.width = cols * cell;
        this.height = rows * cell;
    }

    /** Texture u of local coordinate lu (0..1 across the patch) in cell c. */
    public float u(int c, float lu) {
        return ((c % cols) * cell + 0.5f + lu * (cell - 1f)) / width;
    }

    /** Texture v of local coordinate lv (0..1 across the patch) in cell c. */
    public float v(int c, float lv) {
        return ((c / cols) * cell + 0.5f + lv * (cell - 1f)) / height;
    }

    /** The cell a texture coordinate falls in (inverse of {@link #u}/{@link #v}). */
    public int cellAt(float u, float v) {
        int cx = Math.min(cols - 1, (int) (u * width / cell)), cy = (int) (v * height / cell);
        return cy * cols + cx;
    }

    /**
     * Writes ARGB texels (row-major, width x height): cell c in colour {@code rgbOfCell[c]}
     * (0xRRGGBB), its border darkened by {@link #OUTLINE}.
     */
    public void fill(int[] rgbOfCell, int[] out) {
        for (int c = 0; c < rgbOfCell.length; c++) {
            int rgb = 0xFF000000 | rgbOfCell[c], edge = 0xFF000000 | darken(rgbOfCell[c], OUTLINE);
            int x0 = (c % cols) * cell, y0 = (c / cols) * cell;
            for (int y = 0; y < cell; y++) {
                int row = (y0 + y) * width + x0;
                boolean by = y == 0 || y == cell - 1;
                for (int x = 0; x < cell; x++) out[row + x] = by || x == 0 || x == cell - 1 ? edge : rgb;
            }
        }
    }

    static int darken(int rgb, double f) {
        int r = (int) Math.round(((rgb >> 16) & 255) * f), g = (int) Math.round(((rgb >> 8) & 255) * f),
                b = (int) Math.round((rgb & 255) * f);
        return (r << 16) | (g << 8) | b;
    }
}
