package org.solmass.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.InputException;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.TimeBaseChoice;
import org.solmass.climate.WeatherSeries;
import org.solmass.sky.PlaneIrradiation;
import org.solmass.sky.PreparedSky;
import org.solmass.sky.SkyModel;
import org.solmass.sun.Site;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/** {@code solmass plane}: monthly and annual irradiation of one unobstructed plane, by component. */
@Command(name = "plane", mixinStandardHelpOptions = true,
        description = "Irradiation (kWh/m2) of an unobstructed plane by month and component: beam, sky diffuse, ground-reflected.")
public final class PlaneCommand implements Callable<Integer> {
    @Mixin SiteOptions siteOptions = new SiteOptions();
    @Option(names = "--tilt", required = true, description = "plane tilt from horizontal, degrees (0..180)") double tilt;
    @Option(names = "--surface-azimuth", required = true, description = "direction the plane faces, degrees from north clockwise") double surfaceAzimuth;
    @Option(names = "--albedo", defaultValue = "0.2", description = "ground reflectance 0..1 (default ${DEFAULT-VALUE})") double albedo;
    @Mixin SkyFlag sky = new SkyFlag();
    @Mixin ClimateOptions climateOptions = new ClimateOptions();
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
        SkyModel model = sky.model();
        Site site = siteOptions.site(null);
        TimeBaseChoice base = climateOptions.timeBaseChoice();
        WeatherSeries series = ClimateSource.load(site, climateOptions.spec());
        if (base != TimeBaseChoice.AUTO && series.timeBase() != base.forClearSky()) {
            throw new InputException("--time-base", "the climate source " + series.source() + " gives "
                    + series.timeBase().label() + ", not " + base.label());
        }
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
                out.put("latitude_deg", site.latitudeDeg()); out.put("longitude_deg", site.longitudeDeg()); out.put("zone", site.zone().getId());
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

    private static String fmt(double v) { return String.format(Locale.ROOT, "%.3f", v); }
}
