package org.solmass.climate;

import org.solmass.InputException;

/**
 * Completes and checks the three irradiance components of a step (interval averages, W/m2) so that
 * GHI = DNI cos(z) + DHI holds with z the zenith at the middle of the sun-up part.
 *
 * <p><b>Low-sun cut-off</b> (used everywhere): when the sun's apparent elevation at the middle of
 * the sun-up part is below {@link #LOW_SUN_ELEVATION_DEG} = 2 deg (cos z &lt; 0.0349), beam cannot
 * be separated reliably from GHI - DHI (the ratio 1/cos z blows up and timestamp errors dominate),
 * so DNI is taken as 0 and the whole GHI counts as diffuse. Above it a derived DNI is capped at the
 * extraterrestrial normal irradiance times the sun-up fraction, the excess staying in DHI. Both are
 * listed in the repair report. GHI is never changed by the closure.
 */
public final class Components {
    private Components() {}

    /** Elevation below which DNI is taken as 0 (degrees). */
    public static final double LOW_SUN_ELEVATION_DEG = 2.0;
    /** W/m2 of tolerance for sensor offsets: small negatives and night values up to this are set to 0. */
    public static final double OFFSET_TOLERANCE_WM2 = 5.0;
    /** GHI may exceed the extraterrestrial horizontal irradiance by this factor (cloud enhancement) ... */
    public static final double GHI_LIMIT_FACTOR = 1.1;
    /** ... plus this many W/m2 (twilight, timing at sunrise/sunset). */
    public static final double GHI_LIMIT_SLACK_WM2 = 25.0;

    static boolean lowSun(Slot s) {
        return s.sunUpFraction() <= 0 || s.sun().elevationDeg() < LOW_SUN_ELEVATION_DEG;
    }

    /** DNI from GHI and DHI with the low-sun cut-off and cap; returns {ghi, dni, dhi}. */
    static double[] fromGhiDhi(Slot s, double ghi, double dhi, ClimateReport.Builder rep, String where) {
        if (ghi <= 0) return new double[] {0, 0, 0};
        dhi = Math.min(dhi, ghi);
        double beamH = ghi - dhi;
        if (beamH <= 0) return new double[] {ghi, 0, ghi};
        if (lowSun(s)) {
            rep.repair("beam below the " + LOW_SUN_ELEVATION_DEG + " deg low-sun cut-off counted as diffuse", where);
            return new double[] {ghi, 0, ghi};
        }
        double cz = s.sun().cosZenith();
        double dni = beamH / cz, cap = s.extraNormalWm2() * s.sunUpFraction();
        if (dni > cap) {
            rep.repair("derived DNI capped at the extraterrestrial normal irradiance", where);
            dni = cap;
        }
        return new double[] {ghi, dni, ghi - dni * cz};
    }

    /** DHI from GHI and DNI; returns {ghi, dni, dhi}. */
    static double[] fromGhiDni(Slot s, double ghi, double dni, ClimateReport.Builder rep, String where) {
        if (ghi <= 0) return new double[] {0, 0, 0};
        if (lowSun(s)) {
            if (dni > 0) rep.repair("beam below the " + LOW_SUN_ELEVATION_DEG + " deg low-sun cut-off counted as diffuse", where);
            return new double[] {ghi, 0, ghi};
        }
        double cz = s.sun().cosZenith();
        double dhi = ghi - dni * cz;
        if (dhi < -Math.max(OFFSET_TOLERANCE_WM2, 0.05 * ghi)) {
            throw new InputException(where, String.format("DNI x cos(zenith) = %.1f W/m2 exceeds GHI = %.1f W/m2", dni * cz, ghi));
        }
        if (dhi < 0) {
            rep.repair("DNI reduced so that DNI x cos(zenith) <= GHI", where);
            dni = ghi / cz;
            dhi = 0;
        }
        return new double[] {ghi, dni, dhi};
    }

