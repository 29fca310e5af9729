package org.solmass.viewer;

import org.solmass.surface.Patch;

import java.util.List;

/**
 * The patches at or above a value ("enough sun for this use") and their area.
 *
 * @param count number of patches with a finite value at or above the threshold
 * @param areaM2 their total area, square metres
 * @param totalAreaM2 area of all patches with a finite value, square metres
 */
public record Threshold(int count, double areaM2, double totalAreaM2) {

    public static Threshold of(List<Patch> patches, double[] values, double threshold) {
        int n = 0;
        double a = 0, tot = 0;
        for (int i = 0; i < values.length; i++) {
            double v = values[i];
            if (!Double.isFinite(v)) continue;
            double ar = patches.get(i).areaM2();
            tot += ar;
            if (v >= threshold) {
                n++;
                a += ar;
            }
        }
        return new Threshold(n, a, tot);
    }

    /** Share of the analysed area at or above the threshold, 0..1 (0 when there is none). */
    public double share() { return totalAreaM2 > 0 ? areaM2 / totalAreaM2 : 0; }
}
