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
 * the writer fails, the temporary file is deleted and the old file stays as it was. The temporary file
 * is created with the default permissions (0666 less the user's umask), not the 0600 of
 * {@link Files#createTempFile}, so the file keeps them after the move.
 * A whole results folder is published by {@link Publication}, on top of this.
 */
public final class AtomicFiles {
    private static final java.security.SecureRandom RANDOM = new java.security.SecureRandom();

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
            tmp = createTemp(dir, abs.getFileName().toString());
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
                OutputStream out = new BufferedOutputStream(Channels.newOutputStream(ch), 1 << 16);
                body.write(out);
                out.flush();
                ch.force(true);
            }
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

    /**
     * Creates a new empty file {@code .NAME.<random>.tmp} in {@code dir} with the default permissions
     * (the user's umask applies), unlike {@link Files#createTempFile}, which makes it 0600.
     */
    static Path createTemp(Path dir, String name) throws IOException {
        for (int attempt = 0; ; attempt++) {
            Path tmp = dir.resolve("." + name + "." + Long.toUnsignedString(RANDOM.nextLong(), 36) + ".tmp");
            try {
                Files.newByteChannel(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
                return tmp;
            } catch (java.nio.file.FileAlreadyExistsException e) {
                if (attempt > 100) throw e;
            }
        }
    }

    /** Makes renames and deletions in a folder durable where the platform allows opening a folder (Linux); ignored elsewhere. */
    static void syncFolder(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | UnsupportedOperationException ignored) {
            // not supported on this platform; the file itself is already fsynced
        }
    }
}
