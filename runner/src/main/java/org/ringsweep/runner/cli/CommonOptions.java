package org.ringsweep.runner.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** Options shared by the commands that run or write decks. */
public final class CommonOptions {
    @Option(names = "--out", paramLabel = "DIR", defaultValue = "ringsweep-out",
            description = "Folder for everything the run writes (default: ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--engine", paramLabel = "auto|ngspice|builtin", defaultValue = "auto",
            description = "Simulation engine (default: ${DEFAULT-VALUE}: ngspice when on PATH or named by RINGSWEEP_NGSPICE).")
    String engine;

    @Option(names = "--json", description = "Print one JSON result record per line instead of the table.")
    boolean json;

    @Option(names = "--quiet", description = "Print only the verdict lines (or the JSON records).")
    boolean quiet;

    @Option(names = "--templates", paramLabel = "DIR",
            description = "Folder of deck templates that override the built-in ones by file name.")
    Path templates;

    @Option(names = "--plugins", paramLabel = "DIR",
            description = "Folder of plugin jars whose driver models, receiver models and checks are added to the built-in ones.")
    Path plugins;

    @Option(names = "--no-report", description = "Skip report.html and junit.xml (they can be made later with `ringsweep report OUT`).")
    boolean noReport;

    @Option(names = "--timeout", paramLabel = "SECONDS", defaultValue = "120",
            description = "Wall-clock limit per simulation in seconds (default: ${DEFAULT-VALUE}).")
    double timeoutSeconds;
}
