package org.solmass.viewer;

import java.nio.file.Path;

/**
 * Opens the viewer on the SYNTHETIC courtyard (or, with a second argument, on about that many
 * patches) and saves a snapshot of the window: {@code ViewerDemo out.png [patches [view]]}.
 */
public final class ViewerDemo {
    public static void main(String[] a) throws Exception {
        int n = a.length > 1 ? Integer.parseInt(a[1]) : 0;
        long t0 = System.nanoTime();
        if (Boolean.getBoolean("demo.sample")) {
            Thread w = new Thread(() -> {
                while (true) {
                    try { Thread.sleep(1500); } catch (InterruptedException e) { return; }
                    Thread.getAllStackTraces().forEach((t, st) -> {
                        if (t.getName().startsWith("QuantumRenderer") && st.length > 0) {
                            StringBuilder b = new StringBuilder("sample " + t.getName() + ":");
                            for (int i = 0; i < Math.min(6, st.length); i++) b.append("\n   ").append(st[i]);
                            System.err.println(b);
                        }
                    });
                }
            });
            w.setDaemon(true);
            w.start();
        }
        long slowMs = Long.getLong("demo.slowMs", 0);
        ViewerLoader loader = (p, c) -> {
            for (int i = 0; i < 20 && slowMs > 0; i++) {       // pretend analysis, for looking at the progress overlay
                p.progress(i / 20.0, "Analysing (synthetic) \u2014 step " + (i + 1) + " of 20");
                Thread.sleep(slowMs / 20);
                if (c.getAsBoolean()) return null;
            }
            return n > 0 ? SyntheticViewerData.withAbout(n, true) : SyntheticViewerData.courtyard();
        };
        if (a.length > 2) System.setProperty("solmass.viewer.view", a[2]);
        double s = SolmassViewer.snapshot(loader, ViewerActions.none(new RerunRequest(1, "synthetic", "perez")), Path.of(a[0]),
                1440, 900);
        System.err.printf("first frame after %.2f s (%.2f s since main)%n", s, (System.nanoTime() - t0) / 1e9);
    }
}
