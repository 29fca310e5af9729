package org.solmass.scene;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link HorizonProfile#obstructs}: the quick decision on squared components gives the answer of the
 * azimuth lookup for every direction, including directions a hair above or below the profile's
 * highest and lowest points, where a margin too small would show.
 */
class HorizonProfileTest {

    /** An invented far horizon: 360 azimuths, 0.5 to 14 degrees, with a flat stretch at its lowest. */
    private static HorizonProfile invented() {
        double[] e = new double[360];
        for (int i = 0; i < e.length; i++) e[i] = i >= 100 && i < 130 ? 0.5 : 7.25 + 6.75 * Math.sin(Math.toRadians(3 * i));
        return new HorizonProfile(e);
    }

    @Test
    void quickDecisionEqualsTheLookupForRandomDirections() {
        SplittableRandom r = new SplittableRandom(20261202);
        for (HorizonProfile h : new HorizonProfile[]{invented(), HorizonProfile.constant(5), HorizonProfile.constant(0.001),
                HorizonProfile.constant(89.99), HorizonProfile.constant(89.999)}) {
            int below = 0;
            for (int i = 0; i < 400_000; i++) {
                double dx = r.nextDouble(-1, 1), dy = r.nextDouble(-1, 1), dz = r.nextDouble(1e-6, 1);
                double len = i % 3 == 0 ? 1 : Math.sqrt(dx * dx + dy * dy + dz * dz); // unit and non-unit lengths
                boolean got = h.obstructs(dx / len, dy / len, dz / len);
                assertEquals(h.obstructsByLookup(dx / len, dy / len, dz / len), got, h + " at " + dx + ", " + dy + ", " + dz);
                if (got) below++;
            }
            assertTrue(below > 0, h + ": no direction below it (the test would not check the lower branch)");
        }
    }

    /**
     * Directions at the elevation of the profile's highest and lowest points, moved by a few ulps
     * and by relative steps of 1e-12 to 1e-6 in the tangent: the band the margin leaves to the lookup.
     */
    @Test
    void quickDecisionEqualsTheLookupNextToTheHighestAndLowestPoints() {
        HorizonProfile h = invented();
        double[] tans = {Math.tan(Math.toRadians(14.0)), Math.tan(Math.toRadians(0.5)),
                Math.tan(Math.toRadians(h.maxElevationDeg())), Math.tan(Math.toRadians(0.5 + 1e-9))};
        double[] steps = {0, 1e-16, -1e-16, 3e-16, -3e-16, 1e-12, -1e-12, 1e-10, -1e-10, 1e-9, -1e-9, 3e-9, -3e-9, 1e-6, -1e-6};
        int checked = 0;
        for (int az = 0; az < 3600; az++) {
            double a = Math.toRadians(az / 10.0), dx = Math.sin(a), dy = Math.cos(a);
            for (double t : tans) {
                for (double s : steps) {
                    double dz = t * (1 + s);
                    for (int u = -3; u <= 3; u++) {
                        double z = ulps(dz, u);
                        assertEquals(h.obstructsByLookup(dx, dy, z), h.obstructs(dx, dy, z), "azimuth " + az / 10.0 + ", dz " + z);
                        checked++;
                    }
                }
            }
        }
        assertTrue(checked > 1_000_000);
    }

    /**
     * Directions at every sample's elevation (the brackets of the sector test), moved by a few ulps
     * and by small relative steps, at azimuths all round (samples, sector middles and next to sample
     * azimuths), for profiles of 360, 72 and 7,200 samples.
     */
    @Test
    void quickDecisionEqualsTheLookupAtEverySamplesElevation() {
        SplittableRandom r = new SplittableRandom(7);
        for (int n : new int[]{360, 72, 7200}) {
            double[] e = new double[n];
            for (int i = 0; i < n; i++) e[i] = i % 17 < 3 ? 0 : r.nextDouble(0, 20); // open stretches (0) among random rises
            HorizonProfile h = new HorizonProfile(e);
            double step = 360.0 / n;
            double[] rel = {0, 1e-15, -1e-15, 1e-12, -1e-12, 1e-9, -1e-9, 1e-7, -1e-7};
            int checked = 0, obstructed = 0;
            for (int i = 0; i < n; i++) {
                for (double at : new double[]{0, 1e-9, -1e-9, 0.25, 0.5, 0.999999}) {
                    double a = Math.toRadians((i + at) * step), dx = Math.sin(a), dy = Math.cos(a);
                    for (int k = -2; k <= 3; k++) {
                        double t = Math.tan(Math.toRadians(e[Math.floorMod(i + k, n)]));
                        for (double q : rel) {
                            double z = t * (1 + q);
                            if (!(z > 0)) z = 1e-12 * (1 + q);
                            for (int u = -2; u <= 2; u++) {
                                double zz = ulps(z, u);
                                boolean want = h.obstructsByLookup(dx, dy, zz);
                                assertEquals(want, h.obstructs(dx, dy, zz), n + " samples, azimuth " + (i + at) * step + ", dz " + zz);
                                checked++;
                                if (want) obstructed++;
                            }
                        }
                    }
                }
            }
            assertTrue(obstructed > checked / 10 && obstructed < checked * 9 / 10, obstructed + " of " + checked);
        }
    }

