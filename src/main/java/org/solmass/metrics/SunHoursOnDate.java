package org.solmass.metrics;

import org.solmass.model.Parallel;
import org.solmass.scene.Scene;
import org.solmass.scene.BundleTracer;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SunPosition;
import org.solmass.surface.Patch;

import java.time.Instant;
import java.time.LocalDate;
import java.time.MonthDay;
import java.time.ZoneOffset;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Hours of direct sun per patch on a calendar date: the day (00:00 to 24:00 local standard time) is
 * cut into intervals of {@code stepMinutes}; the apparent sun position at the middle of each interval
 * (NREL SPA, Reda and Andreas 2004, through {@link SolarCalculator}) stands for the whole interval.
 * An interval counts {@code stepMinutes / 60} hours for a patch when the sun is above the minimum
 * elevation, in front of the patch ({@code n . s > 0}) and not hidden: one occlusion ray per sun
 * position from {@link Scene#rayOrigin(Patch)} towards the sun ({@link Tracer#occluded}).
 *
 * <p>Midpoint sampling makes the error of a single sunlit period at most one step (half a step at
 * each end). Patches are computed in parallel, each from the same sun positions into its own slot,
 * so results do not depend on the thread count.
 *
 * <p>The sunlight-exposure levels of EN 17037:2018 "Daylight in buildings" (clause 5.3 and Annex A:
 * minimum 1.5 h, medium 3 h, high 4 h of possible sunlight on a chosen day between 1 February and
 * 21 March) are given by {@link #en17037Level}. The standard assesses a point on the inside of a
 * window; a facade or ground patch here is an indicator only.
 */
public final class SunHoursOnDate {
    /** EN 17037:2018 sunlight-exposure thresholds, hours: minimum, medium, high. */
    public static final double EN17037_MIN_H = 1.5, EN17037_MEDIUM_H = 3.0, EN17037_HIGH_H = 4.0;

    private SunHoursOnDate() {}

    /**
     * The sun positions of a date that can count: unit directions (x east, y north, z up) of the
     * interval middles where the apparent elevation is above {@code minElevationDeg}.
     *
     * @param year calendar year of the date
     * @param stepMinutes interval length, minutes (divides 1440)
     * @return flat x,y,z triples
     */
    public static double[] sunDirections(SolarCalculator calc, int year, MonthDay date, int stepMinutes,
                                         double minElevationDeg) {
        List<SunPosition> all = positions(calc, year, date, stepMinutes);
        double[] d = new double[3 * all.size()];
        int n = 0;
        for (SunPosition p : all) {
            if (!(p.elevationDeg() > minElevationDeg)) continue;
            var v = p.direction();
            d[n++] = v.x();
            d[n++] = v.y();
            d[n++] = v.z();
        }
        return java.util.Arrays.copyOf(d, n);
    }

    /** Apparent sun positions at the middle of every interval of the date, in time order. */
    public static List<SunPosition> positions(SolarCalculator calc, int year, MonthDay date, int stepMinutes) {
        if (stepMinutes <= 0 || 1440 % stepMinutes != 0) throw new IllegalArgumentException("step must divide 1440 minutes: " + stepMinutes);
        ZoneOffset off = calc.site().standardOffset(year);
        Instant start = LocalDate.of(year, date.getMonth(), date.getDayOfMonth()).atStartOfDay().toInstant(off);
        long half = stepMinutes * 30L;
        return IntStream.range(0, 1440 / stepMinutes)
                .mapToObj(k -> calc.at(start.plusSeconds(k * stepMinutes * 60L + half))).toList();
    }

    /**
     * Hours of direct sun of every patch for the given sun directions.
     *
     * @param sunDirs flat x,y,z unit directions ({@link #sunDirections})
     * @param stepHours hours each direction stands for
     * @return hours per patch, in patch order
     */
    public static double[] hours(Scene scene, List<Patch> patches, double[] sunDirs, double stepHours) {
        double[] out = new double[patches.size()];
        int m = sunDirs.length / 3;
        ThreadLocal<BundleTracer> tracers = ThreadLocal.withInitial(scene::bundleTracer);
        boolean[] far = scene.escapeBlocked(sunDirs, m); // the far horizon's answers, the same from every patch
        Parallel.forEach(patches.size(), p -> {
            BundleTracer tr = tracers.get();
            Patch q = patches.get(p);
            double[] o = new double[3];
            scene.rayOrigin(q, o);
            double nx = q.normal().x(), ny = q.normal().y(), nz = q.normal().z();
            double[] front = new double[3 * m];
            boolean[] frontFar = new boolean[m];
            int k = 0;
            for (int i = 0; i < m; i++) { // the sun directions in front of the patch, traced together
                double dx = sunDirs[3 * i], dy = sunDirs[3 * i + 1], dz = sunDirs[3 * i + 2];
                if (nx * dx + ny * dy + nz * dz <= 0) continue;
                front[3 * k] = dx;
                front[3 * k + 1] = dy;
                front[3 * k + 2] = dz;
                frontFar[k++] = far[i];
            }
            boolean[] blocked = new boolean[k];
            tr.occludedKnownFar(o[0], o[1], o[2], front, frontFar, k, blocked);
            int lit = 0;
            for (int i = 0; i < k; i++) if (!blocked[i]) lit++;
            out[p] = lit * stepHours;
        });
        return out;
    }

    /** Whether a date lies in the assessment window of EN 17037:2018 (1 February to 21 March). */
    public static boolean inEn17037Window(MonthDay d) {
        return !d.isBefore(MonthDay.of(2, 1)) && !d.isAfter(MonthDay.of(3, 21));
    }

    /**
     * EN 17037:2018 sunlight-exposure level of a number of hours: 0 below 1.5 h (not met),
     * 1 minimum (at least 1.5 h), 2 medium (at least 3 h), 3 high (at least 4 h).
     */
    public static int en17037Level(double hours) {
        if (hours >= EN17037_HIGH_H) return 3;
        if (hours >= EN17037_MEDIUM_H) return 2;
        if (hours >= EN17037_MIN_H) return 1;
        return 0;
    }

    /** Column suffix of a date, "MMDD". */
    public static String suffix(MonthDay d) {
        return String.format("%02d%02d", d.getMonthValue(), d.getDayOfMonth());
    }
}
