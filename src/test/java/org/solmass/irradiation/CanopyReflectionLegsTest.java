package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.model.MassingModel;
import org.solmass.scene.Canopy;
import org.solmass.sky.Perez;
import org.solmass.study.Vegetation;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The worked case of docs/method.md, "Vegetation", for the crowns on every reflection leg
 * ({@link CanopyShading#onEveryLeg}): a street canyon, H/W 1 (two blocks 20 m long, 10 m high, 10 m
 * apart), walls of albedo 0.5, shaded ground, a row of three box crowns in the middle of the street
 * (4 m deep, z 2 to 8 m), clear-sky average days at 51 N, 256 rays. Measured on the 400 wall patches
 * that face the street.
 * <ul>
 * <li>t = 0 against the crowns as opaque blocks that do not reflect (the model's exact limit for
 * t = 0: a ray that meets a crown is stopped and brings nothing back): every leg's weight carries its
 * own ray's crossings, so the reflected light must be the same, patch by patch.</li>
 * <li>deciduous months (0.6 / 0.45 / 0.25) against runs with that month's transmittance all year:
 * what the year-mean factor on the legs between reflectors leaves (the last leg has the month's own).</li>
 * </ul>
 * The numbers are printed for the docs.
 */
class CanopyReflectionLegsTest {
    static final double[][] CROWNS = {{1, 9, 2, 6.5, 13, 8}, {7.25, 9, 2, 12.75, 13, 8}, {13.5, 9, 2, 19, 13, 8}};

    static MassingModel model(boolean withCrowns) {
        TestModels m = new TestModels().box("a", 0, 0, 20, 6, 10).box("b", 0, 16, 20, 22, 10);
        if (withCrowns) for (int i = 0; i < CROWNS.length; i++) CanopyShadingTest.crown(m, "crown" + i, CROWNS[i]);
        return m.build();
    }

    static IrradiationSetup.Options options() {
        return new IrradiationSetup.Options(1.0, 256, 0.2, true, IrradiationSetup.SunSampling.EXACT, 4096, 7L, true);
    }

    /** The canyon without the crowns in the opaque model; the crowns as a canopy of the given monthly transmittance (null: none). */
    static IrradiationResult run(double[] t, PipelineFixture f) {
        float[] albedo = new float[f.model.triangleCount()];
        Arrays.fill(albedo, 0.5f);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(f.scene, f.model, f.patches.surfaces(), f.patches.patches(), List.of(),
                albedo, CanopyShadingTest.juneAndDecember(), Perez.INSTANCE, options());
        if (t != null) {
            TestModels crowns = new TestModels();
            for (int i = 0; i < CROWNS.length; i++) CanopyShadingTest.crown(crowns, "crown" + i, CROWNS[i]);
            in = in.withCanopy(new CanopyShading(Canopy.build(crowns.build().triangleSoup()), t));
        }
        return ShadedIrradiation.run(f.scene, in, PhaseProgress.NONE);
    }

    /** Indices of the wall patches facing the street (normal +y on block a, -y on block b). */
    static List<Integer> streetWalls(PipelineFixture f) {
        List<Integer> out = new ArrayList<>();
        for (Patch p : f.patches.patches()) {
            boolean a = p.normal().y() > 0.99 && Math.abs(p.centroid().y() - 6) < 1e-6;
            boolean b = p.normal().y() < -0.99 && Math.abs(p.centroid().y() - 16) < 1e-6;
            if (a || b) out.add(p.index());
        }
        return out;
    }

    static double mean(double[] v, List<Integer> idx) {
        double s = 0;
        for (int i : idx) s += v[i];
        return s / idx.size();
    }

    static double[] constant(double t) {
        double[] a = new double[12];
        Arrays.fill(a, t);
        return a;
    }

    @Test
    void crownsOnEveryLegOfTheCanyonsReflectionWorkedCase() {
        PipelineFixture f = new PipelineFixture(model(false), Set.of("a", "b"), 1.0);
        List<Integer> walls = streetWalls(f);
        assertEquals(400, walls.size());
        // opaque, non-reflecting crowns: the same blocks analysed, the crowns in the scene without patches (nothing to reflect)
        PipelineFixture opaque = new PipelineFixture(model(true), Set.of("a", "b"), 1.0);
        List<Integer> opaqueWalls = streetWalls(opaque);
        float[] albedo = new float[opaque.model.triangleCount()];
        Arrays.fill(albedo, 0.5f);
        IrradiationResult none = run(null, f);
        IrradiationResult zero = run(constant(0), f);
        IrradiationResult ref = ShadedIrradiation.run(opaque.scene, IrradiationSetup.build(opaque.scene, opaque.model,
                opaque.patches.surfaces(), opaque.patches.patches(), List.of(), albedo, CanopyShadingTest.juneAndDecember(),
                Perez.INSTANCE, options()), PhaseProgress.NONE);
        double rNone = mean(none.reflected(), walls), rZero = mean(zero.reflected(), walls), rRef = mean(ref.reflected(), opaqueWalls);
        System.out.printf(java.util.Locale.ROOT, "canyon walls, reflected kWh/m2 (June + December): no crowns %.3f; t = 0 %.3f;"
                + " opaque non-reflecting crowns %.3f (t = 0 vs exact limit %+.1f %%)%n", rNone, rZero, rRef, 100 * (rZero / rRef - 1));
        assertTrue(rZero < rNone && rRef < rNone, "crowns take reflected light away");
        // t = 0: a hit behind a crown carries weight 0 on every leg, as the opaque crown's hit carries
        // nothing: the same sums up to the float weights (relative 1e-6, as CanopyShadingTest)
        assertEquals(walls.size(), opaqueWalls.size());
        for (int i = 0; i < walls.size(); i++) {
            int p = walls.get(i), q = opaqueWalls.get(i);
            assertEquals(opaque.patches.patches().get(q).centroid(), f.patches.patches().get(p).centroid());
            assertEquals(ref.reflected()[q], zero.reflected()[p], 1e-6 * Math.max(1, ref.reflected()[q]), "reflected, wall patch " + i);
        }
        double[] dec = new Vegetation(List.of("x"), List.of(), Vegetation.Kind.DECIDUOUS, null).monthly(51);
        IrradiationResult d = run(dec, f);
        for (int month : new int[] {6, 12}) {
            IrradiationResult c = run(constant(dec[month - 1]), f);
            // beam and sky diffuse of the month are the same in both runs: the monthly difference is the reflected light's
            double md = 0, mc = 0, rc = 0, ac = 0;
            for (int i : walls) {
                md += d.monthly()[month - 1][i];
                mc += c.monthly()[month - 1][i];
                rc += c.reflected()[i];
                ac += c.annual()[i];
            }
            System.out.printf(java.util.Locale.ROOT, "month %d, t = %.2f: walls' irradiation of the month, deciduous year %.4f vs that t"
                    + " all year %.4f kWh/m2 (%+.2f %%; reflected light is %.1f %% of the walls' irradiation)%n", month, dec[month - 1],
                    md / walls.size(), mc / walls.size(), 100 * (md / mc - 1), 100 * rc / ac);
            assertTrue(rc > 0);
        }
    }
}
