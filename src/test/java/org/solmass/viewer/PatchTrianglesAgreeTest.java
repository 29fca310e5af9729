package org.solmass.viewer;

import com.fasterxml.jackson.databind.JsonNode;
import org.junit.jupiter.api.Test;
import org.solmass.model.TriangleGeometry;
import org.solmass.model.Vec3;
import org.solmass.output.GltfWriter;
import org.solmass.table.ResultTable;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Base64;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A patch is triangulated in one place ({@link Patch#triangles()}): the glTF file and the viewer mesh
 * of the same patch hold the same triangles, and those triangles cover exactly the outline. Random
 * outlines (invented): convex polygons with corners on an ellipse, L shapes and U shapes, in randomly
 * oriented planes, counter-clockwise seen from the front. Expected areas are analytic: the shoelace
 * formula on the 2D corners (Gauss's area formula; elementary), and for L and U the rectangle sums.
 */
class PatchTrianglesAgreeTest {
    private static final int CASES = 300;

    /** One random outline: 3D corners, unit normal and its analytic area (m2). */
    private record Shape(double[] outline, Vec3 normal, double areaM2, String kind) {}

    @Test
    void gltfAndViewerMeshesHoldTheSameTrianglesCoveringTheShoelaceArea() throws Exception {
        Random rnd = new Random(20261202);
        List<Patch> patches = new ArrayList<>();
        List<Shape> shapes = new ArrayList<>();
        for (int i = 0; i < CASES; i++) {
            Shape s = shape(rnd, i % 3);
            shapes.add(s);
            patches.add(new Patch(i, String.format("B%d-S0-P0000", i), i, "b" + i, i, SurfaceKind.ROOF,
                    new Vec3(s.outline[0], s.outline[1], s.outline[2]), s.normal, s.areaM2, 0, 0, s.outline));
        }
        ResultTable table = new ResultTable(patches);
        double[] v = new double[CASES];
        for (int i = 0; i < CASES; i++) v[i] = i;
        table.put(org.solmass.irradiation.IrradiationColumns.ANNUAL, v);
        List<int[]> gltf = gltfTriangles(GltfWriter.toTree(table, "annual_kwh_m2", "test", List.of()), CASES);
        SceneFrame frame = new SceneFrame(0, 0, 0, 100);
        for (int i = 0; i < CASES; i++) {
            Patch p = patches.get(i);
            Shape s = shapes.get(i);
            PatchMeshData mesh = PatchMeshData.of(List.of(p), frame, 0);
            int[] viewer = new int[3 * mesh.faceCount()];
            for (int f = 0; f < mesh.faceCount(); f++) {
                for (int c = 0; c < 3; c++) viewer[3 * f + c] = mesh.faces[PatchMeshData.FACE_STRIDE * f + 3 * c];
            }
            String what = s.kind + " case " + i;
            assertArrayEquals(gltf.get(i), viewer, what + ": glTF and viewer triangles");
            assertArrayEquals(p.triangles(), viewer, what + ": the patch's own triangles");
            int corners = s.outline.length / 3;
            assertEquals(3 * (corners - 2), viewer.length, what + ": n - 2 triangles (Meisters 1975)");
            // every triangle front-facing, and their areas sum to the analytic area
            double[] cr = new double[3];
            double sum = 0;
            for (int t = 0; t < viewer.length; t += 3) {
                TriangleGeometry.cross(s.outline, viewer[t], viewer[t + 1], viewer[t + 2], cr);
                double front = cr[0] * s.normal.x() + cr[1] * s.normal.y() + cr[2] * s.normal.z();
                assertTrue(front > 0, what + ": triangle faces the front");
                sum += front / 2;
            }
            assertEquals(s.areaM2, sum, 1e-9 * s.areaM2, what + ": triangulated area = shoelace area");
        }
    }

    /** kind 0: convex (corners on an ellipse); 1: L shape; 2: U shape. */
    private static Shape shape(Random rnd, int kind) {
        double[] su, sv;
        double area;
        String name;
        if (kind == 0) {
            int n = 3 + rnd.nextInt(8);
            double a = 0.5 + 4 * rnd.nextDouble(), b = 0.5 + 4 * rnd.nextDouble();
            double[] ang = new double[n];
            for (int k = 0; k < n; k++) ang[k] = (k + 0.1 + 0.8 * rnd.nextDouble()) * 2 * Math.PI / n;
            Arrays.sort(ang);
            su = new double[n];
            sv = new double[n];
            for (int k = 0; k < n; k++) {
                su[k] = a * Math.cos(ang[k]);
                sv[k] = b * Math.sin(ang[k]);
            }
            area = 0;
            for (int k = 0; k < n; k++) {
                int j = (k + 1) % n;
                area += su[k] * sv[j] - su[j] * sv[k];
            }
            area /= 2;
            name = "convex";
        } else if (kind == 1) {
            // W x H rectangle without its top-right (W - a) x (H - b) corner
            double w = 1 + 5 * rnd.nextDouble(), h = 1 + 5 * rnd.nextDouble();
            double a = w * (0.1 + 0.8 * rnd.nextDouble()), b = h * (0.1 + 0.8 * rnd.nextDouble());
            su = new double[] {0, w, w, a, a, 0};
            sv = new double[] {0, 0, b, b, h, h};
            area = w * b + a * (h - b);
            name = "L";
        } else {
            // W x H rectangle with a (W - 2a) x (H - b) notch from the top middle
            double w = 1 + 5 * rnd.nextDouble(), h = 1 + 5 * rnd.nextDouble();
            double a = w * (0.05 + 0.4 * rnd.nextDouble()), b = h * (0.1 + 0.8 * rnd.nextDouble());
            su = new double[] {0, w, w, w - a, w - a, a, a, 0};
            sv = new double[] {0, 0, h, h, b, b, h, h};
            area = w * h - (w - 2 * a) * (h - b);
            name = "U";
        }
        int n = su.length, shift = rnd.nextInt(n);   // any corner may come first
        // a random plane: e1, e2 = n x e1 so that counter-clockwise in (e1, e2) is counter-clockwise from the front
        Vec3 normal = new Vec3(rnd.nextGaussian(), rnd.nextGaussian(), rnd.nextGaussian()).normalized();
        if (rnd.nextInt(4) == 0) normal = rnd.nextBoolean() ? Vec3.UP : new Vec3(0, 1, 0);
        Vec3 any = Math.abs(normal.z()) < 0.9 ? Vec3.UP : new Vec3(1, 0, 0);
        Vec3 e1 = any.cross(normal).normalized(), e2 = normal.cross(e1);
        Vec3 o = new Vec3(100 * rnd.nextDouble(), 100 * rnd.nextDouble(), 30 * rnd.nextDouble());
        double[] out = new double[3 * n];
        for (int k = 0; k < n; k++) {
            int j = (k + shift) % n;
            Vec3 p = o.plus(e1.times(su[j])).plus(e2.times(sv[j]));
            out[3 * k] = p.x();
            out[3 * k + 1] = p.y();
            out[3 * k + 2] = p.z();
        }
        return new Shape(out, normal, area, name);
    }

    /** Per patch, its glTF triangles as corner indices (vertex index minus the patch's first vertex). */
    private static List<int[]> gltfTriangles(JsonNode json, int patches) {
        String uri = json.at("/buffers/0/uri").asText();
        ByteBuffer buf = ByteBuffer.wrap(Base64.getDecoder().decode(uri.substring(uri.indexOf(',') + 1)))
                .order(ByteOrder.LITTLE_ENDIAN);
        int[][] byIndex = new int[patches][];
        for (JsonNode node : json.get("nodes")) {
            if (!node.has("mesh")) continue;
            JsonNode acc = json.get("accessors").get(json.at("/meshes/" + node.get("mesh").asInt() + "/primitives/0/indices").asInt());
            JsonNode view = json.get("bufferViews").get(acc.get("bufferView").asInt());
            int off = view.path("byteOffset").asInt(0) + acc.path("byteOffset").asInt(0), count = acc.get("count").asInt();
            int[] idx = new int[count];
            for (int k = 0; k < count; k++) idx[k] = buf.getInt(off + 4 * k);
            JsonNode ex = node.get("extras");
            for (int q = 0; q < ex.get("patch_ids").size(); q++) {
                String id = ex.get("patch_ids").get(q).asText();
                int patch = Integer.parseInt(id.substring(1, id.indexOf('-')));
                int first = ex.get("first_vertex").get(q).asInt(), n = ex.get("vertex_count").get(q).asInt();
                List<Integer> mine = new ArrayList<>();
                for (int t = 0; t < count; t += 3) {
                    if (idx[t] < first || idx[t] >= first + n) continue;
                    for (int c = 0; c < 3; c++) mine.add(idx[t + c] - first);
                }
                byIndex[patch] = mine.stream().mapToInt(Integer::intValue).toArray();
            }
        }
        return Arrays.asList(byIndex);
    }
}
