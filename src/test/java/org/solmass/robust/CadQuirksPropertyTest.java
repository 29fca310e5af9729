package org.solmass.robust;

import org.junit.jupiter.api.Test;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.scene.Scene;
import org.solmass.scene.SkyViewCalculator;
import org.solmass.scene.ViewFactors;
import org.solmass.surface.Patch;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Property (the quirks of CAD exports change the file, not the geometry, so they must not change the
 * result): random boxes and prisms, written once cleanly (faces counter-clockwise seen from outside,
 * no stray vertices) and once with a random winding per face, vertices that no face uses (far away,
 * below the ground, duplicates of used ones) and each face's corner list rotated by a random amount,
 * give the same patches (ids, areas, normals and centroids within 1e-9) and the same sky view
 * factors. Geometry invented; seeds fixed so a failure repeats.
 */
class CadQuirksPropertyTest {
    static final double TOL = 1e-9;

    /** A closed solid: vertices and faces (0-based corner lists, counter-clockwise from outside). */
    record Solid(List<double[]> vertices, List<int[]> faces) {}

    static Solid box(double x, double y, double w, double d, double h) {
        List<double[]> v = new ArrayList<>();
        for (int k = 0; k < 8; k++) v.add(new double[]{x + ((k & 1) == 0 ? 0 : w), y + ((k & 2) == 0 ? 0 : d), (k & 4) == 0 ? 0 : h});
        int[][] f = {{0, 2, 3, 1}, {4, 5, 7, 6}, {0, 1, 5, 4}, {2, 6, 7, 3}, {0, 4, 6, 2}, {1, 3, 7, 5}};
        return new Solid(v, List.of(f));
    }

    /** A right prism over a convex polygon of n corners on a circle (random angles), height h. */
    static Solid prism(SplittableRandom r, double cx, double cy, double radius, double h) {
        int n = 3 + r.nextInt(4);
        double[] a = new double[n];
        for (int i = 0; i < n; i++) a[i] = (i + r.nextDouble(0.1, 0.9)) * 2 * Math.PI / n;
        List<double[]> v = new ArrayList<>();
        for (int z = 0; z < 2; z++) for (int i = 0; i < n; i++) {
            v.add(new double[]{cx + radius * Math.cos(a[i]), cy + radius * Math.sin(a[i]), z * h});
        }
        List<int[]> f = new ArrayList<>();
        int[] bottom = new int[n], top = new int[n];
        for (int i = 0; i < n; i++) { bottom[i] = n - 1 - i; top[i] = n + i; }
        f.add(bottom);
        f.add(top);
        for (int i = 0; i < n; i++) f.add(new int[]{i, (i + 1) % n, n + (i + 1) % n, n + i});
        return new Solid(v, f);
    }

    /** Solids on a 40 m grid (one per cell, never touching), 1 to 4 blocks of 1 or 2 solids. */
    static List<List<Solid>> randomModel(SplittableRandom r) {
        List<List<Solid>> blocks = new ArrayList<>();
        int nb = 1 + r.nextInt(4), cell = 0;
        for (int b = 0; b < nb; b++) {
            List<Solid> solids = new ArrayList<>();
            for (int s = 0, ns = 1 + r.nextInt(2); s < ns; s++, cell++) {
                double ox = 40 * (cell % 3) + r.nextDouble(0, 5), oy = 40 * (cell / 3) + r.nextDouble(0, 5);
                double h = r.nextDouble(3, 30);
                solids.add(r.nextBoolean()
                        ? box(ox, oy, r.nextDouble(4, 25), r.nextDouble(4, 25), h)
                        : prism(r, ox + 15, oy + 15, r.nextDouble(4, 14), h));
            }
            blocks.add(solids);
        }
        return blocks;
    }

