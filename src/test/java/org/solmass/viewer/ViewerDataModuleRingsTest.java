package org.solmass.viewer;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** The viewer's data holder carries the PV module rings it is given, and none by default (results without modules). */
class ViewerDataModuleRingsTest {
    @Test
    void dataWithoutModulesHasNoRingsAndWithModuleRingsKeepsThemInOrder() {
        ViewerData d = SyntheticViewerData.courtyard();
        assertEquals(0, d.moduleRings().size());
        double[] a = {0, 0, 10, 1.7, 0, 10, 1.7, 1.134, 10, 0, 1.134, 10};
        double[] b = {2, 0, 10, 3.7, 0, 10, 3.7, 1.134, 10};
        ViewerData m = d.withModuleRings(List.of(a, b));
        assertEquals(2, m.moduleRings().size());
        assertArrayEquals(a, m.moduleRings().get(0), 0);
        assertArrayEquals(b, m.moduleRings().get(1), 0);
        assertEquals(d.patches(), m.patches());
    }

    @Test
    void aRingOfTwoCornersIsRejected() {
        ViewerData d = SyntheticViewerData.courtyard();
        assertThrows(IllegalArgumentException.class, () -> d.withModuleRings(List.of(new double[] {0, 0, 0, 1, 0, 0})));
    }
}
