package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.study.StudyOverrides;
import org.solmass.sun.Site;
import picocli.CommandLine.Option;

import java.time.ZoneId;
import java.util.Map;

/**
 * The site flags, the same on every command that needs a site ({@code analyse}, {@code plane},
 * {@code sun}): {@code --lat}, {@code --lon}, {@code --elevation}, {@code --zone}. None is required by
 * picocli, since {@code analyse} can take them from a study file; {@link #site} names a missing one.
 */
public final class SiteOptions {
    @Option(names = "--lat", paramLabel = "DEG", description = "site latitude, degrees north (-90..90)") Double lat;
    @Option(names = "--lon", paramLabel = "DEG", description = "site longitude, degrees east (-180..180)") Double lon;
    @Option(names = "--elevation", paramLabel = "M", description = "site elevation above sea level, metres (default 0)") Double elevation;
    @Option(names = "--zone", paramLabel = "ZONE", description = "time zone of local standard time: IANA name (Europe/Berlin) or UTC offset (+01:00)") String zone;

    /** The flags as study keys (site.*). */
    StudyOverrides applyTo(StudyOverrides ov) {
        return ov.latitude(lat).longitude(lon).elevationM(elevation).zone(zone);
    }

    /** The zone flag parsed, or null when it was not given. */
    ZoneId zoneOrNull() {
        return zone == null ? null : Site.parseZone(zone, "--zone");
    }

    /**
     * The site from the flags alone.
     *
     * @param zoneIfAbsent the zone to use without {@code --zone}; null makes {@code --zone} required
     * @throws InputException naming the flag that is missing or out of range
     */
    Site site(ZoneId zoneIfAbsent) {
        if (lat == null) throw new InputException("--lat", "missing; a latitude in degrees north (-90..90) is required");
        if (lon == null) throw new InputException("--lon", "missing; a longitude in degrees east (-180..180) is required");
        ZoneId z = zone != null ? zoneOrNull() : zoneIfAbsent;
        if (z == null) throw new InputException("--zone", "missing; a time zone is required (IANA id like Europe/Zurich or offset like +02:00)");
        try {
            return new Site(lat, lon, elevation == null ? 0 : elevation, z);
        } catch (InputException e) {
            String flag = Map.of("latitude", "--lat", "longitude", "--lon", "elevation", "--elevation", "zone", "--zone")
                    .getOrDefault(e.where(), e.where());
            throw new InputException(flag, e.getMessage().substring(e.where().length() + 2), e);
        }
    }
}
