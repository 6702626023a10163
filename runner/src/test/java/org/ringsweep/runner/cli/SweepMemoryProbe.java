package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.ringsweep.runner.bench.HeapWatch;
import org.ringsweep.runner.bench.SweepMemoryBenchmark;
import picocli.CommandLine;

/**
 * The child JVM of {@link SweepMemoryTests}: writes the benchmark's one-receiver net and grid sweep
 * ({@link SweepMemoryBenchmark#writeInputs}), runs the real
 * {@code sweep} command on it (planner, batch runner, store, results.jsonl, report, summary) with
 * {@link OrchestrationMemoryEngine}, then {@code results --csv} and {@code results --json} into
 * files, and prints {@code exit <code>} per command and {@code live-after-gc <bytes>}: the most heap
 * any collection left in use.
 *
 * <p>Arguments: the work folder, the values of R1, the values of the rise time.
 */
public final class SweepMemoryProbe {
    private SweepMemoryProbe() {
    }

    public static void main(String[] args) throws Exception {
        Path dir = Path.of(args[0]);
        SweepMemoryBenchmark.writeInputs(dir, Integer.parseInt(args[1]), Integer.parseInt(args[2]));
        HeapWatch heap = HeapWatch.start();
        Path out = dir.resolve("out");
        int sweep;
        try (PrintWriter summary = new PrintWriter(Files.newBufferedWriter(dir.resolve("summary.txt")))) {
            CommandLine cli = new CommandLine(new SweepCommand(new OrchestrationMemoryEngine()));
            cli.setOut(summary);
            sweep = cli.execute(dir.resolve("sweep.yaml").toString(), "--out", out.toString(), "--jobs", "2");
        }
        System.out.println("exit sweep " + sweep);
        for (String format : new String[] {"--csv", "--json"}) {
            try (PrintWriter file = new PrintWriter(Files.newBufferedWriter(dir.resolve("export" + format.replace("--", ".")),
                    StandardCharsets.UTF_8))) {
                CommandLine cli = new CommandLine(new ResultsCommand());
                cli.setOut(file);
                System.out.println("exit results" + format + " " + cli.execute(out.toString(), format));
            }
        }
        System.gc(); // one last collection, so a run too short to collect still reports its live heap
        Thread.sleep(200); // the notification arrives on another thread
        System.out.println("live-after-gc " + heap.maxAfterGcBytes());
    }
}
