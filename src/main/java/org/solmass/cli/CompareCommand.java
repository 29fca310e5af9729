package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.metrics.PatchMatcher;
import org.solmass.model.ObjReader;
import org.solmass.output.AtomicFiles;
import org.solmass.output.CsvNumbers;
import org.solmass.output.MapRenderer;
import org.solmass.output.PatchCsvReader;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;
import org.solmass.study.Study;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * {@code solmass compare A B}: two results folders of massing variants of one site, patch by patch.
 * Patches are matched by position and orientation ({@link PatchMatcher}); differences are B - A.
 * Writes delta.csv, delta-blocks.csv and delta-map.png (on B's geometry). See docs/metrics.md.
 */
@Command(name = "compare", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Compares two results folders of massing variants of one site.",
                "Patches are matched by position and orientation; the differences B - A",
                "of annual irradiation, sun hours, sunshine hours and sky view factor",
                "per patch and per block go to delta.csv and delta-blocks.csv, the",
                "change in annual irradiation to delta-map.png."})
public final class CompareCommand implements Callable<Integer> {
    public static final String DELTA = "delta.csv", BLOCKS = "delta-blocks.csv", MAP = "delta-map.png";
    /** The quantities compared, when both folders have them; plus every sun_hours_MMDD column both have. */
    static final List<String> BASE_QUANTITIES = List.of("annual_kwh_m2", "sunshine_h", "sky_view_factor");

    @Parameters(index = "0", paramLabel = "RESULTS-A", description = "results folder of variant A (the reference)") Path a;
    @Parameters(index = "1", paramLabel = "RESULTS-B", description = "results folder of variant B") Path b;
    @Option(names = "--out", paramLabel = "DIR", description = "output folder (default: RESULTS-B/compare)") Path out;
    @Option(names = "--max-angle", paramLabel = "DEG", description = "largest angle between matched normals (default 5)") Double maxAngle;
    @Option(names = "--no-map", description = "do not write delta-map.png") boolean noMap;

    /** A finished comparison. */
    public record Comparison(PatchCsvReader.Table a, PatchCsvReader.Table b, int[] matchOfB, int[] matchOfA,
                             List<String> quantities) {
        public int matched() { return (int) Arrays.stream(matchOfB).filter(i -> i >= 0).count(); }

        /** B - A of a quantity per row of B; NaN where unmatched. */
        public double[] delta(String q) {
            double[] va = a.column(q), vb = b.column(q), d = new double[matchOfB.length];
            for (int r = 0; r < d.length; r++) d[r] = matchOfB[r] >= 0 ? vb[r] - va[matchOfB[r]] : Double.NaN;
            return d;
        }
    }

    @Override
    public Integer call() {
        if (maxAngle != null && !(maxAngle >= 0 && maxAngle <= 90)) {
            throw new InputException("--max-angle", "expected an angle from 0 to 90 degrees, got " + maxAngle);
        }
        Path dir = out != null ? out : b.resolve("compare");
        RunRecord runA = RunRecord.read(a), runB = RunRecord.read(b);
        Comparison c = compare(a.resolve(ResultsFolder.PATCHES), b.resolve(ResultsFolder.PATCHES),
                0.5 * Math.min(runA.study().patchM(), runB.study().patchM()),
                maxAngle != null ? maxAngle : PatchMatcher.DEFAULT_MAX_ANGLE_DEG);
        List<Path> written = new ArrayList<>();
        Path delta = dir.resolve(DELTA);
        writeDelta(delta, c);
        written.add(delta);
        Path blocks = dir.resolve(BLOCKS);
        writeBlocks(blocks, c);
        written.add(blocks);
        if (!noMap && c.quantities().contains("annual_kwh_m2")) {
            if (!runB.modelUnchanged()) {
                System.err.println("solmass: warning: the model of " + b + " changed since its run; delta-map.png not written");
            } else {
                Path map = dir.resolve(MAP);
                writeMap(map, c, runB.study());
                written.add(map);
            }
        }
        int nb = c.b().size(), na = c.a().size(), m = c.matched();
        System.out.printf("solmass compare: %s (A) -> %s (B)%n", a, b);
        System.out.printf("  %d patches matched; %d of A and %d of B unmatched (listed in %s)%n", m, na - m, nb - m, DELTA);
        double[] areaB = c.b().column("area_m2");
        for (String q : c.quantities()) {
            double[] d = c.delta(q);
            double s = 0, ar = 0;
            for (int r = 0; r < d.length; r++) if (Double.isFinite(d[r])) { s += d[r] * areaB[r]; ar += areaB[r]; }
            System.out.printf("  %s: area-weighted mean change %s%n", q, ar > 0 ? CsvNumbers.format(s / ar, 3) : "n/a");
        }
        for (Path f : written) System.out.println("  wrote " + f);
        return Main.EXIT_OK;
    }

