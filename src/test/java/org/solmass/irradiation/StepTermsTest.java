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
     * Property (common practice for a cache): keeping a normal's step terms for the next receiver
     * changes nothing. For receivers that share normals in runs (as patches of one face do) and
     * switch between them, with random sun visibilities, the shaded and unshaded slot sums and the
     * sunshine hours equal those of the loop over every step, bit for bit.
     */
    @Test
    void keptStepTermsGiveTheSumsOfTheFullStepLoopBitForBit() {
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
            assertEquals(wantSun, sunHours, 0.0, "sunshine hours, receiver " + receiver);
            assertArrayEquals(wantBeam, beam, 0.0, "beam, receiver " + receiver);
            assertArrayEquals(wantCirc, circ, 0.0, "circumsolar, receiver " + receiver);
            if (analysed) {
                assertArrayEquals(wantBeamU, terms.beamU, 0.0, "unshaded beam, receiver " + receiver);
                assertArrayEquals(wantCircU, terms.circU, 0.0, "unshaded circumsolar, receiver " + receiver);
            }
            if (sunHours > 0) checked++;
        }
        assertTrue(checked > 40, "the receivers must see the sun: " + checked); // precondition, not a result
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
