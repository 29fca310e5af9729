package org.solmass.output;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.model.Vec3;
import org.solmass.pv.PvModule;

import java.nio.file.Path;
import java.util.List;

/**
 * Writes modules.geojson: the placed PV modules as a GeoJSON FeatureCollection (RFC 7946 structure)
 * of Polygons, one per module, corners [x, y, z] in the model's local coordinates (metres, x east,
 * y north, z up; not longitude/latitude: no coordinate reference system is given). Properties: zone,
 * module number within the run, mounting, tilt and azimuth. The caution travels in the file.
 */
public final class ModulesGeoJsonWriter {
    public static final String FILE_NAME = "modules.geojson";

    private ModulesGeoJsonWriter() {}

    public static void write(Path file, List<PvModule> modules, String caution) {
        JsonNodeFactory f = JsonNodeFactory.instance;
        ObjectNode root = f.objectNode();
        root.put("type", "FeatureCollection");
        root.put("coordinates", "local metres: x east, y north, z up (no CRS)");
        root.put("caution", caution);
        ArrayNode feats = root.putArray("features");
        for (int i = 0; i < modules.size(); i++) {
            PvModule m = modules.get(i);
            ObjectNode ft = feats.addObject();
            ft.put("type", "Feature");
            ObjectNode g = ft.putObject("geometry");
            g.put("type", "Polygon");
            ArrayNode ring = g.putArray("coordinates").addArray();
            Vec3[] c = m.corners();
            for (int k = 0; k <= 4; k++) {
                Vec3 v = c[k % 4];
                ring.addArray().add(round(v.x())).add(round(v.y())).add(round(v.z()));
            }
            ObjectNode p = ft.putObject("properties");
            p.put("zone", m.zone());
            p.put("module", i + 1);
            p.put("mounting", m.racked() ? "racked" : "flush");
            p.put("tilt_deg", Math.round(m.tiltDeg() * 100) / 100.0);
            p.put("azimuth_deg", Math.round(m.azimuthDeg() * 100) / 100.0);
        }
        try {   // compact: one line per file, as coordinates would otherwise take a line each
            AtomicFiles.writeString(file, new com.fasterxml.jackson.databind.ObjectMapper().writeValueAsString(root) + "\n");
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static double round(double v) { return Math.round(v * 1000) / 1000.0; }
}
