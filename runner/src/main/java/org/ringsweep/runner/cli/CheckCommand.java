package org.ringsweep.runner.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep check NET.yaml...}: simulate each net at its own values (and corners), check limits. */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Simulate each net at its own values (and, with --corners, at each of its corners),",
                "measure every receiver edge and check the limits. Prints a table, or JSON Lines with --json."})
public final class CheckCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Mixin
    NetOptions selection;

    @Override
    public Integer call() {
        return new CheckFlow(common, spec.commandLine().getOut(), spec.commandLine().getErr())
                .run(selection.nets, selection.corners, selection.sets, true);
    }
}
