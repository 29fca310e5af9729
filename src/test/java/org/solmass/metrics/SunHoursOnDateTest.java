package org.solmass.metrics;

import org.junit.jupiter.api.Test;
import org.solmass.model.MassingModel;
import org.solmass.model.Vec3;
import org.solmass.scene.Scene;
import org.solmass.sun.Site;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SunPosition;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.time.MonthDay;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SunHoursOnDateTest {
    static final int YEAR = 2025, STEP = 5;
    static final double LAT = 51.0;
    static final SolarCalculator CALC = new SolarCalculator(new Site(LAT, 10.0, 0, ZoneOffset.ofHours(1)));

    private static Patch patch(Vec3 centroid, Vec3 normal, SurfaceKind kind) {
        double tilt = Math.toDegrees(Math.acos(normal.z()));
        double az = Math.hypot(normal.x(), normal.y()) < 1e-9 ? 0 : (Math.toDegrees(Math.atan2(normal.x(), normal.y())) + 360) % 360;
        return new Patch(0, "P", 0, "b", 0, kind, centroid, normal, 1.0, tilt, az, new double[0]);
    }

    /** Sun hours counted from the same sun positions with a caller's test of "sunlit". */
    private static double analyticHours(MonthDay d, double minEl, java.util.function.Predicate<Vec3> sunlit) {
        int n = 0;
        for (SunPosition p : SunHoursOnDate.positions(CALC, YEAR, d, STEP)) {
            if (p.elevationDeg() > minEl && sunlit.test(p.direction())) n++;
        }
        return n * STEP / 60.0;
    }

    /**
     * Ground points north of a long east-west wall (height H, north face on y = 0) against the shadow
     * of an infinite wall (plane geometry): a point at distance d is shaded when the sun is south of
     * the wall (s_y &lt; 0) and the ray to it crosses y = 0 below the top, d s_z / (-s_y) &lt; H.
     * The wall runs 600 m, more than 2 x H cot(5 deg) = 229 m, so every counted shadow ray meets it.
     */
    @Test
    void groundNorthOfALongWallGetsTheHoursOfTheInfiniteWallShadow() {
        double h = 10;
        MassingModel m = new Obj().block("wall").box(-300, -1, 300, 0, h).model();
        Scene scene = Scene.build(m, true, 0);
        for (String date : List.of("03-21", "06-21", "12-21", "02-15")) {
            MonthDay d = MonthDay.parse("--" + date);
            double[] dirs = SunHoursOnDate.sunDirections(CALC, YEAR, d, STEP, 5.0);
            List<Patch> pts = new ArrayList<>();
            double[] dist = {1, 3, 6, 12, 25};
            for (double y : dist) pts.add(patch(new Vec3(7.3, y, 0), new Vec3(0, 0, 1), SurfaceKind.GROUND));
            double[] got = SunHoursOnDate.hours(scene, pts, dirs, STEP / 60.0);
            for (int i = 0; i < dist.length; i++) {
                double dd = dist[i];
                double want = analyticHours(d, 5.0, s -> s.y() >= 0 || dd * s.z() / -s.y() >= h);
                assertEquals(want, got[i], 1e-9, date + " at " + dd + " m");
            }
        }
    }

    /**
     * A free north-facing facade patch (nothing to its north) on the June solstice gets exactly the
     * steps with the sun north of its plane (s_y &gt; 0) and above the minimum elevation; the same
     * count by the closed form of Duffie and Beckman (2013), eqs. 1.6.1 (declination, Cooper 1969),
     * 1.6.5 (elevation) and the prime-vertical crossing cos w = tan(delta)/tan(phi): at latitude 51
     * deg with delta = 23.44 deg and 5 deg minimum elevation, 2 (w_5 - w_pv)/15 = 5.76 h. Tolerance
     * 0.2 h: midpoint sampling errs by at most half a 5-minute step at each of the four crossings
     * (0.17 h) and refraction at 5 deg elevation (0.16 deg) shifts the two low crossings by about
     * a minute each (SPA uses apparent elevations, the closed form true ones).
     */
    @Test
    void northFacadeOnTheJuneSolsticeGetsTheHoursTheSunIsNorthOfItsPlane() {
        MassingModel m = new Obj().block("b").box(-10, -10, 10, 0, 10).model();
        Scene scene = Scene.build(m, true, 0);
        Patch north = patch(new Vec3(0, 0, 5), new Vec3(0, 1, 0), SurfaceKind.FACADE);
        MonthDay june = MonthDay.of(6, 21);
        double got = SunHoursOnDate.hours(scene, List.of(north), SunHoursOnDate.sunDirections(CALC, YEAR, june, STEP, 5.0), STEP / 60.0)[0];
        assertEquals(analyticHours(june, 5.0, s -> s.y() > 0), got, 1e-9);

        double phi = Math.toRadians(LAT), delta = Math.toRadians(23.44), h0 = Math.toRadians(5);
        double wPv = Math.acos(Math.tan(delta) / Math.tan(phi));
        double w5 = Math.acos((Math.sin(h0) - Math.sin(phi) * Math.sin(delta)) / (Math.cos(phi) * Math.cos(delta)));
        double closed = 2 * Math.toDegrees(w5 - wPv) / 15;
        assertEquals(5.76, closed, 0.01);
        assertEquals(closed, got, 0.2);
    }

    /**
     * At the equinox the sun is north of an east-west facade only while it is within about half a
     * degree of the horizon (on 21 March, declination about +0.4 deg, it crosses the prime vertical
     * at sin h = sin delta / sin phi, h = 0.5 deg, Duffie and Beckman 2013 eq. 1.6.5 with w at the
     * prime vertical). So with the default 5 deg minimum elevation (indeed any minimum of 1 deg or
     * more) a north facade gets exactly 0 h; with 0 deg it gets the few 5-minute steps right after
     * sunrise and before sunset, here exactly the steps with s_y &gt; 0 and elevation above 0.
     */
    @Test
    void northFacadeAtTheEquinoxesGetsNoSunAboveOneDegree() {
        MassingModel m = new Obj().block("b").box(-10, -10, 10, 0, 10).model();
        Scene scene = Scene.build(m, true, 0);
        Patch north = patch(new Vec3(0, 0, 5), new Vec3(0, 1, 0), SurfaceKind.FACADE);
        for (MonthDay d : List.of(MonthDay.of(3, 21), MonthDay.of(9, 23))) {
            for (double minEl : new double[] {1.0, 5.0}) {
                assertEquals(0.0, SunHoursOnDate.hours(scene, List.of(north),
                        SunHoursOnDate.sunDirections(CALC, YEAR, d, STEP, minEl), STEP / 60.0)[0], 0.0, d + " min " + minEl);
            }
            double low = SunHoursOnDate.hours(scene, List.of(north), SunHoursOnDate.sunDirections(CALC, YEAR, d, STEP, 0.0), STEP / 60.0)[0];
            assertEquals(analyticHours(d, 0.0, s -> s.y() > 0), low, 1e-9);
            assertTrue(low <= 4 * STEP / 60.0, d + ": " + low + " h north of the facade with the sun above 0 deg");
        }
    }

    /** EN 17037:2018 sunlight exposure: minimum 1.5 h, medium 3 h, high 4 h; the window 1 February to 21 March. */
    @Test
    void en17037LevelsAndWindowFollowTheStandard() {
        assertEquals(0, SunHoursOnDate.en17037Level(1.49));
        assertEquals(1, SunHoursOnDate.en17037Level(1.5));
        assertEquals(1, SunHoursOnDate.en17037Level(2.99));
        assertEquals(2, SunHoursOnDate.en17037Level(3.0));
        assertEquals(3, SunHoursOnDate.en17037Level(4.0));
        assertTrue(SunHoursOnDate.inEn17037Window(MonthDay.of(2, 1)));
        assertTrue(SunHoursOnDate.inEn17037Window(MonthDay.of(3, 21)));
        assertTrue(!SunHoursOnDate.inEn17037Window(MonthDay.of(1, 31)));
        assertTrue(!SunHoursOnDate.inEn17037Window(MonthDay.of(3, 22)));
    }

    /** An unobstructed roof (horizontal, nothing around) gets every step with the sun above the minimum. */
    @Test
    void freeRoofGetsEveryStepAboveTheMinimumElevation() {
        MassingModel m = new Obj().block("b").box(0, 0, 10, 10, 5).model();
        Scene scene = Scene.build(m, true, 0);
        Patch roof = patch(new Vec3(5, 5, 5), new Vec3(0, 0, 1), SurfaceKind.ROOF);
        MonthDay d = MonthDay.of(3, 21);
        double[] dirs = SunHoursOnDate.sunDirections(CALC, YEAR, d, STEP, 5.0);
        assertEquals(dirs.length / 3 * STEP / 60.0, SunHoursOnDate.hours(scene, List.of(roof), dirs, STEP / 60.0)[0], 1e-12);
    }

    /** Same hours whatever the worker count (each patch from the same sun positions into its own slot). */
    @Test
    void hoursDoNotDependOnTheThreadCount() throws Exception {
        MassingModel m = new Obj().block("a").box(0, 0, 10, 30, 20).block("b").box(14, 0, 24, 30, 8).model();
        Scene scene = Scene.build(m, true, 0);
        List<Patch> pts = new ArrayList<>();
        for (int i = 0; i < 200; i++) pts.add(patch(new Vec3(10.5 + (i % 7) * 0.5, i * 0.15, 0), new Vec3(0, 0, 1), SurfaceKind.GROUND));
        double[] dirs = SunHoursOnDate.sunDirections(CALC, YEAR, MonthDay.of(3, 21), STEP, 5.0);
        double[][] out = new double[2][];
        int[] threads = {1, 3};
        for (int k = 0; k < 2; k++) {
            java.util.concurrent.ForkJoinPool pool = new java.util.concurrent.ForkJoinPool(threads[k]);
            try {
                out[k] = pool.submit(() -> SunHoursOnDate.hours(scene, pts, dirs, STEP / 60.0)).get();
            } finally {
                pool.shutdown();
            }
        }
        org.junit.jupiter.api.Assertions.assertArrayEquals(out[0], out[1]);
    }
}
