package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.ringsweep.api.net.Net;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.batch.BatchRunner;
import org.ringsweep.runner.batch.Progress;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.input.PointParser;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.store.PointKey;
import org.ringsweep.runner.sweep.SweepFile;
import org.ringsweep.runner.sweep.SweepFileLoader;
import org.ringsweep.runner.sweep.SweepPlanner;

/**
 * Points per ngspice process: the same {@value #POINTS}-point sweep (a point-to-point net with a
 * 15 ohm driver into a 50 ohm line, the series resistor varied from 10 to about 60 ohm) run
 * through the sweep's worker pool with one process per point ({@code --batch 1}) and with batch
 * sizes {@link #SIZES}, each with one and two workers. Reports points per second, the speed-up
 * over {@code --batch 1} at the same worker count, and whether every configuration gave the
 * same records (deck paths taken relative to their output folder). A warm-up runs first, untimed;
 * each configuration counts its fastest of three rounds, taken in turn with the others.
 */
public final class BatchBenchmark {
    /** Points in the sweep. */
    public static final int POINTS = 200;
    /** The batch sizes measured. */
    public static final List<Integer> SIZES = List.of(1, 4, 8, 16, 32);
    /** The worker counts measured. */
    public static final List<Integer> JOBS = List.of(1, 2);
    /** Rounds per configuration; the fastest counts (the others saw a busier machine). */
    private static final int ROUNDS = 3;

    private BatchBenchmark() {
    }

    /**
     * Runs the benchmark.
     *
     * @param workDir a scratch folder (net, sweep and outputs go below it)
     * @param ngspice the ngspice binary
     * @return the report: one line per configuration and a conclusion line
     */
    public static String run(Path workDir, Path ngspice) {
        try {
            Files.createDirectories(workDir);
            Path netFile = workDir.resolve("p2p-bench.yaml");
            Files.writeString(netFile, NET, StandardCharsets.UTF_8);
            Path sweepFile = workDir.resolve("sweep.yaml");
            Files.writeString(sweepFile, sweepText(), StandardCharsets.UTF_8);
            BuiltinModels catalog = new BuiltinModels();
            SweepFile sweep = new SweepFileLoader().load(sweepFile);
            Net net = new NetFileLoader(catalog).load(netFile);
            SweepPlanner.Plan plan = new SweepPlanner().plan(sweep, net, new PointParser(catalog));
            NgspiceEngine engine = NgspiceEngine.at(ngspice);
            DeckWriter decks = new DeckWriter();
            StringBuilder report = new StringBuilder("batch: " + plan.points().size() + "-point sweep, points per second"
                    + " (speed-up over --batch 1 at the same --jobs)\n");
            // Warm-up, untimed: class loading and the JIT would otherwise count against the first configuration.
            PointRunner warm = new PointRunner(new Elaborator(), decks, Optional.of(engine), workDir.resolve("out-warm-up"), Duration.ofSeconds(60));
            List<BatchRunner.Task> warmTasks = new ArrayList<>();
            for (PointRunner.PointSpec p : plan.points().subList(0, Math.min(40, plan.points().size()))) {
                warmTasks.add(new BatchRunner.Task(net, p, PointKey.of(p.corner(), p.swept())));
            }
            new BatchRunner(warm, 1, 1).run(warmTasks, (task, r) -> { }, quiet(warmTasks));
            new BatchRunner(warm, 1, 8).run(warmTasks, (task, r) -> { }, quiet(warmTasks));
            Map<String, String> reference = null;
            boolean identical = true;
            double[][] best = new double[JOBS.size()][SIZES.size()];
            for (double[] row : best) {
                java.util.Arrays.fill(row, Double.MAX_VALUE);
            }
            // Rounds go over every configuration in turn, so a busy spell of the machine hits them alike.
            for (int round = 0; round < ROUNDS; round++) {
                for (int j = 0; j < JOBS.size(); j++) {
                    for (int b = 0; b < SIZES.size(); b++) {
                        Path out = workDir.resolve("out-j" + JOBS.get(j) + "-b" + SIZES.get(b));
                        PointRunner runner = new PointRunner(new Elaborator(), decks, Optional.of(engine), out, Duration.ofSeconds(60));
                        List<BatchRunner.Task> tasks = new ArrayList<>();
                        for (PointRunner.PointSpec p : plan.points()) {
                            tasks.add(new BatchRunner.Task(net, p, PointKey.of(p.corner(), p.swept())));
                        }
                        Map<String, String> records = new TreeMap<>();
                        long t0 = System.nanoTime();
                        new BatchRunner(runner, JOBS.get(j), SIZES.get(b))
                                .run(tasks, (task, r) -> records.put(task.pointKey(), normalised(r, out)), quiet(tasks));
                        best[j][b] = Math.min(best[j][b], (System.nanoTime() - t0) / 1e9);
                        if (reference == null) {
                            reference = records;
                        } else if (!reference.equals(records)) {
                            identical = false;
                        }
                    }
                }
            }
            int bestSize = 1;
            double bestRate = 0;
            for (int j = 0; j < JOBS.size(); j++) {
                double single = plan.points().size() / best[j][0];
                for (int b = 0; b < SIZES.size(); b++) {
                    double rate = plan.points().size() / best[j][b];
                    if (j == 0 && rate > bestRate) {
                        bestRate = rate;
                        bestSize = SIZES.get(b);
                    }
                    report.append(String.format(Locale.ROOT, "  --jobs %d --batch %2d: %7.1f points/s (%.2f s), speed-up %.2f%n",
                            JOBS.get(j), SIZES.get(b), rate, best[j][b], rate / single));
                }
            }
            report.append(String.format(Locale.ROOT, "  fastest with one worker: --batch %d; records identical in every configuration: %s",
                    bestSize, identical ? "yes" : "NO"));
            return report.toString();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        }
    }

    private static Progress quiet(List<BatchRunner.Task> tasks) {
        return new Progress(new PrintWriter(new StringWriter()), tasks.size(), false, true, Duration.ofHours(1), System::nanoTime);
    }

    private static String normalised(ResultRecord r, Path out) {
        return ResultJson.line(r).replace(out.toString(), "OUT");
    }

    /** The sweep: the series resistor from 10 ohm in steps of 0.25 ohm. */
    private static String sweepText() {
        StringBuilder values = new StringBuilder();
        for (int i = 0; i < POINTS; i++) {
            values.append(i == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.2f", 10 + 0.25 * i));
        }
        return "format: ringsweep/sweep-1\n"
                + "nets: [p2p-bench.yaml]\n"
                + "vary:\n"
                + "  - { target: R1/value, values: [" + values + "] }\n";
    }

    /** A point-to-point net: 15 ohm driver, series resistor, 1 ns of 50 ohm line, a 2 pF receiver. */
    private static final String NET = "format: ringsweep/net-1\n"
            + "net: P2P_BENCH\n"
            + "rails: { VCC: 3.3 }\n"
            + "drivers:\n  - { pin: U1.1, model: ramp, v_high: VCC, rise: 0.5ns, r_out: 15 }\n"
            + "receivers:\n  - { pin: U2.1, model: cmos, c_in: 2pF, vih: 2.0, vil: 0.8 }\n"
            + "segments:\n  - { from: J1, to: U2.1, z0: 50, delay: 1ns }\n"
            + "parts:\n  - { ref: R1, kind: resistor, value: 22, between: [U1.1, J1] }\n";
}
