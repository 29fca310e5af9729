package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The map's optional overlay outlines and diverging colouring. */
class MapExtrasTest {
    private static int count(BufferedImage img, int rgb, int tol) {
        int n = 0;
        for (int y = 0; y < img.getHeight(); y++) for (int x = 0; x < img.getWidth(); x++) {
            int c = img.getRGB(x, y) & 0xFFFFFF;
            if (Math.abs(((c >> 16) & 255) - ((rgb >> 16) & 255)) <= tol && Math.abs(((c >> 8) & 255) - ((rgb >> 8) & 255)) <= tol
                    && Math.abs((c & 255) - (rgb & 255)) <= tol) n++;
        }
        return n;
    }

    @Test
    void outlinesAreDrawnOnlyWhenGiven() {
        System.setProperty("java.awt.headless", "true");
        SyntheticScene s = SyntheticScene.district(2.0);
        List<double[]> rings = new ArrayList<>();
        for (Patch p : s.patches) if (p.kind() == SurfaceKind.ROOF && rings.size() < 20) rings.add(p.outline());
        MapRenderer.Options o = MapRenderer.Options.of(900, 500, "t");
        BufferedImage plain = MapRenderer.render(s.model(), s.analysedBlocks(), s.patches, s.values(), "q", "kWh/m2", o);
        BufferedImage with = MapRenderer.render(s.model(), s.analysedBlocks(), s.patches, s.values(), "q", "kWh/m2", o,
                new MapRenderer.Extras(false, rings, "zone"));
        int a = count(plain, MapRenderer.OUTLINE, 12), b = count(with, MapRenderer.OUTLINE, 12);
        assertTrue(b > a + 200, a + " -> " + b);
    }

    /** A difference of exactly zero everywhere takes the diverging ramp's neutral colour; the range is symmetric. */
    @Test
    void divergingMapIsNeutralAtZeroWithASymmetricRange() {
        assertArrayEquals(new double[] {-3, 3}, MapRenderer.symmetricRange(new double[] {-1, 2, -3, Double.NaN}));
        assertArrayEquals(new double[] {-1, 1}, MapRenderer.symmetricRange(new double[] {0, 0}));
        SyntheticScene s = SyntheticScene.district(2.0);
        double[] zero = new double[s.patches.size()];
        MapRenderer.Options o = MapRenderer.Options.of(900, 500, "t");
        BufferedImage img = MapRenderer.render(s.model(), s.analysedBlocks(), s.patches, zero, "d", "kWh/m2", o,
                new MapRenderer.Extras(true, List.of(), ""));
        int neutral = ColourRamp.diverging(0);
        assertTrue(count(img, neutral, 3) > 5000);
        assertEquals(0, count(img, ColourRamp.diverging(0.8), 2) > 2000 ? 1 : 0);
    }
}
