package org.solmass.output;

import org.solmass.table.Column;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes the tables of {@code compare}: delta.csv (patch by patch) and delta-blocks.csv (per block).
 * Same conventions as patches.csv: header row first, no comment lines, each quantity with its column's
 * decimals. Columns: docs/outputs.md.
 */
public final class DeltaCsvWriter {
    public static final String DELTA = "delta.csv", BLOCKS = "delta-blocks.csv";

    private DeltaCsvWriter() {}

    /** delta.csv: matched patches (B's order), then B's unmatched, then A's unmatched. */
    public static void writeDelta(Path file, ComparedResults c) {
        AtomicFiles.writeText(file, w -> {
            StringBuilder sb = new StringBuilder("patch_id_a,patch_id_b,match,block,kind,x,y,z,area_m2");
            header(sb, c.comparison().quantities());
            w.write(sb.append('\n').toString());
            int[] mb = c.comparison().matchOfB(), ma = c.comparison().matchOfA();
            for (int r = 0; r < c.b().size(); r++) row(w, sb, c, mb[r], r, mb[r] >= 0 ? "both" : "only_b");
            for (int ra = 0; ra < c.a().size(); ra++) if (ma[ra] < 0) row(w, sb, c, ra, -1, "only_a");
        });
    }

    private static void header(StringBuilder sb, List<Column> qs) {
        for (Column q : qs) sb.append(',').append(q.name()).append("_a,").append(q.name()).append("_b,").append(q.name()).append("_delta");
    }

    private static void row(Writer w, StringBuilder sb, ComparedResults c, int ra, int rb, String match) throws IOException {
        PatchCsvReader.Table ta = c.a(), tb = c.b();
        PatchCsvReader.Table geo = rb >= 0 ? tb : ta;
        int rg = rb >= 0 ? rb : ra;
        sb.setLength(0);
        if (ra >= 0) PatchCsvWriter.text(sb, ta.ids().get(ra));
        sb.append(',');
        if (rb >= 0) PatchCsvWriter.text(sb, tb.ids().get(rb));
        sb.append(',').append(match).append(',');
        PatchCsvWriter.text(sb, geo.block(rg));
        sb.append(',').append(geo.kind(rg).label());
        for (String k : List.of("x", "y", "z")) sb.append(',').append(org.solmass.table.Numbers.format(geo.column(k)[rg], PatchCsvWriter.XYZ_DECIMALS));
        sb.append(',').append(org.solmass.table.Numbers.format(geo.column("area_m2")[rg], PatchCsvWriter.AREA_DECIMALS));
        for (Column q : c.comparison().quantities()) {
            double va = ra >= 0 ? ta.column(q.name())[ra] : Double.NaN, vb = rb >= 0 ? tb.column(q.name())[rb] : Double.NaN;
            sb.append(',').append(q.format(va)).append(',').append(q.format(vb)).append(',').append(q.format(vb - va));
        }
        w.write(sb.append('\n').toString());
    }

    /**
     * delta-blocks.csv: per block of B (and blocks only A has), matched patches and area, the
     * area-weighted (B's areas) means of A, B and B - A over matched patches, and unmatched counts.
     */
    public static void writeBlocks(Path file, ComparedResults c) {
        PatchCsvReader.Table ta = c.a(), tb = c.b();
        List<Column> qs = c.comparison().quantities();
        int nq = qs.size();
        int[] mb = c.comparison().matchOfB(), ma = c.comparison().matchOfA();
        Map<String, double[]> acc = new LinkedHashMap<>();   // block -> [matched, area, onlyB, onlyA, (sumA, sumB) per q]
        double[] area = tb.column("area_m2");
        for (int r = 0; r < tb.size(); r++) {
            double[] s = acc.computeIfAbsent(tb.block(r), k -> new double[4 + 2 * nq]);
            int ra = mb[r];
            if (ra < 0) { s[2]++; continue; }
            s[0]++;
            s[1] += area[r];
            for (int q = 0; q < nq; q++) {
                String name = qs.get(q).name();
                s[4 + 2 * q] += area[r] * ta.column(name)[ra];
                s[5 + 2 * q] += area[r] * tb.column(name)[r];
            }
        }
        for (int ra = 0; ra < ta.size(); ra++) if (ma[ra] < 0) acc.computeIfAbsent(ta.block(ra), k -> new double[4 + 2 * nq])[3]++;
        AtomicFiles.writeText(file, w -> {
            StringBuilder sb = new StringBuilder("block,matched_patches,matched_area_m2,only_b_patches,only_a_patches");
            header(sb, qs);
            w.write(sb.append('\n').toString());
            for (Map.Entry<String, double[]> e : acc.entrySet()) {
                double[] s = e.getValue();
                sb.setLength(0);
                PatchCsvWriter.text(sb, e.getKey());
                sb.append(',').append((long) s[0]).append(',').append(org.solmass.table.Numbers.format(s[1], 2))
                        .append(',').append((long) s[2]).append(',').append((long) s[3]);
                for (int q = 0; q < nq; q++) {
                    Column col = qs.get(q);
                    double mA = s[1] > 0 ? s[4 + 2 * q] / s[1] : Double.NaN, mB = s[1] > 0 ? s[5 + 2 * q] / s[1] : Double.NaN;
                    sb.append(',').append(col.format(mA)).append(',').append(col.format(mB)).append(',').append(col.format(mB - mA));
                }
                w.write(sb.append('\n').toString());
            }
        });
    }
}
