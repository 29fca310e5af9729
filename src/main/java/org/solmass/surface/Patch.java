package org.solmass.surface;

import org.solmass.model.PolygonTriangulator;
import org.solmass.model.Vec3;

/**
 * One grid patch of an analysed surface: the unit Solmass computes and reports values for.
 *
 * @param index dense 0-based index in the patch set (array index of every per-patch result)
 * @param id stable id across runs of the same model and options, e.g. {@code B3-S12-P0045}
 * @param block block id (index into {@code MassingModel.blockNames()})
 * @param blockName block name
 * @param surface surface id (index into {@code PatchSet.surfaces()})
 * @param kind roof, facade, ground or underside
 * @param centroid area centroid, metres (x east, y north, z up)
 * @param normal unit outward normal
 * @param areaM2 area in square metres
 * @param tiltDeg tilt from horizontal, degrees (0 = faces up, 90 = vertical, 180 = faces down)
 * @param azimuthDeg azimuth of the normal's horizontal part, degrees from north clockwise; 0 for horizontal
 * @param outline the patch polygon as x,y,z triples (metres), counter-clockwise seen from the front,
 *                not closed (last corner is not a repeat of the first)
 */
public record Patch(int index, String id, int block, String blockName, int surface, SurfaceKind kind,
                    Vec3 centroid, Vec3 normal, double areaM2, double tiltDeg, double azimuthDeg,
                    double[] outline) {

    /**
     * The patch's triangles as corner indices into {@link #outline}, three per triangle,
     * counter-clockwise seen from the front: the one triangulation of a patch that the glTF file,
     * the viewer and the PNG map all draw. The outline is projected onto the patch plane (axes u
     * horizontal, or east when the patch is horizontal, and w = normal x u, so the projection keeps
     * the outline counter-clockwise) and ear-clipped by {@link PolygonTriangulator}; a convex outline
     * gives the fan from corner 0.
     */
    public int[] triangles() {
        int m = outline.length / 3;
        double h = Math.hypot(normal.x(), normal.y());
        Vec3 u = h < 1e-9 ? new Vec3(1, 0, 0) : new Vec3(-normal.y() / h, normal.x() / h, 0);
        Vec3 w = normal.cross(u);
        double[] x = new double[m], y = new double[m];
        for (int k = 0; k < m; k++) {
            Vec3 c = new Vec3(outline[3 * k], outline[3 * k + 1], outline[3 * k + 2]);
            x[k] = c.dot(u);
            y[k] = c.dot(w);
        }
        return PolygonTriangulator.triangulate(x, y);
    }
}
