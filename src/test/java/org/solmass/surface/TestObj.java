package org.solmass.surface;

import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;

import java.util.Locale;

/** Builds small OBJ texts for tests (faces counter-clockwise seen from outside). */
final class TestObj {
    private final StringBuilder sb = new StringBuilder();

    TestObj block(String name) { sb.append("o ").append(name).append('\n'); return this; }

    /** A closed axis-aligned box with corner (x, y, z) and size w (x), d (y), h (z). */
    TestObj box(double x, double y, double z, double w, double d, double h) {
        double X = x + w, Y = y + d, Z = z + h;
        quad(x, y, Z, X, y, Z, X, Y, Z, x, Y, Z);  // roof
        quad(x, y, z, x, Y, z, X, Y, z, X, y, z);  // bottom
        quad(x, y, z, X, y, z, X, y, Z, x, y, Z);  // south
        quad(X, y, z, X, Y, z, X, Y, Z, X, y, Z);  // east
        quad(X, Y, z, x, Y, z, x, Y, Z, X, Y, Z);  // north
        quad(x, Y, z, x, y, z, x, y, Z, x, Y, Z);  // west
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
