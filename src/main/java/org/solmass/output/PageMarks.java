package org.solmass.output;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;

/**
 * Marks every exported page shares: the colour bar with 1-2-5 ticks ({@link LegendTicks}) and the
 * scale bar of a plan or elevation drawn at a known scale. One drawing of each for map.png, the
 * shadow sheet and the facade elevations.
 */
final class PageMarks {
    private PageMarks() {}

    /** Graphics on a page: anti-aliased shapes and text, the page cleared to the map's background. */
    static Graphics2D begin(java.awt.image.BufferedImage img) {
        Graphics2D g = img.createGraphics();
        g.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, java.awt.RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(java.awt.RenderingHints.KEY_TEXT_ANTIALIASING, java.awt.RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setColor(new Color(MapRenderer.BACKGROUND));
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        return g;
    }

    /** Sets the largest sans-serif font of {@code style} from {@code size} down to 8 points in which {@code text} fits {@code maxW} pixels. */
    static void fitFont(Graphics2D g, String text, int style, int size, int maxW) {
        int s = size;
        do g.setFont(new Font(Font.SANS_SERIF, style, s--));
        while (s >= 8 && g.getFontMetrics().stringWidth(text) > maxW);
    }

    /**
     * A colour bar of {@code barW x barH} pixels at (bx, by) with ticks and their labels below it.
     *
     * @param diverging the diverging ramp (neutral at zero) instead of the sequential one
     */
    static void colourBar(Graphics2D g, int bx, int by, int barW, int barH, double lo, double hi, boolean diverging) {
        for (int i = 0; i < barW; i++) {
            double t = i / (barW - 1.0);
            g.setColor(new Color(diverging ? ColourRamp.diverging(2 * t - 1) : ColourRamp.sequential(t)));
            g.fillRect(bx + i, by, 1, barH);
        }
        g.setColor(new Color(0x666666));
        g.setStroke(new BasicStroke(1f));
        g.drawRect(bx, by, barW, barH);
        double step = LegendTicks.step(lo, hi, 8);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        FontMetrics fm = g.getFontMetrics();
        for (double t : LegendTicks.ticks(lo, hi, 8)) {
            int tx = bx + (int) Math.round(ColourRamp.normalise(t, lo, hi) * barW);
            g.setColor(new Color(0x333333));
            g.drawLine(tx, by + barH, tx, by + barH + 6);
            String s = LegendTicks.label(t, step);
            g.drawString(s, tx - fm.stringWidth(s) / 2, by + barH + 20);
        }
    }

    /**
     * A scale bar of a 1-2-5 length near a quarter of {@code widthPx} (at most a third), half filled,
     * with "0" and its length in metres above it, on a light backing; (x, y) is its lower left.
     *
     * @param pxPerM pixels per metre of the picture it belongs to
     * @param widthPx width of that picture, pixels
     */
    static void scaleBar(Graphics2D g, double pxPerM, int x, int y, int widthPx) {
        if (!(pxPerM > 0)) return;
        double target = widthPx / 4.0 / pxPerM, len = LegendTicks.step(0, target * 2.5, 2);
        while (len * pxPerM > widthPx / 3.0) len /= 2;
        int px = (int) Math.round(len * pxPerM);
        g.setColor(new Color(255, 255, 255, 215));
        g.fillRect(x - 6, y - 22, px + 36, 30);
        g.setColor(new Color(0x222222));
        g.fillRect(x, y - 4, px / 2, 5);
        g.setStroke(new BasicStroke(1.2f));
        g.drawRect(x, y - 4, px, 5);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        g.drawString("0", x - 3, y - 8);
        String s = LegendTicks.label(len, len) + " m";
        g.drawString(s, x + px - g.getFontMetrics().stringWidth(s) / 2, y - 8);
    }
}
