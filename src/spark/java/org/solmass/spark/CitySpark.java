package org.solmass.spark;

import org.apache.spark.SparkConf;
import org.apache.spark.sql.SparkSession;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * The Spark session of a city run. In local mode ({@code local[*]}, {@code local[2]}, {@code local[2,2]}
 * with task retries) the driver listens on 127.0.0.1 only, the web UI is off, Spark's scratch space is
 * java.io.tmpdir's, its SQL warehouse lies in a work folder the caller gives (removed by the caller), and the log shows
 * warnings and errors only ({@code solmass-spark-log4j2.properties}). Under {@code spark-submit} the
 * master and the cluster's settings come from there and are not overridden. Unless the configuration
 * names a serializer, the serializer is Kryo with {@link CityKryo}'s registrations (and a 1 GB
 * largest buffer: a tile's first pass or rows are tens of MB), where the JVM lets Kryo start
 * ({@link #kryoUsable}).
 */
public final class CitySpark {
    /** The log configuration resource (src/spark/resources). */
    static final String LOG_CONFIG = "solmass-spark-log4j2.properties";

    private CitySpark() {}

    /** Spark's setting for the number of partitions under which a shuffle writes one file per partition. */
    static final String BYPASS_THRESHOLD = "spark.shuffle.sort.bypassMergeThreshold";

    /** Spark's setting for whether shuffle blocks are compressed. */
    static final String SHUFFLE_COMPRESS = "spark.shuffle.compress";

    /**
     * A session for a run.
     *
     * @param master a Spark master URL, or null: the one spark-submit gave, else {@code local[*]}
     * @param work a folder for Spark's SQL warehouse (created), used in local mode
     * @param partitions shuffle partitions (a few per core: the exchanges are small)
     */
    public static SparkSession session(String master, Path work, int partitions) {
        quietLog();
        SparkConf given = new SparkConf(); // spark.* system properties, as spark-submit sets them
        String m = master != null ? master : given.contains("spark.master") ? given.get("spark.master") : "local[*]";
        SparkSession.Builder b = SparkSession.builder().appName("solmass-city").master(m)
                .config("spark.ui.enabled", "false")
                .config("spark.ui.showConsoleProgress", "false")
                .config("spark.sql.shuffle.partitions", Integer.toString(Math.max(1, partitions)))
                .config("spark.sql.session.timeZone", "UTC");
        if (!given.contains("spark.serializer") && kryoUsable()) {
            b.config("spark.serializer", "org.apache.spark.serializer.KryoSerializer")
                    .config("spark.kryo.registrator", CityKryo.class.getName())
                    .config("spark.kryoserializer.buffer.max", "1g");
        }
        // Spark's bypass-merge shuffle writer (used below 200 partitions) opens one file per receiving
        // partition in every map task and then concatenates them: tiles x tiles files per exchange
        // (6,561 at 81 tiles, each bounce). The sort-based writers write one file per map task; they
        // are what Spark uses anyway from 200 tiles on (docs/city.md, "Serializer").
        if (!given.contains(BYPASS_THRESHOLD)) b.config(BYPASS_THRESHOLD, "0");
        // The exchanges carry full-precision doubles (12 per receiver and bounce), in which LZ4 finds
        // few repeats: compressing and decompressing them cost more than the bytes they save on a
        // local disk (docs/city.md, "Fixed direction sets and shuffle compression"). A cluster short of network bandwidth can
        // give spark.shuffle.compress=true.
        if (!given.contains(SHUFFLE_COMPRESS)) b.config(SHUFFLE_COMPRESS, "false");
        if (m.startsWith("local")) {
            try {
                Files.createDirectories(work);
            } catch (IOException e) {
                throw new UncheckedIOException("cannot create Spark's work folder " + work + ": " + e.getMessage(), e);
            }
            b.config("spark.driver.bindAddress", "127.0.0.1")
                    .config("spark.driver.host", "127.0.0.1")
                    .config("spark.sql.warehouse.dir", work.resolve("warehouse").toUri().toString());
        }
        return b.getOrCreate();
    }

    /**
     * Whether Spark's Kryo serializer can start in this JVM: it reads the fields of
     * {@code java.nio.HeapByteBuffer}, so java.nio must be open to the runner
     * ({@code --add-opens=java.base/java.nio=ALL-UNNAMED}, which spark-submit, the launcher and the
     * Surefire configuration give); without it the run keeps Spark's Java serializer.
     */
    static boolean kryoUsable() {
        return java.nio.ByteBuffer.class.getModule().isOpen("java.nio", CitySpark.class.getModule());
    }

    /**
     * Points log4j 2 at the runner's configuration, unless the user or the cluster set one; must run
     * before Spark's first log line (log4j reads the property once).
     */
    static void quietLog() {
        if (System.getProperty("log4j2.configurationFile") == null && System.getProperty("log4j.configurationFile") == null) {
            System.setProperty("log4j2.configurationFile", LOG_CONFIG);
        }
    }

    /** The number of cores of a local master ({@code local[4]}: 4, {@code local[*]}: all, {@code local[2,3]}: 2), else 0. */
    static int localCores(String master) {
        if (master == null || !master.startsWith("local")) return 0;
        java.util.regex.Matcher mm = java.util.regex.Pattern.compile("local\\[(\\*|\\d+)").matcher(master);
        if (!mm.find()) return 1;
        return mm.group(1).equals("*") ? Runtime.getRuntime().availableProcessors() : Integer.parseInt(mm.group(1));
    }
}
