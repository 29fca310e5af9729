package org.solmass.output;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.geo.GeoReference;
import org.solmass.model.Vec3;
import org.solmass.pv.PvModule;

import java.nio.file.Path;
import java.util.List;

/**
 * Writes modules.geojson: the placed PV modules as a GeoJSON FeatureCollection (RFC 7946 structure)
 * of Polygons, one per module. Properties: zone, module number within the run, mounting, tilt and
 * azimuth. The caution travels in the file. Where the corners are (docs/outputs.md, "modules.geojson"):
 * <ul>
 * <li>a geo-referenced model ({@link GeoReference}): corners in the model's own CRS, the one its file
 * is in ({@link GeoReference#toFile}; metres to the mm, degrees to 1e-9), named by the collection's
 * {@code "crs"} member in the form of the 2008 GeoJSON specification
 * ({@code urn:ogc:def:crs:EPSG::CODE}, which GDAL-based GIS read; RFC 7946 itself allows only
 * WGS84, so the file says what it is rather than pretend), and {@code "solmass_local"} gives the
 * transform back to the model's local metres (working CRS, origin, north angle, height unit) that
 * {@link ModulesGeoJsonReader} applies;</li>
 * <li>an OBJ model: local metres (x east, y north, z up), no CRS.</li>
 * </ul>
 */
public final class ModulesGeoJsonWriter {
    public static final String FILE_NAME = "modules.geojson";

    private ModulesGeoJsonWriter() {}

    /** modules.geojson of a model without geo-reference: local metres. */
    public static void write(Path file, List<PvModule> modules, String caution) {
        write(file, modules, caution, null);
    }

    /**
     * @param geo the model's geo-reference, or null for local metres
     */
    public static void write(Path file, List<PvModule> modules, String caution, GeoReference geo) {
        JsonNodeFactory f = JsonNodeFactory.instance;
        ObjectNode root = f.objectNode();
        root.put("type", "FeatureCollection");
        if (geo == null) {
            root.put("coordinates", "local metres: x east, y north, z up (no CRS)");
        } else {
            root.putObject("crs").put("type", "name").putObject("properties").put("name", "urn:ogc:def:crs:EPSG::" + geo.file().epsg());
            root.put("coordinates", geo.file().name() + " (the model's CRS); solmass_local gives the transform to the local metres of the results");
            ObjectNode l = root.putObject("solmass_local");
            l.put("crs_epsg", geo.file().epsg());
            l.put("work_epsg", geo.work().epsg());
            l.put("origin_x", geo.originX());
            l.put("origin_y", geo.originY());
            l.put("north_deg", geo.northDeg());
            l.put("z_metres_per_unit", geo.zMetresPerUnit());
            l.put("latitude_deg", geo.latitudeDeg());
            l.put("longitude_deg", geo.longitudeDeg());
        }
        root.put("caution", caution);
        ArrayNode feats = root.putArray("features");
        boolean degrees = geo != null && geo.file().geographic();
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
                if (geo == null) {
                    ring.addArray().add(round(v.x())).add(round(v.y())).add(round(v.z()));
                } else {
                    double[] q = geo.toFile(v.x(), v.y(), v.z());
                    ring.addArray().add(degrees ? Math.round(q[0] * 1e9) / 1e9 : round(q[0]))
                            .add(degrees ? Math.round(q[1] * 1e9) / 1e9 : round(q[1])).add(round(q[2]));
                }
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
