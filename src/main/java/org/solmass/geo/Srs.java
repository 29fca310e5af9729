package org.solmass.geo;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * EPSG codes from the ways files name a CRS: "EPSG:25832", "urn:ogc:def:crs:EPSG::25832",
 * "urn:ogc:def:crs:EPSG:6.12:25832", "http://www.opengis.net/def/crs/EPSG/0/25832", a compound
 * "urn:ogc:def:crs,crs:EPSG::25832,crs:EPSG::7837" (its first, horizontal, part) and the OGC names
 * of WGS84 longitude/latitude ("urn:ogc:def:crs:OGC:1.3:CRS84", "CRS84").
 */
final class Srs {
    private static final Pattern EPSG = Pattern.compile("EPSG(?:/0/|:[0-9.]*:|:)(\\d+)", Pattern.CASE_INSENSITIVE);

    private Srs() {}

    /** The EPSG code a CRS name gives, or 0 when it names no EPSG code (a local or national name). */
    static int epsgOf(String srsName) {
        if (srsName == null) return 0;
        String s = srsName.trim();
        if (s.toUpperCase(Locale.ROOT).endsWith("CRS84")) return Crs.WGS84;
        Matcher m = EPSG.matcher(s);
        if (!m.find()) return 0;
        try {
            return Integer.parseInt(m.group(1));
        } catch (NumberFormatException e) {
            return 0;
        }
    }
}
