package org.ringsweep.runner.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.ringsweep.runner.bench.OverheadBenchmark;
import org.ringsweep.runner.bench.RawReaderBenchmark;
import org.ringsweep.runner.engine.NgspiceEngine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep bench}: the benchmarks whose figures the README reports. */
@Command(name = "bench", mixinStandardHelpOptions = true,
        description = "Run the benchmarks (raw-file reader throughput, orchestration overhead against bare ngspice,"
                + " points per ngspice process).")
public final class BenchCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--work", paramLabel = "DIR", defaultValue = "ringsweep-out/bench", description = "Scratch folder (default: ${DEFAULT-VALUE}).")
    Path work;

    @Option(names = "--nets", defaultValue = "100", description = "Nets for the overhead benchmark (default: ${DEFAULT-VALUE}).")
    int nets;

    @Override
    public Integer call() throws Exception {
        var out = spec.commandLine().getOut();
        Files.createDirectories(work);
        Files.createDirectories(work.resolve("raw"));
        out.println(RawReaderBenchmark.run(work.resolve("raw")));
        out.flush();
        out.println(org.ringsweep.runner.bench.StoreBenchmark.run(work.resolve("store")));
        out.flush();
        var located = NgspiceEngine.locate(System.getenv());
        if (located.isEmpty()) {
            out.println("overhead: skipped, ngspice not found");
            return ExitCodes.SIMULATION;
        }
        out.println(OverheadBenchmark.run(work.resolve("overhead"), located.get().binary(), nets));
        out.flush();
        out.println(org.ringsweep.runner.bench.BatchBenchmark.run(work.resolve("batch"), located.get().binary()));
        out.flush();
        out.println(org.ringsweep.runner.bench.EngineBenchmark.run(work.resolve("engines"), located.get().binary()));
        return ExitCodes.OK;
    }
}
