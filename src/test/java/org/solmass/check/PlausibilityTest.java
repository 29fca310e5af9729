package org.solmass.check;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.solmass.climate.ClimateSource;
import org.solmass.climate.ClimateSpec;
import org.solmass.climate.Step;
import org.solmass.climate.WeatherSeries;
import org.solmass.model.LengthUnit;
import org.solmass.model.MassingModel;
import org.solmass.model.ModelOptions;
import org.solmass.model.ObjReader;
import org.solmass.model.UpAxis;
import org.solmass.sun.Site;

import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;

import static org.junit.jupiter.api.Assertions.*;

/** Each plausibility check fires on the mistake it names and stays quiet on sound inputs. */
class PlausibilityTest {
    /** Invented site at 51 N, 10 E in Europe/Berlin (standard meridian 15 E). */
    static final Site SITE = new Site(51, 10, 200, ZoneId.of("Europe/Berlin"));
    static WeatherSeries clearYear;

    @BeforeAll
    static void clearSky() {
        clearYear = ClimateSource.load(SITE, ClimateSpec.clearSkyYear(2025));
    }

    /** An invented district: four boxes of 12, 18, 30 and 9 m on the ground, in metres, z up. */
    static String district(double scale, boolean yUp) {
        double[][] boxes = {{0, 0, 20, 15, 12}, {30, 0, 20, 20, 18}, {0, 30, 15, 15, 30}, {30, 30, 25, 10, 9}};
        StringBuilder b = new StringBuilder();
        int base = 0;
        for (int k = 0; k < boxes.length; k++) {
            double[] x = boxes[k];
            b.append("o block").append(k).append('\n');
            for (int z = 0; z <= 1; z++) for (int y = 0; y <= 1; y++) for (int i = 0; i <= 1; i++) {
                double px = (x[0] + i * x[2]) * scale, py = (x[1] + y * x[3]) * scale, pz = z * x[4] * scale;
                // a y-up file holds (x, z, -y) of the z-up frame
                if (yUp) b.append("v ").append(px).append(' ').append(pz).append(' ').append(-py).append('\n');
                else b.append("v ").append(px).append(' ').append(py).append(' ').append(pz).append('\n');
            }
            int[][] faces = {{1, 3, 4, 2}, {5, 6, 8, 7}, {1, 2, 6, 5}, {3, 7, 8, 4}, {1, 5, 7, 3}, {2, 4, 8, 6}};
            for (int[] f : faces) {
                b.append("f");
                for (int v : f) b.append(' ').append(v + base);
                b.append('\n');
            }
            base += 8;
        }
        return b.toString();
    }

    static MassingModel read(String obj, ModelOptions o) {
        return ObjReader.parse(obj, "district.obj", o).model();
    }

    static List<String> codes(List<Warning> w) {
        return w.stream().map(Warning::code).toList();
    }

    @Test
    void districtInMetresZUpGivesNoWarning() {
        assertEquals(List.of(), Plausibility.model(read(district(1, false), ModelOptions.defaults())));
    }

    @Test
    void sampleCourtyardModelGivesNoWarning() {
        MassingModel m = ObjReader.read(Path.of("sample-massing/courtyard-block.obj"), ModelOptions.defaults());
        assertEquals(List.of(), Plausibility.model(m));
    }

    @Test
    void singleTallTowerIsNotTakenForAYUpModel() {
        String tower = "o tower\nv 0 0 0\nv 20 0 0\nv 0 20 0\nv 20 20 0\nv 0 0 150\nv 20 0 150\nv 0 20 150\nv 20 20 150\n"
                + "f 1 3 4 2\nf 5 6 8 7\nf 1 2 6 5\nf 3 7 8 4\nf 1 5 7 3\nf 2 4 8 6\n";
        assertEquals(List.of(), Plausibility.model(read(tower, ModelOptions.defaults())));
    }

    @Test
    void districtInMillimetresReadAsMetresIsFlaggedWithTheUnitToSet() {
        List<Warning> w = Plausibility.model(read(district(1000, false), ModelOptions.defaults()));
        assertEquals(List.of("model-not-in-metres"), codes(w));
        assertTrue(w.get(0).text().contains("the model is 30000 m tall"), w.get(0).text());
        assertTrue(w.get(0).text().contains("set model.unit (--unit) to mm (30.0 m tall, 55 m across)"), w.get(0).text());
        assertEquals(List.of(), Plausibility.model(read(district(1000, false), new ModelOptions(UpAxis.Z, LengthUnit.MM, 0))));
    }

