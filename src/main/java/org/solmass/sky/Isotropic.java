package org.solmass.sky;

import org.solmass.climate.Step;

/**
 * Isotropic sky of Liu &amp; Jordan (1963, Solar Energy 7(2) 53-74), Duffie &amp; Beckman (2013)
 * eq. 2.15.1: sky diffuse on a plane = DHI (1 + cos b)/2. Any tilt.
 */
public final class Isotropic implements SkyModel {
    public static final Isotropic INSTANCE = new Isotropic();

    private Isotropic() {}

    @Override public String name() { return "isotropic"; }
    @Override public double circumsolarCoefficient(Step step) { return 0; }
    @Override public double horizonCoefficient(Step step) { return 0; }
}
