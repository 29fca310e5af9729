package org.solmass.output;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.study.StudyWriter;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;
import org.solmass.table.Column;
import org.solmass.table.Numbers;
import org.solmass.table.ResultTable;
import org.solmass.table.Unit;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Writes summary.json: for all patches, per kind (roof, facade, ground, underside) and per block
 * (and per kind within each block): patch count, area, and for each named column its area-weighted
 * mean, min and max (and for kWh/m2 columns the total kWh, the sum of value x area); for the
 * threshold column the area (and share of area) at or above each threshold. Then cautions and the
 * run record (study, version, counts, timings). Keys in a fixed order; layout in docs/outputs.md.
 * Non-finite values (NaN) are left out of the statistics and counted as {@code missing}.
 */
public final class SummaryWriter {
    /** Default thresholds of annual irradiation, kWh/m2 per year (docs/outputs.md). */
    public static final List<Double> DEFAULT_THRESHOLDS = List.of(300.0, 600.0, 900.0, 1200.0);

    private SummaryWriter() {}

    /**
     * What to summarise.
     *
     * @param columns result columns to give statistics for (absent ones are skipped)
     * @param thresholdColumn the column the thresholds apply to (e.g. annual_kwh_m2); null for none
     * @param thresholds ascending thresholds in that column's unit
     */
    public record Spec(List<String> columns, String thresholdColumn, List<Double> thresholds, double storeyHeightM) {
        /** Storey height of the facade height bands when the study gives none, metres (common practice: 3 m floor to floor). */
        public static final double DEFAULT_STOREY_HEIGHT_M = 3.0;

        public Spec {
            columns = List.copyOf(columns);
            thresholds = List.copyOf(thresholds);
            if (!(storeyHeightM > 0)) throw new IllegalArgumentException("storey height must be > 0: " + storeyHeightM);
        }

        /** A spec with the default storey height. */
        public Spec(List<String> columns, String thresholdColumn, List<Double> thresholds) {
            this(columns, thresholdColumn, thresholds, DEFAULT_STOREY_HEIGHT_M);
        }

        /** The same with another storey height, metres. */
        public Spec withStoreyHeight(double m) {
            return new Spec(columns, thresholdColumn, thresholds, m);
        }

        /**
         * annual_kwh_m2 and its components, shading loss, sky view factor and (hourly year) sunshine
         * hours; the given thresholds on annual_kwh_m2.
         */
        public static Spec standard(List<Double> thresholds) {
            return new Spec(java.util.stream.Stream.of(IrradiationColumns.ANNUAL, IrradiationColumns.BEAM,
                    IrradiationColumns.DIFFUSE, IrradiationColumns.REFLECTED, IrradiationColumns.UNSHADED,
                    IrradiationColumns.SHADING_LOSS, IrradiationColumns.SKY_VIEW_FACTOR, IrradiationColumns.SUNSHINE_H,
                    IrradiationColumns.ANNUAL_STD_ERROR)
                    .map(Column::name).toList(), IrradiationColumns.ANNUAL.name(), thresholds);
        }

        /** The same with further columns (a metric's) after the standard ones. */
        public Spec with(List<String> more) {
            List<String> all = new java.util.ArrayList<>(columns);
            for (String c : more) if (!all.contains(c)) all.add(c);
            return new Spec(all, thresholdColumn, thresholds, storeyHeightM);
        }
    }

    /** Writes summary.json atomically. */
    public static void write(Path file, ResultTable table, Spec spec, RunRecord run, List<String> cautions) {
        AtomicFiles.writeString(file, StudyWriter.pretty(toTree(table, spec, run, cautions)));
    }

