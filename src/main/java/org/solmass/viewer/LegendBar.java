package org.solmass.viewer;

import org.solmass.output.LegendTicks;

import javafx.geometry.VPos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.control.Label;
import javafx.scene.layout.VBox;
import javafx.scene.paint.Color;
import javafx.scene.text.Font;
import javafx.scene.text.TextAlignment;

/** The colour legend: quantity and unit, the ramp with round ticks, and the threshold mark. */
final class LegendBar extends VBox {
    /** At most this many ticks under the bar. */
    static final int MAX_TICKS = 6;
    private final Label title = new Label();
    private final Canvas bar = new Canvas(236, 44);

    LegendBar() {
        super(4);
        title.setWrapText(true);
        title.getStyleClass().add("legend-title");
        getChildren().addAll(title, bar);
    }

    void show(Quantity q, ColourScale s, double threshold) {
        title.setText(q.title());
        GraphicsContext g = bar.getGraphicsContext2D();
        double w = bar.getWidth(), x0 = 8, bw = w - 16, bh = 16;
        g.clearRect(0, 0, w, bar.getHeight());
        for (int i = 0; i < ColourScale.STEPS; i++) {
            g.setFill(HeatMap.rgb(s.rgbOfIndex(i)));
            g.fillRect(x0 + i * bw / ColourScale.STEPS, 2, Math.ceil(bw / ColourScale.STEPS) + 0.5, bh);
        }
        g.setStroke(Color.rgb(90, 90, 90));
        g.setLineWidth(0.6);
        g.strokeRect(x0, 2, bw, bh);
        double[] ticks = LegendTicks.ticks(s.min(), s.max(), MAX_TICKS);
        double step = ticks.length > 1 ? ticks[1] - ticks[0] : LegendTicks.step(s.min() - 1, s.max() + 1, MAX_TICKS);
        if (q.def().kind().whole()) {   // levels and zone numbers: whole ticks only
            ticks = java.util.Arrays.stream(ticks).filter(t -> t == Math.rint(t)).toArray();
            step = Math.max(1, step);
        }
        g.setFill(Color.rgb(40, 40, 40));
        g.setFont(Font.font(11));
        g.setTextAlign(TextAlignment.CENTER);
        g.setTextBaseline(VPos.TOP);
        for (double t : ticks) {
            double x = x0 + bw * (s.max() > s.min() ? (t - s.min()) / (s.max() - s.min()) : 0.5);
            g.strokeLine(x, 2 + bh, x, 2 + bh + 4);
            g.fillText(LegendTicks.label(t, step), x, 2 + bh + 6);
        }
        if (Double.isFinite(threshold) && s.max() > s.min()) {
            double x = x0 + bw * Math.max(0, Math.min(1, (threshold - s.min()) / (s.max() - s.min())));
            g.setStroke(Color.rgb(15, 15, 15));
            g.setLineWidth(2);
            g.strokeLine(x, 0, x, 2 + bh + 2);
        }
    }
}
