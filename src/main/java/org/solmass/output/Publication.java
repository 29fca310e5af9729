package org.solmass.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.study.StudyWriter;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Consumer;

/**
 * Publishes the outputs of one run into a results folder so that no reader ever takes files of two
 * runs for one (docs/outputs.md, "How a results folder is published"):
 * <ol>
 * <li>every output is written complete and fsynced into the hidden folder {@value #STAGING} inside the
 * results folder ({@link #write}); a failure here (a full disk, say) leaves the folder as it was;</li>
 * <li>run.json, with this run's id and each output's name, size and SHA-256 (the manifest), is staged
 * last, and the names of the outputs of the earlier run and of this one are noted in the staging folder
 * (so that a run after an interrupted one still knows what to remove);</li>
 * <li>{@link #publish}: the old run.json is removed (from here on the folder is visibly "no complete
 * run"), each output is renamed into place, outputs of the earlier run that this run did not write are
 * removed, and the new run.json is renamed into place as the last step.</li>
 * </ol>
 * Readers ({@link PublishedRun}) check the files they read against the manifest. Files Solmass did not
 * write (a compare/ folder, notes) are never touched. The folder must be held by a {@link FolderClaim}.
 * <p>
 * Test hooks (DEVELOPERS.md, "Testing a killed run"): {@code solmass.test.pauseBeforeMoveMs=N} pauses
 * N ms before each step of {@link #publish} (or only before step k with {@code solmass.test.pauseAtMove=k})
 * after printing {@code solmass: test hook: before move k: ...} on stderr; {@code solmass.test.failAtWrite=k}
 * makes the k-th output fail half written, as a full disk would.
 */
public final class Publication implements AutoCloseable {
    /** The hidden folder inside a results folder where a run's outputs wait to be published. */
    public static final String STAGING = ".solmass-staging";
    /** In the staging folder: the names of the outputs of the earlier run and of this one, one a line. */
    static final String PENDING = "publishing.txt";

    private final FolderClaim claim;
    private final Path dir, staging;
    private final Map<String, PublishedRun.Output> staged = new LinkedHashMap<>();
    private final int failAtWrite;
    private boolean publishing, published;

    /** Starts a publication in a claimed folder (creates the empty staging folder). */
    public Publication(FolderClaim claim) {
        this.claim = claim;
        this.dir = claim.folder();
        this.staging = dir.resolve(STAGING);
        this.failAtWrite = Integer.getInteger("solmass.test.failAtWrite", 0);
        try {
            Files.createDirectories(staging);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the results into " + dir + ": " + e.getMessage(), e);
        }
    }

    /**
     * Writes one output into the staging folder with {@code writer} (given the staged path) and records
     * its size and SHA-256.
     *
     * @throws UncheckedIOException when it cannot be written; the results folder is unchanged
     */
    public void write(String name, Consumer<Path> writer) {
        Path p = staging.resolve(name);
        try {
            writer.accept(p);
            if (staged.size() + 1 == failAtWrite) {
                try (var ch = java.nio.channels.FileChannel.open(p, java.nio.file.StandardOpenOption.WRITE)) {
                    ch.truncate(ch.size() / 2);
                }
                throw new IOException("No space left on device (simulated by solmass.test.failAtWrite=" + failAtWrite + ")");
            }
            staged.put(name, new PublishedRun.Output(name, Files.size(p), RunRecord.sha256(p)));
        } catch (IOException | UncheckedIOException e) {
            String why = e instanceof UncheckedIOException u && u.getCause() != null ? u.getCause().getMessage() : e.getMessage();
            throw new UncheckedIOException("cannot write " + name + " into " + dir + ": " + why
                    + "; the results there are unchanged", e instanceof IOException io ? io : ((UncheckedIOException) e).getCause());
        }
    }

