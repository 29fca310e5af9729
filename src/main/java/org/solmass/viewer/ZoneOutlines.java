package org.solmass.viewer;

import org.solmass.table.ResultTable;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The boundary edges of the PV roof zones, from the {@code pv_zone} column: an outline edge of a
 * zone patch is on the zone's boundary when no other patch of the same zone has the same edge
 * (endpoints compared to the millimetre). Geometry only; the zones themselves come from the results.
 */
final class ZoneOutlines {
    /** The zone column of the results. */
    static final String COLUMN = org.solmass.metrics.PvZonesMetric.ZONE.name();

    private ZoneOutlines() {}

    /** Boundary edges as {ax, ay, az, bx, by, bz, patchIndex} (world metres), empty without zones. */
    static List<double[]> edges(List<Patch> patches, ResultTable table) {
        List<double[]> out = new ArrayList<>();
        if (!table.has(COLUMN)) return out;
        double[] zone = table.column(COLUMN);
        Map<String, Integer> count = new HashMap<>();
        Map<String, double[]> edge = new HashMap<>();
        for (Patch p : patches) {
            double z = zone[p.index()];
            if (!Double.isFinite(z) || z <= 0) continue;
            double[] o = p.outline();
            int n = o.length / 3;
            for (int i = 0; i < n; i++) {
                int j = (i + 1) % n;
                String a = key(o, i), b = key(o, j);
                String k = (long) z + ":" + (a.compareTo(b) < 0 ? a + "|" + b : b + "|" + a);
                count.merge(k, 1, Integer::sum);
                edge.putIfAbsent(k, new double[] {o[3 * i], o[3 * i + 1], o[3 * i + 2], o[3 * j], o[3 * j + 1], o[3 * j + 2], p.index()});
            }
        }
        List<String> keys = new ArrayList<>(edge.keySet());
        java.util.Collections.sort(keys);
        for (String k : keys) if (count.get(k) == 1) out.add(edge.get(k));
        return out;
    }

    private static String key(double[] o, int i) {
        return Math.round(o[3 * i] * 1000) + "," + Math.round(o[3 * i + 1] * 1000) + "," + Math.round(o[3 * i + 2] * 1000);
    }
}
