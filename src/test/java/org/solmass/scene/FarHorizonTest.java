package org.solmass.scene;

import org.junit.jupiter.api.Test;
import org.solmass.metrics.SunHoursOnDate;
import org.solmass.model.Vec3;
import org.solmass.sun.Site;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SunPosition;
import org.solmass.surface.Patch;

import java.time.MonthDay;
import java.time.ZoneOffset;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The far horizon in the ray engine: view factors and sun visibility against closed forms and SPA. */
class FarHorizonTest {
    private static final int RAYS = 256 * 256;

    /** Open flat ground with one small low box far off (so that the BVH is walked) and the ground plane at z = 0. */
    private static Scene openGround(HorizonProfile h) {
        return Scene.build(new SceneFixtures().box(400, 400, 0, 401, 401, 0.5).model(), true, 0).withHorizon(h);
    }

    /**
     * A horizontal patch under a horizon of constant elevation e sees the sky only above e. With the
     * cosine-weighted direction density cos(theta)/pi the share of directions with zenith angle below
     * theta0 is int_0^theta0 2 sin t cos t dt = sin^2(theta0) (analytic); the sky starts at
     * theta0 = 90 - e, so SVF = sin^2(90 - e) = cos^2 e. Tolerance: 4 standard errors of the
     * estimate, as the sampler reports it (collapsed strata, Cochran 1977, 5A.12).
     */
    @Test
    void horizontalPatchUnderAConstantHorizonSeesCosSquaredOfTheElevation() {
        for (double e : new double[]{5, 20, 45}) {
            Scene scene = openGround(HorizonProfile.constant(e));
            Patch p = SceneFixtures.patch("H", 0, 0, 0.5, 0, 0, 1);
            ViewFactors vf = SkyViewCalculator.compute(scene, List.of(p), RAYS, 11)[0];
            double expected = Math.pow(Math.cos(Math.toRadians(e)), 2);
            assertEquals(expected, vf.sky(), 4 * vf.skyStdError(), "SVF under a constant horizon of " + e + " deg");
            assertEquals(1 - expected, vf.obstruction(), 4 * vf.skyStdError(), "the far horizon is classed as obstruction");
            assertEquals(0, vf.ground(), 0.0, "a horizontal patch facing up sees no ground");
        }
    }

    /**
     * A vertical patch facing south, on open ground, under a constant horizon e. Its view factor to
     * the band of directions between elevation 0 and e in front of it (n . d = cos(el) cos(a), a the
     * azimuth from the normal) is (1/pi) int_{-pi/2}^{pi/2} cos a da int_0^e cos(el) cos(el) d(el)
     * = (1/pi) (e + sin e cos e) (analytic, derived here); so SVF = 1/2 - (e + sin e cos e)/pi,
     * ground view factor 1/2 (the plane below). Checked with both the any-hit classes
     * ({@link SkyViewCalculator}) and the closest-hit classes of {@link HemisphereSampler#sample}.
     */
    @Test
    void verticalPatchUnderAConstantHorizonMatchesTheClosedForm() {
        for (double eDeg : new double[]{10, 30}) {
            double e = Math.toRadians(eDeg);
            double band = (e + Math.sin(e) * Math.cos(e)) / Math.PI;
            Scene scene = openGround(HorizonProfile.constant(eDeg));
            Patch p = SceneFixtures.patch("V", 0, 0, 1.5, 0, -1, 0);
            ViewFactors vf = SkyViewCalculator.compute(scene, List.of(p), RAYS, 5)[0];
            assertEquals(0.5 - band, vf.sky(), 4 * vf.skyStdError(), "vertical SVF under " + eDeg + " deg");
            assertEquals(band, vf.obstruction(), 4 * vf.skyStdError());
            HemisphereSampler hs = new HemisphereSampler(scene, RAYS);
            int n = hs.rayCount();
            double[] dir = new double[3 * n], dist = new double[n];
            int[] cls = new int[n], tri = new int[n], cls2 = new int[n];
            hs.sample(p, 5, null, dir, cls, tri, dist);
            hs.classify(p, 5, null, dir, cls2);
            for (int s = 0; s < n; s++) {
                assertEquals(cls2[s], cls[s], "closest-hit and any-hit classes of ray " + s);
                if (cls[s] == HemisphereSampler.BLOCK) assertEquals(Tracer.HORIZON, tri[s], "only the far horizon blocks here");
            }
        }
    }

