package org.ringsweep.runner.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Iterator;
import java.util.concurrent.Callable;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetValidationException;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.ElaborationException;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.runner.batch.BatchRunner;
import org.ringsweep.runner.batch.Verification;
import org.ringsweep.runner.batch.Progress;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.input.PointParser;
import org.ringsweep.runner.plugins.PluginFailureException;
import org.ringsweep.runner.plugins.PluginRegistry;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.store.FinishedPoints;
import org.ringsweep.runner.store.PointKey;
import org.ringsweep.runner.store.ResultStore;
import org.ringsweep.runner.store.StoredRow;
import org.ringsweep.runner.sweep.SweepFile;
import org.ringsweep.runner.sweep.SweepFileLoader;
import org.ringsweep.runner.sweep.SweepPlanner;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code ringsweep sweep SWEEP.yaml [--jobs N] [--batch N] [--resume]}: run every point of a sweep into the
 * results store under {@code --out}, each committed as it finishes.
 */
@Command(name = "sweep", mixinStandardHelpOptions = true,
        description = {"Run a sweep (ringsweep/sweep-1) over its nets into the results store OUT/results.sqlite.",
                "Each finished point is committed at once; --resume re-runs only the unfinished points."})
public final class SweepCommand implements Callable<Integer> {
    /**
     * The default of {@code --batch}: 16 points per ngspice process, chosen by measurement with
     * {@code BatchBenchmark} ({@code ringsweep bench}): a 200-point sweep of a point-to-point net
     * (15 ohm driver, series resistor 10–60 ohm, 1 ns of 50 ohm line), on a 2-core machine shared
     * with other work (load average 3–13, so the figures scatter by some 30 %), best of 2–3 rounds,
     * points per second for --batch 1 / 4 / 8 / 16 / 32:
     * <ul>
     *   <li>--jobs 1: 20.5 / 30.0 / 56.2 / 46.3 / 66.8 and, in another run, 28.3 / 24.9 / 34.1 / 47.6 / 34.8;</li>
     *   <li>--jobs 2: 28.6 / 59.8 / 64.8 / 70.4 / 70.1 and 22.3 / 32.3 / 57.3 / 68.3 / 70.0.</li>
     * </ul>
     * Batches of 16 and 32 are the fastest (2.2–3.3 × one process per point); 16 is within the
     * scatter of 32 in every run and halves what a batch that must fall back to one run per point
     * costs, so it is the default. Records are the same whatever the batch size.
     */
    public static final int DEFAULT_BATCH = 16;

    @Spec
    CommandSpec spec;

    /** The engine to use instead of {@code --engine}'s choice; null outside orchestration tests. */
    private final SimulationEngine engineOverride;

    /** The command as the CLI runs it: the engine is {@code --engine}'s choice. */
    public SweepCommand() {
        this(null);
    }

