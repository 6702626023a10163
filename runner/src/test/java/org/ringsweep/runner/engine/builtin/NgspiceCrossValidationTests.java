package org.ringsweep.runner.engine.builtin;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.ShrinkingMode;
import net.jqwik.api.Tuple;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.statistics.Statistics;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.EdgeEvent;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.elaborate.ReceiverProbe;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.measure.EdgeMeasurer;
import org.ringsweep.runner.measure.EdgeMetrics;
import org.ringsweep.runner.measure.EdgeWindow;
import org.ringsweep.runner.measure.Levels;
import org.ringsweep.runner.testing.Ngspice;

/**
 * Property: on random board nets (RandomNets: point-to-point, tees, daisy chains, open stubs;
 * series, parallel, VTT, Thevenin and RC terminations; clamps, some with junction capacitance;
 * lossy segments; ramp drivers and, one net in four, the IBIS io33 driver of the demo board's
 * parts/kx32.ibs, whose V–I tables are table-driven current sources), elaborated by the
 * real {@link Elaborator}, the built-in engine agrees with ngspice (the reference simulator, run
 * through the real {@link DeckWriter} and {@link NgspiceEngine}) on every receiver edge measured
 * by {@link EdgeMeasurer}: v_max and v_min within 1 % of the swing, the first threshold crossing
 * (VIH rising, VIL falling) within 10 ps + 1 % of its delay from the source's 50 % point, and the
 * same number of crossings.
 *
 * <p>The crossing count and time are compared only where they are well defined at that 1 %
 * accuracy: when no extremum of the wave lies within 1 % of the swing of an edge of the
 * hysteresis band (a peak merely touching the band may count in one engine and not the other),
 * and the first crossing is not on a plateau (a wave within 1 % of the swing of the threshold
 * for longer than ten times the time tolerance). Such skips are counted in the statistics.
 *
 * <p>Tries: 30, or {@code mvn … -Dringsweep.crossTries=N} (the runner's pom passes it to jqwik as
 * {@code jqwik.tries.default}). A case that ngspice
 * itself fails on is skipped with a note (statistics), not counted.
 */
class NgspiceCrossValidationTests {
    /** The project's measurement hysteresis: 1 % of the swing (PointRunner). */
    private static final double HYSTERESIS = 0.01;
    /**
     * A wave that stays within 1 % of the swing of the threshold for this many times the crossing
     * tolerance is on a plateau (e.g. a half-swing step at a mid-chain receiver): a voltage
     * difference inside the 1 % allowed moves its crossing by more than the time tolerance.
     */
    private static final double PLATEAU_FACTOR = 10;

    @Provide
    Arbitrary<Long> seeds() {
        return Arbitraries.longs().between(1, Long.MAX_VALUE / 2);
    }

    /** One net in six has a lossy segment: ngspice's LTRA line is slow on short board lines (tens of seconds). */
    @Provide
    Arbitrary<Boolean> lossy() {
        return Arbitraries.frequency(Tuple.of(5, false), Tuple.of(1, true));
    }

    /** One net in four is driven by the IBIS io33 buffer (table-driven current sources). */
    @Provide
    Arbitrary<Boolean> ibisDriver() {
        return Arbitraries.frequency(Tuple.of(3, false), Tuple.of(1, true));
    }

    /** Clamp junction capacitance (F): none in half the nets, else 0.2 to 4 pF. */
    @Provide
    Arbitrary<Double> clampCjo() {
        return Arbitraries.frequency(Tuple.of(1, 0.0), Tuple.of(1, 1.0)).flatMap(on -> on == 0
                ? Arbitraries.just(0.0) : Arbitraries.doubles().between(0.2, 4).ofScale(3).map(pf -> pf * 1e-12));
    }

