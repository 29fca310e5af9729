package org.solmass.viewer;

import javafx.geometry.VPos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.paint.Color;
import javafx.scene.text.Font;
import javafx.scene.text.TextAlignment;
import org.solmass.climate.MonthHour;
import org.solmass.output.ColourRamp;

/** A month (rows, January on top) by hour (columns, 0..23 local standard time) grid coloured with the ramp. */
final class HeatMap extends Canvas {
    private static final String[] M = {"J", "F", "M", "A", "M", "J", "J", "A", "S", "O", "N", "D"};
    static final double LEFT = 18, BOTTOM = 30, TOP = 4;

    HeatMap(double w, double h) {
        super(w, h);
    }

    /** Draws 288 values ({@code [MonthHour.index(month, hour)]}) on 0..max; NaN cells stay empty. */
    void draw(double[] v, double max, String unit) {
        GraphicsContext g = getGraphicsContext2D();
        double w = getWidth(), h = getHeight();
        g.clearRect(0, 0, w, h);
        double gw = w - LEFT - 10, gh = h - BOTTOM - TOP, cw = gw / 24, ch = gh / 12;
        for (int m = 0; m < 12; m++) {
            for (int hr = 0; hr < 24; hr++) {
                double x = v == null ? Double.NaN : v[MonthHour.index(m + 1, hr)];
                Color c = Double.isFinite(x) ? rgb(ColourRamp.sequential(ColourRamp.normalise(x, 0, max))) : Color.rgb(235, 235, 235);
                g.setFill(c);
                g.fillRect(LEFT + hr * cw, TOP + m * ch, Math.ceil(cw), Math.ceil(ch));
            }
        }
        g.setFill(Color.rgb(60, 60, 60));
        g.setFont(Font.font(Math.max(8, Math.min(11, ch - 1))));
        g.setTextBaseline(VPos.CENTER);
        g.setTextAlign(TextAlignment.CENTER);
        for (int m = 0; m < 12; m++) g.fillText(M[m], LEFT / 2, TOP + (m + 0.5) * ch);
        g.setTextBaseline(VPos.TOP);
        for (int hr = 0; hr <= 24; hr += 6) g.fillText(Integer.toString(hr), LEFT + hr * cw, TOP + gh + 2);
        // ramp key under the hours
        double ky = TOP + gh + 15, kw = gw * 0.5;
        for (int i = 0; i < 64; i++) {
            g.setFill(rgb(ColourRamp.sequential(i / 63.0)));
            g.fillRect(LEFT + i * kw / 64, ky, Math.ceil(kw / 64), 8);
        }
        g.setFill(Color.rgb(60, 60, 60));
        g.setTextAlign(TextAlignment.LEFT);
        g.setTextBaseline(VPos.CENTER);
        g.fillText(String.format(java.util.Locale.ROOT, "0 \u2013 %.0f %s", max, unit), LEFT + kw + 6, ky + 4);
    }

    static Color rgb(int c) { return Color.rgb((c >> 16) & 255, (c >> 8) & 255, c & 255); }
}
