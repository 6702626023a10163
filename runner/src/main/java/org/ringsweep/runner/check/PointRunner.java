package org.ringsweep.runner.check;

import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.ringsweep.api.model.EdgeCheck;
import org.ringsweep.api.model.EdgeSample;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.generators.deck.BatchEntry;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriteException;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.EdgeEvent;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.elaborate.ReceiverProbe;
import org.ringsweep.generators.names.NodeNamer;
import org.ringsweep.runner.engine.CircuitEngine;
import org.ringsweep.runner.engine.FailureKind;
import org.ringsweep.runner.engine.NgspiceBatch;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.measure.EdgeMeasurer;
import org.ringsweep.runner.measure.EdgeMetrics;
import org.ringsweep.runner.measure.EdgeWindow;
import org.ringsweep.runner.measure.Levels;
import org.ringsweep.runner.plugins.PluginFailureException;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;
import org.ringsweep.runner.verdict.EffectiveLimits;
import org.ringsweep.runner.verdict.LimitChecker;
import org.ringsweep.runner.verdict.LimitDefaults;
import org.ringsweep.runner.verdict.Violation;

/**
 * Runs one point of one net from net to result record. Immutable and thread-safe: every
 * collaborator is read-only once built, and each point writes only its own files.
 *
 * <p>Files: {@code OUT/<net>/<corner>-<nnnn>.cir} and, beside it, the raw file and the engine's
 * logs; points run in a batch ({@link #runBatch}) add their circuit-only decks and the batch's
 * master deck and logs. Nothing else is written.
 */
public final class PointRunner {
    /**
     * Hysteresis of the threshold-crossing detector as a fraction of the swing: 1 %, the low end
     * of the 1–2 % that waveform-metrics.md §4.3 gives as typical (common practice), so solver
     * noise that merely touches a threshold is not counted as a second crossing.
     */
    public static final double HYSTERESIS_FRACTION = 0.01;

    private final Elaborator elaborator;
    private final DeckWriter deckWriter;
    private final Optional<SimulationEngine> engine;
    private final Path outDir;
    private final Duration timeout;
    private final List<EdgeCheck> checks;

    /**
     * A runner with no extra edge checks.
     *
     * @param elaborator the elaborator
     * @param deckWriter the deck writer (built once per run)
     * @param engine     the engine, or empty to write decks only
     * @param outDir     the output folder ({@code --out})
     * @param timeout    per-point simulation timeout
     */
    public PointRunner(Elaborator elaborator, DeckWriter deckWriter, Optional<SimulationEngine> engine, Path outDir, Duration timeout) {
        this(elaborator, deckWriter, engine, outDir, timeout, List.of());
    }

    /**
     * @param elaborator the elaborator
     * @param deckWriter the deck writer (built once per run)
     * @param engine     the engine, or empty to write decks only
     * @param outDir     the output folder ({@code --out})
     * @param timeout    per-point simulation timeout
     * @param checks     extra edge checks (plugins), run on every receiver and edge after the
     *                   built-in limits; each finding is a violation under the check's limit key
     */
    public PointRunner(Elaborator elaborator, DeckWriter deckWriter, Optional<SimulationEngine> engine, Path outDir, Duration timeout,
                       List<? extends EdgeCheck> checks) {
        this.elaborator = elaborator;
        this.deckWriter = deckWriter;
        this.engine = engine;
        this.outDir = outDir;
        this.timeout = timeout;
        this.checks = List.copyOf(checks);
    }

    /** What one point is: the corner, its overrides and (for sweeps) the swept values. */
    public record PointSpec(String corner, Point overrides, Map<String, Double> swept, int index) {
    }

    /** The deck of a point, written but not simulated. */
    public record WrittenDeck(Path deck, Elaboration elaboration, String deckText) {
    }

    /**
     * Writes the deck of an elaborated point.
     */
    public WrittenDeck writeDeck(Net net, PointSpec spec, Elaboration elab) {
        return writeDeck(net, elab, deckStem(spec), false);
    }

    private WrittenDeck writeDeck(Net net, Elaboration elab, String stem, boolean conservative) {
        return deck(net, elab, stem, conservative, true);
    }

