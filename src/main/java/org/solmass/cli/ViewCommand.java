package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.output.RunRecord;
import org.solmass.study.StudyReader;
import org.solmass.viewer.SolmassViewer;
import org.solmass.viewer.ViewerActions;
import org.solmass.viewer.ViewerData;
import org.solmass.viewer.ViewerLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code solmass view}: the 3D viewer on a study (analysed first) or on a finished results folder. */
@Command(name = "view", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Opens the 3D viewer on a study, a results folder, or a model (MODEL.obj: set up a new study).",
                "On a study file it analyses first (with a progress bar and a cancel button) and writes the",
                "results folder; on a results folder it opens the finished results."})
public final class ViewCommand implements Callable<Integer> {
    @Parameters(paramLabel = "STUDY.json|RESULTS-FOLDER|MODEL.obj") Path target;
    @Option(names = "--against", paramLabel = "RESULTS-A", description = "with a results folder: also show the differences from this other variant (delta_* quantities, diverging ramp)") Path against;
    @Option(names = "--snapshot", paramLabel = "FILE.png", description = "render once, save a PNG of the window and exit (needs a display, e.g. xvfb-run)") Path snapshot;
    @Option(names = "--width", defaultValue = "1440", paramLabel = "PX", description = "window width (default ${DEFAULT-VALUE})") int width;
    @Option(names = "--height", defaultValue = "900", paramLabel = "PX", description = "window height (default ${DEFAULT-VALUE})") int height;

    /** The actions of a window started on a model for a new study (the set-up's runs, variants, compare). */
    public static ViewerActions newStudyActions() {
        return ViewerBridge.forNewStudy();
    }

    @Override
    public Integer call() throws Exception {
        ViewerLoader loader;
        ViewerActions actions;
        if (Files.isRegularFile(target) && target.getFileName().toString().toLowerCase(java.util.Locale.ROOT).endsWith(".obj")) {
            if (against != null) throw new InputException("--against", "compares two results folders; give a results folder, not a model");
            if (snapshot != null) System.setProperty(SolmassViewer.SNAPSHOT_PROPERTY, snapshot.toString());
            SolmassViewer.openNewStudy(target.toAbsolutePath().normalize(), newStudyActions());
            return Main.EXIT_OK;
        }
        if (Files.isDirectory(target)) {
            if (!Files.exists(target.resolve(RunRecord.FILE_NAME)) && !org.solmass.output.PublishedRun.looksIncomplete(target)) {
                throw new InputException(target.toString(), "not a results folder: no " + RunRecord.FILE_NAME
                        + " (run 'solmass analyse' first, or give a study file)");
            }
            ViewerBridge[] bridge = new ViewerBridge[1];
            ViewerData data = ViewerBridge.fromFolder(target, bridge);
            if (against != null) data = ViewerBridge.withDifferences(data, against, target);
            loader = ViewerLoader.of(data);
            actions = bridge[0];
        } else {
            if (against != null) throw new InputException("--against", "compares two results folders; give a results folder, not a study file");
            ViewerBridge bridge = new ViewerBridge(StudyReader.read(target));
            loader = bridge::analyse;
            actions = bridge;
        }
        if (snapshot != null) {
            double s = SolmassViewer.snapshot(loader, actions, snapshot, width, height);
            System.out.printf("solmass view: first frame after %.2f s; wrote %s%n", s, snapshot);
        } else {
            SolmassViewer.open(loader, actions);
        }
        return Main.EXIT_OK;
    }
}
