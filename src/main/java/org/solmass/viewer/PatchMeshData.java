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
    /** Patch index (into the study's patch list) of each face; for a face over a strip, its first patch. */
    public final int[] faceToPatch;
    /** First texel cell (patch of this mesh) and number of cells each face spans. */
    private final int[] faceFirstCell, faceCells;

    private PatchMeshData(float[] points, float[] normals, float[] texCoords, int[] faces, int[] faceToPatch,
                          int[] faceFirstCell, int[] faceCells, PaletteAtlas atlas, int[] patches) {
        this.faceFirstCell = faceFirstCell;
        this.faceCells = faceCells;
        this.points = points;
        this.normals = normals;
        this.texCoords = texCoords;
        this.faces = faces;
        this.faceToPatch = faceToPatch;
        this.atlas = atlas;
        this.patches = patches;
    }

    /** The (first) patch a picked face belongs to, or -1 when the face index is out of range. */
    public int patchOfFace(int face) {
        return face >= 0 && face < faceToPatch.length ? faceToPatch[face] : -1;
    }

    /**
     * The patch under a pick: the face, then the texel cell at the picked texture coordinate,
     * kept within the cells the face spans; -1 when the face index is out of range.
     */
    public int patchAt(int face, double u, double v) {
        if (face < 0 || face >= faceToPatch.length) return -1;
        int first = faceFirstCell[face], n = faceCells[face];
        if (n == 1 || !Double.isFinite(u) || !Double.isFinite(v)) return patches[first];
        int cell = atlas.cellAt((float) u, (float) v);
        return patches[Math.max(first, Math.min(first + n - 1, cell))];
    }

    /** Number of patches face f covers (1, or the length of its strip). */
    public int patchesOfFace(int f) { return faceCells[f]; }

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
        PaletteAtlas atlas = new PaletteAtlas(group.size());
        List<int[]> strips = strips(group, atlas.cols);
        int nPts = 0, nFaces = 0;
        List<int[]> tris = new ArrayList<>();
        List<double[][]> uvs = new ArrayList<>();
        for (int[] st : strips) {
            if (st[1] > 1) {
                nPts += 4;
                nFaces += 2;
                tris.add(null);
                uvs.add(null);
            } else {
                Patch p = group.get(st[0]);
                double[][] uv = localCoordinates(p);
                int[] t = p.triangles();
                tris.add(t);
                uvs.add(uv);
                nPts += uv[0].length;
                nFaces += t.length / 3;
            }
        }
        float[] pts = new float[3 * nPts];
        float[] tex = new float[2 * nPts];
        int[] ids = new int[group.size()];
        int[] faces = new int[FACE_STRIDE * nFaces];
        float[] nrms = new float[3 * group.size()];
        int[] f2p = new int[nFaces], fFirst = new int[nFaces], fCount = new int[nFaces];
        for (int k = 0; k < group.size(); k++) {
            Patch p = group.get(k);
            ids[k] = p.index();
            nrms[3 * k] = (float) p.normal().x();
            nrms[3 * k + 1] = (float) -p.normal().z();
            nrms[3 * k + 2] = (float) p.normal().y();
        }
        int pi = 0, fi = 0;
        for (int si = 0; si < strips.size(); si++) {
            int k0 = strips.get(si)[0], count = strips.get(si)[1];
            Patch first = group.get(k0), last = group.get(k0 + count - 1);
            Vec3 nrm = first.normal();
            int base = pi;
            int[] t;
            if (count > 1) {
                // one quad over the strip; its texture spans the strip's consecutive cells
                double[][] corners = {corner(first, 0), corner(last, 1), corner(last, 2), corner(first, 3)};
                int col = k0 % atlas.cols, row = k0 / atlas.cols;
                float u0 = (float) col * atlas.cell / atlas.width, u1 = (float) (col + count) * atlas.cell / atlas.width;
                float v0 = (float) row * atlas.cell / atlas.height, v1 = (float) (row + 1) * atlas.cell / atlas.height;
                float[][] uv = {{u0, v0}, {u1, v0}, {u1, v1}, {u0, v1}};
                for (int c = 0; c < 4; c++) {
                    putPoint(pts, pi, corners[c], nrm, liftM, frame);
                    tex[2 * pi] = uv[c][0];
                    tex[2 * pi + 1] = uv[c][1];
                    pi++;
                }
                t = new int[] {0, 1, 2, 0, 2, 3};
            } else {
                double[][] uv = uvs.get(si);
                double[] o = first.outline();
                for (int c = 0; c < uv[0].length; c++) {
                    putPoint(pts, pi, new double[] {o[3 * c], o[3 * c + 1], o[3 * c + 2]}, nrm, liftM, frame);
                    tex[2 * pi] = atlas.u(k0, (float) uv[0][c]);
                    tex[2 * pi + 1] = atlas.v(k0, (float) uv[1][c]);
                    pi++;
                }
                t = tris.get(si);
            }
            for (int j = 0; j < t.length; j += 3) {
                for (int c = 0; c < 3; c++) {
                    faces[FACE_STRIDE * fi + 3 * c] = base + t[j + c];
                    faces[FACE_STRIDE * fi + 3 * c + 1] = k0;
                    faces[FACE_STRIDE * fi + 3 * c + 2] = base + t[j + c];
                }
                f2p[fi] = first.index();
                fFirst[fi] = k0;
                fCount[fi] = count;
                fi++;
            }
        }
        return new PatchMeshData(pts, nrms, tex, faces, f2p, fFirst, fCount, atlas, ids);
    }

    private static double[] corner(Patch p, int c) {
        double[] o = p.outline();
        return new double[] {o[3 * c], o[3 * c + 1], o[3 * c + 2]};
    }

    private static void putPoint(float[] pts, int i, double[] c, Vec3 n, double lift, SceneFrame f) {
        pts[3 * i] = f.fx(c[0] + n.x() * lift);
        pts[3 * i + 1] = f.fy(c[2] + n.z() * lift);
        pts[3 * i + 2] = f.fz(c[1] + n.y() * lift);
    }

    /**
     * Runs of consecutive patches that can share one quad: rectangles of the same surface, each
     * starting at the previous one's far edge (its corners 0 and 3 are the previous corners 1 and 2)
     * with the same width, all within one row of texel cells. Returns {first, count} per run; a
     * patch that joins no run is a run of one.
     */
    static List<int[]> strips(List<Patch> group, int cols) {
        List<int[]> out = new ArrayList<>();
        int k = 0, n = group.size();
        while (k < n) {
            int e = k;
            if (isRectangle(group.get(k))) {
                while (e + 1 < n && (e + 1) % cols != 0 && follows(group.get(e), group.get(e + 1))) e++;
            }
            out.add(new int[] {k, e - k + 1});
            k = e + 1;
        }
        return out;
    }

    private static boolean isRectangle(Patch p) {
        double[] o = p.outline();
        if (o.length != 12) return false;
        double tol = 1e-6 * Math.max(1, Math.sqrt(p.areaM2()));
        double ux = o[3] - o[0], uy = o[4] - o[1], uz = o[5] - o[2], vx = o[9] - o[0], vy = o[10] - o[1], vz = o[11] - o[2];
        double lu = Math.sqrt(ux * ux + uy * uy + uz * uz), lv = Math.sqrt(vx * vx + vy * vy + vz * vz);
        if (lu < tol || lv < tol || Math.abs(ux * vx + uy * vy + uz * vz) > tol * (lu + lv)) return false;
        return Math.abs(o[6] - (o[3] + vx)) < tol && Math.abs(o[7] - (o[4] + vy)) < tol && Math.abs(o[8] - (o[5] + vz)) < tol;
    }

    private static boolean follows(Patch a, Patch b) {
        if (a.surface() != b.surface() || a.block() != b.block() || !isRectangle(b)) return false;
        double[] p = a.outline(), q = b.outline();
        double tol = 1e-6 * Math.max(1, Math.sqrt(a.areaM2()));
        for (int i = 0; i < 3; i++) {
            if (Math.abs(q[i] - p[3 + i]) > tol || Math.abs(q[9 + i] - p[6 + i]) > tol) return false;
            // same width: b's far edge is as far from its near edge as a's
            if (Math.abs((q[3 + i] - q[i]) - (p[3 + i] - p[i])) > tol) return false;
        }
        return true;
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
