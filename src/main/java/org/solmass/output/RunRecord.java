package org.solmass.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.InputException;
import org.solmass.study.Study;
import org.solmass.study.StudyReader;
import org.solmass.study.StudyWriter;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.Collections;
import java.util.HexFormat;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * What a results folder was made from, written as run.json beside the results: the resolved study,
 * the model file's SHA-256 and size (so a reader can tell whether the model changed since), Solmass's
 * version, the time base actually used, counts and phase timings. The viewer reads it to find the
 * model and rebuild the geometry. Layout: docs/outputs.md.
 *
 * @param solmassVersion version of Solmass that made the results (the CLI passes {@code Main.version()})
 * @param study the resolved study
 * @param modelSha256 lower-case hex SHA-256 of the model file's bytes
 * @param modelSizeBytes size of the model file, bytes
 * @param timeBase the time base used ("average-days" or "hourly-year")
 * @param counts named counts in the caller's order (patches, triangles, blocks, steps, rays, ...)
 * @param timingsS named phase durations in seconds, in the caller's order (load, patches, ...)
 * @param finished when the run finished (UTC), or null
 */
public record RunRecord(String solmassVersion, Study study, String modelSha256, long modelSizeBytes,
                        String timeBase, Map<String, Long> counts, Map<String, Double> timingsS, Instant finished) {
    public static final String FILE_NAME = "run.json";

    public RunRecord {
        counts = Collections.unmodifiableMap(new LinkedHashMap<>(counts));
        timingsS = Collections.unmodifiableMap(new LinkedHashMap<>(timingsS));
    }

    /** A record for a study; hashes the study's model file (pass ordered maps, e.g. LinkedHashMap). */
    public static RunRecord of(String solmassVersion, Study study, String timeBase, Map<String, Long> counts,
                               Map<String, Double> timingsS, Instant finished) {
        Path model = study.model().file();
        try {
            return new RunRecord(solmassVersion, study, sha256(model), Files.size(model), timeBase, counts, timingsS, finished);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot hash the model " + model + ": " + e.getMessage(), e);
        }
    }

    /** Lower-case hex SHA-256 of a file's bytes. */
    public static String sha256(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            byte[] buf = new byte[1 << 16];
            for (int n; (n = in.read(buf)) > 0; ) md.update(buf, 0, n);
            return HexFormat.of().formatHex(md.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    /** Whether the model file still has the recorded size and hash. */
    public boolean modelUnchanged() {
        Path p = study.model().file();
        try {
            return Files.size(p) == modelSizeBytes && sha256(p).equals(modelSha256);
        } catch (IOException e) {
            return false;
        }
    }

    public ObjectNode toTree() {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.put("solmass_version", solmassVersion);
        if (finished != null) o.put("finished_utc", finished.toString());
        o.put("time_base", timeBase);
        ObjectNode m = o.putObject("model");
        m.put("file", study.model().file().toString());
        m.put("sha256", modelSha256);
        m.put("size_bytes", modelSizeBytes);
        ObjectNode c = o.putObject("counts");
        counts.forEach(c::put);
        ObjectNode t = o.putObject("timings_s");
        timingsS.forEach((k, v) -> t.put(k, Math.round(v * 1000) / 1000.0));
        if (study.source() != null) o.put("study_file", study.source().toString());
        o.set("study", StudyWriter.toTree(study));
        return o;
    }

    /**
     * Writes a run record alone (without the manifest of a published results folder, which
     * {@link Publication} adds).
     */
    public void write(Path file) {
        AtomicFiles.writeString(file, StudyWriter.pretty(toTree()));
    }

    /**
     * Reads a run.json (or the folder holding one) without checking the folder's files; readers of
     * results use {@link PublishedRun#open}.
     */
    public static RunRecord read(Path fileOrFolder) {
        Path file = Files.isDirectory(fileOrFolder) ? fileOrFolder.resolve(FILE_NAME) : fileOrFolder;
        JsonNode n;
        try {
            n = new ObjectMapper().readTree(Files.readString(file));
        } catch (NoSuchFileException e) {
            throw new InputException(file.toString(), "no run record here (is this a Solmass results folder?)");
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read the run record: " + e.getMessage(), e);
        }
        return fromTree(n, file);
    }

    /** A run record from the parsed run.json {@code file}. */
    static RunRecord fromTree(JsonNode n, Path file) {
        String w = file.toString();
        if (n == null || !n.isObject()) throw new InputException(w, "expected a JSON object");
        JsonNode studyNode = require(n, "study", w);
        Path source = n.hasNonNull("study_file") ? Path.of(n.get("study_file").asText()) : null;
        Study study = StudyReader.fromTree(studyNode, source, file.toAbsolutePath().getParent(), w + ": study");
        JsonNode model = require(n, "model", w);
        Map<String, Long> counts = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = require(n, "counts", w).fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            counts.put(e.getKey(), e.getValue().asLong());
        }
        Map<String, Double> timings = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = require(n, "timings_s", w).fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            timings.put(e.getKey(), e.getValue().asDouble());
        }
        Instant finished = null;
        if (n.hasNonNull("finished_utc")) {
            try {
                finished = Instant.parse(n.get("finished_utc").asText());
            } catch (DateTimeParseException e) {
                throw new InputException(w + ": finished_utc", "expected an ISO-8601 UTC time, got " + n.get("finished_utc"));
            }
        }
        return new RunRecord(require(n, "solmass_version", w).asText(), study, require(model, "sha256", w + ": model").asText(),
                require(model, "size_bytes", w + ": model").asLong(), require(n, "time_base", w).asText(), counts, timings, finished);
    }

    private static JsonNode require(JsonNode n, String key, String where) {
        JsonNode v = n.get(key);
        if (v == null || v.isNull()) throw new InputException(where + ": " + key, "missing");
        return v;
    }
}
