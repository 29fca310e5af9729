package org.solmass.cli;

import org.solmass.sky.SkyModels;

import java.util.Iterator;

/** The sky model names of {@link SkyModels}, for the {@code --sky} help ({@code ${COMPLETION-CANDIDATES}}). */
public final class SkyNames implements Iterable<String> {
    @Override
    public Iterator<String> iterator() { return SkyModels.names().iterator(); }
}
