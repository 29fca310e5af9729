package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.model.Vec3;
import org.solmass.table.ResultTable;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Zone boundaries are the outline edges no other patch of the same zone shares (geometry, by construction). */
class ZoneOutlinesTest {
    static Patch square(int index, double x, double y) {
        double[] o = {x, y, 10, x + 1, y, 10, x + 1, y + 1, 10, x, y + 1, 10};
        return new Patch(index, "P" + index, 0, "b", 0, SurfaceKind.ROOF, new Vec3(x + 0.5, y + 0.5, 10), Vec3.UP, 1, 0, 0, o);
    }

    @Test
    void twoByTwoZoneHasItsPerimeterOfEightUnitEdgesAndNoInnerEdge() {
        List<Patch> ps = new ArrayList<>();
        for (int j = 0; j < 2; j++) for (int i = 0; i < 2; i++) ps.add(square(ps.size(), i, j));
        ps.add(square(4, 2, 0)); // a neighbour in no zone: its shared edge stays a zone boundary
        ResultTable t = new ResultTable(ps).put(org.solmass.metrics.PvZonesMetric.ZONE, new double[] {1, 1, 1, 1, Double.NaN});
        List<double[]> e = ZoneOutlines.edges(ps, t);
        assertEquals(8, e.size());
        double length = 0;
        for (double[] d : e) length += Math.hypot(d[3] - d[0], d[4] - d[1]);
        assertEquals(8.0, length, 1e-12, "perimeter of a 2 x 2 m square");
    }

    @Test
    void resultsWithoutZonesHaveNoOutline() {
        List<Patch> ps = List.of(square(0, 0, 0));
        assertEquals(0, ZoneOutlines.edges(ps, new ResultTable(ps)).size());
    }
}
