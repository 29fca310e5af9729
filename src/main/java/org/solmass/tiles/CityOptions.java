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
 * @param horizonAzimuths azimuth samples of a tile's far horizon (360: every degree)
 * @param horizonBandM height of the bands a tile's receivers are grouped in for the far horizon,
 *                     metres: each band sees the horizon from its own floor ({@link Tile})
 * @param conservativeHorizon true: the far horizon is a bound, never lower than the blocks it stands
 *                            for (highest from any corner of the tile, from the band's floor); false:
 *                            a best estimate (from the tile's centre and the band's middle height),
 *                            see {@link FarHorizon}
 */
public record CityOptions(double tileM, double haloCapM, boolean farHorizon, double rasterCellM, int horizonAzimuths,
                          double horizonBandM, boolean conservativeHorizon) implements Serializable {
    /** Tile side by default, metres (our choice: a few hundred patches per block, a few blocks per tile). */
    public static final double DEFAULT_TILE_M = 250;
    /** Height raster cell by default, metres (our choice: about one block). */
    public static final double DEFAULT_RASTER_CELL_M = 20;
    /** Far-horizon band height by default, metres (our choice: two storeys). */
    public static final double DEFAULT_HORIZON_BAND_M = 6;

    public CityOptions {
        if (!(tileM > 0)) throw new IllegalArgumentException("tile side must be positive: " + tileM);
        if (!(haloCapM >= 0)) throw new IllegalArgumentException("halo cap must be zero or more: " + haloCapM);
        if (!(rasterCellM > 0)) throw new IllegalArgumentException("raster cell must be positive: " + rasterCellM);
        if (horizonAzimuths < 4) throw new IllegalArgumentException("at least 4 horizon azimuths: " + horizonAzimuths);
        if (!(horizonBandM > 0)) throw new IllegalArgumentException("horizon band must be positive: " + horizonBandM);
    }

    /** With the default horizon band, a best-estimate horizon. */
    public CityOptions(double tileM, double haloCapM, boolean farHorizon, double rasterCellM, int horizonAzimuths) {
        this(tileM, haloCapM, farHorizon, rasterCellM, horizonAzimuths, DEFAULT_HORIZON_BAND_M, false);
    }

    /** 250 m tiles, uncapped halo, far horizon from a 20 m raster at 360 azimuths (every degree) in 6 m bands, best estimate. */
    public static CityOptions defaults() {
        return new CityOptions(DEFAULT_TILE_M, Double.POSITIVE_INFINITY, true, DEFAULT_RASTER_CELL_M, 360, DEFAULT_HORIZON_BAND_M, false);
    }

    public CityOptions withTileM(double m) { return new CityOptions(m, haloCapM, farHorizon, rasterCellM, horizonAzimuths, horizonBandM, conservativeHorizon); }

    public CityOptions withHaloCapM(double m) { return new CityOptions(tileM, m, farHorizon, rasterCellM, horizonAzimuths, horizonBandM, conservativeHorizon); }

    public CityOptions withFarHorizon(boolean on) { return new CityOptions(tileM, haloCapM, on, rasterCellM, horizonAzimuths, horizonBandM, conservativeHorizon); }

    public CityOptions withHorizonBandM(double m) { return new CityOptions(tileM, haloCapM, farHorizon, rasterCellM, horizonAzimuths, m, conservativeHorizon); }

    public CityOptions withConservativeHorizon(boolean on) {
        return new CityOptions(tileM, haloCapM, farHorizon, rasterCellM, horizonAzimuths, horizonBandM, on);
    }

    public CityOptions withRasterCellM(double m) { return new CityOptions(tileM, haloCapM, farHorizon, m, horizonAzimuths, horizonBandM, conservativeHorizon); }
}
