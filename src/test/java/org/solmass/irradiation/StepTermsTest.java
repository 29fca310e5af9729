package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.Perez;
import org.solmass.sky.SkyModel;
import org.solmass.sun.Site;

import java.time.ZoneId;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class StepTermsTest {

    /**
     * Property (common practice for a cache): keeping a normal's step terms for the next receiver,
     * added up per (sun direction, slot) pair, changes nothing but rounding. For receivers that share
     * normals in runs (as patches of one face do) and switch between them, with random sun
     * visibilities, the shaded and unshaded slot sums and the sunshine hours equal those of the loop
     * over every step within 1e-12 relative: the terms are at or above zero, so a reordered sum of
     * n terms differs by at most about n x 2^-53 of itself (Higham, Accuracy and Stability of
     * Numerical Algorithms, 2nd ed., 2002, section 4.2), about 4e-13 for the 4,000 terms of a slot's
     * year at most.
     */
    @Test
    void keptStepTermsGiveTheSumsOfTheFullStepLoop() {
        WeatherSeries year = ClimateSource.load(new Site(51, 10, 0, ZoneId.of("Europe/Berlin")), ClimateSpec.clearSkyYear(2025));
        SunDirections sun = SunDirections.binned(year, new SkySubdivision(1000));
        StepTable st = new StepTable(year, sun, Perez.INSTANCE);
        StepTerms terms = new StepTerms(st);
        SplittableRandom r = new SplittableRandom(7);
        double[][] normals = {{0, 0, 1}, {0, -1, 0}, {0.6, 0, 0.8}, {-0.5, 0.5, Math.sqrt(0.5)}, {0, 1, 0}};
        byte[] vis = new byte[sun.count()];
        double[] beam = new double[StepTable.SLOTS], circ = new double[StepTable.SLOTS];
        double[] beamU = new double[StepTable.SLOTS], circU = new double[StepTable.SLOTS];
        double[] wantBeam = new double[StepTable.SLOTS], wantCirc = new double[StepTable.SLOTS];
        double[] wantBeamU = new double[StepTable.SLOTS], wantCircU = new double[StepTable.SLOTS];
        int checked = 0;
        for (int receiver = 0; receiver < 60; receiver++) {
            double[] n = normals[(receiver / 4) % normals.length]; // runs of 4 receivers per normal
            float fx = (float) n[0], fy = (float) n[1], fz = (float) n[2];
            for (int i = 0; i < vis.length; i++) vis[i] = (byte) (r.nextInt(3) == 0 ? 0 : 1);
            boolean analysed = receiver % 3 != 0;
            terms.normal(fx, fy, fz, analysed);
            double sunHours = terms.shaded(vis, beam, circ);
            double wantSun = fullLoop(st, fx, fy, fz, vis, wantBeam, wantCirc, wantBeamU, wantCircU);
            assertEquals(wantSun, sunHours, 1e-12 * wantSun, "sunshine hours, receiver " + receiver);
            close(wantBeam, beam, "beam, receiver " + receiver);
            close(wantCirc, circ, "circumsolar, receiver " + receiver);
            if (analysed) {
                close(wantBeamU, terms.beamU, "unshaded beam, receiver " + receiver);
                close(wantCircU, terms.circU, "unshaded circumsolar, receiver " + receiver);
            }
            if (sunHours > 0) checked++;
        }
        assertTrue(checked > 40, "the receivers must see the sun: " + checked); // precondition, not a result
    }

    private static void close(double[] want, double[] got, String what) {
        for (int k = 0; k < want.length; k++) assertEquals(want[k], got[k], 1e-12 * Math.abs(want[k]), what + ", slot " + k);
    }

    /** The step loop as it stood before the terms were kept: every step, every receiver. */
    private static double fullLoop(StepTable st, float fnx, float fny, float fnz, byte[] vis,
                                   double[] beam, double[] circ, double[] beamU, double[] circU) {
        java.util.Arrays.fill(beam, 0);
        java.util.Arrays.fill(circ, 0);
        java.util.Arrays.fill(beamU, 0);
        java.util.Arrays.fill(circU, 0);
        double sun = 0;
        for (int s = 0; s < st.count; s++) {
            double c = fnx * st.sx[s] + fny * st.sy[s] + fnz * st.sz[s];
            if (c <= 0) continue;
            int k = st.slot[s];
            double b = st.beamWh[s] * c, cs = st.circumsolarWh[s] * SkyModel.circumsolarRatio(c, st.cosZenith[s]);
            beamU[k] += b;
            circU[k] += cs;
            if (vis[st.direction[s]] != 0) {
                sun += st.sunshineHours[s];
                beam[k] += b;
                circ[k] += cs;
            }
        }
        return sun;
    }
}
