package org.solmass.spark;

import org.apache.spark.Partitioner;
import org.apache.spark.SparkEnv;
import org.apache.spark.api.java.JavaPairRDD;
import org.apache.spark.rdd.ShuffledRDD;
import org.apache.spark.serializer.Serializer;
import org.apache.spark.serializer.SerializerInstance;
import scala.Tuple2;
import scala.reflect.ClassTag;
import scala.reflect.ClassTag$;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The shuffles of a city run (records keyed by tile, to the partition of their tile), through the
 * executor's own serializer and its pool of Kryo instances.
 *
 * <p>Why not {@code partitionBy} or {@code groupByKey}: their shuffle carries the serializer object
 * in the task, and each task deserializes its own copy; Spark's {@code KryoSerializer} keeps its pool
 * of Kryo instances in a transient field, so every copy starts with an empty pool, and each
 * serialization stream open at once in a task makes a new Kryo (tens of Scala and Solmass classes
 * registered, several milliseconds each). A map task writing one stream per receiving partition
 * (Spark's bypass-merge writer, below 200 partitions) so made one Kryo per tile it sends to: tiles x
 * tiles instances per exchange (6,561 at 81 tiles). Measured on a 300k-patch city (JFR), creating Kryo
 * instances took 22 % of stage 2's samples. {@link ExecutorSerializer} is a stateless stand-in that
 * asks {@code SparkEnv.get().serializer()} (the executor's one, created once per JVM and configured
 * as the run's) for each instance, so the shuffles reuse the executor's pool; the bytes written are
 * those of the configured serializer.
 */
final class TileShuffle {
    private TileShuffle() {}

    /**
     * The executor's serializer for a shuffle: each instance comes from this JVM's {@link SparkEnv}
     * (Kryo with {@link CityKryo}, or whatever the configuration names), so nothing is built per task.
     */
    static final class ExecutorSerializer extends Serializer implements java.io.Serializable {
        private static final long serialVersionUID = 1L;

        @Override
        public SerializerInstance newInstance() {
            SparkEnv env = SparkEnv.get();
            if (env == null) throw new IllegalStateException("no Spark environment in this JVM (a shuffle outside a Spark task)");
            return env.serializer().newInstance();
        }

        /**
         * As the executor's serializer answers (Kryo with auto-reset: yes), so Spark picks the same
         * shuffle writer as for the configured serializer (above 200 partitions, the serialized sort).
         */
        @Override
        public boolean supportsRelocationOfSerializedObjects() {
            SparkEnv env = SparkEnv.get();
            return env != null && env.serializer().supportsRelocationOfSerializedObjects();
        }
    }

    @SuppressWarnings("unchecked")
    private static <T> ClassTag<T> anyTag() {
        return (ClassTag<T>) ClassTag$.MODULE$.AnyRef();
    }

    /** The records moved to the partition {@code p} gives their key (no map-side combine, no order within a partition). */
    static <K, V> JavaPairRDD<K, V> byKey(JavaPairRDD<K, V> records, Partitioner p) {
        ShuffledRDD<K, V, V> s = new ShuffledRDD<>(records.rdd(), p, anyTag(), anyTag(), anyTag());
        s.setSerializer(new ExecutorSerializer());
        return JavaPairRDD.fromRDD(s, anyTag(), anyTag());
    }

    /**
     * The records moved to their key's partition and grouped by key within it, keys ascending, each
     * key's values in the order they arrived (as {@code groupByKey(p)} gives them, for which the
     * consumers here do not depend on the order: they sort by sending tile).
     */
    static <V> JavaPairRDD<Integer, Iterable<V>> grouped(JavaPairRDD<Integer, V> records, Partitioner p) {
        return byKey(records, p).mapPartitionsToPair(it -> {
            Map<Integer, List<V>> m = new TreeMap<>();
            it.forEachRemaining(e -> m.computeIfAbsent(e._1(), k -> new ArrayList<>()).add(e._2()));
            List<Tuple2<Integer, Iterable<V>>> out = new ArrayList<>(m.size());
            m.forEach((k, v) -> out.add(new Tuple2<>(k, v)));
            return out.iterator();
        }, true);
    }
}