    /** @param engineOverride the engine every point runs on, whatever {@code --engine} says (tests of the orchestration) */
    SweepCommand(SimulationEngine engineOverride) {
        this.engineOverride = engineOverride;
    }

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "SWEEP.yaml", description = "The sweep file.")
    Path sweepFile;

    @Option(names = "--jobs", paramLabel = "N", description = "Parallel simulations (default: the number of cores).")
    Integer jobs;

    /**
     * Points per ngspice process. Default {@value #DEFAULT_BATCH}, measured with
     * {@code BatchBenchmark} (see {@link #DEFAULT_BATCH}).
     */
    @Option(names = "--batch", paramLabel = "N", defaultValue = "" + DEFAULT_BATCH,
            description = "Points per ngspice process (default: ${DEFAULT-VALUE}); 1 runs one process per point."
                    + " Records are the same whatever N is.")
    int batchSize;

    @Option(names = "--resume", description = "Continue the sweep stored under --out: run only the points not yet finished.")
    boolean resume;

    @Option(names = "--verify", paramLabel = "PERCENT",
            description = "With the built-in engine: re-simulate this share of the points with ngspice (e.g. 5%%), report the largest"
                    + " difference per metric and flag points beyond tolerance in their records.")
    String verify;

    @Override
    public Integer call() throws InterruptedException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Optional<PluginRegistry> loaded = Plugins.loadOrReport(common.plugins, common.quiet, err);
        if (loaded.isEmpty()) {
            return ExitCodes.INPUT;
        }
        PluginRegistry registry = loaded.get();
        ModelCatalog catalog = registry.catalog();
        PointParser parser = new PointParser(catalog);
        Elaborator elaborator = registry.elaborator();
        int workers = jobs == null ? Runtime.getRuntime().availableProcessors() : jobs;
        if (workers < 1) {
            err.println("ringsweep: sweep: --jobs: expected at least 1, found " + workers);
            return ExitCodes.INPUT;
        }
        if (batchSize < 1) {
            err.println("ringsweep: sweep: --batch: expected at least 1, found " + batchSize);
            return ExitCodes.INPUT;
        }
        Duration timeout = common.timeout();
        List<SweepPlanner.Plan> plans = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        try {
            SweepFile sweep = new SweepFileLoader().load(sweepFile);
            NetFileLoader loader = new NetFileLoader(catalog);
            PointRunner checker = new PointRunner(elaborator, null, Optional.empty(), common.out, timeout);
            SweepPlanner planner = new SweepPlanner();
            for (Path netFile : sweep.nets()) {
                Net net = loader.load(netFile);
                SweepPlanner.Plan plan = planner.plan(sweep, net, parser);
                if (!plan.points().isEmpty()) {
                    try {
                        checker.elaborate(net, plan.points().get(0)); // the net's models accept its values
                    } catch (PluginFailureException e) {
                        warnings.add(e.getMessage() + "; its points will be error records");
                    }
                }
                plans.add(plan);
                warnings.addAll(plan.warnings());
            }
        } catch (InputException | ElaborationException e) {
            err.println("ringsweep: " + e.getMessage());
            return ExitCodes.INPUT;
        } catch (NetValidationException e) {
            err.println("ringsweep: " + e.location() + ": " + e.getMessage());
            return ExitCodes.INPUT;
        }
        warnings.forEach(w -> err.println("ringsweep: warning: " + w));
        SimulationEngine engine = engineOverride;
        if (engine == null) {
            CommonOptions.EngineSelection selection = common.selectEngine(err);
            if (selection.engine().isEmpty()) {
                return selection.exitCode();
            }
            engine = selection.engine().get();
        }
        boolean existed = Files.exists(common.out.resolve(ResultStore.FILE_NAME));
        try (ResultStore store = ResultStore.open(common.out)) {
            if (existed && !resume && !store.isEmpty()) {
                err.println("ringsweep: sweep: " + store.file() + " already holds results; give --resume to continue"
                        + " that sweep, or another --out");
                return ExitCodes.INPUT;
            }
            // the plan is walked twice, once to count what is left and once to run it; neither
            // walk keeps a point: only the finished-point hashes of --resume (8 bytes a point)
            Map<SweepPlanner.Plan, FinishedPoints> finished = new java.util.IdentityHashMap<>();
            long todo = 0;
            long total = 0;
            if (!common.quiet) {
                out.println("Plan: " + plans.size() + " net(s)");
            }
            for (SweepPlanner.Plan plan : plans) {
                long left = plan.points().size();
                if (resume) {
                    FinishedPoints done = store.finished(plan.net().sourceHash());
                    finished.put(plan, done);
                    left = done.size() == 0 ? left : plan.points().stream().filter(p -> !done.contains(key(p))).count();
                }
                todo += left;
                total += plan.points().size();
                if (!common.quiet) {
                    out.printf(Locale.ROOT, "  %-24s %6d point(s)%s%n", plan.net().name(), plan.points().size(),
                            resume ? " (" + left + " to run)" : "");
                }
            }
            if (!common.quiet) {
                out.printf(Locale.ROOT, "  total %d point(s), %d to run with %d job(s)%s%n", total, todo, workers,
                        total > todo ? ", " + (total - todo) + " already finished" : "");
                out.flush();
            }
            DeckWriter decks = common.deckWriter();
            PointRunner runner = new PointRunner(elaborator, decks, Optional.of(engine), common.out, timeout, registry.checks());
            BatchRunner batch = new BatchRunner(runner, workers, batchSize);
            Thread hook = new Thread(batch::stop, "ringsweep-stop");
            Runtime.getRuntime().addShutdownHook(hook);
            Progress progress = new Progress(err, todo, System.console() != null, common.quiet, Duration.ofSeconds(10), System::nanoTime);
            try {
                Iterator<BatchRunner.Task> tasks = tasks(plans, (plan, key) -> {
                    FinishedPoints done = finished.get(plan);
                    return done == null || done.size() == 0 || !done.contains(key);
                });
                batch.run(tasks, todo, (task, record) -> store.put(record, task.pointKey()), progress);
            } finally {
                try {
                    Runtime.getRuntime().removeShutdownHook(hook);
                } catch (IllegalStateException shuttingDown) {
                    // the hook is running: Ctrl-C
                }
            }
            finished.clear();
            if (verify != null && !batch.stopped()) {
                int code = verify(plans, store, engine, elaborator, decks, timeout, registry, out, err);
                if (code != ExitCodes.OK) {
                    return code;
                }
            }
            writeJsonLines(store);
            if (!common.noReport) {
                ReportStep.run(err, common.quiet, () -> org.ringsweep.runner.report.Reports.afterSweep(common.out, store));
            }
            Map<String, long[]> counts = counts(store, plans);
            if (!common.quiet) {
                summary(store, plans, counts, out);
            }
            return exitCode(counts);
        }
    }

    private static String key(PointRunner.PointSpec p) {
        return PointKey.of(p.corner(), p.swept());
    }

    /**
     * The plans' points as tasks, built one at a time as the iterator is read (nets in order,
     * each net's points in plan order), leaving out those {@code keep} refuses.
     */
    static Iterator<BatchRunner.Task> tasks(List<SweepPlanner.Plan> plans, java.util.function.BiPredicate<SweepPlanner.Plan, String> keep) {
        // a hand-made iterator: Stream.flatMap(...).iterator() would buffer a whole plan's points
        return new Iterator<>() {
            private int plan;
            private int point;
            private BatchRunner.Task next = advance();

            private BatchRunner.Task advance() {
                for (; plan < plans.size(); plan++, point = 0) {
                    SweepPlanner.Plan p = plans.get(plan);
                    while (point < p.points().size()) {
                        PointRunner.PointSpec spec = p.points().get(point++);
                        String key = key(spec);
                        if (keep.test(p, key)) {
                            return new BatchRunner.Task(p.net(), spec, key);
                        }
                    }
                }
                return null;
            }

            @Override
            public boolean hasNext() {
                return next != null;
            }

            @Override
            public BatchRunner.Task next() {
                if (next == null) {
                    throw new java.util.NoSuchElementException();
                }
                BatchRunner.Task t = next;
                next = advance();
                return t;
            }
        };
    }

    /** {@code --verify}: the chosen share of the points again on ngspice, compared metric by metric. */
    private int verify(List<SweepPlanner.Plan> plans, ResultStore store, SimulationEngine engine, Elaborator elaborator,
                       DeckWriter decks, Duration timeout, PluginRegistry registry, PrintWriter out, PrintWriter err) {
        double share;
        try {
            share = org.ringsweep.api.quantity.Quantities.parse(verify, org.ringsweep.api.quantity.Dimension.DIMENSIONLESS);
        } catch (IllegalArgumentException e) {
            err.println("ringsweep: sweep: --verify: expected a share such as 5%, found `" + verify + "`");
            return ExitCodes.INPUT;
        }
        if (!(share > 0 && share <= 1)) {
            err.println("ringsweep: sweep: --verify: expected a share above 0 % and at most 100 %, found `" + verify + "`");
            return ExitCodes.INPUT;
        }
        if (engine instanceof NgspiceEngine) {
            err.println("ringsweep: warning: --verify compares the built-in engine with ngspice; this sweep ran on ngspice already");
            return ExitCodes.OK;
        }
        Optional<NgspiceEngine> ngspice = NgspiceEngine.locate(System.getenv());
        if (ngspice.isEmpty()) {
            err.println("ringsweep: sweep: --verify needs ngspice: " + NgspiceEngine.whyNotFound(System.getenv()));
            return ExitCodes.SIMULATION;
        }
        PointRunner checker = new PointRunner(elaborator, null, Optional.empty(), common.out, timeout);
        PointRunner reference = new PointRunner(elaborator, decks, Optional.of(ngspice.get()), common.out.resolve("verify"), timeout,
                registry.checks());
        // the chosen points follow from their keys (a stable hash), taken one at a time from the plan;
        // each is compared and, when flagged, its stored record rewritten at once: nothing is gathered
        Iterator<BatchRunner.Task> chosen = tasks(plans, (plan, key) -> Verification.chosen(plan.net().sourceHash(), key, share));
        Verification.Report report = Verification.run(chosen,
                t -> store.row(t.net().sourceHash(), t.pointKey())
                        .map(row -> org.ringsweep.runner.report.Reports.parseRecord(row.recordJson(), store.file().toString())),
                reference, t -> checker.elaborate(t.net(), t.spec()).swing(),
                (t, r, why) -> {
                    List<String> warnings = new ArrayList<>(r.warnings());
                    warnings.add("verification against ngspice differs beyond tolerance: " + why);
                    store.put(new org.ringsweep.runner.results.ResultRecord(r.net(), r.corner(), r.point(), r.engineName(),
                            r.engineVersion(), r.verdict(), r.receivers(), r.deck(), r.error(), r.source(), r.sourceHash(),
                            r.defaulted(), warnings), t.pointKey());
                });
        out.printf(Locale.ROOT, "Verification against ngspice: %d point(s) re-simulated (%s of the sweep)%n", report.compared(), verify);
        report.worst().values().forEach(w -> out.printf(Locale.ROOT, "  largest difference %-10s %.4g%s%n", w.metric(), w.difference(),
                w.beyondTolerance() ? "  BEYOND TOLERANCE <<" : ""));
        for (Map.Entry<String, String> f : report.flagged().entrySet()) {
            out.println("  FLAGGED " + f.getKey() + ": " + f.getValue());
        }
        if (report.flaggedCount() > report.flagged().size()) {
            out.println("  ... " + (report.flaggedCount() - report.flagged().size()) + " more flagged point(s): their records say so");
        }
        return ExitCodes.OK;
    }

    /** results.jsonl beside the store: every record, for tools that read JSON Lines; streamed row by row. */
    private void writeJsonLines(ResultStore store) {
        Path file = common.out.resolve("results.jsonl");
        try (java.io.Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            store.forEachRecordLine(line -> {
                try {
                    w.write(line);
                    w.write('\n');
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            });
        } catch (IOException | UncheckedIOException e) {
            String why = e instanceof UncheckedIOException u ? u.getCause().getMessage() : e.getMessage();
            throw new UncheckedIOException("cannot write " + file + ": " + why, e instanceof IOException io ? io : ((UncheckedIOException) e).getCause());
        }
    }

    /** Net name → pass, fail, error counts over the plans' net files, nets in the order of their first row (SQL counts). */
    private static Map<String, long[]> counts(ResultStore store, List<SweepPlanner.Plan> plans) {
        Map<String, long[]> counts = new LinkedHashMap<>();
        plans.stream().map(p -> p.net().sourceHash()).distinct().forEach(hash -> store.counts(hash).forEach((net, c) -> {
            long[] sum = counts.computeIfAbsent(net, k -> new long[3]);
            sum[0] += c.pass();
            sum[1] += c.fail();
            sum[2] += c.error();
        }));
        return counts;
    }

    private static int exitCode(Map<String, long[]> counts) {
        Verdict worst = Verdict.PASS;
        for (long[] c : counts.values()) {
            worst = worst.worst(c[2] > 0 ? Verdict.ERROR : c[1] > 0 ? Verdict.FAIL : Verdict.PASS);
        }
        return switch (worst) {
            case PASS -> ExitCodes.OK;
            case FAIL -> ExitCodes.VIOLATION;
            case ERROR -> ExitCodes.SIMULATION;
        };
    }

    /** Rows of the per-point table per net; the rest is in the store ({@code ringsweep results OUT_DIR --csv}). */
    static final int SUMMARY_ROWS = 60;

    /**
     * Per net: pass/fail/error counts, the best point by the default objective, and the first
     * {@value #SUMMARY_ROWS} points by point key with their key metrics. Counts come from SQL, the
     * best point from one cursor pass, the table from an SQL {@code ORDER BY ... LIMIT}: bounded
     * memory whatever the sweep's size.
     */
    private static void summary(ResultStore store, List<SweepPlanner.Plan> plans, Map<String, long[]> counts, PrintWriter out) {
        Map<String, StoredRow> best = store.bestPerNet();
        out.println();
        for (Map.Entry<String, long[]> e : counts.entrySet()) {
            long[] c = e.getValue();
            long all = c[0] + c[1] + c[2];
            out.printf(Locale.ROOT, "%s: %d point(s), %d pass, %d fail, %d error%n", e.getKey(), all, c[0], c[1], c[2]);
            StoredRow b = best.get(e.getKey());
            out.println("  best (" + org.ringsweep.runner.tune.Objective.DESCRIPTION + "): "
                    + (b == null ? "none (every point is an error)" : b.pointKey() + " -> " + b.verdict().word()));
            out.printf(Locale.ROOT, "  %-48s %-7s %10s %10s %12s%n", "POINT", "VERDICT", "EXCURSION", "RINGBACK", "SETTLE");
            List<StoredRow> rows = new ArrayList<>();
            plans.stream().map(p -> p.net().sourceHash()).distinct()
                    .forEach(hash -> rows.addAll(store.firstByPointKey(e.getKey(), hash, SUMMARY_ROWS)));
            rows.sort(java.util.Comparator.comparing(StoredRow::pointKey));
            for (StoredRow r : rows.subList(0, (int) Math.min(rows.size(), SUMMARY_ROWS))) {
                out.printf(Locale.ROOT, "  %-48s %-7s %10s %10s %12s%s%n", r.pointKey(), r.verdict() == Verdict.PASS ? "pass" : r.verdict().word().toUpperCase(Locale.ROOT),
                        ResultTable.volts(r.worstExcursionV()), ResultTable.volts(r.worstRingbackMarginV()),
                        ResultTable.seconds(r.longestSettleS()), b != null && r.id() == b.id() ? "  << best" : "");
            }
            if (all > SUMMARY_ROWS) {
                out.println("  ... (" + (all - SUMMARY_ROWS) + " more: ringsweep results OUT_DIR --csv)");
            }
        }
        out.println();
        out.println(Caution.TEXT);
    }
}
