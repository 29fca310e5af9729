package org.solmass.surface;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.operation.overlayng.OverlayNG;
import org.locationtech.jts.operation.overlayng.OverlayNGRobust;
import org.solmass.InputException;
import org.solmass.model.MassingModel;
import org.solmass.model.Parallel;
import org.solmass.model.Vec3;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Splits analysed surfaces into square grid patches.
 *
 * <p>The grid lies in each surface's frame and is anchored at the minimum local (u, v) of the
 * surface polygon (local (0, 0), see {@link Surface#polygon()}), so it depends only on the geometry.
 * Each cell is clipped to the polygon with JTS; a clipped cell that falls apart (concave surface)
 * gives one piece per part. A piece smaller than {@link #SLIVER_FRACTION} of a cell is a sliver: it
 * is united with the edge-adjacent piece of the same surface that shares the longest boundary with
 * it (a non-sliver piece if there is one, else another sliver), so the patch areas of a surface sum
 * to its area. A surface smaller than the sliver limit stays one patch.
 *
 * <p>Patch ids are {@code B<block id>-S<surface number within block>-P<patch number within surface,
 * 4 digits>}, e.g. {@code B3-S12-P0045}: they depend only on the model and the patch size, so they
 * are stable across runs and independent of which other blocks are analysed. The outline of a patch
 * with holes (or of several parts after a merge) is the exterior ring of its largest part; its area
 * and centroid are those of the whole piece.
 *
 * <p>Surfaces are patched in parallel; output order is by surface id, then grid row (v), then column
 * (u), whatever the thread count.
 */
public final class Patcher {
    /** Pieces with area below this fraction of a full cell are merged into a neighbour. */
    public static final double SLIVER_FRACTION = 0.25;

    private Patcher() {}

    /** Builds surfaces and patches. */
    public static PatchSet build(MassingModel model, PatchOptions options) {
        return build(model, SurfaceBuilder.build(model), options);
    }

    /** Patches already built surfaces of {@code model}. */
    public static PatchSet build(MassingModel model, List<Surface> surfaces, PatchOptions options) {
        boolean[] analysed = selectBlocks(model, options.analysedBlocks());
        double s = options.patchSizeM();
        for (Surface sf : surfaces) if (analysed[sf.block()]) checkGridSize(model, sf, s); // first offender reported
        // Faces hidden against a touching block are not patched (HiddenFaces).
        Geometry[] exposed = HiddenFaces.exposed(surfaces);
        // Per surface in parallel: cut, merge slivers, build patches with surface-local indices.
        List<List<Patch>> perSurface = Parallel.map(surfaces.size(), i -> {
            Surface sf = surfaces.get(i);
            if (!analysed[sf.block()]) return List.<Patch>of();
            if (sf.kind() == SurfaceKind.UNDERSIDE && !options.includeUndersides()) return List.<Patch>of();
            List<Patch> ps = new ArrayList<>();
            Geometry g = exposed[i];
            for (int k = 0; k < g.getNumGeometries(); k++) {
                if (!(g.getGeometryN(k) instanceof Polygon part) || part.isEmpty()) continue;
                List<Piece> pieces = mergeSlivers(cut(part, s), SLIVER_FRACTION * s * s);
                for (Piece p : pieces) if (p.alive && hasArea(p.geom)) ps.add(toPatch(ps.size(), model, sf, p, s));
            }
            return ps;
        });
        List<Patch> patches = new ArrayList<>();
        boolean ground = false;
        for (Surface sf : surfaces) ground |= sf.kind() == SurfaceKind.GROUND;
        for (List<Patch> ps : perSurface) {
            for (Patch p : ps) {
                patches.add(new Patch(patches.size(), p.id(), p.block(), p.blockName(), p.surface(), p.kind(),
                        p.centroid(), p.normal(), p.areaM2(), p.tiltDeg(), p.azimuthDeg(), p.outline()));
            }
        }
        return new PatchSet(model, options, surfaces, List.copyOf(patches), analysed, ground, model.minZ());
    }

    /** Largest grid (cells of one surface's envelope) patched before giving up as a likely unit error. */
    public static final long MAX_CELLS_PER_SURFACE = 20_000_000L;

    private static void checkGridSize(MassingModel model, Surface sf, double s) {
        var env = sf.polygon().getEnvelopeInternal();
        double cells = Math.ceil(env.getMaxX() / s) * Math.ceil(env.getMaxY() / s);
        if (cells > MAX_CELLS_PER_SURFACE) {
            throw new InputException("patch size", String.format(java.util.Locale.ROOT,
                    "surface %s of block '%s' is %.0f m x %.0f m, which at %.3g m patches is %.3g grid cells"
                            + " (limit %d); check the model's length unit or choose a larger patch size",
                    sf.label(), model.blockNames().get(sf.block()), env.getMaxX(), env.getMaxY(), s, cells,
                    MAX_CELLS_PER_SURFACE));
        }
    }

    private static boolean[] selectBlocks(MassingModel model, Set<String> names) {
        List<String> blocks = model.blockNames();
        boolean[] a = new boolean[blocks.size()];
        if (names.isEmpty()) {
            java.util.Arrays.fill(a, true);
            return a;
        }
        Set<String> unknown = new LinkedHashSet<>();
        for (String n : names.stream().sorted().toList()) {
            int b = blocks.indexOf(n);
            if (b < 0) unknown.add(n); else a[b] = true;
        }
        if (!unknown.isEmpty()) {
            throw new InputException("analysed blocks", "no block named " + String.join(", ", unknown.stream()
                    .map(u -> "'" + u + "'").toList()) + "; the model has blocks: " + String.join(", ", blocks));
        }
        return a;
    }

    /** A clipped cell (or merged cells). */
    static final class Piece {
        Geometry geom;
        double area;
        final int i, j;
        boolean alive = true;
        /** Whether the piece is still the whole, unclipped cell (i, j). */
        boolean full;

        Piece(Geometry g, int i, int j, boolean full) {
            this.geom = g; this.area = g.getArea(); this.i = i; this.j = j; this.full = full;
        }
    }

    /** Clips the grid of cell size {@code s}, anchored at (0, 0), to the polygon. */
    static List<Piece> cut(Polygon poly, double s) {
        List<GridClipper.Cut> cuts = GridClipper.cut(poly, s);
        List<Piece> out = new ArrayList<>(cuts.size());
        for (GridClipper.Cut c : cuts) out.add(new Piece(c.polygon(), c.i(), c.j(), c.full()));
        return out;
    }

    /** Merges pieces below {@code minArea} into neighbours; see the class comment. */
    static List<Piece> mergeSlivers(List<Piece> pieces, double minArea) {
        boolean any = false;
        for (Piece p : pieces) any |= p.area < minArea;
        if (!any || pieces.size() < 2) return pieces;
        Map<Long, List<Piece>> byCell = new HashMap<>();
        for (Piece p : pieces) byCell.computeIfAbsent(cellKey(p.i, p.j), k -> new ArrayList<>()).add(p);
        boolean changed = true;
        while (changed) {
            changed = false;
            for (Piece p : pieces) {
                if (!p.alive || p.area >= minArea) continue;
                Piece best = null;
                double bestLen = 0;
                boolean bestBig = false;
                Geometry pb = p.geom.getBoundary();
                Envelope pe = p.geom.getEnvelopeInternal();
                Set<Piece> seen = new java.util.HashSet<>();
                for (int dj = -1; dj <= 1; dj++) {
                    for (int di = -1; di <= 1; di++) {
                        List<Piece> cands = byCell.get(cellKey(p.i + di, p.j + dj));
                        if (cands == null) continue;
                        for (Piece q : cands) {
                            if (q == p || !q.alive || !seen.add(q)) continue;
                            if (!pe.intersects(q.geom.getEnvelopeInternal())) continue;
                            double len = OverlayNGRobust.overlay(pb, q.geom.getBoundary(), OverlayNG.INTERSECTION)
                                    .getLength();
                            if (len <= 0) continue;
                            boolean big = q.area >= minArea;
                            if (best == null || (big && !bestBig) || (big == bestBig && len > bestLen)) {
                                best = q; bestLen = len; bestBig = big;
                            }
                        }
                    }
                }
                if (best == null) continue;
                best.geom = OverlayNGRobust.overlay(best.geom, p.geom, OverlayNG.UNION);
                best.area = best.geom.getArea();
                best.full = false;
                p.alive = false;
                byCell.get(cellKey(p.i, p.j)).add(best);
                changed = true;
            }
        }
        return pieces;
    }

    /**
     * Whether a piece has a polygon of positive area: a cell that clips to a line or a point (a
     * surface folded onto itself, found by GeometryFuzzTest) is no patch.
     */
    static boolean hasArea(Geometry g) {
        for (int k = 0; k < g.getNumGeometries(); k++) {
            if (g.getGeometryN(k) instanceof Polygon p && p.getArea() > 0) return true;
        }
        return false;
    }

    private static long cellKey(int i, int j) { return ((long) i << 32) ^ (j & 0xffffffffL); }

    private static Patch toPatch(int n, MassingModel model, Surface sf, Piece piece, double s) {
        SurfaceFrame f = sf.frame();
        Geometry g = piece.geom;
        Vec3 centroid;
        double[] outline;
        if (piece.full) { // whole cell: centre and corners are known
            double x0 = piece.i * s, y0 = piece.j * s;
            centroid = f.toWorld(x0 + 0.5 * s, y0 + 0.5 * s);
            outline = new double[12];
            double[][] cs = {{x0, y0}, {x0 + s, y0}, {x0 + s, y0 + s}, {x0, y0 + s}};
            for (int k = 0; k < 4; k++) {
                Vec3 w = f.toWorld(cs[k][0], cs[k][1]);
                outline[3 * k] = w.x(); outline[3 * k + 1] = w.y(); outline[3 * k + 2] = w.z();
            }
        } else {
            Coordinate c = g.getCentroid().getCoordinate();
            centroid = f.toWorld(c.x, c.y);
            Polygon largest = null;
            for (int k = 0; k < g.getNumGeometries(); k++) {
                if (g.getGeometryN(k) instanceof Polygon p && (largest == null || p.getArea() > largest.getArea())) largest = p;
            }
            outline = outline(largest.getExteriorRing().getCoordinates(), f);
        }
        String id = sf.label() + "-P" + pad4(n);
        Vec3 nrm = sf.normal();
        return new Patch(n, id, sf.block(), model.blockNames().get(sf.block()), sf.id(), sf.kind(),
                centroid, nrm, piece.area, SurfaceClassifier.tiltDeg(nrm), SurfaceClassifier.azimuthDeg(nrm), outline);
    }

    /**
     * The ring as x,y,z corners counter-clockwise seen from the front, not closed, without straight
     * (collinear) corners left where merged cells met.
     */
    static double[] outline(Coordinate[] cs, SurfaceFrame f) {
        int m = cs.length - 1;
        boolean ccw = Orientation.isCCW(cs);
        Coordinate[] ring = new Coordinate[m];
        for (int k = 0; k < m; k++) ring[k] = cs[ccw ? k : m - k];
        double size = 0;
        for (Coordinate c : ring) size = Math.max(size, Math.max(Math.abs(c.x - ring[0].x), Math.abs(c.y - ring[0].y)));
        double eps = 1e-12 * size * size;
        double[] out = new double[3 * m];
        int w = 0;
        for (int k = 0; k < m; k++) {
            Coordinate a = ring[(k + m - 1) % m], b = ring[k], c = ring[(k + 1) % m];
            double cross = (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
            double dot = (b.x - a.x) * (c.x - b.x) + (b.y - a.y) * (c.y - b.y);
            if (Math.abs(cross) <= eps && dot > 0 && m - (k - w / 3) > 3) continue;
            Vec3 p = f.toWorld(b.x, b.y);
            out[w++] = p.x(); out[w++] = p.y(); out[w++] = p.z();
        }
        return w == out.length ? out : java.util.Arrays.copyOf(out, w);
    }

    private static String pad4(int n) {
        String s = Integer.toString(n);
        return s.length() >= 4 ? s : "0000".substring(s.length()) + s;
    }
}
