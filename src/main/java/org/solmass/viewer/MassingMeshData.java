package org.solmass.viewer;

import org.solmass.model.MassingModel;

import java.util.ArrayList;
import java.util.List;

/**
 * The arrays of the grey massing: every triangle of the chosen blocks with its own three corners
 * (no shared corners, so each face is lit flat), and the block of each face for picking.
 */
public final class MassingMeshData {
    /** Largest number of triangles in one mesh. */
    public static final int MAX_TRIANGLES = 200_000;

    public final float[] points;
    public final int[] faces;
    /** Block id of each face. */
    public final int[] faceToBlock;

    private MassingMeshData(float[] points, int[] faces, int[] faceToBlock) {
        this.points = points;
        this.faces = faces;
        this.faceToBlock = faceToBlock;
    }

    /** Meshes of the triangles whose block satisfies {@code analysed[block] == wantAnalysed}. */
    public static List<MassingMeshData> build(MassingModel m, SceneFrame frame, boolean[] analysed, boolean wantAnalysed) {
        List<Integer> tris = new ArrayList<>();
        for (int t = 0; t < m.triangleCount(); t++) if (analysed[m.triangleBlock()[t]] == wantAnalysed) tris.add(t);
        List<MassingMeshData> out = new ArrayList<>();
        for (int s = 0; s < tris.size(); s += MAX_TRIANGLES) {
            List<Integer> part = tris.subList(s, Math.min(tris.size(), s + MAX_TRIANGLES));
            float[] pts = new float[part.size() * 9];
            int[] faces = new int[part.size() * 6];
            int[] f2b = new int[part.size()];
            double[] v = m.vertices();
            int[] ix = m.triangles();
            for (int k = 0; k < part.size(); k++) {
                int t = part.get(k);
                for (int c = 0; c < 3; c++) {
                    // corners 0, 2, 1: JavaFX lights the side that is clockwise in its y-down frame
                    int vi = ix[3 * t + (c == 0 ? 0 : 3 - c)] * 3;
                    pts[9 * k + 3 * c] = frame.fx(v[vi]);
                    pts[9 * k + 3 * c + 1] = frame.fy(v[vi + 2]);
                    pts[9 * k + 3 * c + 2] = frame.fz(v[vi + 1]);
                    faces[6 * k + 2 * c] = 3 * k + c;
                    faces[6 * k + 2 * c + 1] = 0;
                }
                f2b[k] = m.triangleBlock()[t];
            }
            out.add(new MassingMeshData(pts, faces, f2b));
        }
        return out;
    }
}
