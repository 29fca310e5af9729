package org.solmass.climate;

import org.junit.jupiter.api.Test;
import org.solmass.sun.Site;

import java.nio.file.Path;
import java.time.ZoneOffset;

import static org.junit.jupiter.api.Assertions.*;

/** Every example file of docs/climate-formats.md is read as documented (invented site of the examples). */
class DocsExamplesTest {
    static final Site VALLMORA = new Site(46.2, 7.4, 500, ZoneOffset.ofHours(1));
    static final Path EX = Path.of("docs", "examples");

    @Test
    void monthHourExampleIsRecognisedAndRead() {
        WeatherSeries s = ClimateSource.load(VALLMORA, ClimateSpec.file(EX.resolve("month-hour-example.csv")));
        assertEquals(TimeBase.AVERAGE_DAYS, s.timeBase());
        assertEquals(288, s.size());
        ClimateSourceTest.assertClosure(s);
    }

    @Test
    void monthlyMeansExampleIsRecognisedAndRead() {
        WeatherSeries s = ClimateSource.load(VALLMORA, ClimateSpec.file(EX.resolve("monthly-means-example.csv")));
        assertEquals(TimeBase.AVERAGE_DAYS, s.timeBase());
        ClimateSourceTest.assertClosure(s);
    }

    @Test
    void hourlyExamplesGiveTheSameGhi() {
        WeatherSeries a = ClimateSource.load(VALLMORA, ClimateSpec.file(EX.resolve("hourly-example.csv")));
        WeatherSeries b = ClimateSource.load(VALLMORA, ClimateSpec.file(EX.resolve("hourly-ghi-utc-end-example.csv"))
                .withIntervalLabel(ClimateSpec.IntervalLabel.END));
        assertEquals(72, a.size());
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            assertEquals(a.step(i).start(), b.step(i).start());
            assertEquals(a.step(i).ghiWm2(), b.step(i).ghiWm2(), 1e-9);
        }
        ClimateSourceTest.assertClosure(a);
        ClimateSourceTest.assertClosure(b);
    }
}
