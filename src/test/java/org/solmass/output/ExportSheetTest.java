package org.solmass.output;

import org.junit.jupiter.api.Test;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The viewer's export sheet composed from a synthetic snapshot (a flat invented picture, no display):
 * size, title, legend ends and the north arrow's direction.
 */
class ExportSheetTest {
    private static final int VIEW_RGB = 0x6A8FB0;

    private static BufferedImage view(int w, int h) {
        BufferedImage v = new BufferedImage(w, h, BufferedImage.TYPE_INT_ARGB);
        Graphics2D g = v.createGraphics();
        g.setColor(new Color(VIEW_RGB));
        g.fillRect(0, 0, w, h);
        g.dispose();
        return v;
    }

    private static ExportSheet.Marks marks(double headingDeg, boolean diverging) {
        return new ExportSheet.Marks("Invented block", "Annual irradiation (kWh/m\u00b2)", "Year of monthly-average days",
                diverging ? -200 : 300, diverging ? 200 : 1100, diverging, headingDeg);
    }

    @Test
    void sheetKeepsTheSnapshotWidthAndAddsBandsAboveAndBelowIt() {
        BufferedImage s = ExportSheet.compose(view(900, 600), marks(0, false));
        ExportSheet.Layout l = ExportSheet.Layout.of(900, 600);
        assertEquals(900, s.getWidth());
        assertTrue(s.getHeight() > 600 + 100, "title band and legend band add height: " + s.getHeight());
        // the snapshot is copied unchanged: its centre and its lower left corner keep the view colour
        assertEquals(VIEW_RGB, s.getRGB(450, l.viewTop() + 300) & 0xFFFFFF);
        assertEquals(VIEW_RGB, s.getRGB(1, l.viewTop() + 598) & 0xFFFFFF);
        // a larger snapshot (a 3x export) keeps its own size too
        BufferedImage big = ExportSheet.compose(view(2700, 1800), marks(0, false));
        assertEquals(2700, big.getWidth());
        assertTrue(big.getHeight() > s.getHeight() * 2);
    }

    /** A shadow-study view: the legend is the two swatches in the given colours (invented colours), no ramp. */
    @Test
    void shadowStudySheetShowsTheSunAndShadeSwatchesWhereTheColourBarWouldBe() {
        int sun = 0xF4D35E, shade = 0x34487A;
        BufferedImage s = ExportSheet.compose(view(900, 600), new ExportSheet.ShadowMarks("Invented block",
                "Shadow study, 03-21 15:00 local standard time", "Sun azimuth 225.7\u00b0, elevation 30.1\u00b0", sun, shade, 0));
        ExportSheet.Layout l = ExportSheet.Layout.of(900, 600);
        int sunPx = 0, shadePx = 0, rampPx = 0;
        for (int y = l.barY(); y < l.barY() + l.barH(); y++) {
            for (int x = l.barX(); x < l.barX() + l.barW(); x++) {
                int c = s.getRGB(x, y) & 0xFFFFFF;
                if (c == sun) sunPx++;
                if (c == shade) shadePx++;
                if (c == ColourRamp.sequential(0.5)) rampPx++;
            }
        }
        assertTrue(sunPx > 100 && shadePx > 100, "swatches: " + sunPx + " sun, " + shadePx + " shade pixels");
        assertEquals(0, rampPx, "no colour bar");
        assertEquals(900, s.getWidth());
    }

    @Test
    void titleBandCarriesText() {
        BufferedImage s = ExportSheet.compose(view(900, 600), marks(0, false));
        int ink = 0;
        for (int y = 0; y < ExportSheet.TITLE_H; y++) {
            for (int x = 0; x < s.getWidth(); x++) if ((s.getRGB(x, y) & 0xFFFFFF) != MapRenderer.BACKGROUND) ink++;
        }
        assertTrue(ink > 500, "title band pixels not background: " + ink);
    }

