package org.solmass.output;

import org.solmass.InputException;

import java.io.IOException;
import java.net.InetAddress;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.temporal.ChronoUnit;

/**
 * A results folder checked and held for one run, from before the work starts until its outputs are
 * published (docs/outputs.md, "How a results folder is published").
 * <p>
 * {@link #claim} first checks that the folder can take results (not a file, not the study file, not
 * {@code /}, not under {@code /proc} or {@code /sys}, no name longer than the file
 * system allows, writable), creating it when missing, so that these mistakes are reported before the
 * analysis and not after it. It then locks the file {@value #LOCK_FILE} inside the folder with
 * {@link FileChannel#tryLock()} and writes who holds it (process id, host, start time, study) into
 * it. A second run on the same folder finds the lock taken and refuses, naming the first. The
 * operating system releases the lock when its process ends, however it ends; a lock file with content
 * but no lock is what a killed run leaves, and is taken over with a note. On {@link #close()} the
 * content is emptied and the lock released; the file stays (deleting it would let two later runs lock
 * two different files of the same name).
 */
public final class FolderClaim implements AutoCloseable {
    /** The lock file inside a results folder. */
    public static final String LOCK_FILE = ".solmass.lock";
    /** The longest name of one path element most file systems allow (ext4, XFS, Btrfs, APFS, NTFS: 255). */
    static final int NAME_MAX_BYTES = 255;

    /**
     * Lock files this Java process holds, with their holder text. Checked before a channel is opened:
     * on Linux, closing any channel of a file releases every lock the process holds on it, so a second
     * claim in the same process must not even open the file.
     */
    private static final java.util.Map<Path, String> HELD = new java.util.concurrent.ConcurrentHashMap<>();

    private final Path folder;
    private final boolean created;
    private final FileChannel channel;
    private final FileLock lock;
    private final String runId;
    private final String note;
    private final java.util.Set<String> interrupted;
    private boolean published;

    private FolderClaim(Path folder, boolean created, FileChannel channel, FileLock lock, String runId, String note,
                        java.util.Set<String> interrupted) {
        this.interrupted = interrupted;
        this.folder = folder;
        this.created = created;
        this.channel = channel;
        this.lock = lock;
        this.runId = runId;
        this.note = note;
    }

    /**
     * Checks a results folder, creates it when missing and locks it for one run.
     *
     * @param folder the output folder
     * @param where what to name in messages: the flag ({@code --out}) or the study key ({@code FILE: outputs.folder})
     * @param studyFile the study file the run reads (refused as the folder), or null
     * @param studyLabel the study as the lock names it to a second run (its file or name)
     * @throws InputException when the folder cannot take results or another run holds it
     */
    public static FolderClaim claim(Path folder, String where, Path studyFile, String studyLabel) {
        Path dir = check(folder, where, studyFile);
        boolean created = !Files.isDirectory(dir);
        try {
            Files.createDirectories(dir);
        } catch (IOException e) {
            throw refusal(dir, where, e);
        }
        String heldHere = HELD.get(key(dir));
        if (heldHere != null) throw inUse(where, dir, heldHere);
        FileChannel ch;
        try {
            ch = FileChannel.open(dir.resolve(LOCK_FILE), StandardOpenOption.CREATE, StandardOpenOption.READ,
                    StandardOpenOption.WRITE);
        } catch (IOException e) {
            throw refusal(dir, where, e);
        }
        try {
            FileLock lock;
            String note = null;
            try {
                lock = ch.tryLock();
            } catch (OverlappingFileLockException e) {
                lock = null;   // held by another run in this same Java process
            } catch (IOException e) {
                // a file system without locks (some network mounts): go on without, and say so
                lock = null;
                note = "cannot lock " + dir + " (" + e.getMessage() + "); two runs into this folder at once would not be kept apart";
                return start(dir, created, ch, null, studyLabel, note);
            }
            String holder = readHolder(ch);
            if (lock == null) {
                ch.close();
                throw inUse(where, dir, holder);
            }
            if (!holder.isEmpty()) {
                note = "an earlier run into " + dir + " did not finish (" + holder + "); its lock is taken over and its leftovers removed";
            }
            return start(dir, created, ch, lock, studyLabel, note);
        } catch (IOException e) {
            closeQuietly(ch);
            throw new java.io.UncheckedIOException("cannot lock " + dir + ": " + e.getMessage(), e);
        } catch (RuntimeException e) {
            closeQuietly(ch);
            throw e;
        }
    }

