package org.solmass.climate;

import org.solmass.sun.Site;

import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * An INVENTED weather year for demonstrations and tests: the clear-sky year of the site
 * ({@link ClearSky}) dimmed by a seeded random cloud cover. It is not measured data and must never
 * stand in for a real site's climate.
 *
 * <p>Cloud cover C in oktas/8: a daily value from a first-order autoregressive process (lag-one
 * correlation 0.6) about an invented seasonal mean (0.72 in winter to 0.52 in summer, a sinusoid
 * peaking in mid January), plus hourly noise from a second autoregressive process (0.8).
 * Global irradiance: GHI = GHI_clear (1 - 0.75 C^3.4), Kasten and Czeplak (1980), "Solar and
 * terrestrial radiation dependent on the amount and type of cloud", Solar Energy 24(2) 177-189.
 * Diffuse: the hourly Erbs et al. (1982) fraction of the clearness index GHI / G0h, never below the
 * clear-sky diffuse. Air temperature: an invented sinusoid (annual mean 9.5 C, amplitude 9 K, warmest
 * late July; diurnal amplitude 4 K, warmest 15:00) that clouds damp; for completeness of the file only.
 */
public final class DemoWeather {
    private DemoWeather() {}

    /** One generated hour (local standard time, interval start). */
    public record Hour(LocalDateTime start, double ghiWm2, double dhiWm2, double tempC) {}

    public static List<Hour> year(Site site, int year, long seed) {
        WeatherSeries clear = ClimateSource.load(site, ClimateSpec.clearSkyYear(year));
        ZoneOffset off = site.standardOffset(year);
        SplittableRandom rnd = new SplittableRandom(seed);
        List<Hour> out = new ArrayList<>(clear.size());
        double daily = 0, hourly = 0;
        int lastDay = -1;
        for (Step s : clear.steps()) {
            LocalDateTime t = LocalDateTime.ofInstant(s.start(), off);
            int doy = t.getDayOfYear();
            double season = Math.cos(2 * Math.PI * (doy - 15) / 365.25);
            double mean = 0.62 + 0.10 * season;
            if (doy != lastDay) {
                daily = 0.6 * daily + 0.8 * gaussian(rnd) * 0.28;
                lastDay = doy;
            }
            hourly = 0.8 * hourly + 0.6 * gaussian(rnd) * 0.12;
            double c = Math.max(0, Math.min(1, mean + daily + hourly));
            double ghi = s.ghiWm2() * (1 - 0.75 * Math.pow(c, 3.4));
            double g0h = s.extraHorizontalWm2();
            double dhi = 0;
            if (ghi > 0 && g0h > 0) {
                double kt = Math.min(1, ghi / g0h);
                dhi = Math.min(ghi, Math.max(s.dhiWm2() * ghi / Math.max(1e-9, s.ghiWm2()),
                        ghi * Decomposition.erbsHourlyDiffuseFraction(kt)));
            }
            double hourOfDay = t.getHour() + 0.5;
            double temp = 9.5 - 9 * Math.cos(2 * Math.PI * (doy - 25) / 365.25)
                    + 4 * (1 - 0.6 * c) * Math.cos(2 * Math.PI * (hourOfDay - 15) / 24);
            out.add(new Hour(t, round1(ghi), round1(Math.min(dhi, ghi)), round1(temp)));
        }
        return out;
    }

    /** The hourly file (docs/climate-formats.md section 3), with comment lines saying it is invented. */
    public static String hourlyCsv(List<Hour> hours, Site site, long seed) {
        StringBuilder b = new StringBuilder(hours.size() * 40);
        header(b, site, seed, "hourly year; timestamps are local standard time, labelling the interval start");
        b.append("time,ghi_wm2,dhi_wm2,temp_c\n");
        DateTimeFormatter f = DateTimeFormatter.ofPattern("yyyy-MM-dd'T'HH:mm");
        for (Hour h : hours) {
            b.append(f.format(h.start())).append(',').append(fmt(h.ghiWm2())).append(',')
                    .append(fmt(h.dhiWm2())).append(',').append(fmt(h.tempC())).append('\n');
        }
        return b.toString();
    }

    /** The month-hour table of the same hours (means per month and hour), docs/climate-formats.md section 1. */
    public static String monthHourCsv(List<Hour> hours, Site site, long seed) {
        double[][] g = new double[12][24], d = new double[12][24], t = new double[12][24];
        int[][] n = new int[12][24];
        for (Hour h : hours) {
            int m = h.start().getMonthValue() - 1, hr = h.start().getHour();
            g[m][hr] += h.ghiWm2();
            d[m][hr] += h.dhiWm2();
            t[m][hr] += h.tempC();
            n[m][hr]++;
        }
        StringBuilder b = new StringBuilder();
        header(b, site, seed, "month-hour table: mean of each hour of each month of the invented year");
        b.append("month,hour,ghi_wm2,dhi_wm2,temp_c\n");
        for (int m = 0; m < 12; m++) {
            for (int hr = 0; hr < 24; hr++) {
                int k = Math.max(1, n[m][hr]);
                b.append(m + 1).append(',').append(hr).append(',').append(fmt(round1(g[m][hr] / k))).append(',')
                        .append(fmt(round1(d[m][hr] / k))).append(',').append(fmt(round1(t[m][hr] / k))).append('\n');
            }
        }
        return b.toString();
    }

    private static void header(StringBuilder b, Site site, long seed, String what) {
        b.append("# INVENTED demo weather, not measured data: Solmass make-weather, seed ").append(seed).append('\n');
        b.append(String.format(Locale.ROOT, "# site %.4f N, %.4f E, %.0f m, zone %s; clear sky (Hottel 1976, Liu & Jordan 1960) dimmed by random cloud cover (Kasten & Czeplak 1980)%n",
                site.latitudeDeg(), site.longitudeDeg(), site.elevationM(), site.zone()));
        b.append("# ").append(what).append('\n');
    }

    private static double gaussian(SplittableRandom r) {
        // Box-Muller (Box and Muller 1958), one of the pair
        double u = 1 - r.nextDouble(), v = r.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    }

    private static double round1(double v) {
        return Math.round(v * 10) / 10.0;
    }

    private static String fmt(double v) {
        if (v == 0) return "0";
        return String.format(Locale.ROOT, "%.1f", v);
    }
}
