package org.solmass.pv;

import org.solmass.model.Parallel;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.SunDirections;
import org.solmass.scene.Scene;
import org.solmass.sky.SkyModel;

import java.time.LocalDateTime;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;

/**
 * The PV stage of a run: the racks become geometry, every module substring's plane-of-array
 * irradiance is computed for every step, and each zone's modules are summed into a {@link ZoneYield}
 * (docs/pv.md "Layout" to "Yield per zone").
 *
 * <p>Racked modules are added to the ray scene ({@link Scene#withTriangles}) so that inter-row
 * shading and shading by parapets come from the ray engine; flush-mounted modules lie on their
 * surface and are not added (they would coincide with it).
 */
public final class PvArrays {
    private PvArrays() {}

    /**
     * Settings of the module rays.
     *
     * @param rays hemisphere rays per substring
     * @param runSeed seed of the run's ray streams
     * @param along sample points along a substring
     * @param across sample points across a substring
     */
    public record Settings(int rays, long runSeed, int along, int across) {}

    /**
     * The modules of every zone, their sight and plane-of-array irradiance, and each zone's yield.
     *
     * @param sightS seconds spent on the rays (scene with racks, visibilities, view factors)
     * @param yieldS seconds spent on the step-by-step sums
     */
    public record Result(List<PvModule> modules, PlaneOfArray poa, List<ZoneYield> zones, double sightS, double yieldS) {}

    /**
     * @param scene the model's scene
     * @param modelIsGround per triangle of {@code scene}, in the scene's numbering: ground or not
     * @param zones per zone (in order of {@code zoneIds}): its modules
     * @param zoneIds zone ids
     * @param zoneId the site's time zone (its standard offset gives the series' local standard time)
     */
    public static Result run(Scene scene, boolean[] modelIsGround, List<List<PvModule>> zones, int[] zoneIds,
                             ModuleSpec module, WeatherSeries weather, SkyModel sky, SunDirections sun,
                             double groundAlbedo, ZoneId zoneId, Settings s) {
        return run(scene, modelIsGround, zones, zoneIds, new LayoutOptions(module, 0, LayoutOptions.DEFAULT_FLAT_MAX_TILT_DEG,
                LayoutOptions.DEFAULT_RACK_TILT_DEG, Double.NaN, LayoutOptions.DEFAULT_GCR, 0, LayoutOptions.DEFAULT_RACK_CLEARANCE_M, false),
                weather, sky, sun, groundAlbedo, zoneId, s);
    }

    /**
     * As above, with the module, the DC/AC ratio and the other-DC-loss factor of the layout options
     * (the placement options themselves are not used here: the modules are placed already).
     */
    public static Result run(Scene scene, boolean[] modelIsGround, List<List<PvModule>> zones, int[] zoneIds,
                             LayoutOptions lo, WeatherSeries weather, SkyModel sky, SunDirections sun,
                             double groundAlbedo, ZoneId zoneId, Settings s) {
        ModuleSpec module = lo.module();
        long t0 = System.nanoTime();
        List<PvModule> all = new ArrayList<>();
        for (List<PvModule> z : zones) all.addAll(z);
        int racked = 0;
        for (PvModule m : all) if (m.racked()) racked++;
        Scene withRacks = scene;
        boolean[] ground = modelIsGround;
        if (racked > 0) {
            float[] soup = new float[racked * 18];
            int o = 0;
            for (PvModule m : all) {
                if (!m.racked()) continue;
                m.triangles(soup, o);
                o += 18;
            }
            withRacks = scene.withTriangles(soup);
            ground = java.util.Arrays.copyOf(modelIsGround, withRacks.triangleCount());
        }
        ModuleSight sight = ModuleSight.compute(withRacks, ground, all, module.bypassSubstrings(), sun, s.rays(),
                s.runSeed(), s.along(), s.across());
        long t1 = System.nanoTime();
        PlaneOfArray poa = new PlaneOfArray(sight, weather, sky, sun, groundAlbedo);
        List<ZoneYield> out = new ArrayList<>();
        int first = 0;
        for (int z = 0; z < zones.size(); z++) {
            int count = zones.get(z).size();
            out.add(zoneYield(poa, zoneIds[z], first, count, lo, zoneId));
            first += count;
        }
        return new Result(List.copyOf(all), poa, List.copyOf(out), (t1 - t0) / 1e9, (System.nanoTime() - t1) / 1e9);
    }

