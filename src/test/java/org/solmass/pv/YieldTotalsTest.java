package org.solmass.pv;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.io.StringWriter;
import java.time.LocalDateTime;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

class YieldTotalsTest {
    static final EnergyBalance STEP = new EnergyBalance(1000, 100, 30, 20, 40, 40, 30, 10, 730);

    /** IEC 61724-1: Yr = H_poa / 1 kW/m2 = reference energy / P0; Yf = E_ac / P0; PR = Yf / Yr. */
    @Test
    void yieldsFollowIec61724Definitions() {
        YieldTotals t = new YieldTotals(2000);
        t.add(STEP, 1, 31);          // an average January day standing for 31 days
        t.add(STEP, 7, 1);
        EnergyBalance y = t.year();
        assertEquals(32 * 1000, y.referenceWh(), 1e-9);
        assertEquals(32 * 1000 / 2000.0, t.referenceYield(y), 1e-12);
        assertEquals(32 * 730 / 2000.0, t.finalYield(y), 1e-12);
        assertEquals(0.73, y.performanceRatio(), 1e-12);
        assertEquals(31 * 730, t.month(1).acWh(), 1e-9);
        assertEquals(0, t.month(2).acWh(), 0);
        assertEquals(y.referenceWh() - y.acWh(), y.lossesWh(), 1e-9);
    }

    /** The series file: header first, no comment lines, one row per step, values as given. */
    @Test
    void zoneSeriesWritesHeaderThenOneRowPerStep() throws Exception {
        ZoneSeries s = new ZoneSeries("roof A", 2000);
        s.add(LocalDateTime.of(2025, 6, 21, 12, 0), 1, 41.25, STEP);
        s.add(LocalDateTime.of(2025, 6, 21, 13, 0), 1, Double.NaN, EnergyBalance.ZERO);
        StringWriter w = new StringWriter();
        s.write(w);
        assertFalse(w.toString().contains("#"));
        List<CSVRecord> rows = CSVParser.parse(new StringReader(w.toString()), CSVFormat.RFC4180).getRecords();
        assertEquals(ZoneSeries.HEADER, rows.get(0).toList());
        assertEquals(3, rows.size());
        CSVRecord r = rows.get(1);
        assertEquals("2025-06-21T12:00", r.get(0));
        assertEquals(500.0, Double.parseDouble(r.get(2)), 1e-9);   // 1000 Wh / 1 h / 2000 W x 1000 W/m2
        assertEquals("41.3", r.get(3));
        assertEquals(770.0, Double.parseDouble(r.get(12)), 1e-9);  // dc = ac + inverter + clipping
        assertEquals(730.0, Double.parseDouble(r.get(13)), 1e-9);
        assertEquals("", rows.get(2).get(3));
    }
}
