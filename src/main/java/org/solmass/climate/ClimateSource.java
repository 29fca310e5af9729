package org.solmass.climate;

import org.solmass.InputException;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.SolarGeometry;
import org.solmass.sun.Site;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Turns a {@link ClimateSpec} into a {@link WeatherSeries} for a site. Formats: docs/climate-formats.md.
 */
public final class ClimateSource {
    private ClimateSource() {}

    public static WeatherSeries load(Site site, ClimateSpec spec) {
        return load(new SolarCalculator(site), spec);
    }

    public static WeatherSeries load(SolarCalculator calc, ClimateSpec spec) {
        if (spec.kind() == ClimateSpec.Kind.CLEAR_SKY) return clearSky(calc, spec);
        return fromLines(calc, spec, ClimateTable.read(spec.file()));
    }

    /**
     * Reads climate text as if it were the spec's file (the spec's file is ignored; {@code name}
     * names the text in messages). For tests and fuzzing.
     */
    public static WeatherSeries parse(SolarCalculator calc, ClimateSpec spec, String name, String text) {
        return fromLines(calc, spec, ClimateTable.of(name, text));
    }

    private static WeatherSeries fromLines(SolarCalculator calc, ClimateSpec spec, ClimateTable csv) {
        ClimateSpec.Format f = spec.format() == ClimateSpec.Format.AUTO ? detect(csv, spec) : spec.format();
        switch (f) {
            case MONTH_HOUR: return monthHour(calc, csv, spec);
            case MONTHLY_MEANS: return monthlyMeans(calc, csv, spec);
            default: return HourlyYearReader.read(calc, csv, spec);
        }
    }

    /**
     * Recognises the format from the header line: month and hour without year or day make a
     * month-hour table; year, month, day and hour columns or a time column an hourly file.
     */
    static ClimateSpec.Format detect(ClimateTable csv, ClimateSpec spec) {
        if (csv.column("ghi_kwh_m2_day") >= 0) return ClimateSpec.Format.MONTHLY_MEANS;
        boolean dated = csv.column("year") >= 0 || csv.column("day") >= 0;
        if (!dated && csv.column("month") >= 0 && csv.column("hour") >= 0) return ClimateSpec.Format.MONTH_HOUR;
        if (dated && csv.column("month") >= 0 && csv.column("hour") >= 0) return ClimateSpec.Format.HOURLY;
        if (spec.columns().containsKey("time")) return ClimateSpec.Format.HOURLY;
        for (ClimateTable.HeaderName c : csv.names) if (HourlyYearReader.TIME_NAMES.contains(c.name())) return ClimateSpec.Format.HOURLY;
        throw new InputException(InputException.at(csv.name, csv.header.number()), "cannot recognise the climate format from the header "
                + Arrays.toString(csv.header.cells()) + "; expected the headers of docs/climate-formats.md or give --climate-format");
    }

    /** Hottel (1976) clear sky with Liu &amp; Jordan diffuse, see {@link ClearSky}. */
    static WeatherSeries clearSky(SolarCalculator calc, ClimateSpec spec) {
        Site site = calc.site();
        List<Slot> slots = new ArrayList<>();
        if (spec.timeBase() == TimeBase.AVERAGE_DAYS) StepGrid.averageDays(calc, spec.stepMinutes()).forEach(slots::addAll);
        else slots = StepGrid.year(calc, spec.year(), spec.stepMinutes());
        ClearSky[] sky = new ClearSky[12];
        for (int m = 1; m <= 12; m++) sky[m - 1] = new ClearSky(site.elevationM() / 1000, ClearSky.typeFor(site.latitudeDeg(), m));
        List<Step> steps = new ArrayList<>(slots.size());
        for (Slot s : slots) {
            if (s.sunUpFraction() <= 0) { steps.add(s.toStep(0, 0, 0, Double.NaN)); continue; }
            double cz = Math.max(0, s.sun().cosZenith());
            double tb = sky[s.month() - 1].beamTransmittance(cz);
            double dni = s.extraNormalWm2() * tb * s.sunUpFraction();
            double dhi = s.extraNormalWm2() * cz * ClearSky.diffuseTransmittance(tb) * s.sunUpFraction();
            if (Components.lowSun(s)) { dhi += dni * cz; dni = 0; } // low-sun cut-off: beam counted as diffuse
            steps.add(s.toStep(dni * cz + dhi, dni, dhi, Double.NaN));
        }
        String what = spec.timeBase() == TimeBase.AVERAGE_DAYS ? "average days" : "year " + spec.year();
        return new WeatherSeries(steps, spec.timeBase(), "clear sky (Hottel 1976 beam, Liu & Jordan 1960 diffuse), " + what,
                new ClimateReport(List.of(), List.of()).complete(steps, spec.timeBase(), site.standardOffset(spec.year())));
    }

