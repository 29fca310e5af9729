package org.solmass.climate;

import org.junit.jupiter.api.Test;
import org.solmass.sun.SunPosition;

import java.time.Instant;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

/** The 288 month-hour slots and the month-hour means of a small invented series. */
class MonthHourTest {

    private static Step step(int month, double localHour, double durationH, double ghi, double dhi, double days) {
        return new Step(Instant.EPOCH, durationH, month, 15, localHour, new SunPosition(180, 40), 1,
                ghi, Math.max(0, ghi - dhi), dhi, 1361, Double.NaN, days);
    }

    @Test
    void everyOneOfThe288SlotsRoundTripsToItsMonthAndHour() {
        boolean[] seen = new boolean[MonthHour.SLOTS];
        for (int m = 1; m <= 12; m++) {
            for (int h = 0; h < 24; h++) {
                int k = MonthHour.index(m, h);
                assertFalse(seen[k], "slot " + k + " used twice");
                seen[k] = true;
                assertEquals(m, MonthHour.month(k));
                assertEquals(h, MonthHour.hour(k));
            }
        }
        assertEquals(288, MonthHour.SLOTS);
        assertEquals(0, MonthHour.index(1, 0));
        assertEquals(287, MonthHour.index(12, 23));
    }

    @Test
    void aStepFallsIntoTheWholeHourOfItsLocalStandardStart() {
        assertEquals(MonthHour.index(7, 13), MonthHour.slotOf(step(7, 13.75, 0.25, 500, 100, 1)));
        assertEquals(MonthHour.index(7, 13), MonthHour.slotOf(step(7, 13.0, 1, 500, 100, 1)));
        assertEquals(MonthHour.index(12, 23), MonthHour.slotOf(step(12, 23.999, 1, 0, 0, 1)));
        assertEquals(MonthHour.index(1, 0), MonthHour.slotOf(step(1, 0, 1, 0, 0, 1)));
    }

    @Test
    void monthlyTotalsAreTheStepsGhiTimesHoursOver1000() {
        // Invented series: January 10:00-11:00 in two half hours (200 and 400 W/m2, DHI 100 and 150) on a
        // day standing for 31 days; June 12:00 (800, DHI 200) standing for 30 days.
        List<Step> steps = List.of(step(1, 10.0, 0.5, 200, 100, 31), step(1, 10.5, 0.5, 400, 150, 31),
                step(6, 12.0, 1, 800, 200, 30));
        WeatherSeries w = new WeatherSeries(steps, TimeBase.AVERAGE_DAYS, "invented", new ClimateReport(List.of(), List.of()));
        MonthHourMeans m = MonthHourMeans.of(w);
        double[] ghiMonth = new double[12], dhiMonth = new double[12];
        for (Step s : steps) {     // sum of GHI x hours / 1000, by hand
            ghiMonth[s.month() - 1] += s.ghiWm2() * s.durationH() * s.weightDays() / 1000;
            dhiMonth[s.month() - 1] += s.dhiWm2() * s.durationH() * s.weightDays() / 1000;
        }
        assertEquals(9.3, ghiMonth[0], 1e-12);            // (200 + 400) x 0.5 h x 31 / 1000
        assertArrayEquals(ghiMonth, m.ghiMonthKwhM2(), 1e-12);
        assertArrayEquals(dhiMonth, m.dhiMonthKwhM2(), 1e-12);
        assertEquals(300, m.ghiWm2()[MonthHour.index(1, 10)], 1e-12);   // hour-weighted mean
        assertEquals(125, m.dhiWm2()[MonthHour.index(1, 10)], 1e-12);
        assertEquals(800, m.ghiWm2()[MonthHour.index(6, 12)], 1e-12);
        double others = 0;
        for (int k = 0; k < MonthHour.SLOTS; k++) {
            if (k != MonthHour.index(1, 10) && k != MonthHour.index(6, 12)) others += m.ghiWm2()[k];
        }
        assertEquals(0, others, 0, "slots without steps are 0");
    }
}
