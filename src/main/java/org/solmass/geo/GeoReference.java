package org.solmass.geo;

import java.util.Locale;

/**
 * How a geo-referenced model sits in its coordinate reference system: the file's CRS, the projected
 * CRS in metres the model is built in, the local origin and the north angle. A reader turns every
 * file coordinate into the Solmass frame with {@link #toLocal}; a writer turns a Solmass point back
 * with {@link #toFile} (the file's CRS) or {@link #toWgs84}; another input in its own CRS (a terrain
 * model) comes in with {@link #toLocal(Crs, double, double, double)}.
 *
 * <p>The Solmass frame: {@code (x, y)} = the working CRS's easting and northing minus the origin,
 * rotated anticlockwise by {@link #northDeg()} about the origin (as {@code model.ModelOptions}
 * rotates an OBJ model), so that +y is true north at the origin; {@code z} = the file's height in
 * metres, unshifted. The origin is the centre of the model's bounding box rounded to whole metres:
 * every coordinate the stages keep is then within the model's half-extent of zero, so doubles keep
 * far below a millimetre and the ray engine's floats (relative to the box centre) as well as they do
 * for an OBJ model.
 *
 * <p>North angle: the meridian convergence. Grid north (+northing) and true north (the meridian)
 * differ by the convergence gamma; {@code northDeg} is the clockwise angle from grid north to true
 * north, found from the CRS itself as the direction of the meridian at the origin: the central
 * difference of the projected points 1e-4 degrees of latitude north and south of it, so any
 * projection works. For Transverse Mercator it equals minus the convergence gamma of Snyder (1987),
 * Map Projections: A Working Manual, USGS Professional Paper 1395, p. 61, which is positive east of
 * the central meridian in the northern hemisphere (there true north lies anticlockwise of grid north).
 *
 * <p>Not thread-safe (its {@link Crs} transforms keep state).
 *
 * @param file the CRS of the file's coordinates
 * @param work the projected CRS in metres the model is built in: the file's CRS when that is
 *             projected in metres, else the WGS84 UTM zone of the model's centre
 * @param originX easting of the Solmass origin in {@code work}, metres (a whole number)
 * @param originY northing of the Solmass origin in {@code work}, metres (a whole number)
 * @param zMetresPerUnit metres per unit of the file's heights (1 for a geographic CRS, whose heights are metres)
 * @param northDeg clockwise angle from grid north of {@code work} to true north at the origin, degrees
 * @param latitudeDeg WGS84 latitude of the origin, degrees north
 * @param longitudeDeg WGS84 longitude of the origin, degrees east
 */
public record GeoReference(Crs file, Crs work, double originX, double originY, double zMetresPerUnit,
                           double northDeg, double latitudeDeg, double longitudeDeg) {

    /** Step of the central difference for the meridian's direction, degrees of latitude (about 11 m). */
    static final double MERIDIAN_STEP_DEG = 1e-4;

    /**
     * The reference of a model whose file coordinates span the box {@code minX..maxX, minY..maxY}
     * (in {@code file}'s units: degrees for a geographic CRS).
     */
    public static GeoReference around(Crs file, double minX, double minY, double maxX, double maxY) {
        double cx = 0.5 * (minX + maxX), cy = 0.5 * (minY + maxY);
        Crs work;
        double ox, oy;
        if (!file.geographic() && file.metresPerUnit() == 1.0) {
            work = file;
            ox = Math.rint(cx);
            oy = Math.rint(cy);
        } else {
            double[] ll = file.toWgs84(cx, cy);
            work = Crs.utmZoneOf(ll[0], ll[1]);
            double[] p = work.fromWgs84(ll[0], ll[1]);
            ox = Math.rint(p[0]);
            oy = Math.rint(p[1]);
        }
        double[] ll = work.toWgs84(ox, oy);
        double zScale = file.geographic() ? 1.0 : file.metresPerUnit();
        return new GeoReference(file, work, ox, oy, zScale, meridianDirectionDeg(work, ll[0], ll[1]), ll[1], ll[0]);
    }

    /**
     * Clockwise angle from grid north of a projected CRS to the meridian (true north) at a point,
     * degrees, by the central difference of the projected points {@link #MERIDIAN_STEP_DEG} north
     * and south of it.
     */
    public static double meridianDirectionDeg(Crs crs, double lonDeg, double latDeg) {
        double[] n = crs.fromWgs84(lonDeg, latDeg + MERIDIAN_STEP_DEG);
        double[] s = crs.fromWgs84(lonDeg, latDeg - MERIDIAN_STEP_DEG);
        return Math.toDegrees(Math.atan2(n[0] - s[0], n[1] - s[1]));
    }

    /** The Solmass point (x, y, z; metres, true north = +y) of a file coordinate. */
    public double[] toLocal(double fx, double fy, double fz) {
        return toLocal(file, fx, fy, fz * zMetresPerUnit);
    }

    /**
     * The Solmass point of a coordinate in another CRS, e.g. a terrain model's cell centre: through
     * WGS84 into the working CRS unless it is the working CRS, then as {@link #toLocal}; {@code z}
     * metres.
     */
    public double[] toLocal(Crs crs, double x, double y, double z) {
        double ex = x, ny = y;
        if (crs.epsg() != work.epsg()) {
            double[] ll = crs.toWgs84(x, y);
            double[] p = work.fromWgs84(ll[0], ll[1]);
            ex = p[0];
            ny = p[1];
        }
        double dx = ex - originX, dy = ny - originY;
        double a = Math.toRadians(northDeg), c = Math.cos(a), s = Math.sin(a);
        return new double[]{dx * c - dy * s, dx * s + dy * c, z};
    }

    /** The working CRS's easting, northing and height (metres) of a Solmass point. */
    public double[] toWork(double x, double y, double z) {
        double a = Math.toRadians(northDeg), c = Math.cos(a), s = Math.sin(a);
        return new double[]{originX + x * c + y * s, originY - x * s + y * c, z};
    }

    /** The file's coordinate (its CRS and units) of a Solmass point. */
    public double[] toFile(double x, double y, double z) {
        double[] w = toWork(x, y, z);
        if (work == file) return new double[]{w[0], w[1], z / zMetresPerUnit};
        double[] ll = work.toWgs84(w[0], w[1]);
        double[] f = file.fromWgs84(ll[0], ll[1]);
        return new double[]{f[0], f[1], z / zMetresPerUnit};
    }

    /** WGS84 longitude, latitude (degrees) and height (metres) of a Solmass point. */
    public double[] toWgs84(double x, double y, double z) {
        double[] w = toWork(x, y, z);
        double[] ll = work.toWgs84(w[0], w[1]);
        return new double[]{ll[0], ll[1], z};
    }

    /** One line for the terminal and summary.json. */
    public String describe() {
        return String.format(Locale.ROOT, "%s; built in %s with its origin at (%.0f, %.0f) m; centre %.6f N %.6f E;"
                        + " true north %.4f deg clockwise of grid north", file.name(),
                work == file ? "the same CRS" : work.name(), originX, originY, latitudeDeg, longitudeDeg, northDeg);
    }
}
