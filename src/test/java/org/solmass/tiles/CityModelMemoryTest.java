package org.solmass.tiles;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.cli.AnalysisRun;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.study.StudyReader;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The memory check of a city run's JVM (the driver and each Spark executor prepare the whole study
 * and then work tile by tile): it counts what the prepared study holds
 * ({@code MemoryEstimate.forTilesBeforePatching}), not the one-machine run's arrays, which a tile
 * builds for its own receivers only. Each case runs {@link Child} in a JVM of its own with a small
 * heap (-Xmx) on an invented synthetic city of about 60,000 patches:
 * <ul>
 * <li>256 MB: the one-machine check refuses the study (its arrays would need about 0.5 GB), the city
 * preparation passes it, builds the model and runs what a task runs with it (the whole reflector
 * index, the largest tile's first pass) without running out of memory;</li>
 * <li>32 MB: the city preparation refuses it before patching with a clear message (the key, what it
 * needs, the Spark memory settings), not with OutOfMemoryError.</li>
 * </ul>
 */
class CityModelMemoryTest {
    @TempDir Path dir;

    @Test
    void aCityJvmChecksTheHeapOfThePreparedStudyNotOfTheOneMachineRunsArrays() throws Exception {
        Path study = SyntheticCity.write(dir.resolve("city"), SyntheticCity.Spec.of(60_000, 3)).study();

        Result analysis = child(study, "analysis", "256m");
        assertEquals(2, analysis.code, "the one-machine check refuses at 256 MB: " + analysis.out);
        assertTrue(analysis.out.contains("the analysis needs about"), analysis.out);

        Result tiles = child(study, "tiles", "256m");
        assertEquals(0, tiles.code, "the city preparation fits in 256 MB: " + tiles.out);
        assertTrue(tiles.out.contains("prepared "), tiles.out);

        Result small = child(study, "tiles", "32m");
        assertEquals(2, small.code, "refused at 32 MB: " + small.out);
        assertTrue(small.out.contains("patch_m") && small.out.contains("preparing the model for its tiles needs about")
                && small.out.contains("spark.executor.memory"), small.out);
        assertTrue(!small.out.contains("OutOfMemoryError"), small.out);
    }

    private record Result(int code, String out) {}

    private Result child(Path study, String mode, String heap) throws Exception {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx" + heap,
                "-cp", System.getProperty("java.class.path"), Child.class.getName(), mode, study.toString()));
        Path log = dir.resolve(mode + "-" + heap + ".log");
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            throw new AssertionError("child did not end in 120 s");
        }
        return new Result(p.exitValue(), Files.readString(log));
    }

    /** Prepares the study as a city run's JVM ({@code tiles}) or as {@code analyse} does ({@code analysis}). */
    public static final class Child {
        public static void main(String[] a) {
            try {
                if (a[0].equals("tiles")) {
                    CityModel m = CityModel.load(Path.of(a[1]));
                    // then what a task does with it: the whole reflector index and the largest tile's first pass
                    CityPlan plan = m.plan(CityOptions.defaults());
                    Tile big = plan.tiles().get(0);
                    for (Tile t : plan.tiles()) if (t.receivers().length > big.receivers().length) big = t;
                    m.firstPass(big, 1);
                    System.out.println("prepared " + m.layout().count() + " receivers, largest tile " + big.receivers().length);
                } else {
                    AnalysisRun.prepare(StudyReader.read(Path.of(a[1])), PhaseProgress.NONE, new LinkedHashMap<>());
                    System.out.println("prepared");
                }
                System.exit(0);
            } catch (InputException e) {
                System.out.println(e.getMessage());
                System.exit(2);
            }
        }
    }
}
