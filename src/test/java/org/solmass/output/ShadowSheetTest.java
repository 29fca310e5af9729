package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.solmass.Cautions;
import org.solmass.metrics.ShadowStudy;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.scene.Scene;
import org.solmass.sun.Site;
import org.solmass.sun.SolarCalculator;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.Patcher;

import javax.imageio.ImageIO;
import java.awt.Rectangle;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalTime;
import java.time.MonthDay;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The shadow sheet of a lone box (invented geometry): one panel per date and time, each with sun and shade. */
class ShadowSheetTest {
    private static final String BOX = String.join("\n", "o box",
            "v 0 0 0", "v 12 0 0", "v 12 8 0", "v 0 8 0", "v 0 0 18", "v 12 0 18", "v 12 8 18", "v 0 8 18",
            "f 5 6 7 8", "f 1 2 6 5", "f 2 3 7 6", "f 3 4 8 7", "f 4 1 5 8", "");

    @Test
    void sheetHasOnePanelPerDateAndTimeEachWithSunAndShade(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        MassingModel m = ObjReader.parse(BOX, "box.obj", ModelOptions.defaults()).model();
        Scene scene = Scene.build(m, true, 0);
        List<Patch> patches = new ArrayList<>(Patcher.build(m, new PatchOptions(1.0, Set.of("box"), false)).patches());
        patches.addAll(ShadowStudy.groundGrid(scene, m, null, -40, -40, 52, 48, 0, 1.0, patches.size()));
        List<MonthDay> dates = List.of(MonthDay.of(3, 21), MonthDay.of(12, 21));
        List<LocalTime> times = ShadowStudy.DEFAULT_TIMES;
        SolarCalculator calc = new SolarCalculator(new Site(51.0, 10.0, 0, ZoneOffset.ofHours(1)));
        List<ShadowStudy.Frame> frames = ShadowStudy.compute(scene, patches, calc, 2025, ShadowStudy.moments(dates, times));
        Path png = dir.resolve("shadows.png");
        ShadowSheet.write(png, m, new boolean[] {true}, patches, frames, times.size(), "test");
        BufferedImage img = ImageIO.read(Files.newInputStream(png));
        // 3 columns of 560 px, 2 margins of 16 and 2 gaps of 12; 2 rows of caption 24 + panel 420 + gap 12, title 70, footer 64
        assertEquals(2 * 16 + 3 * 560 + 2 * 12, img.getWidth());
        assertEquals(70 + 2 * (24 + 420 + 12) + 64, img.getHeight());
        for (int r = 0; r < dates.size(); r++) {
            for (int c = 0; c < times.size(); c++) {
                Rectangle p = ShadowSheet.panel(r, c);
                int sun = 0, shade = 0;
                for (int y = p.y; y < p.y + p.height; y++) {
                    for (int x = p.x; x < p.x + p.width; x++) {
                        int rgb = img.getRGB(x, y) & 0xFFFFFF;
                        if (rgb == ShadowSheet.SUN) sun++;
                        if (rgb == ShadowSheet.SHADE) shade++;
                    }
                }
                assertTrue(sun > 1000 && shade > 100, "panel " + r + "," + c + ": " + sun + " sunlit and " + shade + " shaded ground pixels");
            }
        }
    }

    @Test
    void footerCautionCarriesTheResultsCaution() {
        assertTrue(ShadowSheet.CAUTION.contains("indicative") && ShadowSheet.CAUTION.contains("local standard time")
                && ShadowSheet.CAUTION.contains("local requirements") && ShadowSheet.CAUTION.endsWith(Cautions.RESULTS));
    }
}
