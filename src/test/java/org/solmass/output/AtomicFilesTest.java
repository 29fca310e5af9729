package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

class AtomicFilesTest {
    @TempDir Path dir;

    @Test
    void failureWhileWritingLeavesThePreviousFileIntactAndNoTempFile() throws Exception {
        Path f = dir.resolve("patches.csv");
        AtomicFiles.writeString(f, "old content\n");
        assertThrows(IllegalStateException.class, () -> AtomicFiles.writeText(f, w -> {
            w.write("half of the new");
            w.flush();
            throw new IllegalStateException("simulated failure");
        }));
        assertEquals("old content\n", Files.readString(f));
        assertThrows(UncheckedIOException.class, () -> AtomicFiles.write(f, out -> {
            out.write(new byte[100_000]);
            throw new IOException("disk full (simulated)");
        }));
        assertEquals("old content\n", Files.readString(f));
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(1, s.count(), "only the target is left in the folder");
        }
    }

    /** POSIX open(2) creates files 0666 less the umask; a written file must get that, not a temporary file's 0600. */
    @Test
    void writtenFilesHaveThePermissionsOfAPlainNewFileNotOfATemporaryFile() throws Exception {
        Path plain = Files.createFile(dir.resolve("plain"));
        Path f = dir.resolve("patches.csv");
        AtomicFiles.writeString(f, "x");
        assertEquals(Files.getPosixFilePermissions(plain), Files.getPosixFilePermissions(f));
    }

    @Test
    void writeReplacesAndCreatesFolders() throws Exception {
        Path f = dir.resolve("a/b/summary.json");
        AtomicFiles.writeString(f, "1");
        AtomicFiles.writeString(f, "2");
        assertEquals("2", Files.readString(f));
        try (Stream<Path> s = Files.list(f.getParent())) {
            assertEquals(1, s.count());
        }
    }
}