    @Test
    void yUpDistrictReadAsZUpIsFlaggedAndReadAsYUpIsNot() {
        List<Warning> w = Plausibility.model(read(district(1, true), ModelOptions.defaults()));
        assertEquals(List.of("model-y-up"), codes(w));
        assertTrue(w.get(0).text().endsWith("set model.up (--up) to y"), w.get(0).text());
        assertEquals(List.of(), Plausibility.model(read(district(1, true), new ModelOptions(UpAxis.Y, LengthUnit.M, 0))));
    }

    @Test
    void swappedLatitudeAndLongitudeAreFlaggedForTheZone() {
        Site swapped = new Site(13.4, 52.5, 35, ZoneId.of("Europe/Berlin"));
        assertEquals(List.of("site-lat-lon-swapped"), codes(Plausibility.site(swapped, 2025)));
        assertEquals(List.of(), Plausibility.site(new Site(52.5, 13.4, 35, ZoneId.of("Europe/Berlin")), 2025));
    }

    @Test
    void longitudeFarFromItsMeridianButNotSwappedIsNotFlagged() {
        // western China keeps UTC+8 (standard meridian 120 E) at 76 E (common practice); 39.5 does not fit 120 either
        assertEquals(List.of(), Plausibility.site(new Site(39.5, 76.0, 1300, ZoneId.of("Asia/Shanghai")), 2025));
    }

    @Test
    void clearSkyYearPeaksAtSolarNoonAndInWm2() {
        assertEquals(List.of(), Plausibility.weather(clearYear, SITE));
    }

    @Test
    void sampleWeatherFilesGiveNoWarning() {
        for (String f : new String[] {"sample-massing/veldhaven-month-hour.csv", "sample-massing/veldhaven-year.csv"}) {
            WeatherSeries w = ClimateSource.load(SITE, ClimateSpec.file(Path.of(f)));
            assertEquals(List.of(), Plausibility.weather(w, SITE), f);
        }
    }

    @Test
    void weatherOneHourLateIsFlaggedAsOffSolarNoon() {
        // the values of each hour moved to the next hour: what a wrong zone or an end label read as start does
        List<Step> s = clearYear.steps(), late = new ArrayList<>();
        for (int k = 0; k < s.size(); k++) {
            Step a = s.get(k), from = s.get(Math.max(0, k - 1));
            late.add(new Step(a.start(), a.durationH(), a.month(), a.dayOfYear(), a.localStandardHour(), a.sun(),
                    a.sunUpFraction(), from.ghiWm2(), from.dniWm2(), from.dhiWm2(), a.extraNormalWm2(), a.dryBulbC(), a.weightDays()));
        }
        List<Warning> w = Plausibility.weather(new WeatherSeries(late, clearYear.timeBase(), "late.csv", clearYear.report()), SITE);
        assertEquals(List.of("weather-noon-offset"), codes(w));
        assertTrue(w.get(0).text().contains("1.0 h after solar noon"), w.get(0).text());
    }

    @Test
    void irradianceInKwhOrJoulesPerSquareCentimetreIsFlagged() {
        // 1 kWh/m2 in an hour = 1000 W/m2; 1 J/cm2 in an hour = 10 000 J/m2 / 3600 s = 2.78 W/m2 (unit definitions)
        for (DoubleUnaryOperator unit : new DoubleUnaryOperator[] {x -> x / 1000, x -> x * 0.36}) {
            List<Step> s = new ArrayList<>();
            for (Step a : clearYear.steps()) {
                s.add(new Step(a.start(), a.durationH(), a.month(), a.dayOfYear(), a.localStandardHour(), a.sun(), a.sunUpFraction(),
                        unit.applyAsDouble(a.ghiWm2()), unit.applyAsDouble(a.dniWm2()), unit.applyAsDouble(a.dhiWm2()),
                        a.extraNormalWm2(), a.dryBulbC(), a.weightDays()));
            }
            List<Warning> w = Plausibility.weather(new WeatherSeries(s, clearYear.timeBase(), "kwh.csv", clearYear.report()), SITE);
            assertEquals(List.of("weather-irradiance-unit"), codes(w));
        }
    }
}
