package org.solmass.sun;

import org.solmass.InputException;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;

/**
 * Where the study is: geographic latitude and longitude (degrees, WGS84; north and east positive),
 * elevation above sea level (metres) and the time zone whose <em>standard</em> offset defines local
 * standard time (daylight saving time is never applied).
 */
public record Site(double latitudeDeg, double longitudeDeg, double elevationM, ZoneId zone) {

    public Site {
        if (!(latitudeDeg >= -90 && latitudeDeg <= 90)) {
            throw new InputException("latitude", "must be in [-90, 90] degrees, got " + latitudeDeg);
        }
        if (!(longitudeDeg >= -180 && longitudeDeg <= 180)) {
            throw new InputException("longitude", "must be in [-180, 180] degrees, got " + longitudeDeg);
        }
        if (!(elevationM >= -500 && elevationM <= 9000)) {
            throw new InputException("elevation", "must be in [-500, 9000] m, got " + elevationM);
        }
        if (zone == null) throw new InputException("zone", "a time zone is required");
    }

    /**
     * Parses a zone: an IANA id ("Europe/Zurich"), or a fixed offset ("UTC+02:00", "+02:00", "Z").
     *
     * @param where the flag or key named in the error message
     */
    public static ZoneId parseZone(String text, String where) {
        if (text == null || text.isBlank()) throw new InputException(where, "a time zone is required (IANA id like Europe/Zurich or offset like +02:00)");
        String t = text.trim();
        try {
            if (t.startsWith("+") || t.startsWith("-") || t.equals("Z")) return ZoneOffset.of(t);
            return ZoneId.of(t);
        } catch (DateTimeException e) {
            throw new InputException(where, "unknown time zone '" + t + "' (expected an IANA id like Europe/Zurich or an offset like UTC+02:00 or +02:00)");
        }
    }

    /** The standard (non-DST) UTC offset of the zone in the given year (taken at 1 January). */
    public ZoneOffset standardOffset(int year) {
        Instant jan1 = LocalDateTime.of(year, 1, 1, 0, 0).toInstant(ZoneOffset.UTC);
        return zone.getRules().getStandardOffset(jan1);
    }

    /** Longitude of the standard meridian of the zone (degrees east), 15 degrees per hour of offset. */
    public double standardMeridianDeg(int year) {
        return standardOffset(year).getTotalSeconds() / 240.0;
    }
}
