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
        ViewerLoader loader = (p, c) -> n > 0 ? SyntheticViewerData.withAbout(n, true) : SyntheticViewerData.courtyard();
        if (a.length > 2) System.setProperty("solmass.viewer.view", a[2]);
        double s = SolmassViewer.snapshot(loader, ViewerActions.none(new RerunRequest(1, "synthetic", "perez")), Path.of(a[0]),
                1440, 900);
        System.err.printf("first frame after %.2f s (%.2f s since main)%n", s, (System.nanoTime() - t0) / 1e9);
    }
}
