package org.solmass.viewer;

import javafx.application.ConditionalFeature;
import javafx.application.Platform;
import javafx.geometry.Point2D;
import javafx.scene.control.Label;
import javafx.scene.image.PixelReader;
import javafx.scene.image.WritableImage;
import javafx.scene.input.MouseButton;
import javafx.scene.robot.Robot;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.solmass.output.ColourRamp;

import java.nio.file.Path;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Supplier;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * Opens the window on the SYNTHETIC courtyard, checks the model is drawn in ramp colours, then clicks
 * a patch with the FX robot and checks the side panel shows that patch. Skipped without a display
 * (run under xvfb-run with -Dprism.order=es2 -Dprism.forceGPU=true, see docs/viewer.md).
 */
class ViewerSmokeTest {

    @Test
    void windowDrawsRampColouredModelAndClickOpensThePatch() throws Exception {
        assumeTrue(System.getenv("DISPLAY") != null && !System.getenv("DISPLAY").isBlank(), "no DISPLAY: viewer smoke test skipped");
        SolmassViewer.startToolkit();
        assumeTrue(Platform.isSupported(ConditionalFeature.SCENE3D), "JavaFX 3D not supported here: smoke test skipped");

        ViewerData data = SyntheticViewerData.courtyard();
        ModelView3D.Prepared prep = ModelView3D.Prepared.of(data);
        AtomicReference<ViewerWindow> win = new AtomicReference<>();
        onFx(() -> {
            Stage st = new Stage();
            ViewerWindow w = new ViewerWindow(st, new RerunToCoarser(), 1280, 800);
            st.setX(0);
            st.setY(0);
            st.show();
            w.show(data, prep);
            win.set(w);
            return null;
        });
        ViewerWindow w = win.get();
        frames(4);
        WritableImage img = onFx(() -> w.snapshot3D(1));
        int width = (int) img.getWidth(), height = (int) img.getHeight();
        PixelReader pr = img.getPixelReader();

        // share of pixels whose colour is (nearly) an entry of the sequential ramp: the coloured model
        int ramp = 0, total = 0, bestX = -1, bestY = -1;
        for (int y = 4; y < height - 4; y += 2) {
            for (int x = 4; x < width - 4; x += 2) {
                total++;
                int c = pr.getArgb(x, y) & 0xFFFFFF;
                if (nearRamp(c)) {
                    ramp++;
                    if (bestX < 0 && y > height / 3 && uniform(pr, x, y)) {
                        bestX = x;
                        bestY = y;
                    }
                }
            }
        }
        double share = ramp / (double) total;
        // the synthetic courtyard fills a good part of the default view; 10 % is a conservative floor
        assertTrue(share > 0.10, "ramp-coloured share of the 3D view " + share);
        assertTrue(bestX >= 0, "found no patch interior to click");
        int clicked = pr.getArgb(bestX, bestY) & 0xFFFFFF;

        int px = bestX, py = bestY;
        onFx(() -> {
            Point2D p = w.subScene().localToScreen(px, py);
            Robot r = new Robot();
            r.mouseMove(p.getX(), p.getY());
            r.mouseClick(MouseButton.PRIMARY);
            return null;
        });
        frames(3);
        int shown = onFx(() -> w.panel().shownPatch());
        assertTrue(shown >= 0, "the side panel shows no patch after the click");
        // the picked patch's own colour is the colour under the cursor (face -> patch lookup is right)
        ColourScale scale = onFx(() -> ColourScale.auto(data.table().column("annual_kwh_m2"), false));
        int expect = scale.rgb(data.table().column("annual_kwh_m2")[shown]);
        assertTrue(distance(expect, clicked) <= 24, String.format("clicked colour %06x, patch colour %06x", clicked, expect));
        String annual = onFx(() -> ((Label) w.panel().lookup("#fact-annual-irradiation")).getText());
        assertEquals(PatchPanel.fmt(data.table().column("annual_kwh_m2")[shown], 0) + " kWh/m\u00b2", annual);
        String heading = onFx(() -> ((Label) w.panel().getChildren().get(0)).getText());
        assertEquals("Patch " + data.patches().get(shown).id(), heading);

        // the PNG export renders the 3D view at a chosen scale
        WritableImage twice = onFx(() -> w.snapshot3D(2));
        assertEquals(2 * width, (int) twice.getWidth());
        assertEquals(2 * height, (int) twice.getHeight());

        // re-run from the window: the actions get the request, the new data replaces the old
        onFx(() -> {
            w.rerun(new RerunRequest(2.0, "synthetic", "isotropic"));
            return null;
        });
        long until = System.nanoTime() + 60_000_000_000L;
        while (onFx(() -> w.data()) == data && System.nanoTime() < until) Thread.sleep(100);
        ViewerData after = onFx(() -> w.data());
        assertTrue(after != data, "re-run did not replace the data");
        assertTrue(after.patches().size() < data.patches().size() / 3, "2 m patches are fewer than 1 m patches");
        assertEquals(-1, (int) onFx(() -> w.panel().shownPatch()), "the side panel is cleared after a re-run");
        frames(2);

        Path out = Path.of("target", "viewer-smoke.png");
        onFx(() -> {
            SolmassViewer.write(w.snapshotWindow(), out);
            w.stage().hide();
            return null;
        });
    }

