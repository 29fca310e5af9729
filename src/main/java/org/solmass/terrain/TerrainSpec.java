package org.solmass.terrain;

import java.nio.file.Path;

/**
 * What the study asks of the terrain (study section {@code terrain}, docs/study-file.md).
 *
 * @param horizonCsv far-horizon profile file ({@link HorizonCsv}), or null
 * @param dem DEM GeoTIFF ({@link GeoTiffDem}), or null
 * @param demEpsg EPSG code of the DEM's grid when the file declares none, 0 when not given
 * @param originEastM easting of the model's origin (x = y = 0) in the DEM's grid, metres
 * @param originNorthM northing of the model's origin in the DEM's grid, metres
 * @param nearRadiusM radius around the site centre within which the DEM is triangulated into the
 *                    scene, metres (0: no terrain mesh, the DEM gives only the far horizon)
 * @param farHorizonFromDem whether the far horizon beyond {@code nearRadiusM} is computed from the DEM
 *                          (ignored when {@code horizonCsv} is given, which wins)
 */
public record TerrainSpec(Path horizonCsv, Path dem, int demEpsg, double originEastM, double originNorthM,
                          double nearRadiusM, boolean farHorizonFromDem) {
    public static final double DEFAULT_NEAR_RADIUS_M = 300;
    /** No horizon file, no DEM: flat ground to an open horizon. */
    public static final TerrainSpec NONE = new TerrainSpec(null, null, 0, 0, 0, DEFAULT_NEAR_RADIUS_M, true);

    public boolean isNone() { return horizonCsv == null && dem == null; }
}
