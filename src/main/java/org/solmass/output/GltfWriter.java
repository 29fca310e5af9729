package org.solmass.output;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.irradiation.IrradiationColumns;
import org.solmass.surface.Patch;
import org.solmass.table.Column;
import org.solmass.table.Numbers;
import org.solmass.table.ResultTable;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes the analysed patches as a glTF 2.0 file (Khronos Group, "glTF 2.0 Specification", 2021;
 * an open standard), one JSON file with the binary buffer embedded as a base64 data URI, so web
 * viewers and CAD tools can show the map.
 *
 * <p>Layout (docs/outputs.md): one root node carrying the model's centre as its translation (so the
 * float vertex positions stay precise for survey coordinates), one child node and one mesh per block;
 * each mesh has one triangle primitive with POSITION, NORMAL and COLOR_0 (float VEC3) and
 * UNSIGNED_INT indices. Every patch has its own vertices (flat colour per patch); its triangles are
 * {@link Patch#triangles()}, the ones the viewer and the PNG map draw. Colours are the
 * sequential ramp ({@link ColourRamp#sequential}) of the main column over the map's automatic range,
 * converted from sRGB to linear as glTF requires for COLOR_0 (spec 3.7.2.1). Axes: glTF is y up,
 * right-handed, metres, so a Solmass point (x east, y north, z up) becomes (x, z, -y).
 *
 * <p>Per-patch values are in each block node's {@code extras}: {@code patch_ids}, {@code first_vertex}
 * and {@code vertex_count} (the patch's vertex range in the block's mesh) and {@code values}, one
 * array per result column in patch order ({@link #valueColumns}, null where a value is missing); units
 * in the scene's extras. The JSON is written compact (no indentation).
 */
public final class GltfWriter {
    public static final String FILE_NAME = "patches.gltf";
    static final int FLOAT = 5126, UNSIGNED_INT = 5125, ARRAY_BUFFER = 34962, ELEMENT_ARRAY_BUFFER = 34963, TRIANGLES = 4;

    private GltfWriter() {}

    /** Writes the file atomically; {@code column} colours the mesh. */
    public static void write(Path file, ResultTable table, String column, String generator, List<String> cautions) {
        try {
            AtomicFiles.writeString(file, new com.fasterxml.jackson.databind.ObjectMapper()
                    .writeValueAsString(toTree(table, column, generator, cautions)) + "\n");
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The glTF document as a JSON tree (buffer embedded). */
    public static ObjectNode toTree(ResultTable table, String column, String generator, List<String> cautions) {
        List<Patch> patches = table.patches();
        double[] v = table.column(column);
        double[] range = MapRenderer.autoRange(v);
        double[] centre = centre(patches);

        Map<Integer, List<Integer>> byBlock = new LinkedHashMap<>();
        for (Patch p : patches) byBlock.computeIfAbsent(p.block(), k -> new ArrayList<>()).add(p.index());

        JsonNodeFactory f = JsonNodeFactory.instance;
        ObjectNode root = f.objectNode();
        ObjectNode asset = root.putObject("asset");
        asset.put("version", "2.0");
        asset.put("generator", generator);
        root.put("scene", 0);
        ObjectNode scene = root.putArray("scenes").addObject();
        scene.put("name", "Solmass patches");
        scene.putArray("nodes").add(0);
        ObjectNode sx = scene.putObject("extras");
        sx.put("colour_column", column);
        sx.put("colour_range_low", range[0]);
        sx.put("colour_range_high", range[1]);
        sx.put("axes", "metres, glTF y up: the Solmass point (x east, y north, z up) is the glTF point (x, z, -y)");
        ObjectNode units = sx.putObject("units");
        ObjectNode labels = sx.putObject("labels");
        for (String c : valueColumns(table)) {
            units.put(c, table.def(c).unit().symbol());
            labels.put(c, table.def(c).label());
        }
        ArrayNode cn = sx.putArray("cautions");
        for (String c : cautions) cn.add(c);

        ArrayNode nodes = root.putArray("nodes");
        ObjectNode top = nodes.addObject();
        top.put("name", "model");
        ArrayNode tr = top.putArray("translation");
        tr.add(centre[0]).add(centre[2]).add(-centre[1]);
        ArrayNode children = top.putArray("children");
        ArrayNode meshes = root.putArray("meshes"), accessors = root.putArray("accessors"), views = root.putArray("bufferViews");

        List<byte[]> chunks = new ArrayList<>();
        int offset = 0;
        for (List<Integer> members : byBlock.values()) {
            MeshData md = mesh(patches, members, v, range, centre);
            int block = patches.get(members.get(0)).block();
            String blockName = patches.get(members.get(0)).blockName();
            int viewBase = views.size();
            byte[][] parts = {md.positions, md.normals, md.colours, md.indices};
            for (int k = 0; k < 4; k++) {
                ObjectNode bv = views.addObject();
                bv.put("buffer", 0);
                bv.put("byteOffset", offset);
                bv.put("byteLength", parts[k].length);
                bv.put("target", k < 3 ? ARRAY_BUFFER : ELEMENT_ARRAY_BUFFER);
                chunks.add(parts[k]);
                offset += parts[k].length;       // every part is a multiple of 4 bytes: alignment kept
            }
            int accBase = accessors.size();
            for (int k = 0; k < 3; k++) {
                ObjectNode a = accessors.addObject();
                a.put("bufferView", viewBase + k);
                a.put("componentType", FLOAT);
                a.put("count", md.vertexCount);
                a.put("type", "VEC3");
                if (k == 0) {
                    ArrayNode mn = a.putArray("min"), mx = a.putArray("max");
                    for (int c = 0; c < 3; c++) {
                        mn.add(md.min[c]);
                        mx.add(md.max[c]);
                    }
                }
            }
            ObjectNode ia = accessors.addObject();
            ia.put("bufferView", viewBase + 3);
            ia.put("componentType", UNSIGNED_INT);
            ia.put("count", md.indexCount);
            ia.put("type", "SCALAR");

            ObjectNode mesh = meshes.addObject();
            mesh.put("name", blockName);
            ObjectNode prim = mesh.putArray("primitives").addObject();
            ObjectNode attrs = prim.putObject("attributes");
            attrs.put("POSITION", accBase);
            attrs.put("NORMAL", accBase + 1);
            attrs.put("COLOR_0", accBase + 2);
            prim.put("indices", accBase + 3);
            prim.put("mode", TRIANGLES);

            children.add(nodes.size());
            ObjectNode node = nodes.addObject();
            node.put("name", blockName);
            node.put("mesh", meshes.size() - 1);
            ObjectNode ex = node.putObject("extras");
            ex.put("block", blockName);
            ex.put("block_id", block);
            ArrayNode ids = ex.putArray("patch_ids"), first = ex.putArray("first_vertex"), count = ex.putArray("vertex_count");
            for (int i = 0; i < members.size(); i++) {
                ids.add(patches.get(members.get(i)).id());
                first.add(md.firstVertex[i]);
                count.add(md.vertexCounts[i]);
            }
            ObjectNode vals = ex.putObject("values");
            for (String c : valueColumns(table)) {
                ArrayNode arr = vals.putArray(c);
                double[] col = table.column(c);
                Column def = table.def(c);
                for (int p : members) {
                    if (Double.isFinite(col[p])) arr.add(new java.math.BigDecimal(def.format(col[p]))); else arr.addNull();
                }
            }
        }
        byte[] all = new byte[offset];
        int at = 0;
        for (byte[] c : chunks) {
            System.arraycopy(c, 0, all, at, c.length);
            at += c.length;
        }
        ObjectNode buf = root.putArray("buffers").addObject();
        buf.put("byteLength", all.length);
        buf.put("uri", "data:application/octet-stream;base64," + Base64.getEncoder().encodeToString(all));
        return root;
    }

    /**
     * The columns carried in the extras: every result column except the monthly ones, the per-patch
     * totals and the standard error (patches.csv has them all), rounded as in patches.csv.
     */
    static List<String> valueColumns(ResultTable table) {
        List<String> out = new ArrayList<>();
        for (String c : table.names()) {
            if (IrradiationColumns.MONTHLY.match(c).isPresent() || c.equals(IrradiationColumns.ANNUAL_KWH.name())
                    || c.equals(IrradiationColumns.SVF_STD_ERROR.name())) continue;
            out.add(c);
        }
        return out;
    }

    private record MeshData(byte[] positions, byte[] normals, byte[] colours, byte[] indices, int vertexCount,
                            int indexCount, float[] min, float[] max, int[] firstVertex, int[] vertexCounts) {}

    private static MeshData mesh(List<Patch> patches, List<Integer> members, double[] values, double[] range, double[] c) {
        int nv = 0;
        for (int p : members) nv += patches.get(p).outline().length / 3;
        ByteBuffer pos = le(12 * nv), nrm = le(12 * nv), col = le(12 * nv);
        List<int[]> tris = new ArrayList<>();
        float[] min = {Float.POSITIVE_INFINITY, Float.POSITIVE_INFINITY, Float.POSITIVE_INFINITY};
        float[] max = {Float.NEGATIVE_INFINITY, Float.NEGATIVE_INFINITY, Float.NEGATIVE_INFINITY};
        int[] first = new int[members.size()], counts = new int[members.size()];
        int base = 0, ni = 0;
        for (int i = 0; i < members.size(); i++) {
            Patch q = patches.get(members.get(i));
            double[] o = q.outline();
            int m = o.length / 3;
            first[i] = base;
            counts[i] = m;
            double val = values[q.index()];
            int rgb = ColourRamp.sequential(Double.isFinite(val) ? ColourRamp.normalise(val, range[0], range[1]) : Double.NaN);
            float r = linear((rgb >> 16) & 255), g = linear((rgb >> 8) & 255), b = linear(rgb & 255);
            for (int k = 0; k < m; k++) {
                float[] p = {(float) (o[3 * k] - c[0]), (float) (o[3 * k + 2] - c[2]), (float) (-(o[3 * k + 1] - c[1]))};
                for (int a = 0; a < 3; a++) {
                    pos.putFloat(p[a]);
                    min[a] = Math.min(min[a], p[a]);
                    max[a] = Math.max(max[a], p[a]);
                }
                nrm.putFloat((float) q.normal().x()).putFloat((float) q.normal().z()).putFloat((float) -q.normal().y());
                col.putFloat(r).putFloat(g).putFloat(b);
            }
            int[] t = q.triangles();
            for (int j = 0; j < t.length; j += 3) {
                tris.add(new int[] {base + t[j], base + t[j + 1], base + t[j + 2]});
                ni += 3;
            }
            base += m;
        }
        ByteBuffer idx = le(4 * ni);
        for (int[] t : tris) idx.putInt(t[0]).putInt(t[1]).putInt(t[2]);
        return new MeshData(pos.array(), nrm.array(), col.array(), idx.array(), nv, ni, min, max, first, counts);
    }

    /** sRGB 8-bit code to linear (IEC 61966-2-1:1999 decoding). */
    static float linear(int v8) {
        double s = v8 / 255.0;
        return (float) (s <= 0.04045 ? s / 12.92 : Math.pow((s + 0.055) / 1.055, 2.4));
    }

    private static ByteBuffer le(int bytes) { return ByteBuffer.allocate(bytes).order(ByteOrder.LITTLE_ENDIAN); }

    /** Centre of the patches' bounding box, rounded to whole metres. */
    static double[] centre(List<Patch> patches) {
        double[] lo = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
        double[] hi = {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (Patch p : patches) {
            double[] o = p.outline();
            for (int k = 0; k < o.length; k++) {
                lo[k % 3] = Math.min(lo[k % 3], o[k]);
                hi[k % 3] = Math.max(hi[k % 3], o[k]);
            }
        }
        double[] c = new double[3];
        for (int a = 0; a < 3; a++) c[a] = patches.isEmpty() ? 0 : Math.rint((lo[a] + hi[a]) / 2);
        return c;
    }
}
