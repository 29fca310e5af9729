package org.solmass.irradiation;

import org.solmass.model.Parallel;
import org.solmass.climate.MonthHour;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.SkyViewCalculator;
import org.solmass.scene.Tracer;
import org.solmass.scene.ViewFactors;
import org.solmass.sky.DiffuseParts;
import org.solmass.sky.SkyModel;

import java.util.Arrays;
import java.util.concurrent.atomic.AtomicLong;

/**
 * The shading-aware irradiance of every receiver, step by step, summed into month-hour slots.
 *
 * <p>Per receiver and step (see docs/method.md for the full derivation):
 * <ul>
 * <li>beam: {@code DNI max(0, cos theta) V_sun}, {@code V_sun} the visibility of the sun direction
 * (one occlusion ray per direction of {@link SunDirections});</li>
 * <li>sky diffuse: {@code DHI [(1 - F1) SVF + F1 (a/b) V_sun + F2 sin(beta) V_hor]} with the
 * step's {@link org.solmass.sky.SkyModel} coefficients (Perez et al. 1990, Solar Energy 44(5), eq. 9,
 * each part obstructed on its own; isotropic, Liu and Jordan 1963: F1 = F2 = 0), a/b the capped
 * circumsolar ratio of {@link org.solmass.sky.SkyModel#circumsolarRatio}, SVF the obstructed
 * sky view factor, {@code V_hor} the visible share of the Perez horizon band (0 to 6.5 degrees
 * elevation), weighted by {@code cos theta};</li>
 * <li>reflected, Lambertian reflection over as many bounces as needed: {@code sum over hemisphere
 * rays (1/N) rho_hit E_hit}, the cosine-weighted Monte Carlo form of {@code sum_j F_pj rho_j E_j}
 * (Howell, Menguc and Siegel, Thermal Radiation Heat Transfer, 6th ed., 2016, ch. 7), where
 * {@code E_hit} is GHI for unshaded ground and otherwise the hit receiver's total irradiance, itself
 * first pass plus reflection ({@link Reflection}: the Neumann series, bounce by bounce).</li>
 * </ul>
 * Because every term is linear in the step weights, it is enough to keep per receiver the sums per
 * month-hour slot ({@link MonthHour}, 288 values), and reflection becomes a sparse weighted sum of other receivers' slot
 * sums, computed after all first passes are known; every receiver (context patches and ground probes
 * too) keeps its reflector list for the later bounces.
 *
 * <p>The sky diffuse of a slot is the sky package's three-part sum {@link DiffuseParts#sum} of the
 * slot's parts (kept at or above zero: the Perez horizon term may be negative); the clamp acts on
 * slot sums. With a radiance distribution ({@link org.solmass.sky.SkyDistribution}) it is instead the
 * dot product of the receiver's visible sky-patch shares ({@link SkyPatchView}, from the same
 * hemisphere rays) with the slot's radiance vector ({@link StepTable#skyWh}); no separate
 * circumsolar or horizon term.
 *
 * <p>Determinism: receivers are computed in parallel, each from its own ray seed into its own
 * array slots, so results do not depend on the thread count.
 */
public final class ShadedIrradiation {
    static final int SLOTS = StepTable.SLOTS;
    /**
     * Whether the first pass traces a receiver's hemisphere rays that need no first hit together with
     * its horizon band and sun directions as shared rays ({@link org.solmass.scene.BundleTracer#share},
     * true: the run's way); false traces the hemisphere, the band ({@link HorizonBand#visibility}) and
     * the sun ({@code Worker.sunVisibility}) as separate plain bundles, for the test that shows both
     * give the same results (OneBundleTest).
     */
    static volatile boolean ONE_BUNDLE = true;

    /** Perez horizon band: 0 to 6.5 degrees elevation (Perez et al. 1987, Solar Energy 39(3)). */
    static final double HORIZON_BAND_DEG = 6.5;
    static final int HORIZON_ELEVATIONS = 3, HORIZON_AZIMUTHS = 72;

    private ShadedIrradiation() {}

