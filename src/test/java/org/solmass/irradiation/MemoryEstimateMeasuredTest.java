package org.solmass.irradiation;

import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.Perez;
import org.solmass.sun.Site;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;
import java.time.ZoneId;
import java.util.Arrays;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The memory estimate against the heap the visibility and irradiation phase really holds: the JVM's
 * own count of the heap in use (MemoryMXBean, after a full collection), measured before the inputs
 * are built and at the end of each reflection bounce and of the last phase (the larger), while the
 * run's arrays are still reachable.
 */
class MemoryEstimateMeasuredTest {
    /**
     * The estimate guards a refusal: below the real heap it lets a study fail deep inside with
     * OutOfMemoryError; more than 2x above it refuses studies that fit (our own bound).
     */
    static final double MAX_OVER_ESTIMATE = 2.0;

    @Test
    void estimateIsNotBelowTheMeasuredHeapAndWithinTwiceIt() {
        // an invented block 60 m x 60 m x 20 m at 0.5 m patches: about 30,000 receivers, so that the
        // run's arrays (tens of MB) dominate whatever else the test JVM holds
        PipelineFixture f = new PipelineFixture(new TestModels().box("a", 0, 0, 60, 60, 20).build(), Set.of("a"), 0.5);
        WeatherSeries w = ClimateSource.load(new Site(51, 10, 0, ZoneId.of("Europe/Berlin")), ClimateSpec.clearSky());
        IrradiationSetup.Options o = new IrradiationSetup.Options(0.5, 16, 0.2, false,
                IrradiationSetup.SunSampling.EXACT, 4096, 7L, true);
        float[] albedo = new float[f.model.triangleCount()];
        Arrays.fill(albedo, 0.3f);
        MemoryMXBean mx = ManagementFactory.getMemoryMXBean();
        long before = usedAfterGc(mx);
        ShadedIrradiation.Inputs in = IrradiationSetup.build(f.scene, f.model, f.patches.surfaces(), f.patches.patches(),
                List.of(), albedo, w, Perez.INSTANCE, o);
        int n = in.receivers().analysed;
        long[] peak = {-1};
        PhaseProgress atTheEnd = new PhaseProgress() { // the ends of the bounces and of the last phase
            String phase = "";
            @Override public void begin(String phase, long total) { this.phase = phase; }
            @Override public void advance(long done) {
                if (phase.equals("reflection") || (phase.equals("irradiation") && done == n)) {
                    peak[0] = Math.max(peak[0], usedAfterGc(mx));
                }
            }
        };
        IrradiationResult r = ShadedIrradiation.run(f.scene, in, atTheEnd);
        assertEquals(n, r.annual().length);
        assertTrue(peak[0] > 0, "the last phase reported its end");
        long estimate = MemoryEstimate.of(in, Runtime.getRuntime().availableProcessors()).bytes();
        int receivers = in.receivers().count;
        long lightSlots = FirstPass.liveSlots(in.steps());
        // The baseline is the heap without this run's arrays: before the run, or after it once they are
        // unreachable, whichever is lower. Garbage of earlier tests in the same JVM (thread-local workers
        // of the common pool's threads, dropped lazily) can be freed during the run and would otherwise
        // be subtracted from the run's own peak.
        in = null;
        r = null;
        long after = usedAfterGc(mx);
        long measured = peak[0] - Math.min(before, after);
        System.out.printf("memory estimate: %d receivers, estimate %.1f MB, measured %.1f MB (ratio %.2f)%n",
                receivers, estimate / 1e6, measured / 1e6, estimate / (double) measured);
        assertTrue(measured > (long) receivers * lightSlots * 8,
                "the run holds at least its first-pass double slot sums (the slots that can hold light): " + measured);
        assertTrue(estimate >= measured, "estimate " + estimate + " below the measured " + measured);
        assertTrue(estimate <= MAX_OVER_ESTIMATE * measured, "estimate " + estimate + " over 2x the measured " + measured);
    }

    private static long usedAfterGc(MemoryMXBean mx) {
        mx.gc();
        mx.gc();
        return mx.getHeapMemoryUsage().getUsed();
    }
}
