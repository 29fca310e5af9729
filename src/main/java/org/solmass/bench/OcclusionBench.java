package org.solmass.bench;

import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;
import org.solmass.model.MassingModel;
import org.solmass.scene.BundleTracer;
import org.solmass.scene.Scene;
import org.solmass.scene.Tracer;

import java.util.concurrent.TimeUnit;

/**
 * JMH benchmark of the traversal kernel on the invented {@link SyntheticDistrict}: any-hit
 * (occlusion) and closest-hit rays one at a time, 64 cosine-weighted rays per roof/facade point, and
 * occlusion in bundles of 64 and 1,024 rays per point ({@link BundleTracer}). Scores are rays per
 * microsecond per thread (x 1e6 = rays per second). The forked JVM gets the vector module. Run after
 * {@code mvn -B -q -DskipTests package}:
 * <pre>
 *   java -cp target/solmass.jar org.openjdk.jmh.Main OcclusionBench            # 1 thread
 *   java -cp target/solmass.jar org.openjdk.jmh.Main OcclusionBench -t 2       # 2 threads
 *   java -cp target/solmass.jar org.openjdk.jmh.Main OcclusionBench -p blocks=4000
 * </pre>
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"--add-modules", "jdk.incubator.vector"})
public class OcclusionBench {
    static final int RAYS = 1 << 16;

    @Param({"1000"})
    public int blocks;

    private Tracer tracer;
    private BundleTracer bundles;
    private double[] rays, rays1024;

    @Setup(Level.Trial)
    public void setUp() {
        MassingModel m = SyntheticDistrict.generate(blocks, 1);
        Scene scene = Scene.build(m, true, 0.0);
        tracer = scene.tracer();
        rays = SyntheticDistrict.rays(m, RAYS / 64, 64, scene.epsilon(), 1);
        rays1024 = SyntheticDistrict.rays(m, RAYS / 1024, 1024, scene.epsilon(), 1);
        bundles = scene.bundleTracer();
    }

    /** Occlusion of the same 64-per-point rays, each point's rays traced as one bundle. */
    @Benchmark
    @OperationsPerInvocation(RAYS)
    public void occludedBundles64(Blackhole bh) {
        bh.consume(traceBundles(rays, 64, false));
    }

    /** Occlusion of 1,024 rays per point (the default of sky-view and analyse), one bundle per point. */
    @Benchmark
    @OperationsPerInvocation(RAYS)
    public void occludedBundles1024(Blackhole bh) {
        bh.consume(traceBundles(rays1024, 1024, false));
    }

    /** Closest hit of 1,024 rays per point, one bundle per point (the hemisphere rays of analyse). */
    @Benchmark
    @OperationsPerInvocation(RAYS)
    public void closestHitBundles1024(Blackhole bh) {
        bh.consume(traceBundles(rays1024, 1024, true));
    }

    private long traceBundles(double[] r, int per, boolean closest) {
        return BundleRuns.trace(bundles, r, 0, r.length / 6, per, closest);
    }

    @Benchmark
    @OperationsPerInvocation(RAYS)
    public void occluded(Blackhole bh) {
        double[] r = rays;
        Tracer t = tracer;
        int hits = 0;
        for (int j = 0; j < r.length; j += 6) {
            if (t.occluded(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY)) hits++;
        }
        bh.consume(hits);
    }

    @Benchmark
    @OperationsPerInvocation(RAYS)
    public void closestHit(Blackhole bh) {
        double[] r = rays;
        Tracer t = tracer;
        int sum = 0;
        for (int j = 0; j < r.length; j += 6) {
            sum += t.closestHit(r[j], r[j + 1], r[j + 2], r[j + 3], r[j + 4], r[j + 5], Double.POSITIVE_INFINITY);
        }
        bh.consume(sum);
    }
}