    /**
     * Beam is lost exactly while the sun is at or below the horizon: hour by hour on four dates at
     * latitude 47 N, the sun ray of a roof patch is occluded (single ray and bundle alike) if and only
     * if the SPA elevation (NREL SPA, Reda and Andreas 2004, through {@link SolarCalculator}) is at or
     * below the profile's elevation at the sun's azimuth: a constant horizon and one rising to the
     * south (a ridge), linear in azimuth between samples.
     */
    @Test
    void sunIsHiddenExactlyWhileItsSpaElevationIsAtOrBelowTheHorizon() {
        SolarCalculator calc = new SolarCalculator(new Site(47.0, 9.0, 0, ZoneOffset.ofHours(1)));
        double[] ridge = new double[36];
        for (int i = 0; i < 36; i++) ridge[i] = 4 + 14 * Math.max(0, Math.cos(Math.toRadians(i * 10 - 180)));
        for (HorizonProfile h : List.of(HorizonProfile.constant(12), new HorizonProfile(ridge))) {
            Scene scene = openGround(h);
            Tracer tr = scene.tracer();
            BundleTracer bt = scene.bundleTracer();
            int checked = 0, hidden = 0;
            for (String date : List.of("12-21", "03-21", "06-21", "10-01")) {
                for (SunPosition sp : SunHoursOnDate.positions(calc, 2025, MonthDay.parse("--" + date), 60)) {
                    if (sp.elevationDeg() <= 0) continue;
                    Vec3 d = sp.direction();
                    boolean expected = sp.elevationDeg() <= h.elevationDegAt(sp.azimuthDeg());
                    assertEquals(expected, tr.occluded(0, 0, 0.5, d.x(), d.y(), d.z(), Double.POSITIVE_INFINITY),
                            h + " " + date + " sun at az " + sp.azimuthDeg() + " el " + sp.elevationDeg());
                    boolean[] out = new boolean[1];
                    bt.occluded(0, 0, 0.5, new double[]{d.x(), d.y(), d.z()}, null, 1, out);
                    assertEquals(expected, out[0], "bundle, " + date);
                    checked++;
                    if (expected) hidden++;
                }
            }
            assertTrue(hidden > 0 && hidden < checked, "the dates have hours on both sides of the horizon");
        }
    }

    /**
     * Sun hours on 21 December with a constant horizon e: the count of 5-minute sun positions with SPA
     * elevation above both the metric's minimum and e (counted here from SPA directly), times 5 min.
     */
    @Test
    void winterSunHoursCountOnlyTheSunAboveTheHorizon() {
        SolarCalculator calc = new SolarCalculator(new Site(47.0, 9.0, 0, ZoneOffset.ofHours(1)));
        MonthDay d = MonthDay.of(12, 21);
        double e = 15;
        Scene scene = openGround(HorizonProfile.constant(e));
        int n = 0;
        for (SunPosition sp : SunHoursOnDate.positions(calc, 2025, d, 5)) if (sp.elevationDeg() > Math.max(5, e)) n++;
        double[] dirs = SunHoursOnDate.sunDirections(calc, 2025, d, 5, 5.0);
        Patch p = SceneFixtures.patch("R", 0, 0, 0.5, 0, 0, 1);
        double got = SunHoursOnDate.hours(scene, List.of(p), dirs, 5 / 60.0)[0];
        assertEquals(n * 5 / 60.0, got, 1e-12);
        double open = SunHoursOnDate.hours(openGround(HorizonProfile.NONE), List.of(p), dirs, 5 / 60.0)[0];
        assertTrue(got < open, "the horizon takes winter sun hours: " + got + " h against " + open + " h");
    }

