package org.solmass.climate;

import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SolarGeometry;
import org.solmass.sun.SunPosition;

import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;

/**
 * A time step before its weather is known: the interval, its calendar fields in local standard
 * time, its sun and its weight. Climate sources turn slots into {@link Step}s.
 */
record Slot(Instant start, double durationH, int month, int dayOfYear, double localStandardHour,
            SunPosition sun, double sunUpFraction, double extraNormalWm2, double weightDays) {

    static Slot of(SolarCalculator calc, ZoneOffset standardOffset, Instant start, long durationSec, double weightDays) {
        return of(calc.sunUp(start, durationSec), standardOffset, start, durationSec, weightDays);
    }

    static Slot of(SolarCalculator.SunUp up, ZoneOffset standardOffset, Instant start, long durationSec, double weightDays) {
        LocalDateTime lst = LocalDateTime.ofInstant(start, standardOffset);
        int doy = lst.getDayOfYear();
        double hour = lst.getHour() + lst.getMinute() / 60.0 + lst.getSecond() / 3600.0;
        return new Slot(start, durationSec / 3600.0, lst.getMonthValue(), doy, hour, up.sun(), up.fraction(),
                SolarGeometry.extraterrestrialNormalWm2(doy), weightDays);
    }

    /** Mean extraterrestrial horizontal irradiance over the interval, W/m2 (see {@link Step#extraHorizontalWm2()}). */
    double extraHorizontalWm2() {
        return sunUpFraction > 0 ? extraNormalWm2 * Math.max(0, sun.cosZenith()) * sunUpFraction : 0;
    }

    Step toStep(double ghi, double dni, double dhi, double tempC) {
        return toStep(ghi, dni, dhi, tempC, Double.NaN);
    }

    Step toStep(double ghi, double dni, double dhi, double tempC, double windMs) {
        return new Step(start, durationH, month, dayOfYear, localStandardHour, sun, sunUpFraction,
                ghi, dni, dhi, extraNormalWm2, tempC, windMs, weightDays);
    }
}