    /** The key of a folder's lock in {@link #HELD}: its real path where it exists. */
    private static Path key(Path dir) {
        try {
            return dir.toRealPath().resolve(LOCK_FILE);
        } catch (IOException e) {
            return dir.resolve(LOCK_FILE);
        }
    }

    private static InputException inUse(String where, Path dir, String holder) {
        return new InputException(where, dir + " is in use by another Solmass run (" + (holder.isEmpty() ? "no details" : holder)
                + "); wait for it to finish or give another folder");
    }

    private static FolderClaim start(Path dir, boolean created, FileChannel ch, FileLock lock, String studyLabel, String note)
            throws IOException {
        Instant now = Instant.now().truncatedTo(ChronoUnit.SECONDS);
        String runId = now.toString().replace(":", "").replace("-", "") + "-"
                + Long.toUnsignedString(new java.security.SecureRandom().nextLong(), 36);
        String holder = "pid " + ProcessHandle.current().pid() + " on " + hostName() + ", started " + now + ", study " + studyLabel;
        ch.truncate(0);
        ch.write(ByteBuffer.wrap((holder + "\n").getBytes(StandardCharsets.UTF_8)), 0);
        ch.force(true);
        HELD.put(key(dir), holder);
        java.util.Set<String> interrupted = Publication.removeLeftovers(dir);
        return new FolderClaim(dir, created, ch, lock, runId, note, interrupted);
    }

    /**
     * For commands that write their own files without publishing a run (sky-view, compare, shadows):
     * the same checks as {@link #claim}, the folder created when missing and a file written and removed
     * in it, all before any work, so a folder that cannot take the files is refused at once.
     *
     * @return the absolute folder
     * @throws InputException naming {@code where} when the folder cannot take files
     */
    public static Path prepareWritable(Path folder, String where) {
        Path dir = check(folder, where, null);
        try {
            Files.createDirectories(dir);
            Path probe = Files.createTempFile(dir, ".solmass-probe-", ".tmp");
            Files.delete(probe);
        } catch (IOException e) {
            throw refusal(dir, where, e);
        }
        return dir;
    }

