package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.model.MassingModel;
import org.solmass.output.PatchCsvWriter;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.table.ResultTable;
import org.solmass.scene.HemisphereSampler;
import org.solmass.scene.Scene;
import org.solmass.scene.SkyViewCalculator;
import org.solmass.scene.ViewFactors;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.Surface;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ForkJoinPool;

/** {@code solmass sky-view}: sky and ground view factors of every patch of a model. */
@Command(name = "sky-view", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Sky, ground and obstruction view factors of every patch of a massing model.",
                "Cosine-weighted stratified hemisphere ray casting; writes DIR/sky-view.csv."})
public final class SkyViewCommand implements Callable<Integer> {
    /** The table this command writes: patch columns and the four view-factor columns (not analyse's patches.csv). */
    public static final String FILE_NAME = "sky-view.csv";

    @Parameters(paramLabel = "MODEL", description = "massing model: OBJ, GeoJSON footprints or CityGML (see --format)") Path model;
    @Mixin ModelFlags modelFlags = new ModelFlags();
    @Option(names = "--patch", paramLabel = "METRES", defaultValue = "1", description = "patch size (default ${DEFAULT-VALUE} m)") double patch;
    @Option(names = "--rays", paramLabel = "N", defaultValue = "1024", description = "hemisphere rays per patch, rounded to a square grid (default ${DEFAULT-VALUE})") int rays;
    @Option(names = "--analyse", paramLabel = "BLOCK", split = ",", description = "blocks to analyse (default all)") List<String> analyse;
    @Option(names = "--threads", paramLabel = "N", defaultValue = "0", description = "worker threads (default: all cores)") int threads;
    @Option(names = "--horizon", paramLabel = "FILE.csv",
            description = "far horizon: CSV of azimuth_deg,elevation_deg; rays it stops count as obstruction") Path horizon;
    @Option(names = "--out", paramLabel = "DIR", required = true, description = "output folder") Path out;
    @Option(names = {"-q", "--quiet"}, description = "no progress on stderr") boolean quiet;

    @Override
    public Integer call() {
        if (!(patch > 0) || !Double.isFinite(patch)) throw new InputException("--patch", "expected a positive size in metres, got " + patch);
        if (rays < 1) throw new InputException("--rays", "expected a positive number of rays, got " + rays);
        if (threads < 0) throw new InputException("--threads", "expected 0 (all cores) or a positive count, got " + threads);
        org.solmass.output.FolderClaim.prepareWritable(out, "--out");   // before the work
        org.solmass.scene.HorizonProfile far = horizon == null ? org.solmass.scene.HorizonProfile.NONE
                : org.solmass.terrain.HorizonCsv.read(horizon);
        long t0 = System.nanoTime();
        org.solmass.geo.GeoModel read = org.solmass.geo.ModelFiles.load(model, modelFlags.options(), modelFlags.geoOptions());
        for (String w : read.warnings()) System.err.println("solmass: warning: " + w);
        MassingModel m = read.model();
        PatchSet ps = Patcher.build(m, new PatchOptions(patch, analyse == null ? java.util.Set.of() : new LinkedHashSet<>(analyse), false));
        Scene scene = Scene.build(m, !ps.hasGroundFaces(), ps.groundLevelZ()).withHorizon(far);
        boolean[] ground = Surface.groundTriangles(ps.surfaces(), m.triangleCount());
        double tSetup = AnalysisRun.seconds(t0);
        long t1 = System.nanoTime();
        ViewFactors[] vf;
        int n = ps.patchCount();
        ForkJoinPool pool = new ForkJoinPool(threads > 0 ? threads : Runtime.getRuntime().availableProcessors());
        try (ConsoleProgress progress = new ConsoleProgress(System.err, quiet)) {
            progress.begin("sky view", n);
            vf = pool.submit(() -> SkyViewCalculator.compute(scene, ps.patches(), rays, AnalysisRun.RUN_SEED, ground,
                    d -> progress.advance(d))).get();
        } catch (Exception e) {
            if (e.getCause() instanceof RuntimeException re) throw re;
            throw new IllegalStateException(e);
        } finally {
            pool.shutdownNow();
        }
        double tRays = AnalysisRun.seconds(t1);
        ResultTable table = new ResultTable(ps.patches());
        IrradiationColumns.addViewFactors(table, vf);
        double[] sky = table.column(IrradiationColumns.SKY_VIEW_FACTOR.name());
        try {
            Files.createDirectories(out);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot create " + out + ": " + e.getMessage(), e);
        }
        Path csv = out.resolve(FILE_NAME);
        PatchCsvWriter.write(csv, table);
        long totalRays = (long) n * HemisphereSampler.roundedRayCount(rays);
        double mean = 0, area = 0;
        for (int i = 0; i < n; i++) {
            Patch p = ps.patches().get(i);
            mean += sky[i] * p.areaM2();
            area += p.areaM2();
        }
        System.out.printf("solmass sky-view: %s%n", model.getFileName());
        System.out.printf("  %d patches (%.0f m2) on %d blocks, %d triangles, %d rays per patch%n", n, area,
                m.blockNames().size(), m.triangleCount(), HemisphereSampler.roundedRayCount(rays));
        System.out.printf("  area-weighted mean sky view factor %.3f%n", area > 0 ? mean / area : 0);
        System.out.printf("  time %.2f s (setup %.2f s, rays %.2f s), %.1f million rays per second%n",
                AnalysisRun.seconds(t0), tSetup, tRays, totalRays / tRays / 1e6);
        System.out.println("  wrote " + csv);
        return Main.EXIT_OK;
    }
}
