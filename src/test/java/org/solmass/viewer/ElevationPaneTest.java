package org.solmass.viewer;

import javafx.scene.image.Image;
import org.junit.jupiter.api.Test;
import org.solmass.surface.Patch;
import org.solmass.surface.SurfaceKind;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.atomic.AtomicReference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assumptions.assumeTrue;
import static org.solmass.viewer.ViewerSmokeTest.onFx;

/**
 * The facade elevations tab on the SYNTHETIC courtyard: it lists the analysed blocks with facade
 * patches, draws nothing until it is on show, and draws again when the quantity changes. Skipped
 * without a display (run under xvfb-run, docs/viewer.md).
 */
class ElevationPaneTest {
    @Test
    void listsAnalysedBlocksWithFacadesAndDrawsOnlyWhenShown() throws Exception {
        assumeTrue(System.getenv("DISPLAY") != null && !System.getenv("DISPLAY").isBlank(), "no DISPLAY: viewer test skipped");
        SolmassViewer.startToolkit();
        ViewerData d = SyntheticViewerData.courtyard();
        List<Quantity> qs = Quantity.available(d.table());
        AtomicReference<Quantity> q = new AtomicReference<>(qs.get(0));
        ElevationPane pane = onFx(() -> new ElevationPane(q::get,
                () -> ColourScale.auto(d.table().column(q.get().column()), q.get().diverging())));
        onFx(() -> {
            pane.setData(d);
            return null;
        });
        Set<String> want = new LinkedHashSet<>();
        for (Patch p : d.patches()) if (p.kind() == SurfaceKind.FACADE && d.blockAnalysed()[p.block()]) want.add(p.blockName());
        @SuppressWarnings("unchecked")
        List<String> listed = onFx(() -> new ArrayList<>(((javafx.scene.control.ComboBox<String>) pane.lookup("#elevation-block")).getItems()));
        assertEquals(new ArrayList<>(want), listed);
        javafx.scene.image.ImageView view = onFx(() -> (javafx.scene.image.ImageView) ((javafx.scene.control.ScrollPane) pane.getCenter()).getContent());
        assertNull(onFx(view::getImage), "nothing drawn while the tab is hidden");
        onFx(() -> {
            pane.setActive(true);
            return null;
        });
        Image first = onFx(view::getImage);
        assertNotNull(first);
        q.set(qs.get(qs.size() - 1));
        onFx(() -> {
            pane.redraw();
            return null;
        });
        assertNotEquals(first, onFx(view::getImage), "a new quantity draws a new page");
    }
}
