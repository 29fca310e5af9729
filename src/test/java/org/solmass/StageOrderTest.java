package org.solmass;

import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The stages' order is the architecture table of DEVELOPERS.md: data flows one way, so no class
 * imports (or names by its full name) a package listed after its own. Every package under
 * {@code org.solmass} must have a row, so a new package gets its place before it lands.
 */
class StageOrderTest {
    private static final Path SOURCES = Path.of("src/main/java/org/solmass");
    /** The Spark runner's sources (Maven profile city): its own source root, the last stage. */
    private static final Path SPARK_SOURCES = Path.of("src/spark/java/org/solmass");
    private static final Pattern ROW = Pattern.compile("^\\| `([a-z]+)` \\|");
    private static final Pattern REFERENCE = Pattern.compile("org\\.solmass\\.([a-z]+)\\.");

    static List<String> stages() throws IOException {
        List<String> order = new ArrayList<>();
        boolean inTable = false;
        for (String line : Files.readAllLines(Path.of("DEVELOPERS.md"))) {
            if (line.startsWith("## Architecture")) inTable = true;
            else if (inTable && line.startsWith("## ")) break;
            if (!inTable) continue;
            Matcher m = ROW.matcher(line);
            if (m.find()) order.add(m.group(1));
        }
        return order;
    }

    @Test
    void noPackageReferencesALaterStage() throws IOException {
        List<String> order = stages();
        assertTrue(order.size() >= 10, "the architecture table was not found in DEVELOPERS.md: " + order);
        List<String> wrong = new ArrayList<>();
        TreeSet<String> unlisted = new TreeSet<>();
        for (Path root : List.of(SOURCES, SPARK_SOURCES)) {
            if (Files.isDirectory(root)) check(root, order, wrong, unlisted);
        }
        assertTrue(unlisted.isEmpty(), "packages with no row in DEVELOPERS.md's architecture table: " + unlisted);
        assertTrue(wrong.isEmpty(), "references against the stage order " + order + ":\n" + String.join("\n", wrong));
    }

    /**
     * The Spark runner is the last stage and lives only in src/spark/java: the desktop sources never
     * name it (the desktop jar is built without Spark, -Dsolmass.desktopOnly), and src/spark/java holds
     * no other package's classes.
     */
    @Test
    void sparkRunnerIsTheLastStageAndOnlyInItsOwnSourceRoot() throws IOException {
        List<String> order = stages();
        assertTrue(order.contains("spark") && order.get(order.size() - 1).equals("spark"), "spark is the last row: " + order);
        List<String> wrong = new ArrayList<>();
        try (Stream<Path> files = Files.walk(SOURCES)) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                if (Files.readString(f).contains("org.solmass.spark")) wrong.add(SOURCES.relativize(f).toString());
            }
        }
        assertTrue(wrong.isEmpty(), "src/main names the Spark runner: " + wrong);
        assertTrue(!Files.isDirectory(SOURCES.resolve("spark")), "src/main/java/org/solmass/spark must not exist");
        if (Files.isDirectory(SPARK_SOURCES)) {
            try (Stream<Path> dirs = Files.list(SPARK_SOURCES)) {
                List<String> other = dirs.map(p -> p.getFileName().toString()).filter(n -> !n.equals("spark")).toList();
                assertTrue(other.isEmpty(), "src/spark/java holds other packages: " + other);
            }
        }
    }

    private static void check(Path sources, List<String> order, List<String> wrong, TreeSet<String> unlisted) throws IOException {
        try (Stream<Path> files = Files.walk(sources)) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                Path rel = sources.relativize(f);
                if (rel.getNameCount() < 2) continue; // org.solmass itself: shared texts, no stage
                String own = rel.getName(0).toString();
                int ownIndex = order.indexOf(own);
                if (ownIndex < 0) { unlisted.add(own); continue; }
                Matcher m = REFERENCE.matcher(Files.readString(f));
                TreeSet<String> seen = new TreeSet<>();
                while (m.find()) {
                    String other = m.group(1);
                    int i = order.indexOf(other);
                    if (i < 0 && (Files.isDirectory(SOURCES.resolve(other)) || Files.isDirectory(SPARK_SOURCES.resolve(other)))) unlisted.add(other);
                    if (i > ownIndex && seen.add(other)) wrong.add(rel + " -> " + other);
                }
            }
        }
    }
}
