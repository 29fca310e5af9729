package org.solmass.model;

import org.solmass.InputException;

/**
 * How to turn OBJ coordinates into the Solmass frame (metres, x east, y north, z up).
 * Applied in this order: up axis, unit, north rotation.
 *
 * @param up which OBJ axis is up (default {@link UpAxis#Z})
 * @param unit OBJ length unit (default metres)
 * @param northDeg the angle, in degrees clockwise seen from above, from the model's +y axis (after the
 *                 up-axis mapping) to true north. 0 = the model's +y already points north. A model
 *                 whose +y points true east has north 90 degrees anticlockwise of +y, so
 *                 {@code northDeg = -90} (equivalently 270). On import the model is rotated
 *                 anticlockwise by {@code northDeg} about z: (x, y) -> (x cos a - y sin a,
 *                 x sin a + y cos a), so that afterwards +y is true north.
 */
public record ModelOptions(UpAxis up, LengthUnit unit, double northDeg) {

    public ModelOptions {
        if (up == null) up = UpAxis.Z;
        if (unit == null) unit = LengthUnit.M;
        if (!Double.isFinite(northDeg)) {
            throw new InputException("north", "north angle must be a finite number of degrees, got " + northDeg);
        }
    }

    /** Z up, metres, north = +y. */
    public static ModelOptions defaults() { return new ModelOptions(UpAxis.Z, LengthUnit.M, 0.0); }
}
