package org.solmass.viewer;

import org.solmass.model.Vec3;
import org.solmass.surface.Patch;

import java.util.ArrayList;
import java.util.List;

/**
 * The arrays of one patch mesh (one block, or a slice of a large block): scene-frame points, faces
 * with per-corner texture coordinates, and the lookup from a mesh face to the patch it belongs to.
 * Built without the FX toolkit so picking and recolouring can be tested on their own.
 */
public final class PatchMeshData {
    /** Largest number of patches in one mesh; bigger blocks are split. */
    public static final int MAX_PATCHES = 50_000;

    public final float[] points;
    /** Texture coordinates, two per point, into this mesh's {@link #atlas} (fixed). */
    public final float[] texCoords;
    /** Texel layout: one cell per patch of this mesh, in mesh order. */
    public final PaletteAtlas atlas;
    /** Patch index (into the study's patch list) of each patch of this mesh, in mesh order. */
    public final int[] patches;
    /** One unit normal per patch of the mesh (scene frame), so JavaFX need not derive them. */
    public final float[] normals;
    /** Faces as p0,n0,t0,p1,n1,t1,p2,n2,t2 (texture index = point index, normal index = patch in mesh). */
    public final int[] faces;
    /** Ints per face in {@link #faces}. */
    public static final int FACE_STRIDE = 9;
    /** Patch index (into the study's patch list) of each face. */
    public final int[] faceToPatch;

    private PatchMeshData(float[] points, float[] normals, float[] texCoords, int[] faces, int[] faceToPatch,
                          PaletteAtlas atlas, int[] patches) {
        this.points = points;
        this.normals = normals;
        this.texCoords = texCoords;
        this.faces = faces;
        this.faceToPatch = faceToPatch;
        this.atlas = atlas;
        this.patches = patches;
    }

    /** The patch a picked face belongs to, or -1 when the face index is out of range. */
    public int patchOfFace(int face) {
        return face >= 0 && face < faceToPatch.length ? faceToPatch[face] : -1;
    }

    public int faceCount() { return faceToPatch.length; }

    /**
     * Texels of this mesh's atlas for colours per study patch.
     *
     * @param rgbOfPatch 0xRRGGBB per study patch index
     * @param out ARGB texels, {@code atlas.width * atlas.height} long
     */
    public void texels(int[] rgbOfPatch, int[] out) {
        int[] rgb = new int[patches.length];
        for (int i = 0; i < patches.length; i++) rgb[i] = rgbOfPatch[patches[i]];
        atlas.fill(rgb, out);
    }

    /**
     * Meshes for the patches, grouped by block and split at {@link #MAX_PATCHES}.
     *
     * @param liftM offset of the patches along their normal, metres, so they sit in front of the
     *              grey massing drawn under them
     */
    public static List<PatchMeshData> build(List<Patch> patches, SceneFrame frame, double liftM) {
        List<List<Patch>> groups = new ArrayList<>();
        java.util.Map<Integer, List<Patch>> byBlock = new java.util.TreeMap<>();
        for (Patch p : patches) byBlock.computeIfAbsent(p.block(), k -> new ArrayList<>()).add(p);
        for (List<Patch> g : byBlock.values()) {
            for (int i = 0; i < g.size(); i += MAX_PATCHES) groups.add(g.subList(i, Math.min(g.size(), i + MAX_PATCHES)));
        }
        List<PatchMeshData> out = new ArrayList<>();
        for (List<Patch> g : groups) out.add(of(g, frame, liftM));
        return out;
    }

