package org.solmass.output;

import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.pv.ZoneYield;

import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.ZoneId;
import java.util.List;

/**
 * Writes pv-series.csv: one row per PV zone and time step of the weather series, for downstream
 * energy models. Same conventions as patches.csv (UTF-8, LF, header row first, no comment lines).
 * Times are the step's start in local standard time (no daylight saving); irradiances are averages over
 * the step; energies are the step's (for monthly-average days: one average day's step, not times the
 * days it stands for, which {@code weight_days} gives). Columns: docs/outputs.md.
 */
public final class PvSeriesCsvWriter {
    public static final String FILE_NAME = "pv-series.csv";
    public static final List<String> COLUMNS = List.of("zone", "time_lst", "duration_h", "weight_days", "poa_wm2",
            "poa_unobstructed_wm2", "yield_wh");

    private PvSeriesCsvWriter() {}

    public static void write(Path file, WeatherSeries weather, ZoneId zone, List<ZoneYield> zones) {
        AtomicFiles.writeText(file, w -> {
            w.write(String.join(",", COLUMNS) + "\n");
            StringBuilder sb = new StringBuilder(128);
            String[] times = new String[weather.size()];
            for (int s = 0; s < times.length; s++) {
                Step st = weather.step(s);
                times[s] = LocalDateTime.ofInstant(st.start(), zone.getRules().getStandardOffset(st.start())).toString();
            }
            for (ZoneYield z : zones) {
                for (int s = 0; s < times.length; s++) {
                    Step st = weather.step(s);
                    sb.setLength(0);
                    sb.append(z.zone()).append(',').append(times[s]);
                    num(sb, st.durationH(), 4);
                    num(sb, st.weightDays(), 4);
                    num(sb, z.seriesPoaWm2()[s], 1);
                    num(sb, z.seriesPoaUnobstructedWm2()[s], 1);
                    num(sb, z.seriesYieldWh()[s], 1);
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
