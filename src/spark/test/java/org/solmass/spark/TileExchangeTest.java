package org.solmass.spark;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.TileBounces;
import org.solmass.tiles.CityModel;
import org.solmass.tiles.CityOptions;
import org.solmass.tiles.CityPlan;
import org.solmass.tiles.SyntheticCity;
import org.solmass.tiles.Tile;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import java.util.HashMap;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The exchange's id -> slot map ({@link TileExchange.SlotMap}) and each tile's route
 * ({@link TileExchange.Route}) against {@link java.util.HashMap} and {@link java.util.TreeSet}
 * (general-purpose libraries) on the route's definition.
 */
class TileExchangeTest {
    @TempDir static Path dir;

    /**
     * On a small invented city cut into 50 m tiles: the ids a tile receives are exactly the ids its
     * reflector lists name that it does not hold, ordered by owning tile, then id; the runs per
     * sending tile count them; and each entry's slot is {@link TileBounces#slots} under the map own id
     * -> its entry, received id -> own count + its place (built here with a HashMap).
     */
    @Test
    void eachTilesRouteMatchesItsDefinitionBuiltWithAHashMap() {
        Path study = SyntheticCity.write(dir.resolve("city"), new SyntheticCity.Spec(1500, 2.0, 7, 32632, 500_000, 5_316_000, 16)).study();
        CityModel city = CityModel.load(study);
        CityPlan plan = city.plan(CityOptions.defaults().withTileM(50));
        int[] owner = TileExchange.owners(plan);
        assertTrue(plan.tiles().size() >= 4, "several tiles");
        int received = 0;
        for (Tile t : plan.tiles()) {
            FirstPasses fp = city.firstPass(t);
            TileExchange.Route r = TileExchange.Route.of(t.index(), fp, owner);
            Map<Integer, Integer> slot = new HashMap<>();
            for (int i = 0; i < fp.size(); i++) slot.put(fp.id(i), i);
            java.util.TreeSet<Long> want = new java.util.TreeSet<>(); // owner << 32 | id
            TileBounces.forEachReflector(fp, j -> { if (!slot.containsKey(j)) want.add(((long) owner[j] << 32) | j); });
            List<Integer> expected = new ArrayList<>();
            for (long k : want) expected.add((int) k);
            assertEquals(expected, java.util.Arrays.stream(r.foreign).boxed().toList(), "tile " + t.index() + ": ids received");
            int at = 0;
            for (int i = 0; i < r.from.length; i++) {
                for (int q = 0; q < r.count[i]; q++) assertEquals(r.from[i], owner[r.foreign[at + q]], "tile " + t.index() + ": sending tile");
                at += r.count[i];
            }
            assertEquals(r.foreign.length, at, "tile " + t.index() + ": runs cover the ids received");
            for (int i = 0; i < r.foreign.length; i++) slot.put(r.foreign[i], fp.size() + i);
            assertArrayEquals(TileBounces.slots(fp, slot::get), r.slots, "tile " + t.index() + ": slots");
            received += r.foreign.length;
        }
        assertTrue(received > 100, "ids received across tiles: " + received);
    }

    @Test
    void slotMapAnswersAsAHashMapOverRandomIdsWhileItGrows() {
        Random rnd = new Random(20261202);
        for (int trial = 0; trial < 20; trial++) {
            int n = 1 + rnd.nextInt(50_000), range = 1 + rnd.nextInt(2_000_000);
            TileExchange.SlotMap m = new TileExchange.SlotMap(rnd.nextInt(n));
            Map<Integer, Integer> ref = new HashMap<>();
            for (int i = 0; i < n; i++) {
                int id = rnd.nextInt(range), v = rnd.nextInt(Integer.MAX_VALUE);
                m.put(id, v);
                ref.put(id, v);
            }
            for (int i = 0; i < 2 * n; i++) {
                int id = rnd.nextInt(range);
                assertEquals(ref.getOrDefault(id, -1).intValue(), m.get(id), "id " + id + " (trial " + trial + ")");
            }
            for (Map.Entry<Integer, Integer> e : ref.entrySet()) assertEquals(e.getValue().intValue(), m.get(e.getKey()));
        }
    }
}
