package org.solmass.spark;

import org.apache.spark.SparkConf;
import org.apache.spark.serializer.KryoSerializer;
import org.apache.spark.serializer.SerializerInstance;
import org.junit.jupiter.api.Test;
import org.solmass.tiles.CityOptions;
import org.solmass.tiles.CityPlan;
import org.solmass.tiles.Tile;
import scala.reflect.ClassTag$;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * The runner's Kryo configuration ({@link CityKryo}): what a city run ships comes back equal from a
 * round trip through Spark's {@code KryoSerializer} (the serializer's contract: deserialize(serialize(x))
 * equals x, common practice). Records and the JDK's immutable lists are the cases Kryo 4's own field
 * and collection serializers cannot rebuild.
 */
class CityKryoTest {
    private static SerializerInstance kryo() {
        assumeTrue(CitySpark.kryoUsable(), "Kryo needs --add-opens=java.base/java.nio (Surefire's default execution gives it)");
        SparkConf conf = new SparkConf(false).set("spark.kryo.registrator", CityKryo.class.getName());
        return new KryoSerializer(conf).newInstance();
    }

    @SuppressWarnings("unchecked")
    private static <T> T roundTrip(SerializerInstance s, T x) {
        return (T) s.deserialize(s.serialize(x, ClassTag$.MODULE$.Any()), ClassTag$.MODULE$.Any());
    }

    @Test
    void aCityPlanOfRecordsInAnImmutableListComesBackEqual() {
        SerializerInstance s = kryo();
        Tile t = new Tile(3, 1, 2, new double[] {0, 0, 250, 250}, new int[] {4, 7, 9}, new int[] {0, 2}, 0, 6,
                new double[][] {{1.5, 2.5}, null});
        CityPlan plan = new CityPlan(CityOptions.defaults().withTileM(250), 1200, 6959, 0.8, 98.8, 0, 10, 7, List.of(t));
        CityPlan back = roundTrip(s, plan);
        assertEquals(plan.options(), back.options());
        assertEquals(plan.receiverCount(), back.receiverCount());
        assertEquals(plan.haloM(), back.haloM());
        Tile b = back.tile(0);
        assertEquals(3, b.index());
        assertArrayEquals(t.receivers(), b.receivers());
        assertArrayEquals(t.box(), b.box());
        assertArrayEquals(t.horizonDeg()[0], b.horizonDeg()[0]);
        assertEquals(null, b.horizonDeg()[1]);
        assertEquals(List.of(1, 2, 3), roundTrip(s, List.of(1, 2, 3)));
    }

    @Test
    void theExchangesFlatRecordsComeBackWithTheSameArrays() {
        SerializerInstance s = kryo();
        TileExchange.Packet p = roundTrip(s, new TileExchange.Packet(5, new double[] {1.0, -0.0, Double.MIN_VALUE, 1e300, Math.PI}));
        assertEquals(5, p.from);
        assertArrayEquals(new double[] {1.0, -0.0, Double.MIN_VALUE, 1e300, Math.PI}, p.values);
        TileExchange.Request r = roundTrip(s, new TileExchange.Request(2, new int[] {3, 8, 13}));
        assertEquals(2, r.to);
        assertArrayEquals(new int[] {3, 8, 13}, r.ids);
        TileExchange.Sends sends = TileExchange.Sends.of(List.of(new TileExchange.Request(4, new int[] {1}), r));
        TileExchange.Sends back = roundTrip(s, sends);
        assertArrayEquals(new int[] {2, 4}, back.to);
        assertArrayEquals(new int[] {3, 8, 13}, back.ids[0]);
        assertArrayEquals(new int[] {1}, back.ids[1]);
    }
}
