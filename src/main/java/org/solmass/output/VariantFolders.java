package org.solmass.output;

import org.solmass.InputException;

import java.io.IOException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;

/**
 * Variant folders of a study: each re-run writes a new results folder beside the study's first one
 * ({@code <results>-variant-<yyyyMMdd-HHmmss>} by default, or a name the user gives) so no run
 * overwrites another's files. A name is refused when a file or folder of that name exists; the folder
 * is created here, atomically, so two re-runs cannot take the same name. Layout: docs/viewer.md.
 */
public final class VariantFolders {
    /** Between the results folder's name and the time stamp of a default name. */
    public static final String INFIX = "-variant-";
    private static final DateTimeFormatter STAMP = DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss", Locale.ROOT);

    private VariantFolders() {}

    /** The default name of a variant of {@code resultsFolder} made at {@code time}: "results-variant-20261202-021500". */
    public static String defaultName(Path resultsFolder, LocalDateTime time) {
        return resultsFolder.toAbsolutePath().normalize().getFileName() + INFIX + STAMP.format(time);
    }

    /**
     * Creates the variant folder beside {@code resultsFolder}: the user's name when given (refused when it
     * exists or is no plain folder name), else the default name at {@code time} (with "-2", "-3", ... when
     * a re-run in the same second took it).
     *
     * @throws InputException for a name that exists or is no plain folder name, or a folder that cannot be made
     */
    public static Path create(Path resultsFolder, String userName, LocalDateTime time) {
        Path parent = resultsFolder.toAbsolutePath().normalize().getParent();
        if (parent == null) throw new InputException(resultsFolder.toString(), "the results folder has no parent folder for variants");
        if (userName != null && !userName.isBlank()) {
            String name = userName.strip();
            if (name.equals(".") || name.equals("..") || name.contains("/") || name.contains("\\") || name.indexOf('\0') >= 0) {
                throw new InputException("variant name", "expected a plain folder name (no / or \\), got \"" + name + "\"");
            }
            Path dir = parent.resolve(name);
            if (!make(dir)) {
                throw new InputException(dir.toString(), "exists already; a variant never overwrites earlier results: choose another name");
            }
            return dir;
        }
        String base = defaultName(resultsFolder, time);
        for (int k = 1; ; k++) {
            Path dir = parent.resolve(k == 1 ? base : base + "-" + k);
            if (make(dir)) return dir;
        }
    }

    /**
     * The study's results folders: {@code resultsFolder} and the folders beside it that a re-run made
     * (named {@code <results>-variant-...}, or holding a variant's {@code study.json}), each only when it
     * holds a run.json; sorted by name, the first results folder first.
     */
    public static List<Path> list(Path resultsFolder, String variantStudyFile) {
        Path first = resultsFolder.toAbsolutePath().normalize();
        Path parent = first.getParent();
        List<Path> out = new ArrayList<>();
        if (Files.isRegularFile(first.resolve(RunRecord.FILE_NAME))) out.add(first);
        if (parent == null || !Files.isDirectory(parent)) return out;
        String prefix = first.getFileName() + INFIX;
        List<Path> others = new ArrayList<>();
        try (Stream<Path> s = Files.list(parent)) {
            s.filter(Files::isDirectory).filter(d -> !d.equals(first))
                    .filter(d -> d.getFileName().toString().startsWith(prefix) || Files.isRegularFile(d.resolve(variantStudyFile)))
                    .filter(d -> Files.isRegularFile(d.resolve(RunRecord.FILE_NAME)))
                    .forEach(others::add);
        } catch (IOException e) {
            throw new InputException(parent.toString(), "cannot list the variant folders: " + e.getMessage(), e);
        }
        others.sort(Comparator.comparing(d -> d.getFileName().toString()));
        out.addAll(others);
        return out;
    }

    /** Creates {@code dir}; false when something of that name exists. */
    private static boolean make(Path dir) {
        try {
            Files.createDirectory(dir);
            return true;
        } catch (FileAlreadyExistsException e) {
            return false;
        } catch (IOException e) {
            throw new InputException(dir.toString(), "cannot create the variant folder: " + e.getMessage(), e);
        }
    }
}
