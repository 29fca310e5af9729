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

        int ramp = 0, bestX = -1, bestY = -1;
        for (int y = 4; y < height - 4; y += 2) {
            for (int x = 4; x < width - 4; x += 2) {
                if (!nearRamp(pr.getArgb(x, y))) continue;
                ramp++;
                if (bestX < 0 && y > height / 3 && uniform(pr, x, y)) {
                    bestX = x;
                    bestY = y;
                }
            }
        }
        // Expected ramp pixels, from the camera's own projection of the analysed faces (all of them carry
        // patches in this fixture). Upper bound: the faces turned to the camera, as if none hid another
        // (occlusion only takes away), plus a one-pixel rim along their outlines. Lower bound, less a
        // one-pixel rim along its outline (anti-aliased edge, crease with the walls): the roof
        // of the tallest analysed block (north bar, 18 m), which nothing can hide: a line of sight from
        // it rises towards the camera above, and the only taller block, the context tower, stands
        // south-east while the default camera looks from the south-south-west. Of a face's pixels at
        // least ((e - 3) / e)^2 show the ramp colour unchanged: each patch's texture cell is e x e texels
        // with a one-texel border darkened to 0.88 (PaletteAtlas; 12 % off, beyond nearRamp's 6 code
        // values) and bilinear sampling blends half a texel more on each side; the only light is a
        // white ambient one, so texels reach the screen as they are. Pixels are sampled every second row
        // and column: counts are quartered.
        int cell = prep.patches().stream().mapToInt(m -> m.atlas.cell).min().orElseThrow();
        double keep = Math.pow((cell - 3.0) / cell, 2);
        double[] upper = {0, 0}, lower = {0, 0};
        onFx(() -> {
            javafx.geometry.Point3D eye = w.rig().camera().localToScene(0, 0, 0);
            javafx.scene.Node world = w.view().node();
            eye = world.sceneToLocal(eye);
            double top = 0;
            for (int bl = 0; bl < 4; bl++) top = Math.max(top, SyntheticViewerData.BLOCKS[bl][4]);
            for (int bl = 0; bl < 4; bl++) {
                double[] k = SyntheticViewerData.BLOCKS[bl];
                for (double[][] f : org.solmass.fixtures.Boxes.onGround(k[0], k[1], k[2], k[3], k[4]).faces()) {
                    double[] a2 = projectedAreaAndPerimeter(w, prep.frame(), f, eye);
                    upper[0] += a2[0];
                    upper[1] += a2[1];
                    if (k[4] == top && f[0][2] == top && f[2][2] == top) {
                        lower[0] += a2[0];
                        lower[1] += a2[1];
                    }
                }
            }
            return null;
        });
        double upperPx = (upper[0] + upper[1]) / 4, lowerPx = keep * (lower[0] - lower[1]) / 4;
        assertTrue(ramp >= lowerPx && ramp <= upperPx, String.format(java.util.Locale.ROOT,
                "%d sampled ramp pixels, expected %.0f..%.0f (cell %d texels)", ramp, lowerPx, upperPx, cell));
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
        // and writes it as a sheet: the same width, title and legend bands added above and below
        java.awt.image.BufferedImage sheet = onFx(() -> w.exportSheet(2));
        assertEquals(2 * width, sheet.getWidth());
        assertTrue(sheet.getHeight() > 2 * height, "export sheet height " + sheet.getHeight());

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

    /**
     * Area (px^2) and perimeter (px) in the 3D view's pixels of a face (world corners, metres), 0 when
     * it is turned away from the eye (scene frame of the model).
     */
    static double[] projectedAreaAndPerimeter(ViewerWindow w, SceneFrame fr, double[][] face, javafx.geometry.Point3D eye) {
        javafx.geometry.Point3D[] p = new javafx.geometry.Point3D[face.length];
        for (int i = 0; i < face.length; i++) p[i] = new javafx.geometry.Point3D(fr.fx(face[i][0]), fr.fy(face[i][2]), fr.fz(face[i][1]));
        javafx.geometry.Point3D n = p[1].subtract(p[0]).crossProduct(p[2].subtract(p[0]));
        if (n.dotProduct(eye.subtract(p[0])) <= 0) return new double[] {0, 0};   // (x, y, z) -> (x, -z, y) is a rotation: normals stay outward
        double area = 0, perimeter = 0;
        Point2D[] q = new Point2D[p.length];
        for (int i = 0; i < p.length; i++) q[i] = w.subScene().screenToLocal(w.view().node().localToScreen(p[i]));
        for (int i = 0; i < q.length; i++) {
            Point2D a = q[i], b = q[(i + 1) % q.length];
            area += a.getX() * b.getY() - b.getX() * a.getY();
            perimeter += a.distance(b);
        }
        return new double[] {Math.abs(area) / 2, perimeter};
    }

    static void frames(int n) throws InterruptedException {
        CountDownLatch l = new CountDownLatch(1);
        Platform.runLater(() -> SolmassViewer.afterFrames(n, l::countDown));
        assertTrue(l.await(60, TimeUnit.SECONDS), "no frames rendered");
    }
}
