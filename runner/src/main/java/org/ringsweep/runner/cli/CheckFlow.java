package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetValidationException;
import org.ringsweep.api.net.Point;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.ElaborationException;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.check.PointPipeline;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.check.ResultsFile;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.input.PointParser;
import org.ringsweep.runner.plugins.PluginFailureException;
import org.ringsweep.runner.plugins.PluginRegistry;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * The shared body of {@code check}, {@code deck} and {@code demo}: load every net (all input
 * errors first, nothing simulated when there is one), plan the points, then write decks or run
 * them one engine run at a time ({@link PointPipeline}: the next deck is written and the last
 * point measured while the engine runs), appending each record to {@code results.jsonl} in order
 * as it finishes.
 */
final class CheckFlow {
    /** What a run gave. */
    record Outcome(int exitCode, List<ResultRecord> records) {
    }

    private final CommonOptions common;
    private final PrintWriter out;
    private final PrintWriter err;

    CheckFlow(CommonOptions common, PrintWriter out, PrintWriter err) {
        this.common = common;
        this.out = out;
        this.err = err;
    }

    /** Runs (simulate = true) or writes decks only, and returns the exit code. */
    int run(List<Path> files, boolean corners, List<String> sets, boolean simulate) {
        return execute(files, corners, sets, simulate).exitCode();
    }

    Outcome execute(List<Path> files, boolean corners, List<String> sets, boolean simulate) {
        Optional<PluginRegistry> plugins = Plugins.loadOrReport(common.plugins, common.quiet, err);
        if (plugins.isEmpty()) {
            return new Outcome(ExitCodes.INPUT, List.of());
        }
        PluginRegistry registry = plugins.get();
        ModelCatalog catalog = registry.catalog();
        NetFileLoader loader = new NetFileLoader(catalog);
        PointParser points = new PointParser(catalog);
        Elaborator elaborator = registry.elaborator();
        Duration timeout = common.timeout();
        Map<Net, List<PointRunner.PointSpec>> plan = new LinkedHashMap<>();
        Map<Net, Map<PointRunner.PointSpec, Elaboration>> elaborated = new java.util.IdentityHashMap<>();
        Map<Net, Map<PointRunner.PointSpec, PluginFailureException>> failed = new java.util.IdentityHashMap<>();
        List<String> problems = new ArrayList<>();
        try {
            files = NetFiles.expand(files); // a folder (e.g. from import) stands for its *.yaml files
        } catch (InputException e) {
            err.println("ringsweep: " + e.getMessage());
            return new Outcome(ExitCodes.INPUT, List.of());
        }
        PointRunner planner = new PointRunner(elaborator, null, Optional.empty(), common.out, timeout);
        // Files load and elaborate in parallel (loader, parser and elaborator are thread-safe), which
        // shortens the wait before the first simulation; nets and problems keep the files' order.
        List<Loaded> loaded = files.parallelStream().map(file -> load(file, loader, points, planner, sets, corners)).toList();
        for (Loaded l : loaded) {
            if (l.problem() != null) {
                problems.add(l.problem());
                continue;
            }
            elaborated.put(l.net(), l.elaborated());
            failed.put(l.net(), l.failed());
            plan.put(l.net(), l.specs());
        }
        if (!problems.isEmpty()) {
            problems.forEach(p -> err.println("ringsweep: " + p));
            return new Outcome(ExitCodes.INPUT, List.of());
        }
        DeckWriter decks;
        try {
            decks = common.deckWriter();
        } catch (RuntimeException e) {
            err.println("ringsweep: --templates " + common.templates + ": " + e.getMessage());
            return new Outcome(ExitCodes.INPUT, List.of());
        }
        Optional<SimulationEngine> engine = Optional.empty();
        if (simulate) {
            CommonOptions.EngineSelection selection = common.selectEngine(err);
            if (selection.engine().isEmpty()) {
                return new Outcome(selection.exitCode(), List.of());
            }
            engine = selection.engine();
        }
        PointRunner runner = new PointRunner(elaborator, decks, engine, common.out, timeout, registry.checks());
        if (!simulate) {
            int code = ExitCodes.OK;
            for (Map.Entry<Net, List<PointRunner.PointSpec>> e : plan.entrySet()) {
                for (PointRunner.PointSpec s : e.getValue()) {
                    PluginFailureException failure = failed.get(e.getKey()).get(s);
                    if (failure != null) {
                        err.println("ringsweep: " + runner.pluginErrorRecord(e.getKey(), s, failure).error());
                        code = ExitCodes.SIMULATION;
                        continue;
                    }
                    out.println(runner.writeDeck(e.getKey(), s, elaborated.get(e.getKey()).get(s)).deck());
                }
            }
            return new Outcome(code, List.of());
        }
        List<ResultRecord> records = new ArrayList<>();
        List<PointPipeline.Item> items = new ArrayList<>();
        for (Map.Entry<Net, List<PointRunner.PointSpec>> e : plan.entrySet()) {
            for (PointRunner.PointSpec s : e.getValue()) {
                PluginFailureException failure = failed.get(e.getKey()).get(s);
                items.add(failure != null ? PointPipeline.Item.done(e.getKey(), s, runner.pluginErrorRecord(e.getKey(), s, failure))
                        : PointPipeline.Item.of(e.getKey(), s, elaborated.get(e.getKey()).get(s)));
            }
        }
        try (ResultsFile results = ResultsFile.create(common.out)) {
            // One engine run at a time; decks are written and results measured while it runs.
            // A model or engine failure of a point becomes its error record and the run goes on.
            new PointPipeline(runner).run(items, r -> {
                results.append(r);
                records.add(r);
                if (common.json) {
                    out.println(ResultJson.line(r));
                    out.flush();
                }
            });
        }
        if (!common.noReport) {
            ReportStep.run(err, common.quiet, () -> org.ringsweep.runner.report.Reports.afterCheck(common.out, records, sets));
        }
        if (!common.json) {
            ResultTable.print(records, out, common.quiet);
            if (records.stream().map(ResultRecord::net).distinct().count() > 1) {
                BatchSummary.print(records, out);
            }
            if (!common.quiet) {
                out.println();
                out.println(Caution.TEXT);
            }
        }
        return new Outcome(exitCode(records), records);
    }

