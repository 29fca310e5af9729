package org.solmass.spark;

import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.Path;
import org.apache.hadoop.mapreduce.RecordWriter;
import org.apache.hadoop.mapreduce.TaskAttemptContext;
import org.apache.hadoop.mapreduce.lib.output.FileOutputFormat;
import org.apache.hadoop.mapreduce.lib.output.PathOutputCommitter;
import org.apache.parquet.hadoop.ParquetFileWriter;
import org.apache.parquet.hadoop.ParquetWriter;
import org.apache.parquet.hadoop.api.WriteSupport;
import org.apache.parquet.hadoop.metadata.CompressionCodecName;
import org.apache.parquet.io.api.Binary;
import org.apache.parquet.io.api.RecordConsumer;
import org.apache.parquet.schema.LogicalTypeAnnotation;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.PrimitiveType.PrimitiveTypeName;
import org.apache.parquet.schema.Type;
import org.apache.parquet.schema.Types;
import org.apache.spark.api.java.JavaPairRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.sql.types.DataType;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.solmass.output.PatchCsvWriter;
import scala.Tuple2;

import java.io.IOException;
import java.io.Serializable;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Writes a city run's per-patch rows ({@link PatchRows}) as Parquet, one file per tile in
 * {@code tile=K/}, straight from each tile's arrays ({@link TileOut}): no Spark SQL rows, no sort
 * (a tile lies in one partition), no conversion to Spark's internal rows. The files are those
 * Spark SQL writes for {@code partitionBy("tile")}: the same Parquet schema (message
 * {@code spark_schema}, required patch columns, optional result columns), the same key-value
 * metadata (Spark's version and the row schema with each column's unit, label and decimals, which
 * Spark reads back as the fields' metadata), Snappy pages; doubles and the patch id without a
 * dictionary (they hardly repeat), block, kind and surface with one.
 *
 * <p>The write goes through Spark's Hadoop commit protocol ({@code saveAsNewAPIHadoopFile}: each
 * task writes into its attempt's folder, the output commit coordinator lets one attempt per task
 * commit, the job commit moves the committed files into place and writes {@code _SUCCESS}), so a
 * retried write task leaves every patch exactly once.
 */
public final class TileParquet {
    /** Configuration keys: the file schema (Spark's JSON) and Spark's version. */
    static final String SCHEMA_KEY = "solmass.patches.schema", VERSION_KEY = "solmass.spark.version";
    /** Spark's key-value metadata keys in a Parquet footer. */
    static final String SPARK_VERSION = "org.apache.spark.version", SPARK_ROW_METADATA = "org.apache.spark.sql.parquet.row.metadata";

    private TileParquet() {}

    /**
     * Writes the tiles' rows into {@code folder} (which must not exist yet).
     *
     * @param results the result columns, in the file's order
     * @param zoneNumber the city-wide PV zone number of each (tile, local zone) key ({@link CityStages#zoneKey})
     */
    static void write(JavaSparkContext sc, JavaPairRDD<Integer, TileOut> out, StructType fileSchema, List<String> results,
                      Broadcast<Map<Long, Integer>> zoneNumber, CityStages.Settings s, java.nio.file.Path folder) {
        Configuration conf = new Configuration(sc.hadoopConfiguration());
        conf.set(SCHEMA_KEY, fileSchema.json());
        conf.set(VERSION_KEY, sc.version());
        out.mapToPair(e -> new Tuple2<Void, Rows>(null, e._2().forWrite(results, zoneNumber.value(), s)))
                .saveAsNewAPIHadoopFile(folder.toUri().toString(), Void.class, Rows.class, Format.class, conf);
    }

    /**
     * One tile's rows as the file holds them ({@link Serializable}; made and written in the same task):
     * the patch columns, the result columns in the file's order (NaN where the tile lacks one; the PV
     * zone renumbered city-wide), the settings for the test hook.
     */
    static final class Rows implements Serializable {
        private static final long serialVersionUID = 1L;
        final int tile;
        final String[] ids, blocks, kinds;
        final int[] surface;
        /** x, y, z, nx, ny, nz, area_m2, tilt_deg, azimuth_deg per row. */
        final double[] geometry;
        final double[][] results;
        final CityStages.Settings settings;

        Rows(int tile, String[] ids, String[] blocks, String[] kinds, int[] surface, double[] geometry, double[][] results,
             CityStages.Settings settings) {
            this.tile = tile;
            this.ids = ids;
            this.blocks = blocks;
            this.kinds = kinds;
            this.surface = surface;
            this.geometry = geometry;
            this.results = results;
            this.settings = settings;
        }

        int size() { return ids.length; }
    }

    /**
     * The output format of the write: each tile's rows into {@code tile=K/part-KKKKK.snappy.parquet}
     * under the task attempt's work folder (KKKKK: the tile again, so the names depend on the plan only,
     * not on how the tiles were grouped into partitions; a tile lies in one task, so the name is unique).
     */
    public static final class Format extends FileOutputFormat<Void, Rows> {
        @Override
        public RecordWriter<Void, Rows> getRecordWriter(TaskAttemptContext ctx) throws IOException {
            Path work = ((PathOutputCommitter) getOutputCommitter(ctx)).getWorkPath();
            Configuration conf = ctx.getConfiguration();
            StructType schema = (StructType) DataType.fromJson(conf.get(SCHEMA_KEY));
            String version = conf.get(VERSION_KEY);
            return new RecordWriter<>() {
                @Override
                public void write(Void key, Rows r) throws IOException {
                    if (r.size() == 0) return; // a tile of ground probes only: no folder, as Spark SQL writes none
                    Path file = new Path(work, String.format(Locale.ROOT, "%s=%d/part-%05d.snappy.parquet", PatchRows.TILE, r.tile, r.tile));
                    writeFile(file, conf, schema, version, r);
                }

                @Override
                public void close(TaskAttemptContext c) {}
            };
        }
    }

