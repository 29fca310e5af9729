package org.solmass.viewer;

import org.solmass.output.LegendTicks;

import javafx.collections.FXCollections;
import javafx.geometry.Insets;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.Spinner;
import javafx.scene.control.TextField;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.VBox;
import javafx.stage.FileChooser;

import javax.imageio.ImageIO;
import java.io.File;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/** The left column: colour-by, legend, range, threshold, views, sun path, re-run and export. */
final class ControlColumn extends VBox {
    private final ViewerWindow win;
    private final ViewerActions actions;
    private final ComboBox<Quantity> quantity = new ComboBox<>();
    private final LegendBar legend = new LegendBar();
    private final CheckBox auto = new CheckBox("Automatic range");
    private final TextField min = new TextField(), max = new TextField();
    private final CheckBox thrOn = new CheckBox("Pick out patches at or above");
    private final TextField thr = new TextField();
    private final Label thrArea = new Label();
    private final Label caution = new Label(org.solmass.Cautions.RESULTS);
    private final CheckBox sunPath = new CheckBox("Sun path (monthly average days)");
    private final CheckBox zones = new CheckBox("PV roof zones (indicative)");
    private final Spinner<Double> patchSize = new Spinner<>(0.25, 50, 1, 0.25);
    private final ComboBox<String> climate = new ComboBox<>();
    private final ComboBox<String> sky = new ComboBox<>();
    private final TextField variantName = new TextField();
    private final ComboBox<String> variants = new ComboBox<>();
    private final ComboBox<String> against = new ComboBox<>();
    private List<java.nio.file.Path> variantFolders = List.of();
    private final ComboBox<String> pngScale = new ComboBox<>(FXCollections.observableArrayList("1\u00d7", "2\u00d7", "3\u00d7", "4\u00d7"));
    private ViewerData data;
    private ColourScale scale = new ColourScale(0, 1, false);
    private final ShadowControl shadow = new ShadowControl(this::refresh);
    private final javafx.beans.property.SimpleLongProperty colouring = new javafx.beans.property.SimpleLongProperty();