    /** Everything the pipeline needs besides the scene. */
    public record Inputs(Receivers receivers, ReflectorIndex reflectors, boolean[] triangleIsGround,
                         float[] triangleAlbedo, double groundAlbedo, boolean shadedGround,
                         StepTable steps, SunDirections sun, int raysPerPatch, int reflectorRays,
                         boolean keepMonthHour, double bounceTolerance, int maxBounces, CanopyShading canopy) {
        /**
         * Ground flags with no triangle flagged are dropped (null): they classify every ray as no flags
         * do, and without them the rays outside the reflection subset need any-hit queries only
         * ({@link HemisphereSampler#sampleForReflection}).
         */
        public Inputs {
            triangleIsGround = HemisphereSampler.anyFlagged(triangleIsGround) ? triangleIsGround : null;
        }

        /** Inputs without trees. */
        public Inputs(Receivers receivers, ReflectorIndex reflectors, boolean[] triangleIsGround,
                      float[] triangleAlbedo, double groundAlbedo, boolean shadedGround,
                      StepTable steps, SunDirections sun, int raysPerPatch, int reflectorRays,
                      boolean keepMonthHour, double bounceTolerance, int maxBounces) {
            this(receivers, reflectors, triangleIsGround, triangleAlbedo, groundAlbedo, shadedGround, steps, sun,
                    raysPerPatch, reflectorRays, keepMonthHour, bounceTolerance, maxBounces, null);
        }

        /** The same inputs with tree crowns that attenuate rays (null: none). */
        public Inputs withCanopy(CanopyShading c) {
            return new Inputs(receivers, reflectors, triangleIsGround, triangleAlbedo, groundAlbedo, shadedGround, steps, sun,
                    raysPerPatch, reflectorRays, keepMonthHour, bounceTolerance, maxBounces, c);
        }
    }

    public static IrradiationResult run(org.solmass.scene.Scene scene, Inputs in, PhaseProgress progress) {
        Receivers rc = in.receivers();
        int n = rc.analysed, total = rc.count;
        FirstPass firstPass = new FirstPass(total, in.steps());
        double[] svf = new double[n], gvf = new double[n], obs = new double[n], se = new double[n], hv = new double[n];
        double[] overcast = new double[n];
        double[][] beamM = new double[12][n], diffM = new double[12][n];
        double[] unshaded = new double[n], sunshine = new double[n];
        int[][] refIdx = new int[total][];
        float[][] refW = new float[total][], refW2 = new float[n][];
        float[] ghiAlbedo = new float[total], ghiAlbedo2 = new float[n];
        float[][] canopyReflection = in.canopy() == null ? null : new float[n][12]; // per month, docs/method.md "Vegetation"

        if (org.solmass.scene.KernelWarmup.pendingFor(total)) progress.begin("kernel warm-up", 0);
        org.solmass.scene.KernelWarmup.awaitFor(total); // compiled ray kernels before the first receiver
        progress.begin("visibility", total);
        AtomicLong done = new AtomicLong();
        long every = Math.max(1, total / 200);
        ThreadLocal<Worker> workers = ThreadLocal.withInitial(() -> new Worker(scene, in));
        Parallel.forEach(total, r -> {
            Worker w = workers.get();
            w.firstPass(r, r < n);
            firstPass.put(r, w.slotTotal);
            refIdx[r] = Arrays.copyOf(w.refIdx, w.refCount);
            refW[r] = Arrays.copyOf(w.refW, w.refCount);
            ghiAlbedo[r] = (float) w.ghiAlbedo;
            if (r < n) {
                svf[r] = w.vf.sky();
                gvf[r] = w.vf.ground();
                obs[r] = w.vf.obstruction();
                se[r] = w.vf.skyStdError();
                hv[r] = w.horizonVis;
                overcast[r] = w.overcastSkyPct;
                for (int m = 0; m < 12; m++) {
                    beamM[m][r] = w.beamMonth[m];
                    diffM[m][r] = w.diffMonth[m];
                }
                unshaded[r] = w.unshadedTotal;
                sunshine[r] = w.sunshineHours;
                refW2[r] = Arrays.copyOf(w.refW2, w.refCount);
                ghiAlbedo2[r] = (float) w.ghiAlbedo2;
                if (canopyReflection != null) w.canopyReflection(r, canopyReflection[r]);
            }
            long d = done.incrementAndGet();
            if (d % every == 0 || d == total) progress.advance(d);
        });

        StepTable st = in.steps();
        Reflection.Lists lists = Reflection.Lists.of(refIdx, refW, refW2, ghiAlbedo, ghiAlbedo2, in.raysPerPatch(), in.reflectorRays());
        Reflection.Outcome ro = Reflection.solve(firstPass, lists, n, st, in.bounceTolerance(), in.maxBounces(),
                in.keepMonthHour(), progress);

        progress.begin("irradiation", n);
        done.set(0);
        double background = 0, ghi = 0;
        for (int k = 0; k < SLOTS; k++) {
            background += st.backgroundWh[k];
            ghi += st.ghiWh[k];
        }
        double[] annual = new double[n], beam = new double[n], diffuse = new double[n], reflected = new double[n];
        double[] annualSe = new double[n];
        double[][] monthly = new double[12][n];
        float[] monthHour = ro.monthHourWh();
        double bgAnnual = background, ghiAnnual = ghi;
        long everyB = Math.max(1, n / 200);
        Parallel.forEach(n, p -> {
            int base = p * SLOTS;
            float[] crown = canopyReflection == null ? null : canopyReflection[p]; // reflected light through the crowns
            if (monthHour != null) {
                for (int k = 0; k < SLOTS; k++) {
                    double rk = crown == null ? monthHour[base + k] : monthHour[base + k] * crown[MonthHour.month(k) - 1];
                    double t = firstPass.slot(p, k) + rk; // first pass of p: its beam + sky diffuse
                    monthHour[base + k] = st.hours[k] > 0 ? (float) (t / st.hours[k]) : 0f;
                }
            }
            double[] bm = new double[12], dm = new double[12], rm = new double[12];
            for (int m = 0; m < 12; m++) {
                rm[m] = crown == null ? ro.reflMonthWh()[m][p] : ro.reflMonthWh()[m][p] * crown[m];
                bm[m] = beamM[m][p];
                dm[m] = diffM[m][p];
            }
            patchTotals(p, bm, dm, rm, monthly, beam, diffuse, reflected, annual);
            annualSe[p] = Reflection.stdErrorWh(p, lists, svf[p], bgAnnual, ghiAnnual, ro.totalAnnualWh()) / 1000;
            long d = done.incrementAndGet();
            if (d % everyB == 0 || d == n) progress.advance(d);
        });
        for (int p = 0; p < n; p++) unshaded[p] /= 1000;
        double[] bounceKwh = new double[ro.bounces()];
        for (int b = 0; b < bounceKwh.length; b++) bounceKwh[b] = ro.bounceWh()[b] / 1000;
        return new IrradiationResult(svf, gvf, obs, se, hv, annual, beam, diffuse, reflected, unshaded,
                monthly, monthHour, sunshine, st.siteSunshineHours, in.sun().count(), annualSe,
                new IrradiationResult.Bounces(bounceKwh, ro.converged(), in.bounceTolerance(), in.maxBounces()), overcast);
    }

