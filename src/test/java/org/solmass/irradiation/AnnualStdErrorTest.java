package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.Isotropic;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The {@code annual_std_error_kwh_m2} column ({@link Reflection#stdErrorWh}) on the floor of a long
 * street canyon (H/W 2, 600 m; {@link CanyonRadiosityTest#canyon}) under an isotropic diffuse-only sky.
 */
class AnnualStdErrorTest {
    static final double H = 20;

    private static IrradiationResult run(PipelineFixture f, List<Patch> floor, List<Patch> context, double albedo, int rays,
                                         WeatherSeries w) {
        return f.run(floor, context, (float) albedo, w, Isotropic.INSTANCE, new IrradiationSetup.Options(
                CanyonRadiosityTest.PATCH, rays, albedo, true, IrradiationSetup.SunSampling.EXACT, 4096, 7L, false));
    }

    /**
     * A standard error of a mean of N samples falls as 1/sqrt(N) (the central limit theorem): four
     * times the rays halve it. The column estimates it from the sample variance, whose relative
     * spread per patch is about 1/sqrt(2N), 4.4 % at 256 rays (normal samples; common practice), so
     * the mean over the 120 floor patches scatters by under 0.5 %; the bias of sqrt(s^2) is about
     * 1/(4N). Tolerance 3 % on the ratio: over 6 times that scatter. Albedo 0: reflected light is
     * sampled by at most 256 of a patch's rays ({@link IrradiationSetup#REFLECTOR_RAYS}), so only the
     * sky part has four times the samples.
     */
    @Test
    void fourTimesTheRaysHalveTheStandardError() {
        PipelineFixture f = CanyonRadiosityTest.canyon(H, 600);
        List<Patch> floor = new ArrayList<>(), context = new ArrayList<>();
        for (Patch p : f.patches.patches()) {
            (p.kind() == SurfaceKind.GROUND && Math.abs(p.centroid().x()) < 25 ? floor : context).add(p);
        }
        WeatherSeries w = CanyonRadiosityTest.diffuseOnly();
        IrradiationResult few = run(f, floor, context, 0, 256, w), many = run(f, floor, context, 0, 1024, w);
        double a = 0, b = 0;
        for (int p = 0; p < floor.size(); p++) {
            a += few.annualStdError()[p];
            b += many.annualStdError()[p];
        }
        System.out.printf("standard error 256 rays / 1024 rays: %.4f (%d patches)%n", a / b, floor.size());
        assertEquals(2.0, a / b, 0.03 * 2);
    }

    /**
     * Against the exact sky view factor of a point on the floor of an infinite canyon (2D
     * point-to-segment view factor, {@link CanyonRadiosityTest.Canyon}; albedo 0, so the annual
     * irradiation is DHI x SVF): with normal errors 95.4 % lie within 2 standard errors and
     * practically none beyond 4; the column is an upper bound (stratified rays), so at least 95 % of
     * the patches must lie within 2 and none beyond 4 (our check).
     */
    @Test
    void trueErrorAgainstTheAnalyticSkyViewLiesWithinTheStandardError() {
        PipelineFixture f = CanyonRadiosityTest.canyon(H, 600);
        List<Patch> floor = new ArrayList<>();
        for (Patch p : f.patches.patches()) if (p.kind() == SurfaceKind.GROUND && Math.abs(p.centroid().x()) < 50) floor.add(p);
        WeatherSeries w = CanyonRadiosityTest.diffuseOnly();
        double dhiKwh = 0;
        for (Step s : w.steps()) dhiKwh += s.dhiWm2() * s.weightedHours() / 1000;
        IrradiationResult r = run(f, floor, List.of(), 0, 256, w);
        CanyonRadiosityTest.Canyon exact = new CanyonRadiosityTest.Canyon(H, CanyonRadiosityTest.W, 0, 1);
        int within2 = 0;
        double sumSq = 0;
        for (int p = 0; p < floor.size(); p++) {
            double truth = dhiKwh * exact.street(floor.get(p).centroid().y());
            double z = (r.annual()[p] - truth) / r.annualStdError()[p];
            sumSq += z * z;
            if (Math.abs(z) <= 2) within2++;
            assertTrue(Math.abs(z) <= 4, "patch " + p + ": error " + (r.annual()[p] - truth) + ", standard error " + r.annualStdError()[p]);
        }
        System.out.printf("analytic SVF: %d of %d patches within 2 standard errors, rms error / standard error %.2f%n",
                within2, floor.size(), Math.sqrt(sumSq / floor.size()));
        assertTrue(within2 >= 0.95 * floor.size(), within2 + " of " + floor.size());
    }
}
