package org.solmass.tiles;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.solmass.fixtures.Boxes;
import org.solmass.irradiation.FirstPasses;
import org.solmass.irradiation.IrradiationSetup;
import org.solmass.irradiation.PhaseProgress;
import org.solmass.irradiation.StagedPasses;
import org.solmass.table.Column;
import org.solmass.table.ResultTable;

import java.lang.reflect.Field;
import java.lang.reflect.Modifier;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The tables a city run's driver computes once and sends to its executors ({@link CityTables}): read
 * back, they hold the same bits in every field, and a {@link CityModel} built the way an executor
 * builds it (from the study file and the tables' bytes, the climate file gone) neither reads the
 * climate nor computes the sun and sky tables, and gives the driver's tile rows to the last bit.
 * Also the finish stage's per-tile form of the reflection ({@link StagedPasses.TileReflected}): its
 * arrays follow the tile, and a total it lacks is refused. Exact equality throughout: the
 * bytes carry raw bits, so nothing may differ, not even by rounding.
 */
class CityTablesTest {
    @TempDir Path dir;

    /**
     * Street of five boxes (two context), with the bundled invented hourly year (sample-massing)
     * copied beside it, and the given sky model.
     */
    private Path study(String sky) throws Exception {
        StringBuilder obj = new StringBuilder();
        obj.append(Boxes.onGround(0, 0, 12, 10, 15).obj("a"));
        obj.append(Boxes.onGround(20, 0, 30, 10, 24).obj("b"));
        obj.append(Boxes.onGround(0, 18, 10, 28, 9).obj("c"));
        obj.append(Boxes.onGround(22, 20, 32, 30, 30).obj("tower"));
        obj.append(Boxes.onGround(40, 5, 48, 15, 12).obj("d"));
        Boxes.write(dir, "m.obj", obj.toString());
        Files.copy(Path.of("sample-massing/veldhaven-year.csv"), dir.resolve("year.csv"));
        Path sf = dir.resolve("s.json");
        Files.writeString(sf, "{\"model\": {\"file\": \"m.obj\", \"context\": [\"tower\", \"d\"]},"
                + " \"site\": {\"latitude\": 51.0, \"longitude\": 10.0, \"zone\": \"Europe/Berlin\"},"
                + " \"climate\": {\"source\": \"year.csv\", \"interval_label\": \"start\"}, \"sky\": \"" + sky + "\","
                + " \"patch_m\": 2, \"rays\": 64, \"ground_irradiance\": \"shaded\", \"sun_hours\": {\"dates\": [\"03-21\"]}}");
        return sf;
    }

    @Test
    void tablesReadBackHoldTheSameBitsInEveryField() throws Exception {
        for (String sky : List.of("perez", "perez-1993")) { // a three-part sky, and a radiance distribution (sky patch table)
            Path sf = study(sky);
            CityTables t = CityModel.load(sf).tables();
            CityTables back = CityTables.decode(t.encode());
            assertEquals(t.weather(), back.weather(), sky + ": weather series (every step, source, time base, report)");
            assertFieldsEqual(t.sun().directions(), back.sun().directions(), sky + ": sun directions");
            Object steps = field(t.sun(), "steps"), stepsBack = field(back.sun(), "steps");
            assertFieldsEqual(steps, stepsBack, sky + ": step table");
            if (sky.equals("perez-1993")) assertTrue(field(steps, "skyWh") != null, "the radiance distribution's patch table is written");
            Files.delete(dir.resolve("year.csv"));
            Files.delete(sf);
        }
    }

    @Test
    void anExecutorsModelFromTheTablesGivesTheDriversRowsWithoutComputingThem() throws Exception {
        Path sf = study("perez");
        CityModel driver = CityModel.load(sf);
        byte[] bytes = driver.tables().encode();
        Files.delete(dir.resolve("year.csv")); // an executor that read the climate again would fail here

        long computed = IrradiationSetup.Sun.computedCount();
        CityModel executor = CityModel.load(sf, CityTables.decode(bytes));
        assertNotSame(driver.sun(), executor.sun(), "the executor's tables are its own, read from the bytes");
        assertNotSame(driver.prepared(), executor.prepared());

        CityOptions o = CityOptions.defaults().withTileM(15);
        LocalCityRunner.CityRun a = LocalCityRunner.run(driver, o, PhaseProgress.NONE);
        LocalCityRunner.CityRun b = LocalCityRunner.run(executor, o, PhaseProgress.NONE);
        assertEquals(computed, IrradiationSetup.Sun.computedCount(), "no sun directions or step table computed for the executor");
        assertTrue(a.plan().tiles().size() > 1, "several tiles");
        assertTablesIdentical(a.table(), b.table());
        assertArrayEquals(a.reflected().bounceWh(), b.reflected().bounceWh());
    }

    @Test
    void aTilesPartOfTheReflectionFollowsTheTileAndGivesTheSameRows() throws Exception {
        Path sf = study("perez");
        CityModel city = CityModel.load(sf);
        CityPlan plan = city.plan(CityOptions.defaults().withTileM(15));
        List<FirstPasses> firsts = new ArrayList<>();
        for (Tile t : plan.tiles()) firsts.add(city.firstPass(t));
        StagedPasses.Reflected whole = city.reflect(firsts);
        for (Tile t : plan.tiles()) {
            FirstPasses fp = firsts.get(t.index());
            // as a distributed finish task gets it: its own receivers' sums, and the totals it reads
            int[] own = fp.ids();
            double[] refl = new double[12 * own.length], total = new double[own.length];
            for (int i = 0; i < own.length; i++) {
                if (own[i] < plan.analysedCount()) System.arraycopy(whole.reflMonthWh(), 12 * own[i], refl, 12 * i, 12);
                total[i] = whole.totalAnnualWh()[own[i]];
            }
            int[] got = org.solmass.irradiation.TileBounces.needed(fp);
            double[] gotTotal = new double[got.length];
            for (int k = 0; k < got.length; k++) gotTotal[k] = whole.totalAnnualWh()[got[k]];
            StagedPasses.TileReflected part = StagedPasses.TileReflected.of(plan.analysedCount(), own, refl, total, got, gotTotal,
                    whole.bounceWh(), whole.converged(), whole.tolerance(), whole.maxBounces());

            assertEquals(t.analysedCount(plan.analysedCount()), part.ids().length);
            assertEquals(12 * part.ids().length, part.reflMonthWh().length);
            int[] union = java.util.stream.IntStream.concat(Arrays.stream(own), Arrays.stream(got)).distinct().sorted().toArray();
            assertArrayEquals(union, part.totalIds(), "totals of the tile's receivers and of those it reads, nothing else");
            assertTrue(part.totalIds().length < plan.receiverCount(), "fewer totals than the whole layout's receivers");

            assertTablesIdentical(city.finish(t, fp, whole).table(), city.finish(t, fp, part).table());
        }
        // a total the tile reads but did not receive: refused, naming the receiver
        Tile t = null;
        for (Tile c : plan.tiles()) if (readsOtherTiles(firsts.get(c.index()), plan.analysedCount())) t = c;
        assertTrue(t != null, "a tile's analysed patches read receivers of other tiles (fixture)");
        FirstPasses fp = firsts.get(t.index());
        int[] own = fp.ids();
        StagedPasses.TileReflected missing = StagedPasses.TileReflected.of(plan.analysedCount(), own, new double[12 * own.length],
                new double[own.length], new int[0], new double[0], whole.bounceWh(), whole.converged(), whole.tolerance(), whole.maxBounces());
        Tile tile = t;
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> city.finish(tile, fp, missing));
        assertTrue(e.getMessage().contains("no annual total for receiver"), e.getMessage());
    }

    private static boolean readsOtherTiles(FirstPasses fp, int analysed) {
        int[] own = fp.ids();
        for (int i = 0; i < fp.size(); i++) {
            if (own[i] >= analysed) continue;
            for (int j : fp.reflectors(i)) if (Arrays.binarySearch(own, j) < 0) return true;
        }
        return false;
    }

    /** Every column the same, value by value, to the bit (NaN equal to NaN). */
    static void assertTablesIdentical(ResultTable a, ResultTable b) {
        assertEquals(a.columns().stream().map(Column::name).toList(), b.columns().stream().map(Column::name).toList());
        for (Column c : a.columns()) {
            double[] x = a.column(c.name()), y = b.column(c.name());
            assertEquals(x.length, y.length, c.name());
            for (int i = 0; i < x.length; i++) {
                assertEquals(Double.doubleToLongBits(x[i]), Double.doubleToLongBits(y[i]), c.name() + " row " + i + ": " + x[i] + " vs " + y[i]);
            }
        }
    }

    /** Every instance field (a new field the codec forgets fails here), arrays by content. */
    private static void assertFieldsEqual(Object a, Object b, String what) throws Exception {
        assertSame(a.getClass(), b.getClass());
        int n = 0;
        for (Field f : a.getClass().getDeclaredFields()) {
            if (Modifier.isStatic(f.getModifiers())) continue;
            f.setAccessible(true);
            assertTrue(Objects.deepEquals(f.get(a), f.get(b)), what + ": field " + f.getName());
            n++;
        }
        assertTrue(n > 1, what + ": fields compared");
    }

    private static Object field(Object o, String name) throws Exception {
        Field f = o.getClass().getDeclaredField(name);
        f.setAccessible(true);
        return f.get(o);
    }
}
