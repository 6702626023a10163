package org.ringsweep.runner.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Quantities;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.ElaborationException;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.check.ResultsFile;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.input.PointParser;
import org.ringsweep.runner.plugins.PluginRegistry;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.sweep.ESeries;
import org.ringsweep.runner.tune.Objective;
import org.ringsweep.runner.tune.TuneResult;
import org.ringsweep.runner.tune.TuneSearch;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep tune NET.yaml --vary ID/param --series E24 --from A --to B}: recommend the best value. */
@Command(name = "tune", mixinStandardHelpOptions = true,
        description = {"Recommend the preferred value of one parameter (e.g. a series resistor) by the default objective,",
                "simulating only part of the range, then re-check it at every corner and both tolerance ends."})
public final class TuneCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "NET.yaml", description = "The net file.")
    Path netFile;

    @Option(names = "--vary", required = true, paramLabel = "ID/param", description = "The value to tune, e.g. R5/value.")
    String vary;

    @Option(names = "--series", defaultValue = "E24", paramLabel = "E6|E12|E24|E48|E96|E192",
            description = "IEC 60063 series of the candidates (default: ${DEFAULT-VALUE}).")
    String series;

    @Option(names = "--from", required = true, paramLabel = "VALUE", description = "Lowest candidate, e.g. 10 or 4R7.")
    String from;

    @Option(names = "--to", required = true, paramLabel = "VALUE", description = "Highest candidate, e.g. 100.")
    String to;

    @Option(names = "--tolerance", paramLabel = "PERCENT",
            description = "Part tolerance whose ends are re-checked, e.g. 1%% (default: the series' usual tolerance: "
                    + "E6 20%%, E12 10%%, E24 5%%, E48 2%%, E96 1%%, E192 0.5%%).")
    String tolerance;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Optional<PluginRegistry> loaded = Plugins.loadOrReport(common.plugins, common.quiet, err);
        if (loaded.isEmpty()) {
            return ExitCodes.INPUT;
        }
        PluginRegistry registry = loaded.get();
        ModelCatalog catalog = registry.catalog();
        Optional<ESeries.Series> s = ESeries.Series.named(series);
        if (s.isEmpty()) {
            err.println("ringsweep: tune: --series: unknown series `" + series + "`; expected E3, E6, E12, E24, E48, E96 or E192");
            return ExitCodes.INPUT;
        }
        Net net;
        ValuePath target;
        Value.Number low;
        Value.Number high;
        double tol;
        try {
            net = new NetFileLoader(catalog).load(netFile);
            PointParser parser = new PointParser(catalog);
            target = ValuePath.parse(vary);
            parser.parse(net, List.of(new PointParser.Assignment(vary, from, new Location("--from", 0, 0))));
            low = (Value.Number) parser.value(net, target, from, new Location("--from", 0, 0), "--from");
            high = (Value.Number) parser.value(net, target, to, new Location("--to", 0, 0), "--to");
            if (!(low.si() > 0) || low.si() > high.si()) {
                err.println("ringsweep: tune: expected 0 < --from <= --to, found `" + from + "` and `" + to + "`");
                return ExitCodes.INPUT;
            }
            tol = tolerance == null ? customaryTolerance(s.get()) : Quantities.parse(tolerance, org.ringsweep.api.quantity.Dimension.DIMENSIONLESS);
            if (tol < 0 || tol >= 0.5) {
                err.println("ringsweep: tune: --tolerance: expected a fraction such as 1% (0 to 50 %), found `" + tolerance + "`");
                return ExitCodes.INPUT;
            }
        } catch (InputException | ElaborationException e) {
            err.println("ringsweep: " + e.getMessage());
            return ExitCodes.INPUT;
        } catch (IllegalArgumentException | ClassCastException e) {
            err.println("ringsweep: tune: " + e.getMessage());
            return ExitCodes.INPUT;
        }
        List<Double> candidates = ESeries.between(s.get(), low.si(), high.si());
        if (candidates.isEmpty()) {
            err.println("ringsweep: tune: no " + s.get() + " value lies between " + from + " and " + to);
            return ExitCodes.INPUT;
        }
        CommonOptions.EngineSelection selection = common.selectEngine(err);
        if (selection.engine().isEmpty()) {
            return selection.exitCode();
        }
        SimulationEngine engine = selection.engine().get();
        DeckWriter decks = common.deckWriter();
        PointRunner runner = new PointRunner(registry.elaborator(), decks, Optional.of(engine), common.out,
                common.timeout(), registry.checks());
        TuneResult result = new TuneSearch(runner).tune(net, target, low.dimension(), candidates, tol);
        try (ResultsFile results = ResultsFile.create(common.out)) {
            result.evaluated().forEach(e -> results.append(e.record()));
            result.checks().forEach(c -> results.append(c.record()));
        }
        if (!common.noReport) {
            ReportStep.run(err, common.quiet, () -> org.ringsweep.runner.report.Reports.afterTune(common.out, result));
        }
        if (common.json) {
            out.println(json(result, tol));
        } else {
            print(result, tol, s.get(), out);
        }
        boolean anyError = result.evaluated().stream().anyMatch(e -> e.record().verdict() == Verdict.ERROR);
        if (result.recommended().isEmpty()) {
            return anyError ? ExitCodes.SIMULATION : ExitCodes.VIOLATION;
        }
        return result.robust() ? ExitCodes.OK : ExitCodes.VIOLATION;
    }

    /** Usual tolerance paired with each series (impedance-and-standards.md §5; marked there as common practice). */
    static double customaryTolerance(ESeries.Series s) {
        return switch (s) {
            case E3, E6 -> 0.20;
            case E12 -> 0.10;
            case E24 -> 0.05;
            case E48 -> 0.02;
            case E96 -> 0.01;
            case E192 -> 0.005;
        };
    }

    static String json(TuneResult r, double tolerance) {
        ObjectMapper m = new ObjectMapper();
        ObjectNode o = m.createObjectNode();
        o.put("format", "ringsweep/tune-1");
        o.put("net", r.net());
        o.put("target", r.target().toString());
        if (r.recommended().isPresent()) {
            o.put("recommended", r.recommended().getAsDouble());
        } else {
            o.putNull("recommended");
        }
        o.put("objective", Objective.DESCRIPTION);
        o.put("tolerance", tolerance);
        o.put("robust", r.robust());
        ObjectNode margins = o.putObject("margins");
        r.margins().forEach(margins::put);
        ArrayNode evaluated = o.putArray("evaluated");
        for (TuneResult.Evaluation e : r.evaluated()) {
            ObjectNode eo = evaluated.addObject();
            eo.put("value", e.value());
            eo.put("verdict", e.record().verdict().word());
            putFinite(eo, "worst_excursion_v", Objective.worstExcursion(e.record()));
            putFinite(eo, "longest_settle_s", Objective.longestSettle(e.record()));
        }
        ArrayNode checks = o.putArray("checks");
        for (TuneResult.Check c : r.checks()) {
            ObjectNode co = checks.addObject();
            co.put("corner", c.corner());
            co.put("value", c.value());
            co.put("verdict", c.record().verdict().word());
        }
        ArrayNode failing = o.putArray("failing_everywhere");
        r.failingEverywhere().forEach(failing::add);
        o.put("candidates", r.candidates());
        return o.toString();
    }

    private static void putFinite(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }

    private static void print(TuneResult r, double tol, ESeries.Series s, PrintWriter out) {
        out.printf(Locale.ROOT, "tune %s on net %s: %d %s candidates, %d simulated (objective: %s)%n",
                r.target(), r.net(), r.candidates(), s, r.evaluated().size(), Objective.DESCRIPTION);
        out.println();
        out.println("  VALUE      VERDICT  WORST EXCURSION  LONGEST SETTLE");
        for (TuneResult.Evaluation e : r.evaluated()) {
            boolean best = r.recommended().isPresent() && r.recommended().getAsDouble() == e.value();
            out.printf(Locale.ROOT, "  %-9s  %-7s  %15s  %14s%s%n", Quantities.format(e.value(), org.ringsweep.api.quantity.Dimension.DIMENSIONLESS),
                    e.record().verdict().word(), ResultTable.volts(Objective.worstExcursion(e.record())),
                    ResultTable.seconds(Objective.longestSettle(e.record())), best ? "  << recommended" : "");
        }
        out.println();
        if (r.recommended().isEmpty()) {
            out.println("No value in the range passes every limit. Failing at every value simulated: "
                    + (r.failingEverywhere().isEmpty() ? "(no single limit; see the records)" : String.join(", ", r.failingEverywhere())));
            return;
        }
        out.printf(Locale.ROOT, "Recommended %s = %s; re-checked at %d corner/tolerance point(s) (tolerance %.1f %%): %s%n",
                r.target(), Quantities.format(r.recommended().getAsDouble(), org.ringsweep.api.quantity.Dimension.DIMENSIONLESS),
                r.checks().size(), tol * 100, r.robust() ? "all pass" : "SOME FAIL <<");
        for (TuneResult.Check c : r.checks()) {
            if (c.record().verdict() != Verdict.PASS) {
                out.printf(Locale.ROOT, "  FAIL %s at %s%n", c.corner(), Quantities.format(c.value(), org.ringsweep.api.quantity.Dimension.DIMENSIONLESS));
            }
        }
        out.println("Smallest margins to the limits over those checks (positive = inside):");
        r.margins().forEach((k, v) -> out.printf(Locale.ROOT, "  %-20s %s%n", k, k.startsWith("settle") || k.startsWith("delay")
                ? ResultTable.seconds(v) : k.startsWith("crossings") ? String.format(Locale.ROOT, "%.0f", v) : ResultTable.volts(v)));
        out.println();
        out.println(Caution.TEXT);
    }
}
