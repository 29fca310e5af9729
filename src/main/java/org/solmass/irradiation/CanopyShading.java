package org.solmass.irradiation;

import org.solmass.scene.Canopy;
import org.solmass.scene.HemisphereSampler;

/**
 * Month-by-month attenuation by tree crowns of the rays the opaque scene lets through: the sun
 * directions, the hemisphere rays that reach the sky and the Perez horizon-band rays
 * (docs/method.md, "Vegetation").
 *
 * <p>Model: each crown crossing passes the fraction {@code t_m} of month {@code m}, crossings multiply,
 * so a ray crossing {@code k} crowns passes {@code t_m^k}. This is Beer-Lambert attenuation
 * {@code exp(-G LAD l)} (Monsi and Saeki, 1953, "Uber den Lichtfaktor in den Pflanzengesellschaften
 * und seine Bedeutung fur die Stoffproduktion", Japanese Journal of Botany 14, 22-52) with the path
 * length {@code l} through a crown replaced by one typical crossing, as massing-level tools commonly
 * do (common practice): a crown's measured transmittance already averages its path lengths
 * (Heisler, 1986, Urban Ecology 9, 337-359).
 * <ul>
 * <li>beam and circumsolar diffuse: {@code V_sun} becomes {@code t_m^k} for a direction the opaque
 * scene lets through;</li>
 * <li>isotropic sky diffuse: the sky view factor of month {@code m} is
 * {@code (1/N) sum over the hemisphere rays that reach the sky of t_m^k} (the cosine-weighted rays
 * carry equal weights), in place of the opaque SVF;</li>
 * <li>a radiance distribution (Perez 1993, CIE skies): the visible share of each sky patch in month
 * {@code m} is its unobstructed share times the mean of {@code t_m^k} over the patch's rays (0 for a
 * ray the opaque scene stops), in place of the fraction of its rays that reach the sky
 * ({@link SkyPatchView#throughCrowns});</li>
 * <li>horizon band: each band ray's weight times {@code t_m^k}.</li>
 * <li>reflected, on every leg of every bounce: each receiver's hemisphere rays that hit an opaque face
 * or the ground carry the transmittance of the crowns before the hit in their reflector weights,
 * {@code w_rj = (1/N) sum over the rays that hit j of rho tau(k)}, {@code tau(k)} the year mean of
 * {@code t_m^k} (months weighted by GHI), and so does the weight of GHI-lit hits; exact when the
 * transmittance is the same all year. The sparse reflection sum keeps one weight per reflector, not
 * one per month, so with a transmittance that changes over the year the last leg, onto an analysed
 * patch, is corrected to its month by {@code c_m = sum rho t_m^k / sum rho tau(k)} over its rays (exact
 * when its reflectors behind crowns receive what the others receive on average), and the legs between
 * reflectors keep the year mean (docs/method.md gives a worked case). Crowns themselves do not
 * reflect.</li>
 * </ul>
 * With {@code t_m = 1} every factor is exactly 1 and the results are those of the model without the
 * trees; with {@code t_m = 0} a crossed crown blocks like an opaque block that does not reflect.
 */
public final class CanopyShading {
    private final Canopy canopy;
    /** {@code power[m][k] = t_m^k}, k = 0 .. the most crossings a ray can count. */
    private final double[][] power;

    /**
     * @param canopy the tree crowns
     * @param transmittance per month, index 0 = January, each in [0, 1]
     */
    public CanopyShading(Canopy canopy, double[] transmittance) {
        if (transmittance.length != 12) throw new IllegalArgumentException("12 monthly transmittances expected");
        this.canopy = canopy;
        int kMax = (Canopy.MAX_SURFACES + 1) / 2;
        power = new double[12][kMax + 1];
        for (int m = 0; m < 12; m++) {
            if (!(transmittance[m] >= 0 && transmittance[m] <= 1)) throw new IllegalArgumentException("transmittance outside [0, 1]");
            power[m][0] = 1;
            for (int k = 1; k <= kMax; k++) power[m][k] = power[m][k - 1] * transmittance[m];
        }
    }

