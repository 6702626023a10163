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

/** {@code ringsweep check NET.yaml...}: simulate each net at its own values (and corners), check limits. */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Simulate each net at its own values (and, with --corners, at each of its corners),",
                "measure every receiver edge and check the limits. Prints a table, or JSON Lines with --json."})
public final class CheckCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(arity = "1..*", paramLabel = "NET.yaml", description = "Net files (ringsweep/net-1).")
    List<Path> nets;

    @Option(names = "--corners", description = "Also run every corner the net file defines (typ is always run).")
    boolean corners;

    @Option(names = "--set", paramLabel = "ID/param=value", description = "Override a value for every point, e.g. --set R5/value=33.")
    List<String> sets = new ArrayList<>();

    @Override
    public Integer call() {
        return new CheckFlow(common, spec.commandLine().getOut(), spec.commandLine().getErr())
                .run(nets, corners, sets, true);
    }
}
