package org.solmass.output;

import org.solmass.Cautions;
import org.solmass.metrics.ShadowStudy;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import javax.imageio.ImageIO;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.Rectangle;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;

/**
 * A sheet of plan-view shadow diagrams: one panel per date and time (dates as rows, times as
 * columns), each a plan (north up, the model's y axis is site north) drawn by {@link MapScene} with
 * ground patches in sun in {@link #SUN} and in shade in {@link #SHADE}, block roofs in two nearby
 * steps of the same ramp; a caption with the date,
 * the time and the sun's azimuth and elevation, a north arrow and a scale bar in each panel; a title,
 * a legend and a one-line caution at the foot. Layout: docs/metrics.md, "Shadow studies".
 */
public final class ShadowSheet {
    /** Panel size in pixels (the plan picture, without its caption). */
    public static final int PANEL_W = 560, PANEL_H = 420;
    static final int MARGIN = 16, GAP = 12, TITLE_H = 70, CAPTION_H = 24, FOOTER_H = 64;
    /** Ramp positions ({@link ColourRamp#sequential}) of ground and block patches in sun and in shade. */
    static final double GROUND_SUN_T = 1, BLOCK_SUN_T = 0.80, GROUND_SHADE_T = 0.32, BLOCK_SHADE_T = 0.16;
    /** Colours of ground patches in sun and in shade (blocks take nearby, slightly darker steps). */
    public static final int SUN = ColourRamp.sequential(GROUND_SUN_T), SHADE = ColourRamp.sequential(GROUND_SHADE_T);
    /** The footer caution: shadow-specific, then the project's one results caution. */
    public static final String CAUTION = "Shadow diagrams are indicative, from a simplified massing model, at local standard time; "
            + "planning submissions follow local requirements. " + Cautions.RESULTS;

    private ShadowSheet() {}

    /** Sheet width for {@code times} columns, pixels. */
    public static int width(int times) { return 2 * MARGIN + times * PANEL_W + (times - 1) * GAP; }

    /** Sheet height for {@code dates} rows, pixels. */
    public static int height(int dates) { return TITLE_H + dates * (CAPTION_H + PANEL_H + GAP) + FOOTER_H; }

    /** Where the picture of row {@code r}, column {@code c} sits on the sheet (below its caption). */
    public static Rectangle panel(int r, int c) {
        return new Rectangle(MARGIN + c * (PANEL_W + GAP), TITLE_H + r * (CAPTION_H + PANEL_H + GAP) + CAPTION_H, PANEL_W, PANEL_H);
    }

