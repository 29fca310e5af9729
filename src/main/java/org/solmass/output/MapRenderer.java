package org.solmass.output;

import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;

import javax.imageio.ImageIO;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.Rectangle;
import java.awt.geom.Path2D;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

/**
 * Headless PNG map of a per-patch quantity: an axonometric view (by default from the south-west,
 * 30 deg above the horizon) and a plan (top view, north up), side by side; analysed patches filled
 * with {@link ColourRamp#sequential} with faint outlines, context blocks in neutral grey shaded by
 * their normal, surface edges drawn as thin dark lines, a light ground plane; a legend with 1-2-5
 * ticks and the unit, a north arrow in each panel and a title line. Hidden surfaces are removed with
 * a depth buffer (software rasteriser, 2 x 2 supersampled), so it needs no display
 * ({@code -Djava.awt.headless=true} works). Layout and range rule: docs/outputs.md.
 */
public final class MapRenderer {
    /** Background, ground plane, analysed-but-unpatched faces and edge colours (sRGB). */
    static final int BACKGROUND = 0xFFFFFF, GROUND = 0xECEAE4, UNPATCHED = 0xD9D6CF, EDGE = 0x2E2E2E;
    private static final int TITLE_H = 70, LEGEND_H = 110, MARGIN = 16, CAPTION_H = 24;

    private MapRenderer() {}

    /**
     * @param widthPx image width, pixels
     * @param heightPx image height, pixels
     * @param title first part of the title line (the study name)
     * @param rangeLo low end of the colour range; NaN for automatic (2nd percentile)
     * @param rangeHi high end of the colour range; NaN for automatic (98th percentile)
     * @param viewAzimuthDeg azimuth the axonometric view looks from, degrees from north clockwise; NaN
     *                       for automatic: the diagonal view (from NE, SE, SW or NW) that shows the most
     *                       analysed patch area ({@link #bestViewAzimuth})
     * @param viewElevationDeg elevation of the axonometric view above the horizon, degrees
     * @param period what the values cover (e.g. "Year of monthly-average days, climate FILE",
     *               {@link RunPeriod}), shown under the title; empty for none
     */
    public record Options(int widthPx, int heightPx, String title, double rangeLo, double rangeHi,
                          double viewAzimuthDeg, double viewElevationDeg, String period) {
        public static Options of(int widthPx, int heightPx, String title) {
            return new Options(widthPx, heightPx, title, Double.NaN, Double.NaN, Double.NaN, 30, "");
        }

        public Options withRange(double lo, double hi) {
            return new Options(widthPx, heightPx, title, lo, hi, viewAzimuthDeg, viewElevationDeg, period);
        }

        /** These options with the period shown under the title. */
        public Options withPeriod(String text) {
            return new Options(widthPx, heightPx, title, rangeLo, rangeHi, viewAzimuthDeg, viewElevationDeg, text == null ? "" : text);
        }
    }

    /**
     * Optional additions to a map.
     *
     * @param diverging colour by {@link ColourRamp#diverging} (neutral at zero) for signed differences;
     *                  the automatic range is then symmetric, +-(98th percentile of |value|)
     * @param outlines closed polylines (x,y,z triples, metres, first corner not repeated) drawn over the
     *                 patches, e.g. PV zone outlines; empty for none
     * @param outlineLabel legend text of the outlines
     */
    public record Extras(boolean diverging, List<double[]> outlines, String outlineLabel) {
        public static final Extras NONE = new Extras(false, List.of(), "");

        public Extras {
            outlines = List.copyOf(outlines);
        }
    }

    /** Colour of overlay outlines: a dark teal that stands apart from both ramps. */
    static final int OUTLINE = 0x00665E;

    /** Renders and writes the PNG atomically. */
    public static void write(Path file, MassingModel model, boolean[] analysedBlock, List<Patch> patches,
                             double[] values, String label, String unit, Options o) {
        write(file, model, analysedBlock, patches, values, label, unit, o, Extras.NONE);
    }