    /**
     * Analysed patch p's monthly and annual sums in kWh/m2 from its beam, sky diffuse and reflected
     * irradiation per month (Wh/m2), in month order: the one place both the one-machine run and the
     * tiles' finish stage ({@link StagedPasses}) add them up.
     */
    static void patchTotals(int p, double[] beamWh, double[] diffuseWh, double[] reflectedWh, double[][] monthly,
                            double[] beam, double[] diffuse, double[] reflected, double[] annual) {
        double b = 0, dfs = 0, ref = 0;
        for (int m = 0; m < 12; m++) {
            monthly[m][p] = (beamWh[m] + diffuseWh[m] + reflectedWh[m]) / 1000;
            b += beamWh[m];
            dfs += diffuseWh[m];
            ref += reflectedWh[m];
        }
        beam[p] = b / 1000;
        diffuse[p] = dfs / 1000;
        reflected[p] = ref / 1000;
        double tot = 0;
        for (int m = 0; m < 12; m++) tot += monthly[m][p];
        annual[p] = tot;
    }

    /** Per-thread state: samplers, scratch arrays; no allocation per ray or per step. */
    static final class Worker {
        final org.solmass.scene.Scene scene;
        final Inputs in;
        final HemisphereSampler sampler, reflectorSampler;
        /** Block side of an analysed patch's reflection subset ({@link HemisphereSampler#reflectionBlock}). */
        final int reflectionBlock;
        /** The rays of the current receiver that sample reflected light, ascending, and their number. */
        final int[] subset;
        int subsetCount;
        final org.solmass.scene.BundleTracer bundle;
        /**
         * Directions and limits of the receiver's own rays traced as one bundle with the shared band and
         * sun rays ({@link #shareBandAndSun}): the hemisphere rays without a first hit; with tree crowns,
         * the sun directions (and their indices) as a bundle of their own.
         */
        final double[] bundleDir, bundleT;
        final int[] sunIndex;
        /** Per sun direction, whether the scene's far horizon blocks it (the same from every origin); per bundle ray, the same. */
        final boolean[] sunFar, bundleFar;
        /** The sun directions as doubles (the float table widened). */
        final double[] sunDir;
        final boolean[] blocked;
        final double[] dir;
        final int[] cls, tri;
        final double[] dist;
        final byte[] vis;
        final double[] beamSlot = new double[SLOTS], circSlot = new double[SLOTS];
        final double[] beamUSlot = new double[SLOTS], circUSlot = new double[SLOTS];
        final double[] slotTotal = new double[SLOTS];
        /** Sky diffuse per slot from a radiance distribution, shaded and unshaded (scratch). */
        final double[] skySlot = new double[SLOTS], skyUSlot = new double[SLOTS];
        final double[] beamMonth = new double[12], diffMonth = new double[12];
        final int[] refIdx;
        final float[] refW, refW2;
        /** The reflectors the hemisphere rays hit, gathered per receiver ({@link ReflectorGroups}). */
        final ReflectorGroups reflectors;
        /** The hits' lookups of the nearest receiver, answered together ({@link ReflectorIndex.Batch}). */
        final ReflectorIndex.Batch lookups;
        final HorizonBand horizon = new HorizonBand();
        /** Per-normal step terms of the opaque step loop ({@link StepTerms}). */
        final StepTerms stepTerms;
        /** A radiance distribution's per-patch view of the sky, or null for a three-part sky model. */
        final SkyPatchView skyView;
        /** Tree crowns of the study (docs/method.md "Vegetation"); null without trees, and then never touched. */
        final CanopyShading.Probe canopy;
        ViewFactors vf;
        double horizonVis, unshadedTotal, ghiAlbedo, ghiAlbedo2, sunshineHours;
        /** An analysed receiver's sky component under the CIE overcast sky, percent, from its hemisphere rays ({@link #overcastSky}). */
        double overcastSkyPct;
        int refCount;