    /** One net file planned: its points and their elaborations, or the input problem that stops the run. */
    private record Loaded(Net net, List<PointRunner.PointSpec> specs, Map<PointRunner.PointSpec, Elaboration> elaborated,
                          Map<PointRunner.PointSpec, PluginFailureException> failed, String problem) {
    }

    /** Loads a net file and elaborates each of its points (every input check before anything runs). */
    private static Loaded load(Path file, NetFileLoader loader, PointParser points, PointRunner planner, List<String> sets,
                               boolean corners) {
        try {
            Net net = loader.load(file);
            Point overrides = points.parse(net, sets.stream().map(PointParser::fromSetOption).toList());
            List<PointRunner.PointSpec> specs = new ArrayList<>();
            specs.add(new PointRunner.PointSpec("typ", overrides, Map.of(), 1));
            if (corners) {
                net.corners().forEach((name, corner) -> specs.add(new PointRunner.PointSpec(name, corner.then(overrides), Map.of(), 1)));
            }
            Map<PointRunner.PointSpec, Elaboration> byPoint = new java.util.HashMap<>();
            // Points whose plugin model threw while elaborating: error records, not input errors.
            Map<PointRunner.PointSpec, PluginFailureException> failures = new java.util.HashMap<>();
            for (PointRunner.PointSpec s : specs) {
                try {
                    byPoint.put(s, planner.elaborate(net, s));
                } catch (PluginFailureException e) {
                    failures.put(s, e);
                }
            }
            return new Loaded(net, specs, byPoint, failures, null);
        } catch (InputException | ElaborationException e) {
            return new Loaded(null, null, null, null, e.getMessage());
        } catch (NetValidationException e) {
            return new Loaded(null, null, null, null, file + ": " + e.getMessage());
        }
    }

    /** 3 when any point is an error (results are incomplete), else 1 when any fails, else 0. */
    static int exitCode(List<ResultRecord> records) {
        Verdict worst = Verdict.PASS;
        for (ResultRecord r : records) {
            worst = worst.worst(r.verdict());
        }
        return switch (worst) {
            case PASS -> ExitCodes.OK;
            case FAIL -> ExitCodes.VIOLATION;
            case ERROR -> ExitCodes.SIMULATION;
        };
    }
}
