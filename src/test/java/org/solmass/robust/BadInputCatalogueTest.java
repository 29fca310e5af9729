package org.solmass.robust;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.solmass.cli.Main;
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
    static final String TWO_BOXES = box("west", 0, 0) + box("east", 16, 8);

    static String box(String name, double x0, int base) {
        StringBuilder b = new StringBuilder("o " + name + "\n");
        for (int z = 0; z <= 1; z++) for (int y = 0; y <= 1; y++) for (int x = 0; x <= 1; x++) {
            b.append("v ").append(x0 + 10 * x).append(' ').append(10 * y).append(' ').append(10 * z).append('\n');
        }
        int[][] faces = {{1, 3, 4, 2}, {5, 6, 8, 7}, {1, 2, 6, 5}, {3, 7, 8, 4}, {1, 5, 7, 3}, {2, 4, 8, 6}};
        for (int[] f : faces) b.append(String.format("f %d %d %d %d%n", f[0] + base, f[1] + base, f[2] + base, f[3] + base));
        return b.toString();
    }

    static Stream<String> ids() {
        return BadInputCases.CASES.keySet().stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("ids")
    void catalogueCaseGivesItsMessageAndExitCode2(String id) throws IOException {
        BadInputCases.Case c = BadInputCases.CASES.get(id);
        for (Map.Entry<String, String> f : c.files().entrySet()) Files.writeString(dir.resolve(f.getKey()), f.getValue());
        for (Map.Entry<String, byte[]> f : c.bytes().entrySet()) Files.write(dir.resolve(f.getKey()), f.getValue());
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
