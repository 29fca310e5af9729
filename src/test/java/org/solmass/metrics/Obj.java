package org.solmass.metrics;

import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.util.Locale;

/** Small OBJ texts for the metrics tests: boxes without a bottom, faces counter-clockwise from outside. */
final class Obj {
    private final StringBuilder sb = new StringBuilder();

    Obj block(String name) { sb.append("o ").append(name).append('\n'); return this; }

    /** A box from (x0, y0, 0) to (x1, y1, h) with roof and four walls ({@link Boxes#onGround}). */
    Obj box(double x0, double y0, double x1, double y1, double h) {
        for (double[][] f : Boxes.onGround(x0, y0, x1, y1, h).faces()) {
            quad(f[0][0], f[0][1], f[0][2], f[1][0], f[1][1], f[1][2], f[2][0], f[2][1], f[2][2], f[3][0], f[3][1], f[3][2]);
        }
        return this;
    }

    Obj quad(double... c) {
        for (int i = 0; i < 4; i++) sb.append(String.format(Locale.ROOT, "v %.17g %.17g %.17g%n", c[3 * i], c[3 * i + 1], c[3 * i + 2]));
        sb.append("f -4 -3 -2 -1\n");
        return this;
    }

    String text() { return sb.toString(); }

    MassingModel model() { return ObjReader.parse(text(), "test.obj", ModelOptions.defaults()).model(); }
}
