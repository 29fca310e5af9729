package org.solmass.cli;

import org.solmass.sky.SkyModel;
import org.solmass.sky.SkyModels;
import picocli.CommandLine.Option;

import java.util.Iterator;

/** The {@code --sky} flag, the same on every command that takes a sky model; its names come from {@link SkyModels}. */
public final class SkyFlag {
    @Option(names = "--sky", paramLabel = "MODEL", completionCandidates = Names.class,
            description = "sky diffuse model, one of ${COMPLETION-CANDIDATES}; the first is the default") String name;

    /** The model named by the flag, or the registry's default without it (errors name {@code --sky}). */
    SkyModel model() {
        return name == null ? SkyModels.standard() : SkyModels.byName(name, "--sky");
    }

    /** The registry's names, for {@code ${COMPLETION-CANDIDATES}} in the help. */
    static final class Names implements Iterable<String> {
        @Override
        public Iterator<String> iterator() { return SkyModels.names().iterator(); }
    }
}
