package org.solmass.cli;

import java.util.List;

/** The registry of subcommands. Add a command object here to make it reachable from {@code solmass}. */
final class Commands {
    private Commands() {}

    static List<Object> all() {
        return List.of(new AnalyseCommand(), new SkyViewCommand(), new SunCommand(), new PlaneCommand(),
                new MakeWeatherCommand(), new BenchCommand(), new BenchAnalysisCommand(), new BenchPvCommand(), new ViewCommand(),
                new CompareCommand(), new ClimateCommand(), new ShadowsCommand(), new ElevationsCommand(), new ReportCommand());
    }
}