    /** Renders a deck and, when {@code write}, writes it (a deck-driven engine writes its job's deck itself). */
    private WrittenDeck deck(Net net, Elaboration elab, String stem, boolean conservative, boolean write) {
        String deckText = deckWriter.render(elab.circuit(), new DeckOptions(rawName(stem), true, conservative));
        Path dir = netDir(net);
        Path deck = dir.resolve(stem + ".cir");
        if (write) {
            try {
                java.nio.file.Files.createDirectories(dir);
                java.nio.file.Files.writeString(deck, deckText, java.nio.charset.StandardCharsets.UTF_8);
            } catch (java.io.IOException e) {
                throw new java.io.UncheckedIOException("cannot write deck " + deck + ": " + e.getMessage(), e);
            }
        }
        return new WrittenDeck(deck, elab, deckText);
    }

    /**
     * Runs the point: deck, simulation, measurements, verdict. A run that fails to converge,
     * stalls, stops early or times out is retried once with the deck writer's conservative
     * options (Gear integration, tighter reltol, a quarter of the time step; see
     * {@link DeckOptions#conservative()}), in a deck of its own ({@code <stem>-conservative.cir}).
     * A point that still fails gives an error record quoting the engine; it never throws for that.
     * A plugin model or check that throws ({@link PluginFailureException}) gives an error record
     * naming the plugin and the point.
     */
    public ResultRecord run(Net net, PointSpec spec) {
        Elaboration elab;
        try {
            elab = elaborate(net, spec);
        } catch (PluginFailureException e) {
            return pluginErrorRecord(net, spec, e);
        }
        return run(net, spec, elab);
    }

    /**
     * The error record of a point where plugin code threw: the message names the plugin, what
     * failed, the net and the point.
     */
    public ResultRecord pluginErrorRecord(Net net, PointSpec spec, PluginFailureException e) {
        return errorRecord(net, spec, pluginMessage(net, spec, e));
    }

    private static String pluginMessage(Net net, PointSpec spec, PluginFailureException e) {
        return e.getMessage() + " (net " + net.name() + ", point " + label(spec) + ")";
    }

    /** Elaborates a point (its overrides applied to the net). */
    public Elaboration elaborate(Net net, PointSpec spec) {
        return elaborator.elaborate(net.with(spec.overrides()), label(spec));
    }

    /** Runs a point already elaborated with {@link #elaborate}: {@link #prepare}, {@link #simulate}, {@link #complete}. */
    public ResultRecord run(Net net, PointSpec spec, Elaboration elab) {
        Prepared prepared = prepare(net, spec, elab);
        return complete(prepared, simulate(prepared));
    }

    /**
     * A point ready to simulate ({@link #prepare}).
     *
     * @param net         the net
     * @param spec        the point
     * @param elaboration its elaboration
     * @param stem        the deck's file stem ({@code typ-0001})
     * @param deck        the deck: its path and text
     */
    public record Prepared(Net net, PointSpec spec, Elaboration elaboration, String stem, WrittenDeck deck) {
    }

    /**
     * Renders a point's deck, the first of the three steps of {@link #run(Net, PointSpec, Elaboration)}.
     * A deck-driven engine writes the deck itself when it runs it ({@link SimulationJob}); for an
     * in-process engine the deck is written here, for the record.
     *
     * @throws DeckWriteException when the deck cannot be rendered
     * @throws java.io.UncheckedIOException when it cannot be written
     */
    public Prepared prepare(Net net, PointSpec spec, Elaboration elab) {
        SimulationEngine eng = engine.orElseThrow(() -> new IllegalStateException("no engine to run points"));
        String stem = deckStem(spec);
        return new Prepared(net, spec, elab, stem, deck(net, elab, stem, false, eng instanceof CircuitEngine));
    }

    /**
     * Simulates a prepared point: the only step that runs the engine. Safe on any thread; the
     * callers of {@link PointPipeline} run it on one thread while they prepare and complete others.
     *
     * @return what the engine gave; never throws for a simulation problem
     */
    public SimulationOutcome simulate(Prepared p) {
        SimulationEngine eng = engine.orElseThrow(() -> new IllegalStateException("no engine to run points"));
        // An in-process engine solves the circuit itself; the deck is still written for the record.
        return eng instanceof CircuitEngine inProcess
                ? inProcess.solve(p.elaboration().circuit(), timeout)
                : eng.run(job(p.deck(), p.stem(), p.elaboration()));
    }

