package org.solmass.spark;

import org.junit.jupiter.api.Test;

import java.util.HashMap;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** The exchange's id -> slot map ({@link TileExchange.SlotMap}) against {@link java.util.HashMap} (a general-purpose library). */
class TileExchangeTest {
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
