package org.solmass.pv;

import org.solmass.model.Parallel;
import org.solmass.irradiation.HorizonBand;
import org.solmass.irradiation.SunDirections;
import org.solmass.model.Vec3;
import org.solmass.scene.BundleTracer;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.Scene;
import org.solmass.scene.SkyViewCalculator;
import org.solmass.scene.ViewFactors;

import java.util.List;

/**
 * What each substring of each placed module sees, measured with the ray engine on the scene that
 * holds the racks ({@link Scene#withTriangles}): the same quantities the irradiation stage measures
 * for a patch (docs/method.md), so that {@link PlaneOfArray} can apply the same formulas.
 *
 * <ul>
 * <li>per substring and sun direction: the share of the substring's sample points that see the sun
 *     ({@code along x across} points spread evenly over the strip, one occlusion ray each, traced as one
 *     bundle per point); this is the beam and circumsolar visibility, and the shaded share of the
 *     substring the mismatch model needs;</li>
 * <li>per substring, from its centre: the obstructed sky, ground and obstruction view factors
 *     (cosine-weighted hemisphere rays, {@link HemisphereSampler}) and the visible share of the Perez
 *     horizon band ({@link HorizonBand}).</li>
 * </ul>
 * Deterministic: each module is computed from seeds made of its zone and index, into its own slots.
 */
public final class ModuleSight {
    /** Default sample points along and across a substring. */
    public static final int DEFAULT_ALONG = 4, DEFAULT_ACROSS = 2;

    final List<PvModule> modules;
    final int substrings;
    final int directions;
    /** Per substring q = module x substrings + k and direction d: visible share, {@code q * directions + d}. */
    final float[] sunVisible;
    final double[] skyVf, groundVf, obstructionVf, horizonVis;

    private ModuleSight(List<PvModule> modules, int substrings, int directions) {
        this.modules = modules;
        this.substrings = substrings;
        this.directions = directions;
        int n = modules.size() * substrings;
        sunVisible = new float[n * directions];
        skyVf = new double[n];
        groundVf = new double[n];
        obstructionVf = new double[n];
        horizonVis = new double[n];
    }

    public List<PvModule> modules() { return modules; }

    public int substrings() { return substrings; }

    /** Visible share of sun direction {@code d} from substring {@code k} of module {@code m}, [0, 1]. */
    public double sunVisible(int m, int k, int d) { return sunVisible[(m * substrings + k) * directions + d]; }

    /** Obstructed sky view factor of substring {@code k} of module {@code m}. */
    public double skyViewFactor(int m, int k) { return skyVf[m * substrings + k]; }

    /** View factor of the ground (the ground plane and ground-flagged triangles) from substring {@code k} of module {@code m}. */
    public double groundViewFactor(int m, int k) { return groundVf[m * substrings + k]; }

    /** View factor of the obstructions (triangles not flagged ground, far horizon) from substring {@code k} of module {@code m}. */
    public double obstructionViewFactor(int m, int k) { return obstructionVf[m * substrings + k]; }

    /**
     * @param scene the scene with the racks in it
     * @param triangleIsGround per scene triangle: ground or not (modules: not)
     * @param modules the modules
     * @param substrings bypass-diode substrings per module
     * @param sun the sun directions of the run
     * @param rays hemisphere rays per substring
     * @param runSeed seed of the run's ray streams
     * @param along sample points along a substring
     * @param across sample points across a substring
     */
    public static ModuleSight compute(Scene scene, boolean[] triangleIsGround, List<PvModule> modules, int substrings,
                                      SunDirections sun, int rays, long runSeed, int along, int across) {
        Vec3[] dirs = new Vec3[sun.count()];
        for (int d = 0; d < dirs.length; d++) dirs[d] = sun.direction(d);
        return compute(scene, triangleIsGround, modules, substrings, dirs, rays, runSeed, along, across);
    }

    /** As {@link #compute(Scene, boolean[], List, int, SunDirections, int, long, int, int)} for given unit sun directions. */
    public static ModuleSight compute(Scene scene, boolean[] triangleIsGround, List<PvModule> modules, int substrings,
                                      Vec3[] sun, int rays, long runSeed, int along, int across) {
        ModuleSight s = new ModuleSight(List.copyOf(modules), substrings, sun.length);
        ThreadLocal<Worker> workers = ThreadLocal.withInitial(() -> new Worker(scene, sun, rays, along * across));
        // flags that flag nothing classify as none do, and without flags the classes need any-hit queries only
        boolean[] ground = HemisphereSampler.anyFlagged(triangleIsGround) ? triangleIsGround : null;
        Parallel.forEach(modules.size(), m ->
                workers.get().module(s, m, ground, runSeed, along, across));
        return s;
    }

