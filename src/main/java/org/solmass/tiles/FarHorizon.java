package org.solmass.tiles;

import org.solmass.scene.HorizonProfile;

/**
 * The far horizon of a tile: the blocks beyond its halo, taken from the {@link HeightRaster}, as an
 * elevation angle per azimuth. A raster cell of height H seen from a point at height z at horizontal
 * distance d rises {@code atan((H - z) / d)} above the horizontal (plain trigonometry, earth
 * curvature neglected: at 2 km it lowers a point by 0.3 m, common practice for urban horizons).
 *
 * <p>The profile is the same for every receiver of a height band of the tile (as
 * {@link HorizonProfile} is for a scene; the bands are {@link Tile#band}). Two rules:
 * <ul>
 * <li>best estimate (the default, {@link CityOptions#conservativeHorizon()} false): seen from the
 * centre of the tile's receiver box at the middle height of the band, d to the cell's centre, the
 * samples inside the cell's azimuth range raised;</li>
 * <li>conservative (a bound, never lower than the blocks it stands for): the maximum over five
 * viewpoints, the four corners and the centre of the receiver box, from the band's floor; d from a
 * viewpoint to the nearest point of the cell; every sample from the one at or before the cell's
 * azimuth range to the one at or after it raised, so the linear interpolation of
 * {@link HorizonProfile} between samples stays at or above it.</li>
 * </ul>
 * Measured (FarHorizonErrorTest): the bound over-obstructs where the halo is not much larger than the
 * tile, by more than the missing blocks would; the estimate cut the facade sky view factor error of a
 * 40 to 50 m halo by a factor 2.5 to 6.
 *
 * <p>Only cells lying wholly beyond the halo count: the halo's blocks are in the tile's scene. A
 * block that straddles the halo's edge is partly geometry and partly horizon.
 */
public final class FarHorizon {
    private FarHorizon() {}

    /**
     * Elevation per azimuth {@code i 360 / azimuths}, degrees (all 0 when nothing rises), by the
     * conservative rule.
     *
     * @param box the tile's receiver box {x0, y0, x1, y1}, metres
     * @param haloM the halo radius: cells whose nearest point lies within this of the box are left out
     * @param eyeZ the height the horizon is seen from, metres
     */
    public static double[] elevationsDeg(HeightRaster raster, double[] box, double haloM, double eyeZ, int azimuths) {
        return elevationsDeg(raster, box, haloM, eyeZ, azimuths, true);
    }

    /**
     * As {@link #elevationsDeg(HeightRaster, double[], double, double, int)}; with {@code conservative}
     * false a best estimate instead of a bound: seen from the box's centre only, d to the cell's
     * centre, and only the samples inside the cell's azimuth range raised (the nearest one when none is).
     */
    public static double[] elevationsDeg(HeightRaster raster, double[] box, double haloM, double eyeZ, int azimuths,
                                         boolean conservative) {
        double[] out = new double[azimuths];
        double step = 360.0 / azimuths;
        double[][] eyes = conservative ? new double[][] {{box[0], box[1]}, {box[2], box[1]}, {box[0], box[3]}, {box[2], box[3]},
                {(box[0] + box[2]) / 2, (box[1] + box[3]) / 2}} : new double[][] {{(box[0] + box[2]) / 2, (box[1] + box[3]) / 2}};
        double c = raster.cellM;
        for (int j = 0; j < raster.ny; j++) {
            for (int i = 0; i < raster.nx; i++) {
                double h = raster.maxZ[j * raster.nx + i] - eyeZ;
                if (!(h > 0)) continue;
                double cx0 = raster.x0 + i * c, cy0 = raster.y0 + j * c, cx1 = cx0 + c, cy1 = cy0 + c;
                if (rectDistance(box, cx0, cy0, cx1, cy1) <= haloM) continue;
                for (double[] e : eyes) {
                    double d;
                    if (conservative) {
                        double dx = Math.max(0, Math.max(cx0 - e[0], e[0] - cx1)), dy = Math.max(0, Math.max(cy0 - e[1], e[1] - cy1));
                        d = Math.hypot(dx, dy);
                    } else {
                        d = Math.hypot((cx0 + cx1) / 2 - e[0], (cy0 + cy1) / 2 - e[1]);
                    }
                    double elev = Math.toDegrees(Math.atan2(h, d));
                    raise(out, step, e[0], e[1], cx0, cy0, cx1, cy1, elev, conservative);
                }
            }
        }
        for (int k = 0; k < azimuths; k++) out[k] = Math.min(out[k], 89.999);
        return out;
    }

    /** The profile of {@link #elevationsDeg}, or {@link HorizonProfile#NONE} when nothing rises. */
    public static HorizonProfile profile(HeightRaster raster, double[] box, double haloM, double eyeZ, int azimuths) {
        double[] e = elevationsDeg(raster, box, haloM, eyeZ, azimuths);
        HorizonProfile p = new HorizonProfile(e);
        return p.isNone() ? HorizonProfile.NONE : p;
    }

    /**
     * The higher of two horizons at the samples of {@code a} (the terrain horizon of a site composes
     * with a tile's far horizon this way); {@code b} is read by {@link HorizonProfile#elevationDegAt}.
     */
    public static HorizonProfile max(HorizonProfile a, HorizonProfile b) {
        if (b == null || b.isNone()) return a;
        if (a == null || a.isNone()) return b;
        HorizonProfile fine = a.size() >= b.size() ? a : b, other = fine == a ? b : a;
        double[] e = fine.elevationsDeg();
        for (int k = 0; k < e.length; k++) e[k] = Math.max(e[k], other.elevationDegAt(k * 360.0 / e.length));
        return new HorizonProfile(e);
    }

    /** Shortest distance between rectangle {x0, y0, x1, y1} and the cell, metres (0 when they touch). */
    static double rectDistance(double[] box, double cx0, double cy0, double cx1, double cy1) {
        double dx = Math.max(0, Math.max(cx0 - box[2], box[0] - cx1)), dy = Math.max(0, Math.max(cy0 - box[3], box[1] - cy1));
        return Math.hypot(dx, dy);
    }

    /** Raises the samples covering the cell's azimuth range seen from (ex, ey), and the next sample out on each side. */
    private static void raise(double[] out, double step, double ex, double ey, double cx0, double cy0, double cx1, double cy1,
                              double elev, boolean widen) {
        double mid = azimuth((cx0 + cx1) / 2 - ex, (cy0 + cy1) / 2 - ey), half = 0;
        double[][] corners = {{cx0, cy0}, {cx1, cy0}, {cx0, cy1}, {cx1, cy1}};
        for (double[] k : corners) {
            double a = azimuth(k[0] - ex, k[1] - ey), d = Math.abs(((a - mid) % 360 + 540) % 360 - 180);
            half = Math.max(half, d);
        }
        int n = out.length;
        int from, to;
        if (widen) {
            from = (int) Math.floor((mid - half) / step);
            to = (int) Math.ceil((mid + half) / step);
        } else {
            from = (int) Math.ceil((mid - half) / step);
            to = (int) Math.floor((mid + half) / step);
            if (from > to) from = to = (int) Math.round(mid / step);
        }
        if (to - from >= n) { from = 0; to = n - 1; }
        for (int k = from; k <= to; k++) {
            int s = Math.floorMod(k, n);
            out[s] = Math.max(out[s], elev);
        }
    }

    /** Azimuth of a horizontal direction, degrees from north clockwise, in [0, 360). */
    static double azimuth(double dx, double dy) {
        double a = Math.toDegrees(Math.atan2(dx, dy));
        return a < 0 ? a + 360 : a;
    }
}