    ControlColumn(ViewerWindow win, ViewerActions actions) {
        super(8);
        this.win = win;
        this.actions = actions;
        setPadding(new Insets(12));
        getStyleClass().add("controls");
        quantity.setMaxWidth(Double.MAX_VALUE);
        quantity.setId("quantity");
        quantity.valueProperty().addListener((o, a, b) -> {
            if (b != null) {
                auto.setSelected(true);
                refresh();
            }
        });
        auto.setSelected(true);
        auto.selectedProperty().addListener((o, a, b) -> refresh());
        min.setPromptText("min");
        max.setPromptText("max");
        min.setPrefColumnCount(6);
        max.setPrefColumnCount(6);
        min.setOnAction(e -> { auto.setSelected(false); refresh(); });
        max.setOnAction(e -> { auto.setSelected(false); refresh(); });
        thr.setPromptText("value");
        thr.setId("threshold");
        thr.setOnAction(e -> { thrOn.setSelected(true); refresh(); });
        thrOn.selectedProperty().addListener((o, a, b) -> refresh());
        thrArea.setWrapText(true);
        thrArea.setId("threshold-area");
        caution.setWrapText(true);
        caution.getStyleClass().add("caution");
        caution.setVisible(false);
        caution.setManaged(false);
        sunPath.selectedProperty().addListener((o, a, b) -> win.setSunPathVisible(b));
        zones.selectedProperty().addListener((o, a, b) -> win.setZonesVisible(b));
        zones.setSelected(true);
        zones.managedProperty().bind(zones.visibleProperty());

        GridPane views = new GridPane();
        views.setHgap(4);
        views.setVgap(4);
        views.add(view("Top", "top"), 0, 0);
        views.add(view("3D", "orbit"), 1, 0);
        views.add(view("From N", "N"), 2, 0);
        views.add(view("From E", "E"), 0, 1);
        views.add(view("From S", "S"), 1, 1);
        views.add(view("From W", "W"), 2, 1);
        Button fit = view("Fit analysed blocks", "analysed");
        fit.setPrefWidth(3 * 74 + 2 * 4);
        views.add(fit, 0, 2, 3, 1);

        RerunRequest opt = actions.currentOptions();
        patchSize.setEditable(true);
        patchSize.getValueFactory().setValue(opt.patchSizeM());
        climate.setEditable(true);
        climate.setItems(FXCollections.observableArrayList(actions.climateChoices()));
        climate.setValue(opt.climateSource());
        climate.setMaxWidth(Double.MAX_VALUE);
        sky.setItems(FXCollections.observableArrayList(actions.skyModels()));
        sky.setValue(opt.skyModel());
        sky.setMaxWidth(Double.MAX_VALUE);
        Button run = new Button("Re-run analysis");
        run.setMaxWidth(Double.MAX_VALUE);
        variantName.setId("variant-name");
        String defaultName = actions.defaultVariantName();
        variantName.setPromptText(defaultName != null ? defaultName : "new variant folder name");
        run.setOnAction(e -> {
            win.rerun(new RerunRequest(patchSize.getValue(), climate.getValue(), sky.getValue(), variantName.getText()));
            variantName.clear();   // a name is used once: a second re-run under it would be refused
        });
        variants.setId("variants");
        variants.setMaxWidth(Double.MAX_VALUE);
        variants.setPromptText("no results folder yet");
        Button open = new Button("Open");
        open.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);   // a long variant name shortens the list, not the button
        variants.setPrefWidth(150);
        open.setId("open-variant");
        open.setOnAction(e -> {
            int i = variants.getSelectionModel().getSelectedIndex();
            if (i >= 0 && i < variantFolders.size()) win.openVariant(variantFolders.get(i));
        });
        against.setId("compare-with");
        against.setPrefWidth(150);
        against.setMaxWidth(Double.MAX_VALUE);
        against.setPromptText("another results folder");
        Button diff = new Button("Compare");
        diff.setId("compare");
        diff.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
        diff.setOnAction(e -> {
            int i = against.getSelectionModel().getSelectedIndex();
            if (i >= 0 && i < variantFolders.size()) win.compare(variantFolders.get(i));
        });
        pngScale.getSelectionModel().select(1);

        Button csv = new Button("CSV\u2026"), summary = new Button("Summary\u2026"), png = new Button("PNG\u2026");
        csv.setOnAction(e -> export("CSV", "csv", f -> actions.exportCsv(f)));
        summary.setOnAction(e -> export("summary", "json", f -> actions.exportSummary(f)));
        png.setOnAction(e -> exportPng());