    public Canopy canopy() { return canopy; }

    /** Transmittance of {@code k} crossings in month {@code month0} (0 = January): {@code t^k}. */
    public double factor(int month0, int k) { return power[month0][k]; }

    /**
     * A new per-thread probe for up to {@code sunDirections} sun directions; the reflection weights'
     * year-mean factor {@code tau(k)} weights the months by the site's GHI of the step table.
     */
    Probe probe(int sunDirections, StepTable steps) { return new Probe(sunDirections, steps); }

    /**
     * {@code tau(k) = sum_m G_m t_m^k / sum_m G_m}, k = 0 .. the most crossings: the year mean of the
     * transmittance of k crossings, months weighted by their GHI {@code G_m} (each month alike when
     * there is none); exactly {@code t^k} when {@code t} is the same all year, exactly 1 for k = 0.
     */
    private double[] yearMean(StepTable steps) {
        double[] g = new double[12];
        if (steps != null) for (int k = 0; k < StepTable.SLOTS; k++) g[org.solmass.climate.MonthHour.month(k) - 1] += steps.ghiWh[k];
        double all = 0;
        for (double x : g) all += x;
        if (!(all > 0)) java.util.Arrays.fill(g, 1.0);
        double[] tau = new double[power[0].length];
        for (int k = 0; k < tau.length; k++) {
            boolean same = true;
            for (int m = 1; m < 12; m++) same &= power[m][k] == power[0][k];
            if (same) {
                tau[k] = power[0][k];
                continue;
            }
            double num = 0, den = 0;
            for (int m = 0; m < 12; m++) {
                num += g[m] * power[m][k];
                den += g[m];
            }
            tau[k] = num / den;
        }
        return tau;
    }

    /** Per-thread state of one receiver's canopy factors; no allocation per ray. */
    final class Probe {
        private final Canopy.Counter counter = canopy.counter();
        /** Crossings per sun direction of the current receiver (meaningful where the opaque scene lets it through). */
        final byte[] sunCrossings;
        /** Per month: the sky view factor weighted by the transmittance, and the visible horizon-band share. */
        final double[] skyMonth = new double[12], horizonMonth = new double[12];

        /** {@code tau(k)}: the year-mean transmittance of k crossings ({@link #yearMean}). */
        private final double[] tau;
        /** Crossings of each hemisphere ray of the current receiver that hits something, up to the hit (set by {@link #hits}). */
        private byte[] hitCrossings = new byte[0];

        Probe(int sunDirections, StepTable steps) {
            sunCrossings = new byte[sunDirections];
            tau = yearMean(steps);
        }

        /**
         * Crossings of the hemisphere rays that hit something ({@code cls} not sky), each up to its hit
         * at {@code dist}; call before {@link #hitFactor} and {@link #reflection} for the same rays.
         */
        void hits(double ox, double oy, double oz, double[] dir, int[] cls, double[] dist, int rays) {
            if (hitCrossings.length < rays) hitCrossings = new byte[rays];
            for (int s = 0; s < rays; s++) {
                if (cls[s] == HemisphereSampler.SKY) continue;
                hitCrossings[s] = (byte) counter.crossings(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], dist[s]);
            }
        }

        /**
         * The year-mean factor {@code tau(k)} of hemisphere ray {@code s} (a hit): the factor its
         * reflector weight carries, so that every leg of every bounce passes the crowns its own ray
         * crosses (docs/method.md, "Vegetation"); 1 exactly for a ray that crosses none.
         */
        double hitFactor(int s) { return tau[hitCrossings[s]]; }

        /** Crossings of the sun directions the opaque bundle let through ({@code blocked[i]} false). */
        void sun(double ox, double oy, double oz, double[] dir, int[] sunIndex, int count, boolean[] blocked) {
            for (int i = 0; i < count; i++) {
                if (blocked[i]) continue;
                sunCrossings[sunIndex[i]] = (byte) counter.crossings(ox, oy, oz, dir[3 * i], dir[3 * i + 1], dir[3 * i + 2],
                        Double.POSITIVE_INFINITY);
            }
        }

