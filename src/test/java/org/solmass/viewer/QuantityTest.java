package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.metrics.ColumnCatalogue;
import org.solmass.table.ResultTable;

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
    void metricColumnsTheAnalysisWritesAppearWithTheirLabelsUnitsAndCaution() {
        // the names analyse writes for a sun-hour date and the PV metric (docs/outputs.md)
        ViewerData d = SyntheticViewerData.courtyard();
        ResultTable t = d.table();
        double[] z = new double[t.size()];
        for (String n : List.of("sun_hours_0321", "sun_level_0321", "pv_suitability_pct", "pv_zone")) {
            t.put(ColumnCatalogue.of(n), z);
        }
        List<Quantity> q = Quantity.available(t);
        Quantity sun = find(q, "sun_hours_0321"), level = find(q, "sun_level_0321");
        Quantity suit = find(q, "pv_suitability_pct"), zone = find(q, "pv_zone");
        assertEquals("Sun hours on 21 March", sun.label());
        assertEquals("h", sun.unit());
        assertFalse(sun.pvOrRoof());
        assertEquals("EN 17037 sunlight level on 21 March", level.label());
        assertEquals("1", level.format(1.0), "a level prints as a whole number");
        assertEquals("PV suitability (after shading and orientation losses) (%)", suit.title());
        assertTrue(suit.pvOrRoof() && zone.pvOrRoof(), "PV quantities are shown with the caution");
        assertEquals("3", zone.format(3.0));
        assertEquals("no value", zone.format(Double.NaN));
        for (Quantity x : q) assertFalse(x.label().contains("_"), "raw column name shown: " + x.label());
    }

    /** The vertical sky component column (issue 17) reaches the selector through the column registry. */
    @Test
    void verticalSkyComponentIsOfferedAsAQuantity() {
        ResultTable t = SyntheticViewerData.courtyard().table();
        double[] v = new double[t.size()];
        java.util.Arrays.fill(v, Double.NaN);
        v[0] = 39.6;
        t.put(ColumnCatalogue.of("vsc_pct"), v);
        Quantity q = find(Quantity.available(t), "vsc_pct");
        assertEquals(org.solmass.metrics.VerticalSkyComponentMetric.VSC.label(), q.label());
        assertEquals("%", q.unit());
        assertFalse(q.pvOrRoof());
        assertEquals("no value", q.format(Double.NaN), "patches other than facades have no value");
    }

    @Test
    void differencesAreDivergingAndNamedAsAChange() {
        ResultTable t = SyntheticViewerData.courtyard().table();
        t.put(ColumnCatalogue.of("delta_annual_kwh_m2"), new double[t.size()]);
        Quantity d = find(Quantity.available(t), "delta_annual_kwh_m2");
        assertTrue(d.diverging());
        assertEquals("Change in annual irradiation (B - A) (kWh/m\u00b2)", d.title());
    }

    private static Quantity find(List<Quantity> q, String column) {
        return q.stream().filter(x -> x.column().equals(column)).findFirst().orElseThrow();
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