    /** The summary as a JSON tree; {@code run} may be null (then no "run" section). */
    public static ObjectNode toTree(ResultTable table, Spec spec, RunRecord run, List<String> cautions) {
        List<String> cols = spec.columns().stream().filter(table::has).toList();
        String thrCol = spec.thresholdColumn() != null && table.has(spec.thresholdColumn()) ? spec.thresholdColumn() : null;
        double[][] values = new double[cols.size()][];
        for (int c = 0; c < cols.size(); c++) values[c] = table.column(cols.get(c));
        double[] thr = spec.thresholds().stream().mapToDouble(Double::doubleValue).toArray();
        double[] thrValues = thrCol == null ? null : table.column(thrCol);

        int kinds = SurfaceKind.values().length;
        Group all = new Group(cols.size(), thr.length);
        Group[] byKind = new Group[kinds];
        Map<Integer, Group> byBlock = new TreeMap<>();
        Map<Integer, Group[]> byBlockKind = new TreeMap<>();
        Map<Integer, String> blockNames = new TreeMap<>();
        List<Patch> patches = table.patches();
        double[] row = new double[cols.size()];
        for (int p = 0; p < patches.size(); p++) {
            Patch q = patches.get(p);
            for (int c = 0; c < row.length; c++) row[c] = values[c][p];
            double tv = thrValues == null ? Double.NaN : thrValues[p];
            int k = q.kind().ordinal();
            all.add(q.areaM2(), row, tv, thr);
            if (byKind[k] == null) byKind[k] = new Group(cols.size(), thr.length);
            byKind[k].add(q.areaM2(), row, tv, thr);
            blockNames.putIfAbsent(q.block(), q.blockName());
            byBlock.computeIfAbsent(q.block(), b -> new Group(cols.size(), thr.length)).add(q.areaM2(), row, tv, thr);
            Group[] bk = byBlockKind.computeIfAbsent(q.block(), b -> new Group[kinds]);
            if (bk[k] == null) bk[k] = new Group(cols.size(), thr.length);
            bk[k].add(q.areaM2(), row, tv, thr);
        }

        JsonNodeFactory f = JsonNodeFactory.instance;
        ObjectNode root = f.objectNode();
        if (run != null) {
            root.put("study", run.study().name());
            root.put("solmass_version", run.solmassVersion());
        }
        ObjectNode colInfo = root.putObject("columns");
        for (String c : cols) colInfo.putObject(c).put("unit", table.def(c).unit().symbol()).put("label", table.def(c).label());
        if (thrCol != null) {
            ObjectNode t = root.putObject("thresholds");
            t.put("column", thrCol);
            t.put("unit", table.def(thrCol).unit().symbol());
            ArrayNode a = t.putArray("values");
            for (double v : thr) a.add(v);
        }
        Emit emit = new Emit(cols, table, thr, thrCol != null);
        root.set("all", emit.group(all));
        ObjectNode kn = root.putObject("by_kind");
        for (SurfaceKind k : SurfaceKind.values()) if (byKind[k.ordinal()] != null) kn.set(k.label(), emit.group(byKind[k.ordinal()]));
        ObjectNode bn = root.putObject("by_block");
        for (Map.Entry<Integer, Group> e : byBlock.entrySet()) {
            ObjectNode g = emit.group(e.getValue());
            ObjectNode gk = g.putObject("by_kind");
            Group[] bk = byBlockKind.get(e.getKey());
            for (SurfaceKind k : SurfaceKind.values()) if (bk[k.ordinal()] != null) gk.set(k.label(), emit.group(bk[k.ordinal()]));
            String name = blockNames.get(e.getKey());
            bn.set(bn.has(name) ? name + " (block " + e.getKey() + ")" : name, g);   // two blocks may share a name
        }
        Breakdown br = Breakdown.of(patches, spec.storeyHeightM(), cols.size(), thr.length, values, thrValues, thr);
        ObjectNode on = root.putObject("by_facade_orientation");
        for (Map.Entry<String, Group> e : br.orientation.entrySet()) on.set(e.getKey(), emit.group(e.getValue()));
        ObjectNode sn = root.putObject("by_facade_storey");
        sn.put("storey_height_m", spec.storeyHeightM());
        sn.put("base_z", round(br.baseZ, 3));
        for (Map.Entry<Integer, Group> e : br.storey.entrySet()) {
            sn.set(Breakdown.bandLabel(e.getKey(), spec.storeyHeightM()), emit.group(e.getValue()));
        }
        ObjectNode un = root.putObject("by_surface");
        for (Map.Entry<String, Group> e : br.surface.entrySet()) {
            ObjectNode g = JsonNodeFactory.instance.objectNode();
            Patch first = br.surfaceFirst.get(e.getKey());
            g.put("block", first.blockName());
            g.put("kind", first.kind().label());
            g.put("tilt_deg", round(first.tiltDeg(), 2));
            g.put("azimuth_deg", round(first.azimuthDeg(), 2));
            g.setAll(emit.group(e.getValue()));
            un.set(e.getKey(), g);
        }
        ArrayNode ca = root.putArray("cautions");
        for (String c : cautions) ca.add(c);
        if (run != null) root.set("run", run.toTree());
        return root;
    }

