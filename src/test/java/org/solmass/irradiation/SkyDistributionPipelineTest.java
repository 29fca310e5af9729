package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.Step;
import org.solmass.sky.CieSky;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A radiance distribution through the whole pipeline on obstructed patches: under the traditional
 * CIE overcast sky ({@code cie-overcast}, normalised to DHI) the sky diffuse of a vertical patch is
 * its vertical sky component times DHI, so a wall facing an infinitely long obstruction must follow
 * the closed form of {@link #vscClosedForm}.
 */
class SkyDistributionPipelineTest {

    /**
     * Vertical sky component (fraction) under the CIE traditional overcast sky, L = Lz (1 + 2 sin g)/3
     * (Moon and Spencer 1942), of a vertical wall facing an infinitely long obstruction whose top edge
     * is parallel to the wall and seen at elevation angle alpha in the wall's normal plane. Derivation:
     * write a direction as d = (cos z, sin z cos h, sin z sin h) (x along the wall, y its normal,
     * z up), z in (0, pi) from the wall's axis and h the profile angle; the visible sky is h in
     * (alpha, pi/2), d omega = sin z dz dh, cos theta = sin z cos h, sin g = sin z sin h. Then
     * E_v / Lz = (1/3) int_alpha^{pi/2} cos h [int_0^pi sin^2 z dz + 2 sin h int_0^pi sin^3 z dz] dh
     * = (1/3) [(pi/2)(1 - sin alpha) + (4/3) cos^2 alpha], and E_h / Lz = 7 pi / 9, so
     * VSC = 3 [(pi/2)(1 - sin alpha) + (4/3) cos^2 alpha] / (7 pi); alpha = 0 gives 39.62 %, the
     * trade's 39.6 % (common practice; BRE guidance, Littlefair, "Site layout planning for daylight
     * and sunlight", from memory).
     */
    static double vscClosedForm(double alphaRad) {
        double c = Math.cos(alphaRad);
        return 3 * (Math.PI / 2 * (1 - Math.sin(alphaRad)) + 4.0 / 3 * c * c) / (7 * Math.PI);
    }

    @Test
    void closedFormGivesTheOpenWallValue() {
        assertEquals(0.396, vscClosedForm(0), 0.0005);
        assertEquals(0, vscClosedForm(Math.PI / 2), 1e-15);
    }

    /**
     * An analysed block 20 m long facing a 2 km long, 24 m high wall 12 m away: each row of facade
     * patches facing it, at heights z, gets sky diffuse / DHI = VSC(atan((24 - z)/12)) (a row above
     * the wall's top sees the whole sky in front: alpha = 0). Tolerance: 4 standard errors of the row
     * mean, from the spread of the row's equivalent patches (they differ only in their ray seeds),
     * plus the 1 % criterion the 145-patch sky grid is held to ({@code SkyPatchesTest}; it is +0.55 %
     * on the open wall).
     */
    @Test
    void overcastCanyonWallFollowsTheClosedForm() {
        TestModels m = new TestModels().box("a", 0, 0, 20, 10, 30).box("wall", -990, 22, 1010, 40, 24);
        PipelineFixture f = new PipelineFixture(m.build(), Set.of("a"), 1.0);
        IrradiationResult r = f.run(UnobstructedPlaneTest.AVERAGE_DAYS, CieSky.OVERCAST,
                PipelineFixture.options(1024, IrradiationSetup.SunSampling.EXACT));
        double dhi = 0;
        for (Step s : UnobstructedPlaneTest.AVERAGE_DAYS.steps()) dhi += s.dhiWm2() * s.weightedHours() / 1000;
        for (double z : new double[] {2.5, 10.5, 20.5, 28.5}) {
            List<Double> row = new ArrayList<>();
            for (Patch p : f.patches.patches()) {
                if (p.kind() == SurfaceKind.FACADE && p.normal().y() > 0.99 && Math.abs(p.centroid().z() - z) < 1e-6
                        && p.centroid().x() > 1 && p.centroid().x() < 19) row.add(r.diffuse()[p.index()] / dhi);
            }
            assertTrue(row.size() >= 10, "row at " + z);
            double mean = 0, var = 0;
            for (double v : row) mean += v;
            mean /= row.size();
            for (double v : row) var += (v - mean) * (v - mean);
            double se = Math.sqrt(var / (row.size() - 1) / row.size());
            double expected = vscClosedForm(Math.max(0, Math.atan2(24 - z, 12)));
            System.out.printf("cie-overcast canyon z = %.1f: diffuse/DHI %.4f vs closed form %.4f (se %.4f)%n", z, mean, expected, se);
            assertTrue(se > 0, "equivalent patches differ by their seeds");
            assertEquals(expected, mean, 4 * se + 0.01 * expected, "row at z = " + z);
        }
    }
}
