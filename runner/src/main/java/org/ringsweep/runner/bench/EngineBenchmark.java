package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.engine.builtin.BuiltinEngine;
import org.ringsweep.runner.input.NetFileLoader;

/**
 * Per-point time of the built-in engine against ngspice on the demo board's nets (those of
 * {@code nets/} and the IBIS-driven ones of {@code ibis/}), and a
 * sweep-like loop of {@value #SWEEP_POINTS} points on one net with the built-in engine. Goal: the
 * built-in engine at least 100 × faster per point.
 *
 * <p>ngspice's time per point covers what a point costs with it: writing the deck, the process,
 * reading the raw file ({@link NgspiceEngine#run}). The built-in engine's covers
 * {@link BuiltinEngine#solve}; the sweep loop adds applying the point and elaborating the net,
 * as a sweep does. After a warm-up, on one thread, the two are measured in
 * {@value #ROUNDS} interleaved rounds, each one ngspice run and a {@value #BUILTIN_BATCH_SECONDS} s
 * batch of built-in runs (its mean per run), and each engine's figure is the median over the
 * rounds: on a shared machine whose speed changes from second to second, both engines then
 * see the same slow and fast spells, and a built-in run of a fraction of a millisecond is not
 * timed alone.
 */
public final class EngineBenchmark {
    /** Points of the sweep-like loop. */
    public static final int SWEEP_POINTS = 10_000;
    /** Interleaved measuring rounds per net (one ngspice run and one built-in batch each). */
    private static final int ROUNDS = 7;
    /** Length of a round's batch of built-in runs (s). */
    private static final double BUILTIN_BATCH_SECONDS = 0.05;
    private static final int BUILTIN_WARM_UP = 100;
    /**
     * The built-in engine's warm-up runs in batches of this length (s) until two batches in a row
     * are no faster than the best before them: a net whose solve takes paths the nets before it did not (the
     * IBIS net's tables) makes the JIT recompile, which on a busy two-core machine took more than
     * 2 s, and its figure would be that of the recompilation, not the steady state of a sweep.
     */
    private static final double BUILTIN_WARM_UP_BATCH_SECONDS = 0.5;
    /** Warm-up batches: at least this many … */
    private static final int BUILTIN_WARM_UP_MIN_BATCHES = 6;
    /** … and at most this many. */
    private static final int BUILTIN_WARM_UP_MAX_BATCHES = 30;
    private static final String SWEEP_NET = "sync-terminated.yaml";
    private static final String SWEEP_PART = "R20";

    private EngineBenchmark() {
    }

    /**
     * Runs the benchmark on the demo board nets found at {@code examples/demo-board/nets} (and
     * {@code examples/demo-board/ibis} beside it) below the current folder or its parent.
     *
     * @param workDir a scratch folder for decks and raw files
     * @param ngspice the ngspice binary
     * @return the report: one line per net and the sweep loop's figures
     * @throws IllegalStateException when the demo nets cannot be found
     */
    public static String run(Path workDir, Path ngspice) {
        Path cwd = Path.of("").toAbsolutePath();
        for (Path base : new Path[] {cwd, cwd.getParent()}) {
            if (base != null && Files.isDirectory(base.resolve("examples/demo-board/nets"))) {
                return run(workDir, ngspice, base.resolve("examples/demo-board/nets"));
            }
        }
        throw new IllegalStateException("demo board nets not found at `examples/demo-board/nets` below `" + cwd
                + "` or its parent; run from the project folder or pass the folder");
    }

