package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.metrics.PatchMatcher;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.metrics.PatchComparison;
import org.solmass.output.ComparedResults;
import org.solmass.output.ComparisonNote;
import org.solmass.output.DeltaCsvWriter;
import org.solmass.output.MapRenderer;
import org.solmass.output.PatchCsvReader;
import org.solmass.output.PublishedRun;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunRecord;
import org.solmass.study.Study;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.table.Column;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

/**
 * {@code solmass compare A B}: two results folders of massing variants of one site, patch by patch.
 * Patches are matched by position and orientation ({@link PatchMatcher}); differences are B - A.
 * Writes delta.csv, delta-blocks.csv, delta-map.png (on B's geometry) and compare.json (the two runs
 * and the settings in which they differ, {@link ComparisonNote}). Runs that differ in site, zone,
 * climate, sky model, time base or patch size are compared with a warning, or refused with
 * {@code --strict}. See docs/metrics.md.
 */
@Command(name = "compare", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Compares two results folders of massing variants of one site.",
                "Patches are matched by position and orientation; the differences B - A",
                "of annual irradiation, sun hours, sunshine hours and sky view factor",
                "per patch and per block go to delta.csv and delta-blocks.csv, the",
                "change in annual irradiation to delta-map.png, the two runs and",
                "the settings in which they differ to compare.json."})
public final class CompareCommand implements Callable<Integer> {
    public static final String DELTA = DeltaCsvWriter.DELTA, BLOCKS = DeltaCsvWriter.BLOCKS, MAP = "delta-map.png",
            NOTE = ComparisonNote.FILE_NAME;

    @Parameters(index = "0", paramLabel = "RESULTS-A", description = "results folder of variant A (the reference)") Path a;
    @Parameters(index = "1", paramLabel = "RESULTS-B", description = "results folder of variant B") Path b;
    @Option(names = "--out", paramLabel = "DIR", description = "output folder (default: RESULTS-B/compare)") Path out;
    @Option(names = "--max-angle", paramLabel = "DEG", description = "largest angle between matched normals (default 5)") Double maxAngle;
    @Option(names = "--no-map", description = "do not write delta-map.png") boolean noMap;
    @Option(names = "--strict", description = {"refuse (exit 2) runs that differ in site, zone, climate, sky model,",
            "time base or patch size instead of warning"}) boolean strict;

