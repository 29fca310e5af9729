package org.solmass.pv;

import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Envelope;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.geom.prep.PreparedGeometry;
import org.locationtech.jts.geom.prep.PreparedGeometryFactory;
import org.solmass.model.Vec3;
import org.solmass.surface.SurfaceFrame;

import java.util.ArrayList;
import java.util.List;

/**
 * Places modules in one PV zone (docs/pv.md "Layout").
 *
 * <p>The zone outline, in its surface's 2D frame ({@link SurfaceFrame}), is shrunk by the setback with
 * a JTS negative buffer; what is left is the area modules may cover. Modules are placed on a regular
 * grid (in the grid's own axes) and kept when the area covers them wholly. Flush modules: the grid is
 * anchored at the corner of that area's bounding box. Racked rows start at that corner across the
 * rows; along each row the modules are centred in each free run of the row ({@link #centredStarts}):
 * <ul>
 * <li>flush-mounted (pitched roofs, facades): portrait, the long side up the slope, rows touching
 *     (pitch = module length), in the surface plane;</li>
 * <li>racked (flat roofs): landscape, the long side along the row, rows across the rack azimuth at the
 *     row pitch ({@link LayoutOptions#pitchM()}); each module tilted about its low edge, which stands
 *     {@link LayoutOptions#rackClearanceM()} above the roof. The footprint depth is
 *     {@code width x cos(tilt)}.</li>
 * </ul>
 * For a rectangle this gives the floor-division count {@code floor((a - 2s) / w) x rows}, the number
 * of rows {@code floor((b - 2s - depth) / pitch) + 1}. No other search over grid offsets is made:
 * an indicative layout, not a design.
 */
public final class ModuleLayout {
    /** Modules are tested shrunk by this much on every side, so that rounding never drops one, metres. */
    static final double FIT_TOLERANCE_M = 1e-6;

    private ModuleLayout() {}

    /**
     * @param zone zone id given to the modules
     * @param zoneLocal the zone outline in the frame's local x, y (metres)
     * @param frame the surface's frame
     * @param racked racked rows (flat roof) or flush-mounted
     * @param rackAzimuthDeg azimuth racked modules face, degrees from north clockwise (ignored when flush)
     */
    public static List<PvModule> place(int zone, Geometry zoneLocal, SurfaceFrame frame, boolean racked,
                                       double rackAzimuthDeg, LayoutOptions o) {
        Geometry region = o.setbackM() > 0 ? zoneLocal.buffer(-o.setbackM()) : zoneLocal;
        List<PvModule> out = new ArrayList<>();
        if (region.isEmpty()) return out;
        ModuleSpec m = o.module();
        // grid axes in the frame: a along a row, d across rows (toward the back of racked modules)
        double ax, ay, dx, dy, along, depth, pitch;
        Vec3 a3, d3;
        double beta = Math.toRadians(o.rackTiltDeg());
        double az = Math.toRadians(rackAzimuthDeg);
        if (racked) {
            a3 = new Vec3(Math.cos(az), -Math.sin(az), 0);
            d3 = new Vec3(-Math.sin(az), -Math.cos(az), 0);
            double px = a3.dot(frame.u()), py = a3.dot(frame.v()), l = Math.hypot(px, py);
            ax = px / l;
            ay = py / l;
            double sd = Math.signum(d3.dot(frame.v()) * ax - d3.dot(frame.u()) * ay);
            dx = -ay * (sd == 0 ? 1 : sd);
            dy = ax * (sd == 0 ? 1 : sd);
            along = m.lengthM();
            depth = m.widthM() * Math.cos(beta);
            pitch = o.pitchM();
        } else {
            a3 = frame.u();
            d3 = frame.v();
            ax = 1; ay = 0; dx = 0; dy = 1;
            along = m.widthM();
            depth = m.lengthM();
            pitch = m.lengthM();
        }
        Envelope env = new Envelope();
        for (Coordinate c : region.getCoordinates()) env.expandToInclude(c.x * ax + c.y * ay, c.x * dx + c.y * dy);
        PreparedGeometry prep = PreparedGeometryFactory.prepare(region);
        GeometryFactory gf = region.getFactory();
        double e = FIT_TOLERANCE_M;
        for (double t0 = env.getMinY(); t0 + depth <= env.getMaxY() + e; t0 += pitch) {
            double[] starts = racked ? centredStarts(region, gf, env, t0, depth, along, ax, ay, dx, dy) : null;
            int k = 0;
            for (double s0 = racked ? Double.NaN : env.getMinX(); ; s0 += along) {
                if (racked) {
                    if (k == starts.length) break;
                    s0 = starts[k++];
                } else if (!(s0 + along <= env.getMaxX() + e)) {
                    break;
                }
                Polygon rect = rect(gf, s0 + e, t0 + e, s0 + along - e, t0 + depth - e, ax, ay, dx, dy);
                if (!prep.covers(rect)) continue;
                Vec3 base = frame.toWorld(s0 * ax + t0 * dx, s0 * ay + t0 * dy);
                if (racked) {
                    Vec3 up = new Vec3(Math.sin(az) * Math.sin(beta), Math.cos(az) * Math.sin(beta), Math.cos(beta));
                    Vec3 width = d3.times(Math.cos(beta)).plus(Vec3.UP.times(Math.sin(beta))).times(m.widthM());
                    out.add(new PvModule(zone, base.plus(new Vec3(0, 0, o.rackClearanceM())), a3.times(m.lengthM()),
                            width, up, true));
                } else {
                    out.add(new PvModule(zone, base, d3.times(m.lengthM()), a3.times(m.widthM()), frame.normal(), false));
                }
            }
        }
        return out;
    }

