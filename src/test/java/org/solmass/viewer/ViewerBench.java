package org.solmass.viewer;

import javafx.application.Platform;
import javafx.stage.Stage;

import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Opening time of the viewer on a SYNTHETIC model with about N patches (default 200,000): the data is
 * built first and not timed; timed is preparing the meshes, putting them on show and the first
 * rendered frame, plus one recolour. Prints wall and process CPU seconds.
 * {@code ViewerBench [patches] [snapshot.png]} under xvfb-run.
 */
public final class ViewerBench {
    public static void main(String[] a) throws Exception {
        int n = a.length > 0 ? Integer.parseInt(a[0]) : 200_000;
        ViewerData d = SyntheticViewerData.withAbout(n, true);
        SolmassViewer.startToolkit();
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean();
        // as in use: the window is up (showing the loader's progress) before the data arrives
        long b0 = System.nanoTime();
        AtomicReference<ViewerWindow> win = new AtomicReference<>();
        CountDownLatch up = new CountDownLatch(1);
        Platform.runLater(() -> {
            Stage st = new Stage();
            ViewerWindow w = new ViewerWindow(st, ViewerActions.none(new RerunRequest(1, "synthetic", "perez")), 1440, 900);
            st.show();
            win.set(w);
            SolmassViewer.afterFrames(2, up::countDown);
        });
        up.await();
        long b1 = System.nanoTime();
        long w0 = System.nanoTime(), c0 = os.getProcessCpuTime();
        ModelView3D.Prepared prep = ModelView3D.Prepared.of(d);
        long w1 = System.nanoTime(), c1 = os.getProcessCpuTime();
        CountDownLatch shown = new CountDownLatch(1), drawn = new CountDownLatch(1);
        Platform.runLater(() -> {
            ViewerWindow w = win.get();
            w.show(d, prep);
            shown.countDown();
            SolmassViewer.afterFrames(2, () -> {
                w.snapshot3D(1);      // forces a complete render of the 3D view
                drawn.countDown();
            });
        });
        shown.await();
        long w2 = System.nanoTime(), c2 = os.getProcessCpuTime();
        drawn.await(600, TimeUnit.SECONDS);
        long w3 = System.nanoTime(), c3 = os.getProcessCpuTime();
        System.out.printf("empty window up  wall %.2f s (before the data; not in the total)%n", (b1 - b0) / 1e9);
        CountDownLatch re = new CountDownLatch(1);
        Platform.runLater(() -> {
            win.get().controlsSelect("m06_kwh_m2");
            SolmassViewer.afterFrames(2, () -> {
                win.get().snapshot3D(1);
                re.countDown();
            });
        });
        re.await(600, TimeUnit.SECONDS);
        long w4 = System.nanoTime(), c4 = os.getProcessCpuTime();
        // orbit: 20 camera steps, each drawn (pulse-driven, so this is the achievable frame time)
        CountDownLatch orbit = new CountDownLatch(1);
        long o0 = System.nanoTime();
        Platform.runLater(() -> new javafx.animation.AnimationTimer() {
            int step;

            @Override public void handle(long now) {
                CameraRig r = win.get().rig();
                r.setView(r.headingDeg() + 4, r.pitchDeg(), r.distance());
                if (++step == 20) {
                    stop();
                    orbit.countDown();
                }
            }
        }.start());
        orbit.await(600, TimeUnit.SECONDS);
        long o1 = System.nanoTime();
        System.out.printf("orbit            %.0f ms per frame over 20 frames (pulse cap 60 fps = 17 ms)%n", (o1 - o0) / 1e6 / 20);
        System.out.printf("patches %,d in %d meshes%n", d.patches().size(), prep.patches().size());
        System.out.printf("prepare meshes   wall %.2f s  cpu %.2f s%n", (w1 - w0) / 1e9, (c1 - c0) / 1e9);
        System.out.printf("put on show      wall %.2f s  cpu %.2f s%n", (w2 - w1) / 1e9, (c2 - c1) / 1e9);
        System.out.printf("first frame      wall %.2f s  cpu %.2f s%n", (w3 - w2) / 1e9, (c3 - c2) / 1e9);
        System.out.printf("open total       wall %.2f s  cpu %.2f s%n", (w3 - w0) / 1e9, (c3 - c0) / 1e9);
        System.out.printf("recolour+frame   wall %.2f s  cpu %.2f s%n", (w4 - w3) / 1e9, (c4 - c3) / 1e9);
        System.out.printf("load average %.2f on %d cores%n", os.getSystemLoadAverage(), os.getAvailableProcessors());
        if (a.length > 1) {
            CountDownLatch s = new CountDownLatch(1);
            Platform.runLater(() -> {
                SolmassViewer.write(win.get().snapshotWindow(), Path.of(a[1]));
                s.countDown();
            });
            s.await();
        }
        Platform.exit();
    }
}