    /**
     * Runs the benchmark on the nets of a folder.
     *
     * @param workDir a scratch folder for decks and raw files
     * @param ngspice the ngspice binary
     * @param netsDir the folder of {@code *.yaml} net files (the sweep loop uses {@value #SWEEP_NET} when present);
     *                the nets of an {@code ibis} folder beside it are run too
     * @return the report
     */
    public static String run(Path workDir, Path ngspice, Path netsDir) {
        try {
            Files.createDirectories(workDir);
            NetFileLoader loader = new NetFileLoader(new BuiltinModels());
            Elaborator elaborator = new Elaborator();
            NgspiceEngine ng = NgspiceEngine.at(ngspice);
            BuiltinEngine builtin = new BuiltinEngine();
            List<Path> nets = new ArrayList<>(yamlFiles(netsDir));
            Path ibis = netsDir.resolveSibling("ibis");
            if (Files.isDirectory(ibis)) {
                nets.addAll(yamlFiles(ibis));
            }
            StringBuilder out = new StringBuilder("engine benchmark (per point, median of " + ROUNDS
                    + " interleaved rounds; ngspice = deck write + process + raw read)\n");
            double sumNg = 0;
            double sumBuiltin = 0;
            double slowest = Double.POSITIVE_INFINITY;
            int index = 0;
            for (Path file : nets) {
                Circuit c = elaborator.elaborate(loader.load(file), "typ").circuit();
                warmUp(() -> builtin.solve(c, Duration.ofMinutes(1))); // as the many points of a sweep give
                Path dir = workDir.resolve("net" + index++);
                double[] medians = interleavedMedians(() -> require(ng.run(job(c, dir)), file),
                        () -> require(builtin.solve(c, Duration.ofMinutes(1)), file));
                double tn = medians[0];
                double tb = medians[1];
                sumNg += tn;
                sumBuiltin += tb;
                slowest = Math.min(slowest, tn / tb);
                out.append(String.format(Locale.ROOT, "  %-24s ngspice %8.2f ms  builtin %7.3f ms  ratio %6.0f x%n",
                        file.getFileName(), tn * 1e3, tb * 1e3, tn / tb));
            }
            out.append(String.format(Locale.ROOT, "  all %d nets: ngspice %.2f ms, builtin %.3f ms per point: %.0f x faster,"
                            + " slowest net %.0f x (goal >= 100 x for each)%n",
                    nets.size(), sumNg / nets.size() * 1e3, sumBuiltin / nets.size() * 1e3, sumNg / sumBuiltin, slowest));
            Path sweepNet = netsDir.resolve(SWEEP_NET);
            if (Files.isRegularFile(sweepNet)) {
                out.append(sweep(loader.load(sweepNet), elaborator, builtin));
            }
            return out.toString();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The sweep-like loop: the series resistor from 10 to 100 Ω in {@value #SWEEP_POINTS} steps, each point elaborated and solved. */
    private static String sweep(Net net, Elaborator elaborator, BuiltinEngine builtin) {
        for (int i = 0; i < 200; i++) {
            builtin.solve(elaborator.elaborate(at(net, 10 + i), "warm").circuit(), Duration.ofMinutes(1)); // JIT warm-up
        }
        long t0 = System.nanoTime();
        double solveNanos = 0;
        for (int i = 0; i < SWEEP_POINTS; i++) {
            double ohms = 10 + 90.0 * i / (SWEEP_POINTS - 1);
            Circuit c = elaborator.elaborate(at(net, ohms), "p" + i).circuit();
            long s0 = System.nanoTime();
            SimulationOutcome o = builtin.solve(c, Duration.ofMinutes(1));
            solveNanos += System.nanoTime() - s0;
            if (!o.succeeded()) {
                throw new IllegalStateException("built-in engine failed at " + SWEEP_PART + " = " + ohms + " ohm: " + o);
            }
        }
        double total = (System.nanoTime() - t0) / 1e9;
        return String.format(Locale.ROOT, "  sweep loop, %s/%s 10..100 ohm, %d points: %.2f s, %.3f ms per point"
                        + " (%.3f ms of it solving, the rest applying the point and elaborating)%n",
                SWEEP_PART, "value", SWEEP_POINTS, total, total / SWEEP_POINTS * 1e3, solveNanos / SWEEP_POINTS / 1e6);
    }

    private static Net at(Net net, double ohms) {
        return net.with(Point.of(Map.of(new ValuePath(SWEEP_PART, "value"), new Value.Number(ohms, Dimension.RESISTANCE))));
    }

    private static SimulationJob job(Circuit c, Path dir) {
        String deck = new DeckWriter().render(c, DeckOptions.of("bench.raw"));
        return new SimulationJob(deck, dir, "bench.cir", "bench.raw", c.analysis().stop(), Duration.ofMinutes(2), c.probes());
    }

    private static List<Path> yamlFiles(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
        }
    }

    private static void require(SimulationOutcome o, Path file) {
        if (o instanceof SimulationOutcome.Failure f) {
            throw new IllegalStateException(file.getFileName() + ": " + f.kind() + " " + f.message());
        }
    }

    /**
     * JIT warm-up: at least {@value #BUILTIN_WARM_UP} runs, then batches of
     * {@value #BUILTIN_WARM_UP_BATCH_SECONDS} s until two in a row are not 3 % faster per run than
     * the best before them (after at least {@value #BUILTIN_WARM_UP_MIN_BATCHES}, at most {@value #BUILTIN_WARM_UP_MAX_BATCHES}).
     */
    private static void warmUp(Runnable r) {
        for (int i = 0; i < BUILTIN_WARM_UP; i++) {
            r.run();
        }
        double best = Double.POSITIVE_INFINITY;
        int flat = 0;
        for (int batch = 0; batch < BUILTIN_WARM_UP_MAX_BATCHES; batch++) {
            long t0 = System.nanoTime();
            long end = t0 + (long) (BUILTIN_WARM_UP_BATCH_SECONDS * 1e9);
            int n = 0;
            while (System.nanoTime() < end) {
                r.run();
                n++;
            }
            double perRun = (System.nanoTime() - t0) / (double) n;
            flat = perRun > 0.97 * best ? flat + 1 : 0;
            if (batch + 1 >= BUILTIN_WARM_UP_MIN_BATCHES && flat >= 2) {
                return;
            }
            best = Math.min(best, perRun);
        }
    }

    /**
     * Runs {@code slow} once to warm up, then {@value #ROUNDS} rounds of one timed {@code slow}
     * run and a {@value #BUILTIN_BATCH_SECONDS} s batch of {@code fast} runs.
     *
     * @return the median wall-clock time per run (s) of {@code slow} and of {@code fast}
     */
    private static double[] interleavedMedians(Runnable slow, Runnable fast) {
        slow.run();
        double[] slowTimes = new double[ROUNDS];
        double[] fastTimes = new double[ROUNDS];
        for (int i = 0; i < ROUNDS; i++) {
            long t0 = System.nanoTime();
            slow.run();
            slowTimes[i] = (System.nanoTime() - t0) / 1e9;
            long f0 = System.nanoTime();
            long end = f0 + (long) (BUILTIN_BATCH_SECONDS * 1e9);
            int n = 0;
            do {
                fast.run();
                n++;
            } while (System.nanoTime() < end);
            fastTimes[i] = (System.nanoTime() - f0) / 1e9 / n;
        }
        Arrays.sort(slowTimes);
        Arrays.sort(fastTimes);
        return new double[] {slowTimes[ROUNDS / 2], fastTimes[ROUNDS / 2]};
    }
}
