package org.solmass.check;

import org.solmass.climate.Step;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.model.MassingModel;
import org.solmass.model.TriangleGeometry;
import org.solmass.surface.HiddenFaces;
import org.solmass.surface.Surface;
import org.solmass.sun.SolarGeometry;
import org.solmass.sun.Site;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Checks for inputs that parse but are probably wrong. Thresholds are deliberately loose: a warning
 * should mean "almost certainly a mistake", never "an unusual but real place or building".
 */
public final class Plausibility {
    /** Taller than any building standing (the tallest is about 830 m, common practice): not metres. */
    static final double MAX_PLAUSIBLE_HEIGHT_M = 1000;
    /** Wider than any massing study of a district (common practice): not metres. */
    static final double MAX_PLAUSIBLE_EXTENT_M = 50_000;
    /** Tolerance of "on the base plane", as a share of the model's size along that axis. */
    static final double BASE_TOLERANCE = 0.01;
    /** |GHI-weighted mean hour angle| above this many degrees (half an hour) is off from solar noon. */
    static final double MAX_NOON_OFFSET_DEG = 7.5;
    /** Peak GHI below this share of the extraterrestrial horizontal peak: wrong unit (hourly data). */
    static final double MIN_PEAK_SHARE_HOURLY = 0.3;
    /** The same for monthly-average days, whose means include cloudy days. */
    static final double MIN_PEAK_SHARE_AVERAGE_DAYS = 0.15;
    /** Longitude further than this from the zone's standard meridian is suspicious, degrees. */
    static final double MERIDIAN_DISTANCE_DEG = 20;
    /** ... and a latitude within this of the meridian says the two are swapped, degrees. */
    static final double SWAPPED_FIT_DEG = 7.5;

    private Plausibility() {}

    /** All checks of a model, a site and its weather (weather may be null). */
    public static List<Warning> check(MassingModel model, Site site, WeatherSeries weather) {
        List<Warning> w = new ArrayList<>();
        w.addAll(model(model));
        w.addAll(site(site, 2025));
        if (weather != null) w.addAll(weather(weather, site));
        return w;
    }

    /** Millimetres or centimetres read as metres; a Y-up model read as Z-up. */
    public static List<Warning> model(MassingModel m) {
        List<Warning> out = new ArrayList<>();
        double[] b = m.bounds();
        double dx = b[3] - b[0], dy = b[4] - b[1], dz = b[5] - b[2];
        double extent = Math.max(dx, dy);
        if (dz > MAX_PLAUSIBLE_HEIGHT_M || extent > MAX_PLAUSIBLE_EXTENT_M) {
            out.add(new Warning("model-not-in-metres", String.format(Locale.ROOT,
                    "the model is %.0f m tall and %.0f m across as read; no building or district is that large, so it is"
                            + " probably in millimetres or centimetres read as metres: set model.unit (--unit) to %s",
                    dz, extent, unitAdvice(dz, extent))));
        }
        boolean[] used = m.usedVertices();
        double zBase = baseShare(m.vertices(), used, 2, b[2], dz), yBase = baseShare(m.vertices(), used, 1, b[1], dy);
        double[] area = orientationAreas(m);
        double vertical = area[0];
        // Blocks stand on a common ground plane (half the vertices of extruded blocks lie on it). As read,
        // that plane is one of constant y instead of z, and the model is "taller" than its depth:
        // the file's up axis is y (its roofs now stand vertical, facing +y).
        if (zBase < 0.2 && yBase >= 0.4 && dz > dy) {
            out.add(new Warning("model-y-up", String.format(Locale.ROOT,
                    "%.0f%% of the vertices lie on the plane y = %.1f but only %.0f%% on the lowest z, %.0f%% of the area"
                            + " stands vertical and the model is %.0f m tall on a %.0f m deep footprint: the blocks seem to stand"
                            + " on their side, as a model exported with y up looks when read as z up; set model.up (--up) to y",
                    100 * yBase, b[1], 100 * zBase, 100 * vertical / Math.max(1e-12, area[3]), dz, dy)));
        }
        return out;
    }