    @Override
    public Integer call() {
        if (maxAngle != null && !(maxAngle >= 0 && maxAngle <= 90)) {
            throw new InputException("--max-angle", "expected an angle from 0 to 90 degrees, got " + maxAngle);
        }
        Path dir = out != null ? out : b.resolve("compare");
        PublishedRun pa = PublishedRun.open(a), pb = PublishedRun.open(b);
        for (String w : pa.warnings()) System.err.println("solmass: warning: " + w);
        for (String w : pb.warnings()) System.err.println("solmass: warning: " + w);
        ComparisonNote note = ComparisonNote.of(pa, pb);
        for (ComparisonNote.Difference d : note.differences()) System.err.println("solmass: warning: " + d.message());
        if (strict && note.hasDifferences()) {
            System.err.println("solmass: compare refused (--strict): the runs differ in "
                    + String.join(", ", note.differences().stream().map(ComparisonNote.Difference::field).toList())
                    + "; nothing written");
            return Main.EXIT_INPUT;
        }
        org.solmass.output.FolderClaim.prepareWritable(dir, out != null ? "--out" : b.toString());   // before the matching
        RunRecord runB = pb.record();
        ComparedResults c = read(pa, pb, maxAngle != null ? maxAngle : PatchMatcher.DEFAULT_MAX_ANGLE_DEG);
        List<Path> written = new ArrayList<>();
        Path delta = dir.resolve(DELTA);
        DeltaCsvWriter.writeDelta(delta, c);
        written.add(delta);
        Path blocks = dir.resolve(BLOCKS);
        DeltaCsvWriter.writeBlocks(blocks, c);
        written.add(blocks);
        Path notePath = dir.resolve(NOTE);
        note.write(notePath);
        written.add(notePath);
        if (!noMap && c.comparison().quantities().contains(IrradiationColumns.ANNUAL)) {
            if (!runB.modelUnchanged()) {
                System.err.println("solmass: warning: the model of " + b + " changed since its run; delta-map.png not written");
            } else {
                Path map = dir.resolve(MAP);
                String perA = org.solmass.output.RunPeriod.of(pa.record()), perB = org.solmass.output.RunPeriod.of(runB);
                writeMap(map, c, runB.study(), perA.equals(perB) ? perB : "A: " + perA + "; B: " + perB);
                written.add(map);
            }
        }
        int nb = c.b().size(), na = c.a().size(), m = c.matched();
        System.out.printf("solmass compare: %s (A) -> %s (B)%n", a, b);
        System.out.printf("  %d patches matched; %d of A and %d of B unmatched (listed in %s)%n", m, na - m, nb - m, DELTA);
        double[] areaB = c.b().column("area_m2");
        for (Column q : c.comparison().quantities()) {
            double[] d = c.delta(q);
            double s = 0, ar = 0;
            for (int r = 0; r < d.length; r++) if (Double.isFinite(d[r])) { s += d[r] * areaB[r]; ar += areaB[r]; }
            System.out.printf("  %s: area-weighted mean change %s%n", q.label(),
                    ar > 0 ? (q.format(s / ar) + " " + q.unit().symbol()).trim() : "no matched patch");
        }
        if (note.hasDifferences()) {
            System.out.println("  caution: the runs differ in " + String.join(", ",
                    note.differences().stream().map(ComparisonNote.Difference::field).toList()) + " (see " + NOTE + ")");
        }
        for (Path f : written) System.out.println("  wrote " + f);
        return Main.EXIT_OK;
    }

    /**
     * Reads (each checked against its folder's run.json) and matches the patches.csv files of two results
     * folders; matched within half the smaller patch size.
     */
    static ComparedResults read(PublishedRun runA, PublishedRun runB, double maxAngleDeg) {
        PatchCsvReader.Table ta = runA.read(ResultsFolder.PATCHES, PatchCsvReader::read);
        PatchCsvReader.Table tb = runB.read(ResultsFolder.PATCHES, PatchCsvReader::read);
        return ComparedResults.of(ta, runA.folder().resolve(ResultsFolder.PATCHES), tb, runB.folder().resolve(ResultsFolder.PATCHES),
                0.5 * Math.min(runA.record().study().patchM(), runB.record().study().patchM()), maxAngleDeg);
    }

    /**
     * delta-map.png: B's geometry rebuilt from its run record, patches coloured by the annual difference.
     *
     * @param period what the two runs cover ({@code RunPeriod}; both when they differ), under the title as on map.png
     */
    static void writeMap(Path file, ComparedResults c, Study studyB, String period) {
        org.solmass.geo.GeoModel read = AnalysisRun.loadModel(studyB);
        PatchSet ps = Patcher.build(read.model(), new PatchOptions(studyB.patchM(),
                AnalysisRun.analysedBlocks(studyB, read.model()), false));
        Column q = PatchComparison.delta(IrradiationColumns.ANNUAL);
        double[] d = c.delta(IrradiationColumns.ANNUAL);
        List<Patch> patches = ps.patches();
        double[] v = new double[patches.size()];
        for (int p = 0; p < v.length; p++) {
            int r = c.b().row(patches.get(p).id());
            v[p] = r >= 0 ? d[r] : Double.NaN;
        }
        MapRenderer.write(file, read.model(), studyB.model().analysedMask(read.model().blockNames()), patches, v,
                q.label(), q.unit().symbol(),
                MapRenderer.Options.of(studyB.outputs().mapWidthPx(), studyB.outputs().mapHeightPx(), studyB.name()).withPeriod(period),
                new MapRenderer.Extras(true, List.of(), ""));
    }
}
