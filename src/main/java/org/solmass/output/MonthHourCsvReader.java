package org.solmass.output;

import org.solmass.InputException;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Reads a month-hour.csv written by {@link MonthHourCsvWriter} back into one 12 x 24 table per patch
 * (index {@code MonthHour.index(month, hour)}, W/m2), for the viewer's heat map. Errors name file:line.
 */
public final class MonthHourCsvReader {
    private MonthHourCsvReader() {}

    /** Tables keyed by patch id, in file order; months a file leaves out stay NaN. */
    public static Map<String, float[]> read(Path file) {
        Map<String, float[]> out = new LinkedHashMap<>();
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String header = r.readLine();
            if (header == null || !header.equals(MonthHourCsvWriter.header())) {
                throw new InputException(InputException.at(file, 1), "expected the header " + MonthHourCsvWriter.header());
            }
            int lineNo = 1;
            for (String line; (line = r.readLine()) != null; ) {
                lineNo++;
                if (line.isEmpty()) continue;
                String where = InputException.at(file, lineNo);
                int idEnd = idEnd(line);
                if (idEnd < 0) throw new InputException(where, "expected patch_id,month,h00..h23");
                String id = unquote(line.substring(0, idEnd));
                String[] cells = line.substring(idEnd + 1).split(",", -1);
                if (cells.length != 1 + MonthHourCsvWriter.HOURS) {
                    throw new InputException(where, "expected month and 24 hour values, got " + cells.length + " cells");
                }
                int month;
                try {
                    month = Integer.parseInt(cells[0]);
                } catch (NumberFormatException e) {
                    throw new InputException(where, "month: expected 1 to 12, got \"" + cells[0] + "\"");
                }
                if (month < 1 || month > 12) throw new InputException(where, "month: expected 1 to 12, got " + month);
                float[] t = out.computeIfAbsent(id, k -> {
                    float[] a = new float[MonthHourCsvWriter.CELLS];
                    java.util.Arrays.fill(a, Float.NaN);
                    return a;
                });
                for (int h = 0; h < MonthHourCsvWriter.HOURS; h++) {
                    String c = cells[h + 1];
                    try {
                        t[org.solmass.climate.MonthHour.index(month, h)] = c.isEmpty() ? Float.NaN : Float.parseFloat(c);
                    } catch (NumberFormatException e) {
                        throw new InputException(where, String.format("h%02d: expected a number, got \"%s\"", h, c));
                    }
                }
            }
        } catch (NoSuchFileException e) {
            throw new InputException(file.toString(), "file not found");
        } catch (IOException e) {
            throw new InputException(file.toString(), "cannot read: " + e.getMessage(), e);
        }
        return out;
    }

    private static int idEnd(String line) {
        if (!line.startsWith("\"")) return line.indexOf(',');
        for (int i = 1; i < line.length(); i++) {
            if (line.charAt(i) == '"') {
                if (i + 1 < line.length() && line.charAt(i + 1) == '"') i++;
                else return i + 1;
            }
        }
        return -1;
    }

    private static String unquote(String s) {
        if (!s.startsWith("\"")) return s;
        return s.substring(1, s.length() - 1).replace("\"\"", "\"");
    }
}