    /** Reads and matches two patches.csv files. */
    public static Comparison compare(Path csvA, Path csvB, double maxDistanceM, double maxAngleDeg) {
        PatchCsvReader.Table ta = PatchCsvReader.read(csvA), tb = PatchCsvReader.read(csvB);
        int[] mb = PatchMatcher.match(xyz(ta, "x", "y", "z"), xyz(ta, "nx", "ny", "nz"),
                xyz(tb, "x", "y", "z"), xyz(tb, "nx", "ny", "nz"), maxDistanceM, maxAngleDeg);
        int[] ma = new int[ta.size()];
        Arrays.fill(ma, -1);
        for (int r = 0; r < mb.length; r++) if (mb[r] >= 0) ma[mb[r]] = r;
        List<String> qs = new ArrayList<>();
        for (String q : BASE_QUANTITIES) if (ta.has(q) && tb.has(q)) qs.add(q);
        for (String q : tb.resultColumns()) if (q.startsWith("sun_hours_") && ta.has(q)) qs.add(q);
        if (qs.isEmpty()) throw new InputException(csvB.toString(), "no result column in common with " + csvA + " to compare");
        return new Comparison(ta, tb, mb, ma, List.copyOf(qs));
    }

    private static double[] xyz(PatchCsvReader.Table t, String x, String y, String z) {
        double[] cx = t.column(x), cy = t.column(y), cz = t.column(z), out = new double[3 * t.size()];
        for (int i = 0; i < t.size(); i++) {
            out[3 * i] = cx[i];
            out[3 * i + 1] = cy[i];
            out[3 * i + 2] = cz[i];
        }
        return out;
    }

    /** delta.csv: matched patches (B's order), then B's unmatched, then A's unmatched. */
    static void writeDelta(Path file, Comparison c) {
        AtomicFiles.writeText(file, w -> {
            w.write("# Solmass comparison: differences are B - A; patches matched by centroid and normal (docs/metrics.md)\n");
            StringBuilder sb = new StringBuilder("patch_id_a,patch_id_b,match,block,kind,x,y,z,area_m2");
            for (String q : c.quantities()) sb.append(',').append(q).append("_a,").append(q).append("_b,").append(q).append("_delta");
            w.write(sb.append('\n').toString());
            PatchCsvReader.Table ta = c.a(), tb = c.b();
            for (int r = 0; r < tb.size(); r++) {
                int ra = c.matchOfB()[r];
                row(w, sb, c, ra, r, ra >= 0 ? "both" : "only_b");
            }
            for (int ra = 0; ra < ta.size(); ra++) if (c.matchOfA()[ra] < 0) row(w, sb, c, ra, -1, "only_a");
        });
    }

    private static void row(java.io.Writer w, StringBuilder sb, Comparison c, int ra, int rb, String match) throws java.io.IOException {
        PatchCsvReader.Table ta = c.a(), tb = c.b();
        PatchCsvReader.Table geo = rb >= 0 ? tb : ta;
        int rg = rb >= 0 ? rb : ra;
        sb.setLength(0);
        sb.append(ra >= 0 ? csvText(ta.ids().get(ra)) : "").append(',').append(rb >= 0 ? csvText(tb.ids().get(rb)) : "")
                .append(',').append(match).append(',').append(csvText(geo.block(rg))).append(',').append(geo.kind(rg).label());
        for (String k : List.of("x", "y", "z")) sb.append(',').append(CsvNumbers.format(geo.column(k)[rg], 3));
        sb.append(',').append(CsvNumbers.format(geo.column("area_m2")[rg], 4));
        for (String q : c.quantities()) {
            int dec = q.equals("sky_view_factor") ? 4 : 2;
            double va = ra >= 0 ? ta.column(q)[ra] : Double.NaN, vb = rb >= 0 ? tb.column(q)[rb] : Double.NaN;
            sb.append(',').append(CsvNumbers.format(va, dec)).append(',').append(CsvNumbers.format(vb, dec))
                    .append(',').append(CsvNumbers.format(vb - va, dec));
        }
        w.write(sb.append('\n').toString());
    }

