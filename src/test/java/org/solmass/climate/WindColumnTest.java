package org.solmass.climate;

import org.junit.jupiter.api.Test;
import org.solmass.sun.SolarCalculator;
import org.solmass.sun.Site;

import java.nio.file.Path;
import java.time.ZoneOffset;

import static org.junit.jupiter.api.Assertions.*;

/** The optional wind-speed column of an hourly file (docs/climate-formats.md). */
class WindColumnTest {
    static final SolarCalculator CALC = new SolarCalculator(new Site(45, 7, 0, ZoneOffset.ofHours(1)));  // invented site

    static WeatherSeries read(String text) {
        return ClimateSource.parse(CALC, ClimateSpec.file(Path.of("w.csv")), "w.csv", text);
    }

    @Test
    void windColumnIsReadUnderItsGenericNamesInMetresPerSecond() {
        for (String name : new String[] {"wind_ms", "wind_speed_ms", "wind_speed", "ws", "WS (m/s)"}) {
            WeatherSeries s = read("time,ghi_wm2," + name + "\n2025-01-01T00:00,0,2.5\n2025-01-01T01:00,0,4\n");
            assertEquals(2.5, s.steps().get(0).windMs(), 0, name);
            assertEquals(4.0, s.steps().get(1).windMs(), 0, name);
        }
    }

    @Test
    void fileWithoutWindGivesNaN() {
        WeatherSeries s = read("time,ghi_wm2,temp_c\n2025-01-01T00:00,0,3\n2025-01-01T01:00,0,4\n");
        assertTrue(Double.isNaN(s.steps().get(0).windMs()));
        assertEquals(3.0, s.steps().get(0).dryBulbC(), 0);
    }

    /** A missing cell inside the file is interpolated like the other columns (gap filling on). */
    @Test
    void missingWindCellIsInterpolatedWhenGapsAreFilled() {
        ClimateSpec f = ClimateSpec.file(Path.of("w.csv"));
        ClimateSpec spec = new ClimateSpec(f.kind(), f.file(), f.format(), f.timeBase(), f.year(), f.stepMinutes(), f.intervalLabel(),
                f.columns(), 1, f.reading());
        String text = "time,ghi_wm2,wind_ms\n2025-01-01T00:00,0,2\n2025-01-01T01:00,0,\n2025-01-01T02:00,0,4\n";
        WeatherSeries s = ClimateSource.parse(CALC, spec, "w.csv", text);
        assertEquals(3.0, s.steps().get(1).windMs(), 1e-12);
    }
}