    /** Month-hour table: month,hour,ghi_wm2,dhi_wm2[,temp_c], 288 rows. */
    static WeatherSeries monthHour(SolarCalculator calc, ClimateTable csv, ClimateSpec spec) {
        int cm = need(csv, "month"), ch = need(csv, "hour"), cg = need(csv, "ghi_wm2", "ghi"), cd = need(csv, "dhi_wm2", "dhi"), ct = csv.column("temp_c");
        IrradianceUnit ug = csv.irradianceUnit(cg, spec.reading().irradianceUnit()), ud = csv.irradianceUnit(cd, spec.reading().irradianceUnit());
        double[][][] v = new double[12][24][];
        String[][] where = new String[12][24];
        for (ClimateTable.Line l : csv.rows) {
            int m = integer(csv, l, cm, "month", 1, 12), h = integer(csv, l, ch, "hour", 0, 23);
            if (v[m - 1][h] != null) throw new InputException(csv.at(l), "month " + m + " hour " + h + " given twice (first at " + where[m - 1][h] + ")");
            v[m - 1][h] = new double[] {ug.toWm2(csv.number(l, cg, "ghi_wm2", false), 1), ud.toWm2(csv.number(l, cd, "dhi_wm2", false), 1),
                    ct >= 0 ? csv.number(l, ct, "temp_c", true) : Double.NaN};
            where[m - 1][h] = csv.at(l);
        }
        for (int m = 0; m < 12; m++) for (int h = 0; h < 24; h++) {
            if (v[m][h] == null) throw new InputException(csv.name, "missing row for month " + (m + 1) + " hour " + h + " (288 rows expected)");
        }
        ClimateReport.Builder rep = new ClimateReport.Builder();
        List<Step> steps = new ArrayList<>();
        List<List<Slot>> days = StepGrid.averageDays(calc, 60);
        for (int m = 0; m < 12; m++) {
            List<Slot> day = days.get(m);
            double[] g = new double[24], d = new double[24];
            for (int h = 0; h < 24; h++) { g[h] = v[m][h][0]; d[h] = v[m][h][1]; }
            moveNightValues(day, g, d, rep, where[m]);
            double dayWh = 0;
            for (int h = 0; h < 24; h++) dayWh += g[h];
            double h0 = SolarGeometry.dailyExtraterrestrialWhM2(calc.site().latitudeDeg(), SolarGeometry.kleinDayOfYear(m + 1));
            if (dayWh > 0 && dayWh >= h0) {
                throw new InputException(csv.name, String.format("month %d: the day total of the table, %.0f Wh/m2, is not below the extraterrestrial"
                        + " daily irradiation %.0f Wh/m2 of the month's average day", m + 1, dayWh, h0));
            }
            for (int h = 0; h < 24; h++) {
                Slot s = day.get(h);
                double[] c = Components.check(s, g[h], Double.NaN, d[h], rep, where[m][h], false);
                double[] r = Components.fromGhiDhi(s, c[0], c[2], rep, where[m][h]);
                steps.add(s.toStep(r[0], r[1], r[2], v[m][h][2]));
            }
        }
        Map<String, String> cols = new LinkedHashMap<>();
        cols.put("month", csv.header.cells()[cm]); cols.put("hour", csv.header.cells()[ch]);
        cols.put("ghi", csv.header.cells()[cg]); cols.put("dhi", csv.header.cells()[cd]);
        if (ct >= 0) cols.put("temp", csv.header.cells()[ct]);
        rep.reading(csv.reading("month-hour", cols, Map.of("ghi", ug.label(), "dhi", ud.label()), "", rep.notes()));
        return new WeatherSeries(steps, TimeBase.AVERAGE_DAYS, "month-hour table " + csv.name, rep.build().complete(steps, TimeBase.AVERAGE_DAYS, null));
    }

