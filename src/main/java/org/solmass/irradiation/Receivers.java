package org.solmass.irradiation;

/**
 * Every point the pipeline computes first-pass irradiance for, in one flat layout: the analysed
 * patches first (index = patch index), then the coarse patches of context blocks (reflectors only),
 * then the ground probes (reflectors only, shaded-ground mode). Receivers of the last two kinds are
 * never reported; they exist so that light reflected by context blocks and by shaded ground reaches
 * the analysed patches.
 */
final class Receivers {
    final int count, analysed;
    /** Ray origins (already offset from the surface), x,y,z per receiver. */
    final double[] origin;
    /** Unit normals, x,y,z per receiver. */
    final double[] normal;
    /** Seeds of the hemisphere ray streams. */
    final long[] seed;
    /** Surface id per receiver, -1 for ground probes. */
    final int[] surface;

    Receivers(int count, int analysed, double[] origin, double[] normal, long[] seed, int[] surface) {
        this.count = count;
        this.analysed = analysed;
        this.origin = origin;
        this.normal = normal;
        this.seed = seed;
        this.surface = surface;
    }

    double cosTilt(int r) { return normal[3 * r + 2]; }

    double sinTilt(int r) {
        double c = normal[3 * r + 2];
        return Math.sqrt(Math.max(0, 1 - c * c));
    }

    /** Builder: patches (with the scene's offset origins) then probes. */
    static final class Builder {
        private final double[] origin, normal;
        private final long[] seed;
        private final int[] surface;
        private int n;
        private final int analysed;

        Builder(int capacity, int analysed) {
            origin = new double[3 * capacity];
            normal = new double[3 * capacity];
            seed = new long[capacity];
            surface = new int[capacity];
            this.analysed = analysed;
        }

        void add(double[] o, double nx, double ny, double nz, long s, int surf) {
            origin[3 * n] = o[0];
            origin[3 * n + 1] = o[1];
            origin[3 * n + 2] = o[2];
            normal[3 * n] = nx;
            normal[3 * n + 1] = ny;
            normal[3 * n + 2] = nz;
            seed[n] = s;
            surface[n] = surf;
            n++;
        }

        Receivers build() {
            return new Receivers(n, analysed, origin, normal, seed, surface);
        }
    }
}
