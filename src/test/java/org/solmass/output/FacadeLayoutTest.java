package org.solmass.output;

import org.junit.jupiter.api.Test;
import org.solmass.model.LengthUnit;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.model.UpAxis;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;
import org.solmass.surface.SurfaceKind;

import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Facade elevations: every facade patch in exactly one panel, at its true shape and at one scale.
 * Geometry facts only (a patch's area, the box's and the gabled house's sizes); models invented.
 */
class FacadeLayoutTest {
    /** A 12 x 8 x 18 m box (x east, y north). */
    static final String BOX = String.join("\n", "o box",
            "v 0 0 0", "v 12 0 0", "v 12 8 0", "v 0 8 0", "v 0 0 18", "v 12 0 18", "v 12 8 18", "v 0 8 18",
            "f 5 6 7 8", "f 1 2 6 5", "f 2 3 7 6", "f 3 4 8 7", "f 4 1 5 8", "");

    /** A gabled house 10 x 6 m, eaves at 6 m, ridge along x at 9 m: the east and west walls are pentagons. */
    static final String HOUSE = String.join("\n", "o house",
            "v 0 0 0", "v 10 0 0", "v 10 6 0", "v 0 6 0", "v 0 0 6", "v 10 0 6", "v 10 6 6", "v 0 6 6", "v 0 3 9", "v 10 3 9",
            "f 1 2 6 5", "f 3 4 8 7", "f 2 3 7 10 6", "f 4 1 5 9 8", "f 5 6 10 9", "f 7 8 9 10", "");

    private static List<Patch> patches(String obj, double northDeg, double patchM) {
        MassingModel m = ObjReader.parse(obj, "t.obj", new ModelOptions(UpAxis.Z, LengthUnit.M, northDeg)).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(patchM, new LinkedHashSet<>(m.blockNames()), false));
        return ps.patches();
    }

    /** A walk round a box with it on the left from the south: south, east, north, west; sizes of the box. */
    @Test
    void loneBoxUnrollsSouthEastNorthWestAtItsSizes() {
        FacadeLayout l = FacadeLayout.of(patches(BOX, 0, 1));
        List<String> compass = l.panels().stream().map(FacadeLayout.Panel::compass).toList();
        assertEquals(List.of("S", "E", "N", "W"), compass);
        double[] widths = {12, 8, 12, 8};
        for (int i = 0; i < 4; i++) {
            FacadeLayout.Panel p = l.panels().get(i);
            assertEquals(widths[i], p.widthM(), 1e-9, p.compass());
            assertEquals(18, p.heightM(), 1e-9, p.compass());
            assertEquals(widths[i] * 18, p.areaM2(), 1e-9, p.compass());
        }
        assertEquals(0, l.baseW(), 1e-9, "walls stand on z = 0");
    }

    /**
     * Every facade patch of the courtyard sample (rotated 30 deg so no edge lies on the pixel grid) and
     * of a gabled house is in exactly one panel; roofs and other kinds in none.
     */
    @Test
    void everyFacadePatchAppearsExactlyOnce() throws Exception {
        String sample = java.nio.file.Files.readString(Path.of("sample-massing/courtyard-block.obj"));
        for (String obj : new String[] {sample, HOUSE}) {
            List<Patch> all = patches(obj, 30, 1);
            Set<String> facade = new HashSet<>();
            for (Patch p : all) if (p.kind() == SurfaceKind.FACADE) facade.add(p.id());
            List<String> seen = new ArrayList<>();
            for (FacadeLayout.Panel panel : FacadeLayout.of(all).panels()) for (Patch p : panel.patches()) seen.add(p.id());
            assertEquals(seen.size(), new HashSet<>(seen).size(), "no patch twice");
            assertEquals(facade, new HashSet<>(seen), "every facade patch, nothing else");
            assertTrue(facade.size() > 100);
        }
    }

    /**
     * True scale: each patch's outline on the page encloses its area times the scale squared (exact,
     * up to rounding), and rasterised at the page scale it fills that many pixels to within the pixels
     * its boundary crosses: sampling pixel centres, only pixels a boundary edge passes through can be
     * counted wrongly, at most |dx| + |dy| + 2 per edge of lengths dx, dy in pixels (a segment enters a
     * new pixel column or row at each grid line it crosses).
     */
    @Test
    void patchAreaOnThePageOverScaleSquaredIsThePatchArea() throws Exception {
        String sample = java.nio.file.Files.readString(Path.of("sample-massing/courtyard-block.obj"));
        for (String obj : new String[] {sample, HOUSE}) {
            List<Patch> all = patches(obj, 30, 1);
            for (String block : new LinkedHashSet<>(all.stream().map(Patch::blockName).toList())) {
                List<Patch> mine = all.stream().filter(p -> p.blockName().equals(block)).toList();
                FacadeLayout l = FacadeLayout.of(mine);
                if (l.panels().isEmpty()) continue;
                FacadeLayout.Placement pl = FacadeSheet.placement(l, 2000, 1200);
                double s = pl.scalePxPerM();
                assertTrue(s > 1, "a usable scale: " + s);
                for (int i = 0; i < l.panels().size(); i++) {
                    FacadeLayout.Panel panel = l.panels().get(i);
                    double rowH = pl.rowHeightM()[pl.row()[i]];
                    for (int k = 0; k < panel.patches().size(); k++) {
                        Patch p = panel.patches().get(k);
                        double[] uv = panel.uv().get(k);
                        assertEquals(p.areaM2(), FacadeLayout.polygonArea(uv), 1e-9 * Math.max(1, p.areaM2()), p.id());
                        int[] counted = rasterise(uv, p.triangles(), s, rowH);
                        double want = p.areaM2() * s * s;
                        assertTrue(Math.abs(counted[0] - want) <= counted[1], p.id() + ": " + counted[0] + " pixels for "
                                + want + " (bound " + counted[1] + ")");
                    }
                }
            }
        }
    }

    /** Pixels of one patch drawn alone at the page's pixel grid, and the boundary bound. */
    private static int[] rasterise(double[] uv, int[] triangles, double s, double rowH) {
        int m = uv.length / 2;
        double minX = Double.POSITIVE_INFINITY, minY = minX, maxX = Double.NEGATIVE_INFINITY, maxY = maxX, bound = 0;
        for (int c = 0; c < m; c++) {
            double x = uv[2 * c] * s, y = (rowH - uv[2 * c + 1]) * s;
            minX = Math.min(minX, x); maxX = Math.max(maxX, x); minY = Math.min(minY, y); maxY = Math.max(maxY, y);
            int d = (c + 1) % m;
            bound += Math.abs(uv[2 * d] - uv[2 * c]) * s + Math.abs(uv[2 * d + 1] - uv[2 * c + 1]) * s + 2;
        }
        int fx = (int) Math.floor(minX) - 1, fy = (int) Math.floor(minY) - 1;
        int w = (int) Math.ceil(maxX) - fx + 2, h = (int) Math.ceil(maxY) - fy + 2;
        // shift by whole pixels only, so the pixel centres sampled are the page's
        double[] shifted = new double[uv.length];
        for (int c = 0; c < m; c++) {
            shifted[2 * c] = uv[2 * c] - fx / s;
            shifted[2 * c + 1] = uv[2 * c + 1] + fy / s;
        }
        Raster r = new Raster(w, h, 0);
        FacadeSheet.fillPatch(r, shifted, triangles, s, rowH, 1);
        int n = 0;
        for (int v : r.rgb) if (v == 1) n++;
        return new int[] {n, (int) Math.floor(bound)};
    }

    /** The picture: inside each panel of a lone box, the ramp colour of that facade's value. */
    @Test
    void eachPanelShowsItsFacadesValueInTheRampColour() {
        List<Patch> all = patches(BOX, 0, 1);
        double[] v = new double[all.size()];
        for (Patch p : all) v[p.index()] = p.kind() == SurfaceKind.FACADE ? p.azimuthDeg() : Double.NaN;
        FacadeLayout l = FacadeLayout.of(all);
        BufferedImage img = FacadeSheet.render(l, v, new FacadeSheet.Options(2000, 1200, "box (invented)", "box",
                "Test value", "", "", 0, 360, false, ""));
        FacadeLayout.Placement pl = FacadeSheet.placement(l, 2000, 1200);
        for (int i = 0; i < 4; i++) {
            FacadeLayout.Panel p = l.panels().get(i);
            // the centre of a patch near the panel's middle, away from the faint patch edges
            double u = Math.floor(p.widthM() / 2) + 0.5, w = Math.floor(p.heightM() / 2) + 0.5;
            int x = FacadeSheet.MARGIN + (int) Math.floor(pl.px(i, u)), y = FacadeSheet.TITLE_H + (int) Math.floor(pl.py(i, w));
            int want = ColourRamp.sequential(ColourRamp.normalise(p.azimuthDeg(), 0, 360));
            int got = img.getRGB(x, y) & 0xFFFFFF;
            for (int sh = 16; sh >= 0; sh -= 8) {
                assertEquals((want >> sh) & 255, (got >> sh) & 255, 2.0, p.compass() + " channel " + sh);
            }
        }
    }
}
