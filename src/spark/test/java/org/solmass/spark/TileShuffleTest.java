package org.solmass.spark;

import org.apache.spark.HashPartitioner;
import org.apache.spark.api.java.JavaPairRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import scala.Tuple2;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link TileShuffle} against Spark's own {@code groupByKey} (a general-purpose library): the same
 * groups in the same partitions, with the run's bypass-merge threshold (0: the sort-based writers at
 * every partition count) and with one the user gives (200: the bypass-merge writer below it, above it
 * the serialized sort, used when the serializer allows relocation, as Kryo does); uncompressed blocks
 * (the run's setting) and compressed ones (given).
 */
class TileShuffleTest {
    @TempDir static Path dir;

    /** The run's session: the sort-based shuffle writers at every partition count (bypass threshold 0, see {@link CitySpark}). */
    @Test
    void groupsAsGroupByKeyDoesWithTheRunsShuffleWriters() {
        SparkSession spark = CitySpark.session("local[2]", dir.resolve("spark"), 4);
        try {
            assertEquals("0", spark.sparkContext().getConf().get(CitySpark.BYPASS_THRESHOLD), "the run's bypass threshold");
            assertEquals("false", spark.sparkContext().getConf().get(CitySpark.SHUFFLE_COMPRESS), "the run's shuffle compression");
            compareWithGroupByKey(spark);
        } finally {
            spark.stop();
        }
    }

    /** A threshold (and compression) the user gives is kept: Spark's bypass-merge writer below it (7 partitions), the sort-based ones above (260). */
    @Test
    void groupsAsGroupByKeyDoesBelowAndAboveAGivenBypassThreshold() {
        System.setProperty(CitySpark.BYPASS_THRESHOLD, "200");
        System.setProperty(CitySpark.SHUFFLE_COMPRESS, "true");
        SparkSession spark;
        try {
            spark = CitySpark.session("local[2]", dir.resolve("spark-given"), 4);
        } finally {
            System.clearProperty(CitySpark.BYPASS_THRESHOLD);
            System.clearProperty(CitySpark.SHUFFLE_COMPRESS);
        }
        try {
            assertEquals("200", spark.sparkContext().getConf().get(CitySpark.BYPASS_THRESHOLD), "the given bypass threshold");
            assertEquals("true", spark.sparkContext().getConf().get(CitySpark.SHUFFLE_COMPRESS), "the given shuffle compression");
            compareWithGroupByKey(spark);
        } finally {
            spark.stop();
        }
    }

    private static void compareWithGroupByKey(SparkSession spark) {
        JavaSparkContext sc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        Random rnd = new Random(20261202);
        List<Tuple2<Integer, double[]>> records = new ArrayList<>();
        for (int i = 0; i < 3000; i++) records.add(new Tuple2<>(rnd.nextInt(400), new double[] {i, rnd.nextDouble()}));
        for (int parts : new int[] {7, 260}) {
            HashPartitioner p = new HashPartitioner(parts);
            JavaPairRDD<Integer, double[]> in = sc.parallelizePairs(records, 5);
            List<List<Tuple2<Integer, Iterable<double[]>>>> ours = TileShuffle.grouped(in, p).glom().collect();
            List<List<Tuple2<Integer, Iterable<double[]>>>> spark2 = in.groupByKey(p).glom().collect();
            assertEquals(parts, ours.size(), "partitions");
            int groups = 0;
            for (int q = 0; q < parts; q++) {
                Map<Integer, List<Double>> a = sorted(ours.get(q)), b = sorted(spark2.get(q));
                assertEquals(b, a, "partition " + q + " of " + parts);
                groups += a.size();
            }
            assertTrue(groups > 300, "groups compared: " + groups);
            assertEquals(spark.sparkContext().getConf().get("spark.serializer", "").contains("Kryo"),
                    new TileShuffle.ExecutorSerializer().supportsRelocationOfSerializedObjects(), "relocation as the configured serializer");
        }
    }

    /** Key -> the first value of each record in the group, sorted (groupByKey gives no order within a group). */
    private static Map<Integer, List<Double>> sorted(List<Tuple2<Integer, Iterable<double[]>>> part) {
        Map<Integer, List<Double>> m = new TreeMap<>();
        for (Tuple2<Integer, Iterable<double[]>> g : part) {
            List<Double> l = new ArrayList<>();
            g._2().forEach(v -> l.add(v[0]));
            l.sort(null);
            assertEquals(null, m.put(g._1(), l), "key " + g._1() + " twice in a partition");
        }
        return m;
    }
}
