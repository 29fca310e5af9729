package org.solmass.climate;

import org.solmass.InputException;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.util.Locale;

/**
 * Writes a year of steps as an hourly CSV of docs/climate-formats.md (GHI + DHI + DNI, local
 * standard time, interval-start labels), e.g. to make a demo weather year from the clear sky.
 */
public final class HourlyCsvWriter {
    private HourlyCsvWriter() {}

    /**
     * @param comment        first line(s) of the file without the leading '#' (say what the data is)
     * @param standardOffset the site's standard UTC offset, for the local timestamps
     */
    public static void write(WeatherSeries series, ZoneOffset standardOffset, String comment, Path file) {
        if (series.timeBase() != TimeBase.HOURLY_YEAR) {
            throw new IllegalArgumentException("only an hourly-year series can be written as an hourly file");
        }
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            for (String line : comment.split("\n")) w.write("# " + line + "\n");
            boolean temp = series.steps().stream().anyMatch(s -> !Double.isNaN(s.dryBulbC()));
            boolean wind = series.steps().stream().anyMatch(s -> !Double.isNaN(s.windMs()));
            w.write("time,ghi_wm2,dhi_wm2,dni_wm2" + (temp ? ",temp_c" : "") + (wind ? ",wind_ms" : "") + "\n");
            for (Step s : series.steps()) {
                w.write(LocalDateTime.ofInstant(s.start(), standardOffset).toString());
                w.write(String.format(Locale.ROOT, ",%.2f,%.2f,%.2f", s.ghiWm2(), s.dhiWm2(), s.dniWm2()));
                if (temp) w.write(Double.isNaN(s.dryBulbC()) ? "," : String.format(Locale.ROOT, ",%.1f", s.dryBulbC()));
                if (wind) w.write(Double.isNaN(s.windMs()) ? "," : String.format(Locale.ROOT, ",%.1f", s.windMs()));
                w.write("\n");
            }
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot write: " + e.getMessage(), e);
        }
    }
}
