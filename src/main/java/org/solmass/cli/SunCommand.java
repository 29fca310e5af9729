package org.solmass.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.InputException;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.Site;
import org.solmass.sun.SunPosition;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.time.format.DateTimeParseException;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/** {@code solmass sun}: the apparent sun position (SPA) at one instant, optionally the incidence on a plane. */
@Command(name = "sun", mixinStandardHelpOptions = true,
        description = "Sun position (NREL SPA) at an instant: zenith, azimuth (from north, clockwise), elevation; incidence on a plane.")
public final class SunCommand implements Callable<Integer> {
    @Mixin SiteOptions siteOptions = new SiteOptions();
    @Option(names = "--time", required = true, description = {"ISO-8601 instant with offset, e.g. 2003-10-17T12:30:30-07:00,",
            "or without offset as local standard time of --zone"}) String time;
    @Option(names = "--tilt", description = "plane tilt from horizontal, degrees (0..180)") Double tilt;
    @Option(names = "--surface-azimuth", description = "direction the plane faces, degrees from north clockwise") Double surfaceAzimuth;
    @Option(names = "--pressure", description = "mean pressure, mbar (default: standard atmosphere at the elevation)") Double pressure;
    @Option(names = "--temperature", description = "mean temperature, C (default: standard atmosphere at the elevation)") Double temperature;
    @Option(names = "--delta-t", description = "TT - UT, s (default: estimated from the date)") Double deltaT;
    @Option(names = "--format", defaultValue = "text", description = "text or json (default ${DEFAULT-VALUE})") String format;

    @Override
    public Integer call() throws Exception {
        ZoneId zone = siteOptions.zoneOrNull();
        ZonedDateTime t;
        try {
            t = OffsetDateTime.parse(time).toZonedDateTime();
        } catch (DateTimeParseException e) {
            try {
                t = ZonedDateTime.parse(time);
            } catch (DateTimeParseException e2) {
                t = zone == null ? null : localStandardTime(time, zone);
                if (t == null) {
                    throw new InputException("--time", "expected an ISO-8601 date-time with offset like 2003-10-17T12:30:30-07:00, got '" + time + "'"
                            + (zone == null ? "" : " (or a local standard time like 2003-10-17T12:30:30 with --zone)"));
                }
            }
        }
        if ((tilt == null) != (surfaceAzimuth == null)) throw new InputException(tilt == null ? "--tilt" : "--surface-azimuth", "--tilt and --surface-azimuth go together");
        if (tilt != null) PlaneCommand.checkPlane(tilt, surfaceAzimuth);
        if (!format.equals("text") && !format.equals("json")) throw new InputException("--format", "expected text or json, got '" + format + "'");
        Site site = siteOptions.site(t.getZone());
        SolarCalculator.Atmosphere std = SolarCalculator.Atmosphere.standard(site.elevationM());
        SolarCalculator.Atmosphere atm = new SolarCalculator.Atmosphere(pressure != null ? pressure : std.pressureMbar(),
                temperature != null ? temperature : std.temperatureC(), deltaT != null ? deltaT : Double.NaN);
        if (!(atm.pressureMbar() > 0 && atm.pressureMbar() < 1200)) throw new InputException("--pressure", "expected 0..1200 mbar");
        if (!(atm.temperatureC() > -90 && atm.temperatureC() < 70)) throw new InputException("--temperature", "expected -90..70 C");
        SunPosition p = new SolarCalculator(site, atm).at(t.toInstant());
        Map<String, Object> out = new LinkedHashMap<>();
        out.put("time", t.toOffsetDateTime().toString());
        out.put("zenith_deg", round(p.zenithDeg()));
        out.put("azimuth_deg", round(p.azimuthDeg()));
        out.put("elevation_deg", round(p.elevationDeg()));
        if (tilt != null) out.put("incidence_deg", round(p.incidenceDeg(tilt, surfaceAzimuth)));
        if (format.equals("json")) {
            System.out.println(new ObjectMapper().writerWithDefaultPrettyPrinter().writeValueAsString(out));
        } else {
            out.forEach((k, v) -> System.out.println(String.format(Locale.ROOT, "%-14s %s", k, v)));
        }
        return Main.EXIT_OK;
    }

    /** A date-time without offset read as local standard time (never daylight saving) of the zone, or null. */
    private static ZonedDateTime localStandardTime(String text, ZoneId zone) {
        try {
            LocalDateTime local = LocalDateTime.parse(text);
            ZoneOffset standard = zone.getRules().getStandardOffset(local.toInstant(ZoneOffset.UTC));
            return local.atOffset(standard).toZonedDateTime();
        } catch (DateTimeParseException e) {
            return null;
        }
    }

    private static double round(double v) { return Math.round(v * 1e6) / 1e6; }
}
