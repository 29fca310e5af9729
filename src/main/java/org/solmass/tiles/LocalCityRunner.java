package org.solmass.tiles;

import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.irradiation.StagedPasses;
import org.solmass.metrics.PvZonesMetric;
import org.solmass.surface.Patch;
import org.solmass.table.ResultTable;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A tiled run on one machine, tile after tile (no Spark): plan, stage 1 per tile, exchange and
 * bounces, stage 3 per tile, then the rows merged in the whole model's patch order. The reference a
 * distributed runner is checked against, and what the tests run.
 */
public final class LocalCityRunner {
    private LocalCityRunner() {}

    /**
     * Everything a tiled run produced.
     *
     * @param table every analysed patch's row, in the whole model's patch order, with the columns of patches.csv
     * @param firstPassS seconds of stage 1 over all tiles; likewise the others
     */
    public record CityRun(CityPlan plan, List<CityModel.TileRows> tiles, StagedPasses.Reflected reflected, ResultTable table,
                          double firstPassS, double reflectS, double finishS) {}

    public static CityRun run(CityModel city, CityOptions o, PhaseProgress progress) {
        CityPlan plan = city.plan(o);
        long t0 = System.nanoTime();
        progress.begin("first pass (tiles)", plan.tiles().size());
        List<FirstPasses> firsts = new ArrayList<>();
        for (Tile t : plan.tiles()) {
            firsts.add(city.firstPass(t));
            progress.advance(firsts.size());
        }
        long t1 = System.nanoTime();
        progress.begin("reflection", 0);
        StagedPasses.Reflected refl = city.reflect(firsts);
        long t2 = System.nanoTime();
        progress.begin("finish (tiles)", plan.tiles().size());
        List<CityModel.TileRows> rows = new ArrayList<>();
        for (Tile t : plan.tiles()) {
            rows.add(city.finish(t, firsts.get(t.index()), refl));
            progress.advance(rows.size());
        }
        long t3 = System.nanoTime();
        ResultTable table = merge(city.prepared().patches().patches(), rows);
        return new CityRun(plan, rows, refl, table, (t1 - t0) / 1e9, (t2 - t1) / 1e9, (t3 - t2) / 1e9);
    }

    /**
     * The tiles' rows as one table in the whole model's patch order, columns in the tiles' order
     * (NaN where a tile lacks a column). PV zones, numbered within each tile, are renumbered as the
     * whole model numbers them: by surface id, then first patch ({@code metrics.PvZones}); a block
     * is never split between tiles, so a zone is never either.
     */
    public static ResultTable merge(List<Patch> allPatches, List<CityModel.TileRows> tiles) {
        int n = allPatches.size();
        Map<String, double[]> values = new LinkedHashMap<>();
        Map<String, org.solmass.table.Column> defs = new LinkedHashMap<>();
        int[] seen = new int[n];
        for (CityModel.TileRows t : tiles) {
            for (int i : t.patchIndex()) seen[i]++;
            for (org.solmass.table.Column c : t.table().columns()) {
                defs.putIfAbsent(c.name(), c);
                double[] v = values.computeIfAbsent(c.name(), k -> {
                    double[] a = new double[n];
                    Arrays.fill(a, Double.NaN);
                    return a;
                });
                double[] src = t.table().column(c.name());
                for (int k = 0; k < src.length; k++) v[t.patchIndex()[k]] = src[k];
            }
        }
        for (int i = 0; i < n; i++)
            if (seen[i] != 1) throw new IllegalStateException("patch " + allPatches.get(i).id() + " appears " + seen[i] + " times in the tiles");
        double[] zone = values.get(PvZonesMetric.ZONE.name());
        if (zone != null) renumberZones(allPatches, tiles, zone);
        ResultTable table = new ResultTable(allPatches);
        for (var e : values.entrySet()) table.put(defs.get(e.getKey()), e.getValue());
        return table;
    }

    /** Global zone numbers: zones ordered by (surface id, first patch), numbered from 1. */
    private static void renumberZones(List<Patch> all, List<CityModel.TileRows> tiles, double[] zone) {
        Map<Long, long[]> first = new LinkedHashMap<>(); // (tile, local zone) -> {surface, first patch}
        for (CityModel.TileRows t : tiles) {
            double[] z = t.table().column(PvZonesMetric.ZONE.name());
            for (int k = 0; k < z.length; k++) {
                if (Double.isNaN(z[k])) continue;
                long key = ((long) t.tile().index() << 32) | (long) z[k];
                int g = t.patchIndex()[k];
                long[] f = first.get(key);
                if (f == null) first.put(key, new long[] {all.get(g).surface(), g});
                else f[1] = Math.min(f[1], g);
            }
        }
        List<Map.Entry<Long, long[]>> order = new ArrayList<>(first.entrySet());
        order.sort((a, b) -> a.getValue()[0] != b.getValue()[0] ? Long.compare(a.getValue()[0], b.getValue()[0])
                : Long.compare(a.getValue()[1], b.getValue()[1]));
        Map<Long, Integer> number = new LinkedHashMap<>();
        for (int i = 0; i < order.size(); i++) number.put(order.get(i).getKey(), i + 1);
        for (CityModel.TileRows t : tiles) {
            double[] z = t.table().column(PvZonesMetric.ZONE.name());
            for (int k = 0; k < z.length; k++)
                if (!Double.isNaN(z[k])) zone[t.patchIndex()[k]] = number.get(((long) t.tile().index() << 32) | (long) z[k]);
        }
    }
}
