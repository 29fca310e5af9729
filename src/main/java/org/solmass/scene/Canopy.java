package org.solmass.scene;

/**
 * Tree crowns as a scene of their own: the triangles of the blocks a study marks as trees, kept out of
 * the opaque {@link Scene} so that the opaque queries stay as they are. A ray the opaque scene lets
 * through (up to its opaque hit, or to infinity) is traced against the crowns to count how many
 * crowns it crosses; the irradiation stage turns the count into a transmittance
 * {@code t^crossings} (docs/method.md, "Vegetation").
 *
 * <p>Counting: the crown surfaces met along the ray at {@code 0 < s < sMax} are found one after the
 * other (closest hit, then again from just past it); a closed crown met from outside is met twice (in
 * and out), so the crossings are {@code ceil(hits / 2)}: two crowns in line give 2; a ray that starts
 * inside a crown and leaves it, or enters one and ends at an opaque face inside it, crosses it once; a
 * single open sheet (a billboard tree) counts once. A ray that starts and ends inside the same crown
 * meets no surface and counts none (a patch inside a crown is not attenuated by it on such rays).
 *
 * <p>Immutable and thread-safe; each thread counts through its own {@link Counter}.
 */
public final class Canopy {
    /** At most this many crown surfaces are followed along one ray (a guard against degenerate meshes). */
    public static final int MAX_SURFACES = 64;

    private final Scene crowns;

    private Canopy(Scene crowns) { this.crowns = crowns; }

    /**
     * The crowns from a triangle soup (9 floats per triangle: three corners' x,y,z, metres, world
     * coordinates), without a ground plane.
     */
    public static Canopy build(float[] soup) {
        return new Canopy(Scene.build(soup, false, 0));
    }

    public int triangleCount() { return crowns.triangleCount(); }

    /** A new counter for the calling thread (not thread-safe). */
    public Counter counter() { return new Counter(crowns.tracer(), crowns.epsilon()); }

    /** Per-thread crossing counts; allocates nothing per ray. */
    public static final class Counter {
        private final Tracer tracer;
        private final double step;

        Counter(Tracer tracer, double step) {
            this.tracer = tracer;
            this.step = step;
        }

        /**
         * Crown crossings of the ray {@code o + s d} for {@code 0 < s < sMax} ({@code d} a unit vector,
         * {@code sMax} in metres, +infinity for a ray to the sky): {@code ceil(surfaces met / 2)}.
         */
        public int crossings(double ox, double oy, double oz, double dx, double dy, double dz, double sMax) {
            double s = 0;
            int hits = 0;
            while (hits < MAX_SURFACES) {
                double x = ox + s * dx, y = oy + s * dy, z = oz + s * dz;
                if (tracer.closestHit(x, y, z, dx, dy, dz, sMax - s) == Tracer.MISS) break;
                hits++;
                s += tracer.t() + step;
                if (!(s < sMax)) break;
            }
            return (hits + 1) / 2;
        }
    }
}
