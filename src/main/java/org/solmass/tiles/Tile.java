package org.solmass.tiles;

import java.io.Serializable;

/**
 * One tile of a {@link CityPlan}: the receivers it computes and the geometry it loads.
 *
 * @param index position in {@link CityPlan#tiles()}
 * @param col column of the tile grid (from the west)
 * @param row row of the tile grid (from the south)
 * @param box the receiver box {x0, y0, x1, y1}: plan bounds of the centres of the receivers it
 *            owns, metres (the halo and the far horizon are measured from it)
 * @param receivers global receiver ids it owns, ascending ({@code org.solmass.irradiation.ReceiverLayout}:
 *                  analysed patches first, id = patch index; then context patches; then ground probes)
 * @param sceneBlocks block ids (index into the model's block names) whose plan bounds come within the
 *                    halo of {@code box}: the tile's scene, ascending
 * @param bandFloorM height of the lowest horizon band's floor (the model's ground level), metres
 * @param bandM height of a horizon band, metres
 * @param horizonDeg far horizon per band ({@link #band}) and azimuth {@code i 360 / n}, degrees; an
 *                   entry is null where the band has no receiver or nothing rises; null for no far horizon at all
 */
public record Tile(int index, int col, int row, double[] box, int[] receivers, int[] sceneBlocks, double bandFloorM,
                   double bandM, double[][] horizonDeg) implements Serializable {

    /**
     * The far-horizon band of a receiver at height z: {@code floor((z - bandFloorM) / bandM)}, at least
     * 0. Band k sees the horizon from its floor {@code bandFloorM + k bandM}, the lowest point of the
     * band (conservative for every receiver in it).
     */
    public int band(double z) {
        return band(z, bandFloorM, bandM);
    }

    static int band(double z, double floorM, double bandM) {
        return Math.max(0, (int) Math.floor((z - floorM) / bandM));
    }

    /** The far horizon of band k, or null for none. */
    public double[] horizonDeg(int k) {
        return horizonDeg == null || k >= horizonDeg.length ? null : horizonDeg[k];
    }

    /** Number of analysed patches among its receivers, given the layout's analysed count. */
    public int analysedCount(int analysedTotal) {
        int n = 0;
        for (int r : receivers) if (r < analysedTotal) n++;
        return n;
    }

    /** A short name for logs and file partitions, e.g. {@code t0003-c01-r02}. */
    public String name() {
        return String.format(java.util.Locale.ROOT, "t%04d-c%02d-r%02d", index, col, row);
    }
}
