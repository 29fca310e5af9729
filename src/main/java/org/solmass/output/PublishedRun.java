package org.solmass.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.InputException;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;

/**
 * A results folder opened for reading: its run.json (the {@link RunRecord} and the manifest that
 * {@link Publication} writes last) and the outputs, each checked against the manifest before it is
 * read. Every reader (the viewer on a folder, {@code compare}) goes through here, so none shows files
 * of two runs as one: a folder with outputs but no run.json is refused as incomplete, a file whose size
 * or SHA-256 differs from the manifest as not belonging to the run. A run.json written before manifests
 * existed is read with a warning.
 */
public final class PublishedRun {
    /** run.json keys of the manifest. */
    public static final String RUN_ID = "run_id", OUTPUTS = "outputs";

    /**
     * One output of a run as the manifest lists it.
     *
     * @param file file name inside the results folder
     * @param sizeBytes size, bytes
     * @param sha256 lower-case hex SHA-256 of its bytes
     */
    public record Output(String file, long sizeBytes, String sha256) {}

    private final Path folder;
    private final byte[] runJsonBytes;
    private final RunRecord record;
    private final String runId;
    private final Map<String, Output> outputs;
    private final List<String> warnings;

    private PublishedRun(Path folder, byte[] runJsonBytes, RunRecord record, String runId, Map<String, Output> outputs,
                         List<String> warnings) {
        this.folder = folder;
        this.runJsonBytes = runJsonBytes;
        this.record = record;
        this.runId = runId;
        this.outputs = outputs;
        this.warnings = warnings;
    }

    /**
     * Opens a results folder.
     *
     * @throws InputException when it is no results folder, incomplete, or its run.json is unreadable
     */
    public static PublishedRun open(Path folder) {
        Path file = folder.resolve(RunRecord.FILE_NAME);
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            if (looksIncomplete(folder)) throw incomplete(folder);
            throw new InputException(file.toString(), "no run record here (is this a Solmass results folder?)");
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read the run record: " + e.getMessage(), e);
        }
        JsonNode n;
        try {
            n = new ObjectMapper().readTree(bytes);
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read the run record: " + e.getMessage(), e);
        }
        RunRecord record = RunRecord.fromTree(n, file);
        List<String> warnings = new ArrayList<>();
        Map<String, Output> outputs = outputs(n, file.toString());
        if (outputs == null) {
            warnings.add(folder + " was written by a Solmass without run manifests: its files cannot be checked to belong "
                    + "to one run; run analyse again to be sure");
        }
        String runId = n.hasNonNull(RUN_ID) ? n.get(RUN_ID).asText() : null;
        return new PublishedRun(folder, bytes, record, runId, outputs, Collections.unmodifiableList(warnings));
    }

    /** Whether a folder without run.json holds what a run leaves: outputs, or the staging folder. */
    public static boolean looksIncomplete(Path folder) {
        if (Files.exists(folder.resolve(Publication.STAGING))) return true;
        for (String name : ResultsFolder.OUTPUT_NAMES) if (Files.exists(folder.resolve(name))) return true;
        return false;
    }

    private static InputException incomplete(Path folder) {
        return new InputException(folder.toString(), "results folder is incomplete: the run that wrote it was interrupted "
                + "(no run.json beside its files); run analyse again");
    }

    /** The output names run.json's manifest lists, or null when it has none (or cannot be read). */
    static List<String> listedOutputs(Path runJson) {
        try {
            Map<String, Output> m = outputs(new ObjectMapper().readTree(runJson.toFile()), runJson.toString());
            return m == null ? null : new ArrayList<>(m.keySet());
        } catch (IOException | InputException e) {
            return null;
        }
    }

    private static Map<String, Output> outputs(JsonNode n, String where) {
        JsonNode a = n == null ? null : n.get(OUTPUTS);
        if (a == null || a.isNull()) return null;
        if (!a.isArray()) throw new InputException(where + ": " + OUTPUTS, "expected an array of {file, size_bytes, sha256}");
        Map<String, Output> m = new LinkedHashMap<>();
        for (JsonNode e : a) {
            if (!e.hasNonNull("file") || !e.hasNonNull("size_bytes") || !e.hasNonNull("sha256")) {
                throw new InputException(where + ": " + OUTPUTS, "expected {file, size_bytes, sha256}, got " + e);
            }
            m.put(e.get("file").asText(), new Output(e.get("file").asText(), e.get("size_bytes").asLong(), e.get("sha256").asText()));
        }
        return m;
    }

    /** The results folder. */
    public Path folder() {
        return folder;
    }

    /** The run record. */
    public RunRecord record() {
        return record;
    }

    /** The run's id, or null for a run.json without one. */
    public String runId() {
        return runId;
    }

    /** Warnings for the user (a folder that cannot be checked). */
    public List<String> warnings() {
        return warnings;
    }

    /** Whether the run wrote this output (for an unchecked folder: whether the file exists). */
    public boolean has(String name) {
        return outputs != null ? outputs.containsKey(name) : Files.exists(folder.resolve(name));
    }

    /**
     * Reads one output: checks its size and SHA-256 against the manifest, reads it, then checks that
     * run.json has not changed meanwhile (another run publishing into the folder).
     *
     * @throws InputException when the file does not belong to the recorded run or the folder changed
     */
    public <T> T read(String name, Function<Path, T> reader) {
        Path f = folder.resolve(name);
        if (outputs != null) verify(f, outputs.get(name));
        T t = reader.apply(f);
        byte[] now;
        try {
            now = Files.readAllBytes(folder.resolve(RunRecord.FILE_NAME));
        } catch (IOException e) {
            now = null;
        }
        if (!Arrays.equals(runJsonBytes, now)) {
            throw new InputException(folder.toString(), "results folder changed while it was read (another run is publishing "
                    + "into it); open it again when that run has finished");
        }
        return t;
    }

    private void verify(Path f, Output o) {
        if (o == null) {
            throw new InputException(f.toString(), "is not part of the run recorded in run.json (the run did not write it)");
        }
        try {
            if (Files.size(f) != o.sizeBytes() || !RunRecord.sha256(f).equals(o.sha256())) {
                throw new InputException(f.toString(), "does not belong to the run recorded in run.json (its size or SHA-256 "
                        + "differs): the file was changed after the run; run analyse again");
            }
        } catch (NoSuchFileException e) {
            throw new InputException(folder.toString(), "results folder is incomplete: " + o.file()
                    + " of the run recorded in run.json is missing; run analyse again");
        } catch (IOException e) {
            throw new InputException(f.toString(), "cannot read: " + e.getMessage(), e);
        }
    }
}