        Worker(org.solmass.scene.Scene scene, Inputs in) {
            this.scene = scene;
            this.in = in;
            sampler = new HemisphereSampler(scene, in.raysPerPatch());
            reflectorSampler = new HemisphereSampler(scene, in.reflectorRays());
            bundle = scene.bundleTracer();
            // the rest of the hemisphere, or with crowns the sun directions (band and sun are shared rays otherwise)
            int bundleMax = Math.max(in.sun().count(), HemisphereSampler.roundedRayCount(in.raysPerPatch()));
            bundleDir = new double[3 * bundleMax];
            bundleT = new double[bundleMax];
            sunIndex = new int[bundleMax];
            blocked = new boolean[bundleMax];
            sunFar = scene.escapeBlocked(in.sun().directions, in.sun().count());
            sunDir = new double[3 * in.sun().count()];
            for (int i = 0; i < sunDir.length; i++) sunDir[i] = in.sun().directions[i]; // widened exactly, once
            bundleFar = new boolean[bundleMax];
            int sharedMax = in.sun().count() + HorizonBand.RAYS;
            sharedDir = new double[3 * sharedMax];
            sharedW = new double[sharedMax];
            sharedFar = new boolean[sharedMax];
            sharedBlocked = new boolean[sharedMax];
            sharedSun = new int[sharedMax];
            int maxRays = Math.max(sampler.rayCount(), reflectorSampler.rayCount());
            reflectionBlock = HemisphereSampler.reflectionBlock(sampler.gridSide(), in.reflectorRays());
            subset = new int[maxRays];
            dir = new double[3 * maxRays];
            cls = new int[maxRays];
            tri = new int[maxRays];
            dist = new double[maxRays];
            vis = new byte[in.sun().count()];
            canopy = in.canopy() == null ? null : in.canopy().probe(in.sun().count(), in.steps());
            refIdx = new int[maxRays];
            refW = new float[maxRays];
            refW2 = new float[maxRays];
            reflectors = new ReflectorGroups(in.receivers().count, maxRays);
            lookups = in.reflectors().batch(maxRays);
            stepTerms = new StepTerms(in.steps());
            skyView = in.steps().skyPatches != null ? new SkyPatchView(in.steps().skyPatches, bundle) : null;
        }

