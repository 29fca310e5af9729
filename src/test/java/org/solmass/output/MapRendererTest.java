package org.solmass.output;

import org.junit.jupiter.api.Test;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.*;

class MapRendererTest {
    @Test
    void mapIsAPngOfTheRequestedSizeWhosePlanShowsEveryUpFacingPatchInRampColours() throws Exception {
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
        PlanCount c = PlanCount.of(img, s);
        double expected = c.expectedRampPx();
        // The plan must show every analysed face that looks up (roofs, the courtyard floor) in ramp
        // colours, nothing else (walls are edge-on): see PlanCount for the expectation and its band.
        assertTrue(c.rampPx() >= expected - c.lowSlackPx() && c.rampPx() <= expected + c.highSlackPx(),
                String.format(java.util.Locale.ROOT, "plan: %d ramp pixels, expected %.0f (-%.0f, +%.0f)",
                        c.rampPx(), expected, c.lowSlackPx(), c.highSlackPx()));
    }

    @Test
    void contextBlocksAreNeutralGreyAndAnalysedFacesAreNot() {
        SyntheticScene s = SyntheticScene.district(2.0).gableHouse("House", -30, 45, 16, 9, 6, 10, 25);
        BufferedImage img = MapRenderer.render(s.model(), s.analysedBlocks(), s.patches, s.values(), "Annual irradiation",
                "kWh/m2", MapRenderer.Options.of(1000, 600, "t"));
        PlanCount c = PlanCount.of(img, s);
        // Context roofs (two neighbours, 18 x 40 m and 50 x 14 m) are neutral grey in the plan, less the
        // rim their crease lines and anti-aliasing take (two pixels along their outline); the analysed
        // faces that look up (roofs, courtyard, both slopes of the house) are in ramp colours.
        double greyExpected = (18 * 40 + 50 * 14) * c.pxPerM() * c.pxPerM();
        double greyRim = 2 * (2 * (18 + 40) + 2 * (50 + 14)) * c.pxPerM();
        assertTrue(c.greyPx() >= greyExpected - greyRim, "context grey pixels: " + c.greyPx() + ", expected " + greyExpected);
        assertTrue(c.greyPx() <= greyExpected + greyRim + PlanCount.ARROW_DISC_PX, "grey pixels: " + c.greyPx() + ", expected " + greyExpected);
        double expected = c.expectedRampPx();
        assertTrue(c.rampPx() >= expected - c.lowSlackPx() && c.rampPx() <= expected + c.highSlackPx(),
                "plan ramp pixels " + c.rampPx() + ", expected " + expected);
    }

    /**
     * Counts of the plan's picture ({@link MapRenderer#planTile}) against what geometry says it must
     * hold. The plan is an orthographic view from above that fits the model's bounds into 92 % of the
     * tile's width or 88 % of its height, whichever is tighter (MapScene.draw): {@code pxPerM} pixels
     * per metre. An analysed patch facing up covers its area times n_z (its projection on the ground)
     * times pxPerM^2; nothing in these fixtures overhangs a roof or the courtyard. Where a patch's edge
     * is at least 6 px long the renderer hatches the patch outline, one pixel row and column per patch
     * of e x e pixels, leaving (1 - 1/e)^2 of it in a pure ramp colour. Slack: the outer rim of each
     * surface (crease line, anti-aliasing), up to two pixels along the boundary edges inward and one
     * outward, and the north arrow's disc (radius 38 px) which may cover part of the plan.
     */
    record PlanCount(int rampPx, int greyPx, double pxPerM, double upAreaM2, double keep, double rimPx) {
        static final double ARROW_DISC_PX = Math.PI * 38 * 38;

        static PlanCount of(BufferedImage img, SyntheticScene s) {
            java.awt.Rectangle t = MapRenderer.planTile(img.getWidth(), img.getHeight());
            double[] b = s.model().bounds();
            double pxPerM = Math.min(t.width * 0.92 / (b[3] - b[0]), t.height * 0.88 / (b[4] - b[1]));
            double area = 0, edgeSum = 0;
            java.util.Map<String, Integer> edges = new java.util.HashMap<>();
            java.util.Map<String, Double> edgeLength = new java.util.HashMap<>();
            for (org.solmass.surface.Patch p : s.patches) {
                edgeSum += Math.sqrt(p.areaM2());
                if (p.normal().z() <= 1e-6) continue;
                area += p.areaM2() * p.normal().z();
                double[] o = p.outline();
                int n = o.length / 3;
                for (int i = 0; i < n; i++) {
                    int j = (i + 1) % n;
                    String ka = key(o, i), kb = key(o, j);
                    String k = ka.compareTo(kb) < 0 ? ka + "|" + kb : kb + "|" + ka;
                    edges.merge(k, 1, Integer::sum);
                    edgeLength.put(k, Math.hypot(o[3 * j] - o[3 * i], o[3 * j + 1] - o[3 * i + 1]));
                }
            }
            double boundaryM = 0;
            for (var e : edges.entrySet()) if (e.getValue() == 1) boundaryM += edgeLength.get(e.getKey());
            double edgePx = edgeSum / s.patches.size() * pxPerM;
            double keep = edgePx >= 6 ? (1 - 1 / edgePx) * (1 - 1 / edgePx) : 1;
            boolean[] nearRamp = nearRampLookup(10);
            int ramp = 0, grey = 0;
            for (int y = t.y; y < t.y + t.height; y++) {
                for (int x = t.x; x < t.x + t.width; x++) {
                    int c = img.getRGB(x, y) & 0xFFFFFF;
                    int r = (c >> 16) & 255, g = (c >> 8) & 255, bl = c & 255;
                    if (nearRamp[c]) ramp++;
                    if (r == g && g == bl && r > 100 && r < 235) grey++;
                }
            }
            return new PlanCount(ramp, grey, pxPerM, area, keep, boundaryM * pxPerM);
        }

        double expectedRampPx() { return upAreaM2 * pxPerM * pxPerM * keep; }

        double lowSlackPx() { return 2 * rimPx + ARROW_DISC_PX; }

        double highSlackPx() { return rimPx; }

        private static String key(double[] o, int i) {
            return Math.round(o[3 * i] * 1000) + "," + Math.round(o[3 * i + 1] * 1000) + "," + Math.round(o[3 * i + 2] * 1000);
        }
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
    static boolean[] nearRampLookup(int tol) {
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