    static PatchMeshData of(List<Patch> group, SceneFrame frame, double liftM) {
        int nPts = 0, nFaces = 0;
        List<int[]> tris = new ArrayList<>(group.size());
        List<double[][]> uvs = new ArrayList<>(group.size());
        for (Patch p : group) {
            double[][] uv = localCoordinates(p);
            int[] t = Triangulator.triangulate(uv[0], uv[1]);
            tris.add(t);
            uvs.add(uv);
            nPts += uv[0].length;
            nFaces += t.length / 3;
        }
        float[] pts = new float[3 * nPts];
        float[] tex = new float[2 * nPts];
        PaletteAtlas atlas = new PaletteAtlas(group.size());
        int[] ids = new int[group.size()];
        int[] faces = new int[FACE_STRIDE * nFaces];
        float[] nrms = new float[3 * group.size()];
        int[] f2p = new int[nFaces];
        int pi = 0, fi = 0;
        for (int k = 0; k < group.size(); k++) {
            Patch p = group.get(k);
            double[] o = p.outline();
            Vec3 nrm = p.normal();
            double[][] uv = uvs.get(k);
            int n = uv[0].length, base = pi;
            ids[k] = p.index();
            nrms[3 * k] = (float) nrm.x();
            nrms[3 * k + 1] = (float) -nrm.z();
            nrms[3 * k + 2] = (float) nrm.y();
            for (int c = 0; c < n; c++) {
                pts[3 * pi] = frame.fx(o[3 * c] + nrm.x() * liftM);
                pts[3 * pi + 1] = frame.fy(o[3 * c + 2] + nrm.z() * liftM);
                pts[3 * pi + 2] = frame.fz(o[3 * c + 1] + nrm.y() * liftM);
                tex[2 * pi] = atlas.u(k, (float) uv[0][c]);
                tex[2 * pi + 1] = atlas.v(k, (float) uv[1][c]);
                pi++;
            }
            int[] t = tris.get(k);
            for (int j = 0; j < t.length; j += 3) {
                for (int c = 0; c < 3; c++) {
                    faces[FACE_STRIDE * fi + 3 * c] = base + t[j + c];
                    faces[FACE_STRIDE * fi + 3 * c + 1] = k;
                    faces[FACE_STRIDE * fi + 3 * c + 2] = base + t[j + c];
                }
                f2p[fi++] = p.index();
            }
        }
        return new PatchMeshData(pts, nrms, tex, faces, f2p, atlas, ids);
    }

    /**
     * Corner coordinates in the patch's plane scaled to 0..1 over its bounding rectangle, with the
     * first edge as the u axis (grid patches are rectangles, so their edges map to the cell border).
     * Returns {u[], v[]}.
     */
    static double[][] localCoordinates(Patch p) {
        double[] o = p.outline();
        int n = o.length / 3;
        Vec3 c0 = new Vec3(o[0], o[1], o[2]);
        Vec3 ax = null;
        for (int i = 1; i < n && ax == null; i++) {
            Vec3 e = new Vec3(o[3 * i], o[3 * i + 1], o[3 * i + 2]).minus(c0);
            if (e.length() > 1e-9) ax = e.normalized();
        }
        if (ax == null) ax = new Vec3(1, 0, 0);
        Vec3 ay = p.normal().cross(ax).normalized();
        double[] u = new double[n], v = new double[n];
        double u0 = Double.POSITIVE_INFINITY, u1 = Double.NEGATIVE_INFINITY, v0 = u0, v1 = u1;
        for (int i = 0; i < n; i++) {
            Vec3 d = new Vec3(o[3 * i], o[3 * i + 1], o[3 * i + 2]).minus(c0);
            u[i] = d.dot(ax);
            v[i] = d.dot(ay);
            u0 = Math.min(u0, u[i]);
            u1 = Math.max(u1, u[i]);
            v0 = Math.min(v0, v[i]);
            v1 = Math.max(v1, v[i]);
        }
        double du = u1 - u0 > 0 ? u1 - u0 : 1, dv = v1 - v0 > 0 ? v1 - v0 : 1;
        for (int i = 0; i < n; i++) {
            u[i] = (u[i] - u0) / du;
            v[i] = (v[i] - v0) / dv;
        }
        return new double[][] {u, v};
    }
}
