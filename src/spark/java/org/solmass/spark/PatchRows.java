package org.solmass.spark;

import org.apache.spark.sql.types.DataType;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.Metadata;
import org.apache.spark.sql.types.MetadataBuilder;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.solmass.output.PatchCsvWriter;
import org.solmass.table.Column;

import java.util.ArrayList;
import java.util.List;

/**
 * The per-patch Parquet rows of a city run: patches.csv's columns in patches.csv's order
 * ({@link PatchCsvWriter#PATCH_COLUMNS}, then the result columns as the column registry declares them,
 * {@link Column}), and the tile the patch belongs to ({@value #TILE}, the partition column, so it is
 * the folder name {@code tile=K} on disk and the last column when read back). Values are the full
 * doubles (patches.csv rounds each column to its decimals); the files are written by {@link TileParquet}; each result column's unit, label and
 * decimals travel in the Spark field's metadata.
 */
public final class PatchRows {
    /** The partition column. */
    public static final String TILE = "tile";

    private PatchRows() {}

    /** The schema of the rows for these result columns (in order), the tile last (as read back). */
    public static StructType schema(List<Column> results) {
        return fileSchema(results).add(DataTypes.createStructField(TILE, DataTypes.IntegerType, false));
    }

    /**
     * The schema of the rows in a file (without the tile, which is the folder's name): patch columns
     * (not nullable), then the result columns (nullable, each with its unit, label, decimals and kind
     * as field metadata).
     */
    public static StructType fileSchema(List<Column> results) {
        List<StructField> f = new ArrayList<>();
        for (String n : PatchCsvWriter.PATCH_COLUMNS) f.add(DataTypes.createStructField(n, patchType(n), false));
        for (Column c : results) {
            if (PatchCsvWriter.PATCH_COLUMNS.contains(c.name())) throw new IllegalArgumentException("result column " + c.name() + " clashes with a patch column");
            Metadata m = new MetadataBuilder().putString("unit", c.unit().symbol()).putString("label", c.label())
                    .putLong("decimals", c.decimals()).putString("kind", c.kind().name()).build();
            f.add(DataTypes.createStructField(c.name(), DataTypes.DoubleType, true, m));
        }
        return DataTypes.createStructType(f);
    }

    private static DataType patchType(String name) {
        return switch (name) {
            case "patch_id", "block", "kind" -> DataTypes.StringType;
            case "surface" -> DataTypes.IntegerType;
            default -> DataTypes.DoubleType;
        };
    }
}