    /**
     * The finer groups of summary.json: facade patches by compass sector of their azimuth (N, NE, ...,
     * NW: 45 deg sectors centred on the eight directions) and by storey band (height of the centroid
     * above the lowest point of all patches, in bands of the storey height: band k covers
     * [k h, (k + 1) h)), and every patch by its surface ({@code B<block>-S<surface>}, the prefix of its
     * patch ids).
     */
    static final class Breakdown {
        final Map<String, Group> orientation = new java.util.LinkedHashMap<>();
        final Map<Integer, Group> storey = new TreeMap<>();
        final Map<String, Group> surface = new java.util.LinkedHashMap<>();
        final Map<String, Patch> surfaceFirst = new java.util.HashMap<>();
        double baseZ;

        static Breakdown of(List<Patch> patches, double storeyM, int cols, int nThr, double[][] values, double[] thrValues,
                            double[] thr) {
            Breakdown b = new Breakdown();
            b.baseZ = Double.POSITIVE_INFINITY;
            for (Patch q : patches) {
                double[] o = q.outline();
                for (int k = 2; k < o.length; k += 3) b.baseZ = Math.min(b.baseZ, o[k]);
                if (o.length == 0) b.baseZ = Math.min(b.baseZ, q.centroid().z());
            }
            if (!Double.isFinite(b.baseZ)) b.baseZ = 0;
            for (String sct : org.solmass.model.Compass.shortNames()) b.orientation.put(sct, null);
            double[] row = new double[cols];
            for (int p = 0; p < patches.size(); p++) {
                Patch q = patches.get(p);
                for (int c = 0; c < cols; c++) row[c] = values[c][p];
                double tv = thrValues == null ? Double.NaN : thrValues[p];
                String sid = surfaceLabel(q);
                b.surfaceFirst.putIfAbsent(sid, q);
                b.surface.computeIfAbsent(sid, k -> new Group(cols, nThr)).add(q.areaM2(), row, tv, thr);
                if (q.kind() != SurfaceKind.FACADE) continue;
                String sct = sector(q.azimuthDeg());
                if (b.orientation.get(sct) == null) b.orientation.put(sct, new Group(cols, nThr));
                b.orientation.get(sct).add(q.areaM2(), row, tv, thr);
                int band = (int) Math.floor((q.centroid().z() - b.baseZ) / storeyM + 1e-9);
                b.storey.computeIfAbsent(band, k -> new Group(cols, nThr)).add(q.areaM2(), row, tv, thr);
            }
            b.orientation.values().removeIf(java.util.Objects::isNull);
            return b;
        }

        /** The compass sector of an azimuth ({@link org.solmass.model.Compass}). */
        static String sector(double azimuthDeg) {
            return org.solmass.model.Compass.shortName(azimuthDeg);
        }

        /** "B3-S12" of patch id "B3-S12-P0045". */
        static String surfaceLabel(Patch q) {
            int i = q.id().lastIndexOf("-P");
            return i > 0 ? q.id().substring(0, i) : "B" + q.block() + "-S" + q.surface();
        }

        /** "3-6 m" for band 1 of 3 m storeys. */
        static String bandLabel(int band, double h) {
            return label(band * h) + "-" + label((band + 1) * h) + " m";
        }
    }