        /** First pass of receiver r: view factors, visibilities, beam + diffuse slot sums. */
        void firstPass(int r, boolean analysed) {
            Receivers rc = in.receivers();
            double ox = rc.origin[3 * r], oy = rc.origin[3 * r + 1], oz = rc.origin[3 * r + 2];
            double nx = rc.normal[3 * r], ny = rc.normal[3 * r + 1], nz = rc.normal[3 * r + 2];
            HemisphereSampler hs = analysed ? sampler : reflectorSampler;
            // a horizontal reflector-only receiver (ground probe) weights the horizon band by sin(tilt) = 0
            boolean band = analysed || rc.sinTilt(r) > 0;
            int block = analysed ? reflectionBlock : 1;
            if (ONE_BUNDLE && canopy == null && block > 1 && in.triangleIsGround() == null) {
                // the first hits of the reflection subset, then every other ray of the receiver (the rest of
                // the hemisphere, with the horizon band and the sun in front as the plane's shared rays)
                // through the tree in one stream
                int end = hs.queueForReflection(ox, oy, oz, nx, ny, nz, rc.seed[r], block, dir, cls, tri, dist, subset,
                        bundleDir, bundleT, bundleFar, 0);
                subsetCount = hs.reflectionSubsetSize();
                shareBandAndSun(band, nx, ny, nz);
                bundle.occludedWithShared(ox, oy, oz, bundleDir, bundleT, bundleFar, end, blocked, sharedBlocked);
                hs.classifyRest(blocked, dir, cls, tri, dist);
                readBandAndSun(band);
            } else {
                // every ray for the view factors; the first hits where reflection needs them (with crowns: all, for their legs)
                subsetCount = hs.sampleForReflection(ox, oy, oz, nx, ny, nz, rc.seed[r], in.triangleIsGround(), canopy != null,
                        block, dir, cls, tri, dist, subset);
                if (canopy == null && ONE_BUNDLE) bandAndSun(band, ox, oy, oz, nx, ny, nz); // the plane's shared rays
                else {
                    horizonVis = band ? horizon.visibility(bundle, ox, oy, oz, nx, ny, nz, canopy) : 0;
                    sunVisibility(ox, oy, oz, nx, ny, nz);
                }
            }
            vf = SkyViewCalculator.fromClasses(cls, hs.gridSide());
            if (analysed) overcastSkyPct = overcastSky(hs.rayCount());
            if (skyView != null) skyView.measure(ox, oy, oz, nx, ny, nz, dir, cls, hs.rayCount());
            if (canopy != null) canopy.sky(ox, oy, oz, dir, cls, hs.rayCount());
            if (canopy != null) canopy.hits(ox, oy, oz, dir, cls, dist, hs.rayCount()); // crowns on each reflection leg
            if (canopy != null && skyView != null) skyView.throughCrowns(canopy, ox, oy, oz, cls, hs.rayCount());
            collectReflectors(ox, oy, oz); // every receiver: reflectors reflect what they receive
            accumulate(nx, ny, nz, rc.cosTilt(r), rc.sinTilt(r), analysed);
        }

        /**
         * The sky component under the traditional CIE overcast sky ({@link org.solmass.sky.CieSky#skyComponentPct})
         * from the receiver's hemisphere rays that reach the sky (class SKY), in ray order: the rays
         * and answers of the sky view factor, so the vertical sky component of the metrics stage
         * traces nothing again.
         */
        private double overcastSky(int rays) {
            double sum = 0;
            for (int i = 0; i < rays; i++) if (cls[i] == HemisphereSampler.SKY) sum += org.solmass.sky.CieSky.overcastRelative(dir[3 * i + 2]);
            return org.solmass.sky.CieSky.skyComponentPct(sum, rays);
        }

        /** Per month, the last-leg correction of analysed receiver r's reflected light from the crowns' year mean to the month (just after its first pass). */
        void canopyReflection(int r, float[] out) {
            canopy.reflection(cls, tri, sampler.rayCount(), in.triangleAlbedo(), in.groundAlbedo(), out);
        }