    /**
     * A table's mean hour may hold light in an hour when the sun is down on Klein's day (the month's
     * other days rise earlier or set later): such values move to the nearest sun-up hour of the same
     * day so the day total is kept. Values above 60 W/m2 at night point to a wrong zone: error.
     */
    private static void moveNightValues(List<Slot> day, double[] g, double[] d, ClimateReport.Builder rep, String[] where) {
        for (int h = 0; h < 24; h++) {
            if (day.get(h).sunUpFraction() > 0 || (g[h] <= 0 && d[h] <= 0)) continue;
            if (g[h] > 60) throw new InputException(where[h], "GHI = " + g[h] + " W/m2 in an hour when the sun is down on the month's average day (check the time zone)");
            int best = -1;
            for (int k = 1; k < 24 && best < 0; k++) {
                if (h - k >= 0 && day.get(h - k).sunUpFraction() > 0) best = h - k;
                else if (h + k < 24 && day.get(h + k).sunUpFraction() > 0) best = h + k;
            }
            if (best < 0) {
                if (g[h] > Components.OFFSET_TOLERANCE_WM2) throw new InputException(where[h], "GHI = " + g[h] + " W/m2 in a month without sunrise");
                g[h] = 0; d[h] = 0;
                continue;
            }
            rep.repair("night-hour values of the table moved to the nearest sun-up hour", where[h]);
            g[best] += g[h]; d[best] += d[h]; g[h] = 0; d[h] = 0;
        }
    }

