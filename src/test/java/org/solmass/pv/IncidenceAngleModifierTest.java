package org.solmass.pv;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/** Martin and Ruiz (2001), Solar Energy Materials &amp; Solar Cells 70, 25-38. */
class IncidenceAngleModifierTest {
    static final IncidenceAngleModifier IAM = IncidenceAngleModifier.STANDARD_GLASS;

    /** The beam formula is normalised to 1 at normal incidence and is 0 at grazing incidence (Martin and Ruiz 2001). */
    @Test
    void beamIsOneAtNormalIncidenceAndZeroAtGrazing() {
        assertEquals(1.0, IAM.beam(0), 1e-15);
        assertEquals(0.0, IAM.beam(90), 1e-15);
        assertEquals(0.0, IAM.beam(120), 0);
    }

    @Test
    void beamFallsMonotonicallyFromNormalToGrazing() {
        double prev = 2;
        for (double a = 0; a <= 90; a += 0.25) {
            double v = IAM.beam(a);
            assertTrue(v < prev, "IAM must fall at " + a + " deg");
            prev = v;
        }
    }

    /**
     * Worked values of the paper's beam formula with ar = 0.16, by hand (4-digit tables of exp and cos):
     * denominator 1 - exp(-6.25) = 1 - 0.00193 = 0.99807;
     * 40 deg: cos 0.76604, exp(-4.7878) = 0.00833, (1 - 0.00833) / 0.99807 = 0.9936;
     * 60 deg: cos 0.5, exp(-3.125) = 0.04394, 0.95606 / 0.99807 = 0.9579;
     * 80 deg: cos 0.17365, exp(-1.0853) = 0.33778, 0.66222 / 0.99807 = 0.6635.
     * Shape from memory of the paper's figures for clean modules: loss under 1 % to about 40 deg, a
     * few per cent at 60 deg, steep beyond 70 deg; the hand values agree.
     */
    @Test
    void beamMatchesHandWorkedValuesAt0_40_60_80Degrees() {
        assertEquals(1.0, IAM.beam(0), 1e-12);
        assertEquals(0.9936, IAM.beam(40), 2e-4);
        assertEquals(0.9579, IAM.beam(60), 2e-4);
        assertEquals(0.6635, IAM.beam(80), 2e-4);
    }

    /** A dirtier module (larger ar) loses more at every oblique angle (Martin and Ruiz 2001: ar grows with dust). */
    @Test
    void largerAngularLossCoefficientLosesMore() {
        IncidenceAngleModifier dirty = new IncidenceAngleModifier(0.20);
        for (double a = 10; a < 90; a += 10) assertTrue(dirty.beam(a) < IAM.beam(a), "at " + a);
    }

    /**
     * The sky closed form against an independent numerical integral of the beam IAM over the isotropic
     * sky seen by the tilted plane: ratio of the integral of IAM(theta) cos(theta) dOmega to that of
     * cos(theta) dOmega over the directions in front of the plane and above the horizon.
     * Tolerance 0.01 absolute, set before running from a remembered accuracy of the paper's closed
     * forms of about 1 % (from memory, unconfirmed); measured largest deviation 0.0085 (tilt 30 deg).
     */
    @Test
    void skyClosedFormMatchesHemisphericalIntegralOfBeamIam() {
        for (double ar : new double[] {0.16, 0.20}) {
            IncidenceAngleModifier m = new IncidenceAngleModifier(ar);
            for (double tilt = 0; tilt <= 90; tilt += 15)
                assertEquals(quadrature(m, tilt)[0], m.skyDiffuse(tilt), 0.01, "sky, ar " + ar + ", tilt " + tilt);
        }
    }

    /**
     * The ground closed form (and the sky one, tilts 15..75) against the same integral, checked as the
     * paper built it: c2 = 0.5 ar - 0.154 is a fit of the closed form to this integral, so moving c2 by
     * 0.01 either way must make the largest deviation over tilts 15..75 deg larger. (A plain bound of
     * 0.01 on the ground part fails: the closed form's largest deviation is 0.011 at tilt 30 deg, ar 0.16,
     * and no c2 does better than about that, so it is the form's own accuracy.)
     */
    @Test
    void paperC2IsTheBestFitOfTheClosedFormsToTheIntegral() {
        IncidenceAngleModifier m = IAM;
        double c2 = m.c2();
        double[][] q = new double[5][];
        for (int i = 0; i < 5; i++) q[i] = quadrature(m, 15 + 15 * i);
        double at = maxDeviation(m.ar(), c2, q), below = maxDeviation(m.ar(), c2 - 0.01, q), above = maxDeviation(m.ar(), c2 + 0.01, q);
        assertTrue(at < below && at < above, "deviation " + at + " at c2, " + below + " / " + above + " at c2 -/+ 0.01");
        assertEquals(m.groundReflected(30), closedForm(m.ar(), c2, IncidenceAngleModifier.trigTerm(Math.toRadians(30))), 1e-15);
    }

    private static double maxDeviation(double ar, double c2, double[][] q) {
        double worst = 0;
        for (int i = 0; i < q.length; i++) {
            double b = Math.toRadians(15 + 15 * i);
            worst = Math.max(worst, Math.abs(closedForm(ar, c2, IncidenceAngleModifier.trigTerm(Math.PI - b)) - q[i][0]));
            worst = Math.max(worst, Math.abs(closedForm(ar, c2, IncidenceAngleModifier.trigTerm(b)) - q[i][1]));
        }
        return worst;
    }

    /** The paper's closed form written out here: 1 - exp(-(c1 t + c2 t^2) / ar), c1 = 4 / (3 pi). */
    private static double closedForm(double ar, double c2, double t) {
        return 1 - Math.exp(-(4 / (3 * Math.PI) * t + c2 * t * t) / ar);
    }

    /** Horizontal plane: sees the whole sky and no ground; vertical: half sky, half ground, equal IAM (symmetry). */
    @Test
    void verticalPlaneSeesSkyAndGroundAlikeAndHorizontalSeesNoGround() {
        assertEquals(IAM.skyDiffuse(90), IAM.groundReflected(90), 1e-12);
        assertEquals(0.0, IAM.groundReflected(0), 1e-12);
        assertTrue(IAM.groundReflected(1e-6) < 0.01);
        assertEquals(0.0, IAM.skyDiffuse(180), 1e-12);
    }

    /**
     * Midpoint quadrature in the plane's frame: theta from the normal, phi around it. Direction's
     * vertical component: cos(theta) cos(beta) - sin(theta) cos(phi) sin(beta) (phi = 0 towards the top
     * edge of the plane). Returns {sky IAM, ground IAM}.
     */
    static double[] quadrature(IncidenceAngleModifier m, double tiltDeg) {
        double b = Math.toRadians(tiltDeg);
        int nt = 600, np = 1200;
        double skyNum = 0, skyDen = 0, gNum = 0, gDen = 0;
        for (int i = 0; i < nt; i++) {
            double t = (i + 0.5) * (Math.PI / 2) / nt;
            double w = Math.cos(t) * Math.sin(t), iam = m.beam(Math.toDegrees(t));
            for (int j = 0; j < np; j++) {
                double p = (j + 0.5) * 2 * Math.PI / np;
                double z = Math.cos(t) * Math.cos(b) - Math.sin(t) * Math.cos(p) * Math.sin(b);
                if (z > 0) { skyNum += iam * w; skyDen += w; } else { gNum += iam * w; gDen += w; }
            }
        }
        return new double[] {skyNum / skyDen, gDen > 0 ? gNum / gDen : Double.NaN};
    }
}
