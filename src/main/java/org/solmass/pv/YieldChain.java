package org.solmass.pv;

import java.util.List;

/**
 * The yield chain of a PV array for one time step: plane-of-array irradiance per module substring to
 * AC energy, each loss its own quantity (docs/pv.md). Per module, in this order:
 * <ol>
 *   <li>reference: STC power x unobstructed irradiance / 1000 W/m2 (IEC 61724-1 reference yield);</li>
 *   <li>shading: the same for unobstructed minus obstructed irradiance (measured by the caller);</li>
 *   <li>incidence: per substring, beam x IAM_b(incidence) + sky x IAM_d(tilt) + reflected x IAM_g(tilt)
 *       ({@link IncidenceAngleModifier}, Martin and Ruiz 2001);</li>
 *   <li>mismatch: the substrings' effective irradiances with bypass diodes ({@link SubstringMismatch});</li>
 *   <li>temperature: power x (1 + gamma (T_cell - 25 C)), gamma the module's temperature coefficient
 *       ({@link ModuleSpec#tempCoeffPerK()}), T_cell from the module's mean obstructed irradiance, air
 *       temperature and wind ({@link CellTemperature}, Faiman 2008);</li>
 *   <li>other DC losses: one factor (default {@link #DEFAULT_DC_OTHER_FACTOR});</li>
 * </ol>
 * then for the modules sharing inverters: inverter efficiency and clipping ({@link Inverter}) with an
 * AC rating of the modules' STC power over the DC/AC ratio. Power is taken linear in effective
 * irradiance (no low-irradiance efficiency change; common simplification, stated in docs/pv.md).
 *
 * @param module        the module datasheet
 * @param iam           incidence-angle modifier
 * @param thermal       cell-temperature model
 * @param dcOtherFactor share of DC power kept after soiling, wiring, module quality and light-induced
 *                      degradation, (0, 1]
 * @param inverter      inverter curve and DC/AC ratio
 */