    @Test
    void legendEndsTakeTheRampEndColours() {
        for (boolean div : new boolean[] {false, true}) {
            BufferedImage s = ExportSheet.compose(view(900, 600), marks(0, div));
            ExportSheet.Layout l = ExportSheet.Layout.of(900, 600);
            int y = l.barY() + l.barH() / 2;
            int low = s.getRGB(l.barX() + 1, y) & 0xFFFFFF, high = s.getRGB(l.barX() + l.barW() - 1, y) & 0xFFFFFF;
            int lowRamp = div ? ColourRamp.diverging(-1) : ColourRamp.sequential(0);
            int highRamp = div ? ColourRamp.diverging(1) : ColourRamp.sequential(1);
            // one bar column is 1/(barW-1) of the ramp (barW = 450 here): a channel moves by a few levels at most
            assertClose(lowRamp, low, 3, "low end, diverging=" + div);
            assertClose(highRamp, high, 3, "high end, diverging=" + div);
        }
    }

    /**
     * Looking north (heading 0) north points up; looking east (90) north is on the left; looking south
     * (180) it points down; looking south-west (225) north is behind the camera and to its right, so down
     * and to the right, 45 deg from down (a compass turned with the camera, as the viewer's on-screen arrow). Checked as the direction from the arrow's centre to the
     * centroid of its dark pixels (arrow head and N).
     */
    @Test
    void northArrowPointsWhereTheHeadingPutsNorth() {
        double[][] cases = {{0, 0, -1}, {90, -1, 0}, {225, Math.sqrt(0.5), Math.sqrt(0.5)}, {180, 0, 1}};
        for (double[] c : cases) {
            BufferedImage s = ExportSheet.compose(view(900, 600), marks(c[0], false));
            ExportSheet.Layout l = ExportSheet.Layout.of(900, 600);
            double sx = 0, sy = 0;
            int n = 0;
            for (int y = l.arrowY() - 34; y <= l.arrowY() + 34; y++) {
                for (int x = l.arrowX() - 34; x <= l.arrowX() + 34; x++) {
                    double dx = x - l.arrowX(), dy = y - l.arrowY();
                    if (dx * dx + dy * dy > 34 * 34) continue;
                    if (ColourRamp.lightness(s.getRGB(x, y) & 0xFFFFFF) < 30) {
                        sx += dx;
                        sy += dy;
                        n++;
                    }
                }
            }
            assertTrue(n > 40, "dark arrow pixels at heading " + c[0] + ": " + n);
            double len = Math.hypot(sx, sy), cos = (sx * c[1] + sy * c[2]) / len;
            // a pixel at the head's 20 px subtends about 3 deg; allow two of them of rounding: cos(6 deg)
            assertTrue(cos > Math.cos(Math.toRadians(6)), "heading " + c[0] + ": centroid direction ("
                    + sx / len + ", " + sy / len + "), expected (" + c[1] + ", " + c[2] + ")");
        }
    }

    private static void assertClose(int want, int got, int tol, String what) {
        for (int sh = 0; sh <= 16; sh += 8) {
            int a = (want >> sh) & 0xFF, b = (got >> sh) & 0xFF;
            assertTrue(Math.abs(a - b) <= tol, what + ": want " + Integer.toHexString(want) + ", got " + Integer.toHexString(got));
        }
    }

    /** A narrow view (600 px): the caution wraps instead of running past the right edge (seen cut off before). */
    @Test
    void cautionOfANarrowViewStaysInsideTheMargins() {
        BufferedImage s = ExportSheet.compose(view(600, 400), marks(0, false));
        int bg = s.getRGB(s.getWidth() - 2, s.getHeight() - 2) & 0xFFFFFF, ink = 0;
        for (int y = s.getHeight() - ExportSheet.FOOTER_H; y < s.getHeight(); y++) {
            for (int x = s.getWidth() - ExportSheet.MARGIN + 4; x < s.getWidth(); x++) {
                if ((s.getRGB(x, y) & 0xFFFFFF) != bg) ink++;
            }
        }
        assertEquals(0, ink, "no footer text in the right margin");
    }
}
