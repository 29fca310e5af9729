package org.solmass.irradiation;

import org.solmass.scene.BundleTracer;
import org.solmass.scene.Scene;

/**
 * The rays that measure how much of the Perez horizon band a point sees: 3 elevations x 72 azimuths
 * spread evenly over 0 to {@value ShadedIrradiation#HORIZON_BAND_DEG} degrees of elevation, each
 * weighted by {@code cos(incidence) cos(elevation)} (Perez et al. 1987, Solar Energy 39(3): the
 * horizon brightening comes from a band of 6.5 degrees above the horizon). Used by
 * {@link ShadedIrradiation} for patches and by the PV stage for module substrings.
 *
 * <p>One instance per thread: it owns scratch arrays sized for its bundle.
 */
public final class HorizonBand {
    /** Rays of the band. */
    public static final int RAYS = ShadedIrradiation.HORIZON_ELEVATIONS * ShadedIrradiation.HORIZON_AZIMUTHS;
    private final double[] dir = new double[3 * RAYS];
    private final double[] cosElev = new double[RAYS];
    private final double[] bundleDir = new double[3 * RAYS];
    private final double[] bundleW = new double[RAYS];
    private final boolean[] blocked = new boolean[RAYS];
    /** The far horizon's answer per band ray for {@link #farScene} (the same from every origin), and per bundle ray. */
    private boolean[] far;
    private final boolean[] bundleFar = new boolean[RAYS];
    private Scene farScene;

    public HorizonBand() {
        int h = 0;
        for (int e = 0; e < ShadedIrradiation.HORIZON_ELEVATIONS; e++) {
            double el = Math.toRadians((e + 0.5) * ShadedIrradiation.HORIZON_BAND_DEG / ShadedIrradiation.HORIZON_ELEVATIONS);
            for (int a = 0; a < ShadedIrradiation.HORIZON_AZIMUTHS; a++, h++) {
                double az = 2 * Math.PI * (a + 0.5) / ShadedIrradiation.HORIZON_AZIMUTHS;
                dir[3 * h] = Math.sin(az) * Math.cos(el);
                dir[3 * h + 1] = Math.cos(az) * Math.cos(el);
                dir[3 * h + 2] = Math.sin(el);
                cosElev[h] = Math.cos(el);
            }
        }
    }

    /**
     * Puts the band rays in front of a plane of unit normal n into a caller's arrays from index
     * {@code at} (directions, the scene's far-horizon answers, weights), to be traced with other rays
     * (the first pass: as the plane's shared rays, with the sun's); {@link #share} then reads their
     * answers. Returns the new end.
     */
    int queue(Scene scene, double nx, double ny, double nz, double[] dirOut, boolean[] farOut, double[] wOut, int at) {
        farFor(scene);
        int m = at;
        for (int h = 0; h < RAYS; h++) {
            double dx = dir[3 * h], dy = dir[3 * h + 1], dz = dir[3 * h + 2];
            double c = nx * dx + ny * dy + nz * dz;
            if (c <= 0) continue;
            dirOut[3 * m] = dx;
            dirOut[3 * m + 1] = dy;
            dirOut[3 * m + 2] = dz;
            farOut[m] = far[h];
            wOut[m++] = c * cosElev[h];
        }
        return m;
    }

    /** The far horizon's answers for the band's rays in {@code scene} (kept while the scene stays the same). */
    private void farFor(Scene scene) {
        if (scene == farScene) return;
        farScene = scene;
        far = scene.escapeBlocked(dir, RAYS);
    }

    /** Visible share of the band rays queued at [from, to) ({@link #queue}) from their answers, [0, 1]. */
    static double share(double[] w, boolean[] blocked, int from, int to) {
        double all = 0, seen = 0;
        for (int i = from; i < to; i++) {
            all += w[i];
            if (!blocked[i]) seen += w[i];
        }
        return all > 0 ? seen / all : 0;
    }

    /**
     * Visible share of the band seen from origin {@code o} by a plane of unit normal {@code n}, [0, 1]:
     * the band rays in front of the plane are traced together as one bundle.
     */
    public double visibility(BundleTracer bundle, double ox, double oy, double oz, double nx, double ny, double nz) {
        return visibility(bundle, ox, oy, oz, nx, ny, nz, null);
    }

    /** As {@link #visibility(BundleTracer, double, double, double, double, double, double)}, the band also seen through tree crowns when {@code canopy} is not null. */
    double visibility(BundleTracer bundle, double ox, double oy, double oz, double nx, double ny, double nz,
                      CanopyShading.Probe canopy) {
        farFor(bundle.scene());
        double all = 0;
        int m = 0;
        for (int h = 0; h < RAYS; h++) {
            double dx = dir[3 * h], dy = dir[3 * h + 1], dz = dir[3 * h + 2];
            double c = nx * dx + ny * dy + nz * dz;
            if (c <= 0) continue;
            double w = c * cosElev[h];
            all += w;
            bundleDir[3 * m] = dx;
            bundleDir[3 * m + 1] = dy;
            bundleDir[3 * m + 2] = dz;
            bundleFar[m] = far[h];
            bundleW[m++] = w;
        }
        bundle.occludedKnownFar(ox, oy, oz, bundleDir, bundleFar, m, blocked);
        double seen = 0;
        for (int i = 0; i < m; i++) if (!blocked[i]) seen += bundleW[i];
        if (canopy != null) canopy.horizon(ox, oy, oz, bundleDir, bundleW, m, blocked, all);
        return all > 0 ? seen / all : 0;
    }
}