    /**
     * A block written twice under two names: faces of two blocks in the same place facing the same
     * way ({@link HiddenFaces#duplicates}); one warning per pair of blocks with their shared area.
     */
    public static List<Warning> surfaces(MassingModel m, List<Surface> surfaces) {
        Map<String, double[]> perPair = new LinkedHashMap<>();
        for (HiddenFaces.Duplicate d : HiddenFaces.duplicates(surfaces)) {
            int a = surfaces.get(d.surfaceA()).block(), b = surfaces.get(d.surfaceB()).block();
            String key = Math.min(a, b) + " " + Math.max(a, b);
            perPair.computeIfAbsent(key, k -> new double[1])[0] += d.areaM2();
        }
        List<Warning> out = new ArrayList<>();
        for (Map.Entry<String, double[]> e : perPair.entrySet()) {
            String[] ab = e.getKey().split(" ");
            String a = m.blockNames().get(Integer.parseInt(ab[0])), b = m.blockNames().get(Integer.parseInt(ab[1]));
            out.add(new Warning("model-duplicate-block", String.format(Locale.ROOT,
                    "blocks '%s' and '%s' have %.1f m2 of faces in the same place facing the same way, as a block"
                            + " written twice under two names has: areas and totals count that part twice; remove one"
                            + " copy from the model", a, b, e.getValue()[0])));
        }
        return out;
    }

    /** "mm (... m tall, ... m across)" and/or "cm (...)", whichever gives a plausible size. */
    static String unitAdvice(double heightM, double extentM) {
        List<String> ok = new ArrayList<>();
        for (org.solmass.model.LengthUnit u : plausibleUnits(heightM, extentM)) {
            double f = 1 / u.toMetres(), h = heightM / f, e = extentM / f;
            ok.add(String.format(Locale.ROOT, "%s (%.1f m tall, %.0f m across)", u.name().toLowerCase(Locale.ROOT), h, e));
        }
        return ok.isEmpty() ? "the unit it was drawn in" : String.join(" or ", ok);
    }

    /**
     * The units (millimetres, then centimetres) that give a model {@code heightM} tall and
     * {@code extentM} across as read in metres a plausible size: within the limits above, and at
     * least a storey (2.5 m) tall or 10 m across. Empty when neither does.
     */
    public static List<org.solmass.model.LengthUnit> plausibleUnits(double heightM, double extentM) {
        List<org.solmass.model.LengthUnit> ok = new ArrayList<>();
        for (org.solmass.model.LengthUnit u : new org.solmass.model.LengthUnit[] {org.solmass.model.LengthUnit.MM, org.solmass.model.LengthUnit.CM}) {
            double h = heightM * u.toMetres(), e = extentM * u.toMetres();
            if (h <= MAX_PLAUSIBLE_HEIGHT_M && e <= MAX_PLAUSIBLE_EXTENT_M && (h >= 2.5 || e >= 10)) ok.add(u);
        }
        return ok;
    }

    /**
     * Share of the used vertices (those of a face; a stray vertex says nothing of the base) within
     * {@link #BASE_TOLERANCE} of the lowest value along an axis.
     */
    private static double baseShare(double[] v, boolean[] used, int axis, double min, double size) {
        int n = v.length / 3, on = 0, count = 0;
        double tol = Math.max(1e-9, BASE_TOLERANCE * size);
        for (int i = 0; i < n; i++) {
            if (!used[i]) continue;
            count++;
            if (v[3 * i + axis] - min <= tol) on++;
        }
        return count == 0 ? 0 : on / (double) count;
    }

    /** Areas (m2): {vertical (|nz| < 0.3), facing up (nz > 0.7), facing +y (ny > 0.7), total}. */
    private static double[] orientationAreas(MassingModel m) {
        double[] v = m.vertices();
        int[] t = m.triangles();
        double[] out = new double[4];
        double[] cr = new double[3];
        for (int i = 0; i < t.length; i += 3) {
            TriangleGeometry.cross(v, t, i / 3, cr);
            double ny = cr[1], nz = cr[2];
            double len = TriangleGeometry.length(cr);
            if (len == 0) continue;
            double ar = len / 2;
            if (Math.abs(nz / len) < 0.3) out[0] += ar;
            if (nz / len > 0.7) out[1] += ar;
            if (ny / len > 0.7) out[2] += ar;
            out[3] += ar;
        }
        return out;
    }

