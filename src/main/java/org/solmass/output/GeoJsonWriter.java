package org.solmass.output;

import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.algorithm.PointLocation;
import org.locationtech.jts.geom.Coordinate;
import org.solmass.geo.GeoReference;
import org.solmass.metrics.PvZones;
import org.solmass.surface.Patch;
import org.solmass.table.Numbers;
import org.solmass.table.ResultTable;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes patches.geojson and zones.geojson for a geo-referenced model (docs/geo.md): the patch
 * outlines and the PV roof zones as RFC 7946 GeoJSON, whose coordinates are WGS84 longitude and
 * latitude (degrees, 8 decimals: about 1 mm) and the height in the model's CRS (metres, 3 decimals), as
 * the RFC requires; each feature's properties give, besides its values, its centroid in the model's
 * own CRS ({@code crs_x}, {@code crs_y}, {@code crs_z}; mm), and the collection names that CRS in a
 * foreign member {@code "solmass_crs"} with the caution. Written as text by hand, one feature a line,
 * each number with its column's decimals ({@link Numbers}). zones.geojson of a model without
 * geo-reference (an OBJ model; the city run writes it, {@code spark.CityRun}) is in local metres
 * (x east, y north, z up, mm), as modules.geojson is, and says so in a {@code "coordinates"} member.
 */
public final class GeoJsonWriter {
    public static final String PATCHES = "patches.geojson", ZONES = "zones.geojson";
    /** Decimals of longitude and latitude (1e-8 deg of latitude is 1.1 mm), and of heights and CRS coordinates (mm). */
    static final int LONLAT_DECIMALS = 8, METRE_DECIMALS = 3;

    private GeoJsonWriter() {}

    /** patches.geojson: one Polygon feature per patch with patches.csv's columns as properties. */
    public static void writePatches(Path file, ResultTable table, GeoReference geo, List<String> cautions) {
        List<String> names = table.names();
        AtomicFiles.writeText(file, w -> {
            header(w, geo, cautions);
            List<Patch> ps = table.patches();
            StringBuilder sb = new StringBuilder(1024);
            for (int p = 0; p < ps.size(); p++) {
                Patch q = ps.get(p);
                sb.setLength(0);
                sb.append(p == 0 ? "" : ",\n").append("{\"type\":\"Feature\",\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[");
                ring(sb, q.outline(), geo, true);
                sb.append("]},\"properties\":{\"patch_id\":");
                string(sb, q.id());
                sb.append(",\"block\":");
                string(sb, q.blockName());
                sb.append(",\"kind\":\"").append(q.kind().label()).append('"');
                prop(sb, "area_m2", q.areaM2(), 4);
                prop(sb, "tilt_deg", q.tiltDeg(), 2);
                prop(sb, "azimuth_deg", q.azimuthDeg(), 2);
                centroid(sb, geo, q.centroid().x(), q.centroid().y(), q.centroid().z());
                for (String n : names) prop(sb, n, table.column(n)[p], table.def(n).decimals());
                sb.append("}}");
                w.write(sb.toString());
            }
            w.write("\n]}\n");
        });
    }

    /**
     * zones.geojson: one MultiPolygon feature per PV roof zone with zones.csv's columns as properties.
     *
     * @param geo the model's geo-reference, or null for local metres
     */
    public static void writeZones(Path file, List<PvZones.Zone> zones, GeoReference geo, List<String> cautions) {
        AtomicFiles.writeText(file, w -> {
            header(w, geo, cautions);
            StringBuilder sb = new StringBuilder(1024);
            for (int i = 0; i < zones.size(); i++) {
                PvZones.Zone z = zones.get(i);
                sb.setLength(0);
                sb.append(i == 0 ? "" : ",\n").append("{\"type\":\"Feature\",\"geometry\":{\"type\":\"MultiPolygon\",\"coordinates\":[");
                polygons(sb, z.outlines(), geo);
                sb.append("]},\"properties\":{\"zone\":").append(z.id()).append(",\"block\":");
                string(sb, z.blockName());
                sb.append(",\"surface\":");
                string(sb, z.surfaceLabel());
                sb.append(",\"patches\":").append(z.patches().length);
                prop(sb, "area_m2", z.areaM2(), 2);
                prop(sb, "tilt_deg", z.tiltDeg(), 2);
                prop(sb, "azimuth_deg", z.azimuthDeg(), 2);
                prop(sb, "mean_kwh_m2", z.meanKwhM2(), 2);
                prop(sb, "total_kwh", z.totalKwh(), 1);
                prop(sb, "mean_shading_loss_pct", z.meanShadingLossPct(), 2);
                prop(sb, "yield_kwh", z.yieldKwh(), 1);
                double[] c = centroidOf(z.outlines().isEmpty() ? new double[3] : z.outlines().get(0));
                centroid(sb, geo, c[0], c[1], c[2]);
                sb.append("}}");
                w.write(sb.toString());
            }
            w.write("\n]}\n");
        });
    }