        /** The reflector list of the current receiver from its reflection rays ({@link #subset}). */
        private void collectReflectors(double ox, double oy, double oz) {
            int rays = subsetCount;
            ReflectorIndex idx = in.reflectors();
            lookups.clear();
            float[] albedo = in.triangleAlbedo();
            boolean shaded = in.shadedGround();
            double ga = in.groundAlbedo();
            double ghi = 0, ghi2 = 0;
            for (int q = 0; q < rays; q++) {
                int s = subset[q], k = cls[s];
                if (k == HemisphereSampler.SKY) continue;
                int t = tri[s];
                // the crowns this ray crosses before its hit, in its weight: every reflection leg passes them (exactly 1 without)
                double tf = canopy == null ? 1.0 : canopy.hitFactor(s), gt = ga * tf;
                double hx = ox + dir[3 * s] * dist[s], hy = oy + dir[3 * s + 1] * dist[s], hz = oz + dir[3 * s + 2] * dist[s];
                if (t >= 0) {
                    float rho = canopy == null ? albedo[t] : (float) (albedo[t] * tf);
                    if (k == HemisphereSampler.GROUND && !shaded) {
                        ghi += rho;
                        ghi2 += rho * rho;
                        continue;
                    }
                    lookups.put(t, hx, hy, hz, rho); // its receiver below: a reflector list does not depend on the order of its hits
                } else if (t == Tracer.GROUND && shaded) {
                    int probe = idx.probeAt(hx, hy);
                    if (probe >= 0) reflectors.add(probe, (float) gt);
                    else {
                        ghi += gt;
                        ghi2 += gt * gt;
                    }
                } else {
                    ghi += gt; // ground plane (unshaded mode) or a downward ray leaving a model without one
                    ghi2 += gt * gt;
                }
            }
            lookups.resolve();
            for (int i = 0; i < lookups.size(); i++) if (lookups.receiver(i) >= 0) reflectors.add(lookups.receiver(i), lookups.albedo(i));
            double inv = 1.0 / rays;
            refCount = reflectors.finish(rays, refIdx, refW, refW2);
            ghiAlbedo = ghi * inv;
            ghiAlbedo2 = ghi2 * inv;
        }

        /**
         * The horizon band's rays (when {@code band}) and the sun directions in front of the patch, traced
         * as the plane's shared rays: the same answers as {@link HorizonBand#visibility} and
         * {@link #sunVisibility} (each ray's answer does not depend on the bundle it is traced in).
         */
        private void bandAndSun(boolean band, double ox, double oy, double oz, double nx, double ny, double nz) {
            shareBandAndSun(band, nx, ny, nz);
            bundle.occludedWithShared(ox, oy, oz, bundleDir, null, bundleFar, 0, blocked, sharedBlocked);
            readBandAndSun(band);
        }

        /**
         * Makes the band's rays (when {@code band}) and the sun directions in front of a plane of normal
         * n the bundle tracer's shared rays ({@link org.solmass.scene.BundleTracer#share}), unless they
         * are already (the previous receiver had the same normal and band: the patches of one plane
         * follow each other). Order: the band's rays, then the sun directions by index.
         */
        private void shareBandAndSun(boolean band, double nx, double ny, double nz) {
            if (sharedCount >= 0 && band == sharedBand && nx == sharedNx && ny == sharedNy && nz == sharedNz) return;
            sharedBandEnd = band ? horizon.queue(scene, nx, ny, nz, sharedDir, sharedFar, sharedW, 0) : 0;
            int m = SunDirections.inFront(sunDir, sunFar, vis.length, nx, ny, nz, sharedDir, sharedFar, sharedSun, sharedBandEnd);
            bundle.share(sharedDir, sharedFar, m);
            sharedCount = m;
            sharedBand = band;
            sharedNx = nx;
            sharedNy = ny;
            sharedNz = nz;
        }

        /** horizonVis and vis from the shared rays' answers ({@link #shareBandAndSun}). */
        private void readBandAndSun(boolean band) {
            horizonVis = band ? HorizonBand.share(sharedW, sharedBlocked, 0, sharedBandEnd) : 0;
            Arrays.fill(vis, (byte) 0);
            for (int k = sharedBandEnd; k < sharedCount; k++) if (!sharedBlocked[k]) vis[sharedSun[k]] = 1;
        }

        /** The shared rays of the current normal: directions, far answers, band weights, sun indices, answers. */
        private final double[] sharedDir, sharedW;
        private final boolean[] sharedFar, sharedBlocked;
        private final int[] sharedSun;
        /** Shared rays (-1: none yet), the band's end among them, and the normal and band they are for. */
        private int sharedCount = -1, sharedBandEnd;
        private boolean sharedBand;
        private double sharedNx, sharedNy, sharedNz;

