package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.Step;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.scene.Canopy;
import org.solmass.sky.Perez;
import org.solmass.study.Vegetation;
import org.solmass.sun.Site;
import org.solmass.surface.Patch;

import java.time.ZoneId;
import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Trees in front of a south wall (docs/method.md, "Vegetation"): two crowns (closed boxes) in line
 * south of the wall, clear-sky average days of June and December at 48 N.
 * <ul>
 * <li>The beam on each wall patch equals {@code sum DNI cos(theta) t_m^k} over the steps, k the
 * crowns the sun ray crosses by the analytic slab test of ray and box (Kay and Kajiya, 1986): the
 * attenuation model's definition, a product of per-crossing transmittances (Beer-Lambert with one
 * typical path per crown; Monsi and Saeki, 1953), with the month's transmittance (deciduous defaults:
 * the June value in June, the December value in December).</li>
 * <li>With t = 1 every result equals the run without the trees (t^k = 1 exactly).</li>
 * <li>With t = 0 beam and sky diffuse equal the run with the crowns as opaque context blocks
 * (t^k = 0 for k >= 1; the model's bounds, and so the float frame of the rays, are the same in both).</li>
 * </ul>
 */
class CanopyShadingTest {
    static final double[][] CROWNS = {{-6, -10, 0.5, 6, -4, 9}, {-6, -22, 0.5, 6, -16, 9}};
    static final Site SITE = new Site(48.0, 10.0, 0, ZoneId.of("+01:00"));

    static MassingModel model() {
        TestModels m = new TestModels().box("house", -10, 0, 10, 8, 10).slab("ground", -40, -40, 40, 40, 0);
        for (int i = 0; i < CROWNS.length; i++) crown(m, "crown" + i, CROWNS[i]);
        return m.build();
    }

    /** A closed box, every face counter-clockwise seen from outside. */
    static void crown(TestModels m, String name, double[] b) {
        double x0 = b[0], y0 = b[1], z0 = b[2], x1 = b[3], y1 = b[4], z1 = b[5];
        m.quad(name, new double[] {x0, y0, z0}, new double[] {x0, y1, z0}, new double[] {x1, y1, z0}, new double[] {x1, y0, z0});
        m.quad(name, new double[] {x0, y0, z1}, new double[] {x1, y0, z1}, new double[] {x1, y1, z1}, new double[] {x0, y1, z1});
        m.quad(name, new double[] {x0, y0, z0}, new double[] {x1, y0, z0}, new double[] {x1, y0, z1}, new double[] {x0, y0, z1});
        m.quad(name, new double[] {x0, y1, z0}, new double[] {x0, y1, z1}, new double[] {x1, y1, z1}, new double[] {x1, y1, z0});
        m.quad(name, new double[] {x0, y0, z0}, new double[] {x0, y0, z1}, new double[] {x0, y1, z1}, new double[] {x0, y1, z0});
        m.quad(name, new double[] {x1, y0, z0}, new double[] {x1, y1, z0}, new double[] {x1, y1, z1}, new double[] {x1, y0, z1});
    }

    static WeatherSeries juneAndDecember() {
        WeatherSeries all = ClimateSource.load(SITE, ClimateSpec.clearSky());
        List<Step> days = all.steps().stream().filter(s -> s.month() == 6 || s.month() == 12).toList();
        return new WeatherSeries(days, TimeBase.AVERAGE_DAYS, "two average days", all.report());
    }

    static final Vegetation TREES = new Vegetation(List.of("crown*"), List.of(), Vegetation.Kind.DECIDUOUS, null);

    /** The analysed house with the crowns as trees of the given monthly transmittance (null: opaque context). */
    static Run run(double[] transmittance) {
        MassingModel full = model();
        boolean[] tree = TREES.treeTriangles(full);
        boolean[] opaque = new boolean[tree.length];
        for (int i = 0; i < tree.length; i++) opaque[i] = !tree[i];
        MassingModel m = transmittance == null ? full : full.subset(opaque);
        PipelineFixture f = new PipelineFixture(m, Set.of("house"), 1.0);
        float[] albedo = new float[m.triangleCount()];
        Arrays.fill(albedo, 0.3f);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(f.scene, m, f.patches.surfaces(), f.patches.patches(), List.of(),
                albedo, juneAndDecember(), Perez.INSTANCE, PipelineFixture.options(256, IrradiationSetup.SunSampling.EXACT));
        if (transmittance != null) in = in.withCanopy(new CanopyShading(Canopy.build(full.subset(tree).triangleSoup()), transmittance));
        return new Run(f, ShadedIrradiation.run(f.scene, in, PhaseProgress.NONE));
    }

    record Run(PipelineFixture fixture, IrradiationResult result) {}

    /** Crowns the ray from o along d crosses (slab test in double), or -1 when it passes within 1 mm of a crown's edge. */
    static int crossings(Vec3 o, Vec3 d) {
        int k = 0;
        for (double[] b : CROWNS) {
            double tn = Double.NEGATIVE_INFINITY, tf = Double.POSITIVE_INFINITY;
            double[] oo = {o.x(), o.y(), o.z()}, dd = {d.x(), d.y(), d.z()};
            for (int a = 0; a < 3; a++) {
                double t0 = (b[a] - oo[a]) / dd[a], t1 = (b[a + 3] - oo[a]) / dd[a];
                tn = Math.max(tn, Math.min(t0, t1));
                tf = Math.min(tf, Math.max(t0, t1));
            }
            if (Math.abs(tf - tn) < 1e-3) return -1;
            if (tn < tf && tf > 0) k++;
        }
        return k;
    }

    @Test
    void beamThroughCrownsIsTheBeamTimesTheMonthsTransmittanceToTheCrossings() {
        double[] t = TREES.monthly(SITE.latitudeDeg());
        assertEquals(0.25, t[5], "June: deciduous crown in leaf (Vegetation defaults)");
        assertEquals(0.6, t[11], "December: bare crown");
        Run r = run(t);
        List<Step> steps = juneAndDecember().steps();
        int checked = 0, twice = 0, once = 0;
        for (Patch p : r.fixture().patches.patches()) {
            if (p.normal().y() > -0.99) continue; // the south wall only
            Vec3 o = p.centroid();
            double expected = 0;
            boolean decided = true;
            for (Step s : steps) {
                if (!SunDirections.isSunUp(s) || s.dniWm2() <= 0) continue;
                Vec3 d = s.sun().direction();
                double c = -d.y();
                if (c <= 0) continue;
                int k = crossings(o, d);
                if (k < 0) {
                    decided = false;
                    break;
                }
                if (k == 2) twice++;
                if (k == 1) once++;
                expected += s.dniWm2() * c * Math.pow(t[s.month() - 1], k) * s.weightedHours() / 1000;
            }
            if (!decided) continue;
            checked++;
            // sun vectors are kept as float in the kernel: relative 1e-6 (as CanyonShadowTest)
            assertEquals(expected, r.result().beam()[p.index()], 1e-6 * Math.max(1, expected), "patch at " + o);
        }
        assertTrue(checked > 50 && twice > 0 && once > 0, checked + " patches, " + once + " steps through one crown, " + twice + " through two");
    }

    @Test
    void fullTransmittanceGivesTheResultsWithoutTrees() {
        double[] one = new double[12];
        Arrays.fill(one, 1.0);
        IrradiationResult with = run(one).result();
        MassingModel full = model();
        boolean[] tree = TREES.treeTriangles(full);
        boolean[] opaque = new boolean[tree.length];
        for (int i = 0; i < tree.length; i++) opaque[i] = !tree[i];
        MassingModel bare = full.subset(opaque);
        PipelineFixture f = new PipelineFixture(bare, Set.of("house"), 1.0);
        IrradiationResult without = f.run(juneAndDecember(), Perez.INSTANCE, PipelineFixture.options(256, IrradiationSetup.SunSampling.EXACT));
        assertArrayEquals(without.annual(), with.annual());
        assertArrayEquals(without.beam(), with.beam());
        assertArrayEquals(without.diffuse(), with.diffuse());
        assertArrayEquals(without.reflected(), with.reflected());
    }

    @Test
    void zeroTransmittanceGivesTheBeamAndSkyDiffuseOfOpaqueCrowns() {
        IrradiationResult clear = run(new double[12]).result();
        IrradiationResult opaque = run(null).result();
        assertEquals(opaque.beam().length, clear.beam().length);
        for (int p = 0; p < clear.beam().length; p++) {
            assertEquals(opaque.beam()[p], clear.beam()[p], 1e-9 * Math.max(1, opaque.beam()[p]), "beam of patch " + p);
            assertEquals(opaque.diffuse()[p], clear.diffuse()[p], 1e-9 * Math.max(1, opaque.diffuse()[p]), "sky diffuse of patch " + p);
        }
    }

    /**
     * The house stands in a crown 20 km wide whose underside is at z = 1 m: every ray that leaves a
     * patch above the underside crosses the crown's surface exactly once (through its top, side or
     * underside, the last on the way to the ground), so by the model (t^1 on every ray, f_m = t) the
     * beam, the sky diffuse and the reflected irradiation are those without the crown times t.
     * Evergreen default t = 0.15 all year (Vegetation, from memory). The transmittances are kept as
     * float for reflection: relative 1e-6.
     */
    @Test
    void insideOneCrownBeamSkyAndReflectionAreScaledByItsTransmittance() {
        MassingModel house = new TestModels().box("house", -10, 0, 10, 8, 10).build();
        PipelineFixture f = new PipelineFixture(house, Set.of("house"), 1.0);
        TestModels shell = new TestModels();
        crown(shell, "crown", new double[] {-1e4, -1e4, 1, 1e4, 1e4, 1e3});
        double[] t = new Vegetation(List.of("x"), List.of(), Vegetation.Kind.EVERGREEN, null).monthly(SITE.latitudeDeg());
        assertEquals(0.15, t[0]);
        IrradiationResult without = f.run(juneAndDecember(), Perez.INSTANCE, PipelineFixture.options(256, IrradiationSetup.SunSampling.EXACT));
        float[] albedo = new float[house.triangleCount()];
        Arrays.fill(albedo, 0.3f);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(f.scene, house, f.patches.surfaces(), f.patches.patches(), List.of(),
                albedo, juneAndDecember(), Perez.INSTANCE, PipelineFixture.options(256, IrradiationSetup.SunSampling.EXACT))
                .withCanopy(new CanopyShading(Canopy.build(shell.build().triangleSoup()), t));
        IrradiationResult with = ShadedIrradiation.run(f.scene, in, PhaseProgress.NONE);
        int checked = 0, reflecting = 0;
        for (Patch p : f.patches.patches()) {
            if (p.centroid().z() < 1.5) continue;
            int i = p.index();
            checked++;
            assertTrue(without.diffuse()[i] > 0);
            if (without.reflected()[i] > 0) reflecting++;
            assertEquals(0.15 * without.reflected()[i], with.reflected()[i], 1e-6 * without.reflected()[i], "reflected, patch " + p.centroid());
            assertEquals(0.15 * without.beam()[i], with.beam()[i], 1e-6 * Math.max(1, without.beam()[i]), "beam, patch " + p.centroid());
            assertEquals(0.15 * without.diffuse()[i], with.diffuse()[i], 1e-6 * without.diffuse()[i], "sky diffuse, patch " + p.centroid());
        }
        assertTrue(checked > 500 && reflecting > 300, checked + " patches, " + reflecting + " with reflected light");
    }
}
