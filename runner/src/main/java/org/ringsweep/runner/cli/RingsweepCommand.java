package org.ringsweep.runner.cli;

import picocli.CommandLine.Command;

/** The top-level command: only groups the subcommands. */
@Command(name = "ringsweep", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Board-level signal-integrity checks and termination sweeps on ngspice.",
        subcommands = {CheckCommand.class, DeckCommand.class, SweepCommand.class, ResultsCommand.class, TuneCommand.class,
                ReportCommand.class, ImportCommand.class, ScreenCommand.class, DemoCommand.class, ModelsCommand.class, BenchCommand.class},
        footer = {"", "Exit codes: 0 all pass, 1 a limit is violated, 2 bad input or usage, 3 a simulation failed or no engine."})
public final class RingsweepCommand implements Runnable {
    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }
}
