package org.solmass.climate;

import java.time.ZoneId;
import java.time.zone.ZoneRules;
import java.util.List;

/**
 * Whether an hourly series read as standard time looks like clock time with daylight saving: the
 * centre of each day's light in the data (GHI-weighted mean hour), less the centre of the day's
 * extraterrestrial light (the solar noon of the series' own sun), is about one hour later on the days
 * with daylight saving than on the other days. Common practice (a data-quality check), no
 * published threshold: the two means must differ by 0.5 to 1.5 h, each over at least 20 days.
 */
final class ClockCheck {
    private ClockCheck() {}

    static final int MIN_DAYS = 20;

    static void warnIfClockTime(List<Step> steps, ZoneId zone, ClimateReport.Builder rep) {
        ZoneRules rules = zone.getRules();
        if (rules.isFixedOffset() || steps.isEmpty()) return;
        double[] sum = new double[2];
        int[] days = new int[2];
        double g = 0, gh = 0, x = 0, xh = 0;
        int day = steps.get(0).dayOfYear();
        boolean dst = false;
        for (int i = 0; i <= steps.size(); i++) {
            Step s = i < steps.size() ? steps.get(i) : null;
            if (s == null || s.dayOfYear() != day) {
                if (g > 0 && x > 0) {
                    int k = dst ? 1 : 0;
                    sum[k] += gh / g - xh / x;
                    days[k]++;
                }
                if (s == null) break;
                g = gh = x = xh = 0;
                day = s.dayOfYear();
            }
            double h = s.localStandardHour() + s.durationH() / 2;
            dst = rules.isDaylightSavings(s.start());
            g += s.ghiWm2();
            gh += s.ghiWm2() * h;
            x += s.extraHorizontalWm2();
            xh += s.extraHorizontalWm2() * h;
        }
        if (days[0] < MIN_DAYS || days[1] < MIN_DAYS) return;
        double shift = sum[1] / days[1] - sum[0] / days[0];
        if (shift >= 0.5 && shift <= 1.5) {
            rep.warn(String.format(java.util.Locale.ROOT, "the light of the data is centred %.1f h later, relative to the sun, on the"
                    + " %d days with daylight saving in %s than on the other %d days: the timestamps look like clock time;"
                    + " if so, read the file with --clock dst", shift, days[1], zone, days[0]));
        }
    }
}