    /**
     * Stages run.json with the manifest, then publishes every staged output and run.json (last).
     *
     * @return the published files in the order written, run.json last
     */
    public List<Path> publish(RunRecord run) {
        Path runJson = dir.resolve(RunRecord.FILE_NAME);
        try {
            Set<String> old = previousOutputs();
            AtomicFiles.writeString(staging.resolve(RunRecord.FILE_NAME), StudyWriter.pretty(manifestTree(run)));
            Set<String> both = new LinkedHashSet<>(old);
            both.addAll(staged.keySet());
            AtomicFiles.writeString(staging.resolve(PENDING), String.join("\n", both) + "\n");

            publishing = true;
            int step = 0;
            pauseForTest(++step, "remove " + RunRecord.FILE_NAME);
            Files.deleteIfExists(runJson);
            AtomicFiles.syncFolder(dir);
            List<Path> written = new ArrayList<>();
            for (String name : staged.keySet()) {
                pauseForTest(++step, "move " + name);
                move(staging.resolve(name), dir.resolve(name));
                written.add(dir.resolve(name));
            }
            for (String name : old) {
                if (staged.containsKey(name)) continue;
                pauseForTest(++step, "remove " + name + " of the earlier run");
                Files.deleteIfExists(dir.resolve(name));
            }
            AtomicFiles.syncFolder(dir);
            pauseForTest(++step, "move " + RunRecord.FILE_NAME);
            move(staging.resolve(RunRecord.FILE_NAME), runJson);
            AtomicFiles.syncFolder(dir);
            written.add(runJson);
            published = true;
            claim.markPublished();
            Files.deleteIfExists(staging.resolve(PENDING));
            removeLeftovers(dir);
            return written;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot publish the results in " + dir + ": " + e.getMessage()
                    + "; the folder has no complete run now: run analyse again", e);
        }
    }

    /** run.json: the run record with this run's id first and the outputs before the study. */
    private ObjectNode manifestTree(RunRecord run) {
        ObjectNode record = run.toTree(), o = JsonNodeFactory.instance.objectNode();
        o.put(PublishedRun.RUN_ID, claim.runId());
        for (Iterator<Map.Entry<String, JsonNode>> it = record.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            if ((e.getKey().equals("study_file") || e.getKey().equals("study")) && !o.has(PublishedRun.OUTPUTS)) {
                o.set(PublishedRun.OUTPUTS, outputsTree());
            }
            o.set(e.getKey(), e.getValue());
        }
        if (!o.has(PublishedRun.OUTPUTS)) o.set(PublishedRun.OUTPUTS, outputsTree());
        return o;
    }

    private ArrayNode outputsTree() {
        ArrayNode a = JsonNodeFactory.instance.arrayNode();
        for (PublishedRun.Output f : staged.values()) {
            a.addObject().put("file", f.file()).put("size_bytes", f.sizeBytes()).put("sha256", f.sha256());
        }
        return a;
    }

    /**
     * The outputs an earlier run left: those of run.json's manifest, those an interrupted publication
     * noted, and, for a run.json of a Solmass without manifests, the output names Solmass writes.
     */
    private Set<String> previousOutputs() {
        Set<String> names = new LinkedHashSet<>(claim.interruptedOutputs());
        Path runJson = dir.resolve(RunRecord.FILE_NAME);
        if (Files.exists(runJson)) {
            List<String> listed = PublishedRun.listedOutputs(runJson);
            names.addAll(listed != null ? listed : ResultsFolder.OUTPUT_NAMES);
        }
        names.remove(RunRecord.FILE_NAME);
        names.removeIf(n -> n.isEmpty() || n.contains("/") || n.contains("\\") || n.startsWith("."));
        return names;
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    private static void pauseForTest(int step, String what) {
        long ms = Long.getLong("solmass.test.pauseBeforeMoveMs", 0L);
        int only = Integer.getInteger("solmass.test.pauseAtMove", 0);
        if (ms <= 0 || (only > 0 && only != step)) return;
        System.err.println("solmass: test hook: before move " + step + ": " + what);
        System.err.flush();
        try {
            Thread.sleep(ms);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /**
     * Removes what an unfinished run left in a results folder (the staged files, temporary files of
     * Solmass's outputs) and returns the output names an interrupted publication had noted; that list
     * stays until a publication succeeds. Call only while holding the folder's {@link FolderClaim}.
     */
    static Set<String> removeLeftovers(Path dir) {
        Set<String> noted = new LinkedHashSet<>();
        Path staging = dir.resolve(STAGING);
        try {
            noted.addAll(Files.readAllLines(staging.resolve(PENDING), StandardCharsets.UTF_8));
        } catch (NoSuchFileException e) {
            // no interrupted publication
        } catch (IOException e) {
            // unreadable: the names of run.json still apply
        }
        if (Files.isDirectory(staging)) {
            try (DirectoryStream<Path> s = Files.newDirectoryStream(staging)) {
                for (Path p : s) if (!p.getFileName().toString().equals(PENDING)) Files.deleteIfExists(p);
                if (noted.isEmpty()) Files.deleteIfExists(staging);
            } catch (IOException ignored) {
                // left for the next run; never read
            }
        }
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir, ".*.tmp")) {
            for (Path p : s) {
                String n = p.getFileName().toString();
                for (String out : ResultsFolder.OUTPUT_NAMES) {
                    if (n.startsWith("." + out + ".") && Files.isRegularFile(p)) Files.deleteIfExists(p);
                }
            }
        } catch (IOException ignored) {
            // temporary files are never read; a later run tries again
        }
        return noted;
    }

    /**
     * Removes the staged files when the run failed before publishing (or ran out of memory). A
     * publication that failed part-way keeps them: the next run reads from them what to remove.
     */
    @Override
    public void close() {
        if (!published && !publishing) removeLeftovers(dir);
    }
}