    /** Renders with extras and writes the PNG atomically. */
    public static void write(Path file, MassingModel model, boolean[] analysedBlock, List<Patch> patches,
                             double[] values, String label, String unit, Options o, Extras x) {
        BufferedImage img = render(model, analysedBlock, patches, values, label, unit, o, x);
        AtomicFiles.write(file, out -> {
            if (!ImageIO.write(img, "png", out)) throw new java.io.IOException("no PNG writer available");
        });
    }

    /**
     * The colour range used when none is given: the 2nd and 98th percentiles of the finite values
     * (nearest rank), widened to min and max when they coincide; {0, 1} when there is no finite value.
     */
    public static double[] autoRange(double[] values) {
        double[] v = Arrays.stream(values).filter(Double::isFinite).sorted().toArray();
        if (v.length == 0) return new double[] {0, 1};
        double lo = v[rank(0.02, v.length)], hi = v[rank(0.98, v.length)];
        if (!(hi > lo)) {
            lo = v[0];
            hi = v[v.length - 1];
        }
        return new double[] {lo, hi};
    }

    private static int rank(double p, int n) {
        return Math.max(0, Math.min(n - 1, (int) Math.ceil(p * n) - 1));
    }

    /** Renders the map into an image of the requested size. */
    public static BufferedImage render(MassingModel model, boolean[] analysedBlock, List<Patch> patches,
                                       double[] values, String label, String unit, Options o) {
        return render(model, analysedBlock, patches, values, label, unit, o, Extras.NONE);
    }

    /** Renders the map with extras into an image of the requested size. */
    public static BufferedImage render(MassingModel model, boolean[] analysedBlock, List<Patch> patches,
                                       double[] values, String label, String unit, Options o, Extras x) {
        if (values.length != patches.size()) throw new IllegalArgumentException(values.length + " values for " + patches.size() + " patches");
        if (analysedBlock.length < model.blockNames().size()) throw new IllegalArgumentException("analysedBlock has fewer entries than the model has blocks");
        double[] range = x.diverging() ? symmetricRange(values) : autoRange(values);
        boolean auto = Double.isNaN(o.rangeLo()) || Double.isNaN(o.rangeHi());
        double lo = auto ? range[0] : o.rangeLo(), hi = auto ? range[1] : o.rangeHi();

        int w = o.widthPx(), h = o.heightPx();
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = PageMarks.begin(img);

        Rectangle planTile = planTile(w, h);
        int captionH = CAPTION_H, tileH = planTile.height, panelTop = TITLE_H, panelH = tileH + captionH;
        int planW = planTile.width, axoW = w - 3 * MARGIN - planW;
        MapScene scene = new MapScene(model, analysedBlock, patches, values, lo, hi, x.diverging(), x.outlines());
        double az = Double.isNaN(o.viewAzimuthDeg()) ? bestViewAzimuth(scene, o.viewElevationDeg()) : o.viewAzimuthDeg();
        Vec3 eye = Vec3.fromAzimuthElevation(az, o.viewElevationDeg());
        MapView axo = MapView.looking(eye);
        MapView plan = MapView.looking(Vec3.UP);
        int[][] plPixels = new int[1][];
        Thread planThread = new Thread(() -> plPixels[0] = scene.draw(plan, planW * 2, tileH * 2), "solmass-map-plan");
        planThread.start();
        int[] axoPixels = scene.draw(axo, axoW * 2, tileH * 2);
        try {
            planThread.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while rendering the map", e);
        }
        if (plPixels[0] == null) throw new IllegalStateException("the plan panel failed to render");
        panel(g, axoPixels, axo, MARGIN, panelTop, axoW, panelH, captionH, Double.NaN,
                String.format(java.util.Locale.ROOT, "View from the %s, %.0f\u00b0 above the horizon",
                        org.solmass.model.Compass.longName(az), o.viewElevationDeg()));
        panel(g, plPixels[0], plan, 2 * MARGIN + axoW, panelTop, planW, panelH, captionH,
                scene.pixelsPerMetre(plan, planW * 2, tileH * 2), "Plan, north up");

        title(g, w, o.title(), label, unit, o.period());
        legend(g, w, h - LEGEND_H, lo, hi, label, unit, auto, scene.hasMissing(), x);
        g.dispose();
        return img;
    }

