package org.solmass.climate;

import org.solmass.InputException;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SolarGeometry;
import org.solmass.sun.SunPath;

import java.time.Instant;

import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.Year;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;

/** Builds the slots of the two time bases. */
final class StepGrid {
    private StepGrid() {}

    /** Reference non-leap year of the average days (its calendar and Delta-T only). */
    static final int AVERAGE_DAY_YEAR = SunPath.AVERAGE_DAY_YEAR;

    static void checkStepMinutes(int stepMinutes, String where) {
        if (stepMinutes < 1 || stepMinutes > 60 || 60 % stepMinutes != 0) {
            throw new InputException(where, "step must divide 60 minutes (1, 2, 3, 4, 5, 6, 10, 12, 15, 20, 30 or 60), got " + stepMinutes);
        }
    }

    /** Klein's average day of each month, steps of stepMinutes from 00:00 local standard time. */
    static List<List<Slot>> averageDays(SolarCalculator calc, int stepMinutes) {
        checkStepMinutes(stepMinutes, "step");
        ZoneOffset off = calc.site().standardOffset(AVERAGE_DAY_YEAR);
        List<List<Slot>> months = new ArrayList<>();
        for (int m = 1; m <= 12; m++) {
            List<Slot> slots = new ArrayList<>();
            for (Instant t : SunPath.averageDayStarts(calc.site(), m, stepMinutes)) {
                slots.add(Slot.of(calc, off, t, stepMinutes * 60L, SolarGeometry.daysInMonth(m)));
            }
            months.add(slots);
        }
        return months;
    }

    /** Every step of a calendar year (leap years included) in local standard time. */
    static List<Slot> year(SolarCalculator calc, int year, int stepMinutes) {
        checkStepMinutes(stepMinutes, "step");
        if (year < 1900 || year > 2200) throw new InputException("year", "must be in 1900..2200, got " + year);
        ZoneOffset off = calc.site().standardOffset(year);
        int n = Year.of(year).length() * 1440 / stepMinutes;
        LocalDateTime t0 = LocalDate.of(year, 1, 1).atStartOfDay();
        List<Slot> slots = new ArrayList<>(n);
        Instant first = t0.toInstant(off);
        SolarCalculator.SunUp[] up = calc.sunUpSequence(first, stepMinutes * 60L, n);
        for (int k = 0; k < n; k++) {
            slots.add(Slot.of(up[k], off, first.plusSeconds(k * stepMinutes * 60L), stepMinutes * 60L, 1));
        }
        return slots;
    }
}
