package org.solmass.terrain;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.solmass.InputException;
import org.solmass.TextInput;
import org.solmass.scene.HorizonProfile;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.Locale;

/**
 * A far-horizon profile from a CSV file: a header {@code azimuth_deg,elevation_deg}, then one row per
 * measured point, azimuth in degrees from north clockwise in [0, 360), strictly increasing, elevation
 * in degrees in (-90, 90); any spacing; {@code #} starts a comment line. Between rows the elevation
 * is linear in azimuth, wrapping from the last row to the first across north. Elevations below 0 (a
 * site on a summit looks down at its horizon) are taken as 0: below the horizontal the ground plane
 * and the terrain mesh decide. The profile is resampled at {@link #SAMPLES} equally spaced azimuths
 * ({@value #STEP_DEG} deg apart) for {@link HorizonProfile}.
 */
public final class HorizonCsv {
    /** Azimuths of the resampled profile (0.5 deg apart). */
    public static final int SAMPLES = 720;
    static final double STEP_DEG = 0.5;
    /** Fewest rows that describe a horizon all round. */
    public static final int MIN_ROWS = 3;
    private static final long MAX_BYTES = 16L << 20;

    private HorizonCsv() {}

    /** Reads and resamples a horizon file; every problem names the file and line. */
    public static HorizonProfile read(Path file) {
        TextInput.requireRegularFile(file, "file not found, expected a horizon CSV (azimuth_deg,elevation_deg)",
                "a horizon CSV file");
        String text;
        try {
            text = TextInput.readAll(file, MAX_BYTES, "the horizon file");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return parse(text, file.toString());
    }

    /** Parses horizon CSV text; {@code name} is used in messages. */
    public static HorizonProfile parse(String text, String name) {
        java.util.List<double[]> rows = new java.util.ArrayList<>();
        try (CSVParser p = CSVFormat.RFC4180.builder().setCommentMarker('#').setIgnoreSurroundingSpaces(true)
                .setIgnoreEmptyLines(true).get().parse(new StringReader(text))) {
            boolean header = false;
            for (CSVRecord r : p) {
                int line = (int) p.getCurrentLineNumber();
                String where = InputException.at(name, line);
                if (!header) {
                    if (r.size() != 2 || !r.get(0).equalsIgnoreCase("azimuth_deg") || !r.get(1).equalsIgnoreCase("elevation_deg")) {
                        throw new InputException(where, "expected the header azimuth_deg,elevation_deg, got \""
                                + String.join(",", r.toList()) + "\"");
                    }
                    header = true;
                    continue;
                }
                if (r.size() != 2) throw new InputException(where, "expected 2 values (azimuth_deg,elevation_deg), got " + r.size());
                double az = number(r.get(0), where, "azimuth_deg"), el = number(r.get(1), where, "elevation_deg");
                if (!(az >= 0 && az < 360)) throw new InputException(where, "azimuth_deg must lie in [0, 360) degrees from north, got " + r.get(0));
                if (!(el > -90 && el < 90)) throw new InputException(where, "elevation_deg must lie in (-90, 90) degrees, got " + r.get(1));
                if (!rows.isEmpty() && az <= rows.get(rows.size() - 1)[0]) {
                    throw new InputException(where, String.format(Locale.ROOT,
                            "azimuths must increase from row to row, got %s after %s", r.get(0), fmt(rows.get(rows.size() - 1)[0])));
                }
                rows.add(new double[]{az, Math.max(0, el)});
            }
            if (!header) throw new InputException(name, "the horizon file is empty, expected the header azimuth_deg,elevation_deg and rows");
        } catch (IOException | UncheckedIOException e) {
            throw new InputException(name, "not a readable CSV file: " + e.getMessage());
        }
        if (rows.size() < MIN_ROWS) {
            throw new InputException(name, "expected at least " + MIN_ROWS + " rows of azimuth_deg,elevation_deg around the horizon, got " + rows.size());
        }
        return new HorizonProfile(resample(rows));
    }

    private static String fmt(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v);
    }

    private static double number(String s, String where, String column) {
        try {
            double v = Double.parseDouble(s);
            if (Double.isFinite(v)) return v;
        } catch (NumberFormatException e) {
            // fall through to the message
        }
        throw new InputException(where, column + ": expected a number, got \"" + s + "\"");
    }

    /** Elevations at i x 0.5 deg, linear between rows in azimuth, wrapping across north. */
    static double[] resample(java.util.List<double[]> rows) {
        int n = rows.size();
        double[] out = new double[SAMPLES];
        for (int i = 0; i < SAMPLES; i++) {
            double a = i * STEP_DEG;
            int k = 0; // last row at or before a (wrapping to the last row before the first)
            while (k < n && rows.get(k)[0] <= a) k++;
            double[] lo = rows.get((k - 1 + n) % n), hi = rows.get(k % n);
            double span = ((hi[0] - lo[0]) % 360 + 360) % 360, off = ((a - lo[0]) % 360 + 360) % 360;
            if (span == 0) span = 360;
            out[i] = lo[1] + (hi[1] - lo[1]) * off / span;
        }
        return out;
    }
}
