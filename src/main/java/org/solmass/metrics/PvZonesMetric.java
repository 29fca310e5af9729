package org.solmass.metrics;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.solmass.climate.TimeBase;
import org.solmass.irradiation.IrradiationResult;
import org.solmass.irradiation.SkySubdivision;
import org.solmass.irradiation.SunDirections;
import org.solmass.pv.LayoutOptions;
import org.solmass.pv.ModuleLayout;
import org.solmass.pv.ModuleSight;
import org.solmass.pv.PvArrays;
import org.solmass.pv.PvModule;
import org.solmass.pv.ZoneYield;
import org.solmass.sky.PreparedSky;
import org.solmass.surface.Patch;
import org.solmass.surface.Surface;
import org.solmass.surface.SurfaceKind;
import org.solmass.table.Column;
import org.solmass.table.ColumnFamily;
import org.solmass.table.ColumnKind;
import org.solmass.table.ResultTable;
import org.solmass.table.Unit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * PV zones and their modules (docs/metrics.md "PV roof zones"; docs/pv.md).
 *
 * <p>Suitability of a roof patch measures what the site does to it: {@code (1 - shading loss) x
 * (1 - orientation loss)}, the shading loss its irradiation against the same plane unobstructed
 * ({@link IrradiationResult#shadingLossPct}), the orientation loss that unobstructed plane against the
 * best unobstructed plane at the site ({@link BestPlane}). On flat roofs (tilt up to
 * {@link LayoutOptions#flatMaxTiltDeg()}) modules are racked, so the orientation loss is that of the
 * rack plane. Facades (on request) are measured against the best vertical plane. Suitable patches
 * of one surface form zones ({@link PvZones}); modules are placed in each zone ({@link ModuleLayout})
 * and their yield computed with the racks in the ray scene ({@link PvArrays}).
 */
public final class PvZonesMetric implements Metric {
    public static final Column SUITABILITY = Column.of("pv_suitability_pct", Unit.PERCENT,
            "PV suitability (after shading and orientation losses)",
            "Roof patches (and facades with pv.facades): (1 - shading loss) x (1 - orientation loss), the orientation loss that of the rack plane on flat roofs; empty for other kinds.")
            .withCaution();
    public static final Column ORIENTATION_LOSS = Column.of("pv_orientation_loss_pct", Unit.PERCENT,
            "PV orientation loss (against the best plane)",
            "Roof patches (and facades with pv.facades): the unobstructed plane's annual irradiation short of the best unobstructed plane at the site (flat roofs: the rack plane's; facades: the best vertical plane's); empty for other kinds.")
            .withCaution();
    public static final Column ZONE = new Column("pv_zone", Unit.ID, "PV roof zone", 0, ColumnKind.CATEGORICAL,
            "Number of the PV roof zone (zones.csv) the patch belongs to; empty when in none.", true);
    /** The columns of this metric. */
    public static final List<ColumnFamily> COLUMNS = ColumnFamily.of(SUITABILITY, ORIENTATION_LOSS, ZONE);

    @Override public String name() { return "PV roof zones"; }

    @Override public List<ColumnFamily> columns() { return COLUMNS; }

    @Override
    public Findings compute(MetricContext ctx, ResultTable table) {
        PreparedSky sky = PreparedSky.of(ctx.weather(), ctx.sky());
        BestPlane best = BestPlane.find(sky, ctx.groundAlbedo());
        PvZones.Settings s = ctx.settings().pv();
        LayoutOptions lo = s.layout();
        double rackAz = lo.rackAzimuthDeg(ctx.site().latitudeDeg());
        double rackPlane = sky.sum(lo.rackTiltDeg(), rackAz, ctx.groundAlbedo()).annualKwhM2();
        double bestFacade = 0;
        if (lo.facades()) for (int a = 0; a < 360; a += 10) bestFacade = Math.max(bestFacade, sky.sum(90, a, ctx.groundAlbedo()).annualKwhM2());
        IrradiationResult ir = ctx.irradiation();
        List<Patch> patches = ctx.patches().patches();
        List<Surface> surfaces = ctx.patches().surfaces();
        int n = ir.size();
        double[] loss = new double[n], orient = new double[n], suit = new double[n];
        Arrays.fill(orient, Double.NaN);
        Arrays.fill(suit, Double.NaN);
        for (int p = 0; p < n; p++) {
            loss[p] = ir.shadingLossPct(p);
            Patch q = patches.get(p);
            boolean roof = q.kind() == SurfaceKind.ROOF, facade = lo.facades() && q.kind() == SurfaceKind.FACADE;
            if (!roof && !facade) continue;
            boolean racked = roof && lo.racked(surfaces.get(q.surface()).tiltDeg());
            double plane = racked ? rackPlane : ir.unshaded()[p];
            double ref = roof ? best.annualKwhM2() : bestFacade;
            orient[p] = ref > 0 ? Math.max(0, 100 * (1 - plane / ref)) : 100;
            suit[p] = (100 - loss[p]) * (100 - orient[p]) / 100;
        }
        PvZones.Result zones = PvZones.compute(patches, surfaces, ir.annual(), loss, suit, ctx.patchM(), best, s);
        table.put(SUITABILITY, suit);
        table.put(ORIENTATION_LOSS, orient);
        double[] zone = new double[zones.zoneOf().length];
        for (int p = 0; p < zone.length; p++) zone[p] = zones.zoneOf()[p] > 0 ? zones.zoneOf()[p] : Double.NaN;
        table.put(ZONE, zone);

        List<List<PvModule>> modules = new ArrayList<>();
        int[] ids = new int[zones.zones().size()];
        double[] zoneOrient = new double[ids.length];
        for (int i = 0; i < ids.length; i++) {
            PvZones.Zone z = zones.zones().get(i);
            Surface sf = surfaces.get(z.surface());
            boolean racked = sf.kind() == SurfaceKind.ROOF && lo.racked(sf.tiltDeg());
            ids[i] = z.id();
            modules.add(ModuleLayout.place(z.id(), z.localOutline(), sf.frame(), racked, rackAz, lo));
            double o = 0, a = 0;
            for (int p : z.patches()) {
                o += patches.get(p).areaM2() * orient[p];
                a += patches.get(p).areaM2();
            }
            zoneOrient[i] = a > 0 ? o / a : 0;
        }
        SunDirections sun = ctx.weather().timeBase() == TimeBase.AVERAGE_DAYS ? SunDirections.exact(ctx.weather())
                : SunDirections.binned(ctx.weather(), new SkySubdivision(s.sunBins()));
        PvArrays.Result arrays = PvArrays.run(ctx.scene(), ctx.sceneIsGround(), modules, ids, lo, ctx.weather(), ctx.sky(), sun,
                ctx.groundAlbedo(), ctx.site().zone(), new PvArrays.Settings(ctx.rays(), ctx.raySeed(),
                        ModuleSight.DEFAULT_ALONG, ModuleSight.DEFAULT_ACROSS));
        return new Found(zones, s, zoneOrient, rackAz, arrays);
    }

    /**
     * The zones of a run, for zones.csv, the map's outlines, the terminal and summary.json.
     *
     * @param zones the zones and the reference plane
     * @param settings the settings they were found with
     * @param orientationLossPct per zone (in zone order): area-weighted mean orientation loss, %
     * @param rackAzimuthDeg the azimuth racked modules face, degrees from north clockwise
     * @param arrays the modules of every zone and their yield (zone order)
     */
    public record Found(PvZones.Result zones, PvZones.Settings settings, double[] orientationLossPct,
                        double rackAzimuthDeg, PvArrays.Result arrays) implements Findings {

        /** The yield of the zone at {@code i} in zone order. */
        public ZoneYield yieldOf(int i) { return arrays.zones().get(i); }

        public int modules() { return arrays.modules().size(); }

        public double kwp() { return arrays.zones().stream().mapToDouble(ZoneYield::kwp).sum(); }

        public double yieldKwh() { return arrays.zones().stream().mapToDouble(ZoneYield::yieldKwh).sum(); }

        @Override
        public List<String> summaryLines() {
            BestPlane b = zones.best();
            return List.of(String.format(Locale.ROOT, "PV zones: %d, %.0f m2; %d modules, %.1f kWp, indicative yield %.1f MWh per year "
                            + "(best plane: tilt %.0f, azimuth %.0f, %.0f kWh/m2)", zones.zones().size(), zones.totalAreaM2(),
                    modules(), kwp(), yieldKwh() / 1000, b.tiltDeg(), b.azimuthDeg(), b.annualKwhM2()));
        }

        @Override
        public List<String> notes() {
            BestPlane b = zones.best();
            LayoutOptions lo = settings.layout();
            return List.of(String.format(Locale.ROOT, "PV suitability is (1 - shading loss) x (1 - orientation loss), the orientation "
                            + "loss against the best unobstructed plane at the site: tilt %.0f deg, azimuth %.0f deg, %.1f kWh/m2 per year; "
                            + "on flat roofs the rack plane's (tilt %.0f deg, azimuth %.0f deg).", b.tiltDeg(), b.azimuthDeg(),
                            b.annualKwhM2(), lo.rackTiltDeg(), rackAzimuthDeg),
                    String.format(Locale.ROOT, "PV zones (zones.csv): patches with a suitability of at least %.0f %%, zones of at "
                                    + "least %.1f m2; modules placed %.2f m from the zone outline (a layout sketch: setbacks are set by "
                                    + "the local fire and building codes), racked on roofs up to %.0f deg at ground-coverage ratio %.2f, "
                                    + "flush on steeper roofs. yield_kwh: the plane-of-array irradiance of every module substring "
                                    + "through the loss chain of docs/pv.md (shading, incidence, mismatch, temperature, other DC, "
                                    + "inverter, clipping): an indicative figure; layout, electrical, structural and fire-setback "
                                    + "design by licensed practice.",
                            settings.suitablePct(), settings.minZoneM2(), lo.setbackM(), lo.flatMaxTiltDeg(),
                            lo.rowPitchM() > 0 ? lo.module().widthM() / lo.rowPitchM() : lo.groundCoverageRatio()));
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
            LayoutOptions lo = settings.layout();
            ObjectNode m = o.putObject("module");
            m.put("length_m", lo.module().lengthM());
            m.put("width_m", lo.module().widthM());
            m.put("power_w", lo.module().stcPowerW());
            m.put("efficiency", round(lo.module().efficiency(), 4));
            m.put("substrings", lo.module().bypassSubstrings());
            ObjectNode l = o.putObject("layout");
            l.put("setback_m", lo.setbackM());
            l.put("flat_max_tilt_deg", lo.flatMaxTiltDeg());
            l.put("rack_tilt_deg", lo.rackTiltDeg());
            l.put("rack_azimuth_deg", rackAzimuthDeg);
            l.put("row_pitch_m", round(lo.pitchM(), 3));
            l.put("ground_coverage_ratio", round(lo.module().widthM() / lo.pitchM(), 3));
            l.put("rack_clearance_m", lo.rackClearanceM());
            l.put("facades", lo.facades());
            if (!lo.defaultElectrical()) { // left out at the defaults, so that results of earlier versions compare byte for byte
                l.put("dc_ac_ratio", lo.dcAcRatio());
                l.put("other_dc_factor", lo.dcOtherFactor());
            }
            o.put("zones", zones.zones().size());
            o.put("area_m2", round(zones.totalAreaM2(), 2));
            o.put("total_kwh", round(zones.zones().stream().mapToDouble(PvZones.Zone::totalKwh).sum(), 1));
            o.put("modules", modules());
            o.put("kwp", round(kwp(), 2));
            o.put("yield_kwh", round(yieldKwh(), 1));
            o.put("specific_yield_kwh_kwp", round(kwp() > 0 ? yieldKwh() / kwp() : 0, 1));
            org.solmass.pv.EnergyBalance all = org.solmass.pv.EnergyBalance.ZERO;
            for (ZoneYield y : arrays.zones()) all = all.plus(y.year());
            org.solmass.pv.EnergyBalance e = all;
            o.put("performance_ratio", round(Double.isNaN(e.performanceRatio()) ? 0 : e.performanceRatio(), 3));
            ObjectNode kwh = o.putObject("energy_kwh");
            kwh.put("reference", round(e.referenceWh() / 1000, 1));
            kwh.put("shading_loss", round(e.shadingWh() / 1000, 1));
            kwh.put("incidence_loss", round(e.incidenceWh() / 1000, 1));
            kwh.put("mismatch_loss", round(e.mismatchWh() / 1000, 1));
            kwh.put("temperature_loss", round(e.temperatureWh() / 1000, 1));
            kwh.put("other_dc_loss", round(e.dcOtherWh() / 1000, 1));
            kwh.put("inverter_loss", round(e.inverterWh() / 1000, 1));
            kwh.put("clipping_loss", round(e.clippingWh() / 1000, 1));
            kwh.put("ac", round(e.acWh() / 1000, 1));
            ArrayNode zs = o.putArray("zone_list");
            for (int i = 0; i < zones.zones().size(); i++) {
                PvZones.Zone z = zones.zones().get(i);
                ZoneYield y = yieldOf(i);
                ObjectNode z1 = zs.addObject();
                z1.put("zone", z.id());
                z1.put("surface", z.surfaceLabel());
                z1.put("mounting", y.racked() ? "racked" : "flush");
                z1.put("modules", y.modules());
                z1.put("kwp", round(y.kwp(), 2));
                z1.put("yield_kwh", round(y.yieldKwh(), 1));
                z1.put("specific_yield_kwh_kwp", round(y.specificYieldKwhKwp(), 1));
                z1.put("performance_ratio", round(y.performanceRatio(), 3));
                z1.put("shading_loss_pct", round(y.shadingLossPct(), 2));
            }
            return o;
        }

        static double round(double v, int d) {
            double s = Math.pow(10, d);
            return Math.round(v * s) / s;
        }
    }
}