    /**
     * Where the modules of one racked row start (grid coordinate s along the row): the row's strip
     * {@code t0 .. t0 + depth} across the region's whole extent, less the s-ranges of what the region
     * leaves uncovered of it (each uncovered piece of the strip blocks its s-range: a module there
     * would stick out), gives the free runs along the row; each run holds {@code floor(run / along)}
     * modules, centred in it. For a rectangle this is the anchored grid's count with the leftover
     * split evenly between both ends.
     */
    static double[] centredStarts(Geometry region, GeometryFactory gf, Envelope env, double t0, double depth, double along,
                                  double ax, double ay, double dx, double dy) {
        double e = FIT_TOLERANCE_M, s0 = env.getMinX(), s1 = env.getMaxX();
        Polygon strip = rect(gf, s0, t0 + e, s1, t0 + depth - e, ax, ay, dx, dy);
        Geometry open = strip.difference(region);
        List<double[]> blocked = new ArrayList<>();
        for (int i = 0; i < open.getNumGeometries(); i++) {
            Geometry g = open.getGeometryN(i);
            if (g.getArea() <= e * e) continue; // a sliver where edges coincide
            double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (Coordinate c : g.getCoordinates()) {
                double sc = c.x * ax + c.y * ay;
                lo = Math.min(lo, sc);
                hi = Math.max(hi, sc);
            }
            blocked.add(new double[] {lo, hi});
        }
        blocked.sort((p, q) -> Double.compare(p[0], q[0]));
        List<Double> starts = new ArrayList<>();
        double from = s0;
        for (int i = 0; i <= blocked.size(); i++) {
            double to = i < blocked.size() ? blocked.get(i)[0] : s1;
            if (to > from) {
                int n = (int) Math.floor((to - from + e) / along);
                double first = from + 0.5 * (to - from - n * along);
                for (int j = 0; j < n; j++) starts.add(first + j * along);
            }
            if (i < blocked.size()) from = Math.max(from, blocked.get(i)[1]);
        }
        double[] out = new double[starts.size()];
        for (int i = 0; i < out.length; i++) out[i] = starts.get(i);
        return out;
    }

    private static Polygon rect(GeometryFactory gf, double s0, double t0, double s1, double t1,
                                double ax, double ay, double dx, double dy) {
        double[][] st = {{s0, t0}, {s1, t0}, {s1, t1}, {s0, t1}, {s0, t0}};
        Coordinate[] c = new Coordinate[5];
        for (int i = 0; i < 5; i++) c[i] = new Coordinate(st[i][0] * ax + st[i][1] * dx, st[i][0] * ay + st[i][1] * dy);
        return gf.createPolygon(c);
    }
}
