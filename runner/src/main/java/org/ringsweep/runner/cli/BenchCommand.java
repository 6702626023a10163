package org.ringsweep.runner.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.ringsweep.runner.bench.OverheadBenchmark;
import org.ringsweep.runner.bench.RawReaderBenchmark;
import org.ringsweep.runner.engine.NgspiceEngine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code ringsweep bench [--only NAME]...}: the benchmarks whose figures the README reports. Without
 * {@code --only} every benchmark but {@code sweep-memory} runs (that one simulates a million points,
 * which takes a quarter of an hour or more and writes some 5 GB under {@code --work}).
 */
@Command(name = "bench", mixinStandardHelpOptions = true,
        description = {"Run the benchmarks (raw-file reader throughput, results store, orchestration overhead against bare ngspice,"
                + " points per ngspice process, built-in engine against ngspice).",
                "--only sweep-memory runs a 1 000 000-point sweep with the built-in engine in a 256 MB heap (not part of the default run)."})
public final class BenchCommand implements Callable<Integer> {
    /** The benchmarks by the names {@code --only} takes, in run order. */
    static final List<String> NAMES = List.of("raw", "store", "overhead", "batch", "engines", "sweep-memory");

    @Spec
    CommandSpec spec;

    @Option(names = "--work", paramLabel = "DIR", defaultValue = "ringsweep-out/bench", description = "Scratch folder (default: ${DEFAULT-VALUE}).")
    Path work;

    @Option(names = "--nets", defaultValue = "100", description = "Nets for the overhead benchmark (default: ${DEFAULT-VALUE}).")
    int nets;

    @Option(names = "--only", paramLabel = "NAME", split = ",",
            description = "Run only these benchmarks: raw, store, overhead, batch, engines, sweep-memory (repeatable or comma-separated).")
    List<String> only;

    @Option(names = "--points", paramLabel = "N", defaultValue = "1000000",
            description = "Points of the sweep-memory benchmark (default: ${DEFAULT-VALUE}; a multiple of 1000 makes a 1000-wide grid).")
    long points;

    @Option(names = "--jobs", paramLabel = "N", description = "--jobs of the sweep-memory sweep (default: the number of cores).")
    Integer jobs;

    @Override
    public Integer call() throws Exception {
        var out = spec.commandLine().getOut();
        List<String> chosen = only == null ? NAMES.subList(0, NAMES.size() - 1) : only;
        for (String name : chosen) {
            if (!NAMES.contains(name)) {
                spec.commandLine().getErr().println("ringsweep: bench: --only: unknown benchmark `" + name + "`; expected one of: "
                        + String.join(", ", NAMES));
                return ExitCodes.INPUT;
            }
        }
        Files.createDirectories(work);
        if (chosen.contains("raw")) {
            Files.createDirectories(work.resolve("raw"));
            out.println(RawReaderBenchmark.run(work.resolve("raw")));
            out.flush();
        }
        if (chosen.contains("store")) {
            out.println(org.ringsweep.runner.bench.StoreBenchmark.run(work.resolve("store")));
            out.flush();
        }
        if (chosen.contains("sweep-memory")) {
            out.println(org.ringsweep.runner.bench.SweepMemoryBenchmark.run(work, points,
                    jobs == null ? Runtime.getRuntime().availableProcessors() : jobs));
            out.flush();
        }
        if (chosen.stream().noneMatch(List.of("overhead", "batch", "engines")::contains)) {
            return ExitCodes.OK;
        }
        var located = NgspiceEngine.locate(System.getenv());
        if (located.isEmpty()) {
            out.println("overhead, batch, engines: skipped, ngspice not found");
            return ExitCodes.SIMULATION;
        }
        if (chosen.contains("overhead")) {
            out.println(OverheadBenchmark.run(work.resolve("overhead"), located.get().binary(), nets));
            out.flush();
        }
        if (chosen.contains("batch")) {
            out.println(org.ringsweep.runner.bench.BatchBenchmark.run(work.resolve("batch"), located.get().binary()));
            out.flush();
        }
        if (chosen.contains("engines")) {
            out.println(org.ringsweep.runner.bench.EngineBenchmark.run(work.resolve("engines"), located.get().binary()));
        }
        return ExitCodes.OK;
    }
}
