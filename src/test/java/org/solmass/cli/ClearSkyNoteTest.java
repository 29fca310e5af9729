package org.solmass.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.Cautions;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A clear-sky run says in summary.json's cautions and in the terminal summary that its sky is
 * cloudless (an upper bound, not typical weather); a run on a climate file does not. The sentence is
 * the one the viewer's set-up shows ({@link Cautions#CLEAR_SKY}).
 */
class ClearSkyNoteTest {
    @TempDir Path dir;

    private String analyse(String name, String... extra) throws Exception {
        Path model = dir.resolve(name + ".obj");
        Files.writeString(model, org.solmass.fixtures.Boxes.onGround(0, 0, 10, 8, 12).obj("box"));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        PrintStream old = System.out;
        System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
        try {
            List<String> args = new ArrayList<>(List.of("analyse", "--model", model.toString(), "--lat", "51", "--lon", "10",
                    "--zone", "+01:00", "--rays", "64", "--patch", "2", "--no-gltf", "--threads", "2", "--time-base", "average-days",
                    "--out", dir.resolve(name).toString()));
            args.addAll(List.of(extra));
            assertEquals(0, Main.execute(args.toArray(String[]::new)));
        } finally {
            System.setOut(old);
        }
        return out.toString(StandardCharsets.UTF_8);
    }

    @Test
    void aClearSkyRunCarriesTheCloudlessNoteInSummaryAndTerminal() throws Exception {
        String terminal = analyse("clear");
        assertTrue(terminal.contains(Cautions.CLEAR_SKY), terminal);
        assertTrue(Files.readString(dir.resolve("clear").resolve("summary.json")).contains(Cautions.CLEAR_SKY));

        Path climate = dir.resolve("weather.csv");   // the sample's INVENTED month-hour table
        Files.copy(Path.of("sample-massing", "veldhaven-month-hour.csv"), climate);
        String withFile = analyse("file", "--climate", climate.toString());
        assertFalse(withFile.contains(Cautions.CLEAR_SKY), withFile);
        assertFalse(Files.readString(dir.resolve("file").resolve("summary.json")).contains(Cautions.CLEAR_SKY));
    }
}
