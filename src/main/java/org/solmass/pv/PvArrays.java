package org.solmass.pv;

import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.SunDirections;
import org.solmass.scene.Scene;
import org.solmass.sky.SkyModel;

import java.util.ArrayList;
import java.util.List;

/**
 * The PV stage of a run: the racks become geometry, every module substring's plane-of-array
 * irradiance is computed for every step, and each zone's modules are summed into a {@link ZoneYield}
 * (docs/metrics.md "PV layout" and "PV yield").
 *
 * <p>Racked modules are added to the ray scene ({@link Scene#withTriangles}) so that inter-row
 * shading and shading by parapets come from the ray engine; flush-mounted modules lie on their
 * surface and are not added (they would coincide with it).
 */
public final class PvArrays {
    private PvArrays() {}

    /**
     * Settings of the yield sums.
     *
     * @param performanceRatio the factor from plane-of-array irradiation to AC energy
     *                         (IEC 61724-1 performance ratio, with the reference on the obstructed planes)
     * @param rays hemisphere rays per substring
     * @param runSeed seed of the run's ray streams
     * @param along sample points along a substring
     * @param across sample points across a substring
     */
    public record Settings(double performanceRatio, int rays, long runSeed, int along, int across) {}

    /**
     * The modules of every zone, their sight and plane-of-array irradiance, and each zone's yield.
     *
     * @param sightS seconds spent on the rays (scene with racks, visibilities, view factors)
     * @param yieldS seconds spent on the step-by-step sums
     */
    public record Result(List<PvModule> modules, PlaneOfArray poa, List<ZoneYield> zones, double sightS, double yieldS) {}

    /**
     * @param scene the model's scene
     * @param modelIsGround per model triangle: ground or not
     * @param zones per zone (in order of {@code zoneIds}): its modules
     * @param zoneIds zone ids
     */
    public static Result run(Scene scene, boolean[] modelIsGround, List<List<PvModule>> zones, int[] zoneIds,
                             ModuleSpec module, WeatherSeries weather, SkyModel sky, SunDirections sun,
                             double groundAlbedo, Settings s) {
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
            out.add(zoneYield(poa, zoneIds[z], first, count, module, s));
            first += count;
        }
        return new Result(List.copyOf(all), poa, List.copyOf(out), (t1 - t0) / 1e9, (System.nanoTime() - t1) / 1e9);
    }

    /** Sums modules {@code first .. first + count - 1} step by step. */
    static ZoneYield zoneYield(PlaneOfArray poa, int zone, int first, int count, ModuleSpec module, Settings s) {
        WeatherSeries w = poa.weather();
        int n = w.size(), S = module.bypassSubstrings();
        double[] beam = new double[S], sky = new double[S], refl = new double[S], unob = new double[S];
        float[] sPoa = new float[n], sUnob = new float[n], sYield = new float[n];
        double[] monthPoa = new double[12], monthYield = new double[12];
        double annualPoa = 0, annualUnob = 0, annualYield = 0;
        double area = module.areaM2();
        double kw = count * module.stcPowerW() / 1000;
        for (int st = 0; st < n; st++) {
            Step step = w.step(st);
            double poaSum = 0, unobSum = 0;
            for (int m = first; m < first + count; m++) {
                poa.module(m, st, beam, sky, refl, unob);
                for (int k = 0; k < S; k++) {
                    poaSum += beam[k] + sky[k] + refl[k];
                    unobSum += unob[k];
                }
            }
            double meanPoa = count > 0 ? poaSum / (count * S) : 0, meanUnob = count > 0 ? unobSum / (count * S) : 0;
            double stepWh = kw * meanPoa * s.performanceRatio() * step.durationH(); // kW x W/m2 / (1 kW/m2) x h = Wh
            sPoa[st] = (float) meanPoa;
            sUnob[st] = (float) meanUnob;
            sYield[st] = (float) stepWh;
            double wh = step.weightedHours();
            monthPoa[step.month() - 1] += meanPoa * wh / 1000;
            monthYield[step.month() - 1] += stepWh * step.weightDays() / 1000;
            annualPoa += meanPoa * wh / 1000;
            annualUnob += meanUnob * wh / 1000;
            annualYield += stepWh * step.weightDays() / 1000;
        }
        PvModule any = count > 0 ? poa.sight().modules().get(first) : null;
        return new ZoneYield(zone, count, any != null && any.racked(), any == null ? 0 : any.tiltDeg(),
                any == null ? 0 : any.azimuthDeg(), kw, count * area, annualPoa, annualUnob, monthPoa, annualYield,
                monthYield, sPoa, sUnob, sYield);
    }
}
