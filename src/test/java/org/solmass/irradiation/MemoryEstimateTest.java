package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.InputException;

import static org.junit.jupiter.api.Assertions.*;

/** The memory estimate follows the arrays it counts, and its refusal names a patch size that fits. */
class MemoryEstimateTest {
    @Test
    void firstPassSlotSumsDominateAndEveryReceiverCostsAtLeastThem() {
        // double[receivers x 288] of the first pass: 2304 bytes per receiver (8-byte doubles)
        MemoryEstimate m = MemoryEstimate.of(100_000, 80_000, 1024, 8760, false, 2);
        assertTrue(m.bytes() >= 100_000L * 288 * 8);
        assertTrue(m.countBytes() <= m.bytes());
    }

    @Test
    void estimateIsLinearInReceiversAndMonthHourAddsOneFloatPerSlotAndPatch() {
        MemoryEstimate a = MemoryEstimate.of(1000, 800, 256, 288, false, 4), b = MemoryEstimate.of(2000, 800, 256, 288, false, 4);
        MemoryEstimate c = MemoryEstimate.of(3000, 800, 256, 288, false, 4);
        assertEquals(b.bytes() - a.bytes(), c.bytes() - b.bytes());
        // the month-hour table and bounce 1's month sums, which spread the later bounces over it
        assertEquals(800L * (288 * 4 + 12 * 8), MemoryEstimate.of(1000, 800, 256, 288, true, 4).bytes() - a.bytes());
        // reflector lists: one int, one float and one float of squared albedo per reflection ray and
        // analysed patch (reflector-only receivers keep at most 256 rays either way); 900 rays (a 30 x 30
        // grid, no 2 x 2 blocks) keep every ray for reflection, 1024 rays a subset of 256
        assertEquals(800L * 12 * (900 - 256), MemoryEstimate.of(1000, 800, 900, 288, false, 0).bytes()
                - MemoryEstimate.of(1000, 800, 256, 288, false, 0).bytes());
        assertEquals(MemoryEstimate.of(1000, 800, 256, 288, false, 0).bytes(), MemoryEstimate.of(1000, 800, 1024, 288, false, 0).bytes());
    }

    @Test
    void suggestedPatchSizeFitsTheBudgetWhenCountsScaleWithTheArea() {
        long budget = 64L << 20;
        for (long receivers : new long[] {200_000, 1_000_000, 5_000_000}) {
            MemoryEstimate m = MemoryEstimate.of(receivers, receivers * 3 / 4, 1024, 8760, false, 2);
            assertFalse(m.fits(budget));
            double p = m.fittingPatchM(1.0, budget);
            double shrink = (1.0 / p) * (1.0 / p); // patches per area go as 1 / size^2
            MemoryEstimate atP = MemoryEstimate.of((long) (receivers * shrink), (long) (receivers * 3 / 4 * shrink), 1024, 8760, false, 2);
            assertTrue(atP.fits(budget), receivers + " receivers, suggested " + p + " m");
            assertTrue(p > 1.0);
        }
    }

    @Test
    void tooLargeStudyIsRefusedWithAnInputErrorNamingTheFlagAndAFittingSize() {
        MemoryEstimate m = MemoryEstimate.of(400_000, 300_000, 1024, 8760, false, 2);
        InputException e = assertThrows(InputException.class, () -> m.requireFits(100L << 20, 0.5, 1024, 300_000, "--patch"));
        double p = m.fittingPatchM(0.5, 100L << 20);
        assertTrue(e.getMessage().startsWith("--patch: the analysis needs about "), e.getMessage());
        assertTrue(e.getMessage().contains(String.format(java.util.Locale.ROOT, "use a patch size of at least %.2f m", p)), e.getMessage());
        assertDoesNotThrow(() -> m.requireFits(8L << 30, 0.5, 1024, 300_000, "--patch"));
    }

    @Test
    void estimateBeforePatchingCountsAreaOverPatchSizeSquared() {
        // 9 km2 of roof at 1 m patches: 9 million patches, each at least its double[288] slot sums and its object
        MemoryEstimate m = MemoryEstimate.beforePatching(9e6, 1.0, 0, 4.0, 16, 16, false, 2);
        assertTrue(m.bytes() >= 9_000_000L * (288 * 8 + MemoryEstimate.PATCH_OBJECT_BYTES));
        MemoryEstimate coarse = MemoryEstimate.beforePatching(9e6, 2.0, 0, 8.0, 16, 16, false, 2);
        assertEquals(m.countBytes() / 4.0, coarse.countBytes(), m.countBytes() * 1e-6); // 2x the size, 1/4 the patches
        assertFalse(m.fits(512L << 20));
        double p = m.fittingPatchM(1.0, 512L << 20);
        assertTrue(MemoryEstimate.beforePatching(9e6, p, 0, 4 * p, 16, 16, false, 2).fits(512L << 20), "suggested " + p + " m");
    }

    @Test
    void estimateBeforePatchingCountsTheStudysReflectionRays() {
        // 1e6 m2 at 1 m: a million analysed patches, each keeping one reflector entry per reflection ray
        long all = MemoryEstimate.beforePatching(1e6, 1.0, 0, 4.0, 1024, 1024, false, 2).countBytes();
        long subset = MemoryEstimate.beforePatching(1e6, 1.0, 0, 4.0, 1024, 256, false, 2).countBytes();
        assertEquals(1_000_000L * MemoryEstimate.PER_PATCH_PER_RAY * (1024 - 256), all - subset);
    }

    @Test
    void budgetBelowTheFixedPartHasNoFittingPatchSize() {
        MemoryEstimate m = MemoryEstimate.of(1000, 1000, 1 << 20, 8760, false, 64);
        assertTrue(Double.isNaN(m.fittingPatchM(1, 1L << 20)));
        InputException e = assertThrows(InputException.class, () -> m.requireFits(1L << 20, 1, 1 << 20, 1000, "patch_m"));
        assertTrue(e.getMessage().contains("no patch size fits; give Java more memory"), e.getMessage());
    }
}
