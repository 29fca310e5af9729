package org.solmass.output;

import org.solmass.Cautions;
import org.solmass.model.Vec3;

import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;

/**
 * The viewer's PNG export as a sheet: a title band (study, quantity with unit, the period when known)
 * above the 3D snapshot, a north arrow over the snapshot turned to the camera's heading, and below it
 * the colour bar with ticks ({@link PageMarks#colourBar}) and the results caution
 * ({@link Cautions#RESULTS}); for a view of the shadow study two swatches (in sun, in shade) take the
 * colour bar's place ({@link ShadowMarks}). Plain java.awt, so it needs no display.
 */
public final class ExportSheet {
    /** Title band and footer heights and the side margin, in sheet units (pixels times {@link Layout#scale()}). */
    static final int TITLE_H = 66, FOOTER_H = 106, MARGIN = 18;

    private ExportSheet() {}

    /**
     * What the sheet says about the view.
     *
     * @param study study name (may be empty)
     * @param quantity quantity with its unit, e.g. the legend title "Annual irradiation (kWh/m²)"
     * @param period what the values cover ({@link RunPeriod}); null or empty when not known
     * @param lo value at the low end of the colour bar
     * @param hi value at the high end of the colour bar
     * @param diverging the diverging ramp (differences) instead of the sequential one
     * @param headingDeg compass direction the camera looks towards, degrees from north clockwise
     */
    public record Marks(String study, String quantity, String period, double lo, double hi, boolean diverging,
                        double headingDeg) {}

    /**
     * Where things go on a sheet for a snapshot of {@code viewW x viewH} pixels, in sheet pixels.
     *
     * @param scale whole pixels per sheet unit (larger snapshots get larger text)
     */
    record Layout(int scale, int width, int height, int viewTop, int barX, int barY, int barW, int barH,
                  int arrowX, int arrowY) {
        static Layout of(int viewW, int viewH) {
            int u = Math.max(1, (int) Math.round(viewW / 1200.0));
            int w = viewW / u;
            int barW = Math.max(80, Math.min(600, w / 2));
            return new Layout(u, viewW, viewH + (TITLE_H + FOOTER_H) * u, TITLE_H * u,
                    MARGIN * u, (viewH / u + TITLE_H + 30) * u, barW * u, 18 * u,
                    (w - 52) * u, (TITLE_H + 52) * u);
        }
    }

    /**
     * What the sheet says about a view of the shadow study (the viewer's slider): the legend is two
     * swatches, in sun and in shade, instead of a colour bar.
     *
     * @param study study name (may be empty)
     * @param moment the frame, e.g. "Shadow study, 21 March 15:00 local standard time"
     * @param sun the sun at that moment, e.g. "sun azimuth 225.7°, elevation 30.1°"; may be empty
     * @param sunRgb colour of "in sun", 0xRRGGBB
     * @param shadeRgb colour of "in shade", 0xRRGGBB
     * @param headingDeg compass direction the camera looks towards, degrees from north clockwise
     */
    public record ShadowMarks(String study, String moment, String sun, int sunRgb, int shadeRgb, double headingDeg) {}

    /** The sheet of a shadow-study view: title, north arrow, the two swatches and the caution. */
    public static BufferedImage compose(BufferedImage view, ShadowMarks m) {
        String sub = (m.sun() == null || m.sun().isBlank() ? "" : m.sun() + ". ")
                + "3D view exported from the viewer; each patch in sun or in shade by one ray from its centre to the sun";
        return compose(view, m.study(), m.moment(), sub, m.headingDeg(), (g, l) -> {
            int u = l.scale(), x = l.barX() / u, y = l.barY() / u, h = l.barH() / u;
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
            for (int k = 0; k < 2; k++) {
                g.setColor(new Color(k == 0 ? m.sunRgb() : m.shadeRgb()));
                g.fillRect(x, y, 2 * h, h);
                g.setColor(new Color(0x555555));
                g.drawRect(x, y, 2 * h, h);
                g.setColor(new Color(0x222222));
                String label = k == 0 ? "in sun" : "in shade";
                g.drawString(label, x + 2 * h + 6, y + h - 4);
                x += 2 * h + 14 + g.getFontMetrics().stringWidth(label) + 24;
            }
        });
    }

    /** The sheet: the snapshot unchanged between the title band and the legend, with the marks. */
    public static BufferedImage compose(BufferedImage view, Marks m) {
        String sub = (m.period() == null || m.period().isBlank() ? "" : m.period() + ". ")
                + "3D view exported from the viewer; analysed surfaces coloured by value, context in grey";
        return compose(view, m.study(), m.quantity(), sub, m.headingDeg(), (g, l) ->
                PageMarks.colourBar(g, l.barX() / l.scale(), l.barY() / l.scale(), l.barW() / l.scale(), l.barH() / l.scale(),
                        m.lo(), m.hi(), m.diverging()));
    }

    /** The sheet around a snapshot; {@code legend} draws the legend in sheet units at the layout's bar. */
    private static BufferedImage compose(BufferedImage view, String study, String quantity, String sub, double headingDeg,
                                         java.util.function.BiConsumer<Graphics2D, Layout> legend) {
        Layout l = Layout.of(view.getWidth(), view.getHeight());
        BufferedImage out = new BufferedImage(l.width(), l.height(), BufferedImage.TYPE_INT_RGB);
        Graphics2D g = PageMarks.begin(out);
        g.drawImage(view, 0, l.viewTop(), null);
        int u = l.scale(), w = l.width() / u, viewBottom = (l.viewTop() + view.getHeight()) / u;
        g.scale(u, u);
        String title = (study == null || study.isBlank() ? "" : study + " \u2014 ") + quantity;
        g.setColor(new Color(0x1E1E1E));
        PageMarks.fitFont(g, title, Font.BOLD, 22, w - 2 * MARGIN);
        g.drawString(title, MARGIN, 32);
        g.setColor(new Color(0x555555));
        PageMarks.fitFont(g, sub, Font.PLAIN, 13, w - 2 * MARGIN);
        g.drawString(sub, MARGIN, 54);
        // north as on screen: the plan turned by the heading, so north sits headingDeg anticlockwise from up
        double h = Math.toRadians(headingDeg);
        MapView turned = new MapView(new Vec3(Math.cos(h), -Math.sin(h), 0), new Vec3(Math.sin(h), Math.cos(h), 0), Vec3.UP);
        MapRenderer.northArrow(g, turned, l.arrowX() / u, l.arrowY() / u);
        legend.accept(g, l);
        g.setColor(new Color(0x222222));
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 13));
        g.drawString(quantity, MARGIN, viewBottom + 22);
        g.setColor(new Color(0x444444));
        PageMarks.fitFont(g, Cautions.RESULTS, Font.PLAIN, 12, w - 2 * MARGIN);
        if (g.getFontMetrics().stringWidth(Cautions.RESULTS) <= w - 2 * MARGIN) {
            g.drawString(Cautions.RESULTS, MARGIN, viewBottom + FOOTER_H - 10);
        } else { // a narrow view: the caution on two lines, split after its first sentence, never cut off
            int cut = Cautions.RESULTS.indexOf(". ") + 1;
            String a = Cautions.RESULTS.substring(0, cut), b = Cautions.RESULTS.substring(cut + 1);
            PageMarks.fitFont(g, b.length() > a.length() ? b : a, Font.PLAIN, 11, w - 2 * MARGIN);
            g.drawString(a, MARGIN, viewBottom + FOOTER_H - 22);
            g.drawString(b, MARGIN, viewBottom + FOOTER_H - 8);
        }
        g.dispose();
        return out;
    }
}