    private static String csvText(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && !s.startsWith("#")) return s;
        return "\"" + s.replace("\"", "\"\"") + "\"";
    }

    /**
     * delta-blocks.csv: per block of B (and blocks only A has), matched patches and area, the
     * area-weighted (B's areas) means of A, B and B - A over matched patches, and unmatched counts.
     */
    static void writeBlocks(Path file, Comparison c) {
        PatchCsvReader.Table ta = c.a(), tb = c.b();
        Map<String, double[]> acc = new LinkedHashMap<>();   // block -> [matched, area, onlyB, onlyA, (sumA, sumB) per q]
        int nq = c.quantities().size();
        double[] area = tb.column("area_m2");
        for (int r = 0; r < tb.size(); r++) {
            double[] s = acc.computeIfAbsent(tb.block(r), k -> new double[4 + 2 * nq]);
            int ra = c.matchOfB()[r];
            if (ra < 0) { s[2]++; continue; }
            s[0]++;
            s[1] += area[r];
            for (int q = 0; q < nq; q++) {
                String name = c.quantities().get(q);
                s[4 + 2 * q] += area[r] * ta.column(name)[ra];
                s[5 + 2 * q] += area[r] * tb.column(name)[r];
            }
        }
        for (int ra = 0; ra < ta.size(); ra++) if (c.matchOfA()[ra] < 0) acc.computeIfAbsent(ta.block(ra), k -> new double[4 + 2 * nq])[3]++;
        AtomicFiles.writeText(file, w -> {
            StringBuilder sb = new StringBuilder("block,matched_patches,matched_area_m2,only_b_patches,only_a_patches");
            for (String q : c.quantities()) sb.append(',').append(q).append("_a,").append(q).append("_b,").append(q).append("_delta");
            w.write(sb.append('\n').toString());
            for (Map.Entry<String, double[]> e : acc.entrySet()) {
                double[] s = e.getValue();
                sb.setLength(0);
                sb.append(csvText(e.getKey())).append(',').append((long) s[0]).append(',').append(CsvNumbers.format(s[1], 2))
                        .append(',').append((long) s[2]).append(',').append((long) s[3]);
                for (int q = 0; q < nq; q++) {
                    int dec = c.quantities().get(q).equals("sky_view_factor") ? 4 : 2;
                    double ma = s[1] > 0 ? s[4 + 2 * q] / s[1] : Double.NaN, mb = s[1] > 0 ? s[5 + 2 * q] / s[1] : Double.NaN;
                    sb.append(',').append(CsvNumbers.format(ma, dec)).append(',').append(CsvNumbers.format(mb, dec))
                            .append(',').append(CsvNumbers.format(mb - ma, dec));
                }
                w.write(sb.append('\n').toString());
            }
        });
    }

    /** delta-map.png: B's geometry rebuilt from its run record, patches coloured by the annual difference. */
    static void writeMap(Path file, Comparison c, Study studyB) {
        ObjReader.Result read = AnalysisRun.loadModel(studyB);
        PatchSet ps = Patcher.build(read.model(), new PatchOptions(studyB.patchM(),
                AnalysisRun.analysedBlocks(studyB, read.model()), false));
        double[] d = c.delta("annual_kwh_m2");
        List<Patch> patches = ps.patches();
        double[] v = new double[patches.size()];
        for (int p = 0; p < v.length; p++) {
            int r = c.b().row(patches.get(p).id());
            v[p] = r >= 0 ? d[r] : Double.NaN;
        }
        MapRenderer.write(file, read.model(), studyB.model().analysedMask(read.model().blockNames()), patches, v,
                "Change in annual irradiation, B - A", "kWh/m2",
                MapRenderer.Options.of(studyB.outputs().mapWidthPx(), studyB.outputs().mapHeightPx(), studyB.name()),
                new MapRenderer.Extras(true, List.of(), ""));
    }
}
