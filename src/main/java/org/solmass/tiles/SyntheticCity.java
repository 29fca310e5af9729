package org.solmass.tiles;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * An invented, seeded city for tests and benchmarks: not a real place. Box buildings on a street
 * grid (square plots of {@link #PLOT_M} m, streets between them), each a GeoJSON footprint with a
 * height, in a projected CRS (EPSG code and origin as given; by default UTM zone 32N, EPSG:32632,
 * around an invented point), read back like any GeoJSON model (org.solmass.geo). Footprints
 * 12 to 28 m a side; heights 2 to 8 storeys of 3 m, and about one building in 40 a tower of 45 to
 * 100 m. Buildings are added row by row until the estimated patch count (roof and facade area over
 * the patch area) reaches the target, so 1e5 to 1e6 patches give about 220 to 2,200 buildings at
 * 2 m patches. Writes the GeoJSON and a study file beside it ({@link #write}).
 */
public final class SyntheticCity {
    /** Plot side, metres: a 28 m building leaves a street of at least 12 m. */
    public static final double PLOT_M = 40;
    public static final double STOREY_M = 3;

    /**
     * What to generate.
     *
     * @param targetPatches estimated analysed patches to reach
     * @param patchM patch size of the study, metres
     * @param seed seed of every random choice
     * @param epsg EPSG code of the projected CRS the coordinates are in
     * @param originEastM easting of the south-west corner of the grid, metres
     * @param originNorthM northing of it, metres
     * @param rays hemisphere rays per patch in the study
     */
    public record Spec(long targetPatches, double patchM, long seed, int epsg, double originEastM, double originNorthM, int rays) {
        /** UTM 32N around an invented point (about 48 N, 9 E), 2 m patches, 256 rays. */
        public static Spec of(long targetPatches, long seed) {
            return new Spec(targetPatches, 2.0, seed, 32632, 500_000, 5_316_000, 256);
        }
    }

    /**
     * What was written.
     *
     * @param estimatedPatches the estimate the generator stopped at (the patcher's count differs by a few percent)
     * @param tallestM the tallest building, metres
     */
    public record Written(Path study, Path geoJson, int buildings, long estimatedPatches, double tallestM) {}

    private SyntheticCity() {}

    /** Writes {@code city.geojson} and {@code study.json} into {@code dir} (created if needed). */
    public static Written write(Path dir, Spec s) {
        ObjectMapper json = new ObjectMapper();
        ObjectNode fc = json.createObjectNode();
        fc.put("type", "FeatureCollection");
        fc.put("name", "invented synthetic city (seed " + s.seed() + ")");
        fc.putObject("crs").put("type", "name").putObject("properties").put("name", "urn:ogc:def:crs:EPSG::" + s.epsg());
        ArrayNode features = fc.putArray("features");
        SplittableRandom r = new SplittableRandom(s.seed());
        double perPatch = s.patchM() * s.patchM();
        // columns from a typical building (20 m square, 5 storeys: 400 + 1200 m2)
        int cols = Math.max(1, (int) Math.ceil(Math.sqrt(s.targetPatches() * perPatch / 1600.0)));
        long patches = 0;
        int b = 0;
        double tallest = 0;
        while (patches < s.targetPatches()) {
            double w = r.nextDouble(12, 28), d = r.nextDouble(12, 28);
            double x0 = (b % cols) * PLOT_M + r.nextDouble(0, PLOT_M - 12 - w) + 6;
            double y0 = (b / cols) * PLOT_M + r.nextDouble(0, PLOT_M - 12 - d) + 6;
            double h = r.nextInt(40) == 0 ? r.nextDouble(45, 100) : STOREY_M * (2 + r.nextInt(7));
            h = Math.round(h * 10) / 10.0;
            tallest = Math.max(tallest, h);
            ObjectNode f = features.addObject();
            f.put("type", "Feature");
            f.put("id", b + 1);
            f.putObject("properties").put("name", "building-" + b).put("height", h);
            ObjectNode g = f.putObject("geometry");
            g.put("type", "Polygon");
            ArrayNode ring = g.putArray("coordinates").addArray();
            double[][] pts = {{x0, y0}, {x0 + w, y0}, {x0 + w, y0 + d}, {x0, y0 + d}, {x0, y0}};
            for (double[] p : pts) ring.addArray().add(round(s.originEastM() + p[0])).add(round(s.originNorthM() + p[1]));
            patches += Math.round((w * d + 2 * (w + d) * h) / perPatch);
            b++;
        }
        try {
            Files.createDirectories(dir);
            Path geo = dir.resolve("city.geojson"), study = dir.resolve("study.json");
            json.writerWithDefaultPrettyPrinter().writeValue(geo.toFile(), fc);
            String text = String.format(Locale.ROOT, """
                    {
                      "name": "Synthetic city, seed %d (invented)",
                      "description": "Invented scenario: %d generated box buildings on a street grid. Not a real place or project.",
                      "model": { "file": "city.geojson" },
                      "site": { "zone": "+01:00" },
                      "climate": "clear-sky",
                      "patch_m": %s,
                      "rays": %d,
                      "sun_hours": { "dates": [] }
                    }
                    """, s.seed(), b, Double.toString(s.patchM()), s.rays());
            Files.writeString(study, text);
            return new Written(study, geo, b, patches, tallest);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static double round(double v) { return Math.round(v * 100) / 100.0; }

    /** {@code SyntheticCity <folder> <target patches> [seed]}: writes the city and prints what it wrote. */
    public static void main(String[] args) {
        if (args.length < 2) {
            System.err.println("usage: SyntheticCity <folder> <target patches> [seed]");
            System.exit(2);
        }
        Written w = write(Path.of(args[0]), Spec.of(Long.parseLong(args[1]), args.length > 2 ? Long.parseLong(args[2]) : 1));
        System.out.println("invented city: " + w.buildings() + " buildings, about " + w.estimatedPatches()
                + " patches, tallest " + w.tallestM() + " m -> " + w.study());
    }
}
