package org.solmass.surface;

import org.solmass.fixtures.Boxes;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.util.Locale;

/** Builds small OBJ texts for tests (faces counter-clockwise seen from outside). */
final class TestObj {
    private final StringBuilder sb = new StringBuilder();

    TestObj block(String name) { sb.append("o ").append(name).append('\n'); return this; }

    /** A closed axis-aligned box with corner (x, y, z) and size w (x), d (y), h (z) ({@link Boxes#closed}). */
    TestObj box(double x, double y, double z, double w, double d, double h) {
        for (double[][] f : Boxes.closed(x, y, z, x + w, y + d, z + h).faces()) {
            quad(f[0][0], f[0][1], f[0][2], f[1][0], f[1][1], f[1][2], f[2][0], f[2][1], f[2][2], f[3][0], f[3][1], f[3][2]);
        }
        return this;
    }

    /** A quad face from four corners given as x,y,z triples. */
    TestObj quad(double... c) { return poly(c); }

    /** A polygon face from corners given as x,y,z triples. */
    TestObj poly(double... c) {
        int n = c.length / 3;
        for (int i = 0; i < n; i++) {
            sb.append(String.format(Locale.ROOT, "v %.17g %.17g %.17g%n", c[3 * i], c[3 * i + 1], c[3 * i + 2]));
        }
        sb.append('f');
        for (int i = n; i >= 1; i--) sb.append(' ').append(-i);
        sb.append('\n');
        return this;
    }

    String text() { return sb.toString(); }

    MassingModel model() { return model(ModelOptions.defaults()); }

    MassingModel model(ModelOptions o) { return ObjReader.parse(text(), "test.obj", o).model(); }
}
