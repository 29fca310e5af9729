package org.solmass.geo;

import org.solmass.InputException;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.model.UpAxis;
import org.solmass.model.LengthUnit;
import org.solmass.geo.GeoOptions.ModelFormat;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The one entry for reading a model file in any format Solmass knows: OBJ (local coordinates, read
 * as always by {@link ObjReader}), GeoJSON footprints ({@link GeoJsonReader}) and CityGML
 * ({@link CityGmlReader}). The format is {@code model.format} when given, else detected: by the
 * extension ({@code .obj}; {@code .geojson}, {@code .json}; {@code .gml}, {@code .citygml},
 * {@code .xml}), else by the first bytes ({@code {} GeoJSON, {@code <} CityGML, anything else OBJ).
 */
public final class ModelFiles {
    /** Bytes looked at to detect a format. */
    static final int SNIFF_BYTES = 256;

    private ModelFiles() {}

    /** Reads a model file; {@code options} apply to OBJ (a geo-referenced file is metres, z up, north from its CRS). */
    public static GeoModel load(Path file, ModelOptions options, GeoOptions geo) {
        if (geo == null) geo = GeoOptions.defaults();
        ModelFormat f = format(file, geo.format());
        if (f == ModelFormat.OBJ) {
            ObjReader.Result r = ObjReader.load(file, options);
            List<String> w = new ArrayList<>(r.warnings());
            if (geo.epsg() > 0) {
                w.add(file + ": model.epsg " + geo.epsg() + " ignored: an OBJ model is read in local coordinates"
                        + " (model.north_deg and site.latitude/longitude place it)");
            }
            return new GeoModel(r.model(), null, w);
        }
        GeoModel g = f == ModelFormat.GEOJSON ? GeoJsonReader.read(file, geo) : CityGmlReader.read(file, geo);
        if (options == null) return g;
        List<String> ignored = new ArrayList<>();
        if (options.up() != UpAxis.Z) ignored.add("up axis");
        if (options.unit() != LengthUnit.M) ignored.add("unit");
        if (options.northDeg() != 0) ignored.add("north angle");
        if (ignored.isEmpty()) return g;
        List<String> w = new ArrayList<>(g.warnings());
        w.add(file + ": " + String.join(", ", ignored) + " ignored: a geo-referenced model is in its CRS's metres,"
                + " z up, and its north angle is the meridian convergence");
        return new GeoModel(g.model(), g.reference(), w);
    }

    /** The format of a file: {@code given} unless AUTO, else from its extension, else from its first bytes. */
    public static ModelFormat format(Path file, ModelFormat given) {
        if (given != null && given != ModelFormat.AUTO) return given;
        String n = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (n.endsWith(".obj")) return ModelFormat.OBJ;
        if (n.endsWith(".geojson") || n.endsWith(".json")) return ModelFormat.GEOJSON;
        if (n.endsWith(".gml") || n.endsWith(".citygml") || n.endsWith(".xml")) return ModelFormat.CITYGML;
        if (!Files.isRegularFile(file)) return ModelFormat.OBJ;   // the OBJ reader says what is wrong
        byte[] head;
        try (InputStream in = Files.newInputStream(file)) {
            head = in.readNBytes(SNIFF_BYTES);
        } catch (IOException e) {
            return ModelFormat.OBJ;
        }
        String s = new String(head, StandardCharsets.UTF_8).replace("\uFEFF", "").stripLeading();
        if (s.startsWith("{")) return ModelFormat.GEOJSON;
        if (s.startsWith("<")) return ModelFormat.CITYGML;
        return ModelFormat.OBJ;
    }

    /** True for the formats that carry a coordinate reference system. */
    public static boolean isGeoReferenced(Path file, ModelFormat given) {
        return format(file, given) != ModelFormat.OBJ;
    }

    /**
     * Great-circle distance of two WGS84 points (degrees), metres: the haversine formula on a sphere of
     * the mean Earth radius 6371 km (Sinnott, R. W., 1984, "Virtues of the Haversine", Sky and Telescope
     * 68(2):159); within 0.5 % of the ellipsoid, enough for a 1 km warning.
     */
    public static double distanceM(double lat1, double lon1, double lat2, double lon2) {
        double p1 = Math.toRadians(lat1), p2 = Math.toRadians(lat2);
        double dp = p2 - p1, dl = Math.toRadians(lon2 - lon1);
        double h = Math.sin(dp / 2) * Math.sin(dp / 2) + Math.cos(p1) * Math.cos(p2) * Math.sin(dl / 2) * Math.sin(dl / 2);
        return 2 * 6_371_000.0 * Math.asin(Math.min(1, Math.sqrt(h)));
    }
}
