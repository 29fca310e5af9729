package org.solmass.pv;

/**
 * How modules are placed on a PV zone (study keys under {@code pv}, docs/pv.md "Layout").
 * Defaults are common practice for an indicative layout, not a design: setbacks from roof edges and
 * obstacles are set by local fire and building codes and by the wind-load design, which this tool
 * does not know; the racking geometry by the mounting system's maker.
 *
 * @param module the module's datasheet values
 * @param setbackM distance kept from the zone outline (roof edges, obstacles, unsuitable parts),
 *                 metres; default {@value #DEFAULT_SETBACK_M} m (common practice for access and the
 *                 roof-edge wind zone; fire codes may ask for more: defer to the local code)
 * @param flatMaxTiltDeg roofs at or below this tilt get racked rows, steeper roofs flush-mounted
 *                       modules; default {@value #DEFAULT_FLAT_MAX_TILT_DEG} deg (common practice)
 * @param rackTiltDeg tilt of racked modules, degrees; default {@value #DEFAULT_RACK_TILT_DEG} deg
 *                    (common practice for low-profile racks: 10 to 20 deg)
 * @param rackAzimuthDeg azimuth racked modules face, degrees from north clockwise; NaN = toward the
 *                       equator (180 in the northern hemisphere, 0 in the southern)
 * @param groundCoverageRatio module slant depth over row pitch, (0, 1); default
 *                            {@value #DEFAULT_GCR} (common practice: 0.3 to 0.5 on roofs)
 * @param rowPitchM row pitch of racked rows, metres; 0 = from the ground-coverage ratio
 * @param rackClearanceM height of a racked module's low edge above the roof, metres; default
 *                       {@value #DEFAULT_RACK_CLEARANCE_M} m (common practice for ballasted racks)
 * @param facades also lay out flush modules on suitable facades (building-integrated PV)
 * @param dcAcRatio the arrays' STC power over their inverters' AC rating, [0.5, 3]; default
 *                  {@link Inverter#DEFAULT}'s 1.2 (common practice; docs/pv.md "Inverter")
 * @param dcOtherFactor share of DC power kept after the other DC losses (soiling, wiring, module
 *                      quality), [0.5, 1]; default {@link YieldChain#DEFAULT_DC_OTHER_FACTOR}
 */
public record LayoutOptions(ModuleSpec module, double setbackM, double flatMaxTiltDeg, double rackTiltDeg,
                            double rackAzimuthDeg, double groundCoverageRatio, double rowPitchM,
                            double rackClearanceM, boolean facades, double dcAcRatio, double dcOtherFactor) {
    public static final double DEFAULT_SETBACK_M = 1.0, DEFAULT_FLAT_MAX_TILT_DEG = 5, DEFAULT_RACK_TILT_DEG = 15,
            DEFAULT_GCR = 0.4, DEFAULT_RACK_CLEARANCE_M = 0.2;
    public static final LayoutOptions DEFAULTS = new LayoutOptions(ModuleSpec.DEFAULT, DEFAULT_SETBACK_M,
            DEFAULT_FLAT_MAX_TILT_DEG, DEFAULT_RACK_TILT_DEG, Double.NaN, DEFAULT_GCR, 0, DEFAULT_RACK_CLEARANCE_M, false);

    /** Options with the default DC/AC ratio and other-DC-loss factor. */
    public LayoutOptions(ModuleSpec module, double setbackM, double flatMaxTiltDeg, double rackTiltDeg,
                         double rackAzimuthDeg, double groundCoverageRatio, double rowPitchM,
                         double rackClearanceM, boolean facades) {
        this(module, setbackM, flatMaxTiltDeg, rackTiltDeg, rackAzimuthDeg, groundCoverageRatio, rowPitchM, rackClearanceM,
                facades, Inverter.DEFAULT.dcAcRatio(), YieldChain.DEFAULT_DC_OTHER_FACTOR);
    }

    public LayoutOptions {
        if (!(setbackM >= 0)) throw new IllegalArgumentException("setback must be >= 0: " + setbackM);
        if (!(rackTiltDeg >= 0 && rackTiltDeg <= 60)) throw new IllegalArgumentException("rack tilt must be 0..60: " + rackTiltDeg);
        if (!(groundCoverageRatio > 0 && groundCoverageRatio < 1))
            throw new IllegalArgumentException("ground-coverage ratio must lie in (0, 1): " + groundCoverageRatio);
        if (!(rowPitchM >= 0)) throw new IllegalArgumentException("row pitch must be >= 0: " + rowPitchM);
        if (!(dcAcRatio >= 0.5 && dcAcRatio <= 3)) throw new IllegalArgumentException("DC/AC ratio must lie in [0.5, 3]: " + dcAcRatio);
        if (!(dcOtherFactor >= 0.5 && dcOtherFactor <= 1)) throw new IllegalArgumentException("other-DC factor must lie in [0.5, 1]: " + dcOtherFactor);
    }

    /** The azimuth racked modules face at a site of the given latitude, degrees from north clockwise. */
    public double rackAzimuthDeg(double latitudeDeg) {
        if (!Double.isNaN(rackAzimuthDeg)) return rackAzimuthDeg;
        return latitudeDeg >= 0 ? 180 : 0;
    }

    /** Row pitch of racked rows, metres: the given pitch, else module slant depth / GCR. */
    public double pitchM() {
        return rowPitchM > 0 ? rowPitchM : module.widthM() / groundCoverageRatio;
    }

    /** Whether the DC/AC ratio and the other-DC-loss factor are the defaults. */
    public boolean defaultElectrical() {
        return dcAcRatio == Inverter.DEFAULT.dcAcRatio() && dcOtherFactor == YieldChain.DEFAULT_DC_OTHER_FACTOR;
    }

    /** The yield chain of modules laid out with these options (racked: open-rack thermal model; else flush-roof). */
    public YieldChain yieldChain(boolean racked) {
        return YieldChain.of(module, !racked, dcOtherFactor, dcAcRatio);
    }

    /** Whether a roof of this tilt gets racked rows. */
    public boolean racked(double roofTiltDeg) { return roofTiltDeg <= flatMaxTiltDeg; }
}
