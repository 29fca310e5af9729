package org.solmass.viewer;

import javafx.application.ConditionalFeature;
import javafx.application.Platform;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/** A failing loader ends the snapshot path with its message instead of waiting (skipped without a display). */
class SnapshotFailureTest {
    @Test
    void failingLoaderEndsTheSnapshotWithItsMessage() {
        assumeTrue(System.getenv("DISPLAY") != null && !System.getenv("DISPLAY").isBlank(), "no DISPLAY");
        SolmassViewer.startToolkit();
        assumeTrue(Platform.isSupported(ConditionalFeature.SCENE3D), "no JavaFX 3D");
        ViewerLoader broken = (p, c) -> { throw new IllegalArgumentException("study.json:3: bad climate"); };
        IllegalStateException e = assertThrows(IllegalStateException.class, () -> SolmassViewer.snapshotKeepToolkit(
                broken, ViewerActions.none(new RerunRequest(1, "x", "perez")), Path.of("target", "never.png"), 800, 600, 60));
        assertEquals("study.json:3: bad climate", e.getCause().getMessage());
    }
}
