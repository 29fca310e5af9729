package org.solmass.metrics;

import org.solmass.sky.PreparedSky;

/**
 * The unobstructed plane with the most annual irradiation at a site, for the weather and ground
 * albedo of a run, found by search with {@link PreparedSky#sum(double, double, double)} (the same sky
 * model the pipeline uses, beam + sky diffuse + ground-reflected with the albedo's GHI).
 *
 * <p>Search (our own, docs/metrics.md): a coarse grid of tilt 0..90 deg by 5 deg and surface azimuth
 * 0..350 deg by 10 deg, then a fine grid of 1 deg over tilt +-5 deg and azimuth +-10 deg around the
 * best coarse plane. The annual sum is a smooth function of tilt and azimuth with one broad maximum
 * for ordinary climates, so the fine grid lands within 0.5 deg of it, where the sum is flat to first
 * order (a test checks no plane of a dense grid does better than the result). Ties keep the first
 * plane found (lowest tilt, then lowest azimuth), so the search is deterministic.
 *
 * @param tiltDeg tilt from horizontal, degrees
 * @param azimuthDeg surface azimuth, degrees from north clockwise
 * @param annualKwhM2 its annual irradiation, kWh/m2
 */
public record BestPlane(double tiltDeg, double azimuthDeg, double annualKwhM2) {

    public static BestPlane find(PreparedSky sky, double albedo) {
        BestPlane best = null;
        for (int t = 0; t <= 90; t += 5) {
            for (int a = 0; a < 360; a += 10) {
                best = better(best, sky, t, a, albedo);
                if (t == 0) break;     // all azimuths of a horizontal plane are the same plane
            }
        }
        double t0 = best.tiltDeg, a0 = best.azimuthDeg;
        for (int dt = -5; dt <= 5; dt++) {
            double t = t0 + dt;
            if (t < 0 || t > 90) continue;
            for (int da = -10; da <= 10; da++) {
                double a = ((a0 + da) % 360 + 360) % 360;
                best = better(best, sky, t, t == 0 ? 0 : a, albedo);
            }
        }
        return best;
    }

    private static BestPlane better(BestPlane best, PreparedSky sky, double t, double a, double albedo) {
        double v = sky.sum(t, a, albedo).annualKwhM2();
        return best == null || v > best.annualKwhM2 ? new BestPlane(t, a, v) : best;
    }
}
