package org.solmass.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.InputException;
import org.solmass.climate.ClimateReport;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.WeatherSeries;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintStream;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * {@code solmass climate FILE}: reads a climate file as {@code analyse} would and prints the climate
 * report (how it was read, the period, repairs, warnings, monthly and annual irradiation) without
 * running an analysis.
 */
@Command(name = "climate", mixinStandardHelpOptions = true,
        description = "Read a climate file and report how it was read: layout, separator, decimal mark, columns, units,"
                + " period, steps, repairs, warnings, and monthly and annual GHI/DHI/DNI in kWh/m2.")
public final class ClimateCommand implements Callable<Integer> {
    @Parameters(index = "0", arity = "0..1", paramLabel = "FILE", description = "the climate file (or clear-sky); the same as --climate") String file;
    @Mixin SiteOptions siteOptions = new SiteOptions();
    @Mixin ClimateOptions climateOptions = new ClimateOptions();
    @Option(names = "--format", defaultValue = "text", description = "text or json (default ${DEFAULT-VALUE})") String format;

    @Override
    public Integer call() throws Exception {
        if (!format.equals("text") && !format.equals("json")) throw new InputException("--format", "expected text or json, got '" + format + "'");
        if (file != null && climateOptions.climate != null) throw new InputException("--climate", "give the climate file once, as FILE or as --climate");
        if (file == null && climateOptions.climate == null) throw new InputException("climate", "give a climate file: solmass climate FILE --lat .. --lon .. --zone ..");
        if (file != null) climateOptions.climate = file;
        ClimateSpec spec = climateOptions.spec();
        WeatherSeries series = ClimateSource.load(siteOptions.site(null), spec);
        ClimateReport r = series.report();
        if (format.equals("json")) {
            Map<String, Object> out = new LinkedHashMap<>();
            out.put("source", series.source());
            out.put("report", r);
            System.out.println(new ObjectMapper().writerWithDefaultPrettyPrinter().writeValueAsString(out));
        } else {
            print(System.out, series.source(), r);
        }
        return 0;
    }

    static void print(PrintStream o, String source, ClimateReport r) {
        o.println("source       " + source);
        ClimateReport.Reading rd = r.reading();
        if (rd != null) {
            o.println("format       " + rd.format());
            o.println("dialect      separator " + rd.separator() + ", decimal " + rd.decimalMark() + ", " + rd.encoding()
                    + ", " + rd.lineEnd() + " line ends" + (rd.quoted() ? ", quoted cells" : ""));
            StringBuilder cols = new StringBuilder();
            rd.columns().forEach((role, header) -> cols.append(cols.length() == 0 ? "" : "; ").append(role).append(" = '").append(header).append('\'')
                    .append(rd.units().containsKey(role) ? " in " + rd.units().get(role) : ""));
            o.println("columns      " + cols);
            if (!rd.timestamps().isEmpty()) o.println("time         " + rd.timestamps());
        }
        ClimateReport.Period p = r.period();
        if (p != null) {
            o.println(String.format(Locale.ROOT, "period       %s%d steps of %s min (%s)%s", p.first().isEmpty() ? "" : p.first() + " to " + p.last() + ", ",
                    p.steps(), fmt(p.stepMinutes()), p.timeBase(), p.filledSteps() > 0 ? ", " + p.filledSteps() + " missing steps filled" : ""));
        }
        for (String x : r.repairs()) o.println("repaired     " + x);
        for (String x : r.warnings()) o.println("warning      " + x);
        o.println("irradiation, kWh/m2 (DNI on a plane facing the sun)");
        o.println(String.format(Locale.ROOT, "%-8s %9s %9s %9s", "month", "GHI", "DHI", "DNI"));
        for (ClimateReport.Totals t : r.months()) {
            o.println(String.format(Locale.ROOT, "%-8d %9.1f %9.1f %9.1f", t.month(), t.ghiKwhM2(), t.dhiKwhM2(), t.dniKwhM2()));
        }
        if (r.total() != null) {
            o.println(String.format(Locale.ROOT, "%-8s %9.1f %9.1f %9.1f", "total", r.total().ghiKwhM2(), r.total().dhiKwhM2(), r.total().dniKwhM2()));
        }
    }

    private static String fmt(double minutes) {
        return minutes == Math.rint(minutes) ? Long.toString((long) minutes) : String.format(Locale.ROOT, "%.2f", minutes);
    }
}
