package org.solmass.surface;

import org.locationtech.jts.geom.Polygon;
import org.solmass.model.Vec3;

/**
 * A planar surface: the union of edge-connected coplanar triangles of one block.
 *
 * @param id index in {@code PatchSet.surfaces()}
 * @param block block id (index into {@code MassingModel.blockNames()})
 * @param indexInBlock 0-based number of the surface within its block (used in patch ids)
 * @param kind classification, see {@link SurfaceClassifier}
 * @param normal unit front-side normal (area-weighted mean of its triangles' normals)
 * @param areaM2 polygon area, square metres
 * @param planeOffsetM {@code d} in {@code normal . p = d} for points p of the plane, metres
 * @param triangles ids of the model triangles it was built from, ascending
 * @param polygon the surface in its frame's local coordinates (metres), may be concave and have holes;
 *                its envelope starts at local (0, 0)
 * @param frame the surface's 2D frame
 */
public record Surface(int id, int block, int indexInBlock, SurfaceKind kind, Vec3 normal, double areaM2,
                      double planeOffsetM, int[] triangles, Polygon polygon, SurfaceFrame frame) {

    /** Tilt from horizontal, degrees. */
    public double tiltDeg() { return SurfaceClassifier.tiltDeg(normal); }

    /** Azimuth of the normal, degrees from north clockwise; 0 for horizontal. */
    public double azimuthDeg() { return SurfaceClassifier.azimuthDeg(normal); }

    /**
     * Which model triangles belong to GROUND surfaces: the one home of the ground mask that the
     * albedo, the irradiation receivers and the sky-view classification read.
     *
     * @param surfaces surfaces of the model (all blocks)
     * @param triangleCount number of model triangles
     * @return per model triangle, whether a GROUND surface was built from it
     */
    public static boolean[] groundTriangles(java.util.List<Surface> surfaces, int triangleCount) {
        boolean[] g = new boolean[triangleCount];
        for (Surface s : surfaces) if (s.kind() == SurfaceKind.GROUND) for (int t : s.triangles()) g[t] = true;
        return g;
    }

    /** Stable label {@code B<block>-S<indexInBlock>}, the prefix of its patch ids. */
    public String label() { return "B" + block + "-S" + indexInBlock; }
}
