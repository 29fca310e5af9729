package org.solmass.viewer;

import org.junit.jupiter.api.Test;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The statistics tab's rows on the SYNTHETIC courtyard (headless: the rows, not the window): the
 * facade orientations' areas add up to the facade area of the patches, the blocks' to all patches,
 * and numbers sort by value.
 */
class StatisticsPaneTest {
    @Test
    void orientationAreasAddUpToTheFacadeAreaAndBlocksToTheWhole() {
        ViewerData d = SyntheticViewerData.courtyard();
        Quantity q = Quantity.available(d.table()).get(0);
        double facade = 0, all = 0;
        for (Patch p : d.patches()) {
            all += p.areaM2();
            if (p.kind() == SurfaceKind.FACADE) facade += p.areaM2();
        }
        double sum = 0;
        List<String[]> rows = StatisticsPane.rows(d, q, "by_facade_orientation", 3);
        assertTrue(rows.size() >= 4, "the courtyard's walls face at least four ways");
        for (String[] r : rows) sum += Double.parseDouble(r[2]);
        // summary.json rounds areas to 0.1 m2: one half-step per row at most
        assertEquals(facade, sum, 0.05 * rows.size());
        double blocks = 0;
        for (String[] r : StatisticsPane.rows(d, q, "by_block", 3)) blocks += Double.parseDouble(r[2]);
        assertEquals(all, blocks, 0.05 * d.model().blockNames().size());
        double storeys = 0;
        for (String[] r : StatisticsPane.rows(d, q, "by_facade_storey", 3)) storeys += Double.parseDouble(r[2]);
        assertEquals(facade, storeys, 0.05 * 40, "storey bands cover the facades once");
    }

    @Test
    void numbersSortByValueAndEmptyCellsLast() {
        List<String> v = new ArrayList<>(List.of("10", "", "9.5", "-2", "100"));
        v.sort(StatisticsPane::numeric);
        assertEquals(List.of("-2", "9.5", "10", "100", ""), v);
    }
}
