package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.InputException;
import org.solmass.climate.ClimateSpec;
import org.solmass.sky.SkyModels;
import org.solmass.study.Study;
import org.solmass.study.StudyOverrides;
import org.solmass.study.StudyReader;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The flags that several commands share have one definition (picocli mixins), the sky models one
 * registry, and the climate column mapping reaches {@code analyse} as well as {@code plane}.
 */
class SharedFlagsTest {
    static final List<String> SITE_FLAGS = List.of("--lat", "--lon", "--elevation", "--zone");
    static final List<String> CLIMATE_FLAGS = List.of("--climate", "--climate-format", "--time-base", "--year",
            "--step-minutes", "--interval-label", "--columns", "--fill-gaps");
    static final List<String> MODEL_FLAGS = List.of("--up", "--unit", "--north");

    private static OptionSpec option(Callable<Integer> command, String name) {
        return new CommandLine(command).getCommandSpec().findOption(name);
    }

    /** Name, parameter label, arity and help text of an option: what a user sees and types. */
    private static String shown(OptionSpec o) {
        return o == null ? "absent" : Arrays.toString(o.names()) + " " + o.paramLabel() + " " + o.arity() + " "
                + String.join(" ", o.description());
    }

    private static void sameOn(List<String> flags, List<Callable<Integer>> commands) {
        for (String flag : flags) {
            String first = shown(option(commands.get(0), flag));
            assertNotEquals("absent", first, flag);
            for (Callable<Integer> c : commands) {
                assertEquals(first, shown(option(c, flag)), flag + " on " + c.getClass().getSimpleName());
            }
        }
    }

    @Test
    void everyCommandWithASiteTakesTheSameSiteFlags() {
        sameOn(SITE_FLAGS, List.of(new AnalyseCommand(), new PlaneCommand(), new SunCommand(), new MakeWeatherCommand()));
    }

    @Test
    void analyseAndPlaneTakeTheSameClimateFlags() {
        sameOn(CLIMATE_FLAGS, List.of(new AnalyseCommand(), new PlaneCommand()));
    }

    @Test
    void analyseAndSkyViewTakeTheSameModelFlags() {
        sameOn(MODEL_FLAGS, List.of(new AnalyseCommand(), new SkyViewCommand()));
    }

    @Test
    void everyCommandWithASkyModelTakesTheSameSkyFlagListingTheRegistry() {
        sameOn(List.of("--sky"), List.of(new AnalyseCommand(), new PlaneCommand(), new BenchAnalysisCommand()));
        String usage = new CommandLine(new PlaneCommand()).getUsageMessage().replaceAll("\\s+", " ");
        assertTrue(usage.contains("one of " + String.join(", ", SkyModels.names())), usage);
    }

    /** Solmass works in local standard time (DEVELOPERS.md conventions): Berlin's standard offset is +01:00, also in June. */
    @Test
    void sunReadsATimeWithoutOffsetAsLocalStandardTimeOfTheZone() throws Exception {
        ByteArrayOutputStream a = new ByteArrayOutputStream(), b = new ByteArrayOutputStream();
        assertEquals(Main.EXIT_OK, captured(a, "sun", "--lat", "52.5", "--lon", "13.4", "--time", "2025-06-21T12:00+01:00"));
        assertEquals(Main.EXIT_OK, captured(b, "sun", "--lat", "52.5", "--lon", "13.4", "--zone", "Europe/Berlin",
                "--time", "2025-06-21T12:00"));
        assertEquals(a.toString(StandardCharsets.UTF_8), b.toString(StandardCharsets.UTF_8));
        assertEquals(Main.EXIT_INPUT, captured(new ByteArrayOutputStream(), "sun", "--lat", "52.5", "--lon", "13.4",
                "--time", "2025-06-21T12:00"));
    }

    private static int captured(ByteArrayOutputStream sink, String... args) {
        PrintStream out = System.out, err = System.err;
        try (PrintStream p = new PrintStream(sink, true, StandardCharsets.UTF_8)) {
            System.setOut(p);
            System.setErr(new PrintStream(new ByteArrayOutputStream()));
            return Main.execute(args);
        } finally {
            System.setOut(out);
            System.setErr(err);
        }
    }

