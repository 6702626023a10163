package org.ringsweep.runner.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** Which nets and points a command works on: the net files, {@code --corners} and {@code --set}. */
public final class NetOptions {
    @Parameters(arity = "1..*", paramLabel = "NET.yaml", description = "Net files (ringsweep/net-1).")
    List<Path> nets;

    @Option(names = "--corners", description = "Also run every corner the net file defines (typ is always run).")
    boolean corners;

    @Option(names = "--set", paramLabel = "ID/param=value", description = "Override a value for every point, e.g. --set R5/value=33.")
    List<String> sets = new ArrayList<>();
}
