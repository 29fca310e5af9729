package org.solmass.sun;

import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;

/**
 * The sun over the steps of a monthly-average day (Klein 1977's recommended day, see
 * {@link SolarGeometry#kleinDayOfYear}) or over any list of interval starts (a year of timestamps).
 */
public final class SunPath {
    private SunPath() {}

    /** Reference non-leap year of the average days (calendar and Delta-T only). */
    public static final int AVERAGE_DAY_YEAR = 2025;

    /**
     * The sun of one interval.
     *
     * @param start         interval start
     * @param durationH     interval length, hours
     * @param sun           position at the middle of the sun-up part (see {@link SolarCalculator#sunUp})
     * @param sunUpFraction share of the interval with the sun up, [0, 1]
     */
    public record Sample(Instant start, double durationH, SunPosition sun, double sunUpFraction) {}

    /** Interval starts of Klein's average day of a month, every stepMinutes from 00:00 local standard time. */
    public static List<Instant> averageDayStarts(Site site, int month, int stepMinutes) {
        ZoneOffset off = site.standardOffset(AVERAGE_DAY_YEAR);
        LocalDate day = LocalDate.ofYearDay(AVERAGE_DAY_YEAR, SolarGeometry.kleinDayOfYear(month));
        List<Instant> starts = new ArrayList<>();
        for (int k = 0; k < 1440 / stepMinutes; k++) {
            LocalDateTime t = day.atStartOfDay().plusMinutes((long) k * stepMinutes);
            starts.add(t.toInstant(off));
        }
        return starts;
    }

    /** The sun over intervals of equal length starting at the given instants. */
    public static List<Sample> of(SolarCalculator calc, List<Instant> starts, long durationSec) {
        List<Sample> out = new ArrayList<>(starts.size());
        for (Instant s : starts) {
            SolarCalculator.SunUp up = calc.sunUp(s, durationSec);
            out.add(new Sample(s, durationSec / 3600.0, up.sun(), up.fraction()));
        }
        return out;
    }

    /**
     * A point of a sun-path arc.
     *
     * @param localHour    local standard time, hours (e.g. 13.5), at the middle of the sun-up part of the interval
     * @param azimuthDeg   degrees from north, clockwise
     * @param elevationDeg degrees above the horizon (apparent, refraction included)
     */
    public record ArcPoint(double localHour, double azimuthDeg, double elevationDeg) {}

    /** The sun's arc over Klein's average day of a month (1..12): the points with the sun up. */
    public record Arc(int month, List<ArcPoint> points) {
        public Arc {
            points = List.copyOf(points);
        }
    }

    /**
     * The sun over each monthly-average day (Klein's days), every {@code stepMinutes} while it is up:
     * twelve arcs, January first. A point is kept when part of its interval has the sun up and its
     * elevation is above 0.
     */
    public static List<Arc> averageDayArcs(Site site, int stepMinutes) {
        SolarCalculator calc = new SolarCalculator(site);
        ZoneOffset off = site.standardOffset(AVERAGE_DAY_YEAR);
        List<Arc> arcs = new ArrayList<>();
        for (int m = 1; m <= 12; m++) {
            List<ArcPoint> pts = new ArrayList<>();
            for (Sample s : averageDay(calc, m, stepMinutes)) {
                if (s.sunUpFraction() <= 0 || s.sun().elevationDeg() <= 0) continue;
                LocalDateTime t = LocalDateTime.ofInstant(s.start(), off);
                double hour = t.getHour() + t.getMinute() / 60.0 + s.durationH() / 2;
                pts.add(new ArcPoint(hour, s.sun().azimuthDeg(), s.sun().elevationDeg()));
            }
            arcs.add(new Arc(m, pts));
        }
        return arcs;
    }

    /** The sun over Klein's average day of a month. */
    public static List<Sample> averageDay(SolarCalculator calc, int month, int stepMinutes) {
        return of(calc, averageDayStarts(calc.site(), month, stepMinutes), stepMinutes * 60L);
    }
}