    @Property(seed = "20261202", shrinking = ShrinkingMode.OFF)
    void builtinEngineAgreesWithNgspiceOnRandomNets(@ForAll RandomNets.Topology topology,
                                                    @ForAll RandomNets.Termination termination,
                                                    @ForAll boolean clamps,
                                                    @ForAll("clampCjo") double cjo,
                                                    @ForAll("lossy") boolean lossy,
                                                    @ForAll("ibisDriver") boolean ibis,
                                                    @ForAll("seeds") long seed) throws IOException {
        Path ngspice = Ngspice.require();
        String yaml = RandomNets.yaml(topology, termination, clamps, lossy, ibis, seed);
        if (clamps && cjo > 0) {
            yaml += "# clamp CJO " + cjo + " F\n";
        }
        Path dir = Files.createTempDirectory("builtin-cross");
        try {
            Path file = dir.resolve("net.yaml");
            Files.writeString(file, yaml);
            Elaboration e = new Elaborator().elaborate(new NetFileLoader(new BuiltinModels()).load(file), "typ");
            Circuit circuit = withClampCapacitance(e.circuit(), cjo);
            Statistics.label("clamp CJO").collect(clamps && cjo > 0 ? "> 0" : "none");
            Statistics.label("driver").collect(ibis ? "IBIS tables" : "ramp");
            SimulationOutcome reference = runNgspice(ngspice, circuit, dir);
            if (!(reference instanceof SimulationOutcome.Success ok)) {
                Statistics.label("ngspice").collect("failed, try skipped");
                return;
            }
            Statistics.label("ngspice").collect("ran");
            SimulationOutcome mine = new BuiltinEngine().solve(circuit, Duration.ofSeconds(60));
            if (!(mine instanceof SimulationOutcome.Success builtin)) {
                throw new AssertionError("built-in engine failed: " + mine + "\n" + yaml);
            }
            compare(e, ok.waveforms(), builtin.waveforms(), yaml, true);
        } finally {
            delete(dir);
        }
    }

    /** The circuit with every diode's CJO set to {@code cjo} (the CMOS model's clamps have none of their own). */
    private static Circuit withClampCapacitance(Circuit c, double cjo) {
        if (cjo == 0) {
            return c;
        }
        List<Primitive> out = new ArrayList<>();
        for (Primitive p : c.primitives()) {
            if (p instanceof Primitive.Diode d) {
                DiodeModel m = d.model();
                out.add(new Primitive.Diode(d.name(), d.anode(), d.cathode(),
                        new DiodeModel(m.name() + "c", m.is(), m.n(), m.rs(), cjo)));
            } else {
                out.add(p);
            }
        }
        return new Circuit(c.title(), out, c.analysis(), c.probes(), c.notes());
    }

    private static SimulationOutcome runNgspice(Path ngspice, Circuit c, Path dir) {
        String deck = new DeckWriter().render(c, DeckOptions.of("x.raw"));
        SimulationJob job = new SimulationJob(deck, dir, "x.cir", "x.raw", c.analysis().stop(),
                Duration.ofSeconds(15), c.probes());
        return NgspiceEngine.at(ngspice).run(job);
    }