    /** Latitude and longitude swapped, judged against the time zone's standard meridian. */
    public static List<Warning> site(Site s, int year) {
        List<Warning> out = new ArrayList<>();
        double meridian = s.standardMeridianDeg(year);
        double off = angularDistance(s.longitudeDeg(), meridian), offSwapped = angularDistance(s.latitudeDeg(), meridian);
        if (off > MERIDIAN_DISTANCE_DEG && offSwapped <= SWAPPED_FIT_DEG && Math.abs(s.longitudeDeg()) <= 90) {
            out.add(new Warning("site-lat-lon-swapped", String.format(Locale.ROOT,
                    "the longitude %.4f is %.0f degrees from the standard meridian %.1f of the zone %s, but the latitude %.4f"
                            + " is within %.0f degrees of it: latitude and longitude look swapped; site.latitude (--lat) is"
                            + " degrees north, site.longitude (--lon) degrees east",
                    s.longitudeDeg(), off, meridian, s.zone(), s.latitudeDeg(), offSwapped)));
        }
        return out;
    }

    private static double angularDistance(double a, double b) {
        double d = Math.abs(a - b) % 360;
        return d > 180 ? 360 - d : d;
    }

    /** Midday peak far from solar noon; irradiance columns in a wrong unit. */
    public static List<Warning> weather(WeatherSeries w, Site site) {
        List<Warning> out = new ArrayList<>();
        double meridian = site.standardMeridianDeg(w.steps().isEmpty() ? 2025
                : w.step(0).start().atOffset(java.time.ZoneOffset.UTC).getYear());
        double sumW = 0, sumWOmega = 0, peak = 0, extraPeak = 0;
        for (Step s : w.steps()) {
            peak = Math.max(peak, s.ghiWm2());
            extraPeak = Math.max(extraPeak, s.extraHorizontalWm2());
            double weight = s.ghiWm2() * s.weightedHours();
            if (weight <= 0) continue;
            sumW += weight;
            sumWOmega += weight * hourAngleDeg(s, site.longitudeDeg(), meridian);
        }
        if (sumW > 0) {
            double mean = sumWOmega / sumW;
            if (Math.abs(mean) > MAX_NOON_OFFSET_DEG) {
                out.add(new Warning("weather-noon-offset", String.format(Locale.ROOT,
                        "the irradiance of %s peaks %.1f h %s solar noon (GHI-weighted mean hour angle %.1f degrees):"
                                + " check that the time zone is the data's (standard time, no daylight saving) and whether"
                                + " the timestamps label the start or the end of each interval (climate.interval_label)",
                        w.source(), Math.abs(mean) / 15, mean > 0 ? "after" : "before", mean)));
            }
        }
        double minShare = w.timeBase() == TimeBase.HOURLY_YEAR ? MIN_PEAK_SHARE_HOURLY : MIN_PEAK_SHARE_AVERAGE_DAYS;
        if (extraPeak > 0 && peak > 0 && peak < minShare * extraPeak) {
            out.add(new Warning("weather-irradiance-unit", String.format(Locale.ROOT,
                    "the highest GHI of %s is %.3g W/m2, only %.1f%% of the extraterrestrial peak %.0f W/m2 on the"
                            + " horizontal: the irradiance columns are probably not in W/m2 (kWh/m2 or kW/m2 give values"
                            + " 1000 times too small, J/cm2 per hour 0.36 times); name the unit in the header, e.g. 'GHI (kWh/m2)', or give"
                            + " --irradiance-unit (study key climate.irradiance_unit)",
                    w.source(), peak, 100 * peak / extraPeak, extraPeak)));
        }
        return out;
    }

    /**
     * Hour angle at the middle of a step, degrees (negative before solar noon): solar time = local
     * standard time + 4 (longitude - standard meridian) min + equation of time, Duffie &amp; Beckman
     * (2013) eq. 1.5.2 with longitudes east positive; 15 degrees per hour, eq. 1.6.1 ff.
     */
    static double hourAngleDeg(Step s, double longitudeDeg, double meridianDeg) {
        double solarH = s.localStandardHour() + s.durationH() / 2 + 4 * (longitudeDeg - meridianDeg) / 60
                + SolarGeometry.equationOfTimeMin(s.dayOfYear()) / 60;
        double omega = 15 * (solarH - 12);
        return omega > 180 ? omega - 360 : omega < -180 ? omega + 360 : omega;
    }
}
