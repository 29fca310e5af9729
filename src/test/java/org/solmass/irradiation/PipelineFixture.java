package org.solmass.irradiation;

import org.solmass.climate.WeatherSeries;
import org.solmass.model.MassingModel;
import org.solmass.scene.Scene;
import org.solmass.sky.SkyModel;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;

import java.util.Arrays;
import java.util.List;
import java.util.Set;

/** Runs the pipeline on a test model the way the analyse command does, with every option explicit. */
final class PipelineFixture {
    final MassingModel model;
    final PatchSet patches;
    final Scene scene;

    PipelineFixture(MassingModel model, Set<String> analysed, double patchM) {
        this.model = model;
        this.patches = Patcher.build(model, new PatchOptions(patchM, analysed, false));
        this.scene = Scene.build(model, !patches.hasGroundFaces(), patches.groundLevelZ());
    }

    IrradiationResult run(WeatherSeries weather, SkyModel sky, IrradiationSetup.Options o) {
        return run(patches.patches(), weather, sky, o);
    }

    /** Runs on a subset of the analysed patches (re-indexed 0..n-1 in the given order). */
    IrradiationResult run(List<Patch> subset, WeatherSeries weather, SkyModel sky, IrradiationSetup.Options o) {
        return run(subset, List.of(), 0.3f, weather, sky, o);
    }

    /**
     * Runs on the given analysed patches (re-indexed 0..n-1) with other patches as reflector-only
     * context receivers, every triangle of the given albedo.
     */
    IrradiationResult run(List<Patch> subset, List<Patch> context, float albedo, WeatherSeries weather, SkyModel sky,
                          IrradiationSetup.Options o) {
        float[] a = new float[model.triangleCount()];
        Arrays.fill(a, albedo);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(scene, model, patches.surfaces(), subset, context,
                a, weather, sky, o);
        return ShadedIrradiation.run(scene, in, PhaseProgress.NONE);
    }

    static IrradiationSetup.Options options(int rays, IrradiationSetup.SunSampling sun) {
        return new IrradiationSetup.Options(1.0, rays, 0.2, false, sun, 4096, 7L, true);
    }
}