    /** Running sums of one group of patches. */
    static final class Group {
        int patches;
        double area;
        final double[] valueArea, sumVA, sumSqVA, min, max, aboveArea;
        final int[] missing;

        Group(int cols, int thresholds) {
            valueArea = new double[cols];
            sumVA = new double[cols];
            sumSqVA = new double[cols];
            min = new double[cols];
            max = new double[cols];
            missing = new int[cols];
            aboveArea = new double[thresholds];
            java.util.Arrays.fill(min, Double.POSITIVE_INFINITY);
            java.util.Arrays.fill(max, Double.NEGATIVE_INFINITY);
        }

        void add(double a, double[] v, double thresholdValue, double[] thr) {
            patches++;
            area += a;
            for (int c = 0; c < v.length; c++) {
                if (!Double.isFinite(v[c])) {
                    missing[c]++;
                    continue;
                }
                valueArea[c] += a;
                sumVA[c] += v[c] * a;
                sumSqVA[c] += v[c] * a * v[c] * a;
                min[c] = Math.min(min[c], v[c]);
                max[c] = Math.max(max[c], v[c]);
            }
            for (int t = 0; t < thr.length; t++) if (thresholdValue >= thr[t]) aboveArea[t] += a;
        }
    }

    /**
     * Two-sided 95 % quantile of the standard normal distribution (1.959964, rounded as commonly
     * tabulated). The half-width of an area-weighted mean of patches with independent sampling errors
     * se_p is Z95 sqrt(sum (a_p se_p)^2) / sum a_p (variance of a weighted sum of independent
     * estimates; each patch draws its rays from its own seed).
     */
    static final double Z95 = 1.96;

    /** Turns groups into JSON with the documented rounding. */
    private record Emit(List<String> cols, ResultTable table, double[] thr, boolean thresholds) {
        ObjectNode group(Group g) {
            ObjectNode o = JsonNodeFactory.instance.objectNode();
            o.put("patches", g.patches);
            o.put("area_m2", round(g.area, 2));
            for (int c = 0; c < cols.size(); c++) {
                Column def = table.def(cols.get(c));
                int d = def.decimals();
                ObjectNode s = o.putObject(cols.get(c));
                if (g.valueArea[c] > 0) {
                    s.put("mean", round(g.sumVA[c] / g.valueArea[c], d));
                    s.put("min", round(g.min[c], d));
                    s.put("max", round(g.max[c], d));
                    boolean spread = def.equals(IrradiationColumns.ANNUAL_STD_ERROR); // an error's area sum means nothing
                    if (def.unit() == Unit.KWH_M2 && !spread) s.put("total_kwh", round(g.sumVA[c], 1));
                    int se = cols.indexOf(IrradiationColumns.ANNUAL_STD_ERROR.name());
                    if (cols.get(c).equals(IrradiationColumns.ANNUAL.name()) && se >= 0 && g.valueArea[se] > 0) {
                        s.put("mean_ci95_kwh_m2", round(Z95 * Math.sqrt(g.sumSqVA[se]) / g.valueArea[se], d));
                    }
                } else {
                    s.putNull("mean");
                    s.putNull("min");
                    s.putNull("max");
                }
                if (g.missing[c] > 0) s.put("missing", g.missing[c]);
            }
            if (thresholds) {
                ObjectNode at = o.putObject("area_at_or_above_m2");
                ObjectNode share = o.putObject("share_at_or_above_pct");
                for (int t = 0; t < thr.length; t++) {
                    String key = label(thr[t]);
                    at.put(key, round(g.aboveArea[t], 2));
                    share.put(key, g.area > 0 ? round(100 * g.aboveArea[t] / g.area, 2) : BigDecimal.ZERO);
                }
            }
            return o;
        }
    }

    static BigDecimal round(double v, int decimals) {
        return new BigDecimal(Numbers.format(v, decimals));
    }

    /** A threshold as a key: "300", "450.5". */
    static String label(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }
}