    /**
     * Monthly means: month,ghi_kwh_m2_day[,dhi_kwh_m2_day][,temp_c], 12 rows. Hours by
     * Collares-Pereira &amp; Rabl (1979) for global and Liu &amp; Jordan (1960) for diffuse,
     * each rescaled so the day's steps sum exactly to the given daily totals; monthly diffuse from
     * Erbs et al. (1982) when not given.
     */
    static WeatherSeries monthlyMeans(SolarCalculator calc, ClimateTable csv, ClimateSpec spec) {
        int cm = need(csv, "month"), cg = need(csv, "ghi_kwh_m2_day"), cd = csv.column("dhi_kwh_m2_day"), ct = csv.column("temp_c");
        double[][] v = new double[12][];
        String[] where = new String[12];
        for (ClimateTable.Line l : csv.rows) {
            int m = integer(csv, l, cm, "month", 1, 12);
            if (v[m - 1] != null) throw new InputException(csv.at(l), "month " + m + " given twice");
            v[m - 1] = new double[] {csv.number(l, cg, "ghi_kwh_m2_day", false), cd >= 0 ? csv.number(l, cd, "dhi_kwh_m2_day", true) : Double.NaN,
                    ct >= 0 ? csv.number(l, ct, "temp_c", true) : Double.NaN};
            where[m - 1] = csv.at(l);
        }
        for (int m = 0; m < 12; m++) if (v[m] == null) throw new InputException(csv.name, "missing row for month " + (m + 1) + " (12 rows expected)");
        double lat = calc.site().latitudeDeg(), phi = Math.toRadians(lat);
        ClimateReport.Builder rep = new ClimateReport.Builder();
        List<Step> steps = new ArrayList<>();
        List<List<Slot>> days = StepGrid.averageDays(calc, spec.stepMinutes());
        for (int m = 0; m < 12; m++) {
            int n = SolarGeometry.kleinDayOfYear(m + 1);
            double hWh = v[m][0] * 1000, h0 = SolarGeometry.dailyExtraterrestrialWhM2(lat, n);
            if (hWh < 0) throw new InputException(where[m], "ghi_kwh_m2_day = " + v[m][0] + " is negative, expected a daily total of 0 kWh/m2 or more");
            if (hWh > 0 && hWh >= h0) throw new InputException(where[m], String.format(
                    "ghi_kwh_m2_day = %.3f is not below the extraterrestrial daily irradiation %.3f kWh/m2 of the month's average day", v[m][0], h0 / 1000));
            double delta = SolarGeometry.declinationDeg(n), ws = SolarGeometry.sunsetHourAngleDeg(lat, delta);
            double hdWh;
            if (!Double.isNaN(v[m][1])) {
                hdWh = v[m][1] * 1000;
                if (hdWh < 0 || hdWh > hWh) throw new InputException(where[m], "dhi_kwh_m2_day must be in [0, ghi_kwh_m2_day]");
            } else {
                hdWh = hWh > 0 ? hWh * Decomposition.erbsMonthlyDiffuseFraction(hWh / h0, ws) : 0;
            }
            List<Slot> day = days.get(m);
            double[] wg = new double[day.size()], wd = new double[day.size()];
            double sg = 0, sd = 0, dl = Math.toRadians(delta);
            for (int i = 0; i < day.size(); i++) {
                Slot s = day.get(i);
                if (s.sunUpFraction() <= 0) continue;
                double cosW = Math.max(-1, Math.min(1, (s.sun().cosZenith() - Math.sin(phi) * Math.sin(dl)) / (Math.cos(phi) * Math.cos(dl))));
                wg[i] = Decomposition.collaresPereiraRabl(cosW, ws) * s.sunUpFraction();
                wd[i] = Decomposition.liuJordanDiffuse(cosW, ws) * s.sunUpFraction();
                if (wg[i] <= 0) wg[i] = 1e-9 * s.sunUpFraction(); // refraction lets the sun be up just outside ws
                if (wd[i] <= 0) wd[i] = 1e-9 * s.sunUpFraction();
                sg += wg[i] * s.durationH();
                sd += wd[i] * s.durationH();
            }
            if (hWh > 0 && sg <= 0) throw new InputException(where[m], "global irradiation given for a month without sunrise");
            for (int i = 0; i < day.size(); i++) {
                Slot s = day.get(i);
                double g = sg > 0 ? hWh * wg[i] / sg : 0, d = sd > 0 ? hdWh * wd[i] / sd : 0;
                if (d > g) { rep.repair("Liu & Jordan hourly diffuse above the hourly global clipped to it", where[m]); d = g; }
                double[] r = Components.fromGhiDhi(s, g, d, rep, where[m]);
                steps.add(s.toStep(r[0], r[1], r[2], v[m][2]));
            }
        }
        Map<String, String> cols = new LinkedHashMap<>();
        cols.put("month", csv.header.cells()[cm]); cols.put("ghi", csv.header.cells()[cg]);
        if (cd >= 0) cols.put("dhi", csv.header.cells()[cd]);
        if (ct >= 0) cols.put("temp", csv.header.cells()[ct]);
        rep.reading(csv.reading("monthly", cols, Map.of("ghi", "kWh/m2 per day", "dhi", "kWh/m2 per day"), "", rep.notes()));
        return new WeatherSeries(steps, TimeBase.AVERAGE_DAYS, "monthly means " + csv.name, rep.build().complete(steps, TimeBase.AVERAGE_DAYS, null));
    }

    /** The column of the first name the header has (a name with a unit in brackets counts); missing: error naming the first. */
    static int need(ClimateTable csv, String name, String... otherNames) {
        int c = csv.column(name);
        for (int i = 0; c < 0 && i < otherNames.length; i++) c = csv.column(otherNames[i]);
        if (c < 0) throw new InputException(InputException.at(csv.name, csv.header.number()), "missing column '" + name + "' in the header");
        return c;
    }

    static int integer(ClimateTable csv, ClimateTable.Line l, int col, String what, int lo, int hi) {
        double x = csv.number(l, col, what, false);
        if (x != Math.rint(x) || x < lo || x > hi) throw new InputException(csv.at(l), what + " must be an integer in " + lo + ".." + hi + ", got " + l.cells()[col]);
        return (int) x;
    }
}
