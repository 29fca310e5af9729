package org.solmass.output;

import org.solmass.climate.WeatherSeries;
import org.solmass.pv.EnergyBalance;
import org.solmass.pv.ZoneSeries;
import org.solmass.pv.ZoneYield;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes pv-series.csv: one row per PV zone (with modules) and time step of the weather series, for
 * downstream energy models: the zone number, then the columns of {@link ZoneSeries#HEADER} with the
 * days the step stands for and the obstructed plane-of-array irradiance after the step length. Same
 * conventions as patches.csv (UTF-8, LF, header row first, no comment lines). Times are the step's
 * start in local standard time (no daylight saving); irradiances are averages over the step; energies
 * are the step's (for monthly-average days: one average day's step, not times the days it stands
 * for, which {@code weight_days} gives). Columns: docs/outputs.md.
 */
public final class PvSeriesCsvWriter {
    public static final String FILE_NAME = "pv-series.csv";
    public static final List<String> COLUMNS;

    static {
        List<String> c = new ArrayList<>();
        c.add("zone");
        c.addAll(ZoneSeries.HEADER.subList(0, 2));           // time_lst, duration_h
        c.add("weight_days");
        c.add("poa_wm2");
        c.addAll(ZoneSeries.HEADER.subList(2, ZoneSeries.HEADER.size()));
        COLUMNS = List.copyOf(c);
    }

    private PvSeriesCsvWriter() {}

    public static void write(Path file, WeatherSeries weather, List<ZoneYield> zones) {
        AtomicFiles.writeText(file, w -> {
            w.write(String.join(",", COLUMNS) + "\n");
            StringBuilder sb = new StringBuilder(256);
            for (ZoneYield z : zones) {
                if (z.series() == null) continue;
                List<ZoneSeries.Row> rows = z.series().rows();
                for (int s = 0; s < rows.size(); s++) {
                    ZoneSeries.Row r = rows.get(s);
                    EnergyBalance e = r.energy();
                    sb.setLength(0);
                    sb.append(z.zone()).append(',').append(r.startLst());
                    num(sb, r.durationH(), 4);
                    num(sb, weather.step(s).weightDays(), 4);
                    num(sb, z.seriesPoaWm2()[s], 1);
                    num(sb, z.seriesPoaUnobstructedWm2()[s], 1);
                    sb.append(',');
                    if (!Double.isNaN(r.cellC())) org.solmass.table.Numbers.append(sb, r.cellC(), 1);
                    for (double v : new double[] {e.referenceWh(), e.shadingWh(), e.incidenceWh(), e.mismatchWh(),
                            e.temperatureWh(), e.dcOtherWh(), e.inverterWh(), e.clippingWh(), e.dcWh(), e.acWh()}) num(sb, v, 2);
                    sb.append('\n');
                    w.write(sb.toString());
                }
            }
        });
    }

    private static void num(StringBuilder sb, double v, int decimals) {
        sb.append(',');
        org.solmass.table.Numbers.append(sb, v, decimals);
    }
}
