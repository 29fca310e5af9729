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
    /** Texture coordinates, two per point, for the current colours. */
    public final float[] texCoords;
    /** Faces as p0,t0,p1,t1,p2,t2 (texture index = point index). */
    public final int[] faces;
    /** Patch index (into the study's patch list) of each face. */
    public final int[] faceToPatch;
    private final int[] pointPatch;
    private final float[] localUv;

    private PatchMeshData(float[] points, float[] localUv, int[] pointPatch, int[] faces, int[] faceToPatch) {
        this.points = points;
        this.localUv = localUv;
        this.pointPatch = pointPatch;
        this.faces = faces;
        this.faceToPatch = faceToPatch;
        this.texCoords = new float[localUv.length];
    }

    /** The patch a picked face belongs to, or -1 when the face index is out of range. */
    public int patchOfFace(int face) {
        return face >= 0 && face < faceToPatch.length ? faceToPatch[face] : -1;
    }

    public int faceCount() { return faceToPatch.length; }

    /** Rewrites the texture coordinates so each patch shows palette cell {@code cellOfPatch[patch]}. */
    public void recolour(int[] cellOfPatch) {
        for (int p = 0, n = pointPatch.length; p < n; p++) {
            int c = cellOfPatch[pointPatch[p]];
            texCoords[2 * p] = PaletteAtlas.u(c, localUv[2 * p]);
            texCoords[2 * p + 1] = PaletteAtlas.v(c, localUv[2 * p + 1]);
        }
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
        float[] luv = new float[2 * nPts];
        int[] ptPatch = new int[nPts];
        int[] faces = new int[6 * nFaces];
        int[] f2p = new int[nFaces];
        int pi = 0, fi = 0;
        for (int k = 0; k < group.size(); k++) {
            Patch p = group.get(k);
            double[] o = p.outline();
            Vec3 nrm = p.normal();
            double[][] uv = uvs.get(k);
            int n = uv[0].length, base = pi;
            for (int c = 0; c < n; c++) {
                pts[3 * pi] = frame.fx(o[3 * c] + nrm.x() * liftM);
                pts[3 * pi + 1] = frame.fy(o[3 * c + 2] + nrm.z() * liftM);
                pts[3 * pi + 2] = frame.fz(o[3 * c + 1] + nrm.y() * liftM);
                luv[2 * pi] = (float) uv[0][c];
                luv[2 * pi + 1] = (float) uv[1][c];
                ptPatch[pi] = p.index();
                pi++;
            }
            int[] t = tris.get(k);
            for (int j = 0; j < t.length; j += 3) {
                for (int c = 0; c < 3; c++) {
                    faces[6 * fi + 2 * c] = base + t[j + c];
                    faces[6 * fi + 2 * c + 1] = base + t[j + c];
                }
                f2p[fi++] = p.index();
            }
        }
        return new PatchMeshData(pts, luv, ptPatch, faces, f2p);
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
