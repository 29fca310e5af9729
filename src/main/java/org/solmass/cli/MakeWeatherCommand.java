package org.solmass.cli;

import org.solmass.climate.DemoWeather;
import org.solmass.output.AtomicFiles;
import org.solmass.sun.Site;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

/** {@code solmass make-weather}: an invented demo weather year (and its month-hour table) for a site. */
@Command(name = "make-weather", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Writes an INVENTED demo weather year (never for a real design).",
                "The site's clear sky dimmed by a seeded random cloud cover; not measured data."})
public final class MakeWeatherCommand implements Callable<Integer> {
    @Mixin SiteOptions siteOptions = new SiteOptions();
    @Option(names = "--year", defaultValue = "2025", paramLabel = "YEAR", description = "calendar year (default ${DEFAULT-VALUE})") int year;
    @Option(names = "--seed", defaultValue = "1", paramLabel = "N", description = "random seed (default ${DEFAULT-VALUE})") long seed;
    @Option(names = "--hourly", paramLabel = "FILE", description = "write the hourly year here") Path hourly;
    @Option(names = "--month-hour", paramLabel = "FILE", description = "write its month-hour table here") Path monthHour;

    @Override
    public Integer call() {
        if (hourly == null && monthHour == null) {
            throw new org.solmass.InputException("make-weather", "give --hourly FILE and/or --month-hour FILE");
        }
        Site site = siteOptions.site(null);
        List<DemoWeather.Hour> hours = DemoWeather.year(site, year, seed);
        if (hourly != null) AtomicFiles.writeString(hourly, DemoWeather.hourlyCsv(hours, site, seed));
        if (monthHour != null) AtomicFiles.writeString(monthHour, DemoWeather.monthHourCsv(hours, site, seed));
        double ghi = 0;
        for (DemoWeather.Hour h : hours) ghi += h.ghiWm2() / 1000;
        System.out.printf("solmass make-weather: invented year %d, %d hours, annual GHI %.0f kWh/m2%n", year, hours.size(), ghi);
        if (hourly != null) System.out.println("  wrote " + hourly);
        if (monthHour != null) System.out.println("  wrote " + monthHour);
        return Main.EXIT_OK;
    }
}
