package org.solmass.output;

import org.junit.jupiter.api.Test;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.*;

class MapRendererTest {
    @Test
    void mapIsAPngOfTheRequestedSizeMostlyInRampColours() throws Exception {
        System.setProperty("java.awt.headless", "true");
        SyntheticScene s = SyntheticScene.district(1.0);
        Path dir = Files.createTempDirectory("map");
        Path png = dir.resolve("map.png");
        MapRenderer.write(png, s.model(), s.analysedBlocks(), s.patches, s.values(), "Annual irradiation", "kWh/m2",
                MapRenderer.Options.of(1600, 900, "Synthetic courtyard (invented)"));
        String keep = System.getProperty("solmass.map.keep");
        if (keep != null) Files.copy(png, Path.of(keep + System.currentTimeMillis() % 100000 + ".png"));
        BufferedImage img = ImageIO.read(png.toFile());
        assertEquals(1600, img.getWidth());
        assertEquals(900, img.getHeight());
        boolean[] nearRamp = nearRampLookup(10);
        int hits = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if (nearRamp[img.getRGB(x, y) & 0xFFFFFF]) hits++;
            }
        }
        double share = hits / (double) (img.getWidth() * img.getHeight());
        // The analysed faces of this fixture, seen in both panels, cover about an eighth of the image
        // (measured by eye on the saved PNG); a map that drew them grey, hid them or left them out would
        // fall far below a tenth.
        assertTrue(share > 0.10, "ramp colours cover " + share + " of the pixels");
    }

    @Test
    void contextBlocksAreNeutralGreyAndAnalysedFacesAreNot() {
        SyntheticScene s = SyntheticScene.district(2.0).gableHouse("House", -30, 45, 16, 9, 6, 10, 25);
        BufferedImage img = MapRenderer.render(s.model(), s.analysedBlocks(), s.patches, s.values(), "Annual irradiation",
                "kWh/m2", MapRenderer.Options.of(1000, 600, "t"));
        boolean[] nearRamp = nearRampLookup(10);
        int grey = 0, ramp = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int c = img.getRGB(x, y) & 0xFFFFFF;
                int r = (c >> 16) & 255, g = (c >> 8) & 255, b = c & 255;
                if (r == g && g == b && r > 100 && r < 235) grey++;
                if (nearRamp[c]) ramp++;
            }
        }
        assertTrue(grey > 0.03 * img.getWidth() * img.getHeight(), "context grey pixels: " + grey);
        assertTrue(ramp > 0.05 * img.getWidth() * img.getHeight(), "ramp pixels: " + ramp);
    }

    @Test
    void projectedCoordinatesFarFromTheOriginGiveTheSameMap() {
        // Survey coordinates (hundreds of km) must not cost depth precision: the map of a scene moved by
        // (500 km, 5000 km, 300 m) matches the map at the origin, up to the odd pixel on an edge where
        // rounding of the shifted coordinates lands a sample on the other side.
        SyntheticScene s = SyntheticScene.district(2.0);
        org.solmass.model.MassingModel m = s.model();
        double dx = 500_000, dy = 5_000_000, dz = 300;
        double[] vs = m.vertices().clone();
        for (int i = 0; i < vs.length; i += 3) {
            vs[i] += dx; vs[i + 1] += dy; vs[i + 2] += dz;
        }
        org.solmass.model.MassingModel moved = new org.solmass.model.MassingModel(null, m.blockNames(), m.materialNames(), vs,
                m.triangles(), m.triangleBlock(), m.triangleMaterial(), m.triangleLine(), 0);
        java.util.List<org.solmass.surface.Patch> movedPatches = new java.util.ArrayList<>();
        for (org.solmass.surface.Patch p : s.patches) {
            double[] o = p.outline().clone();
            for (int i = 0; i < o.length; i += 3) {
                o[i] += dx; o[i + 1] += dy; o[i + 2] += dz;
            }
            movedPatches.add(new org.solmass.surface.Patch(p.index(), p.id(), p.block(), p.blockName(), p.surface(), p.kind(),
                    p.centroid().plus(new org.solmass.model.Vec3(dx, dy, dz)), p.normal(), p.areaM2(), p.tiltDeg(), p.azimuthDeg(), o));
        }
        MapRenderer.Options opt = MapRenderer.Options.of(900, 500, "t");
        BufferedImage a = MapRenderer.render(m, s.analysedBlocks(), s.patches, s.values(), "q", "kWh/m2", opt);
        BufferedImage b = MapRenderer.render(moved, s.analysedBlocks(), movedPatches, s.values(), "q", "kWh/m2", opt);
        int differ = 0;
        for (int y = 0; y < a.getHeight(); y++) for (int x = 0; x < a.getWidth(); x++) if (a.getRGB(x, y) != b.getRGB(x, y)) differ++;
        assertTrue(differ < 0.002 * a.getWidth() * a.getHeight(), differ + " pixels differ");
    }

    @Test
    void autoRangeIsTheSecondAndNinetyEighthPercentile() {
        double[] v = new double[100];
        for (int i = 0; i < 100; i++) v[i] = i + 1;      // 1..100
        v[0] = Double.NaN;                               // ignored: 99 finite values 2..100
        double[] r = MapRenderer.autoRange(v);
        // nearest-rank percentile (common practice): rank ceil(p n) of n = 99 sorted values
        assertEquals(3, r[0], 0);    // rank ceil(0.02*99) = 2 -> value 3
        assertEquals(99, r[1], 0);   // rank ceil(0.98*99) = 98 -> value 99
        assertArrayEquals(new double[] {5, 5}, MapRenderer.autoRange(new double[] {5, 5, 5}));
    }

    /** Colours within {@code tol} code values per channel of a ramp colour (outlines and anti-aliasing blend a little). */
    private static boolean[] nearRampLookup(int tol) {
        boolean[] near = new boolean[1 << 24];
        for (int i = 0; i < 256; i++) {
            int c = ColourRamp.sequential(i / 255.0);
            int r = (c >> 16) & 255, g = (c >> 8) & 255, b = c & 255;
            for (int dr = -tol; dr <= tol; dr++) for (int dg = -tol; dg <= tol; dg++) for (int db = -tol; db <= tol; db++) {
                int rr = r + dr, gg = g + dg, bb = b + db;
                if (rr < 0 || gg < 0 || bb < 0 || rr > 255 || gg > 255 || bb > 255) continue;
                near[(rr << 16) | (gg << 8) | bb] = true;
            }
        }
        return near;
    }
}