    /** A ray stopped before it leaves the scene (finite limit) is never blocked by the far horizon. */
    @Test
    void raysWithADistanceLimitIgnoreTheFarHorizon() {
        Scene scene = openGround(HorizonProfile.constant(30));
        double c = Math.cos(Math.toRadians(10)), s = Math.sin(Math.toRadians(10));
        Tracer tr = scene.tracer();
        assertTrue(tr.occluded(0, 0, 0.5, c, 0, s, Double.POSITIVE_INFINITY));
        assertTrue(!tr.occluded(0, 0, 0.5, c, 0, s, 100));
        assertEquals(Tracer.MISS, tr.closestHit(0, 0, 0.5, c, 0, s, 100));
        assertEquals(Tracer.HORIZON, tr.closestHit(0, 0, 0.5, c, 0, s, Double.POSITIVE_INFINITY));
        assertEquals(Tracer.HORIZON, tr.closestHitBruteForce(0, 0, 0.5, c, 0, s, Double.POSITIVE_INFINITY));
    }
    /**
     * A fixed set of directions traced from many origins with the far horizon's answers computed once
     * ({@link Scene#escapeBlocked(double[], int)}, {@link BundleTracer#occludedKnownFar}) gets exactly
     * the answers of {@link Tracer#occluded} ray by ray (single-ray reference, which the far-horizon
     * checks above tie to closed forms), for the SIMD kernel and the scalar stream: a ray is blocked
     * by the far horizon, the ground plane or a triangle, each on its own. Random scenes with the
     * plane, a profile of 36 azimuths between 0 and 40 degrees, directions over the whole sphere.
     */
    @Test
    void precomputedFarHorizonAnswersGiveTheSingleRayAnswers() {
        java.util.SplittableRandom r = new java.util.SplittableRandom(77);
        double[] elev = new double[36];
        for (int i = 0; i < elev.length; i++) elev[i] = r.nextDouble(0, 40);
        HorizonProfile h = new HorizonProfile(elev);
        int n = 700, farOnly = 0, tree = 0;
        double[] dir = new double[3 * n];
        for (int s = 0; s < n; s++) {
            double dx = r.nextGaussian(), dy = r.nextGaussian(), dz = r.nextGaussian();
            double l = Math.sqrt(dx * dx + dy * dy + dz * dz);
            dir[3 * s] = dx / l; dir[3 * s + 1] = dy / l; dir[3 * s + 2] = dz / l;
        }
        for (int sc = 0; sc < 3; sc++) {
            Scene scene = Scene.build(TracerTest.randomSoup(900 + sc, 300), true, 0.0).withHorizon(h);
            Scene open = Scene.build(TracerTest.randomSoup(900 + sc, 300), true, 0.0);
            boolean[] far = scene.escapeBlocked(dir, n);
            Tracer single = scene.tracer(), near = open.tracer();
            BundleTracer scalar = new BundleTracer(scene, false);
            BundleTracer simd = BundleTracer.SIMD_AVAILABLE ? new BundleTracer(scene, true) : null;
            for (int o = 0; o < 40; o++) {
                double ox = r.nextDouble(-20, 120), oy = r.nextDouble(-20, 120), oz = r.nextDouble(0.5, 120);
                boolean[] a = new boolean[n], b = new boolean[n];
                scalar.occludedKnownFar(ox, oy, oz, dir, far, n, a);
                if (simd != null) simd.occludedKnownFar(ox, oy, oz, dir, far, n, b);
                for (int s = 0; s < n; s++) {
                    boolean want = single.occluded(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], Double.POSITIVE_INFINITY);
                    assertEquals(want, a[s], "scalar stream, scene " + sc + " origin " + o + " ray " + s);
                    if (simd != null) assertEquals(want, b[s], "SIMD packets, scene " + sc + " origin " + o + " ray " + s);
                    boolean byTree = near.occluded(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], Double.POSITIVE_INFINITY);
                    if (want && !byTree) farOnly++;
                    if (byTree && dir[3 * s + 2] > 0 && !far[s]) tree++;
                }
            }
        }
        // preconditions, not results: rays only the far horizon blocks, and rising rays only the tree blocks
        assertTrue(farOnly > 1000, "rays blocked by the far horizon alone: " + farOnly);
        assertTrue(tree > 1000, "rising rays under the open profile blocked by a triangle: " + tree);
    }
}
