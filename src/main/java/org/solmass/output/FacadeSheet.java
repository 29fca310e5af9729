package org.solmass.output;

import org.solmass.Cautions;
import org.solmass.model.Compass;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;

import javax.imageio.ImageIO;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * A page of facade elevations of one block ({@link FacadeLayout}): every facade surface seen straight
 * on, side by side at one scale, its patches coloured by a per-patch quantity with the sequential ramp
 * ({@link ColourRamp}); above each panel its number, compass sector ({@link Compass}), surface label
 * and width; a title (study, block, quantity, unit, period), a colour bar, a scale bar, a key plan of
 * the block with the panel numbers and a north arrow, and the results caution. Rendered by the
 * map's software rasteriser ({@link Raster}, 2 x 2 supersampled), so it needs no display.
 */
public final class FacadeSheet {
    static final int MARGIN = 16, TITLE_H = 76, FOOTER_H = 150, LABEL_H = 40, MIN_SLOT = 96, GAP = 22;

    /**
     * What the page shows.
     *
     * @param widthPx page width, pixels
     * @param heightPx page height, pixels
     * @param study study name (first part of the title)
     * @param block block name
     * @param label quantity label
     * @param unit unit symbol
     * @param period what the values cover (e.g. the year and climate), shown under the title
     * @param lo low end of the colour range
     * @param hi high end of the colour range
     * @param diverging colour by {@link ColourRamp#diverging} (neutral at zero, signed differences)
     *                  instead of the sequential ramp
     * @param rangeNote how the range was chosen, shown under the colour bar
     */
    public record Options(int widthPx, int heightPx, String study, String block, String label, String unit,
                          String period, double lo, double hi, boolean diverging, String rangeNote) {
        /** The note of the range elevations share with map.png. */
        public static final String MAP_RANGE = "Range as in map.png (2nd to 98th percentile of the analysed patches); "
                + "values beyond it take the end colours";
    }

    /** sRGB colour of a value on the page's ramp. */
    static int colour(double v, Options o) {
        if (Double.isNaN(v)) return ColourRamp.sequential(Double.NaN);
        double t = ColourRamp.normalise(v, o.lo(), o.hi());
        return o.diverging() ? ColourRamp.diverging(2 * t - 1) : ColourRamp.sequential(t);
    }

    private FacadeSheet() {}

    /** The panels' placement on a page of this size (the area between title and footer). */
    public static FacadeLayout.Placement placement(FacadeLayout layout, int widthPx, int heightPx) {
        return layout.place(widthPx - 2 * MARGIN, heightPx - TITLE_H - FOOTER_H, MIN_SLOT, GAP, LABEL_H);
    }

    /**
     * Renders the page.
     *
     * @param values per patch value indexed by {@link Patch#index()}; NaN for none
     */
    public static BufferedImage render(FacadeLayout layout, double[] values, Options o) {
        int w = o.widthPx();
        FacadeLayout.Placement pl = placement(layout, w, o.heightPx());
        int h = height(pl, o.heightPx());
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = PageMarks.begin(img);
        double s = pl.scalePxPerM();
        List<FacadeLayout.Panel> panels = layout.panels();
        for (int i = 0; i < panels.size(); i++) {
            FacadeLayout.Panel p = panels.get(i);
            int ox = MARGIN + pl.x()[i], oy = TITLE_H + pl.y()[i];
            double rowH = pl.rowHeightM()[pl.row()[i]];
            int tw = (int) Math.ceil(p.widthM() * s) + 2, th = (int) Math.ceil(rowH * s) + 2;
            Raster r = new Raster(2 * tw, 2 * th, MapRenderer.BACKGROUND);
            for (int k = 0; k < p.patches().size(); k++) {
                Patch patch = p.patches().get(k);
                double v = values[patch.index()];
                int colour = colour(v, o);
                fillPatch(r, p.uv().get(k), patch.triangles(), 2 * s, rowH, colour);
            }
            for (double[] uv : p.uv()) {   // faint patch edges
                int m = uv.length / 2;
                for (int c = 0; c < m; c++) {
                    int d = (c + 1) % m;
                    r.line(2 * s * uv[2 * c], 2 * s * (rowH - uv[2 * c + 1]), 0, 2 * s * uv[2 * d], 2 * s * (rowH - uv[2 * d + 1]), 0,
                            MapRenderer.EDGE, 0.14, 1f);
                }
            }
            BufferedImage tile = new BufferedImage(tw, th, BufferedImage.TYPE_INT_RGB);
            tile.setRGB(0, 0, tw, th, r.downsample2(), 0, tw);
            g.drawImage(tile, ox, oy, null);
            g.setColor(new Color(0x888888));
            g.setStroke(new BasicStroke(1f));
            int base = (int) Math.round(oy + rowH * s);
            g.drawLine(ox - 4, base, ox + (int) Math.round(p.widthM() * s) + 4, base);   // the common base line
            panelLabel(g, i + 1, p, ox + p.widthM() * s / 2, oy - 6 + (int) Math.round((rowH - p.heightM()) * s));
        }
        title(g, o, s, w);
        footer(g, layout, o, s, w, h);
        g.dispose();
        return img;
    }

