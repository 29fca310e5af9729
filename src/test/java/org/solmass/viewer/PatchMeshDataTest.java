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
    void aPickAnywhereOnAFaceFindsThePatchUnderIt() {
        // property over random points of every face: the patch found from (face, texture coordinate)
        // contains the picked point (within 6 cm: the 5 cm lift plus rounding) and lies on its plane
        java.util.Random rnd = new java.util.Random(11);
        int covered = 0;
        for (PatchMeshData m : meshes) {
            for (int f = 0; f < m.faceCount(); f++) {
                covered += m.patchesOfFace(f);
                for (int s = 0; s < 4; s++) {
                    double r1 = rnd.nextDouble(), r2 = rnd.nextDouble();
                    if (r1 + r2 > 1) { r1 = 1 - r1; r2 = 1 - r2; }
                    double[] w = {1 - r1 - r2, r1, r2};
                    Vec3 pos = Vec3.ZERO;
                    double u = 0, v = 0;
                    for (int k = 0; k < 3; k++) {
                        int pt = m.faces[PatchMeshData.FACE_STRIDE * f + 3 * k], tx = m.faces[PatchMeshData.FACE_STRIDE * f + 3 * k + 2];
                        pos = pos.plus(model(m.points, pt).times(w[k]));
                        u += w[k] * m.texCoords[2 * tx];
                        v += w[k] * m.texCoords[2 * tx + 1];
                    }
                    Patch p = data.patches().get(m.patchAt(f, u, v));
                    assertEquals(0.05, pos.minus(p.centroid()).dot(p.normal()), 1e-4, "pick off the patch plane");
                    double[] o = p.outline();
                    for (int ax = 0; ax < 3; ax++) {
                        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
                        for (int i = ax; i < o.length; i += 3) {
                            lo = Math.min(lo, o[i]);
                            hi = Math.max(hi, o[i]);
                        }
                        double x = ax == 0 ? pos.x() : ax == 1 ? pos.y() : pos.z();
                        assertTrue(x >= lo - 0.06 && x <= hi + 0.06, "pick outside patch " + p.id());
                    }
                }
            }
        }
        assertEquals(2 * data.patches().size(), covered, "every patch is under two triangles");
    }

    @Test
    void rowsOfEqualPatchesShareQuadsAndPartialPatchesStandAlone() {
        int faces = 0, single = 0;
        for (PatchMeshData m : meshes) {
            faces += m.faceCount();
            for (int f = 0; f < m.faceCount(); f++) if (m.patchesOfFace(f) == 1) single++;
        }
        assertTrue(faces < data.patches().size() / 2, "strips merge rows: " + faces + " faces");
        assertTrue(single > 0, "the narrower last patch of a row stays on its own");
    }

    @Test
    void trianglesCoverTheTotalPatchArea() {
        double tri = 0, patches = 0;
        for (PatchMeshData m : meshes) {
            for (int f = 0; f < m.faceCount(); f++) {
                Vec3 a = model(m.points, m.faces[9 * f]), b = model(m.points, m.faces[9 * f + 3]), c = model(m.points, m.faces[9 * f + 6]);
                tri += 0.5 * b.minus(a).cross(c.minus(a)).length();
            }
        }
        for (Patch p : data.patches()) patches += p.areaM2();
        assertEquals(patches, tri, 1e-6 * patches);
    }

    @Test
    void outOfRangeFacePicksNothing() {
        assertEquals(-1, meshes.get(0).patchOfFace(-1));
        assertEquals(-1, meshes.get(0).patchOfFace(meshes.get(0).faceCount()));
    }

    @Test
    void everyCornerOfAStandAlonePatchSamplesItsOwnTexelCell() {
        for (PatchMeshData m : meshes) {
            for (int f = 0; f < m.faceCount(); f++) {
                if (m.patchesOfFace(f) != 1) continue;
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
            int x0 = (c % m.atlas.cols) * atlasCell(m), y0 = (c / m.atlas.cols) * atlasCell(m);
            int mid = px[(y0 + atlasCell(m) / 2) * m.atlas.width + x0 + atlasCell(m) / 2] & 0xFFFFFF;
            int edge = px[y0 * m.atlas.width + x0 + 2] & 0xFFFFFF;
            assertEquals(rgb[m.patches[c]], mid);
            assertEquals(PaletteAtlas.darken(rgb[m.patches[c]], PaletteAtlas.OUTLINE), edge);
        }
    }

    private static int atlasCell(PatchMeshData m) { return m.atlas.cell; }

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
            assertTrue(m.patches.length <= PatchMeshData.MAX_PATCHES);
            for (int f = 0; f < m.faceCount(); f++) patches += m.patchesOfFace(f);
        }
        assertEquals(2 * big.patches().size(), patches);
        assertTrue(ms.size() > 4, "more meshes than blocks when a block exceeds the limit");
    }
}
