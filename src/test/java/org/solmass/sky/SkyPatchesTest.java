package org.solmass.sky;

import org.junit.jupiter.api.Test;
import org.solmass.climate.Step;
import org.solmass.sun.SolarGeometry;
import org.solmass.sun.SunPosition;

import java.time.Instant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * How fine the sky grid must be. Criterion (ours, declared before measuring): the grid's error on an
 * unobstructed plane stays under 1 %, a third of the 3 % agreement budget between Perez 1993
 * and Perez 1990. Reference: the traditional CIE overcast sky (Moon and Spencer 1942) on an open
 * vertical wall, whose vertical sky component has the closed form 3 (pi/2 + 4/3) / (7 pi) = 39.62 %
 * (derived in {@code irradiation.SkyDistributionPipelineTest#vscClosedForm}; the trade's 39.6 %,
 * common practice). Measured (docs/method.md): 145 patches +0.55 %, 577 patches +0.13 %, 2305
 * patches +0.02 %; on the sample year under Perez 1993 the 145-patch grid is within 0.25 % of the
 * 2305-patch grid on vertical and tilted planes.
 */
class SkyPatchesTest {

    private static double openWallVsc(SkyPatches sp, double azDeg) {
        double[] r = new double[sp.count()], sh = new double[sp.count()];
        Step s = new Step(Instant.EPOCH, 1, 6, 160, 12, new SunPosition(180, 40), 1, 100, 0, 100,
                SolarGeometry.extraterrestrialNormalWm2(160), Double.NaN, 1);
        CieSky.OVERCAST.patchRadiance(s, sp, r);
        var n = SunPosition.planeNormal(90, azDeg);
        sp.cosineShares(n.x(), n.y(), n.z(), sh);
        double e = 0;
        for (int p = 0; p < r.length; p++) e += sh[p] * r[p];
        return e / 100;
    }

    @Test
    void tregenzaGridMeetsTheOnePercentCriterionAndFinerGridsConverge() {
        double closed = 3 * (Math.PI / 2 + 4.0 / 3) / (7 * Math.PI);
        double previous = Double.POSITIVE_INFINITY;
        for (int m : new int[] {1, 2, 4}) {
            for (double az : new double[] {0, 90, 200}) {
                double err = Math.abs(openWallVsc(new SkyPatches(m), az) / closed - 1);
                System.out.printf("sky grid %d patches, wall azimuth %.0f: open-wall VSC error %.3f %%%n", 144 * m * m + 1, az, 100 * err);
                assertTrue(err < 0.01, m + ": " + err);
                if (az == 0) {
                    assertTrue(err < previous, "finer grid, smaller error");
                    previous = err;
                }
            }
        }
        assertEquals(closed, openWallVsc(new SkyPatches(4), 0), 0.001);
    }

    /** Every direction of the upper hemisphere falls in the patch whose cells contain it (band and azimuth cell). */
    @Test
    void directionsFallInTheirPatch() {
        SkyPatches sp = SkyPatches.TREGENZA;
        assertEquals(0, sp.patchOf(0, 1, 0));                 // north on the horizon: first patch of the lowest band
        assertEquals(144, sp.patchOf(0, 0, 1));               // the zenith cap is the last patch
        double e = Math.toRadians(13), az = Math.toRadians(95); // second band (12-24 deg), 30 patches of 12 deg: cell 7
        assertEquals(30 + 7, sp.patchOf(Math.cos(e) * Math.sin(az), Math.cos(e) * Math.cos(az), Math.sin(e)));
        // every direction: the patch from elevation band and azimuth by atan2, written out here
        java.util.Random rnd = new java.util.Random(3);
        int[] counts = {30, 30, 24, 24, 18, 12, 6};
        for (int i = 0; i < 100_000; i++) {
            double el = Math.asin(rnd.nextDouble()), a = 2 * Math.PI * rnd.nextDouble();
            double dx = Math.cos(el) * Math.sin(a), dy = Math.cos(el) * Math.cos(a), dz = Math.sin(el);
            double elDeg = Math.toDegrees(el), azDeg = Math.toDegrees(Math.atan2(dx, dy));
            if (azDeg < 0) azDeg += 360;
            int band = (int) (elDeg / 12), expected;
            if (band >= 7) expected = 144;
            else {
                int first = 0;
                for (int b = 0; b < band; b++) first += counts[b];
                expected = first + (int) (azDeg / (360.0 / counts[band]));
            }
            double edge = Math.min(Math.abs(elDeg / 12 - Math.rint(elDeg / 12)), band >= 7 ? 1 : Math.abs(azDeg / (360.0 / counts[band])
                    - Math.rint(azDeg / (360.0 / counts[band]))));
            if (edge > 1e-9) assertEquals(expected, sp.patchOf(dx, dy, dz), "elevation " + elDeg + " azimuth " + azDeg);
        }
    }
}
