package org.solmass.irradiation;

import org.solmass.climate.MonthHour;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.DiffuseParts;
import org.solmass.sky.SkyDistribution;
import org.solmass.sky.SkyModel;
import org.solmass.sky.SkyPatches;

/**
 * The weather series flattened for the per-patch kernel: one entry per sun-up step with the sun
 * vector, its direction index, its month-hour slot and its beam and circumsolar weights; and, summed
 * per month-hour slot, the plane-independent parts (sky background, horizon band, GHI, hours).
 * The sky diffuse parts are the sky model's own split ({@link SkyModel#parts}) times the step's
 * weighted hours; {@link ShadedIrradiation} adds them with {@link DiffuseParts#sum}.
 *
 * <p>Every weight is irradiance x step duration x the days the step stands for, so that summing
 * {@code weight x geometry factor} over steps gives irradiation in Wh/m2 (see {@link Step}).
 * Steps are summed into the 288 month-hour slots of {@link MonthHour}.
 */
final class StepTable {
    static final int SLOTS = MonthHour.SLOTS;

    final int count;
    final float[] sx, sy, sz;
    final int[] direction;
    final int[] slot;
    /** DNI x weighted hours, Wh/m2 per unit cos(incidence). */
    final double[] beamWh;
    /** DHI x F1 x weighted hours, Wh/m2 per unit circumsolar ratio ({@link SkyModel#circumsolarRatio}). */
    final double[] circumsolarWh;
    /**
     * Hours of sunshine the step stands for: its weighted hours when DNI is at least
     * {@link #SUNSHINE_DNI_WM2}, else 0 (WMO, Guide to Instruments and Methods of Observation,
     * WMO-No. 8, ch. 8: sunshine duration is the time with direct normal irradiance of at least 120 W/m2).
     */
    final double[] sunshineHours;
    /** Sunshine hours of the site over the whole series (same definition, unobstructed). */
    final double siteSunshineHours;
    /** The WMO threshold of sunshine duration, W/m2 of direct normal irradiance. */
    static final double SUNSHINE_DNI_WM2 = 120;
    /** cos(zenith) of the step's sun. */
    final float[] cosZenith;
    /** Per slot: sky background diffuse x weighted hours, Wh/m2 per unit sky view factor. */
    final double[] backgroundWh = new double[SLOTS];
    /** Per slot: horizon-band diffuse x weighted hours, Wh/m2 per unit sin(tilt). */
    final double[] horizonWh = new double[SLOTS];
    /** Per slot: GHI x weighted hours, Wh/m2. */
    final double[] ghiWh = new double[SLOTS];
    /** Per slot: DHI x weighted hours, Wh/m2. */
    final double[] dhiWh = new double[SLOTS];
    /** Per slot: weighted hours (days x hours the slot stands for). */
    final double[] hours = new double[SLOTS];
    /** A radiance distribution's sky patches ({@link SkyPatches#TREGENZA}), or null for a three-part sky model. */
    final SkyPatches skyPatches;
    /**
     * A radiance distribution only (else null): per slot and sky patch, the step's normalised patch
     * radiance ({@link SkyDistribution#patchRadiance}) x weighted hours, summed over the slot's steps,
     * Wh/m2 per unit cosine-weighted patch share; index {@code patch x SLOTS + slot} (patch-major, so
     * that a receiver adds one patch's row to all its slots in one vectorisable loop). The slot's
     * whole sky diffuse on a patch is the sum over patches of the patch's visible share times this.
     */
    final double[] skyWh;

    StepTable(WeatherSeries series, SunDirections dirs, SkyModel sky) {
        int n = 0;
        for (int s = 0; s < series.size(); s++) if (dirs.ofStep(s) >= 0) n++;
        count = n;
        sx = new float[n];
        sy = new float[n];
        sz = new float[n];
        direction = new int[n];
        slot = new int[n];
        beamWh = new double[n];
        circumsolarWh = new double[n];
        cosZenith = new float[n];
        sunshineHours = new double[n];
        SkyDistribution dist = sky instanceof SkyDistribution d ? d : null;
        skyPatches = dist != null ? SkyPatches.TREGENZA : null;
        int np = dist != null ? skyPatches.count() : 0;
        skyWh = dist != null ? new double[SLOTS * np] : null;
        double[] radiance = new double[np];
        double site = 0;
        int k = 0;
        for (int s = 0; s < series.size(); s++) {
            Step st = series.step(s);
            int sl = MonthHour.slotOf(st);
            double wh = st.weightedHours();
            hours[sl] += wh;
            ghiWh[sl] += st.ghiWm2() * wh;
            dhiWh[sl] += st.dhiWm2() * wh;
            DiffuseParts parts = dist != null ? DiffuseParts.NONE : sky.parts(st);
            if (dist != null && st.dhiWm2() > 0) {
                dist.patchRadiance(st, skyPatches, radiance);
                for (int p = 0; p < np; p++) skyWh[p * SLOTS + sl] += radiance[p] * wh;
            }
            if (parts != DiffuseParts.NONE) {
                backgroundWh[sl] += parts.backgroundPerSvf() * wh;
                horizonWh[sl] += parts.horizon() * wh;
            }
            int d = dirs.ofStep(s);
            if (d < 0) continue;
            var v = st.sun().direction();
            sx[k] = (float) v.x();
            sy[k] = (float) v.y();
            sz[k] = (float) v.z();
            direction[k] = d;
            slot[k] = sl;
            beamWh[k] = Math.max(0, st.dniWm2()) * wh;
            circumsolarWh[k] = parts.circumsolar() * wh;
            cosZenith[k] = (float) v.z();
            if (isSunshine(st.dniWm2())) {
                sunshineHours[k] = wh;
                site += wh;
            }
            k++;
        }
        siteSunshineHours = site;
    }

    /**
     * A table read back ({@link SunCodec}): the arrays as written; {@code perSlot} holds, in this
     * order, the background, horizon, GHI, DHI and hours per slot.
     */
    StepTable(float[] sx, float[] sy, float[] sz, int[] direction, int[] slot, double[] beamWh, double[] circumsolarWh,
              double[] sunshineHours, double siteSunshineHours, float[] cosZenith, double[][] perSlot,
              SkyPatches skyPatches, double[] skyWh) {
        this.count = sx.length;
        this.sx = sx;
        this.sy = sy;
        this.sz = sz;
        this.direction = direction;
        this.slot = slot;
        this.beamWh = beamWh;
        this.circumsolarWh = circumsolarWh;
        this.sunshineHours = sunshineHours;
        this.siteSunshineHours = siteSunshineHours;
        this.cosZenith = cosZenith;
        double[][] into = {backgroundWh, horizonWh, ghiWh, dhiWh, hours};
        for (int i = 0; i < into.length; i++) System.arraycopy(perSlot[i], 0, into[i], 0, SLOTS);
        this.skyPatches = skyPatches;
        this.skyWh = skyWh;
    }

    /** Whether a step's DNI counts as sunshine (at or above the WMO threshold). */
    static boolean isSunshine(double dniWm2) {
        return dniWm2 >= SUNSHINE_DNI_WM2;
    }
}