    /**
     * Where the plan's picture sits in a map of {@code w} x {@code h} pixels: the right-hand panel
     * (44 % of the width between margins), below its caption.
     */
    static Rectangle planTile(int w, int h) {
        int panelH = Math.max(40, h - TITLE_H - LEGEND_H);
        int axoW = (int) Math.round((w - 3 * MARGIN) * 0.56);
        return new Rectangle(2 * MARGIN + axoW, TITLE_H + CAPTION_H, w - 3 * MARGIN - axoW, panelH - CAPTION_H);
    }

    /** Diagonal view azimuths tried by {@link #bestViewAzimuth}, in order of preference on ties. */
    static final double[] VIEW_AZIMUTHS = {225, 135, 315, 45};

    /**
     * The diagonal view that shows the most analysed patches: each of {@link #VIEW_AZIMUTHS} is drawn
     * small (320 x 240) and the pixels in patch colours (not neutral grey, not background) counted.
     */
    static double bestViewAzimuth(MapScene scene, double elevationDeg) {
        double best = VIEW_AZIMUTHS[0];
        long bestCount = -1;
        for (double az : VIEW_AZIMUTHS) {
            int[] px = scene.draw(MapView.looking(Vec3.fromAzimuthElevation(az, elevationDeg)), 320, 240);
            long n = 0;
            for (int p : px) {
                int r = (p >> 16) & 255, g = (p >> 8) & 255, b = p & 255;
                if (Math.max(r, Math.max(g, b)) - Math.min(r, Math.min(g, b)) > 12 && (p & 0xFFFFFF) != GROUND) n++;
            }
            if (n > bestCount) {
                bestCount = n;
                best = az;
            }
        }
        return best;
    }

    /**
     * The automatic range of a diverging map: +-(98th percentile of |value|, nearest rank), widened to
     * the largest |value| when that is 0; {-1, 1} when every value is 0 or none is finite.
     */
    public static double[] symmetricRange(double[] values) {
        double[] a = Arrays.stream(values).filter(Double::isFinite).map(Math::abs).sorted().toArray();
        if (a.length == 0) return new double[] {-1, 1};
        double r = a[rank(0.98, a.length)];
        if (!(r > 0)) r = a[a.length - 1];
        if (!(r > 0)) r = 1;
        return new double[] {-r, r};
    }

