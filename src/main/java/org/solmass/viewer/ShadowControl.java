package org.solmass.viewer;

import javafx.collections.FXCollections;
import javafx.scene.control.CheckBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.Slider;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

import java.util.List;
import java.util.Locale;

/**
 * The control column's "Shadow study" section, shown only when the results folder has
 * shadows/shadows.csv ({@link ShadowFrames}): a date choice, a time slider, a two-colour legend and
 * a caption. While it is on, with the per-patch file (shadows/shadow-patches.csv) every patch of the
 * analysed blocks, the context blocks and the ground is drawn in sun or in shade at the chosen moment
 * ({@link #layerColours}); without it (results of an earlier Solmass) each analysed block's patches
 * take the colour of the block's sunlit share ({@link #colours}).
 */
final class ShadowControl extends VBox {
    /** Colour of "in sun", 0xRRGGBB (warm light yellow). */
    static final int SUN_RGB = 0xF4D35E;
    /** Colour of "in shade", 0xRRGGBB (dark slate blue). */
    static final int SHADE_RGB = 0x34487A;

    private final CheckBox on = new CheckBox("Show the shadow study");
    private final ComboBox<String> date = new ComboBox<>();
    private final Slider time = new Slider(0, 0, 0);
    private final Label timeLabel = new Label();
    private final Label caption = new Label();
    private final VBox body = new VBox(6);
    private final Label note = new Label();
    /** Note under the legend with the per-patch file, and without it. */
    static final String NOTE_PATCHES = "Each patch of the blocks (analysed and context) and of the ground is in sun or in shade "
            + "at its centre, one ray to the sun (shadow-patches.csv); walls are drawn lighter or darker by the way they face.",
            NOTE_BLOCKS = "Each analysed block is coloured by the share of its area in sun (these results have shadows.csv only, "
                    + "one row per block; run solmass shadows again for sun and shade per patch).";
    private ShadowFrames frames = ShadowFrames.NONE;

    ShadowControl(Runnable changed) {
        super(6);
        on.setId("shadow-on");
        date.setId("shadow-date");
        time.setId("shadow-time");
        date.setMaxWidth(Double.MAX_VALUE);
        time.setMajorTickUnit(1);
        time.setMinorTickCount(0);
        time.setSnapToTicks(true);
        time.setShowTickMarks(true);
        caption.setWrapText(true);
        caption.getStyleClass().add("small");
        caption.setId("shadow-caption");
        on.selectedProperty().addListener((o, a, b) -> { body.setVisible(b); body.setManaged(b); changed.run(); });
        date.valueProperty().addListener((o, a, b) -> changed.run());
        time.valueProperty().addListener((o, a, b) -> {
            long r = Math.round(b.doubleValue());
            if (r != b.doubleValue()) time.setValue(r);
            else changed.run();
        });
        note.setId("shadow-note");
        note.setWrapText(true);
        note.getStyleClass().add("small");
        body.getChildren().addAll(date, time, timeLabel, new HBox(10, swatch(SUN_RGB, "in sun"), swatch(SHADE_RGB, "in shade")),
                caption, note);
        body.setVisible(false);
        body.setManaged(false);
        Label head = new Label("Shadow study");
        head.getStyleClass().add("head");
        getChildren().addAll(head, on, body);
        setFrames(ShadowFrames.NONE);
    }

    private static HBox swatch(int rgb, String text) {
        Region r = new Region();
        r.setMinSize(14, 14);
        r.setPrefSize(14, 14);
        r.setStyle(String.format(Locale.ROOT, "-fx-background-color: #%06X; -fx-border-color: #555;", rgb));
        return new HBox(4, r, new Label(text));
    }

    /** Shows the section only when there is a shadow study; switches it off on new data. */
    void setFrames(ShadowFrames f) {
        frames = f == null ? ShadowFrames.NONE : f;
        boolean has = !frames.isEmpty();
        note.setText(frames.hasPatches() ? NOTE_PATCHES : NOTE_BLOCKS);
        setVisible(has);
        setManaged(has);
        on.setSelected(false);
        date.setItems(FXCollections.observableArrayList(frames.dates()));
        if (has) date.setValue(frames.dates().get(0));
        List<String> ts = frames.times();
        time.setMax(Math.max(0, ts.size() - 1));
        time.setValue(0);
    }

