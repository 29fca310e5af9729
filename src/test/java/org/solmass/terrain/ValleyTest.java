package org.solmass.terrain;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.cli.AnalysisRun;
import org.solmass.fixtures.Boxes;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.scene.HorizonProfile;
import org.solmass.study.StudyReader;
import org.solmass.surface.Patch;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A site on the floor of an invented valley running east-west: flat floor 200 m either side of the
 * axis, slopes rising to ridges of H = 600 m at D = 3000 m north and south of it, falling again
 * beyond, on a 50 m grid of 241 x 241 samples centred on the site.
 */
class ValleyTest {
    static final double E0 = 600_000, N0 = 5_200_000, CELL = 50, W = 200, D = 3000, H = 600;

    @TempDir Path dir;

    static double valley(double y) {
        double u = Math.abs(y - N0);
        if (u <= W) return 0;
        if (u <= D) return H * (u - W) / (D - W);
        return Math.max(0, H - H * (u - D) / (D - W));
    }

    static GeoTiffFixture valleyDem() {
        // pixel centres at E0 + 50 i, N0 + 50 j for i, j in -120..120
        return new GeoTiffFixture().grid(241, 241, E0 - 6000 - CELL / 2, N0 + 6000 + CELL / 2, CELL)
                .heights((x, y) -> valley(y));
    }

    private Dem readDem() throws IOException {
        Path p = dir.resolve("valley.tif");
        Files.write(p, valleyDem().bytes());
        return GeoTiffDem.read(p, 0, "terrain.dem_epsg");
    }

    /**
     * Along the meridian (azimuths 0 and 180) the ridge crest at distance D is the highest point seen
     * from the valley floor (the slope's elevation angle grows with distance), so the horizon there is
     * atan((H - c(D)) / D), c(D) = D^2/(2R)(1 - k) the curvature drop less refraction (R = 6371 km,
     * k = 0.13: common practice in geodesy). The crest lies on a grid row and on a march step, so the
     * only error is rounding. Along the valley (90, 270) the floor is flat: 0. At azimuth 30 the
     * crest is crossed at D / cos 30 between march steps of 25 m: the bound there is the terrain's slope
     * along the ray x half a step, over the distance (derived here, not tuned).
     */
    @Test
    void horizonFromTheDemMatchesTheRidgeElevationWithEarthCurvature() throws IOException {
        Dem dem = readDem();
        double[] el = DemHorizon.elevationsDeg(dem, E0, N0, 0, 300, 360);
        double c = D * D / (2 * 6_371_000.0) * (1 - 0.13);
        double expected = Math.toDegrees(Math.atan((H - c) / D)), flatEarth = Math.toDegrees(Math.atan(H / D));
        assertEquals(expected, el[0], 1e-9, "north ridge");
        assertEquals(expected, el[180], 1e-9, "south ridge");
        assertTrue(Math.abs(flatEarth - expected) > 0.01, "the curvature correction is visible at this distance");
        assertEquals(0, el[90], 0, "along the valley floor");
        assertEquals(0, el[270], 0);
        double d30 = D / Math.cos(Math.toRadians(30)), c30 = d30 * d30 / (2 * 6_371_000.0) * (1 - 0.13);
        double slopeAlongRay = H / (D - W) * Math.cos(Math.toRadians(30));
        double boundTan = slopeAlongRay * 12.5 / d30;
        double tanExpected = (H - c30) / d30;
        assertTrue(Math.tan(Math.toRadians(el[30])) <= tanExpected + 1e-12, "no sample lies above the crest");
        assertTrue(Math.tan(Math.toRadians(el[30])) >= tanExpected - boundTan, "within half a march step of the crest");
    }

    private IrradiationResult run(String terrain) throws IOException {
        Files.writeString(dir.resolve("house.obj"), Boxes.onGround(0, 0, 10, 10, 10).obj("house"));
        String study = """
                {"model": {"file": "house.obj"},
                 "site": {"latitude": 47.0, "longitude": 9.0, "zone": "+01:00"},
                 "climate": {"source": "clear-sky"}, "time_base": "average-days", "step_minutes": 10,
                 "patch_m": 5, "rays": 256 %s}
                """.formatted(terrain);
        Files.writeString(dir.resolve("study.json"), study);
        return AnalysisRun.run(StudyReader.read(dir.resolve("study.json")), PhaseProgress.NONE).result();
    }

