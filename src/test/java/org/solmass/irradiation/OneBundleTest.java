package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.scene.BundleTracer;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.HorizonProfile;
import org.solmass.scene.Scene;
import org.solmass.scene.SkyViewCalculator;
import org.solmass.scene.ViewFactors;
import org.solmass.sky.Perez;
import org.solmass.surface.Patch;

import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Property (common practice for a packet tracer: a ray's answer does not depend on the rays traced
 * with it): the first pass that traces a receiver's hemisphere rays without a first hit, its horizon
 * band and its sun directions as one bundle gives the results of tracing them as separate bundles,
 * bit for bit, with a far horizon (rays it blocks are not traced) and the ground plane (it limits the
 * hemisphere's downward rays). Two blocks and a slab, 1,024 rays per patch of which 256 are
 * reflection rays (so the hemisphere part is queued), Perez sky, average days. Both ways share the
 * queueing helpers, so the view factors and the horizon band are also checked against paths of
 * their own: the any-hit classes of {@link SkyViewCalculator} (the far horizon asked ray by ray) and
 * {@link HorizonBand#visibility}, equal bit for bit.
 */
class OneBundleTest {
    @Test
    void oneBundlePerReceiverGivesTheResultsOfSeparateBundles() {
        PipelineFixture f = new PipelineFixture(new TestModels()
                .box("a", 0, 0, 10, 8, 12).box("b", 16, -2, 24, 9, 20).slab("terrace", -8, 12, 6, 20, 3).build(),
                Set.of(), 2.0);
        IrradiationSetup.Options o = new IrradiationSetup.Options(2.0, 1024, 0.2, false, IrradiationSetup.SunSampling.EXACT,
                1024, 11L, true);
        // precondition: 1,024 rays with 256 reflection rays take blocks of 2 x 2 (the queued path)
        assertEquals(2, HemisphereSampler.reflectionBlock(HemisphereSampler.gridSide(1024),
                IrradiationSetup.reflectorRays(1024)));
        double[] elev = new double[24];
        for (int i = 0; i < elev.length; i++) elev[i] = 4 + 10 * Math.abs(Math.sin(i * 0.7));
        Scene scene = f.scene.withHorizon(new HorizonProfile(elev));
        float[] albedo = new float[f.model.triangleCount()];
        Arrays.fill(albedo, 0.3f);
        IrradiationResult one = run(f, scene, albedo, o, true), separate = run(f, scene, albedo, o, false);
        assertTrue(one.size() > 100, "patches compared: " + one.size());
        assertArrayEquals(separate.skyViewFactor(), one.skyViewFactor(), "sky view factor");
        assertArrayEquals(separate.groundViewFactor(), one.groundViewFactor(), "ground view factor");
        assertArrayEquals(separate.obstructionViewFactor(), one.obstructionViewFactor(), "obstruction view factor");
        assertArrayEquals(separate.horizonVisibility(), one.horizonVisibility(), "horizon band");
        assertArrayEquals(separate.beam(), one.beam(), "beam");
        assertArrayEquals(separate.diffuse(), one.diffuse(), "diffuse");
        assertArrayEquals(separate.reflected(), one.reflected(), "reflected");
        assertArrayEquals(separate.annual(), one.annual(), "annual");
        assertArrayEquals(separate.sunshineHours(), one.sunshineHours(), "sunshine hours");
        assertArrayEquals(separate.monthHourWm2(), one.monthHourWm2(), "month-hour table");
        // precondition: the far horizon and the blocks shade some of it (a check that can fail)
        double minSvf = Arrays.stream(one.skyViewFactor()).min().orElse(1);
        assertTrue(minSvf < 0.4, "obstructed patches: least sky view factor " + minSvf);

        // the parts both ways share, against paths of their own: view factors from the any-hit classes
        // of SkyViewCalculator (the far horizon asked ray by ray), the band from HorizonBand.visibility
        List<Patch> patches = f.patches.patches();
        ViewFactors[] vf = SkyViewCalculator.compute(scene, patches, 1024, o.runSeed());
        HorizonBand band = new HorizonBand();
        BundleTracer bt = scene.bundleTracer();
        int partlyBlockedBand = 0;
        for (int p = 0; p < patches.size(); p++) {
            Patch q = patches.get(p);
            assertEquals(vf[p].sky(), one.skyViewFactor()[p], 0.0, "sky view factor of patch " + q.id());
            assertEquals(vf[p].ground(), one.groundViewFactor()[p], 0.0, "ground view factor of patch " + q.id());
            double[] or = scene.rayOrigin(q);
            double h = band.visibility(bt, or[0], or[1], or[2], q.normal().x(), q.normal().y(), q.normal().z());
            assertEquals(h, one.horizonVisibility()[p], 0.0, "horizon band of patch " + q.id());
            if (h > 0 && h < 1) partlyBlockedBand++;
        }
        assertTrue(partlyBlockedBand > 50, "patches with a partly blocked band: " + partlyBlockedBand);
    }

    private static IrradiationResult run(PipelineFixture f, Scene scene, float[] albedo, IrradiationSetup.Options o, boolean oneBundle) {
        boolean before = ShadedIrradiation.ONE_BUNDLE;
        ShadedIrradiation.ONE_BUNDLE = oneBundle;
        try {
            return ShadedIrradiation.run(scene, IrradiationSetup.build(scene, f.model, f.patches.surfaces(), f.patches.patches(),
                    List.of(), albedo, UnobstructedPlaneTest.AVERAGE_DAYS, Perez.INSTANCE, o), PhaseProgress.NONE);
        } finally {
            ShadedIrradiation.ONE_BUNDLE = before;
        }
    }
}
