package org.solmass.irradiation;

import java.io.Serializable;
import java.util.List;

/**
 * The first pass of a set of receivers in the global numbering of a {@link ReceiverLayout}: what
 * {@link StagedPasses#firstPass} computed for them and what the later stages need from it
 * (plain arrays, {@link Serializable}, so that a distributed runner can ship it between stages).
 * Entry i belongs to receiver {@code ids[i]}; per-month values are {@code [i * 12 + month0]}.
 * The extras of analysed patches (view factors, the overcast-sky sum of the vertical sky component,
 * beam and diffuse per month, unshaded, sunshine hours) are 0 for context patches and ground probes.
 */
public final class FirstPasses implements Serializable {
    private static final long serialVersionUID = 1L;

    /** Global receiver ids, ascending. */
    final int[] ids;
    /** First pass (beam + sky diffuse) per receiver and month, Wh/m2. */
    final double[] monthWh;
    /** Reflector lists: global ids hit and weights (see {@link Reflection.Lists}). */
    final int[][] refIdx;
    final float[][] refW, refW2;
    final float[] ghiW, ghiW2;
    /** Analysed patches' view factors, standard error, horizon-band visibility, unshaded (Wh/m2), sunshine hours. */
    final double[] svf, gvf, obs, svfSe, horizonVis, unshadedWh, sunshineH;
    /** Analysed patches' sky component under the CIE overcast sky, percent. */
    final double[] overcastPct;
    /** Analysed patches' beam and sky diffuse per month, Wh/m2. */
    final double[] beamMonthWh, diffuseMonthWh;
    /** Tree crowns' factor on reflected light per month, or null without trees. */
    final float[] canopyReflection;

    FirstPasses(int n, boolean canopy) {
        ids = new int[n];
        monthWh = new double[12 * n];
        refIdx = new int[n][];
        refW = new float[n][];
        refW2 = new float[n][];
        ghiW = new float[n];
        ghiW2 = new float[n];
        svf = new double[n];
        gvf = new double[n];
        obs = new double[n];
        svfSe = new double[n];
        horizonVis = new double[n];
        overcastPct = new double[n];
        unshadedWh = new double[n];
        sunshineH = new double[n];
        beamMonthWh = new double[12 * n];
        diffuseMonthWh = new double[12 * n];
        canopyReflection = canopy ? new float[12 * n] : null;
    }

    /** Number of receivers held. */
    public int size() { return ids.length; }

    /** Global id of entry i. */
    public int id(int i) { return ids[i]; }

    /** The global ids held (a copy), ascending. */
    public int[] ids() { return ids.clone(); }

    /** First pass of entry i in month {@code month0} (0 = January), Wh/m2. */
    public double monthWh(int i, int month0) { return monthWh[12 * i + month0]; }

    /** Global ids entry i reflects light from (a copy). */
    public int[] reflectors(int i) { return refIdx[i].clone(); }

    /** Obstructed sky view factor of entry i (an analysed patch). */
    public double skyViewFactor(int i) { return svf[i]; }

    /** Approximate bytes held (for memory reports of a task). */
    public long bytes() {
        long b = 4L * ids.length + 8L * (monthWh.length + beamMonthWh.length + diffuseMonthWh.length) + 8L * 8 * ids.length;
        for (int i = 0; i < ids.length; i++) b += 16 + 12L * refIdx[i].length;
        return b;
    }

    /** The entries of all parts in one, ordered by global id (every id at most once). */
    public static FirstPasses concat(List<FirstPasses> parts) {
        int n = 0;
        boolean canopy = false;
        for (FirstPasses p : parts) {
            n += p.size();
            canopy |= p.canopyReflection != null;
        }
        int[] start = new int[parts.size() + 1];
        long[] order = new long[n];
        int k = 0;
        for (int q = 0; q < parts.size(); q++) {
            start[q] = k;
            for (int i = 0; i < parts.get(q).size(); i++, k++) order[k] = ((long) parts.get(q).ids[i] << 32) | k;
        }
        start[parts.size()] = k;
        java.util.Arrays.sort(order);
        FirstPasses out = new FirstPasses(n, canopy);
        for (int j = 0; j < n; j++) {
            int at = (int) order[j];
            int q = java.util.Arrays.binarySearch(start, at);
            if (q < 0) q = -q - 2;
            while (q + 1 < start.length && start[q + 1] == at) q++; // skip empty parts
            FirstPasses p = parts.get(q);
            int i = at - start[q];
            if (j > 0 && out.ids[j - 1] == p.ids[i]) throw new IllegalArgumentException("receiver " + p.ids[i] + " twice");
            out.copy(j, p, i);
        }
        return out;
    }

    void copy(int j, FirstPasses p, int i) {
        ids[j] = p.ids[i];
        System.arraycopy(p.monthWh, 12 * i, monthWh, 12 * j, 12);
        System.arraycopy(p.beamMonthWh, 12 * i, beamMonthWh, 12 * j, 12);
        System.arraycopy(p.diffuseMonthWh, 12 * i, diffuseMonthWh, 12 * j, 12);
        if (canopyReflection != null && p.canopyReflection != null)
            System.arraycopy(p.canopyReflection, 12 * i, canopyReflection, 12 * j, 12);
        refIdx[j] = p.refIdx[i];
        refW[j] = p.refW[i];
        refW2[j] = p.refW2[i];
        ghiW[j] = p.ghiW[i];
        ghiW2[j] = p.ghiW2[i];
        svf[j] = p.svf[i];
        gvf[j] = p.gvf[i];
        obs[j] = p.obs[i];
        svfSe[j] = p.svfSe[i];
        horizonVis[j] = p.horizonVis[i];
        overcastPct[j] = p.overcastPct[i];
        unshadedWh[j] = p.unshadedWh[i];
        sunshineH[j] = p.sunshineH[i];
    }
}
