package org.solmass.output;

import org.locationtech.jts.algorithm.ConvexHull;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.solmass.geo.GeoReference;
import org.solmass.model.MassingModel;
import org.solmass.table.Column;
import org.solmass.table.Numbers;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Per-building summaries of a city run: buildings.csv (one row per block) and, for a geo-referenced
 * model, buildings.geojson (one Polygon feature per block: the convex hull in plan of the block's
 * vertices at its lowest height, exact for convex footprints and larger for others, with the same
 * values as properties). Columns: {@code block}, {@code patches}, {@code area_m2}, {@code roof_area_m2},
 * {@code facade_area_m2}, then each per-patch result column the caller gives (a city run: all but
 * categories such as the PV zone number) under its own name as the building's
 * area-weighted mean (same unit, same decimals, {@link Column}). Layout: docs/city.md.
 */
public final class BuildingsWriter {
    public static final String CSV = "buildings.csv", GEOJSON = "buildings.geojson";
    /** Decimals of the areas (m2). */
    static final int AREA_DECIMALS = 2;

    /**
     * One building's summary.
     *
     * @param block block name
     * @param patches number of analysed patches
     * @param areaM2 their area, m2
     * @param roofAreaM2 area of the roof patches, m2
     * @param facadeAreaM2 area of the facade patches, m2
     * @param means area-weighted mean of each result column (NaN where no patch has a value)
     * @param valueAreaM2 per result column, the area of the patches with a value (the weight of the mean), m2
     */
    public record Building(String block, long patches, double areaM2, double roofAreaM2, double facadeAreaM2, double[] means,
                           double[] valueAreaM2) {}

    private BuildingsWriter() {}

    /** buildings.csv (RFC 4180, header first, each column's decimals). */
    public static void writeCsv(Path file, List<Building> buildings, List<Column> columns) {
        AtomicFiles.writeText(file, w -> {
            StringBuilder sb = new StringBuilder("block,patches,area_m2,roof_area_m2,facade_area_m2");
            for (Column c : columns) sb.append(',').append(c.name());
            w.write(sb.append('\n').toString());
            for (Building b : buildings) {
                sb.setLength(0);
                PatchCsvWriter.text(sb, b.block());
                sb.append(',').append(b.patches());
                for (double a : new double[] {b.areaM2(), b.roofAreaM2(), b.facadeAreaM2()}) {
                    sb.append(',');
                    Numbers.append(sb, a, AREA_DECIMALS);
                }
                for (int c = 0; c < columns.size(); c++) {
                    sb.append(',');
                    Numbers.append(sb, b.means()[c], columns.get(c).decimals());
                }
                w.write(sb.append('\n').toString());
            }
        });
    }

    /** buildings.geojson for a geo-referenced model; {@code footprints} from {@link #footprints}. */
    public static void writeGeoJson(Path file, List<Building> buildings, List<Column> columns, Map<String, double[]> footprints,
                                    GeoReference geo, List<String> cautions) {
        AtomicFiles.writeText(file, w -> {
            GeoJsonWriter.header(w, geo, cautions);
            StringBuilder sb = new StringBuilder(1024);
            boolean first = true;
            for (Building b : buildings) {
                double[] ring = footprints.get(b.block());
                if (ring == null || ring.length < 9) continue;
                sb.setLength(0);
                sb.append(first ? "" : ",\n").append("{\"type\":\"Feature\",\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[");
                first = false;
                GeoJsonWriter.ring(sb, ring, geo, true);
                sb.append("]},\"properties\":{\"block\":");
                GeoJsonWriter.string(sb, b.block());
                sb.append(",\"patches\":").append(b.patches());
                GeoJsonWriter.prop(sb, "area_m2", b.areaM2(), AREA_DECIMALS);
                GeoJsonWriter.prop(sb, "roof_area_m2", b.roofAreaM2(), AREA_DECIMALS);
                GeoJsonWriter.prop(sb, "facade_area_m2", b.facadeAreaM2(), AREA_DECIMALS);
                for (int c = 0; c < columns.size(); c++) GeoJsonWriter.prop(sb, columns.get(c).name(), b.means()[c], columns.get(c).decimals());
                sb.append("}}");
                w.write(sb.toString());
            }
            w.write("\n]}\n");
        });
    }

    /**
     * Each block's footprint: the convex hull (JTS) in plan of the vertices its triangles use, at the
     * block's lowest height, as x,y,z triples (not closed); blocks with fewer than three distinct
     * corners in plan are left out.
     */
    public static Map<String, double[]> footprints(MassingModel m) {
        int blocks = m.blockNames().size();
        List<List<Coordinate>> pts = new ArrayList<>(blocks);
        double[] minZ = new double[blocks];
        for (int b = 0; b < blocks; b++) {
            pts.add(new ArrayList<>());
            minZ[b] = Double.POSITIVE_INFINITY;
        }
        for (int t = 0; t < m.triangleCount(); t++) {
            int b = m.triangleBlock()[t];
            for (int k = 0; k < 3; k++) {
                int i = m.triangles()[3 * t + k] * 3;
                pts.get(b).add(new Coordinate(m.vertices()[i], m.vertices()[i + 1]));
                minZ[b] = Math.min(minZ[b], m.vertices()[i + 2]);
            }
        }
        GeometryFactory gf = new GeometryFactory();
        Map<String, double[]> out = new java.util.LinkedHashMap<>();
        for (int b = 0; b < blocks; b++) {
            if (pts.get(b).size() < 3) continue;
            Geometry hull = new ConvexHull(pts.get(b).toArray(new Coordinate[0]), gf).getConvexHull();
            Coordinate[] cs = hull.getCoordinates();
            if (!(hull instanceof org.locationtech.jts.geom.Polygon) || cs.length < 4) continue;
            double[] ring = new double[3 * (cs.length - 1)];
            for (int i = 0; i < cs.length - 1; i++) {
                ring[3 * i] = cs[i].x;
                ring[3 * i + 1] = cs[i].y;
                ring[3 * i + 2] = minZ[b];
            }
            out.put(m.blockNames().get(b), ring);
        }
        return out;
    }
}