    @Test
    void skyViewTakesNoSiteBecauseViewFactorsAreGeometryOnly() {
        for (String flag : SITE_FLAGS) assertNull(option(new SkyViewCommand(), flag), flag);
    }

    @Test
    void aSkyNameOutsideTheRegistryIsRefusedWithTheKnownNames(@TempDir Path dir) throws Exception {
        InputException e = assertThrows(InputException.class, () -> SkyModels.byName("cloudy", "--sky"));
        assertEquals("--sky: expected one of " + String.join(", ", SkyModels.names()) + ", got \"cloudy\"", e.getMessage());
        Path study = dir.resolve("s.json");
        Files.writeString(study, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 1, \"longitude\": 2, \"zone\": \"UTC\"},"
                + " \"sky\": \"cloudy\"}");
        e = assertThrows(InputException.class, () -> StudyReader.read(study));
        assertTrue(e.getMessage().endsWith("sky: expected one of " + String.join(", ", SkyModels.names()) + ", got \"cloudy\""),
                e.getMessage());
        assertEquals(Main.EXIT_INPUT, Main.execute("plane", "--lat", "47", "--lon", "8", "--zone", "+01:00", "--tilt", "30",
                "--surface-azimuth", "180", "--sky", "cloudy"));
    }

    @Test
    void everyRegisteredSkyNameReadsBackAsThatModel() {
        assertEquals(List.of("perez", "isotropic", "perez-1993", "cie-overcast"), SkyModels.names().subList(0, 4)); // docs/method.md
        assertEquals(4 + 15, SkyModels.names().size());   // and the 15 CIE standard general skies
        for (String name : SkyModels.names()) {
            Study s = StudyReader.read(null, new StudyOverrides().model(Path.of("m.obj")).latitude(1.0).longitude(2.0)
                    .zone("UTC").sky(name.toUpperCase(java.util.Locale.ROOT)));
            assertSame(SkyModels.byName(name, "test"), s.sky());
            assertEquals(name, s.sky().name());
        }
    }

    @Test
    void theOldMonthlyMeansSpellingStillNamesMonthlyMeans() throws Exception {
        assertEquals(ClimateSpec.Format.MONTHLY_MEANS, ClimateSpec.Format.parse("monthly-means", "--climate-format"));
        assertEquals(ClimateSpec.Format.MONTHLY_MEANS, ClimateSpec.Format.parse("monthly", "--climate-format"));
        Study s = StudyReader.read(null, new StudyOverrides().model(Path.of("m.obj")).latitude(1.0).longitude(2.0)
                .zone("UTC").climate("w.csv").climateFormat("monthly-means"));
        assertEquals(ClimateSpec.Format.MONTHLY_MEANS, s.climate().format());
        assertEquals(Main.EXIT_OK, quiet(() -> Main.execute("plane", "--lat", "46.2", "--lon", "7.4", "--zone", "+01:00",
                "--tilt", "30", "--surface-azimuth", "180", "--climate", "docs/examples/monthly-means-example.csv",
                "--climate-format", "monthly-means")));
    }

    @Test
    void anUnknownColumnRoleInTheStudyNamesItsKey(@TempDir Path dir) throws Exception {
        Path study = dir.resolve("s.json");
        Files.writeString(study, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 1, \"longitude\": 2, \"zone\": \"UTC\"},"
                + " \"climate\": {\"source\": \"w.csv\", \"columns\": {\"time\": 1, \"sun\": \"Glob\"}}}");
        InputException e = assertThrows(InputException.class, () -> StudyReader.read(study));
        assertTrue(e.getMessage().startsWith(study + ": climate.columns.sun: unknown column role"), e.getMessage());
    }

