package org.ringsweep.runner.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep deck NET.yaml}: write the deck(s) only. */
@Command(name = "deck", mixinStandardHelpOptions = true,
        description = "Write the ngspice deck(s) of a net without simulating; prints the paths written.")
public final class DeckCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(arity = "1..*", paramLabel = "NET.yaml", description = "Net files (ringsweep/net-1).")
    List<Path> nets;

    @Option(names = "--corners", description = "Also write a deck for every corner the net file defines.")
    boolean corners;

    @Option(names = "--set", paramLabel = "ID/param=value", description = "Override a value, e.g. --set R5/value=33.")
    List<String> sets = new ArrayList<>();

    @Override
    public Integer call() {
        return new CheckFlow(common, spec.commandLine().getOut(), spec.commandLine().getErr())
                .run(nets, corners, sets, false);
    }
}
