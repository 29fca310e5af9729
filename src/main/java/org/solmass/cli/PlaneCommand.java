package org.solmass.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.InputException;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.PlaneIrradiation;
import org.solmass.sky.PreparedSky;
import org.solmass.sky.SkyModel;
import org.solmass.sun.Site;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/** {@code solmass plane}: monthly and annual irradiation of one unobstructed plane, by component. */
@Command(name = "plane", mixinStandardHelpOptions = true,
        description = "Irradiation (kWh/m2) of an unobstructed plane by month and component: beam, sky diffuse, ground-reflected.")
public final class PlaneCommand implements Callable<Integer> {
    @Option(names = "--lat", required = true, description = "latitude, degrees north (-90..90)") double lat;
    @Option(names = "--lon", required = true, description = "longitude, degrees east (-180..180)") double lon;
    @Option(names = "--zone", required = true, description = "time zone of local standard time: IANA id (Europe/Zurich) or offset (+01:00)") String zone;
    @Option(names = "--elevation", defaultValue = "0", description = "site elevation, m (default ${DEFAULT-VALUE})") double elevation;
    @Option(names = "--tilt", required = true, description = "plane tilt from horizontal, degrees (0..180)") double tilt;
    @Option(names = "--surface-azimuth", required = true, description = "direction the plane faces, degrees from north clockwise") double surfaceAzimuth;
    @Option(names = "--albedo", defaultValue = "0.2", description = "ground reflectance 0..1 (default ${DEFAULT-VALUE})") double albedo;
    @Option(names = "--sky", defaultValue = "perez", description = "isotropic or perez (default ${DEFAULT-VALUE})") String sky;
    @Option(names = "--climate", defaultValue = "clear-sky", description = "clear-sky or a climate CSV file (docs/climate-formats.md)") String climate;
    @Option(names = "--climate-format", defaultValue = "auto", description = "auto, month-hour, monthly-means or hourly (default ${DEFAULT-VALUE})") String climateFormat;
    @Option(names = "--time-base", defaultValue = "average-days", description = "clear sky only: average-days or hourly-year (default ${DEFAULT-VALUE})") String timeBase;
    @Option(names = "--year", defaultValue = "2025", description = "clear-sky hourly-year: calendar year (default ${DEFAULT-VALUE})") int year;
    @Option(names = "--step-minutes", defaultValue = "60", description = "generated steps (clear sky, monthly means), divides 60 (default ${DEFAULT-VALUE})") int stepMinutes;
    @Option(names = "--interval-label", defaultValue = "start", description = "hourly files: timestamps label the interval start or end (default ${DEFAULT-VALUE})") String intervalLabel;
    @Option(names = "--columns", description = "hourly files: role=header or role=column number, e.g. time=1,ghi=GlobHor,dhi=4") String columns;
    @Option(names = "--fill-gaps", defaultValue = "0", description = "hourly files: fill gaps up to N steps by linear interpolation (default ${DEFAULT-VALUE}: never)") int fillGaps;
    @Option(names = "--format", defaultValue = "text", description = "text, json or csv (default ${DEFAULT-VALUE})") String format;

    static void checkPlane(double tiltDeg, double azDeg) {
        if (!(tiltDeg >= 0 && tiltDeg <= 180)) throw new InputException("--tilt", "expected 0..180 degrees, got " + tiltDeg);
        if (!(azDeg >= -360 && azDeg <= 360)) throw new InputException("--surface-azimuth", "expected degrees from north, -360..360, got " + azDeg);
    }

