package org.solmass.cli;

import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.rendering.PDFRenderer;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.Cautions;
import org.solmass.output.PdfPages;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code solmass elevations} and {@code solmass report} on the results of two invented boxes (one
 * analysed, one context) under the clear-sky model, the report read back with PDFBox's own text
 * extraction and renderer (a general-purpose library, not the code that wrote it).
 */
class ReportCommandTest {
    @TempDir static Path dir;
    static Path results;

    private static final String MODEL = String.join("\n", "o box",
            "v 0 0 0", "v 12 0 0", "v 12 8 0", "v 0 8 0", "v 0 0 18", "v 12 0 18", "v 12 8 18", "v 0 8 18",
            "f 5 6 7 8", "f 1 2 6 5", "f 2 3 7 6", "f 3 4 8 7", "f 4 1 5 8",
            "o neighbour",
            "v 20 0 0", "v 26 0 0", "v 26 8 0", "v 20 8 0", "v 20 0 9", "v 26 0 9", "v 26 8 9", "v 20 8 9",
            "f 13 14 15 16", "f 9 10 14 13", "f 10 11 15 14", "f 11 12 16 15", "f 12 9 13 16", "");

    @BeforeAll
    static void analyse() throws Exception {
        Files.writeString(dir.resolve("two.obj"), MODEL);
        Files.writeString(dir.resolve("study.json"), "{\"name\": \"Two boxes (invented)\", \"model\": {\"file\": \"two.obj\","
                + " \"context\": [\"neighbour\"]}, \"site\": {\"latitude\": 51, \"longitude\": 10, \"zone\": \"+01:00\"},"
                + " \"patch_m\": 2, \"rays\": 64}");
        results = dir.resolve("results");
        assertEquals(0, quietly("analyse", dir.resolve("study.json").toString(), "--out", results.toString(), "-q"));
    }

    private static int quietly(String... args) {
        PrintStream old = System.out;
        System.setOut(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
        try {
            return Main.execute(args);
        } finally {
            System.setOut(old);
        }
    }

    @Test
    void elevationsWriteOnePagePerAnalysedBlock() throws Exception {
        assertEquals(0, quietly("elevations", results.toString()));
        Path dirE = results.resolve(ElevationsCommand.FOLDER);
        try (var files = Files.list(dirE)) {
            assertEquals(List.of("box.png"), files.map(p -> p.getFileName().toString()).sorted().toList(),
                    "the analysed block only; the context block has no page");
        }
        BufferedImage img = ImageIO.read(dirE.resolve("box.png").toFile());
        assertEquals(2000, img.getWidth());
        assertTrue(img.getHeight() > 400 && img.getHeight() <= 1200, "at most the page height asked for: " + img.getHeight());
    }

    @Test
    void elevationsRefuseAColumnTheRunDoesNotHave() {
        assertEquals(Main.EXIT_INPUT, quietly("elevations", results.toString(), "--column", "no_such_column",
                "--out", dir.resolve("e2").toString()));
    }

    /**
     * Read back: the pages (title, map, one elevation page, tables, PV zones with cautions and
     * sources), the inputs' text, the results caution and the sources of what the run used (SPA and
     * Perez, the default sky; clear sky: Hottel), and every page renders.
     */
    @Test
    void reportReadBackHasItsPagesInputsCautionsAndSources() throws Exception {
        Path pdf = dir.resolve("out").resolve("r.pdf");
        assertEquals(0, quietly("report", results.toString(), "--out", pdf.toString()));
        try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
            assertEquals(6, d.getNumberOfPages(), "title, map, elevations of box, tables, PV zones + cautions, sources (run onto a sixth page)");
            PDFTextStripper strip = new PDFTextStripper();
            String all = strip.getText(d).replaceAll("\\s+", " ");
            for (String want : new String[] {"Two boxes (invented)", "two.obj", "clear-sky model", "Climate, annual totals", "GHI ",
                    "Sky model perez", "Patch size 2.00 m", "latitude 51.0000", "Solmass",
                    "Energy balance per zone", "performance_ratio", "Faiman"}) {
                assertTrue(all.contains(want), "inputs: " + want);
            }
            assertTrue(all.contains(PdfPages.safe(Cautions.RESULTS)), "the results caution, whole");
            assertTrue(all.contains("Reda, I., Andreas, A. (2004)"), "SPA");
            assertTrue(all.contains("Perez, R., Ineichen, P."), "Perez 1990");
            assertTrue(all.contains("Hottel, H.C. (1976)"), "the clear-sky model's source");
            assertFalse(all.contains("Erbs"), "no decomposition was used");
            strip.setStartPage(3);
            strip.setEndPage(3);
            assertTrue(strip.getText(d).contains("Facade elevations: box"));
            strip.setStartPage(4);
            strip.setEndPage(4);
            String tables = strip.getText(d);
            assertTrue(tables.contains("Facades by orientation") && tables.contains("All facades"), tables);
            PDFRenderer r = new PDFRenderer(d);
            for (int i = 0; i < d.getNumberOfPages(); i++) {
                BufferedImage img = r.renderImageWithDPI(i, 36);
                assertTrue(img.getWidth() > img.getHeight(), "A4 landscape");
            }
        }
    }
}
