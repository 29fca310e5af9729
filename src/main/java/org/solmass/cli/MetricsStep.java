package org.solmass.cli;

import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.metrics.BestPlane;
import org.solmass.metrics.PvZones;
import org.solmass.metrics.SunHoursOnDate;
import org.solmass.output.ResultTable;
import org.solmass.scene.Scene;
import org.solmass.sky.PreparedSky;
import org.solmass.sky.SkyModel;
import org.solmass.study.Study;
import org.solmass.sun.Site;
import org.solmass.sun.SolarCalculator;
import org.solmass.surface.PatchSet;

import java.time.MonthDay;
import java.util.Arrays;
import java.util.List;

/**
 * The metrics step of an analysis, after irradiation: sun hours on the study's dates (with the
 * EN 17037 level for dates from 1 February to 21 March) and PV roof zones. See docs/metrics.md.
 */
public final class MetricsStep {
    private MetricsStep() {}

    /**
     * What the step produced.
     *
     * @param dates the sun-hour dates
     * @param sunHours hours of direct sun, [date][patch]
     * @param pv roof suitability and zones
     */
    public record Result(List<MonthDay> dates, double[][] sunHours, PvZones.Result pv) {}

    /** Computes the metrics of a finished irradiation run (call inside the run's worker pool). */
    public static Result run(Study study, Scene scene, PatchSet patches, IrradiationResult r, WeatherSeries weather,
                             SkyModel sky) {
        Site site = study.site();
        SolarCalculator calc = new SolarCalculator(site);
        Study.SunHours sh = study.sunHours();
        double[][] hours = new double[sh.dates().size()][];
        for (int d = 0; d < hours.length; d++) {
            double[] dirs = SunHoursOnDate.sunDirections(calc, study.climate().year(), sh.dates().get(d),
                    sh.stepMinutes(), sh.minElevationDeg());
            hours[d] = SunHoursOnDate.hours(scene, patches.patches(), dirs, sh.stepMinutes() / 60.0);
        }
        BestPlane best = BestPlane.find(PreparedSky.of(weather, sky), study.albedo().ground());
        double[] loss = new double[r.size()];
        for (int p = 0; p < loss.length; p++) loss[p] = r.shadingLossPct(p);
        Study.Pv pv = study.pv();
        PvZones.Result zones = PvZones.compute(patches.patches(), patches.surfaces(), r.annual(), loss, study.patchM(), best,
                new PvZones.Settings(pv.suitablePct(), pv.minZoneM2(), pv.moduleEfficiency(), pv.performanceRatio()));
        return new Result(sh.dates(), hours, zones);
    }

    /** Adds sun_hours_MMDD (h), sun_level_MMDD (EN 17037 level, dates 02-01..03-21), pv_suitability_pct, pv_zone. */
    public static void addColumns(ResultTable tb, Result m) {
        for (int d = 0; d < m.dates().size(); d++) {
            MonthDay day = m.dates().get(d);
            String sfx = SunHoursOnDate.suffix(day);
            double[] h = m.sunHours()[d];
            tb.put("sun_hours_" + sfx, "h", h);
            if (SunHoursOnDate.inEn17037Window(day)) {
                double[] lvl = new double[h.length];
                for (int p = 0; p < h.length; p++) lvl[p] = SunHoursOnDate.en17037Level(h[p]);
                tb.put("sun_level_" + sfx, "level", lvl);
            }
        }
        tb.put("pv_suitability_pct", "%", m.pv().suitabilityPct());
        double[] zone = new double[m.pv().zoneOf().length];
        for (int p = 0; p < zone.length; p++) zone[p] = m.pv().zoneOf()[p] > 0 ? m.pv().zoneOf()[p] : Double.NaN;
        tb.put("pv_zone", "id", zone);
    }

    /** Text of the notes that go with these metrics into summary.json. */
    public static List<String> notes(Result m) {
        BestPlane b = m.pv().best();
        return Arrays.asList(
                "Sun hours on a date and sun_level (EN 17037:2018 sunlight exposure: 1 minimum >= 1.5 h, 2 medium >= 3 h, "
                        + "3 high >= 4 h, 0 below): EN 17037 is written for reference points on the inside of windows; "
                        + "values of facade and ground patches are an indicator only.",
                String.format(java.util.Locale.ROOT, "PV suitability is relative to the best unobstructed plane at the site: "
                        + "tilt %.0f deg, azimuth %.0f deg, %.1f kWh/m2 per year.", b.tiltDeg(), b.azimuthDeg(), b.annualKwhM2()));
    }
}
