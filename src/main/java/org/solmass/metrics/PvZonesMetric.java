package org.solmass.metrics;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.sky.PreparedSky;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;
import org.solmass.table.ColumnKind;
import org.solmass.table.ResultTable;
import org.solmass.table.Unit;

import java.util.List;
import java.util.Locale;

/**
 * PV roof zones: each roof patch's annual irradiation against the best unobstructed plane at the site
 * ({@link BestPlane}), and the connected suitable roof areas ({@link PvZones}). Columns
 * {@code pv_suitability_pct} and {@code pv_zone}; zones.csv and summary.json's {@code pv_zones}
 * section; method in docs/metrics.md.
 */
public final class PvZonesMetric implements Metric {
    public static final Column SUITABILITY = Column.of("pv_suitability_pct", Unit.PERCENT,
            "PV suitability (share of the best plane)",
            "Roof patches: annual irradiation as a share of the best unobstructed plane at the site; empty for other kinds.")
            .withCaution();
    public static final Column ZONE = new Column("pv_zone", Unit.ID, "PV roof zone", 0, ColumnKind.CATEGORICAL,
            "Number of the PV roof zone (zones.csv) the patch belongs to; empty when in none.", true);
    /** The columns of this metric. */
    public static final List<ColumnFamily> COLUMNS = ColumnFamily.of(SUITABILITY, ZONE);

    @Override public String name() { return "PV roof zones"; }

    @Override public List<ColumnFamily> columns() { return COLUMNS; }

    @Override
    public Findings compute(MetricContext ctx, ResultTable table) {
        BestPlane best = BestPlane.find(PreparedSky.of(ctx.weather(), ctx.sky()), ctx.groundAlbedo());
        double[] loss = new double[ctx.irradiation().size()];
        for (int p = 0; p < loss.length; p++) loss[p] = ctx.irradiation().shadingLossPct(p);
        PvZones.Settings s = ctx.settings().pv();
        PvZones.Result zones = PvZones.compute(ctx.patches().patches(), ctx.patches().surfaces(), ctx.irradiation().annual(),
                loss, ctx.patchM(), best, s);
        table.put(SUITABILITY, zones.suitabilityPct());
        double[] zone = new double[zones.zoneOf().length];
        for (int p = 0; p < zone.length; p++) zone[p] = zones.zoneOf()[p] > 0 ? zones.zoneOf()[p] : Double.NaN;
        table.put(ZONE, zone);
        return new Found(zones, s);
    }

    /**
     * The zones of a run, for zones.csv, the map's outlines, the terminal and summary.json.
     *
     * @param zones the zones and the reference plane
     * @param settings the settings they were found with
     */
    public record Found(PvZones.Result zones, PvZones.Settings settings) implements Findings {
        @Override
        public List<String> summaryLines() {
            BestPlane b = zones.best();
            return List.of(String.format(Locale.ROOT, "PV roof zones: %d, %.0f m2, indicative yield %.1f MWh per year "
                            + "(best plane: tilt %.0f, azimuth %.0f, %.0f kWh/m2)", zones.zones().size(), zones.totalAreaM2(),
                    zones.totalYieldKwh() / 1000, b.tiltDeg(), b.azimuthDeg(), b.annualKwhM2()));
        }

        @Override
        public List<String> notes() {
            BestPlane b = zones.best();
            return List.of(String.format(Locale.ROOT, "PV suitability is relative to the best unobstructed plane at the site: "
                            + "tilt %.0f deg, azimuth %.0f deg, %.1f kWh/m2 per year.", b.tiltDeg(), b.azimuthDeg(), b.annualKwhM2()),
                    String.format(Locale.ROOT, "PV roof zones (zones.csv): roof patches with at least %.0f %% of that plane, "
                                    + "zones of at least %.1f m2; yield_kwh = total_kwh x module efficiency %.3f x performance "
                                    + "ratio %.3f, with the zone fully covered: an indicative figure, not a yield estimate.",
                            settings.suitablePct(), settings.minZoneM2(), settings.moduleEfficiency(), settings.performanceRatio()));
        }

        @Override public List<String> summaryColumns() { return List.of(); }

        @Override public String summaryKey() { return "pv_zones"; }

        @Override
        public ObjectNode summarySection() {
            ObjectNode o = JsonNodeFactory.instance.objectNode();
            ObjectNode b = o.putObject("best_plane");
            b.put("tilt_deg", zones.best().tiltDeg());
            b.put("azimuth_deg", zones.best().azimuthDeg());
            b.put("annual_kwh_m2", round(zones.best().annualKwhM2(), 1));
            o.put("suitable_pct", settings.suitablePct());
            o.put("min_zone_m2", settings.minZoneM2());
            o.put("module_efficiency", settings.moduleEfficiency());
            o.put("performance_ratio", settings.performanceRatio());
            o.put("zones", zones.zones().size());
            o.put("area_m2", round(zones.totalAreaM2(), 2));
            o.put("total_kwh", round(zones.zones().stream().mapToDouble(PvZones.Zone::totalKwh).sum(), 1));
            o.put("yield_kwh", round(zones.totalYieldKwh(), 1));
            return o;
        }

        private static double round(double v, int d) {
            double s = Math.pow(10, d);
            return Math.round(v * s) / s;
        }
    }
}
