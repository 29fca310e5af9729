package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PatchMeshDataTest {
    private final ViewerData data = SyntheticViewerData.build(1.3, false);   // 1.3 m leaves partial patches at the face ends
    private final SceneFrame frame = SceneFrame.of(data.model().bounds());
    private final List<PatchMeshData> meshes = PatchMeshData.build(data.patches(), frame, 0.05);

    /** Model point of scene point i of a mesh (inverse of SceneFrame). */
    private Vec3 model(float[] p, int i) {
        return new Vec3(p[3 * i] + frame.cx(), p[3 * i + 2] + frame.cy(), -p[3 * i + 1] + frame.cz());
    }

    @Test
    void everyFaceMapsBackToThePatchItWasCutFrom() {
        // a face's centroid lies on its patch's plane (lifted by 5 cm) and inside the patch's bounds
        int faces = 0;
        for (PatchMeshData m : meshes) {
            for (int f = 0; f < m.faceCount(); f++) {
                Patch p = data.patches().get(m.patchOfFace(f));
                Vec3 c = Vec3.ZERO;
                for (int k = 0; k < 3; k++) c = c.plus(model(m.points, m.faces[PatchMeshData.FACE_STRIDE * f + 3 * k]).times(1 / 3.0));
                assertEquals(0.05, c.minus(p.centroid()).dot(p.normal()), 1e-4, "face " + f + " off its patch plane");
                double[] o = p.outline();
                for (int ax = 0; ax < 3; ax++) {
                    double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
                    for (int i = ax; i < o.length; i += 3) {
                        lo = Math.min(lo, o[i]);
                        hi = Math.max(hi, o[i]);
                    }
                    double v = ax == 0 ? c.x() : ax == 1 ? c.y() : c.z();
                    assertTrue(v >= lo - 0.06 && v <= hi + 0.06, "face " + f + " outside patch " + p.id());
                }
                faces++;
            }
        }
        assertEquals(2 * data.patches().size(), faces, "two triangles per rectangular patch");
    }

    @Test
    void trianglesOfEachPatchAddUpToItsArea() {
        double[] area = new double[data.patches().size()];
        for (PatchMeshData m : meshes) {
            for (int f = 0; f < m.faceCount(); f++) {
                Vec3 a = model(m.points, m.faces[9 * f]), b = model(m.points, m.faces[9 * f + 3]), c = model(m.points, m.faces[9 * f + 6]);
                area[m.patchOfFace(f)] += 0.5 * b.minus(a).cross(c.minus(a)).length();
            }
        }
        for (Patch p : data.patches()) assertEquals(p.areaM2(), area[p.index()], 1e-4 * Math.max(1, p.areaM2()), p.id());
    }

    @Test
    void outOfRangeFacePicksNothing() {
        assertEquals(-1, meshes.get(0).patchOfFace(-1));
        assertEquals(-1, meshes.get(0).patchOfFace(meshes.get(0).faceCount()));
    }

    @Test
    void everyCornerSamplesItsOwnPatchesTexelCell() {
        for (PatchMeshData m : meshes) {
            for (int f = 0; f < m.faceCount(); f++) {
                for (int k = 0; k < 3; k++) {
                    int t = m.faces[PatchMeshData.FACE_STRIDE * f + 3 * k + 2];
                    int cell = m.atlas.cellAt(m.texCoords[2 * t], m.texCoords[2 * t + 1]);
                    assertEquals(m.patchOfFace(f), m.patches[cell]);
                }
            }
        }
    }

    @Test
    void texelsShowEachPatchesColourInsideADarkerBorder() {
        int[] rgb = new int[data.patches().size()];
        for (int i = 0; i < rgb.length; i++) rgb[i] = ColourRampColours.of(i);
        PatchMeshData m = meshes.get(1);
        int[] px = new int[m.atlas.width * m.atlas.height];
        m.texels(rgb, px);
        for (int c = 0; c < m.patches.length; c++) {
            int x0 = (c % m.atlas.cols) * PaletteAtlas.CELL, y0 = (c / m.atlas.cols) * PaletteAtlas.CELL;
            int mid = px[(y0 + PaletteAtlas.CELL / 2) * m.atlas.width + x0 + PaletteAtlas.CELL / 2] & 0xFFFFFF;
            int edge = px[y0 * m.atlas.width + x0 + 2] & 0xFFFFFF;
            assertEquals(rgb[m.patches[c]], mid);
            assertEquals(PaletteAtlas.darken(rgb[m.patches[c]], PaletteAtlas.OUTLINE), edge);
        }
    }

    /** Distinct test colours from the pipeline ramp. */
    static final class ColourRampColours {
        static int of(int i) { return org.solmass.output.ColourRamp.sequential((i % 97) / 96.0); }
    }

    @Test
    void largeBlocksAreSplitIntoSeveralMeshes() {
        ViewerData big = SyntheticViewerData.withAbout(150_000, false);
        List<PatchMeshData> ms = PatchMeshData.build(big.patches(), SceneFrame.of(big.model().bounds()), 0.05);
        int patches = 0;
        for (PatchMeshData m : ms) {
            assertTrue(m.faceCount() <= 2 * PatchMeshData.MAX_PATCHES);
            patches += m.faceCount() / 2;
        }
        assertEquals(big.patches().size(), patches);
        assertTrue(ms.size() > 4, "more meshes than blocks when a block exceeds the limit");
    }
}
