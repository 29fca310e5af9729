package org.solmass.tiles;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.geo.GeoReference;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The plan of an invented synthetic city: every receiver in exactly one tile; halos as the formula says. */
class TilingTest {
    @TempDir Path dir;

    @Test
    void everyPatchAppearsExactlyOnceAcrossTiles() {
        SyntheticCity.Written w = SyntheticCity.write(dir, SyntheticCity.Spec.of(20_000, 7));
        CityModel city = CityModel.load(w.study());
        GeoReference ref = city.prepared().read().reference();
        assertNotNull(ref, "the synthetic city is geo-referenced");
        CityPlan plan = city.plan(CityOptions.defaults().withTileM(120).withHaloCapM(150));
        assertTrue(plan.tiles().size() >= 4, "tiles: " + plan.tiles().size());
        int[] seen = new int[plan.receiverCount()];
        for (Tile t : plan.tiles()) for (int r : t.receivers()) seen[r]++;
        for (int r = 0; r < seen.length; r++) assertEquals(1, seen[r], "receiver " + r);
        assertEquals(city.prepared().patches().patchCount(), plan.analysedCount());
        // the halo is the formula, capped
        assertEquals(Halo.radiusM(plan.tallestM(), plan.lowestM(), plan.minSunElevationDeg()), plan.uncappedHaloM(), 1e-9);
        assertEquals(Math.min(150, plan.uncappedHaloM()), plan.haloM(), 0.0);
        // a tile's scene holds its own blocks: every analysed patch's block is in its tile's scene
        for (Tile t : plan.tiles()) {
            for (int r : t.receivers()) {
                if (r >= plan.analysedCount()) continue;
                int block = city.prepared().patches().patches().get(r).block();
                assertTrue(java.util.Arrays.binarySearch(t.sceneBlocks(), block) >= 0, "block of " + r + " in tile " + t.name());
            }
        }
        System.out.printf("synthetic city: %d buildings, %d patches (estimate %d), %d tiles, halo %.0f m (uncapped %.0f m)%n",
                w.buildings(), plan.analysedCount(), w.estimatedPatches(), plan.tiles().size(), plan.haloM(), plan.uncappedHaloM());
    }

    @Test
    void theSyntheticCityRepeatsFromItsSeed() throws Exception {
        SyntheticCity.Written a = SyntheticCity.write(dir.resolve("a"), SyntheticCity.Spec.of(5_000, 3));
        SyntheticCity.Written b = SyntheticCity.write(dir.resolve("b"), SyntheticCity.Spec.of(5_000, 3));
        assertArrayEquals(Files.readAllBytes(a.geoJson()), Files.readAllBytes(b.geoJson()));
        assertTrue(Files.readString(a.study()).contains("invented"));
    }
}
