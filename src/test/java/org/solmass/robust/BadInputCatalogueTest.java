package org.solmass.robust;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.solmass.cli.Main;
import org.solmass.fixtures.Boxes;
import picocli.CommandLine;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Every case of docs/bad-inputs.md, run through the command line in process: the exit code is 2 and
 * the first line on stderr is exactly the message the catalogue gives ({@code <dir>} stands for the
 * case's folder; a message ending in "..." is matched by its start). The catalogue is the source of the expected text; the bad inputs are built here.
 */
class BadInputCatalogueTest {
    static final Path CATALOGUE = Path.of("docs/bad-inputs.md");
    private static final Pattern ROW = Pattern.compile("^\\| `([a-z0-9-]+)` \\|.*\\| `(solmass: .*)` \\|$");

    @TempDir Path dir;

    /** Two invented 10 m boxes, blocks "east" and "west", 6 m apart. */
    static final String TWO_BOXES = Boxes.closed(0, 0, 0, 10, 10, 10).obj("west") + Boxes.closed(16, 0, 0, 26, 10, 10).obj("east");

    static Stream<String> ids() {
        return BadInputCases.CASES.keySet().stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("ids")
    void catalogueCaseGivesItsMessageAndExitCode2(String id) throws IOException {
        BadInputCases.Case c = BadInputCases.CASES.get(id);
        org.junit.jupiter.api.Assumptions.assumeFalse(BadInputCases.NOT_AS_ROOT.contains(id) && "root".equals(System.getProperty("user.name")),
                "root may write into a read-only folder");
        for (Map.Entry<String, String> f : c.files().entrySet()) Files.writeString(dir.resolve(f.getKey()), f.getValue());
        for (Map.Entry<String, byte[]> f : c.bytes().entrySet()) Files.write(dir.resolve(f.getKey()), f.getValue());
        BadInputCases.Setup setup = BadInputCases.SETUP.get(id);
        try (AutoCloseable held = setup != null ? setup.prepare(dir) : null) {
            run(id, c);
        } catch (IOException | RuntimeException | Error e) {
            throw e;
        } catch (Exception e) {
            throw new IllegalStateException(e);
        }
    }

    private void run(String id, BadInputCases.Case c) throws IOException {
        List<String> args = new ArrayList<>();
        for (String a : c.args()) args.add(a.replace("@", dir.toString() + "/"));
        StringWriter err = new StringWriter();
        CommandLine cl = Main.commandLine();
        cl.setErr(new PrintWriter(err, true));
        cl.setOut(new PrintWriter(new StringWriter(), true));
        int code = cl.execute(args.toArray(String[]::new));
        String first = err.toString().lines().findFirst().orElse("").replace(dir.toString(), "<dir>");
        if (System.getProperty("solmass.printCatalogue") != null) System.out.println("CASE " + id + " " + code + " " + first);
        String expected = catalogue().get(id);
        assertNotNull(expected, "case " + id + " is not in " + CATALOGUE);
        if (expected.endsWith("...")) assertTrue(first.startsWith(expected.substring(0, expected.length() - 3)), id + ": " + first);
        else assertEquals(expected, first, id);
        assertEquals(Main.EXIT_INPUT, code, id);
    }

    /** Case id -> expected first line of stderr, from the catalogue. */
    static Map<String, String> catalogue() throws IOException {
        Map<String, String> m = new LinkedHashMap<>();
        for (String line : Files.readAllLines(CATALOGUE)) {
            Matcher x = ROW.matcher(line);
            if (x.matches()) m.put(x.group(1), x.group(2).replace("\\|", "|"));
        }
        return m;
    }
}
