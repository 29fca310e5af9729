/**
 * City scale in pure Java (no Spark): a study cut into square tiles of receivers, each computed
 * against its own scene (its blocks and a halo of blocks around it, a far horizon beyond), with the
 * staged passes of {@link org.solmass.irradiation.StagedPasses} and the receivers' global ids of
 * {@link org.solmass.irradiation.ReceiverLayout}, so that a tiled run equals the one-machine run
 * where the halo holds every obstruction. docs/city.md, section "Pure-Java core".
 *
 * <p>Public API (stable for the distributed runner in src/spark):
 * <ul>
 * <li>{@link org.solmass.tiles.CityModel}: {@code load(Path)}, {@code load(Path, CityTables)},
 * {@code of(Study)}, {@code of(Study, CityTables)}; {@code tables()};
 * {@code plan(CityOptions) -> CityPlan}; {@code firstPass(Tile) -> FirstPasses} (stage 1);
 * {@code reflect(List<FirstPasses>) -> StagedPasses.Reflected} (exchange and bounces);
 * {@code finish(Tile, FirstPasses, TileReflected or Reflected) -> TileRows} (stage 3); {@code tileScene(Tile)},
 * {@code sceneTriangles(Tile)}, {@code layout()}, {@code sun()}, {@code prepared()}, {@code raster(double)}.</li>
 * <li>{@link org.solmass.tiles.CityTables}: the weather, sun directions and step table every tile
 * shares, {@code encode() -> byte[]} and {@code decode(byte[])} with every number's raw bits (what a
 * distributed run's driver broadcasts).</li>
 * <li>{@link org.solmass.tiles.CityOptions} (tile side, halo cap, far horizon on/off, raster cell,
 * azimuths, height band, conservative rule), {@link org.solmass.tiles.CityPlan},
 * {@link org.solmass.tiles.Tile}: serializable.</li>
 * <li>{@link org.solmass.tiles.Halo}, {@link org.solmass.tiles.HeightRaster},
 * {@link org.solmass.tiles.FarHorizon}: the halo radius and the far horizon.</li>
 * <li>{@link org.solmass.tiles.LocalCityRunner}: {@code run(CityModel, CityOptions, PhaseProgress)}
 * tile after tile, {@code merge(List<Patch>, List<TileRows>)}: the reference run.</li>
 * <li>{@link org.solmass.tiles.SyntheticCity}: {@code write(Path, Spec)}, an invented city.</li>
 * </ul>
 *
 * <p>Limits: a {@link org.solmass.tiles.CityModel} holds the whole model and its patches (about
 * 0.3 kB per patch) and the whole layout's reflector index (built once per JVM, about 130 B per
 * receiver; 400 B per receiver in all, measured, docs/city.md), which
 * suits cities up to a few million patches per JVM; the metrics of stage 3 that trace rays (sun
 * hours on dates, the PV zones' yield) see the far horizon of the tile's lowest height band only
 * (the vertical sky component comes from the first pass, each band's own).
 */
package org.solmass.tiles;