    /** Actions whose re-run rebuilds the synthetic courtyard at the requested patch size. */
    static final class RerunToCoarser implements ViewerActions {
        @Override public RerunRequest currentOptions() { return new RerunRequest(1, "synthetic", "isotropic"); }
        @Override public ViewerData rerun(RerunRequest r, ProgressSink p, java.util.function.BooleanSupplier c) {
            p.progress(0.5, "rebuilding");
            return SyntheticViewerData.build(r.patchSizeM(), true);
        }
        @Override public void exportCsv(Path file) { throw new UnsupportedOperationException(); }
        @Override public void exportSummary(Path file) { throw new UnsupportedOperationException(); }
    }

    private static final boolean[] NEAR_RAMP = new boolean[1 << 24];

    static {
        for (int i = 0; i < 256; i++) {
            int c = ColourRamp.sequential(i / 255.0);
            for (int dr = -6; dr <= 6; dr++) for (int dg = -6; dg <= 6; dg++) for (int db = -6; db <= 6; db++) {
                int r = ((c >> 16) & 255) + dr, g = ((c >> 8) & 255) + dg, b = (c & 255) + db;
                if (r >= 0 && r < 256 && g >= 0 && g < 256 && b >= 0 && b < 256) NEAR_RAMP[(r << 16) | (g << 8) | b] = true;
            }
        }
    }

    /** True when c is within 6 code values per channel of an entry of the sequential ramp. */
    static boolean nearRamp(int c) { return NEAR_RAMP[c & 0xFFFFFF]; }

    static boolean uniform(PixelReader pr, int x, int y) {
        int c = pr.getArgb(x, y);
        for (int d = -1; d <= 1; d++) {
            if (distance(pr.getArgb(x + d, y) & 0xFFFFFF, c & 0xFFFFFF) > 3) return false;
            if (distance(pr.getArgb(x, y + d) & 0xFFFFFF, c & 0xFFFFFF) > 3) return false;
        }
        return true;
    }

    static int distance(int a, int b) {
        return Math.max(Math.abs(((a >> 16) & 255) - ((b >> 16) & 255)),
                Math.max(Math.abs(((a >> 8) & 255) - ((b >> 8) & 255)), Math.abs((a & 255) - (b & 255))));
    }

    static <T> T onFx(Supplier<T> s) throws Exception {
        AtomicReference<T> r = new AtomicReference<>();
        AtomicReference<Throwable> err = new AtomicReference<>();
        CountDownLatch done = new CountDownLatch(1);
        Platform.runLater(() -> {
            try {
                r.set(s.get());
            } catch (Throwable t) {
                err.set(t);
            } finally {
                done.countDown();
            }
        });
        assertTrue(done.await(60, TimeUnit.SECONDS), "FX thread did not answer");
        if (err.get() != null) throw new AssertionError(err.get());
        return r.get();
    }

    static void frames(int n) throws InterruptedException {
        CountDownLatch l = new CountDownLatch(1);
        Platform.runLater(() -> SolmassViewer.afterFrames(n, l::countDown));
        assertTrue(l.await(60, TimeUnit.SECONDS), "no frames rendered");
    }
}