    /** A view's picture with its caption and north arrow, and a scale bar when {@code pxPerM} is a number (plans). */
    private static void panel(Graphics2D g, int[] pixels, MapView view, int x, int y, int pw, int ph, int captionH, double pxPerM,
                              String caption) {
        BufferedImage tile = new BufferedImage(pw, ph - captionH, BufferedImage.TYPE_INT_RGB);
        tile.setRGB(0, 0, pw, ph - captionH, pixels, 0, pw);
        g.drawImage(tile, x, y + captionH, null);
        g.setColor(new Color(0xD0D0D0));
        g.setStroke(new BasicStroke(1f));
        g.drawRect(x, y + captionH, pw - 1, ph - captionH - 1);
        g.setColor(new Color(0x333333));
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 15));
        g.drawString(caption, x + 2, y + 17);
        northArrow(g, view, x + pw - 50, y + captionH + 50);
        if (!Double.isNaN(pxPerM)) PageMarks.scaleBar(g, pxPerM, x + 12, y + ph - 14, pw);
    }

    /** An arrow pointing to true north as seen in the view, with an N above its tip. */
    static void northArrow(Graphics2D g, MapView view, int cx, int cy) {
        double dx = view.right().y(), dy = -view.up().y();      // screen direction of +y (north)
        double len = Math.hypot(dx, dy);
        if (len < 1e-9) return;
        dx /= len;
        dy /= len;
        double px = -dy, py = dx;
        int rad = 38;
        g.setColor(new Color(255, 255, 255, 225));
        g.fillOval(cx - rad, cy - rad, 2 * rad, 2 * rad);
        g.setColor(new Color(0x777777));
        g.setStroke(new BasicStroke(1.2f));
        g.drawOval(cx - rad, cy - rad, 2 * rad, 2 * rad);
        g.setColor(new Color(0x222222));
        g.setStroke(new BasicStroke(2.4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
        g.drawLine((int) Math.round(cx - dx * 22), (int) Math.round(cy - dy * 22), (int) Math.round(cx + dx * 4), (int) Math.round(cy + dy * 4));
        Path2D.Double head = new Path2D.Double();
        head.moveTo(cx + dx * 20, cy + dy * 20);
        head.lineTo(cx + dx * 2 + px * 8, cy + dy * 2 + py * 8);
        head.lineTo(cx + dx * 2 - px * 8, cy + dy * 2 - py * 8);
        head.closePath();
        g.fill(head);
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        FontMetrics fm = g.getFontMetrics();
        double lx = cx + dx * 29, ly = cy + dy * 29;
        g.drawString("N", (float) (lx - fm.stringWidth("N") / 2.0), (float) (ly + fm.getAscent() / 2.0 - 2));
    }

    private static void title(Graphics2D g, int w, String study, String label, String unit, String period) {
        g.setColor(new Color(0x1E1E1E));
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 24));
        String t = (study == null || study.isBlank() ? "" : study + " \u2014 ") + label + (display(unit).isEmpty() ? "" : " (" + display(unit) + ")");
        g.drawString(t, MARGIN, 36);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        g.setColor(new Color(0x555555));
        g.drawString((period == null || period.isBlank() ? "" : period + ". ")
                + "Analysed surfaces coloured by value; context blocks in grey", MARGIN, 58);
    }

    private static void legend(Graphics2D g, int w, int top, double lo, double hi, String label, String unit,
                               boolean auto, boolean missing, Extras x) {
        int barW = Math.min(900, (int) (w * 0.5)), barH = 20, bx = MARGIN + 4, by = top + 34;
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 15));
        g.setColor(new Color(0x222222));
        g.drawString(label + (display(unit).isEmpty() ? "" : ", " + display(unit)), bx, top + 24);
        PageMarks.colourBar(g, bx, by, barW, barH, lo, hi, x.diverging());
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        FontMetrics fm = g.getFontMetrics();
        int nx = bx + barW + 40;
        g.setColor(new Color(0x444444));
        g.drawString(!auto ? "Range: set by the user" : x.diverging() ? "Range: \u00b1 98th percentile of |difference|, grey at zero"
                : "Range: 2nd to 98th percentile of the patch values", nx, by + 6);
        g.drawString("Values beyond the range take the end colours", nx, by + 24);
        int sy = by + 38;
        g.setColor(new Color(MapScene.contextGrey(0.6)));
        g.fillRect(nx, sy, 16, 12);
        g.setColor(new Color(0x444444));
        g.drawString("Context block (not analysed)", nx + 22, sy + 11);
        if (missing) {
            int mx = nx + 22 + fm.stringWidth("Context block (not analysed)") + 24;
            g.setColor(new Color(ColourRamp.sequential(Double.NaN)));
            g.fillRect(mx, sy, 16, 12);
            g.setColor(new Color(0x444444));
            g.drawString("No value", mx + 22, sy + 11);
        }
        if (!x.outlines().isEmpty()) {
            int oy = sy + 20;
            g.setColor(new Color(OUTLINE));
            g.setStroke(new BasicStroke(3f));
            g.drawRect(nx + 1, oy + 1, 14, 10);
            g.setStroke(new BasicStroke(1f));
            g.setColor(new Color(0x444444));
            g.drawString(x.outlineLabel(), nx + 22, oy + 11);
        }
    }

    /** A unit symbol as shown on screen ({@link org.solmass.table.Unit#display()}); unknown symbols as they are. */
    static String display(String unit) {
        org.solmass.table.Unit u = org.solmass.table.Unit.ofSymbol(unit);
        return u.symbol().equals(unit) ? u.display() : unit;
    }


}
