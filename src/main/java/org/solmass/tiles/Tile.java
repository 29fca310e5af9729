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
 * @param horizonDeg far horizon per azimuth {@code i 360 / n}, degrees, or null for none
 */
public record Tile(int index, int col, int row, double[] box, int[] receivers, int[] sceneBlocks, double[] horizonDeg)
        implements Serializable {

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
