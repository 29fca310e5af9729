package org.solmass.output;

import org.solmass.table.Numbers;
import org.solmass.table.ResultTable;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import de.javagl.jgltf.model.AccessorFloatData;
import de.javagl.jgltf.model.AccessorIntData;
import de.javagl.jgltf.model.AccessorModel;
import de.javagl.jgltf.model.BufferViewModel;
import de.javagl.jgltf.model.GltfModel;
import de.javagl.jgltf.model.MeshPrimitiveModel;
import de.javagl.jgltf.model.io.GltfModelReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Structure of patches.gltf against the glTF 2.0 specification (Khronos, 2021): read back with the
 * de.javagl jgltf-model library (a reader independent of ours) and checked by the spec's rules:
 * accessor counts per attribute, component types (5126 FLOAT, 5125 UNSIGNED_INT), bufferView ranges
 * inside the buffer and 4-byte aligned, POSITION min/max equal to the data's bounds (spec 3.6.2.4:
 * required for POSITION), indices below the vertex count, triangles wound like the NORMAL.
 */
class GltfWriterTest {
    @TempDir Path dir;

    private static ResultTable table(SyntheticScene s) {
        ResultTable t = new ResultTable(s.patches);
        t.put(org.solmass.metrics.ColumnCatalogue.of("annual_kwh_m2"), s.values());
        double[] svf = new double[s.patches.size()];
        for (int i = 0; i < svf.length; i++) svf[i] = i % 7 == 0 ? Double.NaN : 0.5;
        t.put(org.solmass.metrics.ColumnCatalogue.of("sky_view_factor"), svf);
        return t;
    }