        private void sunVisibility(double ox, double oy, double oz, double nx, double ny, double nz) {
            Arrays.fill(vis, (byte) 0); // the sun directions in front of the patch, together
            int m = SunDirections.inFront(sunDir, sunFar, vis.length, nx, ny, nz, bundleDir, bundleFar, sunIndex, 0);
            bundle.occludedKnownFar(ox, oy, oz, bundleDir, bundleFar, m, blocked);
            for (int k = 0; k < m; k++) if (!blocked[k]) vis[sunIndex[k]] = 1;
            if (canopy != null) canopy.sun(ox, oy, oz, bundleDir, sunIndex, m, blocked);
        }

        private void accumulate(double nx, double ny, double nz, double cosTilt, double sinTilt, boolean analysed) {
            StepTable st = in.steps();
            Arrays.fill(beamSlot, 0);
            Arrays.fill(circSlot, 0);
            Arrays.fill(beamUSlot, 0);
            Arrays.fill(circUSlot, 0);
            float fnx = (float) nx, fny = (float) ny, fnz = (float) nz;
            double sun = 0;
            if (canopy == null) { // the normal's step terms, shared with the receivers before it on the same face
                stepTerms.normal(fnx, fny, fnz, analysed);
                sun = stepTerms.shaded(vis, beamSlot, circSlot);
                if (analysed) {
                    System.arraycopy(stepTerms.beamU, 0, beamUSlot, 0, SLOTS);
                    System.arraycopy(stepTerms.circU, 0, circUSlot, 0, SLOTS);
                }
            } else for (int s = 0; s < st.count; s++) {
                double c = fnx * st.sx[s] + fny * st.sy[s] + fnz * st.sz[s];
                if (c <= 0) continue;
                int k = st.slot[s];
                double b = st.beamWh[s] * c, cs = st.circumsolarWh[s] * SkyModel.circumsolarRatio(c, st.cosZenith[s]);
                beamUSlot[k] += b;
                circUSlot[k] += cs;
                if (vis[st.direction[s]] != 0) {
                    if (canopy != null) { // through the crowns: t_m^k of this direction (1 exactly without a crossing)
                        double f = canopy.sunFactor(MonthHour.month(k) - 1, st.direction[s]);
                        b *= f;
                        cs *= f;
                        sun += st.sunshineHours[s] * f;
                    } else {
                        sun += st.sunshineHours[s];
                    }
                    beamSlot[k] += b;
                    circSlot[k] += cs;
                }
            }
            sunshineHours = sun;
            double svf = vf.sky(), hz = sinTilt * horizonVis;
            double svfU = (1 + cosTilt) / 2, gvfU = (1 - cosTilt) / 2;
            Arrays.fill(beamMonth, 0);
            Arrays.fill(diffMonth, 0);
            double unshadedSum = 0, ga = in.groundAlbedo();
            if (skyView != null) {
                if (canopy != null) skyView.slotSumsThroughCrowns(st.skyWh, skySlot); // docs/method.md "Vegetation"
                else skyView.slotSums(skyView.visible, st.skyWh, skySlot);
                if (analysed) skyView.unobstructedSlotSums(nx, ny, nz, st.skyWh, skyUSlot);
            }
            for (int k = 0; k < SLOTS; k++) {
                if (canopy != null) { // the month's sky and horizon band seen through the crowns
                    svf = canopy.skyMonth[MonthHour.month(k) - 1];
                    hz = sinTilt * canopy.horizonMonth[MonthHour.month(k) - 1];
                }
                double diff = skyView == null ? DiffuseParts.sum(st.backgroundWh[k], svf, circSlot[k], st.horizonWh[k], hz)
                        : Math.max(0, skySlot[k]);
                slotTotal[k] = beamSlot[k] + diff;
                if (analysed) {
                    beamMonth[MonthHour.month(k) - 1] += beamSlot[k];
                    diffMonth[MonthHour.month(k) - 1] += diff;
                    double diffU = skyView == null ? DiffuseParts.sum(st.backgroundWh[k], svfU, circUSlot[k], st.horizonWh[k], sinTilt)
                            : Math.max(0, skyUSlot[k]);
                    unshadedSum += beamUSlot[k] + diffU + ga * gvfU * st.ghiWh[k];
                }
            }
            unshadedTotal = unshadedSum;
        }
    }
}