    private static final class Worker {
        final Scene scene;
        final Vec3[] sun;
        final HemisphereSampler sampler;
        final BundleTracer bundle;
        final HorizonBand band = new HorizonBand();
        final double[] dir, bundleDir;
        final int[] cls, index;
        final boolean[] blocked;
        final int[] seen;
        /** Per sun direction, whether the scene's far horizon blocks it; per bundle ray, the same. */
        final boolean[] sunFar, bundleFar;
        /** The sun directions, 3 per direction. */
        final double[] sunDir;
        /** Sun directions shared with the bundle tracer (-1: none yet) and the normal they are in front of. */
        int sharedCount = -1;
        double sharedNx, sharedNy, sharedNz;

        Worker(Scene scene, Vec3[] sun, int rays, int points) {
            this.scene = scene;
            this.sun = sun;
            sampler = new HemisphereSampler(scene, rays);
            bundle = scene.bundleTracer();
            int r = sampler.rayCount();
            dir = new double[3 * r];
            cls = new int[r];
            int n = sun.length;
            bundleDir = new double[3 * Math.max(1, n)];
            index = new int[Math.max(1, n)];
            blocked = new boolean[Math.max(1, n)];
            seen = new int[Math.max(1, n)];
            sunDir = new double[3 * n];
            for (int d = 0; d < n; d++) {
                sunDir[3 * d] = sun[d].x();
                sunDir[3 * d + 1] = sun[d].y();
                sunDir[3 * d + 2] = sun[d].z();
            }
            sunFar = scene.escapeBlocked(sunDir, n); // the far horizon's answers, the same from every point
            bundleFar = new boolean[Math.max(1, n)];
        }

        void module(ModuleSight s, int m, boolean[] isGround, long runSeed, int along, int across) {
            PvModule mod = s.modules.get(m);
            Vec3 nrm = mod.normal();
            double nx = nrm.x(), ny = nrm.y(), nz = nrm.z(), eps = scene.epsilon();
            if (sharedCount < 0 || nx != sharedNx || ny != sharedNy || nz != sharedNz) {
                // the sun directions in front of the module's plane, shared by every point of every
                // module of that plane (the modules of a zone follow each other)
                int count = SunDirections.inFront(sunDir, sunFar, sun.length, nx, ny, nz, bundleDir, bundleFar, index, 0);
                bundle.share(bundleDir, bundleFar, count);
                sharedCount = count;
                sharedNx = nx;
                sharedNy = ny;
                sharedNz = nz;
            }
            int points = along * across;
            for (int k = 0; k < s.substrings; k++) {
                int q = m * s.substrings + k;
                java.util.Arrays.fill(seen, 0, sharedCount, 0);
                for (int i = 0; i < along; i++) {
                    for (int j = 0; j < across; j++) {
                        Vec3 p = mod.at((i + 0.5) / along, (k + (j + 0.5) / across) / s.substrings);
                        bundle.occludedWithShared(p.x() + eps * nx, p.y() + eps * ny, p.z() + eps * nz, bundleDir, null, bundleFar, 0,
                                blocked, blocked); // no rays of its own: the shared ones' answers into blocked
                        for (int c = 0; c < sharedCount; c++) if (!blocked[c]) seen[c]++;
                    }
                }
                for (int c = 0; c < sharedCount; c++) s.sunVisible[q * s.directions + index[c]] = (float) seen[c] / points;
                Vec3 p = mod.at(0.5, (k + 0.5) / s.substrings);
                double ox = p.x() + eps * nx, oy = p.y() + eps * ny, oz = p.z() + eps * nz;
                long seed = HemisphereSampler.patchSeed("pv-" + mod.zone() + "-" + m + "-" + k, runSeed);
                sampler.classify(ox, oy, oz, nx, ny, nz, seed, isGround, dir, cls); // the view factors need classes only
                ViewFactors vf = SkyViewCalculator.fromClasses(cls, sampler.gridSide());
                s.skyVf[q] = vf.sky();
                s.groundVf[q] = vf.ground();
                s.obstructionVf[q] = vf.obstruction();
                s.horizonVis[q] = band.visibility(bundle, ox, oy, oz, nx, ny, nz);
            }
        }
    }
}
