package org.solmass.study;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.*;

/** The examples and the key tables of docs/study-file.md agree with the reader. */
class StudyFileDocTest {
    @TempDir Path dir;

    private static String doc() throws Exception {
        return Files.readString(Path.of("docs/study-file.md"));
    }

    @Test
    void everyJsonExampleInTheDocsReads() throws Exception {
        Matcher m = Pattern.compile("```json\\n(.*?)```", Pattern.DOTALL).matcher(doc());
        int n = 0;
        while (m.find()) {
            Path p = dir.resolve("example" + n++ + ".json");
            Files.writeString(p, m.group(1));
            assertNotNull(StudyReader.read(p));
        }
        assertTrue(n >= 2, "found " + n + " examples");
    }

    @Test
    void everyKeyTheWriterWritesIsDocumented() throws Exception {
        String doc = doc();
        Path p = dir.resolve("s.json");
        Files.writeString(p, "{\"model\": {\"file\": \"m.obj\"}, \"site\": {\"latitude\": 1, \"longitude\": 2, \"zone\": \"UTC\"}, \"climate\": \"w.csv\", \"description\": \"d\"}");
        List<String> keys = new ArrayList<>();
        collect(StudyWriter.toTree(StudyReader.read(p)), "", keys);
        for (String k : keys) assertTrue(doc.contains("`" + k + "`"), "docs/study-file.md documents " + k);
    }

    private static void collect(com.fasterxml.jackson.databind.JsonNode n, String path, List<String> out) {
        n.fieldNames().forEachRemaining(k -> {
            String kp = path.isEmpty() ? k : path + "." + k;
            out.add(kp);
            com.fasterxml.jackson.databind.JsonNode c = n.get(k);
            if (c.isObject() && !kp.equals("albedo.blocks") && !kp.equals("albedo.materials")) collect(c, kp, out);
        });
    }
}