    boolean active() {
        return on.isSelected() && !frames.isEmpty();
    }

    /** Switches the shadow colouring on or off (for scripts and tests). */
    void setActive(boolean b) {
        on.setSelected(b);
    }

    /** The moment on show; null when none. */
    ShadowFrames.Frame frame() {
        List<String> ts = frames.times();
        if (ts.isEmpty() || date.getValue() == null) return null;
        int i = (int) Math.max(0, Math.min(ts.size() - 1, Math.round(time.getValue())));
        return frames.frame(date.getValue(), ts.get(i));
    }

    /** Shows the moment's date, time and sun position. */
    private void caption(ShadowFrames.Frame f) {
        timeLabel.setText("Time " + f.time() + " (local standard time)");
        StringBuilder c = new StringBuilder("Date " + f.date() + ", " + f.time());
        if (Double.isFinite(f.sunAzimuthDeg())) c.append(String.format(Locale.ROOT, ", sun azimuth %.1f\u00b0", f.sunAzimuthDeg()));
        if (Double.isFinite(f.sunElevationDeg())) c.append(String.format(Locale.ROOT, ", elevation %.1f\u00b0", f.sunElevationDeg()));
        if (Double.isFinite(f.sunElevationDeg()) && f.sunElevationDeg() <= 0) c.append(" (sun below the horizon: all in shade)");
        caption.setText(c.toString());
    }

    /**
     * sRGB per patch of the per-patch study ({@link ShadowFrames#perPatch}) for the moment on show, in
     * sun or in shade, each darkened by the way the patch faces ({@link MassingMeshData#shade}, the
     * massing's fixed light) so walls and ground read apart; updates the caption. Null when the study
     * has no per-patch file or nothing is on show.
     */
    int[] layerColours() {
        ShadowFrames.Frame f = frame();
        boolean[] lit = frames.sunlit(f);
        if (lit == null) return null;
        caption(f);
        List<org.solmass.surface.Patch> ps = frames.perPatch().patches();
        int[] rgb = new int[ps.size()];
        for (int i = 0; i < rgb.length; i++) {
            org.solmass.model.Vec3 n = ps.get(i).normal();
            rgb[i] = PaletteAtlas.darken(lit[i] ? SUN_RGB : SHADE_RGB, MassingMeshData.shade(n.x(), n.y(), n.z()));
        }
        return rgb;
    }

    /** sRGB per analysed patch of the block's sunlit share at the moment on show (and updates the caption); null when there is none. */
    int[] colours(ViewerData d) {
        ShadowFrames.Frame f = frame();
        if (f == null) return null;
        caption(f);
        int[] rgb = new int[d.patches().size()];
        for (int i = 0; i < rgb.length; i++) rgb[i] = rgb(f.sunlitPct(d.patches().get(i).blockName()));
        return rgb;
    }

    /** The PNG export sheet's marks for the moment on show ({@code output.ExportSheet}); null while the study is off. */
    org.solmass.output.ExportSheet.ShadowMarks exportMarks(String study, double headingDeg) {
        ShadowFrames.Frame f = active() ? frame() : null;
        if (f == null) return null;
        String sun = Double.isFinite(f.sunAzimuthDeg()) && Double.isFinite(f.sunElevationDeg())
                ? String.format(Locale.ROOT, "Sun azimuth %.1f\u00b0, elevation %.1f\u00b0", f.sunAzimuthDeg(), f.sunElevationDeg()) : "";
        String what = frames.hasPatches() ? "" : " (share of each block in sun)";
        return new org.solmass.output.ExportSheet.ShadowMarks(study, "Shadow study" + what + ", " + f.date() + " " + f.time()
                + " local standard time", sun, SUN_RGB, SHADE_RGB, headingDeg);
    }

    /** Colour of a sunlit share in percent: in shade at 0, in sun at 100, straight mix between; grey when NaN. */
    static int rgb(double pct) {
        if (!Double.isFinite(pct)) return ColourScale.NAN_RGB;
        double t = Math.max(0, Math.min(1, pct / 100));
        int out = 0;
        for (int sh = 16; sh >= 0; sh -= 8) {
            int a = (SHADE_RGB >> sh) & 0xFF, b = (SUN_RGB >> sh) & 0xFF;
            out |= ((int) Math.round(a + t * (b - a))) << sh;
        }
        return out;
    }
}
