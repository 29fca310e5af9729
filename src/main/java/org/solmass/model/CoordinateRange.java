package org.solmass.model;

import org.solmass.InputException;

import java.util.Locale;

/**
 * The coordinate range Solmass supports, checked when a model is read (docs/geometry.md,
 * "Supported coordinate range"), and the report of vertices that no face uses.
 */
public final class CoordinateRange {
    /**
     * Largest |coordinate| of a vertex that a face uses, metres, after the unit, up axis and north
     * angle are applied. Every projected coordinate system in use stays below it (Web Mercator
     * reaches about 2.0e7 m, UTM northings 1e7 m). At 1e8 m the spacing of doubles is 1.5e-8 m, so
     * the weld tolerance (1e-6 of the model's diagonal, {@link VertexWelder}) stays over 100 double
     * steps for any model wider than 1.5 m; the ray engine stores floats relative to the model's
     * centre, so the absolute position costs it nothing.
     */
    public static final double MAX_COORDINATE_M = 1e8;
    /**
     * Largest extent along any axis of the vertices the faces use, metres (100 km). The ray engine
     * stores triangles as floats relative to the model's centre: at 50 km from it a float resolves
     * 2^-24 x 5e4 = 3 mm, and its ray offset (1e-5 of the diagonal) reaches 1.4 m, the size of a
     * patch; a larger model is more likely in millimetres read as metres than a real study.
     */
    public static final double MAX_EXTENT_M = 1e5;

    private CoordinateRange() {}

    /**
     * Refuses used vertices beyond {@link #MAX_COORDINATE_M} or spanning more than {@link #MAX_EXTENT_M}.
     *
     * @param vLine the line (or, for a geo-referenced model, the feature number) of each vertex, for messages
     */
    public static void check(double[] v, int[] vLine, String name) {
        int n = v.length / 3;
        int[] lo = new int[3], hi = new int[3];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < 3; k++) {
                double c = v[3 * i + k];
                if (Math.abs(c) > MAX_COORDINATE_M) {
                    throw new InputException(InputException.at(name, vLine[i]), String.format(Locale.ROOT,
                            "vertex at %s = %.3g m is outside the supported range of +-1e8 m (after the unit is"
                                    + " applied); move the model near the origin (subtract a site origin) or check"
                                    + " the unit (--unit)", "xyz".charAt(k), c));
                }
                if (c < v[3 * lo[k] + k]) lo[k] = i;
                if (c > v[3 * hi[k] + k]) hi[k] = i;
            }
        }
        for (int k = 0; k < 3; k++) {
            double span = v[3 * hi[k] + k] - v[3 * lo[k] + k];
            if (span > MAX_EXTENT_M) {
                throw new InputException(InputException.at(name, vLine[hi[k]]), String.format(Locale.ROOT,
                        "the faces span %.0f m along %s (from the vertex at line %d to this one); the supported"
                                + " extent is %.0f m along each axis: check the unit (--unit) or split the model",
                        span, "xyz".charAt(k), vLine[lo[k]], MAX_EXTENT_M));
            }
        }
    }

    /**
     * The warning when vertices that no face uses lie outside the box of those that are used, or null.
     *
     * @param all every vertex read; {@code used} which of them faces use; {@code v} the used ones
     */
    static String strayVertices(double[] all, boolean[] used, double[] v, IntList vertLine, String name) {
        double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (int i = 0; i < v.length; i += 3) {
            for (int k = 0; k < 3; k++) { b[k] = Math.min(b[k], v[i + k]); b[k + 3] = Math.max(b[k + 3], v[i + k]); }
        }
        int outside = 0, first = -1;
        for (int i = 0; i < used.length; i++) {
            if (used[i]) continue;
            for (int k = 0; k < 3; k++) {
                double c = all[3 * i + k];
                if (c < b[k] || c > b[k + 3]) {
                    if (outside++ == 0) first = i;
                    break;
                }
            }
        }
        if (outside == 0) return null;
        return InputException.at(name, vertLine.get(first)) + ": " + outside + " vertex(es) that no face uses lie"
                + " outside the faces' bounding box (the first on this line); ignored";
    }
}
