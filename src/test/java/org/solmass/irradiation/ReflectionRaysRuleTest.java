package org.solmass.irradiation;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The study key {@code reflection.rays} reaches the run: the rule that turns it into the reflector-only
 * receivers' rays and an analysed patch's reflection subset (docs/study-file.md). Whole-grid arithmetic
 * of the stratified subset (one ray per block of strata, HemisphereSampler.reflectionBlock).
 */
class ReflectionRaysRuleTest {
    @Test
    void requestedReflectionRaysFollowTheGridAndNeverExceedThePatchRays() {
        assertEquals(256, IrradiationSetup.reflectorRays(1024, 256));
        assertEquals(256, IrradiationSetup.reflectionRays(1024, 256)); // 16 x 16 blocks of 2 x 2 strata
        assertEquals(1024, IrradiationSetup.reflectorRays(1024, 1024));
        assertEquals(1024, IrradiationSetup.reflectionRays(1024, 1024)); // every ray again
        assertEquals(1024, IrradiationSetup.reflectionRays(1024, 5000)); // capped at the patch's rays
        assertEquals(256, IrradiationSetup.reflectorRays(256, 1024));
        assertEquals(64, IrradiationSetup.reflectionRays(1024, 64)); // 8 x 8 blocks of 4 x 4 strata
        assertEquals(IrradiationSetup.reflectionRays(1024), IrradiationSetup.reflectionRays(1024, IrradiationSetup.REFLECTOR_RAYS));
    }

    @Test
    void optionsCarryTheRequestIntoTheInputs() {
        IrradiationSetup.Options o = new IrradiationSetup.Options(1.0, 1024, 0.2, false, IrradiationSetup.SunSampling.EXACT,
                4096, 7L, false);
        assertEquals(IrradiationSetup.REFLECTOR_RAYS, o.reflectionRays());
        assertEquals(1024, o.withReflectionRays(1024).reflectionRays());
        assertEquals(1024, o.withReflectionRays(1024).withBounces(0.01, 3).reflectionRays()); // kept through withBounces
    }
}
