package org.solmass.irradiation;

import org.solmass.sky.SkyPatches;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;
import java.nio.ByteBuffer;

/**
 * The sun directions and the step table of a run ({@link IrradiationSetup.Sun}) written as bytes and
 * read back, so that a city run's driver computes them once and its executors read them
 * (the city package's tables) instead of computing them again. Every number goes with its raw
 * bits ({@link Double#doubleToRawLongBits}, {@link Float#floatToRawIntBits}): the tables read back
 * hold the same doubles as those written, and every result made from them is the same to the last bit.
 * The array helpers serve the city tables' weather series too.
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

    /** Length (-1 for null), then each value's raw bits (big-endian), in one write. */
    public static void writeDoubles(DataOutput out, double[] a) throws IOException {
        out.writeInt(a == null ? -1 : a.length);
        if (a == null) return;
        ByteBuffer b = ByteBuffer.allocate(8 * a.length);
        for (double v : a) b.putLong(Double.doubleToRawLongBits(v));
        out.write(b.array());
    }

    public static double[] readDoubles(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0) return null;
        ByteBuffer b = read(in, 8L * n);
        double[] a = new double[n];
        for (int i = 0; i < n; i++) a[i] = Double.longBitsToDouble(b.getLong());
        return a;
    }

    public static void writeFloats(DataOutput out, float[] a) throws IOException {
        out.writeInt(a == null ? -1 : a.length);
        if (a == null) return;
        ByteBuffer b = ByteBuffer.allocate(4 * a.length);
        for (float v : a) b.putInt(Float.floatToRawIntBits(v));
        out.write(b.array());
    }

    public static float[] readFloats(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0) return null;
        ByteBuffer b = read(in, 4L * n);
        float[] a = new float[n];
        for (int i = 0; i < n; i++) a[i] = Float.intBitsToFloat(b.getInt());
        return a;
    }

    public static void writeInts(DataOutput out, int[] a) throws IOException {
        out.writeInt(a == null ? -1 : a.length);
        if (a == null) return;
        ByteBuffer b = ByteBuffer.allocate(4 * a.length);
        for (int v : a) b.putInt(v);
        out.write(b.array());
    }

    public static int[] readInts(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0) return null;
        ByteBuffer b = read(in, 4L * n);
        int[] a = new int[n];
        for (int i = 0; i < n; i++) a[i] = b.getInt();
        return a;
    }

    private static ByteBuffer read(DataInput in, long bytes) throws IOException {
        if (bytes > Integer.MAX_VALUE) throw new IOException("an array of " + bytes + " bytes");
        byte[] b = new byte[(int) bytes];
        in.readFully(b);
        return ByteBuffer.wrap(b);
    }
}
