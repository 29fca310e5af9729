package org.solmass.tiles;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.solmass.climate.ClimateReport;
import org.solmass.climate.Step;
import org.solmass.climate.TimeBase;
import org.solmass.climate.WeatherSeries;
import org.solmass.irradiation.IrradiationSetup;
import org.solmass.irradiation.SunCodec;
import org.solmass.sun.SunPosition;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInput;
import java.io.DataInputStream;
import java.io.DataOutput;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * The tables of a prepared study that are the same for every tile: the weather series (every step
 * with its sun position and irradiance, and the climate report) and the sun directions and step
 * table of the sky model ({@link IrradiationSetup.Sun}). A city run's driver computes them once
 * ({@link CityModel#tables}) and sends them to every executor as bytes ({@link #encode}); an
 * executor's {@link CityModel#load(java.nio.file.Path, CityTables)} takes them instead of reading
 * the climate and computing the sun and sky tables again.
 *
 * <p>Bytes rather than {@code Serializable} objects: a plain {@code byte[]} travels with Java
 * serialization and with Kryo alike, and every number goes with its raw bits ({@link SunCodec}), so
 * the tables read back hold the same doubles and the tiles' results are the same to the last bit
 * (CityTablesTest). The climate report (text and a few totals) goes as JSON.
 */
public final class CityTables {
    /** First int of the bytes ("CTB1"). */
    private static final int MAGIC = 0x43544231;
    /** The report's JSON: its derived getters (isClean) are written and ignored when read. */
    private static final ObjectMapper JSON = new ObjectMapper()
            .configure(com.fasterxml.jackson.databind.DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES, false);

    private final WeatherSeries weather;
    private final IrradiationSetup.Sun sun;

    CityTables(WeatherSeries weather, IrradiationSetup.Sun sun) {
        this.weather = weather;
        this.sun = sun;
    }

    public WeatherSeries weather() { return weather; }

    public IrradiationSetup.Sun sun() { return sun; }

    /** The tables as bytes (read back by {@link #decode}). */
    public byte[] encode() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream(1 << 16);
        try (DataOutputStream out = new DataOutputStream(bytes)) {
            out.writeInt(MAGIC);
            writeWeather(weather, out);
            SunCodec.write(sun, out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }

    /** Tables from {@link #encode}'s bytes. */
    public static CityTables decode(byte[] bytes) {
        try (DataInputStream in = new DataInputStream(new ByteArrayInputStream(bytes))) {
            int magic = in.readInt();
            if (magic != MAGIC) throw new IOException("not city tables (first int " + Integer.toHexString(magic) + ")");
            WeatherSeries w = readWeather(in);
            return new CityTables(w, SunCodec.read(in));
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read the city's tables: " + e.getMessage(), e);
        }
    }

    /** The steps column by column (raw bits), the time base, source and report. */
    static void writeWeather(WeatherSeries w, DataOutput out) throws IOException {
        writeText(out, w.source());
        writeText(out, w.timeBase().name());
        writeText(out, JSON.writeValueAsString(w.report()));
        int n = w.size();
        long[] seconds = new long[n];
        int[] nanos = new int[n], month = new int[n], day = new int[n];
        double[][] d = new double[STEP_DOUBLES][n];
        for (int s = 0; s < n; s++) {
            Step st = w.step(s);
            seconds[s] = st.start().getEpochSecond();
            nanos[s] = st.start().getNano();
            month[s] = st.month();
            day[s] = st.dayOfYear();
            double[] v = {st.durationH(), st.localStandardHour(), st.sun().azimuthDeg(), st.sun().zenithDeg(),
                    st.sunUpFraction(), st.ghiWm2(), st.dniWm2(), st.dhiWm2(), st.extraNormalWm2(), st.dryBulbC(),
                    st.windMs(), st.weightDays()};
            for (int k = 0; k < STEP_DOUBLES; k++) d[k][s] = v[k];
        }
        out.writeInt(n);
        for (long x : seconds) out.writeLong(x);
        SunCodec.writeInts(out, nanos);
        SunCodec.writeInts(out, month);
        SunCodec.writeInts(out, day);
        for (double[] col : d) SunCodec.writeDoubles(out, col);
    }

    /** The double components of a {@link Step}, in the order {@link #writeWeather} writes them. */
    private static final int STEP_DOUBLES = 12;

    static WeatherSeries readWeather(DataInput in) throws IOException {
        String source = readText(in);
        TimeBase base = TimeBase.valueOf(readText(in));
        ClimateReport report = JSON.readValue(readText(in), ClimateReport.class);
        int n = in.readInt();
        long[] seconds = new long[n];
        for (int s = 0; s < n; s++) seconds[s] = in.readLong();
        int[] nanos = SunCodec.readInts(in), month = SunCodec.readInts(in), day = SunCodec.readInts(in);
        double[][] d = new double[STEP_DOUBLES][];
        for (int k = 0; k < STEP_DOUBLES; k++) d[k] = SunCodec.readDoubles(in);
        List<Step> steps = new ArrayList<>(n);
        for (int s = 0; s < n; s++) {
            steps.add(new Step(Instant.ofEpochSecond(seconds[s], nanos[s]), d[0][s], month[s], day[s], d[1][s],
                    new SunPosition(d[2][s], d[3][s]), d[4][s], d[5][s], d[6][s], d[7][s], d[8][s], d[9][s], d[10][s], d[11][s]));
        }
        return new WeatherSeries(steps, base, source, report);
    }

    private static void writeText(DataOutput out, String s) throws IOException {
        byte[] b = s.getBytes(StandardCharsets.UTF_8);
        out.writeInt(b.length);
        out.write(b);
    }

    private static String readText(DataInput in) throws IOException {
        byte[] b = new byte[in.readInt()];
        in.readFully(b);
        return new String(b, StandardCharsets.UTF_8);
    }
}
