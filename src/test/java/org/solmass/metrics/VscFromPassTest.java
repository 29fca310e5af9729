package org.solmass.metrics;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.sun.Site;
import org.solmass.climate.WeatherSeries;
import org.solmass.fixtures.Boxes;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.irradiation.IrradiationSetup;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.irradiation.ShadedIrradiation;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.HorizonProfile;
import org.solmass.scene.Scene;
import org.solmass.sky.Perez;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceKind;
import org.solmass.table.ResultTable;

import java.nio.file.Path;
import java.time.MonthDay;
import java.time.ZoneId;
import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The vertical sky component a run takes from its irradiation pass (the sum the pass keeps from its
 * sky-view rays, {@link IrradiationResult#overcastSkyPct}) is the value the metric's own rays give
 * ({@link VerticalSkyComponentMetric#traced}: the same seeds, origins and sky answers), to the last
 * bit, for every facade patch: the metric's accuracy tests ({@link VerticalSkyComponentMetricTest},
 * against quadrature and a closed form) so hold for what a run reports. Both ray paths of the pass
 * are covered: the shared-ray bundle of the default reflection rays (reflection block above 1, no
 * ground-flagged triangles), and every ray to its first hit (block 1, or a modelled ground face);
 * with a ground plane (blocks on an open site), without one, and behind a far horizon.
 */
class VscFromPassTest {
    @TempDir Path dir;

    static final long SEED = 0x5A15_3A55L;

    @Test
    void passAndTracedRaysGiveTheSameVscWithAGroundPlane() {
        // an analysed block facing a long context wall 12 m away: facades see sky, wall and ground
        String obj = Boxes.onGround(0, 0, 20, 10, 30).obj("a") + Boxes.onGround(-60, 22, 80, 40, 24).obj("wall");
        check(obj, 1024, 256, false, 0);
        check(obj, 256, 256, false, 0);
    }

    @Test
    void passAndTracedRaysGiveTheSameVscBehindAFarHorizon() {
        // 12 degrees of distant skyline all round: low sky rays that pass the wall end on it
        String obj = Boxes.onGround(0, 0, 20, 10, 30).obj("a") + Boxes.onGround(-60, 22, 80, 40, 24).obj("wall");
        check(obj, 1024, 256, false, 12);
    }

    @Test
    void passAndTracedRaysGiveTheSameVscOverAModelledGround() {
        // relative (negative) vertex numbers: the ground's own four vertices, whatever came before
        String ground = "o ground\nv -100 -100 0\nv 120 -100 0\nv 120 140 0\nv -100 140 0\nf -4 -3 -2\nf -4 -2 -1\n";
        String obj = Boxes.onGround(0, 0, 20, 10, 30).obj("a") + Boxes.onGround(-60, 22, 80, 40, 24).obj("wall");
        check(obj + ground, 1024, 256, true, 0);
    }

    private void check(String obj, int rays, int reflectionRays, boolean groundFaces, double horizonDeg) {
        Path f = Boxes.write(dir, "m" + System.nanoTime() + ".obj", obj);
        MassingModel m = ObjReader.load(f, ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(2.0, Set.of("a"), false));
        assertEquals(groundFaces, ps.hasGroundFaces());
        Scene scene = Scene.build(m, !ps.hasGroundFaces(), ps.groundLevelZ());
        if (horizonDeg > 0) scene = scene.withHorizon(HorizonProfile.constant(horizonDeg));
        // which of the pass's two ray paths this case takes: the shared-ray bundle needs a reflection
        // block above 1 and no ground-flagged triangles (ShadedIrradiation.Worker.firstPass)
        int block = HemisphereSampler.reflectionBlock(HemisphereSampler.gridSide(rays), reflectionRays);
        boolean bundlePath = block > 1 && !groundFaces;
        assertEquals(rays == 1024 && !groundFaces, bundlePath, "the case takes the path it is meant for");
        WeatherSeries weather = ClimateSource.load(new Site(51, 10, 0, ZoneId.of("Europe/Berlin")), ClimateSpec.clearSky());
        float[] albedo = new float[m.triangleCount()];
        Arrays.fill(albedo, 0.3f);
        IrradiationSetup.Options o = new IrradiationSetup.Options(2.0, rays, 0.2, false, IrradiationSetup.SunSampling.EXACT,
                4096, SEED, false, 0.01, 10, reflectionRays);
        List<Patch> analysed = ps.patches();
        IrradiationResult r = ShadedIrradiation.run(scene, IrradiationSetup.build(scene, m, ps.surfaces(), analysed, List.of(),
                albedo, weather, Perez.INSTANCE, o), PhaseProgress.NONE);

        MetricContext ctx = new MetricContext(scene, Surface.groundTriangles(ps.surfaces(), scene.triangleCount()), ps, null,
                null, null, null, 2026, 0.2, 2.0, rays, SEED, new MetricContext.Settings(List.of(MonthDay.of(3, 21)), 5, 5, null));
        double[] traced = new double[analysed.size()];
        Arrays.fill(traced, Double.NaN);
        VerticalSkyComponentMetric.traced(ctx, analysed, traced);

        ResultTable t = new ResultTable(analysed);
        MetricContext withPass = new MetricContext(ctx.scene(), ctx.sceneIsGround(), ps, r, null, null, null, 2026, 0.2, 2.0,
                rays, SEED, ctx.settings());
        new VerticalSkyComponentMetric().compute(withPass, t);
        double[] reported = t.column(VerticalSkyComponentMetric.VSC.name());
        int facades = 0;
        double lo = 100, hi = 0;
        for (Patch p : analysed) {
            int i = p.index();
            if (p.kind() != SurfaceKind.FACADE) {
                assertTrue(Double.isNaN(reported[i]), "only facades get a VSC");
                continue;
            }
            facades++;
            assertEquals(traced[i], reported[i], 0.0, "patch " + p.id() + ": the pass's rays and the metric's own");
            assertEquals(traced[i], r.overcastSkyPct()[i], 0.0);
            lo = Math.min(lo, reported[i]);
            hi = Math.max(hi, reported[i]);
        }
        assertTrue(facades >= 40, facades + " facade patches");
        // the facade facing the wall sees less sky than an open wall's 39.6 % (common practice), the others
        // about that, or less behind a far horizon (which takes the low sky from every facade)
        assertTrue(lo < 30 && (horizonDeg > 0 ? hi > 25 && hi < 36 : hi > 36), "range " + lo + " .. " + hi);
    }
}
