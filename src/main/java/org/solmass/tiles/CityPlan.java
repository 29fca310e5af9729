package org.solmass.tiles;

import java.io.Serializable;
import java.util.List;

/**
 * How a city run is cut: square tiles of receivers, each with its halo of obstructing blocks and its
 * far horizon ({@link CityModel#plan}). {@link Serializable}: made once by the driver and sent to
 * every task with the study path.
 *
 * <p>Tiling: a block belongs to the tile holding the centre of its plan bounding box (its footprint
 * centre for a box block), with all its patches (analysed or context): a block is never split, so
 * its surfaces, PV zones and summaries stay in one tile. A ground probe belongs to the tile holding
 * it. Tile (col, row) covers {@code [x0 + col T, x0 + (col + 1) T) x [y0 + row T, ...)} with T the
 * tile side and (x0, y0) the lowest of those points; tiles without receivers are left out.
 *
 * @param options the options it was made with
 * @param haloM the halo radius used (capped), metres
 * @param uncappedHaloM {@link Halo#radiusM} before the cap, metres
 * @param minSunElevationDeg the lowest sun elevation counted by the run's sun directions, degrees
 * @param tallestM highest point of the model, metres
 * @param lowestM ground level (lowest receiver height), metres
 * @param receiverCount receivers of the whole model (every one in exactly one tile)
 * @param analysedCount analysed patches of the whole model (global ids 0 .. analysedCount - 1)
 * @param tiles the tiles, in row-major order of the grid
 */
public record CityPlan(CityOptions options, double haloM, double uncappedHaloM, double minSunElevationDeg,
                       double tallestM, double lowestM, int receiverCount, int analysedCount, List<Tile> tiles)
        implements Serializable {

    /** The tile with this index. */
    public Tile tile(int index) { return tiles.get(index); }
}