    @Test
    void gltfStructureFollowsTheSpecification() throws Exception {
        SyntheticScene s = SyntheticScene.district(2.0);
        ResultTable t = table(s);
        Path f = dir.resolve("patches.gltf");
        GltfWriter.write(f, t, "annual_kwh_m2", "Solmass test", List.of("invented scene"));

        List<String> errors = new ArrayList<>();
        GltfModelReader reader = new GltfModelReader();
        reader.setJsonErrorConsumer(e -> errors.add(e.getJsonPathString() + ": " + e.getMessage()));
        GltfModel g = reader.read(f);
        assertEquals(List.of(), errors);
        assertEquals("2.0", new ObjectMapper().readTree(Files.readString(f)).at("/asset/version").asText());

        int bufLen = g.getBufferModels().get(0).getByteLength();
        for (BufferViewModel bv : g.getBufferViewModels()) {
            assertTrue(bv.getByteOffset() % 4 == 0 && bv.getByteOffset() + bv.getByteLength() <= bufLen);
        }
        JsonNode json = new ObjectMapper().readTree(Files.readString(f));
        // required properties (glTF 2.0 JSON schema: accessor.schema.json, bufferView.schema.json, buffer.schema.json)
        for (JsonNode a : json.get("accessors")) for (String k : List.of("componentType", "count", "type")) assertTrue(a.has(k), k);
        for (JsonNode v : json.get("bufferViews")) for (String k : List.of("buffer", "byteLength")) assertTrue(v.has(k), k);
        for (JsonNode mesh : json.get("meshes")) assertTrue(mesh.get("primitives").get(0).get("attributes").has("POSITION"));
        String uri = json.at("/buffers/0/uri").asText();
        assertTrue(uri.startsWith("data:application/octet-stream;base64,"));
        assertEquals(json.at("/buffers/0/byteLength").asInt(),
                java.util.Base64.getDecoder().decode(uri.substring(uri.indexOf(',') + 1)).length);
        assertTrue(json.get("scene").asInt() < json.get("scenes").size());
        for (JsonNode c : json.at("/nodes/0/children")) assertTrue(c.asInt() > 0 && c.asInt() < json.get("nodes").size());
        double[] origin = new double[3];
        for (int a = 0; a < 3; a++) origin[a] = json.at("/nodes/0/translation/" + a).asDouble();

        int patchesSeen = 0;
        for (int m = 0; m < g.getMeshModels().size(); m++) {
            MeshPrimitiveModel prim = g.getMeshModels().get(m).getMeshPrimitiveModels().get(0);
            assertEquals(4, prim.getMode());
            AccessorModel pos = prim.getAttributes().get("POSITION"), nrm = prim.getAttributes().get("NORMAL"),
                    col = prim.getAttributes().get("COLOR_0"), idx = prim.getIndices();
            assertEquals(5126, pos.getComponentType());
            assertEquals(5126, nrm.getComponentType());
            assertEquals(5126, col.getComponentType());
            assertEquals(5125, idx.getComponentType());
            assertEquals(pos.getCount(), nrm.getCount());
            assertEquals(pos.getCount(), col.getCount());
            assertEquals(0, idx.getCount() % 3);
            AccessorFloatData p = (AccessorFloatData) pos.getAccessorData(), n = (AccessorFloatData) nrm.getAccessorData(),
                    c = (AccessorFloatData) col.getAccessorData();
            for (int a = 0; a < 3; a++) {
                float lo = Float.POSITIVE_INFINITY, hi = Float.NEGATIVE_INFINITY;
                for (int v = 0; v < pos.getCount(); v++) {
                    lo = Math.min(lo, p.get(v, a));
                    hi = Math.max(hi, p.get(v, a));
                }
                assertEquals(lo, pos.getMin()[a].floatValue(), 0f);
                assertEquals(hi, pos.getMax()[a].floatValue(), 0f);
            }
            for (int v = 0; v < col.getCount(); v++) for (int a = 0; a < 3; a++) assertTrue(c.get(v, a) >= 0 && c.get(v, a) <= 1);
            AccessorIntData ix = (AccessorIntData) idx.getAccessorData();
            double[] triArea = new double[pos.getCount()];
            for (int k = 0; k < idx.getCount(); k += 3) {
                int i0 = ix.get(k), i1 = ix.get(k + 1), i2 = ix.get(k + 2);
                assertTrue(i0 < pos.getCount() && i1 < pos.getCount() && i2 < pos.getCount());
                double[] e1 = new double[3], e2 = new double[3];
                for (int a = 0; a < 3; a++) {
                    e1[a] = p.get(i1, a) - p.get(i0, a);
                    e2[a] = p.get(i2, a) - p.get(i0, a);
                }
                double cx = e1[1] * e2[2] - e1[2] * e2[1], cy = e1[2] * e2[0] - e1[0] * e2[2], cz = e1[0] * e2[1] - e1[1] * e2[0];
                double dot = cx * n.get(i0, 0) + cy * n.get(i0, 1) + cz * n.get(i0, 2);
                assertTrue(dot > 0, "triangle wound against its normal");
                triArea[i0] += Math.sqrt(cx * cx + cy * cy + cz * cz) / 2;   // credited to its first corner's patch
            }
            // extras: per-patch table and vertex ranges; corners reproduce the patch outline (x, z, -y)
            JsonNode ex = json.at("/nodes/" + (m + 1) + "/extras");
            JsonNode ids = ex.get("patch_ids");
            for (int i = 0; i < ids.size(); i++) {
                Patch q = s.patches.get(findPatch(s.patches, ids.get(i).asText()));
                int first = ex.get("first_vertex").get(i).asInt(), count = ex.get("vertex_count").get(i).asInt();
                assertEquals(q.outline().length / 3, count);
                double area = 0;
                for (int k = 0; k < count; k++) {
                    assertEquals(q.outline()[3 * k], p.get(first + k, 0) + origin[0], 1e-3);
                    assertEquals(q.outline()[3 * k + 2], p.get(first + k, 1) + origin[1], 1e-3);
                    assertEquals(-q.outline()[3 * k + 1], p.get(first + k, 2) + origin[2], 1e-3);
                    area += triArea[first + k];
                }
                assertEquals(q.areaM2(), area, 1e-3 * q.areaM2());
                double want = t.column("annual_kwh_m2")[q.index()];
                assertEquals(Double.parseDouble(Numbers.format(want, 2)), ex.get("values").get("annual_kwh_m2").get(i).asDouble(), 0);
                JsonNode svf = ex.get("values").get("sky_view_factor").get(i);
                assertEquals(Double.isNaN(t.column("sky_view_factor")[q.index()]), svf.isNull());
                patchesSeen++;
            }
        }
        assertEquals(s.patches.size(), patchesSeen);
    }

    private static int findPatch(List<Patch> ps, String id) {
        for (Patch p : ps) if (p.id().equals(id)) return p.index();
        throw new AssertionError("no patch " + id);
    }

    /** A concave (L-shaped) outline triangulates into triangles of the outline's area (5 m2), all front-facing. */
    @Test
    void concaveOutlineTriangulatesToItsArea() {
        double[] o = {0, 0, 0, 3, 0, 0, 3, 1, 0, 1, 1, 0, 1, 3, 0, 0, 3, 0};
        Patch q = new Patch(0, "L", 0, "b", 0, SurfaceKind.ROOF, new Vec3(1, 1, 0), new Vec3(0, 0, 1), 5, 0, 0, o);
        double area = 0;
        int[] flat = q.triangles();
        assertEquals(4 * 3, flat.length);
        for (int j = 0; j < flat.length; j += 3) {
            int[] t = {flat[j], flat[j + 1], flat[j + 2]};
            double ax = o[3 * t[1]] - o[3 * t[0]], ay = o[3 * t[1] + 1] - o[3 * t[0] + 1];
            double bx = o[3 * t[2]] - o[3 * t[0]], by = o[3 * t[2] + 1] - o[3 * t[0] + 1];
            double cross = ax * by - ay * bx;
            assertTrue(cross > 0);
            area += cross / 2;
        }
        assertEquals(5.0, area, 1e-12);
    }
}