    /**
     * Sums modules {@code first .. first + count - 1} step by step through the yield chain
     * ({@link LayoutOptions#yieldChain}: the open-rack thermal model for racked modules, the flush-roof one
     * otherwise; air temperature filled from the month means, wind from the weather or the default).
     */
    static ZoneYield zoneYield(PlaneOfArray poa, int zone, int first, int count, LayoutOptions lo, ZoneId zoneId) {
        ModuleSpec module = lo.module();
        WeatherSeries w = poa.weather();
        int n = w.size(), S = module.bypassSubstrings();
        float[] sPoa = new float[n], sUnob = new float[n];
        PvModule any = count > 0 ? poa.sight().modules().get(first) : null;
        boolean racked = any != null && any.racked();
        double tilt = any == null ? 0 : any.tiltDeg();
        YieldChain chain = lo.yieldChain(racked);
        double[] air = CellTemperature.airPerStep(w.steps());
        EnergyBalance[] energy = new EnergyBalance[n];
        double[] cell = new double[n];
        double modTilt = Math.min(180, tilt);
        IncidenceAngleModifier iam = chain.iam();
        double id = iam.skyDiffuse(modTilt), ig = iam.groundReflected(modTilt); // the zone's modules share the tilt
        // steps in parallel, each into its own slots; summed below in step order (thread-count independent)
        Parallel.forEach(n, st -> {
            Step step = w.step(st);
            energy[st] = EnergyBalance.ZERO;
            cell[st] = Double.NaN;
            if (count == 0 || !(step.ghiWm2() > 0 || step.dhiWm2() > 0 || step.dniWm2() > 0)) return; // dark: nothing
            double[] beam = new double[S], sky = new double[S], refl = new double[S], unob = new double[S], eff = new double[S];
            double[] one = new double[YieldChain.FIELDS], sum = new double[YieldChain.FIELDS];
            PlaneOfArray.PlaneStep plane = new PlaneOfArray.PlaneStep();
            double poaSum = 0, unobSum = 0, ib = 0, ibOf = Double.NaN;
            for (int m = first; m < first + count; m++) {
                double aoi = poa.module(m, st, beam, sky, refl, unob, plane);
                double u = 0;
                for (int k = 0; k < S; k++) {
                    poaSum += beam[k] + sky[k] + refl[k];
                    u += unob[k];
                }
                unobSum += u;
                if (Double.compare(aoi, ibOf) != 0) { // the modules of a plane share the incidence angle
                    ib = iam.beam(aoi);
                    ibOf = aoi;
                }
                chain.moduleDc(beam, sky, refl, u / S, ib, id, ig, air[st], step.windMs(), eff, one);
                for (int f = 0; f < YieldChain.FIELDS; f++) sum[f] += one[f]; // ModuleDc.plus, module by module
            }
            sPoa[st] = (float) (poaSum / (count * S));
            sUnob[st] = (float) (unobSum / (count * S));
            ModuleDc dc = new ModuleDc(sum[0], sum[1], sum[2], sum[3], sum[4], sum[5], sum[6], sum[7]);
            energy[st] = chain.acStep(dc, count, step.durationH());
            cell[st] = dc.meanCellC();
        });
        double[] monthPoa = new double[12];
        double annualPoa = 0, annualUnob = 0;
        YieldTotals totals = count > 0 ? new YieldTotals(count * module.stcPowerW()) : null;
        ZoneSeries series = count > 0 ? new ZoneSeries("zone " + zone, count * module.stcPowerW()) : null;
        for (int st = 0; st < n; st++) {
            Step step = w.step(st);
            double wh = step.weightedHours();
            monthPoa[step.month() - 1] += sPoa[st] * wh / 1000;
            annualPoa += sPoa[st] * wh / 1000;
            annualUnob += sUnob[st] * wh / 1000;
            if (count == 0) continue;
            totals.add(energy[st], step.month(), step.weightDays());
            series.add(LocalDateTime.ofInstant(step.start(), zoneId.getRules().getStandardOffset(step.start())),
                    step.durationH(), cell[st], energy[st]);
        }
        return new ZoneYield(zone, count, racked, tilt, any == null ? 0 : any.azimuthDeg(), count * module.stcPowerW() / 1000,
                count * module.areaM2(), annualPoa, annualUnob, monthPoa, totals, series, sPoa, sUnob);
    }
}
