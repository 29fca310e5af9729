package org.solmass.cli;

import org.solmass.InputException;
import org.solmass.output.FacadeLayout;
import org.solmass.output.FacadeSheet;
import org.solmass.output.FolderClaim;
import org.solmass.output.MapRenderer;
import org.solmass.output.PublishedRun;
import org.solmass.output.ResultsFolder;
import org.solmass.output.RunPeriod;
import org.solmass.surface.Patch;
import org.solmass.table.Column;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;

/** {@code solmass elevations}: a PNG page of facade elevations per analysed block of a finished run. */
@Command(name = "elevations", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Facade elevations of a finished run: each analysed block's facades unrolled side by side,",
                "seen straight on at one scale, coloured by a column of patches.csv. Writes one PNG per",
                "block to RESULTS/elevations (or --out). The model file must be unchanged since the run."})
public final class ElevationsCommand implements Callable<Integer> {
    /** The default folder of the pages, inside the results folder. */
    static final String FOLDER = "elevations";

    @Parameters(paramLabel = "RESULTS", description = "results folder of analyse") Path results;
    @Option(names = "--column", paramLabel = "NAME", description = "column of patches.csv to colour by (default annual_kwh_m2)") String column;
    @Option(names = "--width", paramLabel = "PX", defaultValue = "2000", description = "page width, pixels (default ${DEFAULT-VALUE})") int widthPx;
    @Option(names = "--height", paramLabel = "PX", defaultValue = "1200", description = "page height, pixels (default ${DEFAULT-VALUE})") int heightPx;
    @Option(names = "--out", paramLabel = "DIR", description = "output folder (default: RESULTS/elevations)") Path out;

    /** One page: the block and its picture. */
    record Page(String block, BufferedImage image, int facadePatches) {}

    @Override
    public Integer call() {
        if (widthPx < 800 || widthPx > 12000) throw new InputException("--width", "expected 800 to 12000 pixels, got " + widthPx);
        if (heightPx < 600 || heightPx > 12000) throw new InputException("--height", "expected 600 to 12000 pixels, got " + heightPx);
        PublishedRun run = PublishedRun.open(results);
        for (String w : run.warnings()) System.err.println("solmass: warning: " + w);
        Path dir = out != null ? out : results.resolve(FOLDER);
        FolderClaim.prepareWritable(dir, out != null ? "--out" : results.toString());
        RunGeometry geo = RunGeometry.of(run);
        List<Page> pages = pages(geo, column, widthPx, heightPx);
        Set<String> names = new HashSet<>();
        System.out.printf("solmass elevations: %s%n", geo.study().name());
        for (Page p : pages) {
            String name = fileName(p.block(), names);
            Path f = dir.resolve(name);
            org.solmass.output.AtomicFiles.write(f, o -> {
                if (!javax.imageio.ImageIO.write(p.image(), "png", o)) throw new java.io.IOException("no PNG writer available");
            });
            System.out.printf("  wrote %s (%d facade patches)%n", f, p.facadePatches());
        }
        if (pages.isEmpty()) System.out.println("  no analysed block has facade patches; nothing written");
        return Main.EXIT_OK;
    }

    /**
     * The pages of every analysed block with facade patches, in block order, coloured over one range for
     * all pages: the map's (2nd to 98th percentile of every analysed patch's value).
     *
     * @param column column of patches.csv, or null for annual irradiation
     */
    static List<Page> pages(RunGeometry geo, String column, int widthPx, int heightPx) {
        String name = column != null ? column : ResultsFolder.MAIN_COLUMN.name();
        double[] values = geo.values(name);
        Column def = geo.table().def(name);
        boolean diverging = def.kind() == org.solmass.table.ColumnKind.DIVERGING;
        double[] range = diverging ? MapRenderer.symmetricRange(values) : MapRenderer.autoRange(values);
        List<String> blocks = geo.model().blockNames();
        List<Page> out = new ArrayList<>();
        for (int b = 0; b < blocks.size(); b++) {
            if (!geo.analysed()[b]) continue;
            List<Patch> mine = new ArrayList<>();
            for (Patch p : geo.patches()) if (p.block() == b) mine.add(p);
            FacadeLayout layout = FacadeLayout.of(mine);
            if (layout.panels().isEmpty()) continue;
            int n = layout.panels().stream().mapToInt(x -> x.patches().size()).sum();
            FacadeSheet.Options o = new FacadeSheet.Options(widthPx, heightPx, geo.study().name(), blocks.get(b), def.label(),
                    def.unit().symbol(), RunPeriod.of(geo.run().record()), range[0], range[1], diverging, FacadeSheet.Options.MAP_RANGE);
            out.add(new Page(blocks.get(b), FacadeSheet.render(layout, values, o), n));
        }
        return out;
    }

    /** A file name for a block: letters, digits, '.', '_' and '-' kept, others '_'; a repeat gets a number. */
    static String fileName(String block, Set<String> taken) {
        String base = block.replaceAll("[^A-Za-z0-9._-]", "_");
        if (base.isEmpty() || base.startsWith(".")) base = "block" + base;
        String name = base + ".png";
        for (int k = 2; !taken.add(name.toLowerCase(java.util.Locale.ROOT)); k++) name = base + "-" + k + ".png";
        return name;
    }
}
