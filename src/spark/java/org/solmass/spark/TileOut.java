package org.solmass.spark;

import org.solmass.metrics.Metrics;
import org.solmass.metrics.PvZones;
import org.solmass.metrics.PvZonesMetric;
import org.solmass.output.ZoneCsvWriter;
import org.solmass.surface.Patch;
import org.solmass.table.ResultTable;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * One tile's finished rows as plain arrays ({@link Serializable}, kept by Spark between the finish
 * stage and the Parquet write): the patch columns of patches.csv, the result columns by name, the
 * whole model's patch index of each row, and the tile's PV zones (numbered within the tile) with the
 * surface and first patch that order them city-wide, and their outlines and figures for zones.geojson
 * and their zones.csv rows ({@link ZoneOut}).
 */
final class TileOut implements Serializable {
    private static final long serialVersionUID = 1L;

    final int tile;
    final int[] patchIndex;
    final String[] ids, blocks, kinds;
    final int[] surface;
    /** x, y, z, nx, ny, nz, area_m2, tilt_deg, azimuth_deg per row. */
    final double[] geometry;
    final String[] columns;
    final double[][] values;
    /** Per local zone (1-based number z at [z - 1]): its surface and its first patch (whole-model index); -1 where unused. */
    final long[] zoneSurface, zoneFirstPatch;
    /** The tile's PV zones (local numbers) for zones.geojson; null when the run finds no PV zones. */
    final ZoneOut[] zones;
    /** The PV zones' notes for the summary (how the suitability and the yield are figured, the same in every tile); null without PV zones. */
    final String[] pvNotes;

    TileOut(int tile, ResultTable table, int[] patchIndex, Metrics.Outcome metrics) {
        this.tile = tile;
        this.patchIndex = patchIndex.clone();
        List<Patch> ps = table.patches();
        int n = ps.size();
        ids = new String[n];
        blocks = new String[n];
        kinds = new String[n];
        surface = new int[n];
        geometry = new double[9 * n];
        for (int p = 0; p < n; p++) {
            Patch q = ps.get(p);
            ids[p] = q.id();
            blocks[p] = q.blockName();
            kinds[p] = q.kind().label();
            surface[p] = q.surface();
            double[] g = {q.centroid().x(), q.centroid().y(), q.centroid().z(), q.normal().x(), q.normal().y(), q.normal().z(),
                    q.areaM2(), q.tiltDeg(), q.azimuthDeg()};
            System.arraycopy(g, 0, geometry, 9 * p, 9);
        }
        columns = table.names().toArray(new String[0]);
        values = new double[columns.length][];
        for (int c = 0; c < columns.length; c++) values[c] = table.column(columns[c]).clone();
        double[] z = table.has(PvZonesMetric.ZONE.name()) ? table.column(PvZonesMetric.ZONE.name()) : new double[0];
        int zones = 0;
        for (double v : z) if (!Double.isNaN(v)) zones = Math.max(zones, (int) v);
        zoneSurface = new long[zones];
        zoneFirstPatch = new long[zones];
        java.util.Arrays.fill(zoneSurface, -1);
        java.util.Arrays.fill(zoneFirstPatch, Long.MAX_VALUE);
        for (int p = 0; p < z.length; p++) {
            if (Double.isNaN(z[p])) continue;
            int k = (int) z[p] - 1;
            zoneSurface[k] = surface[p];
            zoneFirstPatch[k] = Math.min(zoneFirstPatch[k], patchIndex[p]);
        }
        PvZonesMetric.Found found = metrics == null ? null : metrics.find(PvZonesMetric.Found.class).orElse(null);
        List<PvZones.Zone> zs = found == null ? null : found.zones().zones();
        this.pvNotes = found == null ? null : found.notes().toArray(new String[0]);
        this.zones = zs == null ? null : new ZoneOut[zs.size()];
        for (int i = 0; zs != null && i < zs.size(); i++) {
            this.zones[i] = ZoneOut.of(zs.get(i), this.patchIndex, ZoneCsvWriter.afterNumber(zs.get(i), found.orientationLossPct()[i], found.yieldOf(i)));
        }
    }

