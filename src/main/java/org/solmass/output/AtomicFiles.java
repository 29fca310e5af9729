package org.solmass.output;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Writes a file so that readers see either the old or the complete new content, never a half-written
 * file: the content goes to a temporary file in the target's folder, is flushed and fsynced, then moved
 * over the target with an atomic rename (where the file system cannot, a plain replacing move). If
 * the writer fails, the temporary file is deleted and the old file stays as it was.
 */
public final class AtomicFiles {
    /**
     * Test hook (DEVELOPERS.md, "Testing a killed run"): the system property
     * {@code solmass.test.pauseBeforeMoveMs} makes every write wait that long with its complete
     * temporary file in place before the move, so a test can kill the process mid-write. Unset: 0.
     */
    static final long PAUSE_BEFORE_MOVE_MS = Long.getLong("solmass.test.pauseBeforeMoveMs", 0L);

    private AtomicFiles() {}

    /** Writes bytes to a stream. */
    @FunctionalInterface
    public interface StreamBody {
        void write(OutputStream out) throws IOException;
    }

    /** Writes text (UTF-8). */
    @FunctionalInterface
    public interface TextBody {
        void write(Writer out) throws IOException;
    }

    /**
     * Writes {@code target} atomically from a stream body; creates the parent folders.
     *
     * @throws UncheckedIOException when the file cannot be written; the previous file is left intact
     */
    public static void write(Path target, StreamBody body) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        Path tmp = null;
        try {
            Files.createDirectories(dir);
            tmp = Files.createTempFile(dir, "." + abs.getFileName() + ".", ".tmp");
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
                OutputStream out = new BufferedOutputStream(Channels.newOutputStream(ch), 1 << 16);
                body.write(out);
                out.flush();
                ch.force(true);
            }
            if (PAUSE_BEFORE_MOVE_MS > 0) pauseForTest();
            try {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
            }
            tmp = null;
            syncFolder(dir);
        } catch (java.nio.file.FileAlreadyExistsException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getFile() + " exists and is not a folder", e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        } finally {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the original failure is what the caller needs to see
                }
            }
        }
    }

    /** Writes {@code target} atomically as UTF-8 text. */
    public static void writeText(Path target, TextBody body) {
        write(target, out -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
            body.write(w);
            w.flush();
        });
    }

    /** Writes {@code target} atomically with the given text. */
    public static void writeString(Path target, String text) {
        write(target, out -> out.write(text.getBytes(StandardCharsets.UTF_8)));
    }

    private static void pauseForTest() {
        try {
            Thread.sleep(PAUSE_BEFORE_MOVE_MS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** Makes the rename durable where the platform allows opening a folder (Linux); ignored elsewhere. */
    private static void syncFolder(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | UnsupportedOperationException ignored) {
            // not supported on this platform; the file itself is already fsynced
        }
    }
}
