package org.solmass.viewer;

import javafx.collections.FXCollections;
import javafx.scene.chart.BarChart;
import javafx.scene.chart.CategoryAxis;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.VBox;
import org.solmass.climate.MonthHour;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.table.Column;
import org.solmass.table.ResultTable;
import org.solmass.surface.Patch;

import java.util.Locale;

/**
 * The side panel for one picked patch: identity and geometry, sky view, annual irradiation by
 * component, monthly bars, the month-hour map of mean irradiance and one month's daily curve.
 */
final class PatchPanel extends VBox {
    static final String[] MONTHS = {"Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
    /** Columns the panel shows above (fixed rows) or not at all (monthly ones are in the chart). */
    private static final java.util.Set<String> PANEL_SKIPS = java.util.stream.Stream.of(IrradiationColumns.SKY_VIEW_FACTOR,
            IrradiationColumns.ANNUAL, IrradiationColumns.BEAM, IrradiationColumns.DIFFUSE, IrradiationColumns.REFLECTED,
            IrradiationColumns.UNSHADED, IrradiationColumns.SHADING_LOSS, IrradiationColumns.SVF_STD_ERROR,
            IrradiationColumns.GROUND_VIEW_FACTOR, IrradiationColumns.ANNUAL_KWH, IrradiationColumns.OBSTRUCTION_VIEW_FACTOR)
            .map(Column::name).collect(java.util.stream.Collectors.toUnmodifiableSet());
    private final Label heading = new Label("No patch selected");
    private final Label hint = new Label("Click a coloured patch in the model to see its values here.");
    private final GridPane facts = new GridPane();
    private final BarChart<String, Number> monthly;
    private final HeatMap heat = new HeatMap(318, 210);
    private final ComboBox<String> month = new ComboBox<>(FXCollections.observableArrayList(MONTHS));
    private final LineChart<Number, Number> daily;
    private final Label caution = new Label(org.solmass.Cautions.RESULTS);
    private final Label noHourly = new Label("The month-hour table is not in these results: analyse with "
            + "--month-hour (study key outputs.month_hour_csv) to see the hourly map and the daily curve.");
    private final HBox dailyHeading = new HBox(8);
    private final VBox details = new VBox(8);
    private ViewerData data;
    private int patch = -1;

    PatchPanel() {
        super(8);
        getStyleClass().add("side-panel");
        heading.getStyleClass().add("panel-heading");
        hint.setWrapText(true);
        facts.setHgap(10);
        facts.setVgap(2);
        facts.setId("patch-facts");
        CategoryAxis mx = new CategoryAxis();
        NumberAxis my = new NumberAxis();
        my.setLabel("kWh/m\u00b2");
        monthly = new BarChart<>(mx, my);
        monthly.setLegendVisible(false);
        monthly.setAnimated(false);
        monthly.setPrefHeight(170);
        monthly.setBarGap(1);
        monthly.setCategoryGap(3);
        NumberAxis hx = new NumberAxis(0, 24, 3);
        hx.setLabel("hour (local standard time)");
        NumberAxis hy = new NumberAxis();
        hy.setLabel("W/m\u00b2");
        daily = new LineChart<>(hx, hy);
        daily.setLegendVisible(false);
        daily.setAnimated(false);
        daily.setCreateSymbols(false);
        daily.setPrefHeight(180);
        month.getSelectionModel().select(5);
        month.valueProperty().addListener((o, a, b) -> drawDaily());
        caution.setWrapText(true);
        caution.getStyleClass().add("caution");
        noHourly.setWrapText(true);
        dailyHeading.getChildren().addAll(section("Daily irradiance, average day of"), month);
        details.getChildren().addAll(facts, section("Monthly irradiation"), monthly,
                section("Mean irradiance by month and hour of day, local standard time (W/m\u00b2)"), heat, noHourly,
                dailyHeading, daily, caution);
        for (javafx.scene.Node n : new javafx.scene.Node[] {heat, noHourly, dailyHeading, daily}) n.managedProperty().bind(n.visibleProperty());
        details.setVisible(false);
        details.managedProperty().bind(details.visibleProperty());
        getChildren().addAll(heading, hint, details);
    }

    private static Label section(String s) {
        Label l = new Label(s);
        l.setWrapText(true);
        l.getStyleClass().add("section");
        return l;
    }

    void setData(ViewerData d) {
        this.data = d;
        show(-1);
    }

    int shownPatch() { return patch; }

    /** Shows a patch, or the hint when p < 0. */
    void show(int p) {
        patch = p;
        details.setVisible(p >= 0);
        hint.setVisible(p < 0);
        hint.setManaged(p < 0);
        if (p < 0) {
            heading.setText("No patch selected");
            return;
        }
        Patch pt = data.patches().get(p);
        ResultTable t = data.table();
        heading.setText("Patch " + pt.id());
        facts.getChildren().clear();
        int r = 0;
        r = row(r, "Block", pt.blockName());
        r = row(r, "Surface", Integer.toString(pt.surface()));
        r = row(r, "Kind", pt.kind().label());
        r = row(r, "Tilt", fmt(pt.tiltDeg(), 0) + "\u00b0");
        r = row(r, "Azimuth", pt.tiltDeg() < 1 ? "(horizontal)" : fmt(pt.azimuthDeg(), 0) + "\u00b0 " + org.solmass.model.Compass.shortName(pt.azimuthDeg()));
        r = row(r, "Area", fmt(pt.areaM2(), 2) + " m\u00b2");
        r = value(r, t, p, IrradiationColumns.SKY_VIEW_FACTOR, null, 2);
        r = value(r, t, p, IrradiationColumns.ANNUAL, null, 0);
        r = value(r, t, p, IrradiationColumns.BEAM, "  beam", 0);
        r = value(r, t, p, IrradiationColumns.DIFFUSE, "  diffuse", 0);
        r = value(r, t, p, IrradiationColumns.REFLECTED, "  reflected", 0);
        r = value(r, t, p, IrradiationColumns.UNSHADED, null, 0);
        r = value(r, t, p, IrradiationColumns.SHADING_LOSS, null, 1);
        boolean cautioned = pt.kind() == org.solmass.surface.SurfaceKind.ROOF;
        for (Column c : t.columns()) {   // the metrics' columns, sunshine hours and differences, by their own labels
            if (PANEL_SKIPS.contains(c.name()) || IrradiationColumns.MONTHLY.match(c.name()).isPresent()) continue;
            if (!Double.isFinite(t.column(c.name())[p])) continue;   // e.g. no VSC on a roof, no zone: no row
            r = value(r, t, p, c, null, 1);
            cautioned |= c.cautioned();
        }
        caution.setVisible(cautioned);
        caution.setManaged(cautioned);

        XYChart.Series<String, Number> s = new XYChart.Series<>();
        for (int m = 1; m <= 12; m++) {
            String c = IrradiationColumns.month(m).name();
            if (t.has(c)) s.getData().add(new XYChart.Data<>(MONTHS[m - 1], t.column(c)[p]));
        }
        monthly.getData().setAll(FXCollections.singletonObservableList(s));
        double[] mh = new double[MonthHour.SLOTS];
        double max = 0;
        for (int m = 1; m <= 12; m++) for (int h = 0; h < 24; h++) {
            double v = data.monthHour(p, m, h);
            mh[MonthHour.index(m, h)] = v;
            if (Double.isFinite(v)) max = Math.max(max, v);
        }
        boolean hourly = data.monthHourWm2() != null;
        heat.setVisible(hourly);
        dailyHeading.setVisible(hourly);
        daily.setVisible(hourly);
        noHourly.setVisible(!hourly);
        heat.draw(hourly ? mh : null, max > 0 ? max : 1, "W/m\u00b2");
        drawDaily();
    }

    private void drawDaily() {
        if (patch < 0 || data == null) return;
        int m = month.getSelectionModel().getSelectedIndex() + 1;
        XYChart.Series<Number, Number> s = new XYChart.Series<>();
        if (data.monthHourWm2() != null) {
            for (int h = 0; h < 24; h++) s.getData().add(new XYChart.Data<>(h + 0.5, data.monthHour(patch, m, h)));
        }
        daily.getData().setAll(FXCollections.singletonObservableList(s));
    }

    private int row(int r, String k, String v) {
        Label kl = new Label(k), vl = new Label(v);
        kl.getStyleClass().add("fact-key");
        vl.getStyleClass().add("fact-value");
        kl.setWrapText(true);                                    // a long label wraps ...
        vl.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE); // ... the value is never cut
        vl.setId("fact-" + k.trim().toLowerCase(Locale.ROOT).replace(' ', '-'));
        facts.addRow(r, kl, vl);
        return r + 1;
    }

    /** A row of a column's value: its own label unless given, whole numbers for integer and categorical columns. */
    private int value(int r, ResultTable t, int p, Column col, String label, int dec) {
        if (!t.has(col.name())) return r;
        Column c = t.def(col.name());
        String u = c.unit().display();
        double v = t.column(c.name())[p];
        String text = Double.isFinite(v) ? fmt(v, c.kind().whole() ? 0 : dec) + (u.isEmpty() ? "" : " " + u) : "no value";
        return row(r, label != null ? label : c.label(), text);
    }

    static String fmt(double v, int dec) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%,." + dec + "f", v) : "no value";
    }


}
