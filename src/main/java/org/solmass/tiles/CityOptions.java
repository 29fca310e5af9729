package org.solmass.tiles;

import java.io.Serializable;

/**
 * How a city is cut into tiles ({@link CityPlan}).
 *
 * @param tileM side of a square tile, metres
 * @param haloCapM the halo radius at most, metres ({@code Double.POSITIVE_INFINITY}: no cap); the halo
 *                 is otherwise {@link Halo#radiusM}
 * @param farHorizon whether a far-horizon profile from the height raster stands for the blocks beyond the halo
 * @param rasterCellM cell side of the coarse height raster, metres
 * @param horizonAzimuths azimuth samples of a tile's far horizon (72: every 5 degrees)
 */
public record CityOptions(double tileM, double haloCapM, boolean farHorizon, double rasterCellM, int horizonAzimuths)
        implements Serializable {
    /** Tile side by default, metres (our choice: a few hundred patches per block, a few blocks per tile). */
    public static final double DEFAULT_TILE_M = 250;
    /** Height raster cell by default, metres (our choice: about one block). */
    public static final double DEFAULT_RASTER_CELL_M = 20;

    public CityOptions {
        if (!(tileM > 0)) throw new IllegalArgumentException("tile side must be positive: " + tileM);
        if (!(haloCapM >= 0)) throw new IllegalArgumentException("halo cap must be zero or more: " + haloCapM);
        if (!(rasterCellM > 0)) throw new IllegalArgumentException("raster cell must be positive: " + rasterCellM);
        if (horizonAzimuths < 4) throw new IllegalArgumentException("at least 4 horizon azimuths: " + horizonAzimuths);
    }

    /** 250 m tiles, uncapped halo, far horizon from a 20 m raster at 72 azimuths. */
    public static CityOptions defaults() {
        return new CityOptions(DEFAULT_TILE_M, Double.POSITIVE_INFINITY, true, DEFAULT_RASTER_CELL_M, 72);
    }

    public CityOptions withTileM(double m) { return new CityOptions(m, haloCapM, farHorizon, rasterCellM, horizonAzimuths); }

    public CityOptions withHaloCapM(double m) { return new CityOptions(tileM, m, farHorizon, rasterCellM, horizonAzimuths); }

    public CityOptions withFarHorizon(boolean on) { return new CityOptions(tileM, haloCapM, on, rasterCellM, horizonAzimuths); }

    public CityOptions withRasterCellM(double m) { return new CityOptions(tileM, haloCapM, farHorizon, m, horizonAzimuths); }
}