    /**
     * Directions at the profile itself (its interpolated elevation at random azimuths inside the
     * sectors and within 1e-3 degrees of a sample), moved by a few ulps and by small relative steps:
     * where the chord and tangent-line bounds inside a sector must leave the answer to the lookup.
     */
    @Test
    void quickDecisionEqualsTheLookupAtTheInterpolatedProfile() {
        SplittableRandom r = new SplittableRandom(11);
        for (int n : new int[]{360, 36, 7200}) {
            double[] e = new double[n];
            for (int i = 0; i < n; i++) e[i] = i % 11 < 2 ? 0 : r.nextDouble() < 0.1 ? r.nextDouble(60, 89) : r.nextDouble(0, 25);
            HorizonProfile h = new HorizonProfile(e);
            double step = 360.0 / n;
            double[] rel = {0, 1e-15, -1e-15, 1e-12, -1e-12, 1e-10, -1e-10, 1e-9, -1e-9, 1e-8, -1e-8, 1e-6, -1e-6, 1e-4, -1e-4};
            int checked = 0, obstructed = 0;
            for (int k = 0; k < 25_000; k++) {
                int i = r.nextInt(n);
                double at = k % 4 == 0 ? r.nextDouble(-1e-3, 1e-3) / step : r.nextDouble(); // next to sample i, or inside its sector
                double azDeg = (i + at) * step, a = Math.toRadians(azDeg);
                double dx = Math.sin(a), dy = Math.cos(a), len = k % 2 == 0 ? 1 : 0.37 + r.nextDouble();
                double t = Math.tan(Math.toRadians(h.elevationDegAt(Math.toDegrees(Math.atan2(dx, dy)))));
                for (double q : rel) {
                    double z = t * (1 + q);
                    if (!(z > 0)) z = 1e-9 * (1 + q);
                    for (int u = -2; u <= 2; u++) {
                        double zz = ulps(z, u);
                        boolean want = h.obstructsByLookup(dx * len, dy * len, zz * len);
                        assertEquals(want, h.obstructs(dx * len, dy * len, zz * len), n + " samples, azimuth " + azDeg + ", dz " + zz);
                        checked++;
                        if (want) obstructed++;
                    }
                }
            }
            assertTrue(obstructed > checked / 5 && obstructed < checked * 4 / 5, obstructed + " of " + checked);
        }
    }

    /** {@code z} moved by {@code u} ulps (up for u > 0, down for u < 0). */
    private static double ulps(double z, int u) {
        for (int k = 0; k < Math.abs(u); k++) z = u > 0 ? Math.nextUp(z) : Math.nextDown(z);
        return z;
    }

    /** The rule itself (analytic): straight up is open, straight down and the horizontal are obstructed, 10 degrees over a 5 degree horizon is open. */
    @Test
    void plainDirections() {
        HorizonProfile h = HorizonProfile.constant(5);
        assertFalse(h.obstructs(0, 0, 1));
        assertTrue(h.obstructs(0, 0, -1));
        assertTrue(h.obstructs(1, 0, 0));
        double up10 = Math.tan(Math.toRadians(10)), up4 = Math.tan(Math.toRadians(4));
        assertFalse(h.obstructs(1, 0, up10));
        assertTrue(h.obstructs(0, 1, up4));
        assertFalse(HorizonProfile.NONE.obstructs(1, 0, 1e-9));
    }
}
