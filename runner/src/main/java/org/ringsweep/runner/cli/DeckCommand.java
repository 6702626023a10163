package org.ringsweep.runner.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
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

    @Mixin
    NetOptions selection;

    @Override
    public Integer call() {
        return new CheckFlow(common, spec.commandLine().getOut(), spec.commandLine().getErr())
                .run(selection.nets, selection.corners, selection.sets, false);
    }
}