        /** Crown crossings of one ray to the sky from {@code o} along the unit vector {@code d}. */
        int crossings(double ox, double oy, double oz, double dx, double dy, double dz) {
            return counter.crossings(ox, oy, oz, dx, dy, dz, Double.POSITIVE_INFINITY);
        }

        /** {@code t_m^k}: the transmittance of {@code k} crossings in month {@code month0} (0 = January). */
        double factor(int month0, int k) { return power[month0][k]; }

        /** Factor of the beam of a sun direction in month {@code month0} (0 = January). */
        double sunFactor(int month0, int direction) { return power[month0][sunCrossings[direction]]; }

        /** Crossings of each hemisphere ray of the current receiver that reaches the sky (set by {@link #sky}). */
        byte[] skyCrossings = new byte[0];

        /**
         * Per month: {@code (1/N) sum t_m^k} over the hemisphere rays that reach the sky; keeps each
         * such ray's crossings in {@link #skyCrossings} (for a radiance distribution's sky patches,
         * {@link SkyPatchView#throughCrowns}).
         */
        void sky(double ox, double oy, double oz, double[] dir, int[] cls, int rays) {
            java.util.Arrays.fill(skyMonth, 0);
            if (skyCrossings.length < rays) skyCrossings = new byte[rays];
            for (int s = 0; s < rays; s++) {
                if (cls[s] != HemisphereSampler.SKY) continue;
                int k = counter.crossings(ox, oy, oz, dir[3 * s], dir[3 * s + 1], dir[3 * s + 2], Double.POSITIVE_INFINITY);
                skyCrossings[s] = (byte) k;
                for (int m = 0; m < 12; m++) skyMonth[m] += power[m][k];
            }
            for (int m = 0; m < 12; m++) skyMonth[m] /= rays;
        }

        /**
         * Per month, the last leg's correction from the year mean to the month:
         * {@code c_m = sum rho t_m^k / sum rho tau(k)} over the hemisphere rays that hit something
         * ({@code cls} not sky), {@code rho} the hit triangle's albedo (the ground albedo for the ground
         * plane), {@code k} the crowns before the hit ({@link #hits}); 1 when nothing is hit or when
         * no hit crosses a crown. Exactly 1 when the transmittance is the same all year.
         */
        void reflection(int[] cls, int[] tri, int rays, float[] albedo, double groundAlbedo, float[] out) {
            double[] num = reflectionSum;
            java.util.Arrays.fill(num, 0);
            double den = 0;
            for (int s = 0; s < rays; s++) {
                if (cls[s] == HemisphereSampler.SKY) continue;
                double rho = tri[s] >= 0 ? albedo[tri[s]] : groundAlbedo;
                int k = hitCrossings[s];
                den += rho * tau[k];
                for (int m = 0; m < 12; m++) num[m] += rho * power[m][k];
            }
            for (int m = 0; m < 12; m++) out[m] = den > 0 ? (float) (num[m] / den) : 1f;
        }

        private final double[] reflectionSum = new double[12];

        /** Per month: the visible share of the horizon band, each band ray weighted by {@code w t_m^k}. */
        void horizon(double ox, double oy, double oz, double[] dir, double[] weight, int count, boolean[] blocked, double all) {
            java.util.Arrays.fill(horizonMonth, 0);
            for (int i = 0; i < count; i++) {
                if (blocked[i]) continue;
                int k = counter.crossings(ox, oy, oz, dir[3 * i], dir[3 * i + 1], dir[3 * i + 2], Double.POSITIVE_INFINITY);
                for (int m = 0; m < 12; m++) horizonMonth[m] += weight[i] * power[m][k];
            }
            for (int m = 0; m < 12; m++) horizonMonth[m] = all > 0 ? horizonMonth[m] / all : 0;
        }
    }
}
