package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.Step;
import org.solmass.scene.HorizonProfile;
import org.solmass.scene.Scene;
import org.solmass.sky.Isotropic;

import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The far horizon in the irradiation pipeline: a lone horizontal slab (its top an unobstructed roof)
 * under a constant horizon e loses exactly the beam of the steps whose sun (NREL SPA, through the
 * climate stage's sun positions) is at or below e, and its sky view factor is cos^2 e (the
 * analytic value of FarHorizonTest) within 4 standard errors; the far horizon reflects ground albedo x
 * GHI (docs/method.md section 5): isotropic sky, so reflected = rho (1 - cos^2 e) x annual GHI for this
 * roof, whose whole obstructed hemisphere is far horizon, within 4 standard errors of its 256
 * reflection rays (binomial, sqrt(p (1 - p) / 256) of rho x GHI; stratification only lowers it).
 */
class FarHorizonBeamTest {
    @Test
    void roofUnderAConstantHorizonLosesTheBeamOfTheStepsWithTheSunBelowIt() {
        double e = 15, rho = 0.2;
        PipelineFixture f = new PipelineFixture(new TestModels().slab("roof", 0, 0, 8, 8, 10).build(), Set.of(), 4.0);
        IrradiationSetup.Options o = new IrradiationSetup.Options(4.0, 4096, rho, false, IrradiationSetup.SunSampling.EXACT,
                4096, 7L, true);
        IrradiationResult open = f.run(UnobstructedPlaneTest.AVERAGE_DAYS, Isotropic.INSTANCE, o);
        Scene withHorizon = f.scene.withHorizon(HorizonProfile.constant(e));
        float[] albedo = new float[f.model.triangleCount()];
        Arrays.fill(albedo, 0.3f);
        IrradiationResult r = ShadedIrradiation.run(withHorizon, IrradiationSetup.build(withHorizon, f.model, f.patches.surfaces(),
                f.patches.patches(), List.of(), albedo, UnobstructedPlaneTest.AVERAGE_DAYS, Isotropic.INSTANCE, o), PhaseProgress.NONE);
        double lost = 0, ghi = 0;
        for (Step s : UnobstructedPlaneTest.AVERAGE_DAYS.steps()) {
            ghi += s.ghiWm2() * s.weightedHours() / 1000;
            double el = s.sun().elevationDeg();
            if (el > 0 && el <= e) lost += Math.max(0, s.dniWm2()) * s.weightedHours() * (float) s.sun().direction().z() / 1000;
        }
        int roof = -1;
        for (int p = 0; p < f.patches.patchCount(); p++) if (f.patches.patches().get(p).normal().z() > 0.9) { roof = p; break; }
        assertTrue(lost > 0, "the average days have sun below " + e + " deg");
        // float storage of sun vectors and slot sums: relative 1e-6 of the beam
        assertEquals(open.beam()[roof] - lost, r.beam()[roof], open.beam()[roof] * 1e-6, "beam lost below the horizon");
        double cos2 = Math.pow(Math.cos(Math.toRadians(e)), 2);
        assertEquals(cos2, r.skyViewFactor()[roof], 4 * r.skyViewStdError()[roof]);
        double p = 1 - cos2;
        assertEquals(rho * p * ghi, r.reflected()[roof], 4 * rho * ghi * Math.sqrt(p * (1 - p) / IrradiationSetup.REFLECTOR_RAYS),
                "the far horizon reflects ground albedo x GHI");
    }
}
