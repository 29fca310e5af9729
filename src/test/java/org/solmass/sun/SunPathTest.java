package org.solmass.sun;

import net.e175.klaus.solarpositioning.SPA;
import net.e175.klaus.solarpositioning.SunriseResult;
import org.junit.jupiter.api.Test;

import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class SunPathTest {

    /**
     * The sun-up fractions of an average day add up to the day length between the SPA library's own
     * rise and set for the sun's true centre at -0.5667 deg (the apparent centre on the horizon),
     * within 2 min (refraction at the site's standard pressure differs from the SPA's 1010 mbar).
     */
    @Test
    void sunUpFractionsOfADaySumToTheDayLength() {
        for (double lat : new double[] {-50, -20, 0, 35, 60}) {
            Site site = new Site(lat, 10, 0, ZoneOffset.ofHours(1));
            SolarCalculator calc = new SolarCalculator(site);
            for (int m = 1; m <= 12; m += 3) {
                List<SunPath.Sample> day = SunPath.averageDay(calc, m, 60);
                assertEquals(24, day.size());
                double hours = 0;
                for (SunPath.Sample s : day) hours += s.sunUpFraction() * s.durationH();
                ZonedDateTime noon = ZonedDateTime.ofInstant(day.get(12).start(), ZoneOffset.ofHours(1));
                SunriseResult r = SPA.calculateSunriseTransitSet(noon, lat, 10, 69, -0.5667);
                var rd = (SunriseResult.RegularDay) r;
                double spa = (rd.sunset().toEpochSecond() - rd.sunrise().toEpochSecond()) / 3600.0;
                assertEquals(spa, hours, 2.0 / 60, "lat " + lat + " month " + m);
                for (SunPath.Sample s : day) {
                    if (s.sunUpFraction() > 0) assertTrue(s.sun().zenithDeg() <= 90, "sun-up middle is above the horizon");
                    else assertTrue(s.sun().zenithDeg() > 90, "night interval");
                }
            }
        }
    }

    /** At the equator on the average day of March the sun is up about 12 h (common practice). */
    @Test
    void equinoxDayAtTheEquatorIsTwelveHours() {
        SolarCalculator calc = new SolarCalculator(new Site(0, 0, 0, ZoneOffset.UTC));
        double h = 0;
        for (SunPath.Sample s : SunPath.averageDay(calc, 3, 15)) h += s.sunUpFraction() * s.durationH();
        assertEquals(12.1, h, 0.1, "12 h plus refraction (about 4-5 min)");
    }

    /**
     * The highest point of the June and December arcs at 51 deg N is the noon elevation
     * 90 - latitude + declination, with the declination of Klein's days (162 and 344) from Cooper's
     * equation, delta = 23.45 sin(360 (284 + n) / 365) (Cooper, P. I., 1969, "The absorption of
     * radiation in solar stills", Solar Energy 12(3):333-346): +23.09 and -23.05 deg. Within 1 deg
     * (Cooper's equation is approximate; 20-minute points miss noon by at most 10 min, under 0.1 deg).
     */
    @Test
    void averageDayArcsPeakAtTheNoonElevationOfTheirDeclination() {
        Site site = new Site(51, 10, 0, ZoneOffset.ofHours(1));
        List<SunPath.Arc> arcs = SunPath.averageDayArcs(site, 20);
        assertEquals(12, arcs.size());
        for (int m = 1; m <= 12; m++) {
            SunPath.Arc a = arcs.get(m - 1);
            assertEquals(m, a.month());
            double lastHour = -1;
            for (SunPath.ArcPoint p : a.points()) {
                assertTrue(p.elevationDeg() > 0, "only points with the sun up");
                assertTrue(p.localHour() > lastHour, "points in time order");
                lastHour = p.localHour();
            }
        }
        assertEquals(90 - 51 + 23.09, maxElevation(arcs.get(5)), 1.0);
        assertEquals(90 - 51 - 23.05, maxElevation(arcs.get(11)), 1.0);
    }

    private static double maxElevation(SunPath.Arc a) {
        double e = Double.NEGATIVE_INFINITY;
        for (SunPath.ArcPoint p : a.points()) e = Math.max(e, p.elevationDeg());
        return e;
    }
}
