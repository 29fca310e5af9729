package org.solmass.geo;

import org.locationtech.proj4j.CRSFactory;
import org.locationtech.proj4j.CoordinateReferenceSystem;
import org.locationtech.proj4j.CoordinateTransform;
import org.locationtech.proj4j.CoordinateTransformFactory;
import org.locationtech.proj4j.ProjCoordinate;
import org.solmass.InputException;

import java.util.Locale;

/**
 * A coordinate reference system named by its EPSG code, with the transforms to and from WGS84
 * longitude/latitude (proj4j, a Java port of PROJ.4 with the EPSG definitions of proj4j-epsg).
 * Not thread-safe (proj4j's transforms keep state): one instance per reader or writer.
 */
public final class Crs {
    /** EPSG code of WGS84 longitude/latitude (the CRS of RFC 7946 GeoJSON). */
    public static final int WGS84 = 4326;

    private static final CRSFactory FACTORY = new CRSFactory();
    private static final CoordinateTransformFactory TRANSFORMS = new CoordinateTransformFactory();

    private final int epsg;
    private final CoordinateReferenceSystem crs;
    private final CoordinateTransform toWgs84, fromWgs84;
    private final ProjCoordinate in = new ProjCoordinate(), out = new ProjCoordinate();

    private Crs(int epsg, CoordinateReferenceSystem crs) {
        this.epsg = epsg;
        this.crs = crs;
        CoordinateReferenceSystem wgs = FACTORY.createFromName("EPSG:" + WGS84);
        this.toWgs84 = TRANSFORMS.createTransform(crs, wgs);
        this.fromWgs84 = TRANSFORMS.createTransform(wgs, crs);
    }

    /**
     * The CRS of an EPSG code.
     *
     * @param where the file, key or flag that named it, for the message when the code is unknown
     */
    public static Crs epsg(int code, String where) {
        if (code <= 0) throw new InputException(where, "EPSG code must be a positive whole number, got " + code);
        CoordinateReferenceSystem c;
        try {
            c = FACTORY.createFromName("EPSG:" + code);
        } catch (RuntimeException e) {
            c = null;
        }
        if (c == null || c.getProjection() == null) {
            throw new InputException(where, "unknown EPSG code " + code + ": it is not in the EPSG definitions"
                    + " Solmass knows (proj4j-epsg); give the code of a projected CRS such as 32632"
                    + " (WGS 84 / UTM zone 32N) or 25832 (ETRS89 / UTM zone 32N)");
        }
        return new Crs(code, c);
    }

    /** The WGS84 UTM zone (EPSG 326zz north, 327zz south) of a longitude and latitude, degrees. */
    public static Crs utmZoneOf(double lonDeg, double latDeg) {
        int zone = (int) Math.floor((lonDeg + 180) / 6) + 1;
        zone = Math.max(1, Math.min(60, zone));
        return epsg((latDeg >= 0 ? 32600 : 32700) + zone, "UTM zone " + zone);
    }

    public int epsg() { return epsg; }

    /** "EPSG:32632". */
    public String name() { return "EPSG:" + epsg; }

    /** True for longitude/latitude systems (coordinates in degrees). */
    public boolean geographic() { return Boolean.TRUE.equals(crs.isGeographic()); }

    /**
     * Metres per unit of the projected coordinates (1 for metres, 0.3048 for feet); NaN for a
     * geographic CRS, whose coordinates are degrees.
     */
    public double metresPerUnit() {
        if (geographic()) return Double.NaN;
        double fromMetres = crs.getProjection().getFromMetres();
        return fromMetres > 0 && Double.isFinite(fromMetres) ? 1 / fromMetres : Double.NaN;
    }

    /** The proj4 definition, e.g. "+proj=utm +zone=32 +datum=WGS84 +units=m +no_defs". */
    public String definition() { return crs.getParameterString().trim(); }

    /** WGS84 {longitude, latitude}, degrees, of a point {@code x, y} in this CRS (degrees when geographic). */
    public double[] toWgs84(double x, double y) {
        in.x = x;
        in.y = y;
        toWgs84.transform(in, out);
        return new double[]{out.x, out.y};
    }

    /** This CRS's {x, y} of a WGS84 longitude and latitude, degrees. */
    public double[] fromWgs84(double lonDeg, double latDeg) {
        in.x = lonDeg;
        in.y = latDeg;
        fromWgs84.transform(in, out);
        return new double[]{out.x, out.y};
    }

    @Override public String toString() { return String.format(Locale.ROOT, "EPSG:%d (%s)", epsg, definition()); }
}
