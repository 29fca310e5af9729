package org.solmass.viewer;

import javafx.animation.AnimationTimer;
import javafx.application.ConditionalFeature;
import javafx.application.Platform;
import javafx.embed.swing.SwingFXUtils;
import javafx.scene.image.WritableImage;
import javafx.stage.Stage;

import javax.imageio.ImageIO;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Entry points of the viewer, callable from a plain main thread (the FX toolkit is started here,
 * the launcher's main class is not an {@code Application}).
 */
public final class SolmassViewer {
    /** When set to a file name, {@link #open} saves a snapshot of the window there and returns instead of waiting. */
    public static final String SNAPSHOT_PROPERTY = "solmass.viewer.snapshot";

    private SolmassViewer() {}

    /**
     * Opens the window, runs the loader in the background (progress bar, cancel button) and blocks
     * until the user closes the window; then stops the FX toolkit.
     */
    public static void open(ViewerLoader loader, ViewerActions actions) throws InterruptedException {
        String snap = System.getProperty(SNAPSHOT_PROPERTY);
        if (snap != null && !snap.isBlank()) {
            snapshot(loader, actions, Path.of(snap), 1440, 900);
            return;
        }
        showUntilClosed(actions, (st, w) -> w.load(loader, win -> reportFirstFrame(win)));
    }

    /** Shows a new window, hands it to {@code then} on the FX thread, blocks until it is closed; stops the toolkit. */
    private static void showUntilClosed(ViewerActions actions, java.util.function.BiConsumer<Stage, ViewerWindow> then)
            throws InterruptedException {
        startToolkit();
        CountDownLatch closed = new CountDownLatch(1);
        Platform.runLater(() -> {
            Stage st = new Stage();
            ViewerWindow w = new ViewerWindow(st, actions, 1440, 900);
            st.setOnHidden(e -> closed.countDown());
            st.show();
            then.accept(st, w);
        });
        closed.await();
        Platform.exit();
    }

    /**
     * Opens the window on a model for a new study (the set-up on the left, docs/viewer.md "A new study
     * from a model") and blocks until the user closes it; then stops the FX toolkit. With
     * {@code -Dsolmass.viewer.snapshot=FILE} it saves the set-up window there and returns.
     */
    public static void openNewStudy(Path obj, ViewerActions actions) throws InterruptedException {
        String snap = System.getProperty(SNAPSHOT_PROPERTY);
        showUntilClosed(actions, (st, w) -> {
            w.startSetup(obj);
            if (snap != null && !snap.isBlank()) {
                afterFrames(3, () -> {
                    write(w.snapshotWindow(), Path.of(snap));
                    st.hide();
                });
            }
        });
    }

    /**
     * Opens the window at the given size, waits until the data is loaded and rendered, writes a PNG
     * of the whole window to {@code png}, closes the window and stops the FX toolkit.
     *
     * @return seconds from the call to the first rendered frame with the data
     * @throws IllegalStateException when the loader fails (its exception is the cause) or nothing renders
     * @throws java.util.concurrent.CancellationException when the loader is cancelled
     */
    public static double snapshot(ViewerLoader loader, ViewerActions actions, Path png, int width, int height)
            throws InterruptedException {
        try {
            return snapshotKeepToolkit(loader, actions, png, width, height, 600);
        } finally {
            Platform.exit();
        }
    }

    static double snapshotKeepToolkit(ViewerLoader loader, ViewerActions actions, Path png, int width, int height,
                                      long timeoutSeconds) throws InterruptedException {
        long t0 = System.nanoTime();
        startToolkit();
        if (Boolean.getBoolean("solmass.viewer.timing")) System.err.printf("viewer: toolkit up after %.2f s (at %.2f)%n", (System.nanoTime() - t0) / 1e9, System.nanoTime() / 1e9 % 1000);
        AtomicReference<ViewerWindow> win = new AtomicReference<>();
        AtomicReference<Throwable> failed = new AtomicReference<>();
        CountDownLatch rendered = new CountDownLatch(1);
        Platform.runLater(() -> {
            Stage st = new Stage();
            ViewerWindow w = new ViewerWindow(st, actions, width, height);
            win.set(w);
            st.show();
            if (Boolean.getBoolean("solmass.viewer.timing")) System.err.printf("viewer: window shown at %.2f%n", System.nanoTime() / 1e9 % 1000);
            w.load(loader, x -> afterFrames(3, () -> {
                try {
                    write(x.snapshotWindow(), png);
                } catch (RuntimeException e) {
                    failed.set(e);
                }
                rendered.countDown();
            }), e -> {
                failed.set(e);
                rendered.countDown();
            });
        });
        boolean done = rendered.await(timeoutSeconds, TimeUnit.SECONDS);
        if (failed.get() != null || !done) {
            Platform.runLater(() -> { if (win.get() != null) win.get().stage().hide(); });
            if (!done) throw new IllegalStateException("the viewer did not render within " + timeoutSeconds + " s");
            Throwable e = failed.get();
            if (e instanceof java.util.concurrent.CancellationException c) throw c;
            throw new IllegalStateException("no snapshot: " + e.getMessage(), e);
        }
        double s = (System.nanoTime() - t0) / 1e9;
        CountDownLatch hidden = new CountDownLatch(1);
        Platform.runLater(() -> {
            win.get().stage().hide();
            hidden.countDown();
        });
        hidden.await(10, TimeUnit.SECONDS);
        return s;
    }

    /**
     * Starts the FX toolkit once; warns on stderr when 3D is not available. Unless the user set them,
     * asks for the ES2 pipeline (software sw as fallback) and allows it on software OpenGL (Mesa), the
     * only pipeline that draws 3D on Linux without a GPU.
     */
    static void startToolkit() {
        if (System.getProperty("prism.order") == null) System.setProperty("prism.order", "es2,sw");
        if (System.getProperty("prism.forceGPU") == null) System.setProperty("prism.forceGPU", "true");
        CountDownLatch up = new CountDownLatch(1);
        try {
            Platform.startup(up::countDown);
        } catch (IllegalStateException alreadyRunning) {
            up.countDown();
        }
        try {
            up.await();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        Platform.setImplicitExit(false);
        if (!Platform.isSupported(ConditionalFeature.SCENE3D)) {
            System.err.println("viewer: this display does not support JavaFX 3D (try -Dprism.order=es2 -Dprism.forceGPU=true); the model may not draw");
        }
    }

    /** Runs an action on the FX thread after n more frames have been rendered. */
    static void afterFrames(int n, Runnable r) {
        new AnimationTimer() {
            int left = n;

            @Override public void handle(long now) {
                if (Boolean.getBoolean("solmass.viewer.timing")) System.err.printf("viewer: frame at %.2f s%n", System.nanoTime() / 1e9 % 1000);
                if (--left <= 0) {
                    stop();
                    r.run();
                }
            }
        }.start();
    }

    private static void reportFirstFrame(ViewerWindow w) {
        afterFrames(1, () -> System.err.printf("viewer: %,d patches on screen%n", w.data().patches().size()));
    }

    static void write(WritableImage img, Path png) {
        try {
            Path parent = png.toAbsolutePath().getParent();
            if (parent != null) Files.createDirectories(parent);
            ImageIO.write(SwingFXUtils.fromFXImage(img, null), "png", png.toFile());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + png, e);
        }
    }
}