    /** OBJ text of the model, clean or with the quirks. */
    static String write(List<List<Solid>> blocks, SplittableRandom r, boolean quirks) {
        StringBuilder b = new StringBuilder();
        int written = 0;
        if (quirks) { b.append(stray(r, new double[]{0, 0, 0})); written++; }
        for (int k = 0; k < blocks.size(); k++) {
            b.append("o block").append(k).append('\n');
            for (Solid s : blocks.get(k)) {
                int[] index = new int[s.vertices().size()]; // 1-based OBJ index of each corner
                for (int i = 0; i < index.length; i++) {
                    double[] p = s.vertices().get(i);
                    if (quirks && r.nextInt(3) == 0) { b.append(stray(r, p)); written++; }
                    b.append(String.format(Locale.ROOT, "v %.17g %.17g %.17g%n", p[0], p[1], p[2]));
                    index[i] = ++written;
                }
                for (int[] f : s.faces()) {
                    int n = f.length;
                    int[] q = f.clone();
                    if (quirks && r.nextBoolean()) for (int i = 0; i < n / 2; i++) { int t = q[i]; q[i] = q[n - 1 - i]; q[n - 1 - i] = t; }
                    int rot = quirks ? r.nextInt(n) : 0;
                    b.append('f');
                    for (int i = 0; i < n; i++) b.append(' ').append(index[q[(i + rot) % n]]);
                    b.append('\n');
                }
            }
        }
        return b.toString();
    }

    /** A vertex no face uses: far away, below the ground, or a duplicate of a used one. */
    static String stray(SplittableRandom r, double[] near) {
        double[] p = switch (r.nextInt(3)) {
            case 0 -> new double[]{r.nextDouble(-1e6, 1e6), r.nextDouble(-1e6, 1e6), r.nextDouble(-1e3, 1e3)};
            case 1 -> new double[]{near[0], near[1], -50};
            default -> near.clone();
        };
        return String.format(Locale.ROOT, "v %.17g %.17g %.17g%n", p[0], p[1], p[2]);
    }

    record Result(PatchSet patches, ViewFactors[] views) {}

    static Result analyse(String obj) {
        MassingModel m = ObjReader.parse(obj, "p.obj", ModelOptions.defaults()).model();
        PatchSet ps = Patcher.build(m, new PatchOptions(5.0, Set.of(), false));
        Scene scene = Scene.build(m, !ps.hasGroundFaces(), ps.groundLevelZ());
        return new Result(ps, SkyViewCalculator.compute(scene, ps.patches(), 16, 7));
    }

    @Test
    void cadQuirksGiveTheSamePatchesAndSkyViewAsTheCleanFile() {
        for (long seed = 1; seed <= 6; seed++) {
            SplittableRandom r = new SplittableRandom(seed);
            List<List<Solid>> model = randomModel(r);
            String clean = write(model, r, false), quirky = write(model, r, true);
            Result a = analyse(clean), b = analyse(quirky);
            List<Patch> pa = a.patches().patches(), pb = b.patches().patches();
            assertEquals(pa.size(), pb.size(), "seed " + seed + ": patch count");
            assertTrue(pa.size() > 0);
            for (int i = 0; i < pa.size(); i++) {
                Patch x = pa.get(i), y = pb.get(i);
                String at = "seed " + seed + " patch " + x.id();
                assertEquals(x.id(), y.id(), at);
                assertEquals(x.kind(), y.kind(), at);
                assertEquals(x.areaM2(), y.areaM2(), TOL, at);
                assertEquals(x.normal().x(), y.normal().x(), TOL, at);
                assertEquals(x.normal().y(), y.normal().y(), TOL, at);
                assertEquals(x.normal().z(), y.normal().z(), TOL, at);
                assertEquals(0, x.centroid().minus(y.centroid()).length(), TOL, at);
                assertEquals(a.views()[i].sky(), b.views()[i].sky(), TOL, at + " sky view factor");
            }
            assertEquals(a.patches().groundLevelZ(), b.patches().groundLevelZ(), 0, "seed " + seed + ": ground level");
        }
    }

    @Test
    void theQuirkyFileDiffersFromTheCleanOne() {
        // the property above is not vacuous: the writer does apply the quirks
        SplittableRandom r = new SplittableRandom(3);
        List<List<Solid>> model = randomModel(r);
        String clean = write(model, r, false), quirky = write(model, r, true);
        assertNotEquals(clean, quirky);
        assertTrue(quirky.lines().filter(l -> l.startsWith("v ")).count() > clean.lines().filter(l -> l.startsWith("v ")).count());
    }
}
