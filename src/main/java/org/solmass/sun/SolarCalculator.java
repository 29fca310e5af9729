package org.solmass.sun;

import net.e175.klaus.solarpositioning.DeltaT;
import net.e175.klaus.solarpositioning.SPA;
import net.e175.klaus.solarpositioning.SolarPosition;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;

/**
 * Solar position by the NREL Solar Position Algorithm (Reda &amp; Andreas 2004, Solar Energy 76(5)
 * 577-589; corrigendum 2007; NREL/TP-560-34302 rev. 2008), through the library
 * net.e175.klaus:solarpositioning (SPA class). Stated accuracy +/-0.0003 deg for years -2000..6000.
 *
 * <p>Refraction: the SPA's atmospheric refraction correction (Bennett-type, SPA eq. 42) is applied
 * with the pressure and temperature of {@link Atmosphere}; by default the pressure of the ISO 2533
 * standard atmosphere at the site's elevation and 15 C minus 6.5 K/km. So zenith angles are
 * <em>apparent</em>: the sun counts as up while its apparent centre is above the horizon.
 * Delta-T (TT - UT) defaults to the Espenak &amp; Meeus polynomial estimate of {@link DeltaT}.
 */
public final class SolarCalculator {
    private final Site site;
    private final Atmosphere atmosphere;

    /**
     * Atmospheric inputs of the SPA.
     *
     * @param pressureMbar  annual mean local pressure, mbar (hPa)
     * @param temperatureC  annual mean local temperature, degrees C
     * @param deltaTSeconds TT - UT in seconds, or NaN to estimate it from the date
     */
    public record Atmosphere(double pressureMbar, double temperatureC, double deltaTSeconds) {
        /** ISO 2533 standard atmosphere at the elevation (common practice), Delta-T estimated. */
        public static Atmosphere standard(double elevationM) {
            double p = 1013.25 * Math.pow(1 - 2.25577e-5 * elevationM, 5.25588);
            return new Atmosphere(p, 15.0 - 0.0065 * elevationM, Double.NaN);
        }
    }

    public SolarCalculator(Site site) {
        this(site, Atmosphere.standard(site.elevationM()));
    }

    public SolarCalculator(Site site, Atmosphere atmosphere) {
        this.site = site;
        this.atmosphere = atmosphere;
    }

    public Site site() { return site; }

    /** Apparent sun position at an instant. */
    public SunPosition at(Instant t) {
        ZonedDateTime utc = ZonedDateTime.ofInstant(t, ZoneOffset.UTC);
        double dt = Double.isNaN(atmosphere.deltaTSeconds()) ? DeltaT.estimate(utc.toLocalDate()) : atmosphere.deltaTSeconds();
        SolarPosition p = SPA.calculateSolarPosition(utc, site.latitudeDeg(), site.longitudeDeg(),
                site.elevationM(), dt, atmosphere.pressureMbar(), atmosphere.temperatureC());
        return new SunPosition(p.azimuth(), p.zenithAngle());
    }

    /**
     * The part of an interval during which the sun is up, and the sun position at the middle of
     * that part. Sunrise and sunset inside the interval are located by bisection to 10 s, with the
     * sun tested at the interval's start, middle and end; an interval is assumed to hold at most one
     * sunrise and one sunset (true for steps up to a few hours). When the sun sets and rises again
     * inside one interval, the position is that of the longer sun-up part.
     *
     * @param start       interval start
     * @param durationSec interval length, seconds
     */
    public SunUp sunUp(Instant start, long durationSec) {
        return sunUp(start, durationSec, at(start), at(start.plusSeconds(durationSec)));
    }

    /**
     * {@link #sunUp(Instant, long)} for n contiguous intervals of equal length from {@code first}:
     * each boundary position is computed once.
     */
    public SunUp[] sunUpSequence(Instant first, long durationSec, int n) {
        SunUp[] out = new SunUp[n];
        SunPosition prev = at(first);
        for (int k = 0; k < n; k++) {
            Instant s = first.plusSeconds(k * durationSec);
            SunPosition next = at(s.plusSeconds(durationSec));
            out[k] = sunUp(s, durationSec, prev, next);
            prev = next;
        }
        return out;
    }

    private SunUp sunUp(Instant start, long durationSec, SunPosition pStart, SunPosition pEnd) {
        Instant mid = start.plusSeconds(durationSec / 2);
        SunPosition pMid = at(mid);
        boolean upS = up(pStart), upE = up(pEnd), upM = up(pMid);
        double riseSec, setSec; // sun-up part [riseSec, setSec] from start
        if (upS && upE) {
            if (upM) return new SunUp(1, pMid);
            // sets and rises again inside the interval (near the polar day): the longer sun-up part
            double set = crossing(start, 0, durationSec / 2.0, true), rise = crossing(start, durationSec / 2.0, durationSec, false);
            double midUp = set > durationSec - rise ? set / 2 : (rise + durationSec) / 2;
            return new SunUp(1 - (rise - set) / durationSec, clampUp(at(start.plusMillis(Math.round(1000 * midUp)))));
        } else if (!upS && !upE) {
            if (!upM) return new SunUp(0, pMid);
            riseSec = crossing(start, 0, durationSec / 2.0, false);
            setSec = crossing(start, durationSec / 2.0, durationSec, true);
        } else if (upS) {
            riseSec = 0;
            setSec = crossing(start, 0, durationSec, true);
        } else {
            riseSec = crossing(start, 0, durationSec, false);
            setSec = durationSec;
        }
        double frac = (setSec - riseSec) / durationSec;
        return new SunUp(frac, clampUp(at(start.plusMillis(Math.round(500 * (riseSec + setSec))))));
    }

    /** A sun-up middle found by bisection may sit a hair below the horizon: put it on the horizon. */
    private static SunPosition clampUp(SunPosition p) {
        return up(p) ? p : new SunPosition(p.azimuthDeg(), Math.min(p.zenithDeg(), 90.0));
    }

    /**
     * @param fraction share of the interval with the sun up, [0, 1]
     * @param sun      position at the middle of the sun-up part (at the interval's middle if 0)
     */
    public record SunUp(double fraction, SunPosition sun) {}

    private static boolean up(SunPosition p) { return p.zenithDeg() < 90.0; }

    /** Bisection for the horizon crossing in [a, b] seconds from start; upAtA says the sun is up at a. */
    private double crossing(Instant start, double a, double b, boolean upAtA) {
        while (b - a > 10) {
            double m = 0.5 * (a + b);
            boolean u = up(at(start.plusMillis(Math.round(m * 1000))));
            if (u == upAtA) a = m; else b = m;
        }
        return 0.5 * (a + b);
    }
}
