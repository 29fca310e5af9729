package org.solmass.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.InputException;
import org.solmass.geo.Crs;
import org.solmass.geo.GeoReference;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads modules.geojson ({@link ModulesGeoJsonWriter}) back as module outlines: one ring per Polygon
 * feature, its exterior ring's corners as {x0, y0, z0, x1, ...} in local metres (x east, y north,
 * z up). The closing position that GeoJSON repeats (RFC 7946, section 3.1.6) is dropped. A file of a
 * geo-referenced model holds its corners in the model's CRS with the transform to local metres in
 * {@code "solmass_local"} ({@link ModulesGeoJsonWriter}): they are turned back with
 * {@link GeoReference#toLocal}. Geometry only: nothing here computes energy.
 */
public final class ModulesGeoJsonReader {
    private ModulesGeoJsonReader() {}

    /** The module rings of the file, in file order. */
    public static List<double[]> rings(Path file) {
        JsonNode root;
        try {
            root = new ObjectMapper().readTree(file.toFile());
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read modules: " + e.getMessage());
        }
        List<double[]> out = new ArrayList<>();
        JsonNode feats = root == null ? null : root.get("features");
        if (feats == null || !feats.isArray()) {
            throw new InputException(file.toString(), "features: expected an array of GeoJSON features");
        }
        GeoReference geo = reference(root.get("solmass_local"), file);
        for (int i = 0; i < feats.size(); i++) {
            JsonNode g = feats.get(i).path("geometry");
            if (!"Polygon".equals(g.path("type").asText())) continue;
            JsonNode ring = g.path("coordinates").path(0);
            int n = ring.size();
            if (n >= 2 && ring.get(0).equals(ring.get(n - 1))) n--;
            if (n < 3) {
                throw new InputException(file.toString(), "features[" + i + "].geometry.coordinates[0]: expected at least 3 corners, got " + n);
            }
            double[] r = new double[3 * n];
            for (int k = 0; k < n; k++) {
                JsonNode p = ring.get(k);
                if (!p.isArray() || p.size() < 3) {
                    throw new InputException(file.toString(), "features[" + i + "].geometry.coordinates[0][" + k + "]: expected [x, y, z] in metres");
                }
                for (int c = 0; c < 3; c++) r[3 * k + c] = p.get(c).asDouble();
                if (geo != null) System.arraycopy(geo.toLocal(r[3 * k], r[3 * k + 1], r[3 * k + 2]), 0, r, 3 * k, 3);
            }
            out.add(r);
        }
        return out;
    }

    /** The geo-reference declared by {@code "solmass_local"}, or null when the file is in local metres. */
    private static GeoReference reference(JsonNode l, Path file) {
        if (l == null || !l.isObject()) return null;
        String where = file + ": solmass_local";
        for (String k : new String[] {"crs_epsg", "work_epsg", "origin_x", "origin_y", "north_deg", "z_metres_per_unit"}) {
            if (!l.path(k).isNumber()) throw new InputException(where, k + ": expected a number");
        }
        Crs crs = Crs.epsg(l.get("crs_epsg").asInt(), where);
        Crs work = l.get("work_epsg").asInt() == crs.epsg() ? crs : Crs.epsg(l.get("work_epsg").asInt(), where);
        return new GeoReference(crs, work, l.get("origin_x").asDouble(), l.get("origin_y").asDouble(),
                l.get("z_metres_per_unit").asDouble(), l.get("north_deg").asDouble(),
                l.path("latitude_deg").asDouble(Double.NaN), l.path("longitude_deg").asDouble(Double.NaN));
    }
}
