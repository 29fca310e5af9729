package org.solmass.pv;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.time.LocalDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A PV zone's (or any module group's) time series, one row per time step, for downstream energy
 * models: CSV, header row first, no comment lines, units in the column names, decimal point, '\n'
 * line ends. Energies are for the step (not multiplied by the days an average-day step stands for).
 * Columns: {@link #HEADER}.
 */
public final class ZoneSeries {
    /** Column names, in order. */
    public static final List<String> HEADER = List.of("time_lst", "duration_h", "poa_unobstructed_wm2", "cell_temp_c",
            "reference_wh", "shading_loss_wh", "incidence_loss_wh", "mismatch_loss_wh", "temperature_loss_wh",
            "dc_other_loss_wh", "inverter_loss_wh", "clipping_loss_wh", "dc_wh", "ac_wh");

    private final String name;
    private final double arrayStcW;
    private final List<Row> rows = new ArrayList<>();

    /** One step: its start in local standard time, length, mean cell temperature (NaN when dark) and energies. */
    public record Row(LocalDateTime startLst, double durationH, double cellC, EnergyBalance energy) {}

    /**
     * @param name      zone name (kept for the caller; not written)
     * @param arrayStcW the group's STC power, W (to turn the reference energy back into irradiance)
     */
    public ZoneSeries(String name, double arrayStcW) {
        if (!(arrayStcW > 0)) throw new IllegalArgumentException("array power must be positive: " + arrayStcW);
        this.name = name;
        this.arrayStcW = arrayStcW;
    }

    public String name() { return name; }

    public List<Row> rows() { return List.copyOf(rows); }

    /** Adds a step (in time order). */
    public void add(LocalDateTime startLst, double durationH, double cellC, EnergyBalance energy) {
        rows.add(new Row(startLst, durationH, cellC, energy));
    }

    /**
     * Writes the table to w (not closed). In a results folder, call it inside the output stage's
     * atomic writer so that the file is published with the others.
     */
    public void write(Writer w) {
        try {
            CSVPrinter p = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').build());
            p.printRecord(HEADER);
            for (Row r : rows) {
                EnergyBalance e = r.energy();
                double poa = r.durationH() > 0 ? e.referenceWh() / r.durationH() / arrayStcW * 1000 : 0;
                p.printRecord(r.startLst().toString(), f(r.durationH(), 4), f(poa, 1),
                        Double.isNaN(r.cellC()) ? "" : f(r.cellC(), 1),
                        f(e.referenceWh(), 2), f(e.shadingWh(), 2), f(e.incidenceWh(), 2), f(e.mismatchWh(), 2),
                        f(e.temperatureWh(), 2), f(e.dcOtherWh(), 2), f(e.inverterWh(), 2), f(e.clippingWh(), 2),
                        f(e.dcWh(), 2), f(e.acWh(), 2));
            }
            p.flush();
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }

    private static String f(double v, int decimals) {
        String s = String.format(Locale.ROOT, "%." + decimals + "f", v);
        return s.startsWith("-") && Double.parseDouble(s) == 0 ? s.substring(1) : s;
    }
}
