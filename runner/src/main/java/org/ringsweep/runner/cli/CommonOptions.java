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

    /** The per-simulation timeout. */
    java.time.Duration timeout() {
        return java.time.Duration.ofMillis(Math.round(timeoutSeconds * 1000));
    }

    /** The deck writer: the built-in templates, or those under {@code --templates}. */
    org.ringsweep.generators.deck.DeckWriter deckWriter() {
        return templates == null ? new org.ringsweep.generators.deck.DeckWriter()
                : org.ringsweep.generators.deck.DeckWriter.withTemplateDir(templates);
    }

    /**
     * The engine {@code --engine} names, or the exit code after printing why there is none:
     * 2 for an unknown choice, 3 when the chosen engine is not found.
     */
    record EngineSelection(java.util.Optional<org.ringsweep.runner.engine.SimulationEngine> engine, int exitCode) {
    }

    EngineSelection selectEngine(java.io.PrintWriter err) {
        org.ringsweep.runner.engine.EngineChoice choice;
        try {
            choice = org.ringsweep.runner.engine.EngineChoice.parse(engine);
        } catch (IllegalArgumentException e) {
            err.println("ringsweep: --engine: " + e.getMessage());
            return new EngineSelection(java.util.Optional.empty(), ExitCodes.INPUT);
        }
        try {
            return new EngineSelection(java.util.Optional.of(
                    org.ringsweep.runner.engine.EngineSelector.select(choice, System.getenv())), ExitCodes.OK);
        } catch (org.ringsweep.runner.engine.EngineNotFoundException e) {
            err.println("ringsweep: " + e.getMessage());
            return new EngineSelection(java.util.Optional.empty(), ExitCodes.SIMULATION);
        }
    }
}
