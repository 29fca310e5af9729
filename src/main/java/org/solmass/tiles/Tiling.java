package org.solmass.tiles;

import org.solmass.irradiation.ReceiverLayout;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;

/** Makes a {@link CityPlan}: the rules are in its javadoc. */
final class Tiling {
    private Tiling() {}

    static CityPlan plan(CityModel city, CityOptions o) {
        ReceiverLayout l = city.layout();
        double[][] bb = city.blockBounds();
        List<Patch> analysed = city.prepared().patches().patches(), context = city.prepared().contextPatches();
        int n = l.count(), na = l.analysed();
        // the point that places each receiver: its block's plan-bounds centre, or the probe itself
        double[] px = new double[n], py = new double[n];
        for (int r = 0; r < n; r++) {
            int block = r < na ? analysed.get(r).block() : r < na + context.size() ? context.get(r - na).block() : -1;
            if (block >= 0) {
                px[r] = (bb[block][0] + bb[block][2]) / 2;
                py[r] = (bb[block][1] + bb[block][3]) / 2;
            } else {
                px[r] = l.centre(r, 0);
                py[r] = l.centre(r, 1);
            }
        }
        double x0 = Double.POSITIVE_INFINITY, y0 = Double.POSITIVE_INFINITY;
        for (int r = 0; r < n; r++) {
            x0 = Math.min(x0, px[r]);
            y0 = Math.min(y0, py[r]);
        }
        TreeMap<Long, List<Integer>> byCell = new TreeMap<>(); // key row-major: row, then col
        for (int r = 0; r < n; r++) {
            long col = (long) Math.floor((px[r] - x0) / o.tileM()), row = (long) Math.floor((py[r] - y0) / o.tileM());
            byCell.computeIfAbsent((row << 32) | col, k -> new ArrayList<>()).add(r);
        }

        double tallest = Double.NEGATIVE_INFINITY;
        for (double[] b : bb) if (b != null) tallest = Math.max(tallest, b[4]);
        double lowest = city.prepared().patches().groundLevelZ();
        double alphaMin = Halo.lowestSunElevationDeg(city.sun().directions());
        double uncapped = Halo.radiusM(tallest, lowest, alphaMin);
        double halo = Math.min(uncapped, o.haloCapM());
        HeightRaster raster = o.farHorizon() ? city.raster(o.rasterCellM()) : null;

        List<Tile> tiles = new ArrayList<>();
        for (var e : byCell.entrySet()) {
            int col = (int) (e.getKey() & 0xFFFFFFFFL), row = (int) (e.getKey() >>> 32);
            int[] rec = e.getValue().stream().mapToInt(Integer::intValue).toArray(); // ascending: added in id order
            double[] box = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
            for (int r : rec) {
                box[0] = Math.min(box[0], l.centre(r, 0));
                box[1] = Math.min(box[1], l.centre(r, 1));
                box[2] = Math.max(box[2], l.centre(r, 0));
                box[3] = Math.max(box[3], l.centre(r, 1));
            }
            List<Integer> blocks = new ArrayList<>();
            for (int b = 0; b < bb.length; b++)
                if (bb[b] != null && FarHorizon.rectDistance(box, bb[b][0], bb[b][1], bb[b][2], bb[b][3]) <= halo) blocks.add(b);
            double[][] horizon = null;
            if (raster != null && Double.isFinite(halo)) {
                int bands = 0;
                for (int r : rec) bands = Math.max(bands, Tile.band(l.centre(r, 2), lowest, o.horizonBandM()) + 1);
                boolean[] used = new boolean[bands];
                for (int r : rec) used[Tile.band(l.centre(r, 2), lowest, o.horizonBandM())] = true;
                horizon = new double[bands][];
                boolean any = false;
                for (int k = 0; k < bands; k++) {
                    if (!used[k]) continue;
                    double eye = lowest + (k + (o.conservativeHorizon() ? 0 : 0.5)) * o.horizonBandM();
                    double[] e2 = FarHorizon.elevationsDeg(raster, box, halo, eye, o.horizonAzimuths(), o.conservativeHorizon());
                    for (double v : e2) if (v > 0) { horizon[k] = e2; any = true; break; }
                }
                if (!any) horizon = null;
            }
            tiles.add(new Tile(tiles.size(), col, row, box, rec, blocks.stream().mapToInt(Integer::intValue).toArray(), lowest,
                    o.horizonBandM(), horizon));
        }
        return new CityPlan(o, halo, uncapped, alphaMin, tallest, lowest, n, na, List.copyOf(tiles));
    }
}