    /**
     * An hourly file whose headers the reader does not know, read with {@code --columns}, gives the same
     * patches.csv as the same values under the documented headers (the mapping renames, it changes no
     * number); without the mapping it is refused as bad input. The study key {@code climate.columns}
     * does the same as the flag.
     */
    @Test
    void analyseReadsAnHourlyFileWithUnusualHeadersThroughColumns(@TempDir Path dir) throws Exception {
        Path obj = dir.resolve("two.obj");
        Files.writeString(obj, AnalyseEndToEndTest.OBJ);
        Path plain = dir.resolve("plain.csv");
        assertEquals(Main.EXIT_OK, quiet(() -> Main.execute("make-weather", "--lat", "51", "--lon", "10", "--zone", "+01:00",
                "--hourly", plain.toString())));
        List<String> lines = new ArrayList<>(Files.readAllLines(plain));
        int header = lines.indexOf("time,ghi_wm2,dhi_wm2,temp_c");
        assertTrue(header > 0, "make-weather writes the documented header");
        lines.set(header, "Stamp,Air,GlobHor,DiffHor");   // unusual names, and temperature moved to the second column
        for (int i = header + 1; i < lines.size(); i++) {
            String[] f = lines.get(i).split(",");
            lines.set(i, f[0] + "," + f[3] + "," + f[1] + "," + f[2]);
        }
        Path odd = dir.resolve("odd.csv");
        Files.write(odd, lines);

        String[] common = {"analyse", "--model", obj.toString(), "--lat", "51", "--lon", "10", "--zone", "+01:00", "--patch", "4",
                "--rays", "16", "--context", "high", "--no-gltf", "--sun-hours-date", "03-21", "-q"};
        Path a = dir.resolve("a"), b = dir.resolve("b"), c = dir.resolve("c");
        assertEquals(Main.EXIT_OK, quiet(() -> Main.execute(concat(common, "--climate", plain.toString(), "--out", a.toString()))));
        assertEquals(Main.EXIT_OK, quiet(() -> Main.execute(concat(common, "--climate", odd.toString(),
                "--climate-format", "hourly", "--columns", "time=Stamp,ghi=GlobHor,dhi=4,temp=Air", "--out", b.toString()))));
        assertEquals(Files.readString(a.resolve("patches.csv")), Files.readString(b.resolve("patches.csv")));

        Path study = dir.resolve("odd-study.json");
        Files.writeString(study, "{\"model\": {\"file\": \"two.obj\"}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"},"
                + " \"climate\": {\"source\": \"odd.csv\", \"format\": \"hourly\", \"columns\": {\"time\": \"Stamp\", \"ghi\": \"GlobHor\", \"dhi\": 4, \"temp\": \"Air\"}}}");
        assertEquals(Map.of("time", "Stamp", "ghi", "GlobHor", "dhi", "4", "temp", "Air"), StudyReader.read(study).climate().columns());
        assertEquals(Main.EXIT_OK, quiet(() -> Main.execute("analyse", study.toString(), "--patch", "4", "--rays", "16",
                "--context", "high", "--no-gltf", "--sun-hours-date", "03-21", "--out", c.toString(), "-q")));
        assertEquals(Files.readString(a.resolve("patches.csv")), Files.readString(c.resolve("patches.csv")));

        assertEquals(Main.EXIT_INPUT, quiet(() -> Main.execute(concat(common, "--climate", odd.toString(),
                "--climate-format", "hourly", "--out", dir.resolve("d").toString()))));
    }

    private static String[] concat(String[] a, String... b) {
        String[] out = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }

    /** Runs with stdout and stderr captured (the command's report is not what these tests check). */
    private static int quiet(Callable<Integer> run) throws Exception {
        PrintStream out = System.out, err = System.err;
        ByteArrayOutputStream sink = new ByteArrayOutputStream();
        try (PrintStream p = new PrintStream(sink, true, StandardCharsets.UTF_8)) {
            System.setOut(p);
            System.setErr(p);
            int code = run.call();
            if (code != Main.EXIT_OK && code != Main.EXIT_INPUT) fail(sink.toString(StandardCharsets.UTF_8));
            return code;
        } finally {
            System.setOut(out);
            System.setErr(err);
        }
    }
}