public record YieldChain(ModuleSpec module, IncidenceAngleModifier iam, CellTemperature thermal,
                         double dcOtherFactor, Inverter inverter) {

    /**
     * Other DC losses as one factor: 0.95, i.e. about 2 % soiling, 1.5 % DC wiring and 1.5 % module
     * quality and light-induced degradation (common practice for a new, cleaned-by-rain system).
     */
    public static final double DEFAULT_DC_OTHER_FACTOR = 0.95;

    public YieldChain {
        if (!(dcOtherFactor > 0 && dcOtherFactor <= 1)) throw new IllegalArgumentException("other-losses factor must lie in (0, 1]: " + dcOtherFactor);
    }

    /**
     * The documented defaults for a module: standard glass (ar 0.16), free-standing or flush-roof
     * thermal preset, other-losses factor 0.95, default inverter (DC/AC 1.2).
     */
    public static YieldChain defaults(ModuleSpec module, boolean roofFlush) {
        return of(module, roofFlush, DEFAULT_DC_OTHER_FACTOR, Inverter.DEFAULT.dcAcRatio());
    }

    /**
     * The documented defaults with a given other-losses factor and DC/AC ratio (study keys
     * {@code pv.other_dc_losses_pct} and {@code pv.dc_ac_ratio}); the default inverter curve.
     */
    public static YieldChain of(ModuleSpec module, boolean roofFlush, double dcOtherFactor, double dcAcRatio) {
        Inverter inv = dcAcRatio == Inverter.DEFAULT.dcAcRatio() ? Inverter.DEFAULT
                : new Inverter(Inverter.DEFAULT.p0(), Inverter.DEFAULT.v(), Inverter.DEFAULT.r(), dcAcRatio);
        return new YieldChain(module, IncidenceAngleModifier.STANDARD_GLASS,
                roofFlush ? CellTemperature.ROOF_FLUSH : CellTemperature.FREE_STANDING, dcOtherFactor, inv);
    }

    /**
     * DC power of one module at one instant.
     *
     * @param in     the module's plane-of-array irradiance
     * @param airC   air temperature, C (NaN: {@link CellTemperature#DEFAULT_AIR_C}; fill from the month
     *               mean first with {@link CellTemperature#fillAir})
     * @param windMs wind speed, m/s (NaN: {@link CellTemperature#DEFAULT_WIND_MS})
     */
    public ModuleDc moduleDc(ModuleIrradiance in, double airC, double windMs) {
        double[] q = new double[FIELDS];
        moduleDc(in.beamWm2(), in.skyWm2(), in.reflectedWm2(), in.unobstructedWm2(), iam.beam(in.incidenceDeg()),
                iam.skyDiffuse(in.tiltDeg()), iam.groundReflected(in.tiltDeg()), airC, windMs, new double[in.substrings()], q);
        return new ModuleDc(q[0], q[1], q[2], q[3], q[4], q[5], q[6], q[7]);
    }

    /** Quantities of {@link ModuleDc}, in its field order. */
    static final int FIELDS = 8;

    /**
     * {@link #moduleDc(ModuleIrradiance, double, double)} on flat arrays, without allocating: for the
     * yield of a zone, which calls it for every module and step with the incidence-angle modifiers
     * worked out once per plane ({@code ib}) and per zone ({@code id}, {@code ig}). The one formula
     * of the chain; {@code out} gets the module's {@link ModuleDc} fields in their order.
     *
     * @param beam     beam and circumsolar per substring, W/m2 (as {@link ModuleIrradiance#beamWm2})
     * @param sky      sky diffuse per substring, W/m2
     * @param refl     reflected per substring, W/m2
     * @param unobstructedWm2 the unobstructed plane's irradiance, W/m2
     * @param ib       {@link IncidenceAngleModifier#beam} of the incidence angle
     * @param id       {@link IncidenceAngleModifier#skyDiffuse} of the tilt
     * @param ig       {@link IncidenceAngleModifier#groundReflected} of the tilt
     * @param eff      scratch, one per substring
     * @param out      the {@link #FIELDS} quantities
     */
    void moduleDc(double[] beam, double[] sky, double[] refl, double unobstructedWm2, double ib, double id, double ig,
                  double airC, double windMs, double[] eff, double[] out) {
        if (Double.isNaN(unobstructedWm2)) // as ModuleIrradiance refuses it (the incidence comes from acos of a finite cosine)
            throw new IllegalArgumentException("unobstructed irradiance must be a number");
        double pPerWm2 = module.stcPowerW() / 1000;
        int n = eff.length;
        double unobstructed = Math.max(0, unobstructedWm2);
        double obstructed = ModuleIrradiance.obstructedMeanWm2(beam, sky, refl);
        for (int i = 0; i < n; i++) eff[i] = beam[i] * ib + sky[i] * id + refl[i] * ig;
        double effMean = SubstringMismatch.meanWm2(eff);
        double equivalent = SubstringMismatch.equivalentWm2(eff);
        double cell = thermal.cellC(obstructed, airC, windMs);
        double pMismatch = pPerWm2 * equivalent;
        double pTemp = Math.max(0, pMismatch * (1 + module.tempCoeffPerK() * (cell - 25)));
        double pDc = pTemp * dcOtherFactor;
        double ref = pPerWm2 * unobstructed;
        out[0] = ref;
        out[1] = ref - pPerWm2 * obstructed;
        out[2] = pPerWm2 * (obstructed - effMean);
        out[3] = pPerWm2 * effMean - pMismatch;
        out[4] = pMismatch - pTemp;
        out[5] = pTemp - pDc;
        out[6] = pDc;
        out[7] = cell * ref;
    }

    /**
     * AC side of one step for modules whose DC power is summed in dc (they share inverters rated at
     * their STC power over the DC/AC ratio).
     *
     * @param dc        DC power summed over the modules, W
     * @param modules   number of modules summed (sets the array's STC power and AC rating)
     * @param durationH step length, hours
     * @return the step's energies, Wh
     */
    public EnergyBalance acStep(ModuleDc dc, int modules, double durationH) {
        if (modules < 1) throw new IllegalArgumentException("at least one module: " + modules);
        Inverter.Conversion c = inverter.convert(dc.dcW(), inverter.acRatingW(modules * module.stcPowerW()));
        double h = durationH;
        return new EnergyBalance(dc.referenceW() * h, dc.shadingW() * h, dc.incidenceW() * h, dc.mismatchW() * h,
                dc.temperatureW() * h, dc.dcOtherW() * h, c.lossW() * h, c.clippedW() * h, c.acW() * h);
    }

    /**
     * One step for a group of modules that share inverters: {@link #moduleDc} per module, summed,
     * then {@link #acStep}.
     */
    public EnergyBalance step(List<ModuleIrradiance> modules, double airC, double windMs, double durationH) {
        return acStep(dcSum(modules, airC, windMs), modules.size(), durationH);
    }

    /** DC power summed over modules, W. */
    public ModuleDc dcSum(List<ModuleIrradiance> modules, double airC, double windMs) {
        ModuleDc sum = ModuleDc.ZERO;
        for (ModuleIrradiance m : modules) sum = sum.plus(moduleDc(m, airC, windMs));
        return sum;
    }
}
