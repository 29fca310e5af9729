package org.solmass.viewer;

import javafx.collections.FXCollections;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.Slider;
import javafx.scene.layout.HBox;
import javafx.scene.layout.VBox;
import javafx.scene.paint.Color;
import javafx.scene.text.Font;
import javafx.scene.text.TextAlignment;

import java.time.Month;
import java.time.format.TextStyle;
import java.util.List;
import java.util.Locale;

/**
 * The sun path of the site as a small chart beside the model, not drawn through it: the sky seen
 * from above as a disc (equidistant polar projection: the horizon is the rim, the zenith the centre,
 * the distance from the centre proportional to 90 deg minus the elevation; north up, east right, as
 * a plan is drawn), the monthly-average days' tracks (June and December darker), the whole hours as
 * dots, and the sun at the month and hour the user picks, read off those tracks.
 */
final class SunInset extends VBox {
    static final double SIZE_PX = 170;
    private final Canvas canvas = new Canvas(SIZE_PX, SIZE_PX);
    private final ComboBox<String> month = new ComboBox<>();
    private final Slider hour = new Slider(4, 20, 12);
    private final Label readout = new Label();
    private List<SunArc> arcs = List.of();

    SunInset() {
        super(4);
        setId("sun-inset");
        getStyleClass().add("sun-inset");
        setPadding(new Insets(8));
        setMaxSize(SIZE_PX + 16, USE_PREF_SIZE);
        for (Month m : Month.values()) month.getItems().add(m.getDisplayName(TextStyle.SHORT, Locale.ENGLISH));
        month.getSelectionModel().select(5);
        month.setPrefWidth(74);
        hour.setMajorTickUnit(1);
        hour.setSnapToTicks(true);
        hour.setBlockIncrement(1);
        hour.setPrefWidth(86);
        month.valueProperty().addListener((o, a, b) -> draw());
        hour.valueProperty().addListener((o, a, b) -> draw());
        readout.getStyleClass().add("small");
        readout.setWrapText(true);
        readout.setMaxWidth(SIZE_PX);
        Label title = new Label("Sun path of the site");
        title.getStyleClass().add("head");
        HBox pick = new HBox(6, month, hour);
        pick.setAlignment(Pos.CENTER_LEFT);
        getChildren().addAll(title, canvas, pick, readout);
    }

    void setArcs(List<SunArc> a) {
        arcs = a == null ? List.of() : a;
        draw();
    }

    /** Picks the month (1..12) and local standard hour shown as the current sun. */
    void setTime(int m, double h) {
        month.getSelectionModel().select(m - 1);
        hour.setValue(h);
    }

    /** {x, y} of a sky direction on a disc of radius r centred at (cx, cy): north up, east right. */
    static double[] xy(double azimuthDeg, double elevationDeg, double cx, double cy, double r) {
        double d = r * (90 - Math.max(0, elevationDeg)) / 90, a = Math.toRadians(azimuthDeg);
        return new double[] {cx + d * Math.sin(a), cy - d * Math.cos(a)};
    }

    /** The sun on month m's track at local standard hour h (linear between the track's points); null when it is down. */
    static SunArc.Point sunAt(List<SunArc> arcs, int m, double h) {
        for (SunArc a : arcs) {
            if (a.month() != m) continue;
            List<SunArc.Point> p = a.points();
            for (int i = 0; i + 1 < p.size(); i++) {
                SunArc.Point u = p.get(i), v = p.get(i + 1);
                if (h >= u.localHour() && h <= v.localHour()) {
                    double t = v.localHour() == u.localHour() ? 0 : (h - u.localHour()) / (v.localHour() - u.localHour());
                    double daz = ((v.azimuthDeg() - u.azimuthDeg() + 540) % 360) - 180;
                    return new SunArc.Point(h, (u.azimuthDeg() + t * daz + 360) % 360, u.elevationDeg() + t * (v.elevationDeg() - u.elevationDeg()));
                }
            }
        }
        return null;
    }