    /** DHI and DNI from GHI alone by the Erbs et al. (1982) hourly correlation; returns {ghi, dni, dhi}. */
    static double[] fromGhi(Slot s, double ghi, ClimateReport.Builder rep, String where) {
        if (ghi <= 0) return new double[] {0, 0, 0};
        double i0 = s.extraHorizontalWm2();
        double kt = i0 > 0 ? Math.min(1, ghi / i0) : 0;
        double dhi = ghi * Decomposition.erbsHourlyDiffuseFraction(kt);
        return fromGhiDhi(s, ghi, dhi, rep, where);
    }

    /**
     * The input checks of a measured or tabulated step (NaN = component not given). Throws
     * InputException naming {@code where} for: negative values below -5 W/m2, values above 5 W/m2
     * with the sun down for the whole interval, GHI above 1.1 x extraterrestrial horizontal + 25 W/m2,
     * DNI above the extraterrestrial normal irradiance, DHI above GHI + 5 W/m2. Smaller offsets are
     * set to 0 / clipped and reported. Returns the repaired {ghi, dni, dhi} (NaN kept).
     */
    static double[] check(Slot s, double ghi, double dni, double dhi, ClimateReport.Builder rep, String where) {
        return check(s, ghi, dni, dhi, rep, where, true);
    }

    /**
     * As above; {@code stepGhiLimit = false} replaces the per-step GHI limit by GHI &lt;= G0n (for
     * monthly mean hours, whose sunrise hours hold light of other days of the month; their
     * daily total is checked against H0 instead).
     */
    static double[] check(Slot s, double ghi, double dni, double dhi, ClimateReport.Builder rep, String where, boolean stepGhiLimit) {
        double[] v = {ghi, dni, dhi};
        String[] names = {"GHI", "DNI", "DHI"};
        for (int i = 0; i < 3; i++) {
            if (Double.isNaN(v[i])) continue;
            if (v[i] < -OFFSET_TOLERANCE_WM2) throw new InputException(where, names[i] + " is negative (" + v[i] + " W/m2)");
            if (v[i] < 0) { rep.repair("small negative values set to 0", where); v[i] = 0; }
            if (s.sunUpFraction() <= 0 && v[i] > 0) {
                if (v[i] > OFFSET_TOLERANCE_WM2) {
                    throw new InputException(where, names[i] + " = " + v[i] + " W/m2 while the sun is below the horizon for the whole interval"
                            + " (check the time zone, the interval label start|end, clock time with daylight saving (--clock dst) and the timestamps)");
                }
                rep.repair("small night values set to 0", where);
                v[i] = 0;
            }
        }
        if (!Double.isNaN(v[0])) {
            double limit = stepGhiLimit ? GHI_LIMIT_FACTOR * s.extraHorizontalWm2() + GHI_LIMIT_SLACK_WM2 : s.extraNormalWm2();
            if (s.sunUpFraction() > 0 && v[0] > limit) {
                throw new InputException(where, String.format("GHI = %.1f W/m2 is above what the extraterrestrial irradiance allows (%.1f W/m2 with %.2f x extraterrestrial horizontal + %.0f)",
                        v[0], limit, GHI_LIMIT_FACTOR, GHI_LIMIT_SLACK_WM2));
            }
        }
        if (!Double.isNaN(v[1]) && v[1] > s.extraNormalWm2() + 1e-9) {
            throw new InputException(where, String.format("DNI = %.1f W/m2 is above the extraterrestrial normal irradiance %.1f W/m2", v[1], s.extraNormalWm2()));
        }
        if (!Double.isNaN(v[0]) && !Double.isNaN(v[2]) && v[2] > v[0]) {
            if (v[2] > v[0] + OFFSET_TOLERANCE_WM2) {
                throw new InputException(where, String.format("DHI = %.1f W/m2 is above GHI = %.1f W/m2", v[2], v[0]));
            }
            rep.repair("DHI slightly above GHI clipped to GHI", where);
            v[2] = v[0];
        }
        return v;
    }
}