    /**
     * Checks what can be checked without writing: the path is not {@code /}, not under a system
     * folder, no name is too long, it is not the study file, not a file. Returns the absolute folder.
     */
    static Path check(Path folder, String where, Path studyFile) {
        Path dir = folder.toAbsolutePath().normalize();
        if (dir.getParent() == null) {
            throw new InputException(where, dir + " is the root of the file system; give a folder of its own for the results");
        }
        for (Path name : dir) {
            int bytes = name.toString().getBytes(StandardCharsets.UTF_8).length;
            if (bytes > NAME_MAX_BYTES) {
                throw new InputException(where, "the name " + shortened(name.toString()) + " is too long for the file system ("
                        + bytes + " bytes; at most " + NAME_MAX_BYTES + " per name)");
            }
        }
        Path real = realOfNearestExisting(dir);
        for (String system : new String[] {"/proc", "/sys"}) {
            if (real.startsWith(system)) {
                throw new InputException(where, dir + " is under " + system
                        + ", which the operating system fills, not a place for files; give a folder of your own");
            }
        }
        if (studyFile != null && Files.exists(dir)) {
            try {
                if (Files.isSameFile(dir, studyFile)) {
                    throw new InputException(where, dir + " is the study file itself; give a folder for the results");
                }
            } catch (IOException ignored) {
                // not comparable: the checks below still apply
            }
        }
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new InputException(where, dir + " is a file, not a folder; give a folder for the results (it is created when missing)");
        }
        for (Path p = dir.getParent(); p != null; p = p.getParent()) {
            if (Files.exists(p)) {
                if (!Files.isDirectory(p)) {
                    throw new InputException(where, p + " is a file, not a folder, so " + dir + " cannot be created; give a folder for the results");
                }
                break;
            }
        }
        return dir;
    }

    private static Path realOfNearestExisting(Path dir) {
        for (Path p = dir; p != null; p = p.getParent()) {
            try {
                return p.toRealPath();
            } catch (IOException e) {
                // does not exist yet: try its parent
            }
        }
        return dir;
    }

    /** The refusal for a failed create or open in the folder, in the user's words. */
    private static InputException refusal(Path dir, String where, IOException e) {
        if (e instanceof AccessDeniedException) {
            return new InputException(where, "permission denied: cannot create files in " + dir + "; give a folder you can write to", e);
        }
        if (e instanceof FileAlreadyExistsException || e instanceof NotDirectoryException) {
            String file = e instanceof FileSystemException f && f.getFile() != null ? f.getFile() : dir.toString();
            return new InputException(where, file + " is a file, not a folder; give a folder for the results", e);
        }
        String reason = e instanceof FileSystemException f && f.getReason() != null ? f.getReason() : String.valueOf(e.getMessage());
        if (reason.contains("Read-only file system")) {
            return new InputException(where, "permission denied: " + dir + " is on a read-only file system; give a folder you can write to", e);
        }
        if (reason.contains("File name too long")) {
            return new InputException(where, "the path " + shortened(dir.toString()) + " is too long for the file system", e);
        }
        return new InputException(where, "cannot create files in " + dir + ": " + reason, e);
    }

    private static String shortened(String s) {
        return s.length() <= 40 ? "\"" + s + "\"" : "\"" + s.substring(0, 32) + "...\" (" + s.length() + " characters)";
    }

    private static String readHolder(FileChannel ch) throws IOException {
        long size = Math.min(ch.size(), 4096);
        ByteBuffer b = ByteBuffer.allocate((int) size);
        ch.read(b, 0);
        return new String(b.array(), 0, b.position(), StandardCharsets.UTF_8).strip();
    }

    private static String hostName() {
        try {
            return InetAddress.getLocalHost().getHostName();
        } catch (IOException e) {
            return "an unknown host";
        }
    }

    private static void closeQuietly(FileChannel ch) {
        try {
            ch.close();
        } catch (IOException ignored) {
            // nothing to add to the failure being reported
        }
    }

    /** The absolute results folder. */
    public Path folder() {
        return folder;
    }

    /** This run's id: its start time (UTC) and a random part, e.g. {@code 20261202T012000Z-3k9x...}. */
    public String runId() {
        return runId;
    }

    /** A note for the user (a stale lock taken over, or no locking), or null. */
    public String note() {
        return note;
    }

    /** Output names an interrupted publication into this folder had noted (removed with the next publication). */
    java.util.Set<String> interruptedOutputs() {
        return interrupted;
    }

    void markPublished() {
        published = true;
    }

    /**
     * Empties the lock file and releases the lock. A folder this claim created and nothing was
     * published into is removed again, so a run refused later (a bad model, say) leaves no trace.
     */
    @Override
    public void close() {
        Path key = key(folder);
        try {
            channel.truncate(0);
            if (lock != null) lock.release();
        } catch (IOException ignored) {
            // the lock goes with the channel or the process anyway
        }
        HELD.remove(key);
        try {
            channel.close();
            if (created && !published) {
                Files.deleteIfExists(folder.resolve(LOCK_FILE));
                Publication.removeLeftovers(folder);
                Files.deleteIfExists(folder);   // only when empty; a DirectoryNotEmptyException keeps it
            }
        } catch (IOException ignored) {
            // the lock goes with the process anyway; nothing the user could act on
        }
    }
}
