package org.solmass.model;

import org.solmass.InputException;
import org.solmass.TextInput;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.io.StringReader;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * Reads a Wavefront OBJ massing model into a {@link MassingModel} in the Solmass frame.
 *
 * <p>Accepted: {@code v x y z [w | r g b]} (extras ignored), {@code f} with {@code i}, {@code i/t},
 * {@code i//n}, {@code i/t/n} and negative (relative) indices, triangles, quads and n-gons (planar
 * n-gons are ear-clipped, see {@link PolygonTriangulator}), {@code o} and {@code g} (name the block
 * of the following faces; faces before any of them go to a block named after the file stem, or
 * "default"; a repeated name appends to the same block), {@code usemtl} (kept per triangle),
 * {@code vt vn vp s mtllib l p cstype deg curv surf parm end}, comments and blank lines, and line
 * continuations with a trailing backslash. Other statements give one warning per keyword.
 *
 * <p>Degenerate triangles are dropped and counted: a triangle is degenerate when twice its area is at
 * most {@link #DEGENERATE_REL} times the square of its longest edge (its height is below that
 * fraction of its longest edge), or when its longest edge is zero.
 *
 * <p>Vertices that no face uses are dropped (the rest keep their order), so a stray vertex changes no
 * bounds, tolerance or ground level; the used ones must lie within {@link CoordinateRange#MAX_COORDINATE_M} of the
 * origin and span at most {@link CoordinateRange#MAX_EXTENT_M}. A face whose edges cross (a bow-tie) is refused
 * with its line. Last, the faces of every block are turned to face out of it ({@link Orientation}).
 *
 * <p>Parsing is by hand (no regular expressions) so a 100k-triangle file reads in a fraction of a second.
 */
public final class ObjReader {
    /** Relative height (height / longest edge) below which a triangle counts as degenerate. */
    public static final double DEGENERATE_REL = 1e-9;
    /** A model and the warnings met while reading it (for the CLI to print). */
    public record Result(MassingModel model, List<String> warnings) {}

    private ObjReader() {}

    /** Reads an OBJ file; warnings are dropped (use {@link #load} to get them). */
    public static MassingModel read(Path file, ModelOptions options) {
        return load(file, options).model();
    }

    /**
     * Reads an OBJ file with its warnings. The file must be a regular file of UTF-8 text (a UTF-8 or
     * UTF-16 byte-order mark is honoured) with lines of at most {@link TextInput#MAX_LINE_BYTES} bytes.
     */
    public static Result load(Path file, ModelOptions options) {
        try (TextInput.Lines lines = TextInput.Lines.open(file, "file not found, expected an OBJ model", "an OBJ model")) {
            return parse(lines, file.toString(), file, options);
        } catch (NoSuchFileException e) {
            throw new InputException(file.toString(), "file not found, expected an OBJ model", e);
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read OBJ file: " + e.getMessage(), e);
        }
    }

    /**
     * Reads OBJ bytes as {@link #load(Path, ModelOptions)} reads a file's (encoding, line length);
     * {@code displayName} names the source in messages and the default block. The stream is not closed.
     */
    public static Result load(InputStream in, String displayName, ModelOptions options) throws IOException {
        return parse(new TextInput.Lines(in, displayName, "an OBJ model"), displayName, null, options);
    }

    /** Parses OBJ text; {@code displayName} names the source in messages and the default block. */
    public static Result parse(String text, String displayName, ModelOptions options) {
        try {
            return parse(new BufferedReader(new StringReader(text))::readLine, displayName, null, options);
        } catch (IOException e) {
            throw new IllegalStateException(e); // a StringReader does not fail
        }
    }

    /** Parses OBJ text from a reader; {@code displayName} names the source in messages. */
    public static Result parse(Reader reader, String displayName, ModelOptions options) throws IOException {
        BufferedReader br = reader instanceof BufferedReader b ? b : new BufferedReader(reader);
        return parse(br::readLine, displayName, null, options);
    }

    private static Result parse(TextInput.LineSource r, String name, Path source, ModelOptions options)
            throws IOException {
        if (options == null) options = ModelOptions.defaults();
        return new Parser(name, source, options).run(r);
    }

    /** Default block name: the file stem, or "default". */
    static String defaultBlockName(String displayName) {
        if (displayName == null || displayName.isBlank()) return "default";
        String s = displayName.replace('\\', '/');
        s = s.substring(s.lastIndexOf('/') + 1);
        int dot = s.lastIndexOf('.');
        if (dot > 0) s = s.substring(0, dot);
        return s.isBlank() ? "default" : s;
    }

    private static final class Parser {
        final String name;
        final Path source;
        final double scale, cosN, sinN;
        final UpAxis up;
        final DoubleList verts = new DoubleList();
        final IntList vertLine = new IntList();
        final IntList faceIdx = new IntList(1 << 12), faceStart = new IntList(), faceLine = new IntList();
        final IntList faceBlock = new IntList(), faceMat = new IntList();
        final Map<String, Integer> blocks = new LinkedHashMap<>();
        final Map<String, Integer> materials = new LinkedHashMap<>();
        final Map<String, int[]> unknown = new TreeMap<>();
        final List<String> warnings = new ArrayList<>();
        final double[] tmp = new double[3], mapped = new double[3];
        String currentBlock;
        int currentMat = -1;
        int lineNo;

        Parser(String name, Path source, ModelOptions o) {
            this.name = name;
            this.source = source;
            this.scale = o.unit().toMetres();
            this.up = o.up();
            double a = Math.toRadians(o.northDeg());
            this.cosN = Math.cos(a);
            this.sinN = Math.sin(a);
            this.currentBlock = defaultBlockName(name);
        }

        Result run(TextInput.LineSource r) throws IOException {
            String line;
            StringBuilder cont = null;
            int startLine = 0;
            while ((line = r.readLine()) != null) {
                lineNo++;
                if (lineNo == 1 && !line.isEmpty() && line.charAt(0) == '\uFEFF') line = line.substring(1); // UTF-8 BOM
                int end = line.length();
                while (end > 0 && line.charAt(end - 1) <= ' ') end--;
                if (end > 0 && line.charAt(end - 1) == '\\') {
                    if (cont == null) { cont = new StringBuilder(); startLine = lineNo; }
                    if (cont.length() + end > TextInput.MAX_LINE_BYTES) {
                        throw new InputException(at(startLine), "statement continued (trailing \\) to over "
                                + TextInput.MAX_LINE_BYTES + " characters, the most one line may have");
                    }
                    cont.append(line, 0, end - 1).append(' ');
                    continue;
                }
                if (cont != null) {
                    cont.append(line);
                    statement(cont.toString(), startLine);
                    cont = null;
                } else {
                    statement(line, lineNo);
                }
            }
            if (cont != null) statement(cont.toString(), startLine);
            return finish();
        }

        private String at(int line) { return InputException.at(name, line); }

        private void statement(String s, int ln) {
            int n = s.length(), i = 0;
            while (i < n && s.charAt(i) <= ' ') i++;
            if (i == n || s.charAt(i) == '#') return;
            int k = i;
            while (k < n && s.charAt(k) > ' ') k++;
            int kwLen = k - i;
            char c0 = s.charAt(i);
            if (kwLen == 1 && c0 == 'v') vertex(s, k, ln);
            else if (kwLen == 1 && c0 == 'f') face(s, k, ln);
            else if (kwLen == 1 && (c0 == 'o' || c0 == 'g')) group(s, k);
            else if (s.startsWith("usemtl", i) && kwLen == 6) material(s, k, ln);
            else {
                String kw = s.substring(i, k);
                switch (kw) {
                    case "vt", "vn", "vp", "s", "mtllib", "l", "p", "cstype", "deg", "curv", "curv2",
                         "surf", "parm", "trim", "hole", "end", "bmat", "step", "maplib", "usemap",
                         "lod", "shadow_obj", "trace_obj", "mg" -> { }
                    default -> {
                        int[] e = unknown.computeIfAbsent(kw, x -> new int[]{0, ln});
                        e[0]++;
                    }
                }
            }
        }

        private void vertex(String s, int from, int ln) {
            int pos = from;
            for (int c = 0; c < 3; c++) {
                int n = s.length();
                while (pos < n && s.charAt(pos) <= ' ') pos++;
                int e = pos;
                while (e < n && s.charAt(e) > ' ') e++;
                if (e == pos || s.charAt(pos) == '#') {
                    throw new InputException(at(ln), "vertex needs 3 coordinates (v x y z), found " + c);
                }
                double d;
                try {
                    d = Double.parseDouble(s.substring(pos, e));
                } catch (NumberFormatException ex) {
                    throw new InputException(at(ln), "vertex coordinate '" + s.substring(pos, e)
                            + "' is not a number, expected v x y z with decimal numbers");
                }
                if (!Double.isFinite(d)) {
                    throw new InputException(at(ln), "vertex coordinate '" + s.substring(pos, e)
                            + "' is not finite, expected a finite decimal number");
                }
                tmp[c] = d * scale;
                pos = e;
            }
            double[] m = mapped;
            up.apply(tmp[0], tmp[1], tmp[2], m, 0);
            verts.add(m[0] * cosN - m[1] * sinN);
            verts.add(m[0] * sinN + m[1] * cosN);
            verts.add(m[2]);
            vertLine.add(ln);
        }

        private void face(String s, int from, int ln) {
            int start = faceIdx.size();
            int n = s.length(), pos = from, count = 0;
            int nv = verts.size() / 3;
            while (true) {
                while (pos < n && s.charAt(pos) <= ' ') pos++;
                if (pos >= n || s.charAt(pos) == '#') break; // end of line or a trailing comment
                int e = pos;
                while (e < n && s.charAt(e) > ' ') e++;
                int slash = pos;
                while (slash < e && s.charAt(slash) != '/') slash++;
                long v = parseIndex(s, pos, slash, ln);
                int resolved;
                if (v == 0) {
                    throw new InputException(at(ln), "vertex index 0 in face; OBJ indices start at 1"
                            + " (or are negative, counting back from the last vertex)");
                } else if (v < 0) {
                    long r = nv + v;
                    if (r < 0) {
                        throw new InputException(at(ln), "relative vertex index " + v + " points before the first"
                                + " vertex; only " + nv + " vertices are defined so far");
                    }
                    resolved = (int) r;
                } else {
                    if (v > Integer.MAX_VALUE) throw new InputException(at(ln), "vertex index " + v + " is too large");
                    resolved = (int) (v - 1); // checked against the final vertex count in finish()
                }
                faceIdx.add(resolved);
                count++;
                pos = e;
            }
            if (count < 3) {
                throw new InputException(at(ln), "face has " + count + " vertices, expected at least 3");
            }
            faceStart.add(start);
            faceLine.add(ln);
            faceMat.add(currentMat);
            Integer b = blocks.get(currentBlock);
            if (b == null) { b = blocks.size(); blocks.put(currentBlock, b); }
            faceBlock.add(b);
        }

        private long parseIndex(String s, int from, int to, int ln) {
            int i = from;
            boolean neg = false;
            if (i < to && (s.charAt(i) == '-' || s.charAt(i) == '+')) { neg = s.charAt(i) == '-'; i++; }
            if (i == to) throw badIndex(s, from, to, ln);
            long v = 0;
            for (; i < to; i++) {
                char c = s.charAt(i);
                if (c < '0' || c > '9' || v > 1_000_000_000_000L) throw badIndex(s, from, to, ln);
                v = v * 10 + (c - '0');
            }
            return neg ? -v : v;
        }

        private InputException badIndex(String s, int from, int to, int ln) {
            return new InputException(at(ln), "face vertex '" + s.substring(from, to)
                    + "' is not an integer index, expected i, i/t, i//n or i/t/n");
        }

        private void group(String s, int from) {
            String g = s.substring(from).trim();
            currentBlock = g.isEmpty() ? defaultBlockName(name) : g;
        }

        private void material(String s, int from, int ln) {
            String m = s.substring(from).trim();
            if (m.isEmpty()) {
                currentMat = -1;
                warnings.add(at(ln) + ": usemtl without a name; following faces have no material");
                return;
            }
            currentMat = materials.computeIfAbsent(m, x -> materials.size());
        }

        private Result finish() {
            int nv = verts.size() / 3;
            if (nv == 0) throw new InputException(name, "the model has no vertices, expected v x y z lines");
            int nf = faceStart.size();
            if (nf == 0) throw new InputException(name, "the model has no faces, expected f lines");
            // Indices in range; only the vertices that faces use are kept (in their order), so that a stray
            // vertex changes no bounds, tolerance or ground level.
            boolean[] used = new boolean[nv];
            for (int f = 0; f < nf; f++) {
                int s = faceStart.get(f), e = f + 1 < nf ? faceStart.get(f + 1) : faceIdx.size();
                for (int i = s; i < e; i++) {
                    int vi = faceIdx.get(i);
                    if (vi >= nv) {
                        throw new InputException(at(faceLine.get(f)), "vertex index " + (vi + 1)
                                + " is out of range, the model has " + nv + " vertices");
                    }
                    used[vi] = true;
                }
            }
            double[] all = verts.toArray();
            int[] newIndex = new int[nv];
            int kept = 0;
            for (int i = 0; i < nv; i++) newIndex[i] = used[i] ? kept++ : -1;
            double[] v = new double[3 * kept];
            int[] vLine = new int[kept];
            for (int i = 0; i < nv; i++) {
                if (!used[i]) continue;
                System.arraycopy(all, 3 * i, v, 3 * newIndex[i], 3);
                vLine[newIndex[i]] = vertLine.get(i);
            }
            CoordinateRange.check(v, vLine, name);
            if (kept < nv) {
                String stray = CoordinateRange.strayVertices(all, used, v, vertLine, name);
                if (stray != null) warnings.add(stray);
            }
            IntList tris = new IntList(nf * 2), tBlock = new IntList(nf * 2);
            IntList tMat = new IntList(nf * 2), tLine = new IntList(nf * 2);
            PolygonTriangulator tri = new PolygonTriangulator();
            int[] face = new int[16];
            int degenerate = 0;
            for (int f = 0; f < nf; f++) {
                int s = faceStart.get(f), e = f + 1 < nf ? faceStart.get(f + 1) : faceIdx.size();
                int k = e - s;
                if (face.length < k) face = new int[Math.max(k, face.length * 2)];
                for (int i = 0; i < k; i++) face[i] = newIndex[faceIdx.get(s + i)];
                int[] cross = PolygonTriangulator.crossingEdges(face, k, v);
                if (cross != null) {
                    throw new InputException(at(faceLine.get(f)), String.format(Locale.ROOT,
                            "face is self-intersecting: its edge from corner %d to %d crosses the edge from corner %d"
                                    + " to %d (a bow-tie); expected a simple polygon: reorder its corners or split it",
                            cross[0] + 1, (cross[0] + 1) % k + 1, cross[1] + 1, (cross[1] + 1) % k + 1));
                }
                int before = tris.size();
                int made = tri.triangulate(face, k, v, tris);
                degenerate += (k - 2) - made;
                // Drop degenerate triangles among those just made, keeping the rest in order.
                int w = before;
                for (int t = before; t < tris.size(); t += 3) {
                    int a = tris.get(t), b = tris.get(t + 1), c = tris.get(t + 2);
                    if (isDegenerate(v, a, b, c)) { degenerate++; continue; }
                    tris.set(w, a); tris.set(w + 1, b); tris.set(w + 2, c);
                    w += 3;
                    tBlock.add(faceBlock.get(f)); tMat.add(faceMat.get(f)); tLine.add(faceLine.get(f));
                }
                tris.truncate(w);
            }
            if (tris.size() == 0) {
                throw new InputException(name, "all " + nf + " faces are degenerate (zero area),"
                        + " expected at least one face with an area");
            }
            if (degenerate > 0) {
                warnings.add(name + ": dropped " + degenerate + " degenerate (zero-area) triangle(s)");
            }
            for (Map.Entry<String, int[]> u : unknown.entrySet()) {
                warnings.add(at(u.getValue()[1]) + ": unknown statement '" + u.getKey() + "' ignored ("
                        + u.getValue()[0] + " line(s))");
            }
            MassingModel m = new MassingModel(source, List.copyOf(blocks.keySet()),
                    List.copyOf(materials.keySet()), v, tris.toArray(), tBlock.toArray(), tMat.toArray(),
                    tLine.toArray(), degenerate);
            double[] b = m.bounds();
            double diagonal = Math.sqrt((b[3] - b[0]) * (b[3] - b[0]) + (b[4] - b[1]) * (b[4] - b[1])
                    + (b[5] - b[2]) * (b[5] - b[2]));
            warnings.addAll(Orientation.orient(m.vertices(), m.triangles(), m.triangleBlock(), m.triangleLine(),
                    m.blockNames(), name, VertexWelder.tolerance(diagonal)));
            return new Result(m, List.copyOf(warnings));
        }
    }

    /**
     * True when twice the triangle's area is at most {@link #DEGENERATE_REL} times its longest edge
     * squared (a zero-area or needle triangle).
     */
    public static boolean isDegenerate(double[] v, int a, int b, int c) {
        double[] cr = new double[3];
        TriangleGeometry.cross(v, a, b, c, cr);
        double twiceArea = TriangleGeometry.length(cr);
        a *= 3; b *= 3; c *= 3;
        double ux = v[b] - v[a], uy = v[b + 1] - v[a + 1], uz = v[b + 2] - v[a + 2];
        double wx = v[c] - v[a], wy = v[c + 1] - v[a + 1], wz = v[c + 2] - v[a + 2];
        double zx = v[c] - v[b], zy = v[c + 1] - v[b + 1], zz = v[c + 2] - v[b + 2];
        double l2 = Math.max(ux * ux + uy * uy + uz * uz, Math.max(wx * wx + wy * wy + wz * wz,
                zx * zx + zy * zy + zz * zz));
        return l2 == 0 || twiceArea <= DEGENERATE_REL * l2;
    }
}
