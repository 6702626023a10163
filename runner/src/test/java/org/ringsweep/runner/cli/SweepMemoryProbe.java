package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.ringsweep.runner.bench.HeapWatch;
import picocli.CommandLine;

/**
 * The child JVM of {@link SweepMemoryTests}: writes a one-receiver net and a grid sweep of
 * {@code R1/value} × {@code U1.1/rise} giving the asked number of points, runs the real
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
        Files.createDirectories(dir.resolve("nets"));
        Files.writeString(dir.resolve("nets/tiny.yaml"), String.join("\n",
                "format: ringsweep/net-1",
                "net: TINY",
                "rails: { VCC: 3.3 }",
                "drivers:",
                "  - { pin: U1.1, model: ramp, v_high: VCC, rise: 1ns, r_out: 20 }",
                "receivers:",
                "  - { pin: U2.1, model: cmos, c_in: 3pF, vih: 2.0, vil: 0.8 }",
                "segments:",
                "  - { from: U1.1, to: R1.1, z0: 50, delay: 50ps }",
                "  - { from: R1.2, to: U2.1, z0: 50, delay: 200ps }",
                "parts:",
                "  - { ref: R1, kind: resistor, value: 33, between: [R1.1, R1.2] }",
                ""), StandardCharsets.UTF_8);
        Files.writeString(dir.resolve("sweep.yaml"), String.join("\n",
                "format: ringsweep/sweep-1",
                "nets: [nets/tiny.yaml]",
                "vary:",
                "  - { target: R1/value, from: 10, to: 60, steps: " + args[1] + " }",
                "  - { target: U1.1/rise, from: 0.5ns, to: 2ns, steps: " + args[2] + " }",
                ""), StandardCharsets.UTF_8);
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