    static void header(Writer w, GeoReference geo, List<String> cautions) throws IOException {
        StringBuilder sb = new StringBuilder("{\"type\":\"FeatureCollection\",");
        if (geo == null) {
            sb.append("\"coordinates\":\"local metres: x east, y north, z up (no CRS)\"");
        } else {
            sb.append("\"solmass_crs\":");
            string(sb, geo.file().name());
            sb.append(",\"solmass_reference\":");
            string(sb, geo.describe());
        }
        sb.append(",\"caution\":");
        string(sb, String.join(" ", cautions));
        sb.append(",\"features\":[\n");
        w.write(sb.toString());
    }

    /**
     * A closed ring of x,y,z triples (Solmass frame) as [lon, lat, z] positions (with {@code geo} null:
     * [x, y, z] local metres), counter-clockwise in plan when {@code ccw}.
     */
    static void ring(StringBuilder sb, double[] xyz, GeoReference geo, boolean ccw) {
        int n = xyz.length / 3;
        Coordinate[] cs = new Coordinate[n + 1];
        for (int i = 0; i < n; i++) {
            double[] ll = geo == null ? new double[] {xyz[3 * i], xyz[3 * i + 1], xyz[3 * i + 2]}
                    : geo.toWgs84(xyz[3 * i], xyz[3 * i + 1], xyz[3 * i + 2]);
            cs[i] = new Coordinate(ll[0], ll[1], ll[2]);
        }
        int xy = geo == null ? METRE_DECIMALS : LONLAT_DECIMALS;
        cs[n] = cs[0];
        boolean reverse = n >= 3 && Orientation.isCCW(cs) != ccw;
        sb.append('[');
        for (int k = 0; k <= n; k++) {
            Coordinate c = cs[reverse ? n - k : k];
            if (k > 0) sb.append(',');
            sb.append('[');
            Numbers.append(sb, c.x, xy);
            sb.append(',');
            Numbers.append(sb, c.y, xy);
            sb.append(',');
            Numbers.append(sb, c.z, METRE_DECIMALS);
            sb.append(']');
        }
        sb.append(']');
    }

    /**
     * The zone's rings as MultiPolygon coordinates: a ring whose first corner lies inside another ring
     * (in plan) is a hole of it; shells counter-clockwise, holes clockwise (RFC 7946, section 3.1.6).
     */
    private static void polygons(StringBuilder sb, List<double[]> rings, GeoReference geo) {
        int n = rings.size();
        int[] holeOf = new int[n];
        for (int i = 0; i < n; i++) {
            holeOf[i] = -1;
            double[] r = rings.get(i);
            Coordinate first = new Coordinate(r[0], r[1]);
            for (int j = 0; j < n && holeOf[i] < 0; j++) {
                if (j != i && PointLocation.isInRing(first, plan(rings.get(j)))) holeOf[i] = j;
            }
        }
        boolean firstPoly = true;
        for (int i = 0; i < n; i++) {
            if (holeOf[i] >= 0) continue;
            sb.append(firstPoly ? "" : ",").append('[');
            firstPoly = false;
            ring(sb, rings.get(i), geo, true);
            for (int h = 0; h < n; h++) {
                if (holeOf[h] != i) continue;
                sb.append(',');
                ring(sb, rings.get(h), geo, false);
            }
            sb.append(']');
        }
    }

    private static Coordinate[] plan(double[] xyz) {
        int n = xyz.length / 3;
        Coordinate[] cs = new Coordinate[n + 1];
        for (int i = 0; i < n; i++) cs[i] = new Coordinate(xyz[3 * i], xyz[3 * i + 1]);
        cs[n] = cs[0];
        return cs;
    }

    /** Mean of a ring's corners (for a zone: where it is; its exact centroid is not needed). */
    private static double[] centroidOf(double[] xyz) {
        int n = Math.max(1, xyz.length / 3);
        double[] c = new double[3];
        for (int i = 0; i < xyz.length / 3; i++) for (int k = 0; k < 3; k++) c[k] += xyz[3 * i + k] / n;
        return c;
    }

    /** The centroid in the model's CRS ({@code crs_x}, ...); nothing without a geo-reference (the geometry is in local metres). */
    static void centroid(StringBuilder sb, GeoReference geo, double x, double y, double z) {
        if (geo == null) return;
        double[] f = geo.toFile(x, y, z);
        int d = geo.file().geographic() ? LONLAT_DECIMALS : METRE_DECIMALS;
        prop(sb, "crs_x", f[0], d);
        prop(sb, "crs_y", f[1], d);
        prop(sb, "crs_z", f[2], METRE_DECIMALS);
    }

    static void prop(StringBuilder sb, String name, double v, int decimals) {
        sb.append(",\"").append(name).append("\":");
        if (Double.isFinite(v)) Numbers.append(sb, v, decimals);
        else sb.append("null");
    }

    /** A JSON string with the escapes RFC 8259 requires. */
    static void string(StringBuilder sb, String s) {
        sb.append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> sb.append("\\\"");
                case '\\' -> sb.append("\\\\");
                default -> {
                    if (c < 0x20) sb.append(String.format("\\u%04x", (int) c));
                    else sb.append(c);
                }
            }
        }
        sb.append('"');
    }
}
