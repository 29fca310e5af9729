package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.output.ResultTable;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class QuantityTest {

    @Test
    void selectorListsWhatTheTableHasAnnualFirstMonthsInOrder() {
        ViewerData d = SyntheticViewerData.courtyard();
        List<Quantity> q = Quantity.available(d.table());
        assertEquals("annual_kwh_m2", q.get(0).column());
        assertEquals(d.table().names().size(), q.size());
        int jan = -1, dec = -1;
        for (int i = 0; i < q.size(); i++) {
            if (q.get(i).column().equals("m01_kwh_m2")) jan = i;
            if (q.get(i).column().equals("m12_kwh_m2")) dec = i;
        }
        assertEquals(11, dec - jan);
        assertEquals("December irradiation", q.get(dec).label());
        assertEquals("Annual irradiation (kWh/m\u00b2)", q.get(0).title());
    }

    @Test
    void pvAndSunHourColumnsAppearWithTheirUnitsAndPvCarriesTheCaution() {
        ViewerData d = SyntheticViewerData.courtyard();
        ResultTable t = d.table();
        double[] z = new double[t.size()];
        t.put("sun_hours_mar21", "h", z).put("pv_yield_kwh", "kWh", z);
        List<Quantity> q = Quantity.available(t);
        Quantity sun = q.stream().filter(x -> x.column().equals("sun_hours_mar21")).findFirst().orElseThrow();
        Quantity pv = q.stream().filter(x -> x.column().equals("pv_yield_kwh")).findFirst().orElseThrow();
        assertEquals("h", sun.unit());
        assertFalse(sun.pvOrRoof());
        assertTrue(pv.pvOrRoof());
        assertEquals("kWh", pv.unit());
    }

    @Test
    void massingShadeIsBrightestFacingTheFixedLightAndNeverBelowAmbient() {
        double roof = MassingMeshData.shade(0, 0, 1), north = MassingMeshData.shade(0, 1, 0);
        double towardLight = MassingMeshData.shade(MassingMeshData.LIGHT[0], MassingMeshData.LIGHT[1], MassingMeshData.LIGHT[2]);
        assertEquals(1, towardLight, 1e-12);
        assertTrue(roof > north);
        assertTrue(north >= MassingMeshData.AMBIENT);
    }
}
