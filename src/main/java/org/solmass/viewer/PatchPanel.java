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
import org.solmass.output.ResultTable;
import org.solmass.surface.Patch;

import java.util.Locale;

/**
 * The side panel for one picked patch: identity and geometry, sky view, annual irradiation by
 * component, monthly bars, the month-hour map of mean irradiance and one month's daily curve.
 */
final class PatchPanel extends VBox {
    static final String[] MONTHS = {"Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
    private final Label heading = new Label("No patch selected");
    private final Label hint = new Label("Click a coloured patch in the model to see its values here.");
    private final GridPane facts = new GridPane();
    private final BarChart<String, Number> monthly;
    private final HeatMap heat = new HeatMap(318, 210);
    private final ComboBox<String> month = new ComboBox<>(FXCollections.observableArrayList(MONTHS));
    private final LineChart<Number, Number> daily;
    private final Label caution = new Label(Quantity.CAUTION);
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
        r = row(r, "Azimuth", pt.tiltDeg() < 1 ? "(horizontal)" : fmt(pt.azimuthDeg(), 0) + "\u00b0 " + compass(pt.azimuthDeg()));
        r = row(r, "Area", fmt(pt.areaM2(), 2) + " m\u00b2");
        r = value(r, t, p, "sky_view_factor", "Sky view factor", 2);
        r = value(r, t, p, "annual_kwh_m2", "Annual irradiation", 0);
        r = value(r, t, p, "beam_kwh_m2", "  beam", 0);
        r = value(r, t, p, "diffuse_kwh_m2", "  diffuse", 0);
        r = value(r, t, p, "reflected_kwh_m2", "  reflected", 0);
        r = value(r, t, p, "unshaded_kwh_m2", "Without obstructions", 0);
        r = value(r, t, p, "shading_loss_pct", "Shading loss", 1);
        for (String n : t.names()) if (n.startsWith("sun_hours_") || n.startsWith("pv_")) r = value(r, t, p, n, Quantity.labelOf(n), 1);
        boolean pv = t.names().stream().anyMatch(n -> n.startsWith("pv_")) || pt.kind().label().equals("roof");
        caution.setVisible(pv);
        caution.setManaged(pv);

        XYChart.Series<String, Number> s = new XYChart.Series<>();
        for (int m = 1; m <= 12; m++) {
            String c = String.format(Locale.ROOT, "m%02d_kwh_m2", m);
            if (t.has(c)) s.getData().add(new XYChart.Data<>(MONTHS[m - 1], t.column(c)[p]));
        }
        monthly.getData().setAll(FXCollections.singletonObservableList(s));
        double[] mh = new double[288];
        double max = 0;
        for (int m = 1; m <= 12; m++) for (int h = 0; h < 24; h++) {
            double v = data.monthHour(p, m, h);
            mh[(m - 1) * 24 + h] = v;
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
        vl.setId("fact-" + k.trim().toLowerCase(Locale.ROOT).replace(' ', '-'));
        facts.addRow(r, kl, vl);
        return r + 1;
    }

    private int value(int r, ResultTable t, int p, String col, String label, int dec) {
        if (!t.has(col)) return r;
        String u = t.unit(col);
        return row(r, label, fmt(t.column(col)[p], dec) + (u.isEmpty() ? "" : " " + Quantity.pretty(u)));
    }

    static String fmt(double v, int dec) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%,." + dec + "f", v) : "n/a";
    }

    static String compass(double az) {
        String[] c = {"N", "NE", "E", "SE", "S", "SW", "W", "NW"};
        return c[(int) Math.floorMod(Math.round(az / 45.0), 8)];
    }
}