        getChildren().addAll(head("Colour by"), quantity, legend, caution, auto, ViewerWindow.row(min, new Label("to"), max),
                head("Threshold"), thrOn, thr, thrArea, shadow,
                head("View"), views, sunPath, zones, hint(),
                head("Re-run"), label("Patch size (m)"), patchSize, label("Climate"), climate, label("Sky model"), sky,
                label("Variant folder (empty: dated name)"), variantName, run,
                label("Results of this study"), ViewerWindow.row(variants, open),
                label("Differences of the results on show from"), ViewerWindow.row(against, diff),
                head("Export"), ViewerWindow.row(csv, summary), ViewerWindow.row(png, pngScale));
    }

    private static Label head(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("head");
        return l;
    }

    private static Label label(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("small");
        return l;
    }

    private static Label hint() {
        Label l = new Label("Left drag: orbit \u00b7 right or middle drag: pan \u00b7 wheel: zoom \u00b7 click: patch values");
        l.setWrapText(true);
        l.getStyleClass().add("small");
        return l;
    }

    private Button view(String label, String key) {
        Button b = new Button(label);
        b.setPrefWidth(74);
        b.setOnAction(e -> win.preset(key));
        return b;
    }

    boolean sunPathOn() { return sunPath.isSelected(); }

    boolean zonesOn() { return zones.isSelected(); }

    /** Shows the zone toggle only when the results carry zones. */
    void setZonesAvailable(boolean available) { zones.setVisible(available); }

    void setSunPath(boolean on) { sunPath.setSelected(on); }

    Quantity quantity() { return quantity.getValue(); }

    ColourScale scale() { return scale; }

    void setData(ViewerData d) {
        this.data = d;
        RerunRequest opt = actions.currentOptions();     // after a re-run, the options it ran with
        patchSize.getValueFactory().setValue(opt.patchSizeM());
        climate.setValue(opt.climateSource());
        sky.setValue(opt.skyModel());
        refreshVariants();
        List<Quantity> qs = Quantity.available(d.table());
        Quantity keep = quantity.getValue();
        quantity.setItems(FXCollections.observableArrayList(qs));
        Quantity pick = qs.isEmpty() ? null : qs.get(0);
        if (keep != null) for (Quantity q : qs) if (q.column().equals(keep.column())) pick = q;
        quantity.setValue(pick);
        shadow.setFrames(d.shadows());
        refresh();
    }

    /** Switches the shadow study colouring on or off (for scripts and tests); false when there is none. */
    boolean showShadows(boolean on) {
        shadow.setActive(on);
        return shadow.active();
    }

    /** Lists the study's results folders (the first results and its variants) by folder name; selects the one on show. */
    private void refreshVariants() {
        try {
            variantFolders = actions.variants();
        } catch (RuntimeException e) {
            variantFolders = List.of();
        }
        List<String> names = new java.util.ArrayList<>();
        for (java.nio.file.Path f : variantFolders) names.add(String.valueOf(f.getFileName()));
        variants.setItems(FXCollections.observableArrayList(names));
        against.setItems(FXCollections.observableArrayList(names));
        java.nio.file.Path onShow = actions.shownFolder();
        int i = onShow == null ? -1 : variantFolders.indexOf(onShow);
        if (i >= 0) variants.getSelectionModel().select(i);
        else if (!names.isEmpty()) variants.getSelectionModel().select(names.size() - 1);
    }

    /** Picks out the patches at or above a value (NaN: threshold off), as the controls would. */
    void setThreshold(double v) {
        thr.setText(Double.isFinite(v) ? LegendTicks.label(v, 1) : "");
        thrOn.setSelected(Double.isFinite(v));
        refresh();
    }

    /** Colours by the difference of annual irradiation (or the first difference) after a comparison. */
    void selectFirstDelta() {
        Quantity pick = null;
        for (Quantity q : quantity.getItems()) {
            if (q.column().equals("delta_annual_kwh_m2")) pick = q;
            else if (pick == null && q.column().startsWith("delta_")) pick = q;
        }
        if (pick != null) quantity.setValue(pick);
    }

    /** Selects a quantity by column name (for scripts and tests). */
    void select(String column) {
        for (Quantity q : quantity.getItems()) if (q.column().equals(column)) quantity.setValue(q);
    }

    private void refresh() {
        Quantity q = quantity.getValue();
        if (data == null || q == null) return;
        double[] v = data.table().column(q.column());
        ColourScale a = ColourScale.auto(v, q.diverging());
        if (auto.isSelected()) {
            scale = a;
            double st = LegendTicks.step(a.min(), a.max(), LegendBar.MAX_TICKS);
            min.setText(LegendTicks.label(a.min(), st / 10));
            max.setText(LegendTicks.label(a.max(), st / 10));
        } else {
            scale = new ColourScale(parse(min.getText(), a.min()), parse(max.getText(), a.max()), q.diverging());
        }
        double t = thrOn.isSelected() ? parse(thr.getText(), Double.NaN) : Double.NaN;
        if (Double.isFinite(t)) {
            Threshold th = Threshold.of(data.patches(), v, t);
            thrArea.setText(String.format(Locale.ROOT, "%,d patches, %,.0f m\u00b2 (%.0f %% of the analysed area) at or above %s %s",
                    th.count(), th.areaM2(), 100 * th.share(), thr.getText().trim(), q.unit()));
        } else {
            thrArea.setText(thrOn.isSelected() ? "Type a value and press Enter." : "");
        }
        legend.show(q, scale, t);
        boolean pv = q.pvOrRoof();
        caution.setVisible(pv);
        caution.setManaged(pv);
        int[] layer = shadow.active() ? shadow.layerColours() : null;   // sun or shade per patch, ground and context too
        int[] sun = shadow.active() && layer == null ? shadow.colours(data) : null;   // an older study: per block
        legend.setVisible(layer == null && sun == null);   // the quantity's ramp does not apply while the shadow study is on
        win.applyShadowLayer(layer);
        if (sun != null) win.applyRgb(sun);
        else win.applyColours(scale, scale.indices(v, t));
        colouring.set(colouring.get() + 1);
    }

    /** Counts the colourings (quantity or range chosen): views that follow the colours listen to it. */
    javafx.beans.value.ObservableValue<Number> colouringProperty() { return colouring; }

    private static double parse(String s, double dflt) {
        try {
            return Double.parseDouble(s.trim().replace(",", ""));
        } catch (RuntimeException e) {
            return dflt;
        }
    }

    interface FileAction { void run(Path p) throws Exception; }

    private void export(String what, String ext, FileAction a) {
        FileChooser fc = new FileChooser();
        fc.setTitle("Export " + what);
        fc.getExtensionFilters().add(new FileChooser.ExtensionFilter(what + " (*." + ext + ")", "*." + ext));
        File f = fc.showSaveDialog(win.stage());
        if (f == null) return;
        Thread t = new Thread(() -> {
            try {
                a.run(f.toPath());
                javafx.application.Platform.runLater(() -> win.setStatus("Wrote " + f));
            } catch (Exception ex) {
                javafx.application.Platform.runLater(() -> win.setStatus("Export failed: " + ex.getMessage()));
            }
        }, "solmass-export");
        t.setDaemon(true);
        t.start();
    }

    /**
     * The PNG export: the 3D view at {@code s} times its size with title, legend, north arrow and
     * caution ({@link org.solmass.output.ExportSheet}); call on the FX thread.
     */
    java.awt.image.BufferedImage exportImage(double s) {
        java.awt.image.BufferedImage view = javafx.embed.swing.SwingFXUtils.fromFXImage(win.snapshot3D(s), null);
        Quantity q = quantity.getValue();
        CameraRig rig = win.rig();
        org.solmass.output.ExportSheet.ShadowMarks sm = shadow.exportMarks(win.data().title(), rig == null ? 0 : rig.headingDeg());
        if (sm != null) return org.solmass.output.ExportSheet.compose(view, sm);   // the shadow study on show: its two colours, not the ramp
        return q == null ? view : org.solmass.output.ExportSheet.compose(view, new org.solmass.output.ExportSheet.Marks(
                win.data().title(), q.title(), win.data().period(), scale.min(), scale.max(), scale.diverging(),
                rig == null ? 0 : rig.headingDeg()));
    }

    private void exportPng() {
        FileChooser fc = new FileChooser();
        fc.setTitle("Export the 3D view as PNG");
        fc.getExtensionFilters().add(new FileChooser.ExtensionFilter("PNG image (*.png)", "*.png"));
        File f = fc.showSaveDialog(win.stage());
        if (f == null) return;
        double s = pngScale.getSelectionModel().getSelectedIndex() + 1;
        try {
            ImageIO.write(exportImage(s), "png", f);
            win.setStatus("Wrote " + f);
        } catch (Exception ex) {
            win.setStatus("PNG export failed: " + ex.getMessage());
        }
    }
}