    @Override
    public Integer call() throws Exception {
        checkPlane(tilt, surfaceAzimuth);
        if (!(albedo >= 0 && albedo <= 1)) throw new InputException("--albedo", "expected 0..1, got " + albedo);
        if (!format.equals("text") && !format.equals("json") && !format.equals("csv")) throw new InputException("--format", "expected text, json or csv, got '" + format + "'");
        SkyModel model = SkyModel.parse(sky, "--sky");
        Site site = PlaneCommand.site(lat, lon, elevation, Site.parseZone(zone, "--zone"));
        ClimateSpec spec = ClimateSpec.parse(climate)
                .withFormat(ClimateSpec.Format.parse(climateFormat, "--climate-format"))
                .withStepMinutes(stepMinutes)
                .withIntervalLabel(ClimateSpec.IntervalLabel.parse(intervalLabel, "--interval-label"))
                .withColumns(ClimateSpec.parseColumns(columns, "--columns"))
                .withFillGaps(checkFill(fillGaps));
        if (spec.kind() == ClimateSpec.Kind.FILE && !java.nio.file.Files.isRegularFile(spec.file())) {
            throw new InputException("--climate", "no such file '" + climate + "' (expected clear-sky or a climate CSV file)");
        }
        if (spec.kind() == ClimateSpec.Kind.FILE && !timeBase.equals("average-days")) {
            throw new InputException("--time-base", "applies to --climate clear-sky only (a file's format sets its time base)");
        }
        if (spec.kind() == ClimateSpec.Kind.CLEAR_SKY) {
            switch (timeBase) {
                case "average-days": break;
                case "hourly-year": spec = spec.withTimeBase(TimeBase.HOURLY_YEAR).withYear(year); break;
                default: throw new InputException("--time-base", "expected average-days or hourly-year, got '" + timeBase + "'");
            }
        }
        WeatherSeries series = ClimateSource.load(site, spec);
        PlaneIrradiation r = PreparedSky.of(series, model).sum(tilt, surfaceAzimuth, albedo);
        String[] names = PlaneIrradiation.columnNames();
        double[] values = r.columnValues();
        if (!format.equals("json")) {
            series.report().repairs().forEach(x -> System.err.println("solmass: repaired: " + x));
            series.report().warnings().forEach(x -> System.err.println("solmass: warning: " + x));
        }
        switch (format) {
            case "csv":
                System.out.println(String.join(",", names));
                StringBuilder row = new StringBuilder();
                for (int i = 0; i < values.length; i++) row.append(i == 0 ? "" : ",").append(fmt(values[i]));
                System.out.println(row);
                break;
            case "json":
                Map<String, Object> out = new LinkedHashMap<>();
                out.put("latitude_deg", lat); out.put("longitude_deg", lon); out.put("zone", site.zone().getId());
                out.put("tilt_deg", tilt); out.put("surface_azimuth_deg", surfaceAzimuth); out.put("albedo", albedo);
                out.put("sky", model.name()); out.put("climate", series.source()); out.put("time_base", series.timeBase().label());
                for (int i = 0; i < values.length; i++) out.put(names[i], Math.round(values[i] * 1000) / 1000.0);
                out.put("repairs", series.report().repairs());
                out.put("warnings", series.report().warnings());
                System.out.println(new ObjectMapper().writerWithDefaultPrettyPrinter().writeValueAsString(out));
                break;
            default:
                System.out.println("plane: tilt " + tilt + " deg, facing " + surfaceAzimuth + " deg from north, albedo " + albedo + ", sky " + model.name());
                System.out.println("climate: " + series.source() + " (" + series.timeBase().label() + ")");
                System.out.println(String.format(Locale.ROOT, "%-6s %10s %10s %10s %10s", "month", "total", "beam", "diffuse", "reflected"));
                String[] mon = {"Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
                for (int m = 0; m < 12; m++) {
                    System.out.println(String.format(Locale.ROOT, "%-6s %10.2f %10.2f %10.2f %10.2f", mon[m], r.monthlyKwhM2()[m],
                            r.monthlyBeamKwhM2()[m], r.monthlyDiffuseKwhM2()[m], r.monthlyReflectedKwhM2()[m]));
                }
                System.out.println(String.format(Locale.ROOT, "%-6s %10.2f %10.2f %10.2f %10.2f   kWh/m2", "year", r.annualKwhM2(),
                        r.beamKwhM2(), r.diffuseKwhM2(), r.reflectedKwhM2()));
        }
        return Main.EXIT_OK;
    }

    /** A site, with errors naming the command-line flag of the field. */
    static Site site(double lat, double lon, double elevation, java.time.ZoneId zone) {
        try {
            return new Site(lat, lon, elevation, zone);
        } catch (InputException e) {
            String flag = Map.of("latitude", "--lat", "longitude", "--lon", "elevation", "--elevation", "zone", "--zone").getOrDefault(e.where(), e.where());
            throw new InputException(flag, e.getMessage().substring(e.where().length() + 2), e);
        }
    }

    private static int checkFill(int n) {
        if (n < 0) throw new InputException("--fill-gaps", "expected a number of steps >= 0, got " + n);
        return n;
    }

    private static String fmt(double v) { return String.format(Locale.ROOT, "%.3f", v); }
}
