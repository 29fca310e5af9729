package org.solmass.table;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The column definition and the table that carries it. */
class ColumnTableTest {
    private static Patch patch(int i, double areaM2) {
        return new Patch(i, "P" + i, 0, "b", 0, SurfaceKind.ROOF, new Vec3(i, 0, 0), Vec3.UP, areaM2, 0, 0, new double[0]);
    }

    @Test
    void areaWeightedMeanWeighsByAreaAndSkipsMissingValues() {
        // by hand: (10 x 1 + 20 x 3) / (1 + 3) = 17.5; the NaN patch counts neither value nor area
        List<Patch> ps = List.of(patch(0, 1), patch(1, 3), patch(2, 5));
        AreaStats s = AreaStats.of(ps, new double[] {10, 20, Double.NaN});
        assertEquals(17.5, s.mean(), 1e-12);
        assertEquals(4, s.areaM2(), 1e-12);
        assertEquals(70, s.valueTimesAreaSum(), 1e-12);
        assertEquals(10, s.min(), 0);
        assertEquals(20, s.max(), 0);
        assertEquals(3, AreaStats.areaAtLeast(ps, new double[] {10, 20, Double.NaN}, 15), 0);
        assertTrue(Double.isNaN(AreaStats.of(ps, new double[] {Double.NaN, Double.NaN, Double.NaN}).mean()));
    }

    @Test
    void wholeKindsPrintWithoutDecimalsAndNamesAreSnakeCase() {
        assertThrows(IllegalArgumentException.class,
                () -> new Column("zone", Unit.ID, "Zone", 2, ColumnKind.CATEGORICAL, "A zone.", false));
        assertThrows(IllegalArgumentException.class, () -> Column.of("Annual kWh", Unit.KWH, "x", "x."));
        Column c = new Column("zone", Unit.ID, "Zone", 0, ColumnKind.CATEGORICAL, "A zone.", false);
        assertEquals("3", c.format(3.0));
        assertEquals("", c.format(Double.NaN), "a missing value is an empty cell");
        assertEquals("Zone", c.title(), "ids carry no unit on screen");
        assertEquals("1.23 kWh/m\u00b2", Column.of("a_kwh_m2", Unit.KWH_M2, "A", "A.").display(1.234));
    }

    @Test
    void tableKeepsDefinitionsWithValuesAndRefusesWrongLengths() {
        ResultTable t = new ResultTable(List.of(patch(0, 1), patch(1, 1)));
        Column c = Column.of("sky_view_factor", Unit.RATIO, "Sky view factor", "S.");
        t.put(c, new double[] {0.5, 0.25});
        assertEquals(c, t.def("sky_view_factor"));
        assertEquals(List.of(c), t.copy().columns());
        assertThrows(IllegalArgumentException.class, () -> t.put(c, new double[3]));
        assertThrows(IllegalArgumentException.class, () -> t.def("nothing"));
    }
}
