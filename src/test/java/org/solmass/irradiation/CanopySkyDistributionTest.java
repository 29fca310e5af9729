package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.Step;
import org.solmass.scene.Canopy;
import org.solmass.scene.HemisphereSampler;
import org.solmass.sky.CieSky;
import org.solmass.study.Vegetation;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Tree crowns under a sky radiance distribution (docs/method.md, "Vegetation"): a horizontal roof
 * patch under the CIE traditional overcast sky ({@code cie-overcast}) with a flat crown (a 256-gon
 * sheet, crossed once) centred above it that covers every direction within {@code theta0} of the
 * zenith (its area is within 1e-4 of the circle's). By the attenuation model each month's sky diffuse is
 * {@code DHI_m (1 - s (1 - t_m))}, {@code s} the share of the horizontal diffuse that comes from the
 * covered cap. For the CIE overcast sky, L = Lz (1 + 2 cos theta) / 3 (Moon and Spencer 1942),
 * {@code E(cap) / Lz = (2 pi / 3) [sin^2 theta0 / 2 + 2 (1 - cos^3 theta0) / 3]} and the whole sky
 * gives {@code 7 pi / 9}, so {@code s = (3/7) [sin^2 theta0 + (4/3) (1 - cos^3 theta0)]} (our
 * derivation, written here; theta0 = 90 deg gives 1). The isotropic sky would give {@code sin^2 theta0}.
 */
class CanopySkyDistributionTest {

    /** Share of a horizontal plane's diffuse from the cap within theta0 of the zenith, CIE overcast sky. */
    static double overcastCapShare(double theta0Rad) {
        double s = Math.sin(theta0Rad), c = Math.cos(theta0Rad);
        return 3.0 / 7 * (s * s + 4.0 / 3 * (1 - c * c * c));
    }

    @Test
    void capShareIsOneForTheWholeSkyAndAboveTheIsotropicShareForACap() {
        assertEquals(1, overcastCapShare(Math.PI / 2), 1e-15);
        assertTrue(overcastCapShare(Math.PI / 4) > 0.58 && overcastCapShare(Math.PI / 4) < 0.59, "" + overcastCapShare(Math.PI / 4));
    }

    /**
     * The roof patch's annual sky diffuse with the crown against {@code sum_m DHI_m (1 - s (1 - t_m))},
     * deciduous monthly transmittances (Vegetation defaults) at 30, 45 and 60 deg. Tolerance (named):
     * 4 binomial standard errors of the covered share from N rays, {@code 4 sqrt(s (1 - s) / N)}
     * times the largest {@code 1 - t_m} and the annual DHI (an upper bound for the stratified
     * sampler), plus the 1 % criterion the 145-patch sky grid is held to ({@code SkyPatchesTest}).
     * At 45 deg the isotropic share would miss by more than the tolerance, so the test sees whether
     * the crowns act on the radiance-weighted patch shares.
     */
    @Test
    void crownOverTheZenithCapAttenuatesTheOvercastDiffuseByTheCapsRadianceShare() {
        TestModels m = new TestModels().box("a", 0, 0, 1, 1, 1);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of("a"), 1.0);
        Patch roof = f.patches.patches().stream().filter(p -> p.kind() == SurfaceKind.ROOF).findFirst().orElseThrow();
        assertEquals(1, f.patches.patches().stream().filter(p -> p.kind() == SurfaceKind.ROOF).count());
        double[] t = new Vegetation(List.of("x"), List.of(), Vegetation.Kind.DECIDUOUS, null).monthly(UnobstructedPlaneTest.SITE.latitudeDeg());
        double[] dhiMonth = new double[12];
        for (Step s : UnobstructedPlaneTest.AVERAGE_DAYS.steps()) dhiMonth[s.month() - 1] += s.dhiWm2() * s.weightedHours() / 1000;
        double dhi = 0, worst = 0;
        for (int i = 0; i < 12; i++) {
            dhi += dhiMonth[i];
            worst = Math.max(worst, 1 - t[i]);
        }
        int rays = 4096, n = HemisphereSampler.roundedRayCount(rays);
        IrradiationSetup.Options o = PipelineFixture.options(rays, IrradiationSetup.SunSampling.EXACT);
        float[] albedo = new float[f.model.triangleCount()];
        java.util.Arrays.fill(albedo, 0.3f);
        for (double deg : new double[] {30, 45, 60}) {
            double theta0 = Math.toRadians(deg), h = 2, radius = h * Math.tan(theta0);
            Canopy crown = Canopy.build(disc(roof.centroid().x(), roof.centroid().y(), roof.centroid().z() + h, radius, 256));
            ShadedIrradiation.Inputs in = IrradiationSetup.build(f.scene, f.model, f.patches.surfaces(), f.patches.patches(), List.of(),
                    albedo, UnobstructedPlaneTest.AVERAGE_DAYS, CieSky.OVERCAST, o).withCanopy(new CanopyShading(crown, t));
            IrradiationResult r = ShadedIrradiation.run(f.scene, in, PhaseProgress.NONE);
            double s = overcastCapShare(theta0), expected = 0;
            for (int i = 0; i < 12; i++) expected += dhiMonth[i] * (1 - s * (1 - t[i]));
            double tol = 4 * Math.sqrt(s * (1 - s) / n) * worst * dhi + 0.01 * expected;
            double got = r.diffuse()[roof.index()];
            System.out.printf("crown over the zenith cap %.0f deg, cie-overcast: diffuse/DHI %.4f, model %.4f (tolerance %.4f; isotropic share would give %.4f)%n",
                    deg, got / dhi, expected / dhi, tol / dhi, expectedIsotropic(dhiMonth, t, theta0) / dhi);
            assertEquals(expected, got, tol, "diffuse under a crown over the cap of " + deg + " deg");
            if (deg == 45) {
                assertTrue(Math.abs(expectedIsotropic(dhiMonth, t, theta0) - expected) > tol, "the test tells the radiance share from the isotropic one");
            }
        }
    }

    /** The same crown with t = 1 in every month: the diffuse equals the run without trees (t^k = 1 exactly). */
    @Test
    void transparentCrownLeavesTheOvercastDiffuseAsWithoutTrees() {
        TestModels m = new TestModels().box("a", 0, 0, 4, 3, 2).box("b", 6, -2, 9, 5, 8);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of("a"), 1.0);
        IrradiationSetup.Options o = PipelineFixture.options(256, IrradiationSetup.SunSampling.EXACT);
        IrradiationResult without = f.run(UnobstructedPlaneTest.AVERAGE_DAYS, CieSky.OVERCAST, o);
        float[] albedo = new float[f.model.triangleCount()];
        java.util.Arrays.fill(albedo, 0.3f);
        double[] one = new double[12];
        java.util.Arrays.fill(one, 1.0);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(f.scene, f.model, f.patches.surfaces(), f.patches.patches(), List.of(),
                albedo, UnobstructedPlaneTest.AVERAGE_DAYS, CieSky.OVERCAST, o)
                .withCanopy(new CanopyShading(Canopy.build(disc(2, 1.5, 5, 4, 32)), one));
        IrradiationResult with = ShadedIrradiation.run(f.scene, in, PhaseProgress.NONE);
        org.junit.jupiter.api.Assertions.assertArrayEquals(without.diffuse(), with.diffuse());
    }

    private static double expectedIsotropic(double[] dhiMonth, double[] t, double theta0) {
        double s = Math.pow(Math.sin(theta0), 2), e = 0;
        for (int i = 0; i < 12; i++) e += dhiMonth[i] * (1 - s * (1 - t[i]));
        return e;
    }

    /** A horizontal regular polygon of {@code sides} corners on a circle (a triangle fan), as a soup of 9 floats per triangle. */
    static float[] disc(double cx, double cy, double z, double radius, int sides) {
        float[] soup = new float[9 * sides];
        for (int i = 0; i < sides; i++) {
            double a0 = 2 * Math.PI * i / sides, a1 = 2 * Math.PI * (i + 1) / sides;
            double[] v = {cx, cy, z, cx + radius * Math.cos(a0), cy + radius * Math.sin(a0), z,
                    cx + radius * Math.cos(a1), cy + radius * Math.sin(a1), z};
            for (int k = 0; k < 9; k++) soup[9 * i + k] = (float) v[k];
        }
        return soup;
    }
}
