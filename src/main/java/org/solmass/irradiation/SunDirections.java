package org.solmass.irradiation;

import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.model.Vec3;

/**
 * The sun directions a study casts occlusion rays toward, and which direction stands for each step.
 *
 * <p>{@link #exact} gives every sun-up step its own direction (the step's sun position), as used for
 * monthly-average days. {@link #binned} groups the steps of a year by the {@link SkySubdivision} cell
 * their sun lies in and casts one ray per occupied cell, toward the irradiance-weighted mean direction
 * of the cell's steps (weights: DNI x weighted hours, plus a small floor so a cell of only cloudy
 * steps still has a direction). The error this adds is measured in {@code BinnedSunErrorTest} and
 * stated in docs/method.md.
 */
public final class SunDirections {
    /** Unit direction vectors toward the sun, x east, y north, z up: 3 floats per direction. */
    final float[] directions;
    /** Per step of the series: the direction index standing for it, or -1 when the sun is down. */
    final int[] stepDirection;

    SunDirections(float[] directions, int[] stepDirection) {
        this.directions = directions;
        this.stepDirection = stepDirection;
    }

    public int count() { return directions.length / 3; }

    /** Direction index of step {@code s}, or -1 when its sun is down. */
    public int ofStep(int s) { return stepDirection[s]; }

    public Vec3 direction(int d) { return new Vec3(directions[3 * d], directions[3 * d + 1], directions[3 * d + 2]); }

    /**
     * The directions {@code dirs[3i..3i+2]} (i &lt; count) in front of a plane of normal n (n . d &gt; 0),
     * in index order, into {@code outDir} from index {@code at}, with their far-horizon answers
     * {@code far[i]} and their indices i; returns the new end. The one "sun in front" of the first pass
     * and of the PV modules' rays.
     */
    public static int inFront(double[] dirs, boolean[] far, int count, double nx, double ny, double nz,
                              double[] outDir, boolean[] outFar, int[] outIndex, int at) {
        int m = at;
        for (int i = 0; i < count; i++) {
            double dx = dirs[3 * i], dy = dirs[3 * i + 1], dz = dirs[3 * i + 2];
            if (nx * dx + ny * dy + nz * dz <= 0) continue;
            outDir[3 * m] = dx;
            outDir[3 * m + 1] = dy;
            outDir[3 * m + 2] = dz;
            outFar[m] = far[i];
            outIndex[m++] = i;
        }
        return m;
    }

    /** One direction per sun-up step. */
    public static SunDirections exact(WeatherSeries series) {
        int n = series.size();
        int[] of = new int[n];
        float[] dirs = new float[3 * n];
        int count = 0;
        for (int s = 0; s < n; s++) {
            Step st = series.step(s);
            if (!isSunUp(st)) {
                of[s] = -1;
                continue;
            }
            Vec3 d = st.sun().direction();
            dirs[3 * count] = (float) d.x();
            dirs[3 * count + 1] = (float) d.y();
            dirs[3 * count + 2] = (float) d.z();
            of[s] = count++;
        }
        return new SunDirections(java.util.Arrays.copyOf(dirs, 3 * count), of);
    }

    /** One direction per occupied cell of the subdivision. */
    public static SunDirections binned(WeatherSeries series, SkySubdivision sky) {
        int n = series.size();
        int[] cellOfStep = new int[n];
        double[] sum = new double[3 * sky.cellCount()];
        for (int s = 0; s < n; s++) {
            Step st = series.step(s);
            if (!isSunUp(st)) {
                cellOfStep[s] = -1;
                continue;
            }
            int c = sky.cellOf(st.sun().azimuthDeg(), st.sun().elevationDeg());
            cellOfStep[s] = c;
            double w = (Math.max(0, st.dniWm2()) + 1.0) * st.weightedHours();
            Vec3 d = st.sun().direction();
            sum[3 * c] += w * d.x();
            sum[3 * c + 1] += w * d.y();
            sum[3 * c + 2] += w * d.z();
        }
        int[] index = new int[sky.cellCount()];
        java.util.Arrays.fill(index, -1);
        float[] dirs = new float[3 * sky.cellCount()];
        int count = 0;
        for (int c = 0; c < sky.cellCount(); c++) {
            double x = sum[3 * c], y = sum[3 * c + 1], z = sum[3 * c + 2];
            double l = Math.sqrt(x * x + y * y + z * z);
            if (l == 0) continue;
            dirs[3 * count] = (float) (x / l);
            dirs[3 * count + 1] = (float) (y / l);
            dirs[3 * count + 2] = (float) (z / l);
            index[c] = count++;
        }
        int[] of = new int[n];
        for (int s = 0; s < n; s++) of[s] = cellOfStep[s] < 0 ? -1 : index[cellOfStep[s]];
        return new SunDirections(java.util.Arrays.copyOf(dirs, 3 * count), of);
    }

    /** A step counts as sun-up for ray casting when part of it has the sun above the horizon. */
    static boolean isSunUp(Step st) {
        return st.sunUpFraction() > 0 && st.sun().elevationDeg() > 0;
    }
}
