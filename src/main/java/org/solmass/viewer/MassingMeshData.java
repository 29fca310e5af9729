package org.solmass.viewer;

import org.solmass.model.MassingModel;
import org.solmass.model.TriangleGeometry;

import java.util.ArrayList;
import java.util.List;

/**
 * The arrays of the grey massing: every triangle of the chosen blocks with its own three corners,
 * the block of each face for picking, and a flat shade per face baked into its texture coordinate
 * (a fixed light from the south-west, above), so the massing reads in 3D without scene lights and
 * the coloured patches next to it stay exactly the legend's colours.
 */
public final class MassingMeshData {
    /** Largest number of triangles in one mesh. */
    public static final int MAX_TRIANGLES = 200_000;
    /** Shade levels in the grey texture. */
    public static final int LEVELS = 256;
    /** Share of the light that reaches every face whatever its orientation. */
    static final double AMBIENT = 0.64;
    /** Unit direction towards the fixed light in the model frame: azimuth 225 deg, elevation 50 deg. */
    static final double[] LIGHT = {Math.sin(Math.toRadians(225)) * Math.cos(Math.toRadians(50)),
            Math.cos(Math.toRadians(225)) * Math.cos(Math.toRadians(50)), Math.sin(Math.toRadians(50))};

    public final float[] points;
    /** Faces as p0,n0,t0,p1,n1,t1,p2,n2,t2; the corners of a face share its normal and its texture coordinate (its shade). */
    public final int[] faces;
    /** One unit normal per face (scene frame). */
    public final float[] normals;
    /** Block id of each face. */
    public final int[] faceToBlock;
    /** Texture coordinates: one (u, v) per shade level. */
    public static final float[] TEX_COORDS = new float[2 * LEVELS];

    static {
        for (int i = 0; i < LEVELS; i++) {
            TEX_COORDS[2 * i] = (i + 0.5f) / LEVELS;
            TEX_COORDS[2 * i + 1] = 0.5f;
        }
    }

    private MassingMeshData(float[] points, float[] normals, int[] faces, int[] faceToBlock) {
        this.points = points;
        this.normals = normals;
        this.faces = faces;
        this.faceToBlock = faceToBlock;
    }

    /** Brightness factor 0..1 of a face with unit normal (nx, ny, nz), model frame; both sides lit alike. */
    static double shade(double nx, double ny, double nz) {
        double d = Math.abs(nx * LIGHT[0] + ny * LIGHT[1] + nz * LIGHT[2]);
        return AMBIENT + (1 - AMBIENT) * d;
    }

    /** Meshes of the triangles whose block satisfies {@code analysed[block] == wantAnalysed}. */
    public static List<MassingMeshData> build(MassingModel m, SceneFrame frame, boolean[] analysed, boolean wantAnalysed) {
        List<Integer> tris = new ArrayList<>();
        for (int t = 0; t < m.triangleCount(); t++) if (analysed[m.triangleBlock()[t]] == wantAnalysed) tris.add(t);
        List<MassingMeshData> out = new ArrayList<>();
        double[] v = m.vertices();
        int[] ix = m.triangles();
        for (int s = 0; s < tris.size(); s += MAX_TRIANGLES) {
            List<Integer> part = tris.subList(s, Math.min(tris.size(), s + MAX_TRIANGLES));
            float[] pts = new float[part.size() * 9];
            int[] faces = new int[part.size() * 9];
            float[] nrm = new float[part.size() * 3];
            int[] f2b = new int[part.size()];
            double[] cr = new double[3];
            for (int k = 0; k < part.size(); k++) {
                int t = part.get(k);
                TriangleGeometry.cross(v, ix, t, cr);
                double nx = cr[0], ny = cr[1], nz = cr[2];
                double len = TriangleGeometry.length(cr);
                int level = len > 0 ? (int) Math.round(shade(nx / len, ny / len, nz / len) * (LEVELS - 1)) : LEVELS - 1;
                if (len > 0) {
                    nrm[3 * k] = (float) (nx / len);
                    nrm[3 * k + 1] = (float) (-nz / len);
                    nrm[3 * k + 2] = (float) (ny / len);
                } else {
                    nrm[3 * k + 1] = -1;
                }
                for (int q = 0; q < 3; q++) {
                    int vi = ix[3 * t + q] * 3;
                    pts[9 * k + 3 * q] = frame.fx(v[vi]);
                    pts[9 * k + 3 * q + 1] = frame.fy(v[vi + 2]);
                    pts[9 * k + 3 * q + 2] = frame.fz(v[vi + 1]);
                    faces[9 * k + 3 * q] = 3 * k + q;
                    faces[9 * k + 3 * q + 1] = k;
                    faces[9 * k + 3 * q + 2] = level;
                }
                f2b[k] = m.triangleBlock()[t];
            }
            out.add(new MassingMeshData(pts, nrm, faces, f2b));
        }
        return out;
    }

    /** ARGB pixels of the shade texture (LEVELS x 1) for a base colour 0xRRGGBB. */
    public static int[] shadeTexture(int rgb) {
        int[] px = new int[LEVELS];
        for (int i = 0; i < LEVELS; i++) px[i] = 0xFF000000 | PaletteAtlas.darken(rgb, i / (LEVELS - 1.0));
        return px;
    }
}