    /**
     * Height of the page: the requested height, or less when the panels at their scale leave room
     * (a wide block's single row of facades), so no band of white is left between panels and legend.
     */
    public static int height(FacadeLayout.Placement pl, int heightPx) {
        int used = 0;
        for (int i = 0; i < pl.x().length; i++) {
            used = Math.max(used, pl.y()[i] + (int) Math.ceil(pl.rowHeightM()[pl.row()[i]] * pl.scalePxPerM()) + 2);
        }
        return Math.min(heightPx, TITLE_H + used + 28 + FOOTER_H);
    }

    /** Renders and writes the PNG atomically. */
    public static void write(Path file, FacadeLayout layout, double[] values, Options o) {
        BufferedImage img = render(layout, values, o);
        AtomicFiles.write(file, out -> {
            if (!ImageIO.write(img, "png", out)) throw new java.io.IOException("no PNG writer available");
        });
    }

    /**
     * Fills one patch into a panel's raster: (u, w) metres to pixels at {@code pxPerM}, w measured down
     * from the row's top at {@code rowH} metres.
     */
    static void fillPatch(Raster r, double[] uv, int[] triangles, double pxPerM, double rowH, int colour) {
        int m = uv.length / 2;
        double[] xs = new double[m], ys = new double[m], zs = new double[m];
        for (int c = 0; c < m; c++) {
            xs[c] = uv[2 * c] * pxPerM;
            ys[c] = (rowH - uv[2 * c + 1]) * pxPerM;
        }
        r.polygon(xs, ys, zs, triangles, colour, 1f);
    }

    private static void panelLabel(Graphics2D g, int number, FacadeLayout.Panel p, double cx, int bottom) {
        String head = number + "  " + p.compass();
        String sub = String.format(Locale.ROOT, "%s, %.1f m", p.label(), p.widthM());
        g.setColor(new Color(0x1E1E1E));
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        FontMetrics fm = g.getFontMetrics();
        g.drawString(head, (float) (cx - fm.stringWidth(head) / 2.0), bottom - 17);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        fm = g.getFontMetrics();
        g.setColor(new Color(0x444444));
        g.drawString(sub, (float) (cx - fm.stringWidth(sub) / 2.0), bottom - 3);
    }

    private static void title(Graphics2D g, Options o, double s, int w) {
        g.setColor(new Color(0x1E1E1E));
        String unit = MapRenderer.display(o.unit());
        String t = (o.study() == null || o.study().isBlank() ? "" : o.study() + " \u2014 ") + "Facade elevations of "
                + o.block() + " \u2014 " + o.label() + (unit.isEmpty() ? "" : " (" + unit + ")");
        PageMarks.fitFont(g, t, Font.BOLD, 24, w - 2 * MARGIN);
        g.drawString(t, MARGIN, 34);
        g.setColor(new Color(0x555555));
        String sub = (o.period() == null || o.period().isBlank() ? "" : o.period() + ". ")
                + "Each facade seen straight on from outside, unrolled from the south with the block on the left; "
                + String.format(Locale.ROOT, "one scale for the page: %.2f px per metre", s);
        PageMarks.fitFont(g, sub, Font.PLAIN, 14, w - 2 * MARGIN);
        g.drawString(sub, MARGIN, 56);
    }

