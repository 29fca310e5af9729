package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.TextInput;
import picocli.CommandLine;
import picocli.CommandLine.Command;

import java.nio.file.InvalidPathException;
import java.nio.file.Path;

/**
 * Entry point of the {@code solmass} command. Each stage of the pipeline has a thin subcommand here;
 * the subcommands only parse flags and wire the stages together.
 * Exit codes: 0 done, 1 failed, 2 bad usage or input.
 */
@Command(name = "solmass", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = "Solar irradiation on 3D massing models: sky view, sun, shading and irradiation per patch.",
        subcommands = {CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    public static final int EXIT_OK = 0, EXIT_FAILED = 1, EXIT_INPUT = 2;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(System.out);
    }

    /** Builds the command line with every subcommand registered. */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        for (Object sub : Commands.all()) cl.addSubcommand(sub);
        cl.registerConverter(Path.class, Main::path);   // after the subcommands: it reaches them all
        cl.setExecutionExceptionHandler((ex, line, parse) -> {
            if (ex instanceof InputException) {
                line.getErr().println("solmass: " + ex.getMessage());
                return EXIT_INPUT;
            }
            if (outOfMemory(ex) != null) {
                line.getErr().println(outOfMemoryMessage());
                return EXIT_FAILED;
            }
            if (ex instanceof java.io.UncheckedIOException && ex.getMessage() != null) {
                line.getErr().println("solmass: failed: " + ex.getMessage());   // says which file and why
                if (System.getenv("SOLMASS_DEBUG") != null) ex.printStackTrace(line.getErr());
                return EXIT_FAILED;
            }
            line.getErr().println("solmass: failed: " + ex);
            if (System.getenv("SOLMASS_DEBUG") != null) ex.printStackTrace(line.getErr());
            return EXIT_FAILED;
        });
        cl.setParameterExceptionHandler((ex, args) -> {
            CommandLine c = ex.getCommandLine();
            c.getErr().println("solmass: " + ex.getMessage());
            c.getErr().println("Try 'solmass " + (c.getCommandName().equals("solmass") ? "" : c.getCommandName() + " ") + "--help'.");
            return EXIT_INPUT;
        });
        return cl;
    }

    /** A path flag's value; a text that cannot be a path (a NUL character) is bad usage naming the flag. */
    static Path path(String text) {
        try {
            return Path.of(text);
        } catch (InvalidPathException e) {
            throw new CommandLine.TypeConversionException(TextInput.invalidPath(text, e));
        }
    }

    /** Runs a command line and returns the exit code (used by tests). */
    public static int execute(String... args) {
        return execute(commandLine(), args);
    }

    /**
     * Runs a command line; running out of memory anywhere (picocli passes errors on) becomes exit 1
     * with {@link #outOfMemoryMessage()} instead of a stack trace. Results are not published then: the
     * results folder keeps the previous run ({@code output.Publication}).
     */
    public static int execute(CommandLine cl, String... args) {
        try {
            return cl.execute(args);
        } catch (OutOfMemoryError e) {
            cl.getErr().println(outOfMemoryMessage());
            cl.getErr().flush();
            return EXIT_FAILED;
        }
    }

    /** What a user can do when the Java heap ran out. */
    static String outOfMemoryMessage() {
        long max = Runtime.getRuntime().maxMemory();
        String heap = max >= 1e9 ? String.format(java.util.Locale.ROOT, "%.1f GB", max / 1e9)
                : String.format(java.util.Locale.ROOT, "%.0f MB", max / 1e6);
        return String.format(java.util.Locale.ROOT, "solmass: out of memory: the Java heap (at most %s) was not enough; "
                + "give Java more heap with SOLMASS_JAVA_OPTS=-Xmx... (the launcher's default is -Xmx8g), or a larger patch "
                + "size (--patch, patch_m) or fewer rays; no results were written", heap);
    }

    private static OutOfMemoryError outOfMemory(Throwable t) {
        for (int depth = 0; t != null && depth < 20; t = t.getCause(), depth++) {
            if (t instanceof OutOfMemoryError oom) return oom;
        }
        return null;
    }

    /** Converts a command-line path; a NUL character (which no file name can hold) is refused in words. */
    public static void main(String[] args) {
        // a worker thread that runs out of memory ends the run with the message, not a stack trace;
        // nothing is published then (publishing runs on the main thread, after the workers are done)
        Thread.setDefaultUncaughtExceptionHandler((t, e) -> {
            if (e instanceof OutOfMemoryError) {
                System.err.println(outOfMemoryMessage());
                System.err.flush();
                Runtime.getRuntime().halt(EXIT_FAILED);
            }
            System.err.print("Exception in thread \"" + t.getName() + "\" ");
            e.printStackTrace();
        });
        System.exit(execute(args));
    }

    /** Version from the jar manifest, or the development version. */
    public static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"solmass " + version()};
        }
    }

    public static String version() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0-dev" : v;
    }
}
