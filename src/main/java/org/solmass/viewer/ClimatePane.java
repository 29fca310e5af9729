package org.solmass.viewer;

import javafx.collections.FXCollections;
import javafx.scene.chart.BarChart;
import javafx.scene.chart.CategoryAxis;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.VBox;

/** The study's climate input at a glance: month-hour maps of global and diffuse horizontal irradiance, monthly totals. */
final class ClimatePane extends VBox {
    private final Label caption = new Label();
    private final HeatMap ghi = new HeatMap(370, 230), dhi = new HeatMap(370, 230);
    private final BarChart<String, Number> totals;

    ClimatePane() {
        super(10);
        getStyleClass().add("climate-pane");
        caption.getStyleClass().add("panel-heading");
        caption.setWrapText(true);
        CategoryAxis x = new CategoryAxis();
        NumberAxis y = new NumberAxis();
        y.setLabel("kWh/m\u00b2 per month");
        totals = new BarChart<>(x, y);
        totals.setAnimated(false);
        totals.setPrefHeight(260);
        totals.setPrefWidth(690);
        totals.setMaxWidth(690);
        caption.setMaxWidth(690);
        totals.setTitle("Monthly horizontal irradiation");
        VBox a = new VBox(4, new Label("Global horizontal, mean W/m\u00b2"), ghi);
        VBox b = new VBox(4, new Label("Diffuse horizontal, mean W/m\u00b2"), dhi);
        getChildren().addAll(caption, new HBox(24, a, b), totals);
    }

    void show(ViewerData d) {
        ClimateGlance c = d.climate();
        if (c == null) {
            caption.setText("This study carries no climate summary.");
            ghi.draw(null, 1, "W/m\u00b2");
            dhi.draw(null, 1, "W/m\u00b2");
            totals.getData().clear();
            return;
        }
        double tg = 0, td = 0;
        for (int m = 0; m < 12; m++) {
            tg += c.ghiMonthKwhM2()[m];
            td += c.dhiMonthKwhM2()[m];
        }
        caption.setText(String.format(java.util.Locale.ROOT,
                "Climate: %s  \u2014  %.2f\u00b0 %s, %.2f\u00b0 %s, %s  \u2014  year: %.0f kWh/m\u00b2 global, %.0f kWh/m\u00b2 diffuse (%.0f %%)",
                c.source(), Math.abs(d.latitudeDeg()), d.latitudeDeg() >= 0 ? "N" : "S", Math.abs(d.longitudeDeg()),
                d.longitudeDeg() >= 0 ? "E" : "W", d.zone(), tg, td, tg > 0 ? 100 * td / tg : 0));
        double max = 0;
        for (double v : c.ghiWm2()) max = Math.max(max, v);
        max = max > 0 ? max : 1;
        ghi.draw(c.ghiWm2(), max, "W/m\u00b2");
        dhi.draw(c.dhiWm2(), max, "W/m\u00b2");
        XYChart.Series<String, Number> g = new XYChart.Series<>(), f = new XYChart.Series<>();
        g.setName("global");
        f.setName("diffuse");
        for (int m = 0; m < 12; m++) {
            g.getData().add(new XYChart.Data<>(PatchPanel.MONTHS[m], c.ghiMonthKwhM2()[m]));
            f.getData().add(new XYChart.Data<>(PatchPanel.MONTHS[m], c.dhiMonthKwhM2()[m]));
        }
        totals.setData(FXCollections.observableArrayList(g, f));
    }
}
