package org.solmass.cli;

import org.solmass.study.StudyOverrides;
import picocli.CommandLine.Option;

import java.nio.file.Path;

/** The terrain flags of {@code analyse}: a far-horizon file and a DEM (study section {@code terrain}). */
public final class TerrainFlags {
    @Option(names = "--horizon", paramLabel = "FILE.csv",
            description = "far horizon: CSV of azimuth_deg,elevation_deg (sets terrain.horizon)") Path horizon;
    @Option(names = "--dem", paramLabel = "FILE.tif",
            description = "terrain near the site and its far horizon from a GeoTIFF DEM (sets terrain.dem)") Path dem;

    void applyTo(StudyOverrides ov) {
        ov.set("--horizon", "terrain.horizon", horizon);
        ov.set("--dem", "terrain.dem", dem);
    }
}
