package org.solmass.model;

import java.nio.file.Path;
import java.util.List;

/**
 * A massing model as Solmass uses it after import: named blocks of triangles in metres, x east,
 * y north, z up (units, up axis and north angle already applied). Flat arrays so the scene stage can
 * build its BVH without copying objects.
 *
 * @param source the OBJ file it was read from (for messages), may be null for synthetic models
 * @param blockNames block names (from {@code o}/{@code g}), index = block id
 * @param materialNames material names from {@code usemtl}, index = material id
 * @param vertices x,y,z per vertex, metres
 * @param triangles three vertex indices per triangle, counter-clockwise seen from the front side
 *                  (the OBJ winding is kept: its normal is the face normal)
 * @param triangleBlock block id per triangle
 * @param triangleMaterial material id per triangle, -1 where none was set
 * @param triangleLine OBJ line number of the face each triangle came from (1-based), 0 if synthetic
 * @param degenerateDropped number of zero-area triangles dropped on import
 * @param triangleKind what the file declares each triangle to be ({@link SemanticKind#code()}), or null
 *                     when it declares nothing (OBJ): then every triangle is {@link SemanticKind#NONE}
 */
public record MassingModel(Path source, List<String> blockNames, List<String> materialNames,
                           double[] vertices, int[] triangles, int[] triangleBlock,
                           int[] triangleMaterial, int[] triangleLine, int degenerateDropped, byte[] triangleKind) {

    /** A model whose file declares no kind of face (OBJ). */
    public MassingModel(Path source, List<String> blockNames, List<String> materialNames,
                        double[] vertices, int[] triangles, int[] triangleBlock,
                        int[] triangleMaterial, int[] triangleLine, int degenerateDropped) {
        this(source, blockNames, materialNames, vertices, triangles, triangleBlock, triangleMaterial, triangleLine,
                degenerateDropped, null);
    }

    /** What the file declares triangle {@code t} to be; {@link SemanticKind#NONE} when it declares nothing. */
    public SemanticKind semanticKind(int t) {
        return triangleKind == null ? SemanticKind.NONE : SemanticKind.of(triangleKind[t]);
    }

    public int triangleCount() { return triangles.length / 3; }

    public int vertexCount() { return vertices.length / 3; }

    /** Vertex {@code v} of triangle {@code t} (v in 0..2). */
    public Vec3 vertex(int t, int v) {
        int i = triangles[3 * t + v] * 3;
        return new Vec3(vertices[i], vertices[i + 1], vertices[i + 2]);
    }

    /**
     * Lowest z of the vertices the triangles use, metres (a vertex no face uses does not count: it
     * must not sink the ground level).
     */
    public double minZ() {
        double m = Double.POSITIVE_INFINITY;
        for (int i : triangles) m = Math.min(m, vertices[3 * i + 2]);
        return m;
    }

    /**
     * Axis-aligned bounds of the vertices the triangles use: {minX, minY, minZ, maxX, maxY, maxZ}.
     * Tolerances (weld, plane), the ground level and the plausibility checks scale with these, so a
     * stray vertex that no face uses changes none of them.
     */
    public double[] bounds() {
        double[] b = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (int t : triangles) {
            int i = 3 * t;
            for (int k = 0; k < 3; k++) {
                b[k] = Math.min(b[k], vertices[i + k]);
                b[k + 3] = Math.max(b[k + 3], vertices[i + k]);
            }
        }
        return b;
    }

    /** Which vertices at least one triangle uses, index = vertex id. */
    public boolean[] usedVertices() {
        boolean[] used = new boolean[vertexCount()];
        for (int t : triangles) used[t] = true;
        return used;
    }

    /**
     * The model with only the triangles {@code keep} marks: same blocks, materials and vertices (block
     * and material ids keep their meaning; a block may be left without triangles); triangle order,
     * blocks, materials and OBJ lines kept.
     */
    public MassingModel subset(boolean[] keep) {
        int n = 0;
        for (int t = 0; t < triangleCount(); t++) if (keep[t]) n++;
        int[] tr = new int[3 * n], bl = new int[n], ma = new int[n], li = new int[n];
        int j = 0;
        for (int t = 0; t < triangleCount(); t++) {
            if (!keep[t]) continue;
            System.arraycopy(triangles, 3 * t, tr, 3 * j, 3);
            bl[j] = triangleBlock[t];
            ma[j] = triangleMaterial[t];
            li[j] = triangleLine[t];
            j++;
        }
        return new MassingModel(source, blockNames, materialNames, vertices, tr, bl, ma, li, degenerateDropped);
    }

    /** Flat x,y,z of the 3 corners of every triangle (9 floats per triangle), for the scene stage. */
    public float[] triangleSoup() {
        float[] out = new float[triangles.length * 3];
        for (int i = 0; i < triangles.length; i++) {
            int v = triangles[i] * 3;
            out[3 * i] = (float) vertices[v];
            out[3 * i + 1] = (float) vertices[v + 1];
            out[3 * i + 2] = (float) vertices[v + 2];
        }
        return out;
    }
}