    /**
     * The record of a simulated point: the conservative retry when the run failed in a way it can
     * cure (this runs the engine once more, on the calling thread), else the measurements.
     */
    public ResultRecord complete(Prepared p, SimulationOutcome outcome) {
        SimulationEngine eng = engine.orElseThrow(() -> new IllegalStateException("no engine to run points"));
        return finish(p.net(), p.spec(), p.elaboration(), eng, p.stem(), p.deck(), outcome);
    }

    /**
     * Whether {@link #complete} runs the engine again for this outcome (the conservative retry).
     *
     * @param outcome what {@link #simulate} gave
     */
    public boolean retries(SimulationOutcome outcome) {
        return outcome instanceof SimulationOutcome.Failure f && isRetryable(f.kind())
                && !(engine.orElse(null) instanceof CircuitEngine) && !Thread.currentThread().isInterrupted();
    }

    /**
     * Runs several points of one net, already elaborated, and gives their records in order. With
     * ngspice the points share one process ({@link NgspiceBatch}): each point's standalone deck
     * {@code <stem>.cir} is still written (the record names it, and it re-runs the point by hand),
     * beside it the circuit-only deck {@code <raw stem>_circuit.cir} the batch sources, and the
     * master deck {@code batch_<first raw stem>.cir} with its logs. A point whose deck cannot be
     * written circuit-only (templates that keep the control block) runs alone, as does every
     * point with another engine. The outcome of each point then goes through the very code of
     * {@link #run(Net, PointSpec, Elaboration)} (the conservative retry, the measurements), and
     * the batch runs every point it does not prove good again alone, so the records are those
     * {@code run} gives point by point.
     *
     * @param net          the net
     * @param specs        the points
     * @param elaborations their elaborations ({@link #elaborate}), one per point, same order
     * @return one record per point, same order
     * @throws IllegalArgumentException when the lists differ in length
     */
    public List<ResultRecord> runBatch(Net net, List<PointSpec> specs, List<Elaboration> elaborations) {
        if (specs.size() != elaborations.size()) {
            throw new IllegalArgumentException(specs.size() + " points but " + elaborations.size() + " elaborations");
        }
        SimulationEngine eng = engine.orElseThrow(() -> new IllegalStateException("no engine for runBatch()"));
        int n = specs.size();
        ResultRecord[] records = new ResultRecord[n];
        List<Integer> batched = new ArrayList<>();
        List<NgspiceBatch.Point> points = new ArrayList<>();
        List<WrittenDeck> decks = new ArrayList<>();
        if (eng instanceof NgspiceEngine && n > 1) {
            for (int i = 0; i < n; i++) {
                Elaboration elab = elaborations.get(i);
                String stem = deckStem(specs.get(i));
                String raw = rawName(stem);
                String circuitText;
                String deckText;
                try {
                    deckText = deckWriter.render(elab.circuit(), new DeckOptions(raw, true, false));
                    circuitText = deckWriter.renderCircuitOnly(elab.circuit(), new DeckOptions(raw, true, false));
                } catch (DeckWriteException e) {
                    continue; // runs alone below, where the same error becomes its record
                }
                WrittenDeck written = new WrittenDeck(netDir(net).resolve(stem + ".cir"), elab, deckText);
                points.add(new NgspiceBatch.Point(job(written, stem, elab), raw.substring(0, raw.length() - 4) + "_circuit.cir", circuitText));
                decks.add(written);
                batched.add(i);
            }
        }
        if (batched.size() > 1) {
            List<BatchEntry> entries = new ArrayList<>();
            for (int j = 0; j < points.size(); j++) {
                NgspiceBatch.Point p = points.get(j);
                // The probes in the circuit's order, as the standalone deck writes them.
                entries.add(new BatchEntry(p.circuitDeckFileName(), p.job().rawFileName(),
                        new ArrayList<>(decks.get(j).elaboration().circuit().probes().keySet())));
            }
            String first = points.get(0).job().rawFileName();
            String master = "batch_" + first.substring(0, first.length() - 4) + ".cir";
            NgspiceBatch batch = new NgspiceBatch(points, master, deckWriter.renderBatch(entries, true));
            List<SimulationOutcome> outcomes = ((NgspiceEngine) eng).runBatch(batch);
            for (int j = 0; j < batched.size(); j++) {
                int i = batched.get(j);
                String stem = deckStem(specs.get(i));
                records[i] = finish(net, specs.get(i), elaborations.get(i), eng, stem, decks.get(j), outcomes.get(j));
            }
        }
        List<ResultRecord> result = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            result.add(records[i] != null ? records[i] : run(net, specs.get(i), elaborations.get(i)));
        }
        return List.copyOf(result);
    }

    /** The first run's outcome to a record: the conservative retry when it failed, else the measurements. */
    private ResultRecord finish(Net net, PointSpec spec, Elaboration elab, SimulationEngine eng, String stem,
                                WrittenDeck written, SimulationOutcome outcome) {
        Net applied = net.with(spec.overrides());
        List<String> warnings = new ArrayList<>(elab.warnings());
        // An interrupted run (Ctrl-C, a stopping batch) is not retried: its record is discarded anyway.
        // The conservative options are deck options: only a deck-driven engine can retry with them.
        if (retries(outcome)) {
            SimulationOutcome.Failure first = (SimulationOutcome.Failure) outcome;
            String retryStem = stem + "-conservative";
            written = deck(net, elab, retryStem, true, false); // the engine writes it
            outcome = eng.run(job(written, retryStem, elab));
            String firstText = "first run failed (" + first.kind().name().toLowerCase(java.util.Locale.ROOT) + "): " + first.message();
            if (outcome instanceof SimulationOutcome.Failure second) {
                return record(net, spec, eng, Verdict.ERROR, List.of(), written.deck(),
                        firstText + "; the retry with conservative options failed too: " + second.message(), List.of(), warnings);
            }
            warnings.add(firstText + "; retried with conservative options (Gear integration, reltol 1e-4, smaller step) and succeeded");
        }
        if (outcome instanceof SimulationOutcome.Failure f) {
            return record(net, spec, eng, Verdict.ERROR, List.of(), written.deck(), f.message(), List.of(), warnings);
        }
        Waveforms w = ((SimulationOutcome.Success) outcome).waveforms();
        List<ReceiverResult> receivers = new ArrayList<>();
        java.util.Set<String> defaulted = new java.util.TreeSet<>();
        Verdict worst = Verdict.PASS;
        for (ReceiverProbe probe : elab.receivers()) {
            Receiver receiver = applied.receivers().stream().filter(r -> r.pin().equals(probe.pin())).findFirst().orElseThrow();
            double swing = elab.vHigh() - elab.vLow();
            EffectiveLimits limits = LimitDefaults.resolve(applied.limitsFor(receiver), swing);
            defaulted.addAll(limits.defaultedKeys());
            ReceiverResult rr;
            try {
                rr = measureReceiver(w, probe, elab.edges(), limits, swing, checks);
            } catch (PluginFailureException e) {
                return record(net, spec, eng, Verdict.ERROR, List.of(), written.deck(), pluginMessage(net, spec, e), List.of(), warnings);
            }
            receivers.add(rr);
            worst = worst.worst(rr.verdict());
        }
        return record(net, spec, eng, worst, receivers, written.deck(), "", List.copyOf(defaulted), warnings);
    }

    /** Failures a different integration method or step can cure; syntax and set-up problems cannot. */
    private static boolean isRetryable(FailureKind kind) {
        return switch (kind) {
            case CONVERGENCE, STALLED, TIMEOUT, TRUNCATED_OUTPUT -> true;
            default -> false;
        };
    }

    private SimulationJob job(WrittenDeck written, String stem, Elaboration elab) {
        return new SimulationJob(written.deckText(), written.deck().getParent(), stem + ".cir", rawName(stem),
                elab.circuit().analysis().stop(), timeout, elab.circuit().probes());
    }

    private static ReceiverResult measureReceiver(Waveforms w, ReceiverProbe probe, List<EdgeEvent> edges,
                                                  EffectiveLimits limits, double swing, List<EdgeCheck> checks) {
        double[] t = w.times();
        double[] v = w.signal(probe.node()).orElseThrow(() -> new IllegalStateException("engine returned no signal for " + probe.node()));
        Levels levels = new Levels(probe.lowRail(), probe.highRail(), probe.vil(), probe.vih(),
                limits.settleBandV(), HYSTERESIS_FRACTION * swing);
        Map<String, EdgeResult> results = new LinkedHashMap<>();
        List<ViolationRecord> violations = new ArrayList<>();
        double lastSample = t[t.length - 1];
        for (EdgeEvent e : edges) {
            // The last window ends at the stop time; ngspice's last time point can differ from it by
            // rounding (the engine already checked that the run reached the stop time within 1e-9).
            double end = Math.min(e.end(), lastSample);
            EdgeMetrics m = EdgeMeasurer.measure(t, v, new EdgeWindow(e.direction(), e.start(), e.source50(), end), levels);
            results.put(e.direction().word(), MetricsView.of(m));
            for (Violation viol : LimitChecker.check(m, limits)) {
                violations.add(new ViolationRecord(viol.limit(), viol.edge().word(), viol.measured(), viol.limitValue(),
                        limits.defaultedKeys().contains(viol.limit()), viol.message()));
            }
            if (!checks.isEmpty()) {
                EdgeSample sample = sample(t, v, probe, e, end);
                for (EdgeCheck check : checks) {
                    check.check(sample).ifPresent(f -> violations.add(new ViolationRecord(check.limitKey(), e.direction().word(),
                            f.measured(), f.limit(), false, f.message())));
                }
            }
        }
        return new ReceiverResult(probe.pin(), violations.isEmpty() ? Verdict.PASS : Verdict.FAIL, results, violations);
    }

    /** The samples of one edge's window, for the extra checks. */
    private static EdgeSample sample(double[] t, double[] v, ReceiverProbe probe, EdgeEvent e, double end) {
        int from = 0;
        while (from < t.length - 1 && t[from] < e.start()) {
            from++;
        }
        int to = from;
        while (to < t.length && t[to] <= end) {
            to++;
        }
        to = Math.max(to, from + 1);
        return new EdgeSample(probe.pin(), e.direction(), e.start(), e.source50(), end,
                java.util.Arrays.copyOfRange(t, from, to), java.util.Arrays.copyOfRange(v, from, to),
                probe.vil(), probe.vih(), probe.lowRail(), probe.highRail());
    }

    private ResultRecord record(Net net, PointSpec spec, SimulationEngine eng, Verdict verdict, List<ReceiverResult> receivers,
                                Path deck, String error, List<String> defaulted, List<String> warnings) {
        return new ResultRecord(net.name(), spec.corner(), spec.swept(), eng.name(), eng.version(), verdict, receivers,
                deck.toString(), error, net.source(), net.sourceHash(), defaulted, warnings);
    }

    /** The error record for a point that could not even be elaborated or simulated. */
    public ResultRecord errorRecord(Net net, PointSpec spec, String message) {
        String name = engine.map(SimulationEngine::name).orElse("");
        String version = engine.map(SimulationEngine::version).orElse("");
        return new ResultRecord(net.name(), spec.corner(), spec.swept(), name, version, Verdict.ERROR, List.of(),
                netDir(net).resolve(deckStem(spec) + ".cir").toString(), message, net.source(), net.sourceHash(), List.of(), List.of());
    }

    /** The folder of a net under the output folder. */
    public Path netDir(Net net) {
        return outDir.resolve(NodeNamer.safeFileStem(net.name()));
    }

    private static String deckStem(PointSpec spec) {
        return NodeNamer.safeFileStem(spec.corner()) + String.format(java.util.Locale.ROOT, "-%04d", spec.index());
    }

    /** The raw file written beside a deck this runner wrote ({@code typ-0001.cir} → {@code typ_0001.raw}). */
    public static Path rawFileOf(Path deck) {
        String name = deck.getFileName().toString();
        return deck.resolveSibling(rawName(name.endsWith(".cir") ? name.substring(0, name.length() - 4) : name));
    }

    private static String rawName(String stem) {
        return stem.toLowerCase(java.util.Locale.ROOT).replaceAll("[^a-z0-9_]", "_") + ".raw";
    }

    private static String label(PointSpec spec) {
        StringBuilder b = new StringBuilder(spec.corner());
        spec.overrides().values().forEach((k, v) -> b.append(' ').append(k).append('=').append(v.display()));
        return b.toString();
    }
}
