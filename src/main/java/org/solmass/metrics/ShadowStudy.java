package org.solmass.metrics;

import org.solmass.model.Parallel;
import org.solmass.model.MassingModel;
import org.solmass.model.TriangleGeometry;
import org.solmass.model.Vec3;
import org.solmass.scene.BundleTracer;
import org.solmass.scene.Scene;
import org.solmass.scene.Tracer;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SunPosition;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.MonthDay;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Shadow study: which patches are in direct sun at chosen dates and times, computed with the ray
 * engine (the same occlusion query as {@link SunHoursOnDate}).
 *
 * <p><b>Shadow rule.</b> At a moment (a calendar date and a clock time in local standard time, the
 * site's standard offset without daylight saving) a patch is <em>in sun</em> when
 * <ol>
 *   <li>the sun is above the horizon: apparent (refracted) elevation &gt; 0 deg, from the NREL SPA
 *       (Reda and Andreas 2004, through {@link SolarCalculator});</li>
 *   <li>the sun is in front of the patch: {@code n . s > 0} (n its outward normal, s the unit sun
 *       direction); and</li>
 *   <li>one occlusion ray from the patch centre ({@link Scene#rayOrigin(Patch)}: the centroid moved
 *       a small epsilon along the normal) towards the sun meets nothing ({@link BundleTracer#occluded}).</li>
 * </ol>
 * A patch is all sun or all shade: shadow edges are resolved to one patch.
 *
 * <p><b>Ground.</b> The ground is the model's ground faces (their patches) and, around them, a
 * rectangle around the model sampled on a square grid ({@link #groundGrid}). Grid cells whose centre
 * lies on a ground face of the model (a short downward ray meets a ground triangle first) are left
 * out, since that face's patches stand there; so are cells whose centre lies inside a block (an
 * upward ray first meets the back of a face, i.e. leaves a solid), so the ground figures are of open
 * ground only.
 *
 * <p>Patches are computed in parallel, each into its own slot, so results do not depend on the thread
 * count.
 */
public final class ShadowStudy {
    /** Default dates: the March equinox and the two solstices (common practice for shadow diagrams). */
    public static final List<MonthDay> DEFAULT_DATES = List.of(MonthDay.of(3, 21), MonthDay.of(6, 21), MonthDay.of(12, 21));
    /** Default clock times, local standard time. */
    public static final List<LocalTime> DEFAULT_TIMES = List.of(LocalTime.of(9, 0), LocalTime.of(12, 0), LocalTime.of(15, 0));
    /** Block name of the ground rows of {@link #areas}. */
    public static final String GROUND = "ground";

    /** Reach of the probe that finds the model's own ground faces above and below a grid cell, metres. */
    static final double GROUND_PROBE_M = 0.25;

    private ShadowStudy() {}

    /** A date and a clock time, local standard time. */
    public record Moment(MonthDay date, LocalTime time) {}

    /**
     * The result at one moment.
     *
     * @param sun apparent sun position (azimuth deg from north clockwise, zenith deg)
     * @param sunlit per patch, in patch order: in sun by the shadow rule
     */
    public record Frame(Moment moment, SunPosition sun, boolean[] sunlit) {
        public boolean sunUp() { return sun.elevationDeg() > 0; }
    }

    /**
     * Sunlit area of one block (or of the ground) at one moment.
     *
     * @param name block name, or {@link #GROUND}
     * @param role "analysed", "context" or "ground"
     */
    public record Area(Moment moment, SunPosition sun, String name, String role, double areaM2, double sunlitAreaM2) {
        public double sunlitPct() { return areaM2 > 0 ? 100 * sunlitAreaM2 / areaM2 : 0; }
    }

    /** The apparent sun position at a moment of {@code year}, local standard time. */
    public static SunPosition sunAt(SolarCalculator calc, int year, Moment m) {
        LocalDateTime t = LocalDateTime.of(year, m.date().getMonth(), m.date().getDayOfMonth(), m.time().getHour(),
                m.time().getMinute(), m.time().getSecond());
        return calc.at(t.toInstant(calc.site().standardOffset(year)));
    }

    /** Every date with every time, dates first (the sheet's row order). */
    public static List<Moment> moments(List<MonthDay> dates, List<LocalTime> times) {
        List<Moment> out = new ArrayList<>();
        for (MonthDay d : dates) for (LocalTime t : times) out.add(new Moment(d, t));
        return out;
    }

    /** Applies the shadow rule to every patch at every moment. */
    public static List<Frame> compute(Scene scene, List<Patch> patches, SolarCalculator calc, int year, List<Moment> moments) {
        List<Frame> out = new ArrayList<>();
        for (Moment m : moments) {
            SunPosition sun = sunAt(calc, year, m);
            out.add(new Frame(m, sun, sunlit(scene, patches, sun)));
        }
        return out;
    }

    /** The shadow rule for one sun position: in sun per patch, in patch order. */
    public static boolean[] sunlit(Scene scene, List<Patch> patches, SunPosition sun) {
        boolean[] out = new boolean[patches.size()];
        if (!(sun.elevationDeg() > 0)) return out;
        Vec3 s = sun.direction();
        double[] dir = {s.x(), s.y(), s.z()};
        ThreadLocal<BundleTracer> tracers = ThreadLocal.withInitial(scene::bundleTracer);
        Parallel.forEach(patches.size(), p -> {
            Patch q = patches.get(p);
            if (q.normal().dot(s) <= 0) return;
            double[] o = new double[3];
            scene.rayOrigin(q, o);
            boolean[] blocked = new boolean[1];
            tracers.get().occluded(o[0], o[1], o[2], dir, null, 1, blocked);
            out[p] = !blocked[0];
        });
        return out;
    }

    /**
     * A ground rectangle sampled on a square grid: cells of {@code cellM} from (x0, y0) to at least
     * (x1, y1) at height {@code z}, facing up, kind {@link SurfaceKind#GROUND}, block -1 named
     * {@link #GROUND}, ids {@code G-P<row>-<column>}, indices from {@code firstIndex}. Cells whose centre
     * lies on a ground face of the model or inside a block are left out (see the class comment).
     *
     * @param groundTriangle per model triangle: part of a ground face (null: none is)
     */
    public static List<Patch> groundGrid(Scene scene, MassingModel model, boolean[] groundTriangle, double x0, double y0,
                                         double x1, double y1, double z, double cellM, int firstIndex) {
        if (!(cellM > 0)) throw new IllegalArgumentException("cell size must be positive: " + cellM);
        int nx = (int) Math.ceil((x1 - x0) / cellM - 1e-9), ny = (int) Math.ceil((y1 - y0) / cellM - 1e-9);
        Tracer tr = scene.tracer();
        double[] n = new double[3];
        List<Patch> out = new ArrayList<>();
        Vec3 up = new Vec3(0, 0, 1);
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                double ax = x0 + i * cellM, ay = y0 + j * cellM, bx = ax + cellM, by = ay + cellM;
                double cx = (ax + bx) / 2, cy = (ay + by) / 2;
                if (groundTriangle != null) {   // on the model's own ground: from 0.25 m above, down to 0.25 m below
                    int below = tr.closestHit(cx, cy, z + GROUND_PROBE_M, 0, 0, -1, 2 * GROUND_PROBE_M);
                    if (below >= 0 && groundTriangle[below]) continue;
                }
                int hit = tr.closestHit(cx, cy, z + scene.epsilon(), 0, 0, 1, Double.POSITIVE_INFINITY);
                if (hit >= 0 && TriangleGeometry.unitNormal(model.vertices(), model.triangles(), hit, n) && n[2] > 0) continue;
                double[] outline = {ax, ay, z, bx, ay, z, bx, by, z, ax, by, z};
                out.add(new Patch(firstIndex + out.size(), String.format(java.util.Locale.ROOT, "G-P%04d-%04d", j, i), -1, GROUND,
                        -1, SurfaceKind.GROUND, new Vec3(cx, cy, z), up, cellM * cellM, 0, 0, outline));
            }
        }
        return out;
    }

    /**
     * A patch's role in the study: {@value #GROUND} for a patch of kind GROUND (the grid's cells and the
     * model's own ground faces), else "analysed" or "context" by its block.
     *
     * @param analysedBlock per block id: analysed (else context)
     */
    public static String role(Patch p, boolean[] analysedBlock) {
        if (p.kind() == SurfaceKind.GROUND) return GROUND;
        return analysedBlock[p.block()] ? "analysed" : "context";
    }

    /**
     * Area and sunlit area per block and of the ground, per moment: a patch of kind GROUND counts to the
     * ground, every other patch to its block. Blocks in order of first appearance, the ground last.
     *
     * @param analysedBlock per block id: analysed (else context)
     */
    public static List<Area> areas(List<Patch> patches, List<Frame> frames, boolean[] analysedBlock) {
        Map<String, String> roles = new LinkedHashMap<>();
        for (Patch p : patches) {
            if (p.kind() != SurfaceKind.GROUND) roles.putIfAbsent(p.blockName(), role(p, analysedBlock));
        }
        roles.put(GROUND, GROUND);
        List<String> names = new ArrayList<>(roles.keySet());
        List<Area> out = new ArrayList<>();
        for (Frame f : frames) {
            Map<String, double[]> sums = new LinkedHashMap<>();
            for (String name : names) sums.put(name, new double[2]);
            for (int i = 0; i < patches.size(); i++) {
                Patch p = patches.get(i);
                double[] s = sums.get(p.kind() == SurfaceKind.GROUND ? GROUND : p.blockName());
                s[0] += p.areaM2();
                if (f.sunlit()[i]) s[1] += p.areaM2();
            }
            for (String name : names) {
                double[] s = sums.get(name);
                out.add(new Area(f.moment(), f.sun(), name, roles.get(name), s[0], s[1]));
            }
        }
        return out;
    }
}