    /** One tile's file; the test hook may fail the task after half the rows (the attempt's folder is then aborted). */
    static void writeFile(Path file, Configuration conf, StructType schema, String version, Rows r) throws IOException {
        MessageType type = messageType(schema);
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put(SPARK_VERSION, version);
        meta.put(SPARK_ROW_METADATA, schema.json());
        Builder b = new Builder(file, type, meta, r).withConf(conf).withWriteMode(ParquetFileWriter.Mode.CREATE)
                .withCompressionCodec(CompressionCodecName.SNAPPY).withDictionaryEncoding(true);
        for (StructField f : schema.fields()) {
            // a patch's values and its id hardly repeat: a dictionary would be tried and dropped on every page
            if (f.dataType() == DataTypes.DoubleType || f.name().equals("patch_id")) b = b.withDictionaryEncoding(f.name(), false);
        }
        try (ParquetWriter<Integer> w = b.build()) {
            int n = r.size();
            for (int p = 0; p < n; p++) {
                if (p == n / 2) CityStages.failOnce(r.settings, "write", r.tile);
                w.write(p);
            }
        }
    }

    /** The Parquet schema Spark writes for this row schema (required where not nullable). */
    static MessageType messageType(StructType schema) {
        Types.MessageTypeBuilder m = Types.buildMessage();
        for (StructField f : schema.fields()) {
            Type.Repetition rep = f.nullable() ? Type.Repetition.OPTIONAL : Type.Repetition.REQUIRED;
            DataType t = f.dataType();
            if (t == DataTypes.StringType) m.primitive(PrimitiveTypeName.BINARY, rep).as(LogicalTypeAnnotation.stringType()).named(f.name());
            else if (t == DataTypes.IntegerType) m.primitive(PrimitiveTypeName.INT32, rep).named(f.name());
            else if (t == DataTypes.DoubleType) m.primitive(PrimitiveTypeName.DOUBLE, rep).named(f.name());
            else throw new IllegalArgumentException("no Parquet type for column " + f.name() + " of type " + t);
        }
        return m.named("spark_schema");
    }

    private static final class Builder extends ParquetWriter.Builder<Integer, Builder> {
        private final MessageType type;
        private final Map<String, String> meta;
        private final Rows rows;

        Builder(Path file, MessageType type, Map<String, String> meta, Rows rows) {
            super(file);
            this.type = type;
            this.meta = meta;
            this.rows = rows;
        }

        @Override protected Builder self() { return this; }

        @Override protected WriteSupport<Integer> getWriteSupport(Configuration conf) { return new Support(type, meta, rows); }
    }

    /** Writes row p of a tile: the patch columns ({@link PatchCsvWriter#PATCH_COLUMNS}), then the results; NaN is a value, not a null. */
    private static final class Support extends WriteSupport<Integer> {
        private static final int PATCH = PatchCsvWriter.PATCH_COLUMNS.size(), GEOMETRY = 9;
        private final MessageType type;
        private final Map<String, String> meta;
        private final Rows r;
        private final String[] names;
        private RecordConsumer rc;
        private String lastBlock, lastKind;
        private Binary lastBlockBinary, lastKindBinary;

        Support(MessageType type, Map<String, String> meta, Rows r) {
            this.type = type;
            this.meta = meta;
            this.r = r;
            this.names = type.getFields().stream().map(Type::getName).toArray(String[]::new);
            if (names.length != PATCH + r.results.length) {
                throw new IllegalStateException("tile " + r.tile + ": " + r.results.length + " result columns for a schema of " + names.length);
            }
        }

        @Override public WriteContext init(Configuration conf) { return new WriteContext(type, meta); }

        @Override public void prepareForWrite(RecordConsumer recordConsumer) { rc = recordConsumer; }

        @Override
        public void write(Integer row) {
            int p = row;
            rc.startMessage();
            binary(0, Binary.fromString(r.ids[p]));
            if (!r.blocks[p].equals(lastBlock)) {
                lastBlock = r.blocks[p];
                lastBlockBinary = Binary.fromString(lastBlock);
            }
            binary(1, lastBlockBinary);
            rc.startField(names[2], 2);
            rc.addInteger(r.surface[p]);
            rc.endField(names[2], 2);
            if (!r.kinds[p].equals(lastKind)) {
                lastKind = r.kinds[p];
                lastKindBinary = Binary.fromString(lastKind);
            }
            binary(3, lastKindBinary);
            for (int k = 0; k < GEOMETRY; k++) number(4 + k, r.geometry[GEOMETRY * p + k]);
            for (int c = 0; c < r.results.length; c++) number(PATCH + c, r.results[c][p]);
            rc.endMessage();
        }

        private void binary(int field, Binary v) {
            rc.startField(names[field], field);
            rc.addBinary(v);
            rc.endField(names[field], field);
        }

        private void number(int field, double v) {
            rc.startField(names[field], field);
            rc.addDouble(v);
            rc.endField(names[field], field);
        }
    }
}
