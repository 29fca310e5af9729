package org.solmass.geo;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.valid.IsValidOp;
import org.locationtech.jts.operation.valid.TopologyValidationError;
import org.solmass.InputException;
import org.solmass.model.SemanticKind;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Reads GeoJSON building footprints (RFC 7946: a FeatureCollection or one Feature of Polygon or
 * MultiPolygon geometries, holes allowed) and extrudes each polygon into a block with a flat roof:
 * walls, roof (declared {@link SemanticKind#ROOF}) and floor ({@link SemanticKind#GROUND}), walls
 * {@link SemanticKind#WALL}. Height: the feature's height property (metres above the base), else its
 * storeys property times the storey height; base: its base elevation property, else 0 (the z of the
 * positions is not used). Block name: the name property, else the feature's "id", else "feature N";
 * a name used before gets "#N" appended. Each footprint is checked with JTS ({@code IsValidOp}).
 *
 * <p>CRS: {@code model.epsg} when given; else the old (2008) GeoJSON {@code crs} member
 * ({@code {"type": "name", "properties": {"name": "urn:ogc:def:crs:EPSG::32632"}}}); else RFC 7946's
 * WGS84 longitude/latitude, checked (coordinates beyond +-180 / +-90 are projected ones whose CRS the
 * file does not say).
 */
public final class GeoJsonReader {
    /** Largest GeoJSON file read, bytes. */
    public static final long MAX_FILE_BYTES = 512L << 20;
    private static final GeometryFactory GF = new GeometryFactory();

    private GeoJsonReader() {}

    /** Reads a GeoJSON file. */
    public static GeoModel read(Path file, GeoOptions options) {
        String text;
        try {
            text = org.solmass.TextInput.readAll(file, MAX_FILE_BYTES, "a GeoJSON model");
        } catch (java.nio.file.NoSuchFileException e) {
            throw new InputException(file.toString(), "file not found, expected a GeoJSON model", e);
        } catch (java.io.IOException e) {
            throw new InputException(file.toString(), "cannot read GeoJSON file: " + e.getMessage(), e);
        }
        return parse(text, file.toString(), file, options);
    }

    /** Parses GeoJSON text; {@code name} names the source in messages. */
    public static GeoModel parse(String text, String name, Path source, GeoOptions options) {
        JsonNode root;
        try {
            root = new ObjectMapper().readTree(text);
        } catch (JsonProcessingException e) {
            throw new InputException(name + (e.getLocation() == null ? "" : ":" + e.getLocation().getLineNr()),
                    "not valid JSON: " + e.getOriginalMessage());
        }
        if (root == null || !root.isObject()) throw new InputException(name, "expected a GeoJSON object { \"type\": \"FeatureCollection\", ... }");
        String type = root.path("type").asText("");
        List<JsonNode> features = new ArrayList<>();
        if (type.equals("FeatureCollection") && root.path("features").isArray()) root.path("features").forEach(features::add);
        else if (type.equals("Feature")) features.add(root);
        else throw new InputException(name, "expected a GeoJSON FeatureCollection or Feature, got type \"" + type + "\"");
        Crs crs = crs(root, name, options);
        double zUnit = crs.geographic() ? 1 : crs.metresPerUnit();
        List<String> warnings = new ArrayList<>();
        GeoModelBuilder b = new GeoModelBuilder(name, source);
        int skipped = 0;
        for (int i = 0; i < features.size(); i++) {
            JsonNode f = features.get(i);
            int number = i + 1;
            JsonNode g = f.path("geometry");
            String gt = g.path("type").asText("");
            if (!gt.equals("Polygon") && !gt.equals("MultiPolygon")) { skipped++; continue; }
            JsonNode props = f.path("properties");
            String block = blockName(f, props, options, number, b);
            String where = name + ": feature " + number + " (\"" + block + "\")";
            double height = height(props, options, where);
            double base = number(props, options.baseProperty(), where, 0.0);
            List<JsonNode> polys = new ArrayList<>();
            if (gt.equals("Polygon")) polys.add(g.path("coordinates"));
            else g.path("coordinates").forEach(polys::add);
            int id = b.block(block);
            for (JsonNode p : polys) {
                List<Coordinate[]> rings = rings(p, where, crs);
                checkValid(rings, where);
                extrude(b, id, number, rings, base / zUnit, (base + height) / zUnit);
            }
        }
        if (skipped > 0) warnings.add(name + ": " + skipped + " feature(s) without a Polygon or MultiPolygon geometry skipped");
        return b.build(crs, warnings);
    }

    private static Crs crs(JsonNode root, String name, GeoOptions options) {
        JsonNode named = root.path("crs").path("properties").path("name");
        int fromFile = named.isTextual() ? Srs.epsgOf(named.asText()) : 0;
        if (named.isTextual() && fromFile == 0) {
            throw new InputException(name + ": crs", "the CRS \"" + named.asText() + "\" names no EPSG code, so the unit"
                    + " and place of the coordinates are unknown; expected a name such as \"urn:ogc:def:crs:EPSG::32632\""
                    + " or give the EPSG code (model.epsg, --epsg)");
        }
        if (options.epsg() > 0 && fromFile > 0 && options.epsg() != fromFile) {
            throw new InputException(name + ": crs", "the file says EPSG:" + fromFile + " but model.epsg says EPSG:"
                    + options.epsg() + "; drop one of them");
        }
        if (options.epsg() > 0) return Crs.epsg(options.epsg(), "model.epsg");
        if (fromFile > 0) return Crs.epsg(fromFile, name + ": crs");
        return Crs.epsg(Crs.WGS84, name);
    }

    private static double height(JsonNode props, GeoOptions o, String where) {
        double h = number(props, o.heightProperty(), where, Double.NaN);
        if (Double.isNaN(h)) {
            double storeys = number(props, o.storeysProperty(), where, Double.NaN);
            if (!Double.isNaN(storeys)) h = storeys * o.storeyHeightM();
        }
        if (Double.isNaN(h)) {
            throw new InputException(where, "footprint has no height: expected a property \"" + o.heightProperty()
                    + "\" (metres above its base) or \"" + o.storeysProperty() + "\" (storeys of "
                    + String.format(Locale.ROOT, "%.1f", o.storeyHeightM()) + " m); other property names:"
                    + " model.footprints.height_property, model.footprints.storeys_property");
        }
        if (!(h > 0 && h <= 1000)) {
            throw new InputException(where, String.format(Locale.ROOT, "footprint height %s m is not in (0, 1000] m", h));
        }
        return h;
    }

    /** A number property (a JSON number or a numeric string), {@code absent} when missing or null. */
    private static double number(JsonNode props, String key, String where, double absent) {
        JsonNode v = props.path(key);
        if (v.isMissingNode() || v.isNull()) return absent;
        double d = Double.NaN;
        if (v.isNumber()) d = v.asDouble();
        else if (v.isTextual()) {
            try { d = Double.parseDouble(v.asText().trim()); } catch (NumberFormatException e) { d = Double.NaN; }
        }
        if (!Double.isFinite(d)) throw new InputException(where + ": " + key, "expected a number, got " + v);
        return d;
    }

    private static String blockName(JsonNode f, JsonNode props, GeoOptions o, int number, GeoModelBuilder b) {
        JsonNode n = props.path(o.nameProperty());
        if (n.isMissingNode() || n.isNull() || n.asText("").isBlank()) n = f.path("id");
        String s = n.isMissingNode() || n.isNull() || n.asText("").isBlank() ? "feature " + number : n.asText().trim();
        return b.hasBlock(s) ? s + "#" + number : s;
    }

    /** The rings of a Polygon's coordinates, each closed, as JTS coordinates (x, y). */
    private static List<Coordinate[]> rings(JsonNode poly, String where, Crs crs) {
        if (!poly.isArray() || poly.isEmpty()) throw new InputException(where, "Polygon without rings; expected [[[x, y], ...]]");
        List<Coordinate[]> out = new ArrayList<>();
        for (JsonNode ring : poly) {
            List<Coordinate> cs = new ArrayList<>();
            for (JsonNode pos : ring) {
                if (!pos.isArray() || pos.size() < 2 || !pos.get(0).isNumber() || !pos.get(1).isNumber()) {
                    throw new InputException(where, "position " + pos + " is not [x, y] or [x, y, z] numbers");
                }
                double x = pos.get(0).asDouble(), y = pos.get(1).asDouble();
                if (crs.geographic() && (Math.abs(x) > 180 || Math.abs(y) > 90)) {
                    throw new InputException(where, String.format(Locale.ROOT, "position [%s, %s] is not longitude/latitude,"
                            + " which a GeoJSON file without a crs member is (RFC 7946); give the EPSG code of its"
                            + " projected CRS (model.epsg, --epsg)", pos.get(0), pos.get(1)));
                }
                Coordinate c = new Coordinate(x, y);
                if (cs.isEmpty() || !cs.get(cs.size() - 1).equals2D(c)) cs.add(c);
            }
            if (cs.size() > 1 && !cs.get(0).equals2D(cs.get(cs.size() - 1))) cs.add(cs.get(0).copy());
            if (cs.size() < 4) throw new InputException(where, "a ring has fewer than 3 distinct corners");
            out.add(cs.toArray(new Coordinate[0]));
        }
        return out;
    }

    /** Refuses a footprint that is not a valid polygon (JTS IsValidOp: self-intersection, holes outside, ...). */
    private static void checkValid(List<Coordinate[]> rings, String where) {
        LinearRing shell = GF.createLinearRing(rings.get(0));
        LinearRing[] holes = new LinearRing[rings.size() - 1];
        for (int i = 1; i < rings.size(); i++) holes[i - 1] = GF.createLinearRing(rings.get(i));
        Polygon p = GF.createPolygon(shell, holes);
        TopologyValidationError e = new IsValidOp(p).getValidationError();
        if (e != null) {
            Coordinate c = e.getCoordinate();
            throw new InputException(where, String.format(Locale.ROOT,
                    "footprint is not a valid polygon: %s at (%s, %s); expected a simple ring (edges that do not"
                            + " cross) with holes inside it", e.getMessage(), plain(c.x), plain(c.y)));
        }
    }

    private static String plain(double d) { return java.math.BigDecimal.valueOf(d).stripTrailingZeros().toPlainString(); }

    /**
     * Walls, roof and floor of one footprint from {@code z0} to {@code z1} (file units): the shell
     * turned counter-clockwise and the holes clockwise seen from above, so the roof faces up, the floor
     * down and each wall to the right of its edge, out of the block.
     */
    private static void extrude(GeoModelBuilder b, int block, int feature, List<Coordinate[]> rings, double z0, double z1) {
        List<double[]> roof = new ArrayList<>(), floor = new ArrayList<>();
        for (int r = 0; r < rings.size(); r++) {
            Coordinate[] cs = rings.get(r);
            boolean ccw = Orientation.isCCW(cs);
            boolean want = r == 0;
            int n = cs.length - 1;
            double[] xy = new double[2 * n];
            for (int i = 0; i < n; i++) {
                Coordinate c = ccw == want ? cs[i] : cs[n - 1 - i];
                xy[2 * i] = c.x;
                xy[2 * i + 1] = c.y;
            }
            double[] top = new double[3 * n], bottom = new double[3 * n];
            for (int i = 0; i < n; i++) {
                top[3 * i] = xy[2 * i]; top[3 * i + 1] = xy[2 * i + 1]; top[3 * i + 2] = z1;
                int j = n - 1 - i;
                bottom[3 * i] = xy[2 * j]; bottom[3 * i + 1] = xy[2 * j + 1]; bottom[3 * i + 2] = z0;
            }
            roof.add(top);
            floor.add(bottom);
            for (int i = 0; i < n; i++) {
                int k = (i + 1) % n;
                double ax = xy[2 * i], ay = xy[2 * i + 1], bx = xy[2 * k], by = xy[2 * k + 1];
                b.polygon(block, SemanticKind.WALL, feature, List.of(new double[]{ax, ay, z0, bx, by, z0, bx, by, z1, ax, ay, z1}));
            }
        }
        b.polygon(block, SemanticKind.ROOF, feature, roof);
        b.polygon(block, SemanticKind.GROUND, feature, floor);
    }
}
