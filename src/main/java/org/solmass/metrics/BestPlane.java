package org.solmass.metrics;

import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.SimpleBounds;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.BOBYQAOptimizer;
import org.solmass.sky.PreparedSky;

/**
 * The unobstructed plane with the most annual irradiation at a site, for the weather and ground
 * albedo of a run, found by search with {@link PreparedSky#sum(double, double, double)} (the same sky
 * model the pipeline uses, beam + sky diffuse + ground-reflected with the albedo's GHI).
 *
 * <p>Search (docs/metrics.md): a coarse grid of tilt 0..90 deg by 5 deg and surface azimuth 0..350
 * deg by 10 deg (649 planes) finds the one broad maximum of ordinary climates; then BOBYQA (Powell,
 * 2009, "The BOBYQA algorithm for bound constrained optimization without derivatives", Cambridge
 * NA Report NA2009/06; the Apache Commons Math implementation) refines it within tilt +-5 deg and
 * azimuth +-10 deg of the best coarse plane, from a trust region of 2.5 deg down to 0.001 deg. On
 * the sample's weather the refinement takes 14 to 17 evaluations (the former 1 deg fine grid took
 * 231) and lands within 1e-5 kWh/m2 of the maximum of a 0.02 deg grid (the 1 deg grid fell 0.009
 * kWh/m2 short). The annual sum of discrete steps is only piecewise smooth (kinks where a step's sun
 * crosses the plane's horizon), so a local search can stop on a ripple: up to 0.04 kWh/m2 (2e-5 of
 * the sum) below a 0.05 deg grid's best on clear-sky years (BestPlaneTest). The plane is reported
 * to 0.1 deg (its annual sum is that of the reported plane; the rounding costs about 0.001 kWh/m2,
 * the sum falling by about 1 kWh/m2 per deg^2 near its maximum). Deterministic: no
 * randomness, one thread. Ties keep the coarse plane found first (lowest tilt, then lowest
 * azimuth); a refined plane replaces it only when strictly better.
 *
 * @param tiltDeg tilt from horizontal, degrees (a multiple of 0.1)
 * @param azimuthDeg surface azimuth, degrees from north clockwise, in [0, 360) (a multiple of 0.1)
 * @param annualKwhM2 its annual irradiation, kWh/m2
 */
public record BestPlane(double tiltDeg, double azimuthDeg, double annualKwhM2) {
    /** Half-widths of the refinement box around the best coarse plane, degrees (one coarse step). */
    static final double TILT_BOX_DEG = 5, AZIMUTH_BOX_DEG = 10;
    /** BOBYQA's initial and final trust-region radius, degrees. */
    static final double START_RADIUS_DEG = 2.5, STOP_RADIUS_DEG = 1e-3;
    /** Evaluations the refinement may use at most (it needs fewer than 30 on ordinary climates). */
    static final int MAX_REFINE_EVALUATIONS = 500;

    public static BestPlane find(PreparedSky sky, double albedo) {
        BestPlane best = null;
        for (int t = 0; t <= 90; t += 5) {
            for (int a = 0; a < 360; a += 10) {
                best = better(best, sky, t, a, albedo);
                if (t == 0) break;     // all azimuths of a horizontal plane are the same plane
            }
        }
        double t0 = best.tiltDeg, a0 = best.azimuthDeg;
        double lo = Math.max(0, t0 - TILT_BOX_DEG), hi = Math.min(90, t0 + TILT_BOX_DEG);
        BOBYQAOptimizer opt = new BOBYQAOptimizer(5, START_RADIUS_DEG, STOP_RADIUS_DEG);
        PointValuePair p = opt.optimize(new MaxEval(MAX_REFINE_EVALUATIONS), GoalType.MAXIMIZE,
                new ObjectiveFunction(x -> sky.sum(x[0], x[1], albedo).annualKwhM2()),
                new InitialGuess(new double[] {t0, a0}),
                new SimpleBounds(new double[] {lo, a0 - AZIMUTH_BOX_DEG}, new double[] {hi, a0 + AZIMUTH_BOX_DEG}));
        double t = Math.rint(p.getPoint()[0] * 10) / 10;
        double a = Math.rint((p.getPoint()[1] % 360 + 360) % 360 * 10) / 10;
        if (t == 0 || a == 360) a = 0;
        return better(best, sky, t, a, albedo);
    }

    private static BestPlane better(BestPlane best, PreparedSky sky, double t, double a, double albedo) {
        double v = sky.sum(t, a, albedo).annualKwhM2();
        return best == null || v > best.annualKwhM2 ? new BestPlane(t, a, v) : best;
    }
}
