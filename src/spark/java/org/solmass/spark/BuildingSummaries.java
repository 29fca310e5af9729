package org.solmass.spark;

import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.functions;
import org.solmass.output.BuildingsWriter;
import org.solmass.table.Column;

import java.util.ArrayList;
import java.util.List;

import static org.apache.spark.sql.functions.col;
import static org.apache.spark.sql.functions.isnan;
import static org.apache.spark.sql.functions.lit;
import static org.apache.spark.sql.functions.sum;
import static org.apache.spark.sql.functions.when;

/**
 * Per-building summaries of a city run, computed by Spark from the per-patch rows ({@link PatchRows}):
 * per block the patch count, the area (all, roof, facade) and, per result column, the area-weighted
 * mean {@code sum(v a) / sum(a)} over the patches with a value, as {@link org.solmass.table.AreaStats}
 * defines it (patches without a value, NaN, are left out of both sums).
 */
public final class BuildingSummaries {
    private BuildingSummaries() {}

    /** The summaries, ordered by block name (collected on the driver: one row per building). */
    public static List<BuildingsWriter.Building> of(Dataset<Row> patches, List<Column> results) {
        org.apache.spark.sql.Column a = col("area_m2");
        List<org.apache.spark.sql.Column> aggs = new ArrayList<>();
        aggs.add(sum(a).as("area_m2"));
        aggs.add(sum(when(col("kind").equalTo("roof"), a).otherwise(lit(0.0))).as("roof_area_m2"));
        aggs.add(sum(when(col("kind").equalTo("facade"), a).otherwise(lit(0.0))).as("facade_area_m2"));
        for (int c = 0; c < results.size(); c++) {
            org.apache.spark.sql.Column v = col(results.get(c).name());
            org.apache.spark.sql.Column has = v.isNotNull().and(functions.not(isnan(v)));
            aggs.add(sum(when(has, v.multiply(a))).as("va_" + c));
            aggs.add(sum(when(has, a)).as("a_" + c));
        }
        Dataset<Row> g = patches.groupBy("block").agg(functions.count(lit(1)).as("patches"),
                aggs.toArray(new org.apache.spark.sql.Column[0])).orderBy("block");
        List<BuildingsWriter.Building> out = new ArrayList<>();
        for (Row r : g.collectAsList()) {
            double[] mean = new double[results.size()], area = new double[results.size()];
            for (int c = 0; c < mean.length; c++) {
                Object va = r.getAs("va_" + c), ar = r.getAs("a_" + c);
                area[c] = ar == null ? 0 : (Double) ar;
                mean[c] = va == null || area[c] <= 0 ? Double.NaN : (Double) va / area[c];
            }
            out.add(new BuildingsWriter.Building(r.getAs("block"), r.<Long>getAs("patches"), r.<Double>getAs("area_m2"),
                    r.<Double>getAs("roof_area_m2"), r.<Double>getAs("facade_area_m2"), mean, area));
        }
        return out;
    }
}
