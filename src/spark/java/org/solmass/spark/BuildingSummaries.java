package org.solmass.spark;

import org.apache.spark.api.java.JavaPairRDD;
import org.solmass.output.BuildingsWriter;

import java.io.Serializable;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Per-building summaries of a city run, from the tiles' finished rows ({@link TileOut}, the rows the
 * Parquet files hold): per block the patch count, the area (all, roof, facade) and, per result
 * column, the area-weighted mean {@code sum(v a) / sum(a)} over the patches with a value, as
 * {@link org.solmass.table.AreaStats} defines it (patches without a value, NaN, are left out of both
 * sums). A block lies in one tile (docs/city.md), so each tile's blocks are summed in its task in patch order and
 * the driver only collects one row per building (blocks met in several tiles would be added).
 */
public final class BuildingSummaries {
    private BuildingSummaries() {}

    /** One block's sums ({@link Serializable}): per column {@code sum(v a)} and {@code sum(a)} over the patches with a value. */
    record Sums(String block, long patches, double areaM2, double roofAreaM2, double facadeAreaM2, double[] va, double[] a)
            implements Serializable {
        Sums plus(Sums o) {
            double[] v = va.clone(), w = a.clone();
            for (int c = 0; c < v.length; c++) {
                v[c] += o.va[c];
                w[c] += o.a[c];
            }
            return new Sums(block, patches + o.patches, areaM2 + o.areaM2, roofAreaM2 + o.roofAreaM2, facadeAreaM2 + o.facadeAreaM2, v, w);
        }
    }

    /** The summaries of every block, ordered by block name (as UTF-8 bytes), for these result columns (in order). */
    static List<BuildingsWriter.Building> of(JavaPairRDD<Integer, TileOut> tiles, List<String> results) {
        Map<String, Sums> all = new LinkedHashMap<>();
        for (List<Sums> t : tiles.values().map(o -> sums(o, results)).collect()) for (Sums s : t) all.merge(s.block(), s, Sums::plus);
        List<Sums> sorted = new ArrayList<>(all.values());
        sorted.sort((x, y) -> Arrays.compareUnsigned(x.block().getBytes(StandardCharsets.UTF_8), y.block().getBytes(StandardCharsets.UTF_8)));
        List<BuildingsWriter.Building> out = new ArrayList<>(sorted.size());
        for (Sums s : sorted) {
            double[] mean = new double[results.size()];
            for (int c = 0; c < mean.length; c++) mean[c] = s.a()[c] > 0 ? s.va()[c] / s.a()[c] : Double.NaN;
            out.add(new BuildingsWriter.Building(s.block(), s.patches(), s.areaM2(), s.roofAreaM2(), s.facadeAreaM2(), mean, s.a().clone()));
        }
        return out;
    }

    /** A tile's blocks' sums, in order of first patch. */
    static List<Sums> sums(TileOut t, List<String> results) {
        double[][] v = new double[results.size()][];
        for (int c = 0; c < v.length; c++) v[c] = t.column(results.get(c));
        Map<String, double[]> byBlock = new LinkedHashMap<>(); // patches, area, roof, facade, then va and a per column
        int n = t.size(), m = v.length;
        for (int p = 0; p < n; p++) {
            double[] s = byBlock.computeIfAbsent(t.blocks[p], k -> new double[4 + 2 * m]);
            double area = t.geometry[9 * p + 6];
            s[0]++;
            s[1] += area;
            if (t.kinds[p].equals("roof")) s[2] += area;
            else if (t.kinds[p].equals("facade")) s[3] += area;
            for (int c = 0; c < m; c++) {
                if (v[c] == null || Double.isNaN(v[c][p])) continue;
                s[4 + c] += v[c][p] * area;
                s[4 + m + c] += area;
            }
        }
        List<Sums> out = new ArrayList<>(byBlock.size());
        byBlock.forEach((b, s) -> out.add(new Sums(b, (long) s[0], s[1], s[2], s[3], Arrays.copyOfRange(s, 4, 4 + m),
                Arrays.copyOfRange(s, 4 + m, 4 + 2 * m))));
        return out;
    }
}
