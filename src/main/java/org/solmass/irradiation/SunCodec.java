package org.solmass.irradiation;

import org.solmass.sky.SkyPatches;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;

/**
 * The sun directions and the step table of a run ({@link IrradiationSetup.Sun}) written as bytes and
 * read back, so that a city run's driver computes them once and its executors read them
 * (org.solmass.tiles.CityTables) instead of computing them again. Every number goes with its raw
 * bits ({@link Double#doubleToRawLongBits}, {@link Float#floatToRawIntBits}): the tables read back
 * hold the same doubles as those written, and every result made from them is the same to the last bit.
 * The array helpers serve the weather series too (CityTables).
 */
public final class SunCodec {
    /** First int of the bytes ("SUN1"), to refuse bytes of another kind. */
    static final int MAGIC = 0x53554E31;

    private SunCodec() {}

    public static void write(IrradiationSetup.Sun sun, DataOutput out) throws IOException {
        out.writeInt(MAGIC);
        writeFloats(out, sun.directions.directions);
        writeInts(out, sun.directions.stepDirection);
        StepTable st = sun.steps;
        writeFloats(out, st.sx);
        writeFloats(out, st.sy);
        writeFloats(out, st.sz);
        writeInts(out, st.direction);
        writeInts(out, st.slot);
        writeDoubles(out, st.beamWh);
        writeDoubles(out, st.circumsolarWh);
        writeDoubles(out, st.sunshineHours);
        out.writeLong(Double.doubleToRawLongBits(st.siteSunshineHours));
        writeFloats(out, st.cosZenith);
        writeDoubles(out, st.backgroundWh);
        writeDoubles(out, st.horizonWh);
        writeDoubles(out, st.ghiWh);
        writeDoubles(out, st.dhiWh);
        writeDoubles(out, st.hours);
        if (st.skyPatches != null && st.skyPatches != SkyPatches.TREGENZA) {
            throw new IllegalStateException("only the Tregenza sky patches can be written");
        }
        out.writeBoolean(st.skyPatches != null);
        writeDoubles(out, st.skyWh);
    }

    public static IrradiationSetup.Sun read(DataInput in) throws IOException {
        int magic = in.readInt();
        if (magic != MAGIC) throw new IOException("not sun tables (first int " + Integer.toHexString(magic) + ")");
        SunDirections dirs = new SunDirections(readFloats(in), readInts(in));
        float[] sx = readFloats(in), sy = readFloats(in), sz = readFloats(in);
        int[] direction = readInts(in), slot = readInts(in);
        double[] beam = readDoubles(in), circumsolar = readDoubles(in), sunshine = readDoubles(in);
        double site = Double.longBitsToDouble(in.readLong());
        float[] cosZenith = readFloats(in);
        double[][] perSlot = {readDoubles(in), readDoubles(in), readDoubles(in), readDoubles(in), readDoubles(in)};
        SkyPatches patches = in.readBoolean() ? SkyPatches.TREGENZA : null;
        double[] skyWh = readDoubles(in);
        StepTable st = new StepTable(sx, sy, sz, direction, slot, beam, circumsolar, sunshine, site, cosZenith, perSlot,
                patches, skyWh);
        return new IrradiationSetup.Sun(dirs, st);
    }

    /** Length (-1 for null), then each value's raw bits. */
    public static void writeDoubles(DataOutput out, double[] a) throws IOException {
        out.writeInt(a == null ? -1 : a.length);
        if (a != null) for (double v : a) out.writeLong(Double.doubleToRawLongBits(v));
    }

    public static double[] readDoubles(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0) return null;
        double[] a = new double[n];
        for (int i = 0; i < n; i++) a[i] = Double.longBitsToDouble(in.readLong());
        return a;
    }

    public static void writeFloats(DataOutput out, float[] a) throws IOException {
        out.writeInt(a == null ? -1 : a.length);
        if (a != null) for (float v : a) out.writeInt(Float.floatToRawIntBits(v));
    }

    public static float[] readFloats(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0) return null;
        float[] a = new float[n];
        for (int i = 0; i < n; i++) a[i] = Float.intBitsToFloat(in.readInt());
        return a;
    }

    public static void writeInts(DataOutput out, int[] a) throws IOException {
        out.writeInt(a == null ? -1 : a.length);
        if (a != null) for (int v : a) out.writeInt(v);
    }

    public static int[] readInts(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0) return null;
        int[] a = new int[n];
        for (int i = 0; i < n; i++) a[i] = in.readInt();
        return a;
    }
}
