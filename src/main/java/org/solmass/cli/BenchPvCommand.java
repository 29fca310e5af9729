package org.solmass.cli;

import org.solmass.irradiation.PhaseProgress;
import org.solmass.metrics.PvZonesMetric;
import org.solmass.scene.Scene;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.table.ResultTable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code solmass bench-pv STUDY}: runs the study's analysis once, then times the PV stage alone
 * (zones, layout, racks in the scene, per-substring rays, step-by-step plane-of-array sums) several
 * times. Nothing is written.
 */
@Command(name = "bench-pv", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Times the PV stage (zones, module layout, module rays, per-step sums) on a study.",
                "Runs the analysis once, then the PV stage --repeat times; nothing is written."})
public final class BenchPvCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "STUDY", description = "study file (JSON)") Path studyFile;
    @Option(names = "--repeat", defaultValue = "3", paramLabel = "N", description = "timed runs of the PV stage (default ${DEFAULT-VALUE})") int repeat;

    @Override
    public Integer call() {
        Study study = StudyReader.read(studyFile);
        long t0 = System.nanoTime();
        AnalysisRun.Outcome o = AnalysisRun.run(study, PhaseProgress.NONE);
        System.out.printf(Locale.ROOT, "analysis: %.2f s (irradiation %.2f s, metrics %.2f s), %d steps, %d patches%n",
                (System.nanoTime() - t0) / 1e9, o.timingsS().get("irradiation"), o.timingsS().get("metrics"),
                o.weather().size(), o.patches().patchCount());
        Scene scene = Scene.build(o.model(), !o.patches().hasGroundFaces(), o.patches().groundLevelZ());
        var ctx = AnalysisRun.metricContext(study, scene, o.patches(), o.result(), o.weather());
        System.out.printf(Locale.ROOT, "%-4s %6s %8s %8s %9s %9s %9s%n", "run", "zones", "modules", "kwp", "total_s", "rays_s", "sums_s");
        for (int i = 1; i <= repeat; i++) {
            long t = System.nanoTime();
            PvZonesMetric.Found f = (PvZonesMetric.Found) new PvZonesMetric().compute(ctx, new ResultTable(o.patches().patches()));
            System.out.printf(Locale.ROOT, "%-4d %6d %8d %8.1f %9.2f %9.2f %9.2f%n", i, f.zones().zones().size(), f.modules(), f.kwp(),
                    (System.nanoTime() - t) / 1e9, f.arrays().sightS(), f.arrays().yieldS());
        }
        return Main.EXIT_OK;
    }
}
