package org.solmass.output;

import org.solmass.metrics.PvZones;
import org.solmass.pv.ZoneYield;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes zones.csv: one row per PV zone ({@link PvZones}) with its modules and yield ({@link ZoneYield}).
 * Same conventions as patches.csv (UTF-8, LF, header row first, no comment lines, RFC 4180 quoting,
 * fixed decimals); the caution, the best plane and the settings go to summary.json. Columns: docs/outputs.md.
 */
public final class ZoneCsvWriter {
    public static final String FILE_NAME = "zones.csv";
    /** The monthly yield columns, yield_m01_kwh .. yield_m12_kwh. */
    static final List<String> MONTHS;
    public static final List<String> COLUMNS;

    static {
        List<String> m = new ArrayList<>();
        for (int i = 1; i <= 12; i++) m.add(String.format("yield_m%02d_kwh", i));
        MONTHS = List.copyOf(m);
        List<String> c = new ArrayList<>(List.of("zone", "block", "surface", "patches", "area_m2", "tilt_deg",
                "azimuth_deg", "mean_kwh_m2", "total_kwh", "mean_shading_loss_pct", "orientation_loss_pct", "mounting",
                "modules", "kwp", "module_tilt_deg", "module_azimuth_deg", "poa_kwh_m2", "poa_unobstructed_kwh_m2",
                "module_shading_loss_pct", "reference_kwh", "shading_loss_kwh", "incidence_loss_kwh", "mismatch_loss_kwh",
                "temperature_loss_kwh", "other_dc_loss_kwh", "inverter_loss_kwh", "clipping_loss_kwh", "yield_kwh",
                "specific_yield_kwh_kwp", "performance_ratio"));
        c.addAll(MONTHS);
        COLUMNS = List.copyOf(c);
    }

    private ZoneCsvWriter() {}

    /**
     * @param zones the zones
     * @param orientationLossPct per zone (same order): area-weighted mean orientation loss, %
     * @param yields per zone (same order): modules and yield
     */
    public static void write(Path file, List<PvZones.Zone> zones, double[] orientationLossPct, List<ZoneYield> yields) {
        int[] numbers = new int[zones.size()];
        List<String> rows = new ArrayList<>(zones.size());
        for (int i = 0; i < zones.size(); i++) {
            numbers[i] = zones.get(i).id();
            rows.add(afterNumber(zones.get(i), orientationLossPct[i], yields.get(i)));
        }
        write(file, numbers, rows);
    }

    /**
     * Writes zones.csv from rows already printed ({@link #afterNumber}), e.g. by the tiles of a city
     * run, each with its zone number.
     *
     * @param numbers the zone number of each row
     * @param afterNumber per row (same order): its text after the number
     */
    public static void write(Path file, int[] numbers, List<String> afterNumber) {
        AtomicFiles.writeText(file, w -> {
            w.write(String.join(",", COLUMNS) + "\n");
            for (int i = 0; i < numbers.length; i++) w.write(numbers[i] + "," + afterNumber.get(i) + "\n");
        });
    }

    /**
     * One zone's row without its number and line end: the columns after {@code zone}, printed as
     * {@link #write} prints them.
     */
    public static String afterNumber(PvZones.Zone z, double orientationLossPct, ZoneYield y) {
        StringBuilder sb = new StringBuilder(512);
        PatchCsvWriter.text(sb, z.blockName());
        sb.append(',').append(z.surfaceLabel()).append(',').append(z.patches().length);
        num(sb, z.areaM2(), 2);
        num(sb, z.tiltDeg(), 2);
        num(sb, z.azimuthDeg(), 2);
        num(sb, z.meanKwhM2(), 2);
        num(sb, z.totalKwh(), 1);
        num(sb, z.meanShadingLossPct(), 2);
        num(sb, orientationLossPct, 2);
        sb.append(',').append(y.racked() ? "racked" : "flush").append(',').append(y.modules());
        num(sb, y.kwp(), 2);
        num(sb, y.tiltDeg(), 2);
        num(sb, y.azimuthDeg(), 2);
        num(sb, y.poaKwhM2(), 2);
        num(sb, y.poaUnobstructedKwhM2(), 2);
        num(sb, y.shadingLossPct(), 2);
        org.solmass.pv.EnergyBalance e = y.year();
        num(sb, e.referenceWh() / 1000, 1);
        num(sb, e.shadingWh() / 1000, 1);
        num(sb, e.incidenceWh() / 1000, 1);
        num(sb, e.mismatchWh() / 1000, 1);
        num(sb, e.temperatureWh() / 1000, 1);
        num(sb, e.dcOtherWh() / 1000, 1);
        num(sb, e.inverterWh() / 1000, 1);
        num(sb, e.clippingWh() / 1000, 1);
        num(sb, y.yieldKwh(), 1);
        num(sb, y.specificYieldKwhKwp(), 1);
        num(sb, y.performanceRatio(), 3);
        for (int m = 1; m <= 12; m++) num(sb, y.monthYieldKwh(m), 1);
        return sb.toString();
    }

    private static void num(StringBuilder sb, double v, int decimals) {
        sb.append(',');
        org.solmass.table.Numbers.append(sb, v, decimals);
    }
}