    /**
     * The valley takes winter sun: at 47 N on 21 December the sun culminates at about
     * 90 - 47 - 23.4 = 19.6 deg (from memory, the solstice declination), above the 11.3 deg ridges only
     * around noon, so the roof's December irradiation and the year's sunshine hours drop against the
     * same house on open flat ground. The roof's obstruction view factor is the share of its
     * cosine-weighted hemisphere below the far horizon e(phi): 1 - (1/2 pi) int cos^2 e(phi) d phi
     * (the constant-elevation result cos^2 e of FarHorizonTest, azimuth by azimuth), within 4 standard
     * errors; the near terrain mesh (floor and the foot of the slopes within 300 m) stays below the
     * far horizon seen from the roof, so it takes none of the roof's sky.
     */
    @Test
    void aHouseInTheValleyLosesWinterBeamAndSunHours() throws IOException {
        Files.write(dir.resolve("valley.tif"), valleyDem().bytes());
        IrradiationResult open = run("");
        IrradiationResult valley = run(", \"terrain\": {\"dem\": \"valley.tif\", \"origin_east_m\": " + (E0 - 5)
                + ", \"origin_north_m\": " + (N0 - 5) + ", \"near_radius_m\": 300}");
        int roof = -1;
        List<Patch> patches = org.solmass.surface.Patcher.build(
                org.solmass.model.ObjReader.load(dir.resolve("house.obj"), new org.solmass.model.ModelOptions(
                        org.solmass.model.UpAxis.Z, org.solmass.model.LengthUnit.M, 0)).model(),
                new org.solmass.surface.PatchOptions(5, java.util.Set.of("house"), false)).patches();
        for (Patch p : patches) if (p.normal().z() > 0.9) { roof = p.index(); break; }
        assertTrue(roof >= 0);
        double decOpen = open.monthly()[11][roof], decValley = valley.monthly()[11][roof];
        assertTrue(decValley < decOpen, "December roof irradiation " + decValley + " against " + decOpen + " kWh/m2");
        assertTrue(valley.sunshineHours()[roof] < open.sunshineHours()[roof],
                "sunshine hours " + valley.sunshineHours()[roof] + " against " + open.sunshineHours()[roof]);
        assertEquals(0, open.obstructionViewFactor()[roof], 0);
        // the profile the run used: the DEM seen from the patches' mean centroid height above the site's floor
        double eye = patches.stream().mapToDouble(p -> p.centroid().z()).average().orElseThrow();
        HorizonProfile h = SiteTerrain.build(new TerrainSpec(null, dir.resolve("valley.tif"), 0, E0 - 5, N0 - 5, 300, true),
                5, 5, 0, eye).horizon();
        int n = 36_000;
        double open2 = 0;
        for (int i = 0; i < n; i++) open2 += Math.pow(Math.cos(Math.toRadians(h.elevationDegAt((i + 0.5) * 360.0 / n))), 2);
        double expectedObstruction = 1 - open2 / n;
        assertEquals(expectedObstruction, valley.obstructionViewFactor()[roof], 4 * valley.skyViewStdError()[roof]);
        assertEquals(0, valley.groundViewFactor()[roof], 0, "the near terrain stays below the far horizon");
    }

    /** The far horizon of a DEM beyond the near radius is what {@link SiteTerrain} puts into the scene. */
    @Test
    void siteTerrainPlacesTheMeshAtTheModelsGroundAndKeepsTheHorizon() throws IOException {
        Files.write(dir.resolve("valley.tif"), valleyDem().bytes());
        TerrainSpec spec = new TerrainSpec(null, dir.resolve("valley.tif"), 0, E0, N0, 300, true);
        SiteTerrain t = SiteTerrain.build(spec, 0, 0, 12.0, 0);
        assertEquals(12.0, t.lowestZ(), 1e-6, "the valley floor at the site is the model's ground level");
        HorizonProfile h = t.horizon();
        double c = D * D / (2 * 6_371_000.0) * (1 - 0.13);
        assertEquals(Math.toDegrees(Math.atan((H - c) / D)), h.elevationDegAt(180), 1e-9);
        assertTrue(t.triangleCount() > 2 * 100, "about pi 300^2 / 50^2 = 113 cells, two triangles each: " + t.triangleCount());
    }
}