    private static void footer(Graphics2D g, FacadeLayout layout, Options o, double s, int w, int h) {
        int top = h - FOOTER_H, bx = MARGIN + 4, barW = Math.min(700, (int) (w * 0.32)), keyX = w - MARGIN - 300;
        String unit = MapRenderer.display(o.unit());
        g.setColor(new Color(0x222222));
        String label = o.label() + (unit.isEmpty() ? "" : ", " + unit);
        PageMarks.fitFont(g, label, Font.BOLD, 15, keyX - bx - 20);
        g.drawString(label, bx, top + 22);
        PageMarks.colourBar(g, bx, top + 32, barW, 20, o.lo(), o.hi(), o.diverging());
        g.setColor(new Color(0x444444));
        String note = o.rangeNote() == null ? "" : o.rangeNote();
        PageMarks.fitFont(g, note, Font.PLAIN, 13, keyX - bx - 120);
        g.drawString(note, bx, top + 96);
        g.setColor(new Color(ColourRamp.sequential(Double.NaN)));
        int nx = bx + g.getFontMetrics().stringWidth(note) + 24;
        g.fillRect(nx, top + 85, 16, 12);
        g.setColor(new Color(0x444444));
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        g.drawString("No value", nx + 22, top + 96);
        PageMarks.scaleBar(g, s, bx + barW + 40, top + 60, Math.min(600, w / 3));
        keyPlan(g, layout, keyX, top + 6, 200, FOOTER_H - 42);
        MapRenderer.northArrow(g, MapView.looking(Vec3.UP), w - MARGIN - 48, top + 52);
        g.setColor(new Color(0x555555));
        PageMarks.fitFont(g, Cautions.RESULTS, Font.PLAIN, 13, w - 2 * MARGIN);   // one line: the font shrinks to fit
        g.drawString(Cautions.RESULTS, MARGIN, h - 10);
    }

    /** The block's facades in plan (north up), each marked with its panel number, fitted into a box. */
    private static void keyPlan(Graphics2D g, FacadeLayout layout, int x, int y, int bw, int bh) {
        double minX = Double.POSITIVE_INFINITY, minY = minX, maxX = Double.NEGATIVE_INFINITY, maxY = maxX;
        for (FacadeLayout.Panel p : layout.panels()) {
            for (Patch q : p.patches()) {
                double[] o = q.outline();
                for (int k = 0; k + 2 < o.length; k += 3) {
                    minX = Math.min(minX, o[k]); maxX = Math.max(maxX, o[k]);
                    minY = Math.min(minY, o[k + 1]); maxY = Math.max(maxY, o[k + 1]);
                }
            }
        }
        if (!(maxX >= minX)) return;
        int pad = 16;
        double sc = Math.min((bw - 2 * pad) / Math.max(1e-9, maxX - minX), (bh - 2 * pad) / Math.max(1e-9, maxY - minY));
        double cx = x + bw / 2.0, cy = y + bh / 2.0, mx = (minX + maxX) / 2, my = (minY + maxY) / 2;
        g.setColor(new Color(0xF4F3EF));
        g.fillRect(x, y, bw, bh);
        g.setColor(new Color(0xB0B0B0));
        g.drawRect(x, y, bw, bh);
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 11));
        FontMetrics fm = g.getFontMetrics();
        List<FacadeLayout.Panel> panels = layout.panels();
        for (int i = 0; i < panels.size(); i++) {
            FacadeLayout.Panel p = panels.get(i);
            double ax = Double.NaN, ay = 0, bxp = 0, byp = 0, lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            double ux = -Math.cos(Math.toRadians(p.azimuthDeg())), uy = Math.sin(Math.toRadians(p.azimuthDeg()));
            for (Patch q : p.patches()) {
                double[] o = q.outline();
                for (int k = 0; k + 2 < o.length; k += 3) {
                    double t = o[k] * ux + o[k + 1] * uy;
                    if (t < lo) { lo = t; ax = o[k]; ay = o[k + 1]; }
                    if (t > hi) { hi = t; bxp = o[k]; byp = o[k + 1]; }
                }
            }
            if (Double.isNaN(ax)) continue;
            g.setColor(new Color(0x333333));
            g.setStroke(new BasicStroke(2f));
            int x0 = (int) Math.round(cx + (ax - mx) * sc), y0 = (int) Math.round(cy - (ay - my) * sc);
            int x1 = (int) Math.round(cx + (bxp - mx) * sc), y1 = (int) Math.round(cy - (byp - my) * sc);
            g.drawLine(x0, y0, x1, y1);
            double nx = Math.sin(Math.toRadians(p.azimuthDeg())), ny = Math.cos(Math.toRadians(p.azimuthDeg()));
            String n = Integer.toString(i + 1);
            double lx = (x0 + x1) / 2.0 + nx * 9, ly = (y0 + y1) / 2.0 - ny * 9;
            g.setColor(new Color(0x00665E));
            g.drawString(n, (float) (lx - fm.stringWidth(n) / 2.0), (float) (ly + fm.getAscent() / 2.0 - 1));
        }
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        g.setColor(new Color(0x444444));
        g.drawString("Key plan, north up", x + 4, y + bh + 14);
    }
}