    /**
     * Renders the sheet.
     *
     * @param patches every patch the frames cover (blocks and ground), in frame order
     * @param frames {@code dates x times} frames, dates first ({@link ShadowStudy#moments})
     * @param times number of times (columns)
     */
    public static BufferedImage render(MassingModel model, boolean[] analysedBlock, List<Patch> patches,
                                       List<ShadowStudy.Frame> frames, int times, String title) {
        if (times <= 0 || frames.size() % times != 0) throw new IllegalArgumentException(frames.size() + " frames for " + times + " times");
        int rows = frames.size() / times;
        int w = width(times), h = height(rows);
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = PageMarks.begin(img);
        double[] extent = outlinePoints(patches);
        MapView plan = MapView.looking(Vec3.UP);
        DateTimeFormatter day = DateTimeFormatter.ofPattern("d MMM", Locale.ROOT);
        for (int f = 0; f < frames.size(); f++) {
            ShadowStudy.Frame fr = frames.get(f);
            double[] values = new double[patches.size()];
            for (int i = 0; i < values.length; i++) {
                boolean ground = patches.get(i).kind() == SurfaceKind.GROUND;
                values[i] = fr.sunlit()[i] ? (ground ? GROUND_SUN_T : BLOCK_SUN_T) : (ground ? GROUND_SHADE_T : BLOCK_SHADE_T);
            }
            MapScene scene = new MapScene(model, analysedBlock, patches, values, 0, 1).fitAlso(extent);
            int[] px = scene.draw(plan, 2 * PANEL_W, 2 * PANEL_H);
            Rectangle r = panel(f / times, f % times);
            BufferedImage tile = new BufferedImage(PANEL_W, PANEL_H, BufferedImage.TYPE_INT_RGB);
            tile.setRGB(0, 0, PANEL_W, PANEL_H, px, 0, PANEL_W);
            g.drawImage(tile, r.x, r.y, null);
            g.setColor(new Color(0xD0D0D0));
            g.setStroke(new BasicStroke(1f));
            g.drawRect(r.x, r.y, r.width - 1, r.height - 1);
            g.setColor(new Color(0x222222));
            g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 15));
            String when = fr.moment().date().format(day) + ", " + fr.moment().time();
            g.drawString(when, r.x + 2, r.y - 7);
            int wx = r.x + 2 + g.getFontMetrics().stringWidth(when);
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
            g.setColor(new Color(0x444444));
            g.drawString(fr.sunUp()
                    ? String.format(Locale.ROOT, "   sun azimuth %.0f\u00b0, elevation %.1f\u00b0", fr.sun().azimuthDeg(), fr.sun().elevationDeg())
                    : String.format(Locale.ROOT, "   sun below the horizon (elevation %.1f\u00b0)", fr.sun().elevationDeg()), wx, r.y - 7);
            MapRenderer.northArrow(g, plan, r.x + r.width - 48, r.y + 48);
            PageMarks.scaleBar(g, scene.pixelsPerMetre(plan, 2 * PANEL_W, 2 * PANEL_H), r.x + 12, r.y + r.height - 14, PANEL_W);
        }
        title(g, title);
        footer(g, w, h - FOOTER_H);
        g.dispose();
        return img;
    }

    /** Renders and writes the PNG atomically. */
    public static void write(Path file, MassingModel model, boolean[] analysedBlock, List<Patch> patches,
                             List<ShadowStudy.Frame> frames, int times, String title) {
        BufferedImage img = render(model, analysedBlock, patches, frames, times, title);
        AtomicFiles.write(file, out -> {
            if (!ImageIO.write(img, "png", out)) throw new java.io.IOException("no PNG writer available");
        });
    }

    /** Corners of every horizontal patch outline: the plan is fitted to them and the model. */
    private static double[] outlinePoints(List<Patch> patches) {
        double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        double z = 0;
        for (Patch p : patches) {
            double[] o = p.outline();
            for (int k = 0; k + 2 < o.length; k += 3) {
                b[0] = Math.min(b[0], o[k]);
                b[1] = Math.min(b[1], o[k + 1]);
                b[2] = Math.max(b[2], o[k]);
                b[3] = Math.max(b[3], o[k + 1]);
                z = o[k + 2];
            }
        }
        if (!(b[0] <= b[2])) return new double[0];
        return new double[] {b[0], b[1], z, b[2], b[3], z};
    }

    private static void title(Graphics2D g, String study) {
        g.setColor(new Color(0x1E1E1E));
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 24));
        g.drawString((study == null || study.isBlank() ? "" : study + " \u2014 ") + "Shadow diagrams (plan, north up)", MARGIN, 36);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        g.setColor(new Color(0x555555));
        g.drawString("Rows: dates; columns: local standard time. Each patch of blocks and ground in sun or in shade by one ray "
                + "from its centre to the sun", MARGIN, 58);
    }

    private static void footer(Graphics2D g, int w, int top) {
        int x = MARGIN, y = top + 22;
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        FontMetrics fm = g.getFontMetrics();
        String[] names = {"Ground in sun", "Ground in shade", "Roof in sun", "Roof in shade"};
        double[] ts = {GROUND_SUN_T, GROUND_SHADE_T, BLOCK_SUN_T, BLOCK_SHADE_T};
        for (int k = 0; k < names.length; k++) {
            g.setColor(new Color(ColourRamp.sequential(ts[k])));
            g.fillRect(x, y - 12, 18, 14);
            g.setColor(new Color(0x666666));
            g.drawRect(x, y - 12, 18, 14);
            g.setColor(new Color(0x333333));
            String s = names[k];
            g.drawString(s, x + 24, y);
            x += 24 + fm.stringWidth(s) + 28;
        }
        g.setColor(new Color(0x333333));
        g.drawString("(analysed and context blocks alike; walls are seen edge-on)", x, y);
        int size = 13;   // one line: the font shrinks until the caution fits the sheet
        do g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, size--));
        while (size > 8 && g.getFontMetrics().stringWidth(CAUTION) > w - 2 * MARGIN);
        g.setColor(new Color(0x555555));
        g.drawString(CAUTION, MARGIN, y + 26);
    }
}
