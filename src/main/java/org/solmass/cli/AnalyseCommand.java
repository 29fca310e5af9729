package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.study.Study;
import org.solmass.table.AreaStats;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

/** {@code solmass analyse}: the main job, shading-aware irradiation of every patch of a model. */
@Command(name = "analyse", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"The main job: shading-aware irradiation of every patch of a massing model.",
                "Beam, sky diffuse and reflected light with the obstruction of the neighbouring blocks,",
                "summed to months and the year.",
                "Give a study file, or the model and site as flags; flags override the study file.",
                "Writes patches.csv, zones.csv, summary.json, map.png, patches.gltf and",
                "run.json to the output folder."})
public final class AnalyseCommand implements Callable<Integer> {
    @Parameters(arity = "0..1", paramLabel = "STUDY.json", description = "study file (docs/study-file.md)")
    Path studyFile;

    @Option(names = "--model", paramLabel = "MODEL", description = "massing model: OBJ, GeoJSON footprints or CityGML (see --format)") Path model;
    @Mixin ModelFlags modelFlags = new ModelFlags();
    @Option(names = "--analyse", paramLabel = "BLOCK", split = ",", description = "blocks to analyse (default all not in --context)") List<String> analyse;
    @Option(names = "--context", paramLabel = "BLOCK", split = ",", description = "blocks that only obstruct") List<String> context;
    @Mixin SiteOptions site = new SiteOptions();
    @Mixin ClimateOptions climate = new ClimateOptions();
    @Mixin TerrainFlags terrain = new TerrainFlags();
    @Option(names = "--patch", paramLabel = "M", description = "patch size, metres (default 1)") Double patch;
    @Option(names = "--rays", paramLabel = "N", description = "hemisphere rays per patch (default 1024)") Integer rays;
    @Option(names = "--reflection-rays", paramLabel = "N", description = "of those, rays that sample reflected light (default 256)") Integer reflectionRays;
    @Option(names = "--max-bounces", paramLabel = "N", description = "most reflection bounces (default 20)") Integer maxBounces;
    @Option(names = "--bounce-tolerance", paramLabel = "PCT", description = "stop reflection after a bounce adding at most PCT % (default 0.5)") Double bounceTolerance;
    @Mixin SkyFlag sky = new SkyFlag();
    @Option(names = "--albedo", paramLabel = "A", description = "ground albedo (default 0.2)") Double albedo;
    @Option(names = "--month-hour", description = "also write month-hour.csv (large)") Boolean monthHour;
    @Option(names = "--sun-hours-date", paramLabel = "MM-DD", description = "date of the sun-hour metric, repeatable (default 03-21; replaces the study's sun_hours.dates)") List<String> sunHoursDates;
    @Option(names = "--gltf", negatable = true, description = "write patches.gltf (glTF 2.0 mesh; default on)") Boolean gltf;
    @Option(names = "--threads", paramLabel = "N", description = "worker threads (default: all cores)") Integer threads;
    @Option(names = "--out", paramLabel = "DIR", description = "output folder") Path out;
    @Option(names = {"-q", "--quiet"}, description = "no progress on stderr") boolean quiet;

    @Override
    public Integer call() {
        Study study = resolve();
        long t0 = System.nanoTime();
        AnalysisRun.Outcome o;
        try (org.solmass.output.FolderClaim folder = ResultFiles.claim(study, out != null);   // before any work
             ConsoleProgress progress = new ConsoleProgress(System.err, quiet)) {
            o = AnalysisRun.run(study, progress);
            progress.begin("write", 0);
            for (String w : o.warnings()) System.err.println("solmass: warning: " + w);
            List<Path> files = ResultFiles.write(o, folder);
            printSummary(o, files, AnalysisRun.seconds(t0));
        }
        return Main.EXIT_OK;
    }

    Study resolve() {
        StudyOverrides ov = new StudyOverrides().model(model).analyse(analyse).context(context).patchM(patch).rays(rays)
                .sky(sky.name).albedo(albedo).monthHourCsv(monthHour).threads(threads).out(out).sunHoursDates(sunHoursDates)
                .gltf(gltf).reflectionRays(reflectionRays).maxBounces(maxBounces).bounceTolerancePct(bounceTolerance);
        modelFlags.applyTo(ov);
        site.applyTo(ov);
        climate.applyTo(ov);
        terrain.applyTo(ov);
        if (studyFile == null && model == null) {
            throw new InputException("analyse", "give a study file, or --model with --lat, --lon and --zone");
        }
        return StudyReader.read(studyFile, ov);
    }

    private static void printSummary(AnalysisRun.Outcome o, List<Path> files, double seconds) {
        Map<String, Long> c = o.counts();
        System.out.printf("solmass analyse: %s%n", o.study().name());
        System.out.printf("  %d patches on %d blocks (%d triangles), %s, %s sky%n", c.get("patches"),
                c.get("blocks"), c.get("triangles"), o.weather().timeBase().label(), o.study().sky().name());
        AreaStats a = AreaStats.of(o.patches().patches(), o.result().annual());
        System.out.printf("  annual irradiation: area-weighted mean %.0f kWh/m2, min %.0f, max %.0f, total %.0f MWh on %.0f m2%n",
                a.mean(), a.min(), a.max(), a.valueTimesAreaSum() / 1000, a.areaM2());
        org.solmass.irradiation.IrradiationResult.Bounces b = o.result().bounces();
        System.out.printf(java.util.Locale.ROOT, "  reflection: %d bounce%s, %s%n", b.used(), b.used() == 1 ? "" : "s",
                b.converged() ? String.format(java.util.Locale.ROOT, "the last added under %.1f %% of the reflected total", 100 * b.tolerance())
                        : "stopped at the maximum before the last bounce fell under " + 100 * b.tolerance() + " %");
        printMetrics(o);
        for (String caution : ResultFiles.cautions(o.study())) System.out.println("  " + caution);
        System.out.printf("  time %.1f s (%s)%n", seconds, timings(o.timingsS()));
        for (Path f : files) System.out.println("  wrote " + f);
    }

    private static void printMetrics(AnalysisRun.Outcome o) {
        for (String line : o.metrics().summaryLines()) System.out.println("  " + line);
    }

    private static String timings(Map<String, Double> t) {
        StringBuilder b = new StringBuilder();
        t.forEach((k, v) -> b.append(b.length() == 0 ? "" : ", ").append(k).append(String.format(" %.1f s", v)));
        return b.toString();
    }
}