    private void draw() {
        GraphicsContext g = canvas.getGraphicsContext2D();
        double s = SIZE_PX, cx = s / 2, cy = s / 2, r = s / 2 - 16;
        g.clearRect(0, 0, s, s);
        g.setFill(Color.rgb(0xFB, 0xFA, 0xF7));
        g.fillOval(cx - r, cy - r, 2 * r, 2 * r);
        g.setStroke(Color.rgb(0xB8, 0xB5, 0xAE));
        g.setLineWidth(0.8);
        for (int el : new int[] {30, 60}) {
            double d = r * (90 - el) / 90;
            g.strokeOval(cx - d, cy - d, 2 * d, 2 * d);
        }
        g.strokeLine(cx - r, cy, cx + r, cy);
        g.strokeLine(cx, cy - r, cx, cy + r);
        g.setStroke(Color.rgb(0x55, 0x55, 0x55));
        g.setLineWidth(1.2);
        g.strokeOval(cx - r, cy - r, 2 * r, 2 * r);
        g.setFill(Color.rgb(0x33, 0x33, 0x33));
        g.setFont(Font.font(11));
        g.setTextAlign(TextAlignment.CENTER);
        g.fillText("N", cx, cy - r - 4);
        g.fillText("S", cx, cy + r + 12);
        g.fillText("E", cx + r + 8, cy + 4);
        g.fillText("W", cx - r - 8, cy + 4);
        g.setFont(Font.font(9));
        g.setFill(Color.rgb(0x77, 0x77, 0x77));
        g.fillText("30\u00b0", cx + 4 + r / 3 * 2, cy - 2);
        g.fillText("60\u00b0", cx + 4 + r / 3, cy - 2);
        for (SunArc a : arcs) {
            boolean solstice = a.month() == 6 || a.month() == 12;
            g.setStroke(solstice ? Color.rgb(0x8A, 0x4B, 0x2E) : Color.rgb(0xC9, 0x9A, 0x6E));
            g.setLineWidth(solstice ? 2 : 1);
            double[] prev = null;
            for (SunArc.Point p : a.points()) {
                double[] q = xy(p.azimuthDeg(), p.elevationDeg(), cx, cy, r);
                if (prev != null) g.strokeLine(prev[0], prev[1], q[0], q[1]);
                prev = q;
            }
            g.setFill(Color.rgb(0x6B, 0x5B, 0x4E));
            for (SunArc.Point p : a.points()) {
                if (Math.abs(p.localHour() - Math.rint(p.localHour())) > 1e-6) continue;
                double[] q = xy(p.azimuthDeg(), p.elevationDeg(), cx, cy, r);
                g.fillOval(q[0] - 1.5, q[1] - 1.5, 3, 3);
            }
        }
        int m = month.getSelectionModel().getSelectedIndex() + 1;
        double h = hour.getValue();
        SunArc.Point sun = sunAt(arcs, m, h);
        String when = month.getValue() + String.format(Locale.ROOT, ", %02d:00 local standard time", (int) Math.round(h));
        if (sun == null) {
            readout.setText(when + ": the sun is down (average day of the month).");
            return;
        }
        double[] q = xy(sun.azimuthDeg(), sun.elevationDeg(), cx, cy, r);
        g.setFill(Color.rgb(0xF2, 0xB1, 0x1F));
        g.fillOval(q[0] - 6, q[1] - 6, 12, 12);
        g.setStroke(Color.rgb(0x3A, 0x2A, 0x10));
        g.setLineWidth(1.2);
        g.strokeOval(q[0] - 6, q[1] - 6, 12, 12);
        readout.setText(String.format(Locale.ROOT, "%s: sun at azimuth %.0f\u00b0, %.0f\u00b0 above the horizon (average day).",
                when, sun.azimuthDeg(), sun.elevationDeg()));
    }
}