    /**
     * One PV zone of a tile as {@code output.GeoJsonWriter.writeZones} needs it ({@link Serializable}):
     * {@link PvZones.Zone}'s fields but the outline in the surface's frame (only the module layout,
     * done in the tile, uses it); patches as whole-model indices; {@code csvRow}: its zones.csv row
     * after the number, printed in the tile ({@code output.ZoneCsvWriter#afterNumber}: modules and
     * yield, which stay in the tile).
     */
    record ZoneOut(int localId, int block, String blockName, int surface, String surfaceLabel, int[] patches,
                   double areaM2, double meanKwhM2, double totalKwh, double meanShadingLossPct, double yieldKwh,
                   double tiltDeg, double azimuthDeg, double[][] outlines, String csvRow) implements Serializable {
        static ZoneOut of(PvZones.Zone z, int[] patchIndex, String csvRow) {
            int[] ps = new int[z.patches().length];
            for (int i = 0; i < ps.length; i++) ps[i] = patchIndex[z.patches()[i]];
            java.util.Arrays.sort(ps);
            return new ZoneOut(z.id(), z.block(), z.blockName(), z.surface(), z.surfaceLabel(), ps, z.areaM2(), z.meanKwhM2(),
                    z.totalKwh(), z.meanShadingLossPct(), z.yieldKwh(), z.tiltDeg(), z.azimuthDeg(),
                    z.outlines().toArray(new double[0][]), csvRow);
        }

        /** The zone with its city-wide number (no outline in the surface's frame: null). */
        PvZones.Zone zone(int id) {
            return new PvZones.Zone(id, block, blockName, surface, surfaceLabel, patches, areaM2, meanKwhM2, totalKwh,
                    meanShadingLossPct, yieldKwh, tiltDeg, azimuthDeg, List.of(outlines), null);
        }
    }

    int size() { return ids.length; }

    /** What the driver needs of a tile before the write: its columns, its PV zones (keys and, for zones.geojson, figures), its row count. */
    record Head(int tile, String[] columns, long[] zoneSurface, long[] zoneFirstPatch, ZoneOut[] zones, String[] pvNotes, int size)
            implements Serializable {}

    Head head() { return new Head(tile, columns, zoneSurface, zoneFirstPatch, zones, pvNotes, size()); }

    /**
     * The rows as the Parquet file holds them ({@link TileParquet.Rows}): patch columns, then
     * {@code results} in that order (NaN where this tile lacks one), the PV zone renumbered city-wide
     * with {@code zoneNumber} ((tile, local zone) key, see {@link CityStages#zoneKey}). Shares this
     * tile's arrays but the renumbered zone column.
     */
    TileParquet.Rows forWrite(List<String> results, Map<Long, Integer> zoneNumber, CityStages.Settings settings) {
        int n = size();
        double[][] v = new double[results.size()][];
        for (int c = 0; c < v.length; c++) {
            v[c] = column(results.get(c));
            if (v[c] == null) {
                v[c] = new double[n];
                java.util.Arrays.fill(v[c], Double.NaN);
            }
        }
        int zoneCol = results.indexOf(PvZonesMetric.ZONE.name());
        if (zoneCol >= 0) {
            double[] z = v[zoneCol].clone();
            for (int p = 0; p < n; p++) if (!Double.isNaN(z[p])) z[p] = zoneNumber.get(CityStages.zoneKey(tile, (int) z[p]));
            v[zoneCol] = z;
        }
        return new TileParquet.Rows(tile, ids, blocks, kinds, surface, geometry, v, settings);
    }

    /** This tile's values of a result column, or null when it has none. */
    double[] column(String name) {
        for (int k = 0; k < columns.length; k++) if (columns[k].equals(name)) return values[k];
        return null;
    }

    /**
     * zones.csv's rows: the city-wide numbers ({@link CityStages#zoneNumbers}) in order, each with the row its
     * tile printed after the number ({@code output.ZoneCsvWriter#afterNumber}); the PV zones' notes
     * for the summary (the first tile's: they hold only site-wide figures and settings).
     */
    record ZoneRows(int[] numbers, List<String> afterNumber, List<String> notes) {}

    /** The tiles' zones.csv rows in city-wide number order; null when no tile found PV zones. */
    static ZoneRows zoneRows(List<TileOut.Head> tiles, Map<Long, Integer> zoneNumber) {
        List<Map.Entry<Integer, String>> rows = null;
        List<String> notes = null;
        for (TileOut.Head t : tiles) {
            if (t.zones() == null) continue;
            if (rows == null) rows = new ArrayList<>();
            if (notes == null) notes = List.of(t.pvNotes());
            for (TileOut.ZoneOut z : t.zones()) rows.add(Map.entry(zoneNumber.get(CityStages.zoneKey(t.tile(), z.localId())), z.csvRow()));
        }
        if (rows == null) return null;
        rows.sort(Map.Entry.comparingByKey());
        return new ZoneRows(rows.stream().mapToInt(Map.Entry::getKey).toArray(), rows.stream().map(Map.Entry::getValue).toList(), notes);
    }
}