    /**
     * Compares every receiver edge of two solutions with the tolerances above and throws an
     * AssertionError listing each difference beyond them.
     *
     * @param statistics whether to collect jqwik statistics (only inside a property)
     */
    static void compare(Elaboration e, Waveforms ref, Waveforms mine, String yaml, boolean statistics) {
        double swing = e.swing();
        List<String> problems = new ArrayList<>();
        for (ReceiverProbe p : e.receivers()) {
            Levels levels = Levels.of(p.lowRail(), p.highRail(), p.vil(), p.vih(), 0.05 * swing);
            double[] tr = ref.times();
            double[] vr = ref.signal(p.node()).orElseThrow();
            double[] tm = mine.times();
            double[] vm = mine.signal(p.node()).orElseThrow();
            for (EdgeEvent edge : e.edges()) {
                double end = Math.min(edge.end(), Math.min(tr[tr.length - 1], tm[tm.length - 1]));
                EdgeWindow w = new EdgeWindow(edge.direction(), edge.start(), edge.source50(), end);
                EdgeMetrics a = EdgeMeasurer.measure(tr, vr, w, levels);
                EdgeMetrics b = EdgeMeasurer.measure(tm, vm, w, levels);
                String where = p.pin() + " " + edge.direction().word();
                // Tolerances of the task: extremes within 1 % of the swing.
                check(problems, where + " v_max", a.vMax(), b.vMax(), 0.01 * swing);
                check(problems, where + " v_min", a.vMin(), b.vMin(), 0.01 * swing);
                double th = a.thresholdV();
                double h = HYSTERESIS * swing;
                boolean ambiguous = nearBandEdge(tr, vr, w, th, h, 0.01 * swing) || nearBandEdge(tm, vm, w, th, h, 0.01 * swing);
                if (ambiguous) {
                    note(statistics, "crossings", "extremum near the band, not compared");
                    continue;
                }
                note(statistics, "crossings", "compared");
                if (a.crossings() != b.crossings()) {
                    problems.add(where + " crossings: ngspice " + a.crossings() + ", builtin " + b.crossings());
                }
                if (Double.isFinite(a.firstCrossingS()) || Double.isFinite(b.firstCrossingS())) {
                    double tol = 10e-12 + 0.01 * Math.abs(a.firstCrossingS() - edge.source50());
                    if (plateau(tr, vr, w, th, 0.01 * swing, PLATEAU_FACTOR * tol)) {
                        note(statistics, "first crossing", "on a plateau, not compared");
                    } else {
                        note(statistics, "first crossing", "compared");
                        check(problems, where + " first crossing", a.firstCrossingS(), b.firstCrossingS(), tol);
                    }
                }
            }
        }
        if (!problems.isEmpty()) {
            throw new AssertionError(String.join("\n", problems) + "\n--- net ---\n" + yaml);
        }
    }

    private static void note(boolean statistics, String label, String value) {
        if (statistics) {
            Statistics.label(label).collect(value);
        }
    }

    /** Largest differences seen in this run, for the report printed after the property: v_max/v_min (fraction of swing), crossing (s, and fraction of its tolerance). */
    private static final double[] WORST = new double[3];

    @AfterContainer
    static void reportWorstDifferences() {
        System.out.printf(java.util.Locale.ROOT, "built-in vs ngspice, worst differences: extremes %.3f %% of the swing,"
                + " first crossing %.1f ps (%.0f %% of its tolerance)%n", WORST[0] * 100, WORST[1] * 1e12, WORST[2] * 100);
    }

    private static void check(List<String> problems, String what, double ref, double mine, double tol) {
        if (what.endsWith("first crossing")) {
            WORST[1] = Math.max(WORST[1], Math.abs(ref - mine));
            WORST[2] = Math.max(WORST[2], Math.abs(ref - mine) / tol);
        } else {
            WORST[0] = Math.max(WORST[0], Math.abs(ref - mine) / (tol / 0.01));
        }
        if (!(Math.abs(ref - mine) <= tol)) {
            problems.add(what + ": ngspice " + ref + ", builtin " + mine + " (tolerance " + tol + ")");
        }
    }

    /** Whether a local extremum inside the window lies within {@code margin} of an edge of the band {@code th ± h}. */
    private static boolean nearBandEdge(double[] t, double[] v, EdgeWindow w, double th, double h, double margin) {
        for (int i = 1; i + 1 < t.length; i++) {
            if (t[i] < w.start() || t[i] > w.end()) {
                continue;
            }
            boolean extremum = (v[i] - v[i - 1]) * (v[i + 1] - v[i]) <= 0;
            if (extremum && (Math.abs(v[i] - (th + h)) < margin || Math.abs(v[i] - (th - h)) < margin)) {
                return true;
            }
        }
        return false;
    }

    /** Whether the wave stays within {@code band} of {@code th} for longer than {@code tol} inside the window. */
    private static boolean plateau(double[] t, double[] v, EdgeWindow w, double th, double band, double tol) {
        double since = Double.NaN;
        for (int i = 0; i < t.length; i++) {
            if (t[i] < w.start() || t[i] > w.end()) {
                continue;
            }
            if (Math.abs(v[i] - th) <= band) {
                if (Double.isNaN(since)) {
                    since = t[i];
                }
                if (t[i] - since > tol) {
                    return true;
                }
            } else {
                since = Double.NaN;
            }
        }
        return false;
    }

    private static void delete(Path dir) {
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
