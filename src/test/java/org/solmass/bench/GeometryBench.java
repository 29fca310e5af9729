package org.solmass.bench;

import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.surface.PatchOptions;
import org.solmass.surface.PatchSet;
import org.solmass.surface.Patcher;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Wall-clock timing of OBJ import and patching on synthetic models (invented geometry, not a real
 * site). Not a unit test: run with
 * {@code java -cp target/classes:target/test-classes:<deps> org.solmass.bench.GeometryBench}.
 */
public final class GeometryBench {
    public static void main(String[] args) throws IOException {
        Path dir = Files.createTempDirectory("solmass-bench");
        Path grid = dir.resolve("grid.obj");
        Files.writeString(grid, triangleGrid(224)); // 2 x 224 x 224 = 100,352 triangles
        Path court = dir.resolve("courtyard.obj");
        Files.writeString(court, courtyardBlock());
        Path district = dir.resolve("district.obj");
        Files.writeString(district, district(8, 8));
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean)
                java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        for (int round = 0; round < 5; round++) {
            long cpu0 = os.getProcessCpuTime();
            long t0 = System.nanoTime();
            MassingModel g = ObjReader.read(grid, ModelOptions.defaults());
            long t1 = System.nanoTime();
            MassingModel c = ObjReader.read(court, ModelOptions.defaults());
            PatchSet pc = Patcher.build(c, PatchOptions.defaults());
            long t2 = System.nanoTime();
            MassingModel d = ObjReader.read(district, ModelOptions.defaults());
            PatchSet pd = Patcher.build(d, PatchOptions.defaults());
            long t3 = System.nanoTime();
            long cpu1 = os.getProcessCpuTime();
            System.out.printf(Locale.ROOT, "round %d: read %d triangles %.0f ms | courtyard %d patches %.0f ms | "
                            + "district %d surfaces %d patches %.0f ms | process CPU %.0f ms%n", round, g.triangleCount(), (t1 - t0) / 1e6,
                    pc.patchCount(), (t2 - t1) / 1e6, pd.surfaces().size(), pd.patchCount(), (t3 - t2) / 1e6, (cpu1 - cpu0) / 1e6);
        }
    }

    /** n x n grid of 1 m squares, each two triangles, shared vertices. */
    static String triangleGrid(int n) {
        StringBuilder sb = new StringBuilder();
        for (int j = 0; j <= n; j++) for (int i = 0; i <= n; i++) sb.append("v ").append(i).append(' ').append(j).append(" 0.25\n");
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                int a = j * (n + 1) + i + 1, b = a + 1, c = a + n + 2, d = a + n + 1;
                sb.append("f ").append(a).append(' ').append(b).append(' ').append(c).append('\n');
                sb.append("f ").append(a).append(' ').append(c).append(' ').append(d).append('\n');
            }
        }
        return sb.toString();
    }

    private static final class Obj {
        final StringBuilder sb = new StringBuilder();
        int nv;

        void face(double... c) {
            for (int i = 0; i < c.length; i += 3) sb.append(String.format(Locale.ROOT, "v %g %g %g%n", c[i], c[i + 1], c[i + 2]));
            sb.append('f');
            for (int i = 0; i < c.length / 3; i++) sb.append(' ').append(++nv);
            sb.append('\n');
        }
    }

    /** Invented perimeter block: 60 x 60 m, 30 x 30 m courtyard, 20 m tall, courtyard floor as ground. */
    static String courtyardBlock() {
        Obj o = new Obj();
        double a = 0, b = 60, i0 = 15, i1 = 45, h = 20;
        o.sb.append("o perimeter_block\n");
        o.face(a, a, h, b, a, h, i1, i0, h, i0, i0, h);
        o.face(b, a, h, b, b, h, i1, i1, h, i1, i0, h);
        o.face(b, b, h, a, b, h, i0, i1, h, i1, i1, h);
        o.face(a, b, h, a, a, h, i0, i0, h, i0, i1, h);
        wallsOut(o, a, a, b, b, 0, h);
        // courtyard walls face inwards
        o.face(i0, i0, 0, i0, i0, h, i1, i0, h, i1, i0, 0);
        o.face(i1, i0, 0, i1, i0, h, i1, i1, h, i1, i1, 0);
        o.face(i1, i1, 0, i1, i1, h, i0, i1, h, i0, i1, 0);
        o.face(i0, i1, 0, i0, i1, h, i0, i0, h, i0, i0, 0);
        o.sb.append("o courtyard\n");
        o.face(i0, i0, 0, i1, i0, 0, i1, i1, 0, i0, i1, 0);
        return o.sb.toString();
    }

    private static void wallsOut(Obj o, double x0, double y0, double x1, double y1, double z0, double z1) {
        o.face(x0, y0, z0, x1, y0, z0, x1, y0, z1, x0, y0, z1);
        o.face(x1, y0, z0, x1, y1, z0, x1, y1, z1, x1, y0, z1);
        o.face(x1, y1, z0, x0, y1, z0, x0, y1, z1, x1, y1, z1);
        o.face(x0, y1, z0, x0, y0, z0, x0, y0, z1, x0, y1, z1);
    }

    /** Invented district: nx x ny blocks of 20 x 20 x 15.5 m on a 30 m grid (1,640 patches each at 1 m). */
    static String district(int nx, int ny) {
        Obj o = new Obj();
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                double x = i * 30, y = j * 30, h = 15.5;
                o.sb.append("o block_").append(i).append('_').append(j).append('\n');
                o.face(x, y, h, x + 20, y, h, x + 20, y + 20, h, x, y + 20, h);
                wallsOut(o, x, y, x + 20, y + 20, 0, h);
            }
        }
        return o.sb.toString();
    }
}
