package org.solmass.viewer;

import javafx.application.ConditionalFeature;
import javafx.application.Platform;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.BooleanSupplier;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.solmass.viewer.ViewerSmokeTest.frames;
import static org.solmass.viewer.ViewerSmokeTest.onFx;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * The re-run controls of the window on the SYNTHETIC courtyard with stand-in actions (no analysis): a
 * re-run names its variant folder in the status line, the study's results folders are listed, and
 * Open shows the chosen one. Skipped without a display (run under xvfb-run, docs/viewer.md).
 */
class ViewerVariantListTest {

    @Test
    void rerunNamesItsVariantInTheStatusLineAndOpenShowsTheChosenFolder() throws Exception {
        assumeTrue(System.getenv("DISPLAY") != null && !System.getenv("DISPLAY").isBlank(), "no DISPLAY: viewer test skipped");
        SolmassViewer.startToolkit();
        assumeTrue(Platform.isSupported(ConditionalFeature.SCENE3D), "JavaFX 3D not supported here: viewer test skipped");
        Variants actions = new Variants();
        ViewerData data = SyntheticViewerData.courtyard();
        AtomicReference<ViewerWindow> win = new AtomicReference<>();
        onFx(() -> {
            Stage st = new Stage();
            ViewerWindow w = new ViewerWindow(st, actions, 1280, 800);
            // off the screen: surefire runs test classes in parallel forks on one display, and
            // ViewerSmokeTest clicks with the robot at the screen's top left; this test clicks nothing
            st.setX(4000);
            st.setY(4000);
            st.show();
            w.show(data, ModelView3D.Prepared.of(data));
            win.set(w);
            return null;
        });
        ViewerWindow w = win.get();
        frames(2);
        @SuppressWarnings("unchecked")
        List<String> listed = onFx(() -> List.copyOf(((ComboBox<String>) w.root().lookup("#variants")).getItems()));
        assertEquals(List.of("results"), listed);

        onFx(() -> {
            w.rerun(new RerunRequest(2.0, "synthetic", "isotropic", "coarser"));
            return null;
        });
        ViewerData afterRerun = waitForNewData(w, data);
        frames(2);
        assertTrue(onFx(w::statusText).startsWith("Variant written to " + Path.of("/tmp/study/coarser")), onFx(w::statusText));
        @SuppressWarnings("unchecked")
        ComboBox<String> box = (ComboBox<String>) onFx(() -> w.root().lookup("#variants"));
        assertEquals(List.of("results", "coarser"), onFx(() -> List.copyOf(box.getItems())));
        assertEquals("coarser", onFx(() -> box.getValue()), "the list selects the folder on show");

        onFx(() -> {
            box.getSelectionModel().select(0);
            ((Button) w.root().lookup("#open-variant")).fire();
            return null;
        });
        ViewerData opened = waitForNewData(w, afterRerun);
        assertEquals(Path.of("/tmp/study/results"), actions.opened);
        assertTrue(opened.patches().size() > afterRerun.patches().size(), "the 1 m results have more patches than the 2 m variant");
        frames(2);
        assertEquals("results", onFx(() -> box.getValue()), "the list selects the folder on show");
        assertTrue(onFx(w::statusText).startsWith("Showing " + Path.of("/tmp/study/results")), onFx(w::statusText));
        frames(2);
        onFx(() -> {
            SolmassViewer.write(w.snapshotWindow(), Path.of("target", "viewer-variants.png"));
            w.stage().hide();
            return null;
        });
    }

    private static ViewerData waitForNewData(ViewerWindow w, ViewerData old) throws Exception {
        long until = System.nanoTime() + 60_000_000_000L;
        while (onFx(w::data) == old && System.nanoTime() < until) Thread.sleep(100);
        ViewerData now = onFx(w::data);
        assertTrue(now != old, "the data on show was not replaced");
        return now;
    }

    /** Stand-in actions: folders under /tmp/study are names only, nothing is read or written. */
    static final class Variants implements ViewerActions {
        final List<Path> folders = new java.util.ArrayList<>(List.of(Path.of("/tmp/study/results")));
        volatile Path last, opened;

        @Override public RerunRequest currentOptions() { return new RerunRequest(1, "synthetic", "isotropic"); }
        @Override public ViewerData rerun(RerunRequest r, ProgressSink p, BooleanSupplier c) {
            last = Path.of("/tmp/study", r.variantName());
            folders.add(last);
            return SyntheticViewerData.build(r.patchSizeM(), true);
        }
        @Override public Path shownFolder() { return last; }   // the folder of the data on show
        @Override public List<Path> variants() { return List.copyOf(folders); }
        @Override public ViewerData openVariant(Path folder) {
            opened = folder;
            last = folder;
            return SyntheticViewerData.build(1.0, true);
        }
        @Override public void exportCsv(Path file) { throw new UnsupportedOperationException(); }
        @Override public void exportSummary(Path file) { throw new UnsupportedOperationException(); }
    }
}
